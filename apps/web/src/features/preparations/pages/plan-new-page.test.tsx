import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { makeAspirinProcedure, makePlanDetail } from '../test-factories';

const technician = makeUser({ role: 'manager' });
const procedure = makeAspirinProcedure({ id: 1 });
const plan = makePlanDetail({ id: 7 });
const preview = {
  totalFactor: plan.totalFactor,
  stockCheck: plan.stockCheck,
  hazards: plan.hazards,
  cautions: plan.cautions,
  safetyDeferral: plan.safetyDeferral,
};

function routes() {
  return mockFetch({
    'GET /api/auth/me': { body: { user: technician } },
    'GET /api/procedures': { body: page([procedure]) },
    'GET /api/procedures/1': { body: procedure },
    'POST /api/plans/preview': { body: preview },
    'POST /api/plans': { status: 201, body: plan },
    'GET /api/plans/7': { body: plan },
  });
}

describe('Plan a session', () => {
  it('when the stock is checked, then the check is shown without saving, and "Save this plan" saves it', async () => {
    const { requests } = routes();
    const user = userEvent.setup();
    renderApp('/preparations/plans/new?procedureId=1');

    const form = await screen.findByRole('form', { name: 'Plan a session' }, { timeout: 5000 });
    await user.clear(within(form).getByRole('textbox', { name: 'Benches or groups' }));
    await user.type(within(form).getByRole('textbox', { name: 'Benches or groups' }), '4');
    await user.click(within(form).getByRole('button', { name: 'Check stock for this session' }));

    expect(
      await screen.findByRole('heading', { name: 'Stock check (not saved yet)' }),
    ).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Stock check' })).toBeInTheDocument();
    expect(requests.filter((r) => r.url.pathname === '/api/plans')).toHaveLength(0);
    expect(requests.find((r) => r.url.pathname === '/api/plans/preview')?.body).toMatchObject({
      procedureId: 1,
      benches: 4,
    });

    await user.click(screen.getByRole('button', { name: 'Save this plan' }));
    expect(
      await screen.findByRole('heading', { level: 1, name: plan.procedure.title }),
    ).toBeInTheDocument();
    const saves = requests.filter((r) => r.method === 'POST' && r.url.pathname === '/api/plans');
    expect(saves).toHaveLength(1);
  });

  it('when a value changes after the check, then the stale check goes and nothing can be saved until checked again', async () => {
    routes();
    const user = userEvent.setup();
    renderApp('/preparations/plans/new?procedureId=1');

    const form = await screen.findByRole('form', { name: 'Plan a session' }, { timeout: 5000 });
    await user.click(within(form).getByRole('button', { name: 'Check stock for this session' }));
    await screen.findByRole('button', { name: 'Save this plan' });
    await user.type(within(form).getByRole('textbox', { name: 'Benches or groups' }), '2');
    expect(screen.queryByRole('button', { name: 'Save this plan' })).not.toBeInTheDocument();
  });

  it('when 0 benches are asked for, then the message names the lower bound', async () => {
    routes();
    const user = userEvent.setup();
    renderApp('/preparations/plans/new?procedureId=1');

    const form = await screen.findByRole('form', { name: 'Plan a session' }, { timeout: 5000 });
    const benches = within(form).getByRole('textbox', { name: 'Benches or groups' });
    await user.clear(benches);
    await user.type(benches, '0');
    await user.click(within(form).getByRole('button', { name: 'Check stock for this session' }));
    expect(benches).toHaveAccessibleDescription(/Benches: must be at least 1/);
  });

  it('when a procedure is chosen, then the form comes first with a hazard summary, the full hazards below it', async () => {
    routes();
    renderApp('/preparations/plans/new?procedureId=1');

    const form = await screen.findByRole('form', { name: 'Plan a session' }, { timeout: 5000 });
    const summary = await within(form).findByTestId('hazard-summary');
    expect(summary).toHaveTextContent(/hazardous chemicals?, \d+ H-statements?/);
    const safety = await screen.findByRole('region', { name: /Hazards and cautions/ });
    // The form precedes the full hazards in the page.
    expect(form.compareDocumentPosition(safety) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });
});
