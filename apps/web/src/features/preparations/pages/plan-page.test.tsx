import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { safetyDeferral } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { display, makePlanDetail, makeStockLine } from '../test-factories';

const technician = makeUser({ role: 'manager' });

// Dibenzalacetone for 8 benches at 1/4 scale with 10 % overage: 20 mL of 1 M NaOH per bench
// at base scale -> 5.0 mL per bench -> 5 × 8 × 1.10 = 44 mL; 13.5 mL in stock -> 30.5 mL short.
const naohLine = makeStockLine({
  index: 1,
  lineIndex: 2,
  role: 'catalyst',
  chemical: {
    id: 27,
    name: 'Sodium hydroxide solution 1 M',
    stockUnit: 'mL',
    density: 1.04,
    defaultPurityPercent: 100,
  },
  perBench: 5,
  perBenchDisplay: display(5, 'mL'),
  required: 44,
  requiredDisplay: display(44, 'mL'),
  requiredPure: 44,
  requiredPureG: 45.76,
  available: 13.5,
  availablePure: 13.5,
  availablePureG: 14.04,
  shortfall: 30.5,
  shortfallPureG: 31.72,
  status: 'short',
  take: [
    {
      containerId: 65,
      labelCode: 'LW-00065',
      lotId: 35,
      locationId: 9,
      locationPath: 'Room 101 › Base cabinet › Bases shelf',
      status: 'open',
      expiresOn: null,
      purityPercent: 100,
      quantity: 13.5,
      reservedByOthers: 0,
      reservedByThisPlan: 0,
      free: 13.5,
      take: 13.5,
      takePure: 13.5,
    },
  ],
  suggestions: [
    {
      kind: 'reorder',
      chemicalId: 27,
      shortfall: 30.5,
      unit: 'mL',
      reorderQuantity: null,
      href: '/orders/new?chemicalId=27&quantity=30.5&unit=mL',
    },
    {
      kind: 'prepare',
      procedureId: 3,
      procedureTitle: 'Sodium hydroxide solution 1 M',
      productLineIndex: 2,
      // 10 g NaOH / 39.997 g/mol = 250.02 mL of 1 M; × 95 % = 237.52 mL; 30.5 / 237.52
      factor: 0.128411,
      roundedFactor: 0.13,
      expectedYieldPercent: 95,
      expectedAmount: 30.877,
      unit: 'mL',
    },
  ],
  // 44 mL / 8 benches = 5.5 mL a bench; 13.5 mL serves 2 benches
  benchesCovered: 2,
  remedy: 'prepare',
});

const plan = makePlanDetail({
  stockCheck: {
    asOf: '2026-12-10',
    lines: [makeStockLine(), naohLine],
    ok: false,
    shortCount: 1,
    benchesServed: 2,
    rule: 'Counted: usable containers.',
  },
});

describe('Plan page', () => {
  it('when a line is short and another procedure makes it, then the shortfall is shown in words and "prepare it first" links to planning that procedure at the factor', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/plans/2': { body: plan },
    });
    renderApp('/preparations/plans/2');

    const row = await screen.findByTestId('stock-line-1', {}, { timeout: 5000 });
    expect(within(row).getByText('Short')).toBeInTheDocument();
    expect(within(row).getByTestId('shortfall-1')).toHaveTextContent('30.50 mL');
    expect(within(row).getByText('44.0 mL')).toBeInTheDocument();
    expect(within(row).getByText('LW-00065')).toBeInTheDocument();
    expect(screen.getByText('1 line is short')).toBeInTheDocument();
    expect(within(screen.getByTestId('stock-line-0')).getByText('Enough')).toBeInTheDocument();

    const prepare = within(row).getByTestId('prepare-suggestion');
    expect(prepare).toHaveTextContent('Prepare it first');
    expect(prepare).toHaveTextContent('Sodium hydroxide solution 1 M at factor 0.13');
    expect(within(prepare).getByRole('link', { name: 'Plan that preparation' })).toHaveAttribute(
      'href',
      '/preparations/plans/new?procedureId=3&factor=0.13',
    );

    expect(within(row).getByRole('button', { name: 'Reorder 30.50 mL' })).toBeEnabled();

    // Hazards, cautions and the deferral sit above the stock check.
    expect(screen.getByText(safetyDeferral)).toBeInTheDocument();
    expect(screen.getByText('Keep the mixture below 30 °C.')).toBeInTheDocument();
    expect(screen.getByText('Harmful if swallowed')).toBeInTheDocument();
  });

  it('when the technician reorders a shortfall, then an order line is drafted for it and the page links to the order', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/plans/2': { body: plan },
      'POST /api/reorder-suggestions/shortfall': {
        status: 201,
        body: {
          orderId: 14,
          supplier: { id: 3, name: 'Harbour Reagents (fictional)' },
          created: false,
          lineCount: 1,
        },
      },
    });
    renderApp('/preparations/plans/2');
    const row = await screen.findByTestId('stock-line-1', {}, { timeout: 5000 });
    await userEvent.click(within(row).getByRole('button', { name: 'Reorder 30.50 mL' }));
    const link = await within(row).findByRole('link', {
      name: 'order #14 with Harbour Reagents (fictional)',
    });
    expect(link).toHaveAttribute('href', '/orders/14');
    expect(within(row).getByTestId('reorder-suggestion')).toHaveTextContent('Added to order #14');
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      chemicalId: 27,
      quantity: 30.5,
      unit: 'mL',
    });
  });

  it('when a member sees a shortfall, then they may request it instead of ordering', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/plans/2': { body: plan },
      'POST /api/requests': { status: 201, body: {} },
    });
    renderApp('/preparations/plans/2');
    const row = await screen.findByTestId('stock-line-1', {}, { timeout: 5000 });
    expect(within(row).queryByRole('button', { name: /^Reorder/ })).not.toBeInTheDocument();
    await userEvent.click(within(row).getByRole('button', { name: 'Request 30.50 mL' }));
    await waitFor(() =>
      expect(
        requests.find((r) => r.method === 'POST' && r.url.pathname === '/api/requests'),
      ).toBeDefined(),
    );
  });

  it('when another plan took the container first, then the 409 message is shown and nothing is held', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: technician } },
      'GET /api/plans/2': { body: plan },
      'POST /api/plans/2/reservations': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'Some containers no longer have enough free.',
            fields: { items: 'at most 2 mL of LW-00025 is free' },
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/preparations/plans/2');

    await user.click(await screen.findByRole('button', { name: 'Reserve' }, { timeout: 5000 }));

    expect(await screen.findByText('Nothing was reserved: stock changed')).toBeInTheDocument();
    expect(screen.getByText('at most 2 mL of LW-00025 is free')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ until: '2026-12-10' });
  });

  it("when a member opens the technician's plan, then they are offered to record a run but not to reserve, change or cancel it", async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ id: 7, role: 'member' }) } },
      'GET /api/plans/2': { body: plan },
    });
    renderApp('/preparations/plans/2');

    const record = await screen.findByRole('link', { name: 'Record a run' }, { timeout: 5000 });
    expect(record).toHaveAttribute('href', '/preparations/runs/new?planId=2');
    expect(screen.getByTestId('plan-ownership')).toHaveTextContent(
      'Planned by Tess Technician. You can record a run from this plan',
    );
    expect(screen.queryByRole('button', { name: 'Reserve' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Cancel plan' })).not.toBeInTheDocument();
    expect(screen.getByText(/What is on hand serves benches 1–2 of 8/)).toBeInTheDocument();
  });

  it('when the author (a member) opens their own plan, then they may reserve and cancel it', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ id: 2, role: 'member' }) } },
      'GET /api/plans/2': { body: plan },
    });
    renderApp('/preparations/plans/2');

    expect(
      await screen.findByRole('button', { name: 'Reserve' }, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Cancel plan' })).toBeInTheDocument();
    expect(screen.queryByTestId('plan-ownership')).not.toBeInTheDocument();
  });
});
