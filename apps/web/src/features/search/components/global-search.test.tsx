import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeContainer, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const container = makeContainer({ id: 42, labelCode: 'LW-00042' });

function routes() {
  return mockFetch({
    'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
    'GET /api/chemicals': { body: page([makeChemical({ name: 'Acetone' })]) },
    'GET /api/search': (request) => {
      const q = request.url.searchParams.get('q') ?? '';
      return {
        body: {
          containers: q.toUpperCase().startsWith('LW')
            ? [
                {
                  id: 42,
                  labelCode: 'LW-00042',
                  status: 'open',
                  chemicalId: 900,
                  chemicalName: 'Sodium chloride',
                  locationPath: 'Room 101 › Cabinet A › Shelf 2',
                  exact: true,
                },
              ]
            : [],
          chemicals: q.toLowerCase().startsWith('ace')
            ? [
                {
                  id: 3,
                  name: 'Acetone',
                  casNumber: '67-64-1',
                  formula: 'C3H6O',
                  matchedSynonym: null,
                },
                {
                  id: 6,
                  name: 'Acetic anhydride',
                  casNumber: '108-24-7',
                  formula: 'C4H6O3',
                  matchedSynonym: null,
                },
              ]
            : [],
        },
      };
    },
    'GET /api/containers/by-label/LW-00042': { body: container },
    'GET /api/containers/42': { body: container },
    'GET /api/containers/42/ledger': { body: page([]) },
  });
}

describe('Global search', () => {
  it('when a label code is scanned and Enter pressed, then the container opens at once', async () => {
    routes();
    const user = userEvent.setup();
    const { router } = renderApp('/chemicals');
    const box = await screen.findByRole('combobox', { name: 'Search chemicals and containers' });

    await user.type(box, 'lw-42{Enter}');

    await waitFor(() => expect(router.state.location.pathname).toBe('/stock/containers/42'), {
      timeout: 5000,
    });
    expect(
      await screen.findByRole('heading', { level: 1, name: 'Sodium chloride' }, { timeout: 5000 }),
    ).toBeInTheDocument();
  });

  it('when results show, then arrow keys move through them, Enter opens one and Escape closes', async () => {
    routes();
    const user = userEvent.setup();
    const { router } = renderApp('/chemicals');
    const box = await screen.findByRole('combobox', { name: 'Search chemicals and containers' });

    await user.type(box, 'ace');
    const list = await screen.findByRole('listbox', { name: 'Search results' });
    expect(await within(list).findByText('Acetic anhydride')).toBeInTheDocument();

    await user.keyboard('{Escape}');
    expect(screen.queryByRole('listbox')).not.toBeInTheDocument();

    await user.keyboard('{ArrowDown}{ArrowDown}');
    const options = within(screen.getByRole('listbox')).getAllByRole('option');
    expect(options[1]).toHaveAttribute('aria-selected', 'true');
    expect(box).toHaveAttribute('aria-activedescendant', options[1]!.id);

    await user.keyboard('{Enter}');
    await waitFor(() => expect(router.state.location.pathname).toBe('/stock/chemicals/6'));
  });
});
