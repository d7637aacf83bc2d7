import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { display, makeDispensingSheet, makePlanDetail, makeStockLine } from '../test-factories';

// Dibenzalacetone for 4 benches at 1/4 scale with 10 % overage: 5.0 mL of 1 M NaOH per bench
// -> 5 × 4 × 1.10 = 22 mL; 13.5 mL on hand -> 8.5 mL short; 5.5 mL a bench -> 2 benches served.
const shortLine = makeStockLine({
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
  required: 22,
  requiredDisplay: display(22, 'mL'),
  available: 13.5,
  shortfall: 8.5,
  status: 'short',
  take: [],
  suggestions: [
    {
      kind: 'prepare',
      procedureId: 3,
      procedureTitle: 'Sodium hydroxide solution 1 M',
      productLineIndex: 2,
      // 8.5 mL / 237.52 mL at factor 1 and 95 % = 0.0358
      factor: 0.035787,
      roundedFactor: 0.036,
      expectedYieldPercent: 95,
      expectedAmount: 8.55,
      unit: 'mL',
    },
  ],
  benchesCovered: 2,
  remedy: 'prepare',
});
const plan = makePlanDetail({
  benches: 4,
  stockCheck: {
    asOf: '2026-12-10',
    lines: [makeStockLine({ benchesCovered: 4 }), shortLine],
    ok: false,
    shortCount: 1,
    benchesServed: 2,
    rule: 'Counted: usable containers.',
  },
});

describe('Dispensing sheet', () => {
  it('when a plan is short on one line, then the session totals and every bench page say "short", by how much and what to do, and which benches cannot be served', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      'GET /api/plans/2/dispensing': { body: makeDispensingSheet(plan) },
    });
    renderApp('/preparations/plans/2/dispensing');

    const totals = await screen.findByRole('region', { name: 'Session totals' }, { timeout: 5000 });
    expect(within(totals).getByRole('note')).toHaveTextContent(
      'Short: 1 line. Benches 1–2 can be served from what is on hand; benches 3–4 cannot.',
    );
    const totalsShort = within(totals).getByTestId('sheet-short-2-line');
    // The amount is written by the one formatting rule (formatAmount).
    expect(totalsShort).toHaveTextContent(/Short by 8\.50? mL for the session/);
    expect(totalsShort).toHaveTextContent('on hand serves 2 of 4 benches');
    expect(totalsShort).toHaveTextContent(
      'Prepare it first: Sodium hydroxide solution 1 M at factor 0.036',
    );

    for (const bench of [1, 2, 3, 4]) {
      const page = screen.getByRole('region', { name: `Bench ${bench}` });
      expect(within(page).getByTestId('sheet-short-2-line')).toHaveTextContent(
        /Short by 8\.50? mL.*Prepare it first/,
      );
      const status = within(page).getByTestId(`bench-status-${bench}`);
      if (bench <= 2) {
        expect(status).toHaveTextContent(`Bench ${bench} can be served from what is on hand`);
      } else {
        expect(status).toHaveTextContent(
          `Bench ${bench} cannot be served from what is on hand: short of Sodium hydroxide solution 1 M`,
        );
      }
    }
  });

  it('when everything is in stock, then the sheet says so and no bench is marked short', async () => {
    const covered = makePlanDetail({ benches: 2 });
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      'GET /api/plans/2/dispensing': { body: makeDispensingSheet(covered) },
    });
    renderApp('/preparations/plans/2/dispensing');

    expect(
      await screen.findByText('In stock for all 2 benches.', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.queryByText(/cannot be served/)).not.toBeInTheDocument();
    expect(screen.queryByText('Short')).not.toBeInTheDocument();
  });
  it('when the procedure has steps, then every bench page lists them with that bench’s amount of the line added', async () => {
    const withSteps = makePlanDetail({
      benches: 3,
      stockCheck: { ...plan.stockCheck, lines: [makeStockLine(), shortLine] },
      steps: [
        {
          index: 0,
          text: 'Add the base to the stirred solution.',
          durationMinutes: 30,
          temperatureLowC: 20,
          temperatureHighC: 25,
          outsideWindow: 'cool in a water bath',
          lineIndex: 2,
          addition: 'dropwise over about 5 min',
          caution: null,
          holdPoint: 'a yellow solid has formed',
        },
      ],
    });
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      'GET /api/plans/2/dispensing': { body: makeDispensingSheet(withSteps) },
    });
    renderApp('/preparations/plans/2/dispensing');

    await screen.findByRole('region', { name: 'Bench 1' }, { timeout: 5000 });
    for (const bench of [1, 2, 3]) {
      const page = screen.getByRole('region', { name: `Bench ${bench}` });
      const steps = within(page).getByRole('region', { name: `Steps at bench ${bench}` });
      const step = within(steps).getByRole('listitem', { name: 'Step 1' });
      // The bench table's own per-bench text, 5.0 mL, repeated in the step.
      expect(step).toHaveTextContent(
        'Add: Sodium hydroxide solution 1 M — 5.0 mL, dropwise over about 5 min',
      );
      expect(step).toHaveTextContent('Keep the temperature: 20–25 °C');
      expect(step).toHaveTextContent('Time: 30 min');
      expect(step).toHaveTextContent('Hold point: do not go on until a yellow solid has formed');
    }
    const totals = screen.getByRole('region', { name: 'Session totals' });
    expect(within(totals).queryByText(/Hold point/)).toBeNull();
  });
});
