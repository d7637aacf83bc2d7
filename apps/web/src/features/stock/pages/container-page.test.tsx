import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeContainer, makeLedgerEntry, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const member = makeUser({ role: 'member', displayName: 'Mo Member' });

const acetone = makeContainer({
  id: 42,
  labelCode: 'LW-00042',
  quantity: 250,
  unit: 'g',
  tareMass: 150,
  chemical: {
    id: 3,
    name: 'Acetone',
    formula: 'C3H6O',
    casNumber: '67-64-1',
    density: 0.791,
    storageGroup: 'flammable',
    extraHazardGroups: [],
    ghsPictograms: ['GHS02', 'GHS07'],
    hazardStatements: ['H225', 'H319', 'H336'],
    peroxideClass: null,
    stockUnit: 'g',
  },
});

const received = makeLedgerEntry({ containerId: 42, quantity: 250, balanceAfter: 250 });

function stockRoutes() {
  let balance = 250;
  const entries = [received];
  const routes = mockFetch({
    'GET /api/auth/me': { body: { user: member } },
    'GET /api/containers/42': () => ({ body: { ...acetone, quantity: balance } }),
    'GET /api/containers/42/ledger': () => ({ body: page(entries, entries.length, 1, 10) }),
    'GET /api/locations': { body: page([]) },
    'POST /api/containers/42/draws': (request) => {
      const body = request.body as { grossMass: number };
      const drawn = balance - (body.grossMass - 150);
      balance -= drawn;
      const entry = makeLedgerEntry({
        containerId: 42,
        reason: 'drawn',
        quantity: -drawn,
        balanceAfter: balance,
        note: `Weighed ${body.grossMass} g gross`,
        user: { id: member.id, displayName: member.displayName },
        createdAt: '2026-11-30T10:00:00.000Z',
      });
      entries.unshift(entry);
      return {
        status: 201,
        body: {
          container: { ...acetone, quantity: balance },
          entries: [entry],
          warnings: [],
        },
      };
    },
  });
  return routes;
}

async function openContainer() {
  const user = userEvent.setup();
  const view = renderApp('/stock/containers/42');
  await screen.findByRole('heading', { level: 1, name: 'Acetone' }, { timeout: 5000 });
  return { user, ...view };
}

describe('Container page', () => {
  it('when the chemical has an SDS, then the hazards link it directly; when not, they say so', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/containers/42': {
        body: {
          ...acetone,
          sds: {
            fileName: 'Acetone SDS.pdf',
            size: 1200,
            contentType: 'application/pdf',
            uploadedAt: '2026-09-01T09:00:00.000Z',
          },
        },
      },
      'GET /api/containers/42/ledger': { body: page([received]) },
      'GET /api/containers/7': { body: makeContainer({ id: 7 }) },
      'GET /api/containers/7/ledger': { body: page([]) },
    });
    const { router } = renderApp('/stock/containers/42');
    const hazards = await screen.findByRole('region', { name: 'Hazards' }, { timeout: 5000 });
    expect(within(hazards).getByRole('link', { name: 'Open the SDS (PDF)' })).toHaveAttribute(
      'href',
      '/api/chemicals/3/sds',
    );
    expect(within(hazards).getByText(/Acetone SDS\.pdf/)).toBeInTheDocument();

    await router.navigate('/stock/containers/7');
    const other = await screen.findByTestId('sds-missing', {}, { timeout: 5000 });
    expect(other).toHaveTextContent(/No SDS is uploaded for this chemical/);
  });

  it('shows the hazards first: pictograms, H-statement texts and the SDS caution', async () => {
    stockRoutes();
    await openContainer();

    const hazards = screen.getByRole('region', { name: 'Hazards' });
    expect(within(hazards).getByText('Flame')).toBeInTheDocument();
    expect(within(hazards).getByText('Highly flammable liquid and vapour')).toBeInTheDocument();
    expect(within(hazards).getByText(/not a safety approval/)).toBeInTheDocument();
  });

  it('when a gross mass is typed, then net and drawn amounts are previewed and the draw sends { grossMass, unit }; balance and ledger follow', async () => {
    const { requests } = stockRoutes();
    const { user } = await openContainer();

    const form = screen.getByRole('form', { name: 'Record a draw' });
    expect(within(form).getByRole('radio', { name: /Weigh the container/ })).toBeChecked();
    expect(within(form).getByTestId('weighing-preview')).toHaveTextContent('150.00 g');

    await user.type(within(form).getByRole('textbox', { name: 'Gross mass now' }), '380');

    expect(within(form).getByTestId('preview-net')).toHaveTextContent('230.00 g');
    expect(within(form).getByTestId('preview-drawn')).toHaveTextContent('20.00 g');

    await user.click(within(form).getByRole('button', { name: 'Record draw' }));

    expect(await within(form).findByText(/Drawn 20.00 g from LW-00042/)).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ grossMass: 380, unit: 'g' });
    await waitFor(() => expect(screen.getByTestId('balance')).toHaveTextContent('230.00 g'));
    const ledger = screen.getByRole('table', { name: 'Ledger' });
    expect(await within(ledger).findByText('Drawn')).toBeInTheDocument();
    expect(within(ledger).getByText('−20.00 g')).toBeInTheDocument();
  });

  it('when the server refuses a draw with 409, then its message naming container, amount and unit shows at the form', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/containers/42': { body: acetone },
      'GET /api/containers/42/ledger': { body: page([received]) },
      'POST /api/containers/42/draws': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'LW-00042 holds only 250 g; 300 g cannot be drawn from it.',
            fields: { amount: 'at most 250 g is available in LW-00042' },
          },
        },
      },
    });
    const { user } = await openContainer();

    const form = screen.getByRole('form', { name: 'Record a draw' });
    await user.click(within(form).getByRole('radio', { name: 'Enter the amount' }));
    const amount = within(form).getByRole('textbox', { name: 'Amount taken' });
    await user.type(amount, '300');
    await user.click(within(form).getByRole('button', { name: 'Record draw' }));

    expect(await within(form).findByRole('alert')).toHaveTextContent(
      'LW-00042 holds only 250 g; 300 g cannot be drawn from it. Nothing was recorded.',
    );
    expect(amount).toHaveAttribute('aria-invalid', 'true');
    expect(amount).toHaveAccessibleDescription(/at most 250 g is available in LW-00042/i);
    expect(amount).toHaveValue('300');

    // A new amount is a new question: the answer about 300 g goes.
    await user.clear(amount);
    await user.type(amount, '20');
    expect(within(form).queryByRole('alert')).not.toBeInTheDocument();
    expect(amount).not.toHaveAttribute('aria-invalid', 'true');
    expect(amount).not.toHaveAccessibleDescription(/at most 250 g/i);
  });

  it('when the mode toggle and the amount field are read out, then their names differ', async () => {
    stockRoutes();
    const { user } = await openContainer();
    const form = screen.getByRole('form', { name: 'Record a draw' });
    await user.click(within(form).getByRole('radio', { name: 'Enter the amount' }));
    expect(within(form).getByRole('radio', { name: 'Weigh the container' })).toBeInTheDocument();
    expect(within(form).queryByRole('radio', { name: 'Amount taken' })).not.toBeInTheDocument();
    expect(within(form).getByRole('textbox', { name: 'Amount taken' })).toBeInTheDocument();
  });

  it('when a viewer opens a container, then there is no draw form and no write actions', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/containers/42': { body: acetone },
      'GET /api/containers/42/ledger': { body: page([received]) },
    });
    await openContainer();

    expect(screen.queryByRole('form', { name: 'Record a draw' })).not.toBeInTheDocument();
    expect(screen.getByText(/Your role can look at stock but not record use/)).toBeInTheDocument();
    for (const name of ['Adjust', 'Split', 'Move', 'Dispose']) {
      expect(screen.queryByRole('button', { name })).not.toBeInTheDocument();
    }
    expect(screen.getByRole('link', { name: /Stock/ })).toBeInTheDocument();
  });

  it('when a container is a member’s portion of a shared order, then it says whom it belongs to', async () => {
    stockRoutes();
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/containers/42': {
        body: { ...acetone, owner: { id: 9, displayName: 'Ines Okafor' } },
      },
      'GET /api/containers/42/ledger': { body: page([received], 1, 1, 10) },
      'GET /api/locations': { body: page([]) },
    });
    await openContainer();
    const term = screen.getByText('Belongs to');
    expect(term.nextElementSibling).toHaveTextContent('Ines Okafor');
  });

  it('when a container has no owner, then it is the lab’s', async () => {
    stockRoutes();
    await openContainer();
    expect(screen.getByText('Belongs to').nextElementSibling).toHaveTextContent('The lab');
  });

  it('when a liquid weighed by default is switched to the amount taken, then the unit is the container’s own, not the first of the list', async () => {
    const ethanol = makeContainer({
      ...acetone,
      id: 43,
      labelCode: 'LW-00043',
      unit: 'mL',
      quantity: 300,
      tareMass: 120,
      chemical: { ...acetone.chemical, name: 'Ethanol', stockUnit: 'mL' },
    });
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/containers/43': { body: ethanol },
      'GET /api/containers/43/ledger': { body: page([]) },
      'GET /api/locations': { body: page([]) },
    });
    const user = userEvent.setup();
    renderApp('/stock/containers/43');
    await screen.findByRole('heading', { level: 1, name: 'Ethanol' }, { timeout: 5000 });
    const form = screen.getByRole('form', { name: 'Record a draw' });
    expect(within(form).getByRole('combobox', { name: 'Unit' })).toHaveValue('g');

    await user.click(within(form).getByRole('radio', { name: /Enter the amount/ }));

    expect(within(form).getByRole('combobox', { name: 'Unit' })).toHaveValue('mL');
  });

  it('when “Record a draw” at the top is pressed, then the cursor is in the draw form’s first field', async () => {
    stockRoutes();
    const { user } = await openContainer();

    await user.click(screen.getByRole('button', { name: 'Record a draw' }));

    const form = screen.getByRole('form', { name: 'Record a draw' });
    expect(within(form).getByRole('textbox', { name: 'Gross mass now' })).toHaveFocus();
  });
});
