import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeContainer, makeLedgerEntry, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const bottle = makeContainer({ id: 51, labelCode: 'LW-00051', material: null });

function routes(role: 'manager' | 'viewer') {
  let material: string | null = null;
  return mockFetch({
    'GET /api/auth/me': { body: { user: makeUser({ role }) } },
    'GET /api/containers/51': () => ({ body: { ...bottle, material } }),
    'GET /api/containers/51/ledger': { body: page([makeLedgerEntry({ containerId: 51 })]) },
    'GET /api/locations': { body: page([]) },
    'PATCH /api/containers/51': (request) => {
      material = (request.body as { material: string | null }).material;
      return { body: { ...bottle, material } };
    },
  });
}

describe('a container’s material', () => {
  it('when a manager sets the material, then only the material is sent and the page shows it', async () => {
    const { requests } = routes('manager');
    const user = userEvent.setup();
    renderApp('/stock/containers/51');

    const select = await screen.findByRole('combobox', { name: 'Material' }, { timeout: 5000 });
    expect(select).toHaveValue('');
    await user.selectOptions(select, 'safety-can');
    await user.click(screen.getByRole('button', { name: 'Save material' }));

    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ material: 'safety-can' }),
    );
    await waitFor(() =>
      expect(screen.queryByRole('button', { name: 'Save material' })).not.toBeInTheDocument(),
    );
    expect(screen.getByRole('combobox', { name: 'Material' })).toHaveValue('safety-can');
  });

  it('when a viewer looks, then the material is words, not a control', async () => {
    routes('viewer');
    renderApp('/stock/containers/51');

    await screen.findByRole('heading', { level: 1 }, { timeout: 5000 });
    const term = screen.getByText('Material', { selector: 'dt' });
    expect(within(term.parentElement!).getByText('Not said')).toBeInTheDocument();
    expect(screen.queryByRole('combobox', { name: 'Material' })).not.toBeInTheDocument();
  });
});
