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
});
