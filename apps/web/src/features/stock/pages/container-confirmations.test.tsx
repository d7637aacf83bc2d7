import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { ContainerHold } from '@lotwise/shared';
import { mockFetch, type RecordedRequest } from '../../../test/fetch-mock';
import { makeContainer, makeLedgerEntry, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const manager = makeUser({ role: 'manager', displayName: 'Tess Technician' });

const hold: ContainerHold = {
  reservationId: 5,
  planId: 3,
  planTitle: 'Aspirin from salicylic acid',
  plannedOn: '2026-12-10',
  until: '2026-12-10',
  quantity: 65,
  reservedQuantity: 65,
  unit: 'mL',
};

const anhydride = makeContainer({
  id: 42,
  labelCode: 'LW-00042',
  quantity: 100,
  unit: 'mL',
  tareMass: null,
  capacity: null,
  chemical: {
    id: 3,
    name: 'Acetic anhydride',
    formula: 'C4H6O3',
    casNumber: '108-24-7',
    density: 1.082,
    storageGroup: 'organic-acid',
    extraHazardGroups: [],
    ghsPictograms: ['GHS02', 'GHS05'],
    hazardStatements: ['H226', 'H314'],
    peroxideClass: null,
    stockUnit: 'mL',
  },
  holds: [hold],
});

const holdWarning = {
  kind: 'hold',
  message: '65 mL of LW-00042 is held for plan #3 …',
  planId: 3,
  planTitle: 'Aspirin from salicylic acid',
  plannedOn: '2026-12-10',
  until: '2026-12-10',
  containerId: 42,
  labelCode: 'LW-00042',
  heldBefore: 65,
  heldAfter: 15,
  loses: 50,
  unit: 'mL',
};

const storageWarning = {
  kind: 'storage_conflict',
  message:
    'Acetic anhydride (organic acid) and sodium hydroxide (base, LW-00007 at Room 101 › Bases shelf) must be kept apart: Acids and bases neutralise each other with heat and spattering.',
  code: 'incompatible_groups',
  reason: 'Acids and bases neutralise each other with heat and spattering.',
  source: 'Prudent Practices',
  groups: ['organic-acid', 'base'],
  locationId: 8,
  locationPath: 'Room 101 › Bases shelf',
  labelCodes: ['LW-00007'],
};

const flammableLimitWarning = {
  kind: 'flammable_limit',
  message:
    'Room 101 would hold 16.0 L of Class I liquids; its limit is 15.1 L (NFPA 45 (2024), Table 9.1.1).',
  labAreaId: 4,
  labAreaName: 'Room 101',
  limit: 'Class I liquids, cabinets and safety cans included',
  heldLitres: 15.0,
  afterLitres: 16.0,
  limitLitres: 15.1,
  source: 'NFPA 45 (2024), Table 9.1.1',
};

const containerSizeWarning = {
  kind: 'container_size',
  message: 'Acetic anhydride (Class II) in a 5 L glass bottle: the largest allowed is 4 L.',
  liquidClass: 'II',
  material: 'glass',
  capacityLitres: 5,
  limitLitres: 4,
  source: 'Campus safety office (2026), container sizes',
};

function confirmationAnswer(warnings: unknown[]) {
  return {
    status: 409,
    body: { error: { code: 'confirmation_required', message: 'Confirm first.', warnings } },
  };
}

function routes(write: (request: RecordedRequest) => { status?: number; body?: unknown }) {
  const entry = makeLedgerEntry({ containerId: 42, quantity: 100, balanceAfter: 100 });
  const place = {
    id: 8,
    name: 'Bases shelf',
    kind: 'shelf',
    parentId: null,
    path: 'Room 101 › Bases shelf',
    depth: 1,
    storageGroups: [],
    notes: '',
    flammableStorage: null,
    containerCount: 1,
    childCount: 0,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-01-01T00:00:00.000Z',
  };
  return mockFetch({
    'GET /api/auth/me': { body: { user: manager } },
    'GET /api/containers/42': { body: anhydride },
    'GET /api/containers/42/ledger': { body: page([entry]) },
    'GET /api/locations': { body: page([{ ...place, id: 5, name: 'Shelf 2' }, place]) },
    'POST /api/containers/42/draws': write,
    'POST /api/containers/42/transfers': write,
    'POST /api/containers/42/splits': write,
  });
}

async function openContainer() {
  const user = userEvent.setup();
  renderApp('/stock/containers/42');
  await screen.findByRole('heading', { level: 1, name: 'Acetic anhydride' }, { timeout: 5000 });
  return user;
}

const saved = (quantity: number) => ({
  status: 201,
  body: {
    container: { ...anhydride, quantity },
    entries: [makeLedgerEntry({ containerId: 42, reason: 'drawn', quantity: -55 })],
    warnings: [],
  },
});

describe('confirming a write the server asks about', () => {
  it('when a container is held for a plan, then its page and the draw form say for which plan, date and how much is free', async () => {
    routes(() => saved(100));
    await openContainer();

    expect(screen.getByText('Held for plans')).toBeInTheDocument();
    expect(
      screen.getAllByRole('link', { name: 'plan #3 · Aspirin from salicylic acid' }),
    ).toHaveLength(2);
    const form = screen.getByRole('form', { name: 'Record a draw' });
    expect(within(form).getByText(/Free to draw without asking/)).toHaveTextContent(/35(\.0+)? mL/);
  });

  it('when a draw into a hold answers confirmation_required, then the dialog names the plan and what it loses, and "Draw anyway" sends the same draw with confirm', async () => {
    const { requests } = routes((request) =>
      (request.body as { confirm?: boolean }).confirm
        ? saved(45)
        : confirmationAnswer([holdWarning]),
    );
    const user = await openContainer();

    const form = screen.getByRole('form', { name: 'Record a draw' });
    await user.type(within(form).getByRole('textbox', { name: 'Amount taken' }), '55');
    await user.click(within(form).getByRole('button', { name: 'Record draw' }));

    const dialog = await screen.findByRole('dialog', { name: 'This takes stock held for a plan' });
    expect(dialog).toHaveTextContent('Plan #3 · Aspirin from salicylic acid');
    expect(dialog).toHaveTextContent(/The plan loses 50(\.0+)? mL/);
    await user.click(within(dialog).getByRole('button', { name: 'Draw anyway' }));

    expect(await within(form).findByText(/Draw recorded/)).toBeInTheDocument();
    const posts = requests.filter((r) => r.method === 'POST');
    expect(posts.map((r) => r.body)).toEqual([
      { amount: 55, unit: 'mL' },
      { amount: 55, unit: 'mL', confirm: true },
    ]);
  });

  it('when the person goes back, then nothing more is sent and the form says nothing was drawn', async () => {
    const { requests } = routes(() => confirmationAnswer([holdWarning]));
    const user = await openContainer();

    const form = screen.getByRole('form', { name: 'Record a draw' });
    await user.type(within(form).getByRole('textbox', { name: 'Amount taken' }), '55');
    await user.click(within(form).getByRole('button', { name: 'Record draw' }));
    const dialog = await screen.findByRole('dialog', { name: 'This takes stock held for a plan' });
    await user.click(within(dialog).getByRole('button', { name: 'Go back' }));

    expect(await within(form).findByRole('alert')).toHaveTextContent(/nothing was drawn/);
    expect(requests.filter((r) => r.method === 'POST')).toHaveLength(1);
  });

  it('when a move breaks a storage rule, then the reason "must be kept apart" is shown before anything is saved, and "Save anyway" moves it', async () => {
    const { requests } = routes((request) =>
      (request.body as { confirm?: boolean }).confirm
        ? {
            status: 201,
            body: {
              container: {
                ...anhydride,
                location: { id: 8, name: 'Bases shelf', path: 'Room 101 › Bases shelf' },
              },
              entries: [],
              warnings: [],
            },
          }
        : confirmationAnswer([storageWarning]),
    );
    const user = await openContainer();

    await user.click(screen.getByRole('button', { name: 'Move' }));
    const move = await screen.findByRole('dialog', { name: 'Move LW-00042' });
    await user.selectOptions(within(move).getByRole('combobox', { name: 'Move to' }), '8');
    await user.click(within(move).getByRole('button', { name: 'Move container' }));

    const confirm = await screen.findByRole('dialog', { name: 'Check the storage before saving' });
    expect(confirm).toHaveTextContent(/must be kept apart: Acids and bases/);
    expect(confirm).toHaveTextContent(/not a safety approval/);
    await user.click(within(confirm).getByRole('button', { name: 'Save anyway' }));

    expect(await within(move).findByText(/is now at Room 101 › Bases shelf/)).toBeInTheDocument();
    await waitFor(() =>
      expect(requests.filter((r) => r.method === 'POST').map((r) => r.body)).toEqual([
        { locationId: 8, note: '' },
        { locationId: 8, note: '', confirm: true },
      ]),
    );
  });

  it('when a move would take a lab area over a flammable-liquid limit, then the dialog names the area, the litres held and after against the limit, and the rule set, and "Save anyway" moves it', async () => {
    const { requests } = routes((request) =>
      (request.body as { confirm?: boolean }).confirm
        ? {
            status: 201,
            body: {
              container: {
                ...anhydride,
                location: { id: 8, name: 'Bases shelf', path: 'Room 101 › Bases shelf' },
              },
              entries: [],
              warnings: [],
            },
          }
        : confirmationAnswer([flammableLimitWarning]),
    );
    const user = await openContainer();

    await user.click(screen.getByRole('button', { name: 'Move' }));
    const move = await screen.findByRole('dialog', { name: 'Move LW-00042' });
    await user.selectOptions(within(move).getByRole('combobox', { name: 'Move to' }), '8');
    await user.click(within(move).getByRole('button', { name: 'Move container' }));

    const confirm = await screen.findByRole('dialog', {
      name: 'This goes over a flammable-liquid limit',
    });
    expect(confirm).toHaveTextContent('Room 101 · Class I liquids, cabinets and safety cans');
    expect(confirm).toHaveTextContent(
      /Holds 15\.0 L now, 16\.0 L after this, against a limit of 15\.1 L: 0\.90 L over/,
    );
    expect(confirm).toHaveTextContent('Limit from NFPA 45 (2024), Table 9.1.1');
    expect(confirm).toHaveTextContent(/not an approval/);
    await user.click(within(confirm).getByRole('button', { name: 'Save anyway' }));

    expect(await within(move).findByText(/is now at Room 101 › Bases shelf/)).toBeInTheDocument();
    await waitFor(() =>
      expect(requests.filter((r) => r.method === 'POST').map((r) => r.body)).toEqual([
        { locationId: 8, note: '' },
        { locationId: 8, note: '', confirm: true },
      ]),
    );
  });

  it('when a split answers that the container is larger than its class and material allow, then the dialog gives the capacity against the largest allowed with the rule set, and going back saves nothing', async () => {
    const { requests } = routes(() => confirmationAnswer([containerSizeWarning]));
    const user = await openContainer();

    await user.click(screen.getByRole('button', { name: 'Split' }));
    const split = await screen.findByRole('dialog', { name: 'Split LW-00042' });
    await user.type(within(split).getByRole('textbox', { name: 'Amount to pour off' }), '20');
    await user.click(within(split).getByRole('button', { name: 'Split into new container' }));

    const confirm = await screen.findByRole('dialog', {
      name: 'This container is larger than allowed',
    });
    expect(confirm).toHaveTextContent(
      /Class II in glass: the container holds 5\.0 L; the largest allowed is 4\.0 L/,
    );
    expect(confirm).toHaveTextContent('Limit from Campus safety office (2026), container sizes');
    await user.click(within(confirm).getByRole('button', { name: 'Go back' }));

    await waitFor(() =>
      expect(screen.queryByRole('dialog', { name: /larger than allowed/ })).not.toBeInTheDocument(),
    );
    expect(requests.filter((r) => r.method === 'POST')).toHaveLength(1);
  });
});
