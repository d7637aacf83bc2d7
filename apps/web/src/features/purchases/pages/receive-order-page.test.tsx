import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Location, ReceivingView } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const coordinator = makeUser({ role: 'manager', displayName: 'Demo Technician' });

function place(id: number, path: string): Location {
  return {
    id,
    name: path.split(' › ').pop()!,
    kind: 'shelf',
    parentId: null,
    path,
    depth: 0,
    storageGroups: [],
    notes: '',
    flammableStorage: null,
    containerCount: 0,
    childCount: 0,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-01-01T00:00:00.000Z',
  };
}

const ordered: ReceivingView = {
  orderId: 5,
  title: 'Spring order',
  status: 'ordered',
  supplierName: 'Kestrel Fine Reagents (fictional)',
  supplierReference: 'KFR-2026-014',
  receivedAt: null,
  receivable: true,
  closable: false,
  closeBlockers: [],
  lines: [
    {
      lineId: 21,
      sku: 'KFR-S-500',
      chemical: {
        id: 7,
        name: 'Salicylic acid',
        ghsPictograms: ['GHS05', 'GHS07'],
        hazardStatements: ['H302', 'H318'],
      },
      packs: 1,
      packSize: 500,
      packUnit: 'g',
      grade: 'reagent',
      hazardous: false,
      lot: null,
      shares: [
        {
          shareId: 31,
          userId: 3,
          forLab: false,
          holder: 'Ines Okafor',
          quantity: 200,
          packUnit: 'g',
          stockQuantity: 200,
          stockUnit: 'g',
          container: null,
        },
        {
          shareId: 32,
          userId: null,
          forLab: true,
          holder: 'Lab',
          quantity: 300,
          packUnit: 'g',
          stockQuantity: 300,
          stockUnit: 'g',
          container: null,
        },
      ],
    },
  ],
};

function received(): ReceivingView {
  const line = ordered.lines[0]!;
  return {
    ...ordered,
    status: 'received',
    receivable: false,
    closable: true,
    receivedAt: '2026-03-10T15:00:00.000Z',
    lines: [
      {
        ...line,
        lot: { id: 90, supplierLotNumber: 'SA-24117' },
        shares: [
          {
            ...line.shares[0]!,
            container: {
              id: 101,
              labelCode: 'LW-00101',
              quantity: 200,
              unit: 'g',
              locationId: 2,
              locationPath: 'Room 101 › Cupboard',
            },
          },
          {
            ...line.shares[1]!,
            container: {
              id: 100,
              labelCode: 'LW-00100',
              quantity: 300,
              unit: 'g',
              locationId: 1,
              locationPath: 'Room 101 › Shelf A',
            },
          },
        ],
      },
    ],
  };
}

describe('Receive order page', () => {
  it('when the delivery is recorded, then the lot number, places and packs are sent and each portion’s container is shown', async () => {
    let view = ordered;
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: coordinator } },
      'GET /api/orders/5/receiving': () => ({ body: view }),
      'GET /api/locations': {
        body: page([place(1, 'Room 101 › Shelf A'), place(2, 'Room 101 › Cupboard')]),
      },
      'POST /api/orders/5/receive': () => {
        view = received();
        return { body: view };
      },
    });
    const user = userEvent.setup();
    renderApp('/orders/5/receive');
    await screen.findByRole('heading', { level: 1, name: /Receive order #5/ }, { timeout: 5000 });
    // The chemical's hazards show where it is received.
    expect(screen.getByText('H318')).toBeInTheDocument();

    await screen.findAllByRole('option', { name: 'Room 101 › Shelf A' });
    await user.selectOptions(screen.getByLabelText('Store the portions in'), 'Room 101 › Shelf A');
    await user.type(screen.getByLabelText(/Supplier lot number/), 'SA-24117');
    await user.selectOptions(
      screen.getByLabelText('Location of Ines Okafor’s portion'),
      'Room 101 › Cupboard',
    );
    await user.click(screen.getByRole('button', { name: 'Receive into 2 containers' }));

    const table = await screen.findByRole('table', { name: 'Containers made for the portions' });
    const ines = within(table).getByText('Ines Okafor').closest('tr')!;
    expect(within(ines).getByText('LW-00101')).toBeInTheDocument();
    expect(within(ines).getByText('Room 101 › Cupboard')).toBeInTheDocument();
    const post = requests.find((r) => r.method === 'POST')!;
    expect(post.body).toMatchObject({
      locationId: 1,
      lines: [{ lineId: 21, packsReceived: 1, supplierLotNumber: 'SA-24117', expiresOn: null }],
      shares: [{ shareId: 31, locationId: 2 }],
      confirm: false,
    });
    expect(screen.getByRole('button', { name: 'Close order' })).toBeEnabled();
  }, 15_000);

  it('when no place is chosen, then nothing is sent and the field says what is missing', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: coordinator } },
      'GET /api/orders/5/receiving': { body: ordered },
      'GET /api/locations': { body: page([place(1, 'Room 101 › Shelf A')]) },
    });
    const user = userEvent.setup();
    renderApp('/orders/5/receive');
    await screen.findByRole('heading', { level: 1, name: /Receive order #5/ }, { timeout: 5000 });
    await user.click(screen.getByRole('button', { name: 'Receive into 2 containers' }));
    expect(await screen.findByText('Choose where the portions are stored.')).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });
});
