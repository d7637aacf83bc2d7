import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import {
  safetyDeferral,
  type MemberRequest,
  type PackOffer,
  type ReorderSuggestion,
} from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const technician = makeUser({ role: 'manager' });

function offer(overrides: Partial<PackOffer> = {}): PackOffer {
  return {
    supplier: { id: 1, name: 'Northgate Lab Supply (fictional)' },
    packs: [
      {
        catalogItemId: 11,
        supplierSku: 'NG-500',
        count: 1,
        packSize: 500,
        packUnit: 'g',
        amountPerPack: 500,
        priceMinor: 4000,
        hazardous: false,
      },
    ],
    packCount: 1,
    amount: 500,
    goodsMinor: 4000,
    shippingFeeMinor: 1200,
    hazardousFeeMinor: 0,
    totalMinor: 5200,
    pricePerUnitMinor: 10.4,
    withinOverbuyLimit: true,
    minimumOrderMinor: 0,
    belowMinimumOrder: false,
    minimumOrderShortMinor: 0,
    ...overrides,
  };
}

function suggestion(overrides: Partial<ReorderSuggestion> = {}): ReorderSuggestion {
  return {
    chemical: {
      id: 5,
      name: 'Salicylic acid',
      casNumber: '69-72-7',
      formula: 'C7H6O3',
      physicalState: 'solid',
      stockUnit: 'g',
      ghsPictograms: ['GHS05', 'GHS07'],
      hazardStatements: ['H302', 'H318'],
      storageGroup: 'organic-acid',
      restricted: false,
    },
    unit: 'g',
    onHand: 205,
    reorderPoint: 100,
    reorderQuantity: 500,
    consumed: 280,
    rateDays: 56,
    ratePerDay: 5,
    daysLeft: 41,
    daysToReorderPoint: 21,
    reorderPointOn: '2026-12-23',
    emptyOn: '2027-01-12',
    due: false,
    quantityToBuy: 500,
    rule: 'reorder-quantity',
    onOrder: 0,
    offer: offer(),
    alternatives: [],
    notes: [],
    ...overrides,
  };
}

const salicylic = suggestion();
const acetone = suggestion({
  chemical: {
    ...salicylic.chemical,
    id: 6,
    name: 'Acetone',
    physicalState: 'liquid',
    stockUnit: 'mL',
    ghsPictograms: ['GHS02', 'GHS07'],
    hazardStatements: ['H225', 'H319', 'H336'],
    storageGroup: 'flammable',
  },
  unit: 'mL',
  onHand: 300,
  reorderPoint: 500,
  due: true,
  daysToReorderPoint: 0,
  offer: offer({
    supplier: { id: 2, name: 'Harbour Reagents (fictional)' },
    hazardousFeeMinor: 2500,
    totalMinor: 7700,
    pricePerUnitMinor: 7.7,
  }),
});
const ethanol = suggestion({
  chemical: { ...salicylic.chemical, id: 7, name: 'Ethanol', ghsPictograms: ['GHS02'] },
  ratePerDay: null,
  daysLeft: null,
  daysToReorderPoint: null,
  reorderPointOn: null,
  quantityToBuy: null,
  rule: 'none',
  offer: null,
  notes: ['Set a reorder quantity on the chemical to get a quantity and packs to buy.'],
});

const list = {
  items: [acetone, salicylic, ethanol],
  windowWeeks: 8,
  asOf: '2026-12-02',
  currency: 'EUR',
  packRule: 'Packs from one supplier that together cover the quantity.',
};

const request: MemberRequest = {
  id: 31,
  chemical: salicylic.chemical,
  requester: { id: 9, displayName: 'Robin Example' },
  quantity: 50,
  unit: 'g',
  neededBy: '2027-03-01',
  note: 'for the crystal evening',
  status: 'open',
  orderId: null,
  shareId: null,
  createdAt: '2026-12-01T10:00:00.000Z',
  updatedAt: '2026-12-01T10:00:00.000Z',
};

describe('Restock page', () => {
  it('when the coordinator opens it, then each chemical shows its hazards, days and best offer with fees', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/reorder-suggestions': { body: list },
      'GET /api/requests': { body: page([request]) },
    });
    renderApp('/orders/restock');
    const table = await screen.findByRole(
      'table',
      { name: 'Reorder suggestions' },
      { timeout: 5000 },
    );
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    const [acetoneRow, salicylicRow, ethanolRow] = rows as [HTMLElement, HTMLElement, HTMLElement];
    expect(acetoneRow).toHaveTextContent('Reorder now');
    expect(acetoneRow).toHaveTextContent('H225');
    expect(acetoneRow).toHaveTextContent('Harbour Reagents (fictional)');
    // 205 g on hand, 5 g a day -> 35 g a week; the reorder point in 21 days
    expect(salicylicRow).toHaveTextContent('205.00 g');
    expect(salicylicRow).toHaveTextContent('35.00 g/week');
    expect(salicylicRow).toHaveTextContent('Reorder in 21 days');
    expect(salicylicRow).toHaveTextContent('€52.00');
    expect(salicylicRow).toHaveTextContent('€12.00 fees');
    expect(salicylicRow).toHaveTextContent('€0.104/g');
    expect(within(salicylicRow).getByText('GHS05')).toBeInTheDocument();
    expect(ethanolRow).toHaveTextContent('Not being used');
    expect(ethanolRow).toHaveTextContent('Set a reorder quantity');
    expect(within(ethanolRow).getByRole('checkbox')).toBeDisabled();
    expect(screen.getAllByText(safetyDeferral).length).toBeGreaterThan(0);

    const requests = screen.getByRole('region', { name: 'Members’ open requests' });
    expect(requests).toHaveTextContent('50.00 g of Salicylic acid for Robin Example');
  });

  it('when the coordinator picks two rows and drafts, then one order per supplier is drafted and linked', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/reorder-suggestions': { body: list },
      'GET /api/requests': { body: page([]) },
      'POST /api/reorder-suggestions/draft-orders': {
        status: 201,
        body: {
          orders: [
            { orderId: 21, supplier: acetone.offer!.supplier, created: true, lineCount: 1 },
            { orderId: 22, supplier: salicylic.offer!.supplier, created: false, lineCount: 1 },
          ],
        },
      },
    });
    renderApp('/orders/restock');
    const draft = await screen.findByRole(
      'button',
      { name: 'Draft a shared order' },
      { timeout: 5000 },
    );
    expect(draft).toBeDisabled();
    await userEvent.click(
      await screen.findByRole('checkbox', { name: 'Choose Acetone' }, { timeout: 5000 }),
    );
    await userEvent.click(screen.getByRole('checkbox', { name: 'Choose Salicylic acid' }));
    await userEvent.click(screen.getByRole('button', { name: 'Draft a shared order (2 chosen)' }));
    expect(
      await screen.findByRole('link', { name: 'Order #21 with Harbour Reagents (fictional)' }),
    ).toHaveAttribute('href', '/orders/21');
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      items: [{ chemicalId: 6 }, { chemicalId: 5 }],
    });
  });

  it('when one supplier gets the order, then the page goes to that order', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/reorder-suggestions': { body: list },
      'GET /api/requests': { body: page([]) },
      'POST /api/reorder-suggestions/draft-orders': {
        status: 201,
        body: {
          orders: [{ orderId: 23, supplier: acetone.offer!.supplier, created: true, lineCount: 1 }],
        },
      },
    });
    const { router } = renderApp('/orders/restock');
    await userEvent.click(
      await screen.findByRole('checkbox', { name: 'Choose Acetone' }, { timeout: 5000 }),
    );
    await userEvent.click(screen.getByRole('button', { name: 'Draft a shared order (1 chosen)' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/orders/23'));
  });

  it('when the coordinator folds a request, then it becomes the member’s share and the order is linked', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/reorder-suggestions': { body: list },
      'GET /api/requests': { body: page([request]) },
      'POST /api/requests/31/fold': {
        body: { ...request, status: 'folded', orderId: 24, shareId: 40 },
      },
    });
    renderApp('/orders/restock');
    await userEvent.click(
      await screen.findByRole(
        'button',
        { name: 'Add to a draft order as their share' },
        { timeout: 5000 },
      ),
    );
    expect(await screen.findByRole('link', { name: 'order #24' })).toHaveAttribute(
      'href',
      '/orders/24',
    );
    expect(screen.getByText(/is now Robin Example’s share in/)).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({});
  });

  it('when a member opens it, then they cannot draft but can ask for a chemical and see their requests', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/reorder-suggestions': { body: list },
      'GET /api/requests': {
        body: page([{ ...request, requester: { id: 2, displayName: 'Me' } }]),
      },
    });
    renderApp('/orders/restock');
    await screen.findByRole('table', { name: 'Reorder suggestions' }, { timeout: 5000 });
    expect(screen.queryByRole('button', { name: /Draft a shared order/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('checkbox', { name: /Choose/ })).not.toBeInTheDocument();
    expect(screen.getByRole('form', { name: 'Request a chemical' })).toBeInTheDocument();
    const own = screen.getByRole('region', { name: 'Your requests' });
    expect(within(own).getByRole('button', { name: 'Withdraw' })).toBeInTheDocument();
  });
});
