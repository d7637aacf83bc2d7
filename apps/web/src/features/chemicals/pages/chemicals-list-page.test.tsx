import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch, type RecordedRequest } from '../../../test/fetch-mock';
import { makeChemical, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const rows = [
  makeChemical({
    name: 'Acetic anhydride',
    formula: 'C4H6O3',
    casNumber: '108-24-7',
    molarMass: 102.09,
    storageGroup: 'organic-acid',
    ghsPictograms: ['GHS02', 'GHS05', 'GHS06'],
    hazardStatements: ['H226', 'H302', 'H314', 'H330'],
    stockUnit: 'mL',
    reorderPoint: 250,
  }),
  makeChemical({ name: 'Salicylic acid', formula: 'C7H6O3', molarMass: 138.12 }),
];

function listRequests(requests: RecordedRequest[]) {
  return requests.filter((r) => r.url.pathname === '/api/chemicals');
}

function setup(role: 'viewer' | 'manager' = 'viewer', total = 60) {
  return mockFetch({
    'GET /api/auth/me': { body: { user: makeUser({ role }) } },
    'GET /api/chemicals': (request) => ({
      body: page(rows, total, Number(request.url.searchParams.get('page') ?? 1)),
    }),
  });
}

describe('Chemicals list', () => {
  it('when the person searches, sorts, filters and pages, then the state is written to the URL and asked of the server', async () => {
    const { requests } = setup();
    const user = userEvent.setup();
    const { router } = renderApp('/chemicals');
    await screen.findByRole('link', { name: 'Acetic anhydride' });
    const search = () => new URLSearchParams(router.state.location.search);

    await user.type(screen.getByRole('searchbox', { name: 'Search' }), 'acet');
    await waitFor(() => expect(search().get('q')).toBe('acet'));
    await waitFor(() =>
      expect(listRequests(requests).at(-1)?.url.searchParams.get('q')).toBe('acet'),
    );

    await user.click(screen.getByRole('button', { name: 'Molar mass' }));
    await waitFor(() => expect(search().get('sort')).toMatch(/^molarMass\.(asc|desc)$/));
    const header = screen.getByRole('columnheader', { name: /Molar mass/ });
    expect(header).toHaveAttribute(
      'aria-sort',
      search().get('sort')?.endsWith('desc') ? 'descending' : 'ascending',
    );

    await user.selectOptions(screen.getByRole('combobox', { name: 'Storage group' }), 'flammable');
    await waitFor(() => expect(search().get('storageGroup')).toBe('flammable'));

    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(search().get('page')).toBe('2'));

    await user.selectOptions(screen.getByRole('combobox', { name: 'Rows per page' }), '50');
    await waitFor(() => expect(search().get('pageSize')).toBe('50'));
    expect(search().get('page')).toBeNull();

    const last = listRequests(requests).at(-1)?.url.searchParams;
    expect(Object.fromEntries(last ?? [])).toMatchObject({
      q: 'acet',
      storageGroup: 'flammable',
      pageSize: '50',
      page: '1',
    });
  });

  it('when / is pressed outside a text field, then the search box takes the focus', async () => {
    setup();
    const user = userEvent.setup();
    renderApp('/chemicals');
    await screen.findByRole('link', { name: 'Acetic anhydride' });

    await user.keyboard('/');

    expect(screen.getByRole('searchbox', { name: 'Search' })).toHaveFocus();
    expect(screen.getByRole('searchbox', { name: 'Search' })).toHaveValue('');
  });

  it('when opened from a shared URL, then the table starts in that state', async () => {
    const { requests } = setup();
    renderApp('/chemicals?q=ethanol&sort=molarMass.desc&page=2&pictogram=GHS02');

    await screen.findByRole('link', { name: 'Acetic anhydride' });
    expect(screen.getByRole('searchbox', { name: 'Search' })).toHaveValue('ethanol');
    expect(screen.getByRole('columnheader', { name: /Molar mass/ })).toHaveAttribute(
      'aria-sort',
      'descending',
    );
    expect(screen.getByRole('combobox', { name: 'Pictogram' })).toHaveValue('GHS02');
    expect(Object.fromEntries(listRequests(requests)[0]?.url.searchParams ?? [])).toMatchObject({
      q: 'ethanol',
      sort: 'molarMass.desc',
      page: '2',
      pictogram: 'GHS02',
    });
  });

  it('shows each chemical with its hazards, storage group and reorder point with unit', async () => {
    setup();
    renderApp('/chemicals');

    const row = (await screen.findByRole('link', { name: 'Acetic anhydride' })).closest(
      'tr',
    ) as HTMLElement;
    expect(within(row).getByText('GHS05')).toBeInTheDocument();
    expect(within(row).getByText(/Corrosive to skin, eyes or metals/)).toBeInTheDocument();
    expect(within(row).getByText('Organic acids')).toBeInTheDocument();
    expect(within(row).getByText('250.00 mL')).toBeInTheDocument();
    expect(within(row).getByText('102.09 g/mol')).toBeInTheDocument();
    expect(screen.getByText(/1–25 of 60 chemicals/)).toBeInTheDocument();
  });

  it('when a viewer finds nothing, then there is a way to clear the filters but no add button', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/chemicals': { body: page([], 0) },
    });
    const user = userEvent.setup();
    const { router } = renderApp('/chemicals?q=zzz');

    expect(await screen.findByText('No chemicals match “zzz”')).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: /Add a chemical/ })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Clear search and filters' }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
  });

  it('when a manager opens an empty Lotwise, then the first-run state offers to add a chemical', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      'GET /api/chemicals': { body: page([], 0) },
    });
    renderApp('/chemicals');

    expect(await screen.findByText('No chemicals yet')).toBeInTheDocument();
    expect(screen.getAllByRole('link', { name: /Add a chemical/ }).length).toBeGreaterThan(0);
  });
});
