import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const ether = makeChemical({
  name: 'Diethyl ether',
  formula: 'C4H10O',
  molarMass: 74.12,
  physicalState: 'liquid',
  ghsPictograms: ['GHS02', 'GHS07'],
  hazardStatements: ['H224', 'H302', 'H336', 'H019x'],
  storageGroup: 'flammable',
  peroxideClass: 'B',
});

describe('Chemical detail', () => {
  it('shows the hazards first: pictograms with meaning, H-statement texts, storage group, peroxide class and the caution', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      [`GET /api/chemicals/${ether.id}`]: { body: ether },
    });
    renderApp(`/chemicals/${ether.id}`);

    const hazards = await screen.findByRole('region', { name: 'Hazards' });
    expect(within(hazards).getByText('Flame')).toBeInTheDocument();
    expect(within(hazards).getByText('Harmful, irritant or narcotic')).toBeInTheDocument();
    expect(within(hazards).getByText('Extremely flammable liquid and vapour')).toBeInTheDocument();
    expect(within(hazards).getByText(/see SDS/)).toBeInTheDocument();
    expect(within(hazards).getByText('Flammables')).toBeInTheDocument();
    expect(within(hazards).getByText(/Dangerous on concentration/)).toBeInTheDocument();
    expect(within(hazards).getByText(/not a safety approval/)).toBeInTheDocument();
  });

  it('when a viewer looks, then there is no Edit or Delete', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      [`GET /api/chemicals/${ether.id}`]: { body: ether },
    });
    renderApp(`/chemicals/${ether.id}`);

    await screen.findByRole('heading', { level: 1, name: /Diethyl ether/ });
    expect(screen.queryByRole('link', { name: 'Edit' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Delete' })).not.toBeInTheDocument();
  });

  it('when a manager deletes but the server refuses (409), then the reason shows in the dialog', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      [`GET /api/chemicals/${ether.id}`]: { body: ether },
      [`DELETE /api/chemicals/${ether.id}`]: {
        status: 409,
        body: { error: { code: 'conflict', message: 'Diethyl ether still has 2 lots.' } },
      },
    });
    const user = userEvent.setup();
    const { router } = renderApp(`/chemicals/${ether.id}`);

    await user.click(await screen.findByRole('button', { name: 'Delete' }));
    const dialog = screen.getByRole('dialog', { name: 'Delete Diethyl ether?' });
    await user.click(within(dialog).getByRole('button', { name: 'Delete chemical' }));

    await waitFor(() =>
      expect(within(dialog).getByRole('alert')).toHaveTextContent('still has 2 lots'),
    );
    expect(router.state.location.pathname).toBe(`/chemicals/${ether.id}`);
  });

  it('when the id is unknown, then the page says so', async () => {
    mockFetch({ 'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } } });
    renderApp('/chemicals/9999');

    expect(await screen.findByText('No such chemical')).toBeInTheDocument();
  });
});
