import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { formatMoney, type Receipt } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const member = makeUser({ role: 'member', displayName: 'Ines Okafor' });

/** 100 g of a 500 g pack and one 1 L bottle, paid online and in cash, €1.00 given back. */
const receipt: Receipt = {
  labName: 'Harbour Street Chemistry Club',
  orderId: 7,
  title: 'Spring order',
  status: 'received',
  currency: 'EUR',
  supplier: { name: 'Kestrel Fine Reagents (fictional)', reference: 'KFR-2026-014' },
  member: { id: member.id, displayName: 'Ines Okafor', email: 'ines@example.test' },
  claimsClosedAt: '2026-02-20T09:00:00.000Z',
  orderedAt: '2026-02-22T09:00:00.000Z',
  receivedAt: '2026-03-10T15:00:00.000Z',
  lines: [
    {
      shareId: 11,
      sku: 'KFR-NACL-500',
      chemicalName: 'Salicylic acid',
      ghsPictograms: ['GHS05', 'GHS07'],
      hazardStatements: ['H302', 'H318'],
      quantity: 100,
      unit: 'g',
      goodsMinor: 1000,
      feesMinor: 336,
      amountMinor: 1336,
      paymentStatus: 'paid',
      labelCode: 'LW-00101',
    },
    {
      shareId: 12,
      sku: 'KFR-ETOH-1L',
      chemicalName: 'Ethanol',
      ghsPictograms: ['GHS02'],
      hazardStatements: ['H225'],
      quantity: 1,
      unit: 'L',
      goodsMinor: 1200,
      feesMinor: 403,
      amountMinor: 1603,
      paymentStatus: 'paid',
      labelCode: null,
    },
  ],
  payments: [
    {
      id: 1,
      shareId: 11,
      kind: 'checkout',
      amountMinor: 1336,
      at: '2026-02-21T10:00:00.000Z',
      note: '',
    },
    {
      id: 2,
      shareId: 12,
      kind: 'cash',
      amountMinor: 1603,
      at: '2026-02-21T11:00:00.000Z',
      note: 'At the club evening',
    },
  ],
  refunds: [
    {
      id: 3,
      shareId: 12,
      kind: 'refund',
      amountMinor: 100,
      at: '2026-03-11T08:00:00.000Z',
      note: '',
    },
  ],
  totals: {
    amountMinor: 2939,
    collectedMinor: 2939,
    refundedMinor: 100,
    owedMinor: 0,
    goodsMinor: 2200,
    feesMinor: 739,
    netPaidMinor: 2839,
  },
  issuedAt: '2026-03-12T09:00:00.000Z',
};

const eur = (minor: number) => formatMoney(minor, 'EUR');

afterEach(() => vi.restoreAllMocks());

describe('Receipt page', () => {
  it('when a member opens a receipt, then it shows the lab, supplier, their lines with goods and fees, payments, refunds and totals from the server', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/7/receipt': { body: receipt },
    });
    renderApp('/orders/7/receipt');
    const article = await screen.findByRole(
      'article',
      { name: 'Receipt for order #7' },
      { timeout: 5000 },
    );
    const view = within(article);
    expect(view.getByText('Harbour Street Chemistry Club')).toBeInTheDocument();
    expect(view.getByText('Kestrel Fine Reagents (fictional)')).toBeInTheDocument();
    expect(view.getByText('Order reference KFR-2026-014')).toBeInTheDocument();

    const lines = within(view.getByRole('region', { name: 'What you took' }));
    const salt = lines.getByText('Salicylic acid').closest('tr')!;
    expect(within(salt).getByText(eur(1000))).toBeInTheDocument();
    expect(within(salt).getByText(eur(336))).toBeInTheDocument();
    expect(within(salt).getByText(eur(1336))).toBeInTheDocument();
    expect(within(salt).getByText('LW-00101')).toBeInTheDocument();
    // Its hazards stay beside it, and the page defers to the SDS.
    expect(within(salt).getByText('H318')).toBeInTheDocument();
    expect(screen.getByText(/SDS, local regulations and licensed practice/)).toBeInTheDocument();

    const payments = within(view.getByRole('region', { name: 'Payments' }));
    expect(payments.getByText('Online payment')).toBeInTheDocument();
    expect(payments.getByText('Cash')).toBeInTheDocument();
    expect(payments.getByText('At the club evening')).toBeInTheDocument();
    expect(
      within(view.getByRole('region', { name: 'Refunds' })).getByText(eur(100)),
    ).toBeInTheDocument();

    const totals = within(view.getByRole('region', { name: 'Totals' }));
    const total = (label: string) => totals.getByText(label).closest('div')!;
    expect(within(total('Goods')).getByText(eur(2200))).toBeInTheDocument();
    expect(within(total('Fees')).getByText(eur(739))).toBeInTheDocument();
    expect(within(total('Your amount')).getByText(eur(2939))).toBeInTheDocument();
    expect(within(total('Paid in the end')).getByText(eur(2839))).toBeInTheDocument();
    expect(within(total('Still to pay')).getByText(eur(0))).toBeInTheDocument();
  });

  it('when the member presses Print or save as PDF, then the browser’s print dialog opens', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/7/receipt': { body: receipt },
    });
    const print = vi.spyOn(window, 'print').mockImplementation(() => undefined);
    const user = userEvent.setup();
    renderApp('/orders/7/receipt');
    await screen.findByRole('article', { name: 'Receipt for order #7' }, { timeout: 5000 });
    await user.click(screen.getByRole('button', { name: 'Print or save as PDF' }));
    expect(print).toHaveBeenCalledOnce();
  });

  it('when the member has no share in the order, then the page says so', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/8/receipt': {
        status: 404,
        body: { error: { code: 'not_found', message: 'You have no share in order #8.' } },
      },
    });
    renderApp('/orders/8/receipt');
    expect(
      await screen.findByText('You have no share in order #8.', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
  });
});
