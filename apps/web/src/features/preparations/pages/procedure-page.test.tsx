import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { makeAspirinProcedure } from '../test-factories';

function open(role: 'manager' | 'viewer', procedure = makeAspirinProcedure()) {
  mockFetch({
    'GET /api/auth/me': { body: { user: makeUser({ role }) } },
    'GET /api/procedures/1': { body: procedure },
  });
  renderApp('/preparations/procedures/1');
}

describe('Procedure page: steps', () => {
  it('when a procedure has a step adding a line, then the step names the chemical with its amount at base scale', async () => {
    open(
      'viewer',
      makeAspirinProcedure({
        steps: [
          {
            index: 0,
            text: 'Add the anhydride.',
            durationMinutes: 90,
            temperatureLowC: null,
            temperatureHighC: null,
            outsideWindow: '',
            lineIndex: 1,
            addition: 'in one portion',
            caution: 'fumeHood',
            holdPoint: '',
          },
        ],
      }),
    );
    const steps = await screen.findByRole('region', { name: 'Steps' }, { timeout: 5000 });
    const step = within(steps).getByRole('listitem', { name: 'Step 1' });
    // The amount as the lines table above writes it.
    expect(step).toHaveTextContent('Add: Acetic anhydride — 5.00 mL, in one portion');
    expect(step).toHaveTextContent('Time: 1 h 30 min');
    expect(step).toHaveTextContent('Caution: Needs a fume hood');
  });

  it('when a procedure has no steps, then a manager is told how to add them', async () => {
    open('manager');
    expect(
      await screen.findByText(/No steps written yet/, {}, { timeout: 5000 }),
    ).toBeInTheDocument();
  });

  it('when a viewer opens a procedure without steps, then no steps section or hint is shown', async () => {
    open('viewer');
    await screen.findByRole('heading', { level: 1 }, { timeout: 5000 });
    expect(screen.queryByText(/No steps written yet/)).toBeNull();
    expect(screen.queryByRole('region', { name: 'Steps' })).toBeNull();
  });
});
