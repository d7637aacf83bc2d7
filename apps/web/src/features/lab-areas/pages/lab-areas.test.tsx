import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch, type RecordedRequest } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import {
  listedArea,
  listedPlace,
  nfpa45,
  place,
  room204,
  sizes,
} from '../test/room-rules-fixtures';

const manager = makeUser({ role: 'manager' });
const viewer = makeUser({ role: 'viewer' });

function ruleSets(request: RecordedRequest) {
  const kind = request.url.searchParams.get('kind');
  return { body: { items: [nfpa45, sizes].filter((s) => !kind || s.kind === kind) } };
}

describe('marking a place as a lab area', () => {
  it('when a manager marks a room, then the form offers the classes with their figures and source, and sends what was entered', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/locations/10': { body: place() },
      'GET /api/locations': { body: page([listedPlace()]) },
      'GET /api/containers': { body: page([]) },
      'GET /api/lab-areas': { body: { items: [] } },
      'GET /api/rule-sets': ruleSets,
      'POST /api/lab-areas': { status: 201, body: room204 },
    });
    const user = userEvent.setup();
    renderApp('/stock/locations/10');

    const panel = await screen.findByRole('region', { name: 'Room rules' }, { timeout: 5000 });
    await user.click(await within(panel).findByRole('button', { name: 'Mark as a lab area' }));
    const dialog = await screen.findByRole('dialog', { name: 'Mark Room 204 as a lab area' });
    // NFPA 45 (2024) Table 9.1.1, as given in public summaries: Class C 4 / 8 gal per 100 ft².
    await waitFor(() =>
      expect(dialog).toHaveTextContent('Class I 4 gal, Classes I–IIIA 8 gal per 100 ft²'),
    );
    expect(dialog).toHaveTextContent('Figures from NFPA 45 (2024), Table 9.1.1.');
    await user.click(within(dialog).getByRole('radio', { name: /Class C/ }));
    await user.type(within(dialog).getByRole('textbox', { name: 'Floor area' }), '37.2');
    await user.clear(within(dialog).getByRole('textbox', { name: 'Storey' }));
    await user.type(within(dialog).getByRole('textbox', { name: 'Storey' }), '5');
    await user.click(within(dialog).getByRole('checkbox', { name: /Instructional/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Mark as a lab area' }));

    await waitFor(() =>
      expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
        locationId: 10,
        kind: 'lab-unit',
        unitClass: 'C',
        floorArea: 37.2,
        floorAreaUnit: 'm2',
        storey: 5,
        instructional: true,
        flammableRuleSetId: 1,
        containerSizeRuleSetId: 2,
        notes: '',
      }),
    );
  });

  it('when the server refuses a field, then its message shows at that field and the form keeps what was typed', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/locations/10': { body: place() },
      'GET /api/locations': { body: page([listedPlace()]) },
      'GET /api/containers': { body: page([]) },
      'GET /api/lab-areas': { body: { items: [] } },
      'GET /api/rule-sets': ruleSets,
      'POST /api/lab-areas': {
        status: 422,
        body: {
          error: {
            code: 'validation_failed',
            message: 'Check the marked fields.',
            fields: { unitClass: 'must be C or D for an instructional lab' },
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/locations/10');

    await user.click(
      await screen.findByRole('button', { name: 'Mark as a lab area' }, { timeout: 5000 }),
    );
    const dialog = await screen.findByRole('dialog', { name: 'Mark Room 204 as a lab area' });
    await user.type(within(dialog).getByRole('textbox', { name: 'Floor area' }), '40');
    await user.click(within(dialog).getByRole('checkbox', { name: /Instructional/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Mark as a lab area' }));

    expect(
      await within(dialog).findByText('Lab-unit class must be C or D for an instructional lab'),
    ).toBeInTheDocument();
    expect(within(dialog).getByRole('alert')).toHaveTextContent('Nothing was saved');
    expect(within(dialog).getByRole('textbox', { name: 'Floor area' })).toHaveValue('40');
  });

  it('when the place is a lab area, then its panel shows the most used limit in words and links to the area', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: viewer } },
      'GET /api/locations/10': { body: place() },
      'GET /api/containers': { body: page([]) },
      'GET /api/lab-areas': { body: { items: [listedArea()] } },
    });
    renderApp('/stock/locations/10');

    const panel = await screen.findByRole('region', { name: 'Room rules' }, { timeout: 5000 });
    expect(await within(panel).findByText(/Lab unit, Class B, 37\.2 m², storey 2/)).toBeVisible();
    expect(within(panel).getByRole('meter')).toHaveAttribute(
      'aria-valuetext',
      '106 % used, over a limit',
    );
    expect(
      within(panel).getByRole('link', { name: 'Litres held against each limit' }),
    ).toHaveAttribute('href', '/stock/lab-areas/3');
    expect(within(panel).queryByRole('button')).not.toBeInTheDocument();
  });
});

describe('approved flammable storage', () => {
  it('when a manager marks a cabinet as approved flammable storage, then the change sends it and the panel says liquids there count as in storage', async () => {
    const cabinet = place({
      id: 11,
      name: 'Solvent cabinet',
      kind: 'cabinet',
      path: 'Room 204 › Solvent cabinet',
    });
    let saved = cabinet;
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/locations/11': () => ({ body: saved }),
      'GET /api/locations': { body: page([listedPlace(), listedPlace(cabinet)]) },
      'GET /api/containers': { body: page([]) },
      'GET /api/lab-areas': { body: { items: [listedArea()] } },
      'PATCH /api/locations/11': (request) => {
        saved = { ...cabinet, ...(request.body as object) };
        return { body: listedPlace(saved) };
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/locations/11');

    await user.click(
      await screen.findByRole('button', { name: 'Change or move' }, { timeout: 5000 }),
    );
    const dialog = await screen.findByRole('dialog', { name: 'Change Solvent cabinet' });
    await user.selectOptions(
      within(dialog).getByRole('combobox', { name: 'Approved flammable storage' }),
      'cabinet',
    );
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));

    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PATCH')?.body).toMatchObject({
        flammableStorage: 'cabinet',
      }),
    );
    const panel = screen.getByRole('region', { name: 'Room rules' });
    expect(
      await within(panel).findByText(/Approved flammable-storage cabinet: liquids here count/),
    ).toBeVisible();
    expect(within(panel).getByRole('link', { name: 'Room 204' })).toHaveAttribute(
      'href',
      '/stock/lab-areas/3',
    );
  });
});

describe('the lab areas', () => {
  it('when areas are listed, then each shows its most used limit as a bar with the share and the status in words', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: viewer } },
      'GET /api/lab-areas': { body: { items: [listedArea()] } },
    });
    renderApp('/stock/lab-areas');

    const table = await screen.findByRole('table', {}, { timeout: 5000 });
    expect(within(table).getByRole('link', { name: 'Room 204' })).toHaveAttribute(
      'href',
      '/stock/lab-areas/3',
    );
    expect(table).toHaveTextContent('106 % used');
    expect(table).toHaveTextContent('80.0 L of 75.7 L');
    expect(table).toHaveTextContent('Over a limit');
    expect(table).toHaveTextContent('1 container not counted; 1 container too large');
    expect(screen.getByText(/not an approval/)).toBeInTheDocument();
  });

  it('when there are none, then the page says how to mark one', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: viewer } },
      'GET /api/lab-areas': { body: { items: [] } },
    });
    renderApp('/stock/lab-areas');

    expect(await screen.findByText('No lab areas yet', {}, { timeout: 5000 })).toBeVisible();
  });

  it('when an area is opened, then each limit shows held, limit, margin, share, working and citation, with what was and was not counted', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: viewer } },
      'GET /api/lab-areas/3': { body: room204 },
    });
    renderApp('/stock/lab-areas/3');

    await screen.findByRole('heading', { level: 1, name: 'Room 204' }, { timeout: 5000 });
    const limits = screen.getAllByRole('listitem').filter((li) => li.querySelector('h3'));
    expect(limits).toHaveLength(2);
    expect(limits[0]).toHaveTextContent('Class I liquids, cabinets and safety cans included');
    expect(limits[0]).toHaveTextContent(/Held140\.0 L/);
    expect(limits[0]).toHaveTextContent(/Limit151\.4 L/);
    expect(limits[0]).toHaveTextContent(/Margin11\.4 L/);
    expect(limits[0]).toHaveTextContent('NFPA 45 (2024), Table 9.1.1');
    expect(limits[0]).toHaveTextContent('400 ft² × 10 gal per 100 ft² = 40 gal = 151.4 L');
    expect(limits[0]).toHaveTextContent('Near a limit');
    expect(limits[1]).toHaveTextContent(/Over by4\.3 L/);
    expect(limits[1]).toHaveTextContent('Over a limit');

    const counted = screen.getByRole('region', { name: 'Containers counted' });
    expect(within(counted).getByRole('link', { name: 'LW-00071' })).toBeInTheDocument();
    expect(within(counted).getByRole('list', { name: 'GHS pictograms' })).toBeInTheDocument();
    expect(counted).toHaveTextContent('Not in approved storage');
    expect(screen.getByRole('link', { name: 'edit Mystery solvent' })).toHaveAttribute(
      'href',
      '/chemicals/6/edit',
    );
    expect(
      screen.getByRole('region', { name: 'Containers larger than allowed' }),
    ).toHaveTextContent(/1\.0 L, the largest allowed is 0\.50 L/);
    expect(screen.getByRole('link', { name: 'Inspection summary' })).toHaveAttribute(
      'href',
      '/stock/lab-areas/3/inspection',
    );
    expect(screen.getAllByText(/not an approval/).length).toBeGreaterThan(0);
  });

  it('when the area cannot be loaded, then the page says so and offers to try again', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: viewer } },
      'GET /api/lab-areas/3': {
        status: 500,
        body: { error: { code: 'internal', message: 'Something broke.' } },
      },
    });
    renderApp('/stock/lab-areas/3');

    expect(
      await screen.findByText('The lab area could not be loaded', {}, { timeout: 5000 }),
    ).toBeVisible();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeVisible();
  });
});

describe('rule sets', () => {
  it('when sets are listed, then they are grouped by kind with citation and a built-in mark', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: viewer } },
      'GET /api/rule-sets': ruleSets,
    });
    renderApp('/stock/rule-sets');

    const flammable = await screen.findByRole(
      'region',
      { name: 'Flammable-liquid quantity limits' },
      { timeout: 5000 },
    );
    expect(flammable).toHaveTextContent('NFPA 45 (2024), Table 9.1.1');
    expect(flammable).toHaveTextContent('Built in');
    expect(screen.getByRole('region', { name: /Largest container/ })).toHaveTextContent('Your own');
    expect(screen.queryByRole('link', { name: 'New rule set' })).not.toBeInTheDocument();
  });

  it("when a built-in set is copied, then the form is filled from it and the server's error shows at its box", async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/rule-sets/1': { body: nfpa45 },
      'POST /api/rule-sets': {
        status: 422,
        body: {
          error: {
            code: 'validation_failed',
            message: 'Check the marked fields.',
            fields: {
              'data.byUnitClass.2.perArea.classI': 'cannot be above the Classes I–IIIA figure',
            },
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/rule-sets/1');

    // NFPA 45 (2024) Table 9.1.1, as given in public summaries: Class A 20 / 40 gal per 100 ft².
    const table = await screen.findByRole('table', {}, { timeout: 5000 });
    const classA = within(table).getByRole('row', { name: /Class A/ });
    expect(classA).toHaveTextContent(/Class A\s*20\s*40\s*480\s*1,600/);
    expect(screen.getByText(/outside them 50 % of each per-area figure/)).toBeVisible();
    expect(screen.queryByRole('link', { name: 'Change' })).not.toBeInTheDocument();

    await user.click(screen.getByRole('link', { name: 'Copy to my own set' }));
    const form = await screen.findByRole('form', { name: 'Rule set' });
    expect(within(form).getByRole('textbox', { name: 'Name' })).toHaveValue(
      'NFPA 45 flammable-liquid limits (our copy)',
    );
    const cell = within(form).getByRole('textbox', { name: 'Lab-unit class C: Class I' });
    expect(cell).toHaveValue('4');
    await user.clear(cell);
    await user.type(cell, '9');
    await user.click(within(form).getByRole('button', { name: 'Save rule set' }));

    expect(
      await within(form).findByText('cannot be above the Classes I–IIIA figure'),
    ).toBeInTheDocument();
    expect(cell).toHaveAttribute('aria-invalid', 'true');
    const sent = requests.find((r) => r.method === 'POST')?.body as {
      kind: string;
      data: { byUnitClass: { perArea: { classI: number } }[]; storeyReductions: unknown[] };
    };
    expect(sent.kind).toBe('flammable-limits');
    expect(sent.data.byUnitClass[2]!.perArea.classI).toBe(9);
    expect(sent.data.storeyReductions).toHaveLength(3);
  });
});
