import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { makeAspirinProcedure, makeRun } from '../test-factories';

describe('Run page', () => {
  it('when the product weighed more than the theoretical yield, then the yield above 100 % is flagged as probably wet or impure', async () => {
    // worked example: 2.80 g wet product / 2.6087 g theoretical = 107.3 %
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/procedures/1': { body: makeAspirinProcedure() },
      'GET /api/runs/10': {
        body: makeRun({
          id: 10,
          status: 'recorded',
          performedOn: '2026-11-11',
          theoreticalYieldG: 2.6087,
          productMassG: 2.8,
          percentYield: 107.33,
          yieldFlag:
            'Yield above 100 %: the product is probably wet or impure: dry or recrystallize and weigh again.',
        }),
      },
    });
    renderApp('/preparations/runs/10');

    expect(
      await screen.findByText('Above 100 %: probably wet or impure', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByText(/dry or recrystallize and weigh again/)).toBeInTheDocument();
    expect(screen.getByTestId('percent-yield')).toHaveTextContent('107.33 %');
    expect(screen.getByTestId('percent-yield')).toHaveTextContent('above 100 %');
  });

  it('when a wet crude is above 100 % and the purified crop is not, then the crude yield carries its own flag and the purified one none', async () => {
    // worked example, calc from CIAAW 2021: theoretical 2.6087 g; crude 2.80 g = 107.3 %, purified 2.10 g = 80.50 %
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/procedures/1': { body: makeAspirinProcedure() },
      'GET /api/runs/11': {
        body: makeRun({
          id: 11,
          status: 'recorded',
          performedOn: '2026-11-12',
          theoreticalYieldG: 2.6087,
          crudeMassG: 2.8,
          crudePercentYield: 107.33,
          crudeYieldFlag:
            'Crude yield 107.3 % is above 100 %: the crude product is probably wet or impure: dry or recrystallize and weigh again.',
          productMassG: 2.1,
          percentYield: 80.5,
        }),
      },
    });
    renderApp('/preparations/runs/11');

    expect(
      await screen.findByText('Crude above 100 %: probably wet or impure', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByText(/^Crude yield 107.3 % is above 100 %/)).toBeInTheDocument();
    expect(screen.getByTestId('crude-yield')).toHaveTextContent('above 100 %');
    expect(screen.getByTestId('percent-yield')).toHaveTextContent('80.5 %');
    expect(screen.getByTestId('percent-yield')).not.toHaveTextContent('above 100 %');
    expect(screen.queryByText('Above 100 %: probably wet or impure')).not.toBeInTheDocument();
  });

  it('when the melting range agrees with the literature, then it is not shown in warning colour', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/procedures/1': { body: makeAspirinProcedure() },
      'GET /api/runs/12': {
        body: makeRun({
          id: 12,
          status: 'recorded',
          performedOn: '2026-11-12',
          observations: {
            meltingRangeC: { low: 135, high: 136 },
            literatureMeltingC: { low: 135, high: 136 },
            meltingComparison: {
              agrees: true,
              text: 'agrees with the literature range (135–136 °C)',
            },
            appearance: '',
            notes: '',
          },
        }),
      },
    });
    renderApp('/preparations/runs/12');

    const comparison = await screen.findByTestId('melting-comparison', {}, { timeout: 5000 });
    expect(comparison).toHaveTextContent('agrees with the literature range');
    expect(comparison).toHaveClass('text-ok-700');
    expect(comparison).not.toHaveClass('text-warn-700');
  });
});
