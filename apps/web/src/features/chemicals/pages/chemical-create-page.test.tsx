import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const manager = makeUser({ role: 'manager', displayName: 'Tess Technician' });

async function openForm() {
  const user = userEvent.setup();
  const view = renderApp('/chemicals/new');
  await screen.findByRole('heading', { name: 'Add a chemical' }, { timeout: 5000 });
  return { user, ...view };
}

async function fillRequired(user: ReturnType<typeof userEvent.setup>, name: string) {
  await user.type(screen.getByRole('textbox', { name: 'Name' }), name);
  await user.selectOptions(screen.getByRole('combobox', { name: 'Physical state' }), 'liquid');
}

describe('Add a chemical', () => {
  it('when a formula is typed, then the molar mass from packages/chem shows at once', async () => {
    mockFetch({ 'GET /api/auth/me': { body: { user: manager } } });
    const { user } = await openForm();

    await user.type(screen.getByRole('textbox', { name: /^Formula/ }), 'C6H12O6');

    expect(await screen.findByTestId('molar-mass')).toHaveTextContent('180.16 g/mol');
  });

  it('when the formula has an unknown element, then the chem error message shows instead', async () => {
    mockFetch({ 'GET /api/auth/me': { body: { user: manager } } });
    const { user } = await openForm();

    await user.type(screen.getByRole('textbox', { name: /^Formula/ }), 'C6H12Xx');

    expect(await screen.findByTestId('molar-mass-error')).toHaveTextContent('unknown element "Xx"');
    expect(screen.queryByTestId('molar-mass')).not.toBeInTheDocument();
  });

  it('when the server answers 400 with fields, then each message lands on its input and nothing typed is lost', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/chemicals': {
        status: 400,
        body: {
          error: {
            code: 'validation_failed',
            message: 'Some fields are not right.',
            fields: {
              reorderQuantity: 'must be at least the reorder point',
              'hazardStatements.1': 'is not used together with H224',
            },
          },
        },
      },
    });
    const { user } = await openForm();

    await fillRequired(user, 'Ethanol, absolute');
    await user.type(screen.getByRole('textbox', { name: /^Hazard statements/ }), 'H225, H319');
    await user.type(screen.getByRole('textbox', { name: /^Reorder point/ }), '500');
    await user.type(screen.getByRole('textbox', { name: /^Reorder quantity/ }), '250');
    await user.click(screen.getByRole('button', { name: 'Add chemical' }));

    const quantity = screen.getByRole('textbox', { name: /^Reorder quantity/ });
    await waitFor(() => expect(quantity).toHaveAttribute('aria-invalid', 'true'));
    expect(quantity).toHaveAccessibleDescription(
      /Reorder quantity must be at least the reorder point/,
    );
    expect(screen.getByRole('textbox', { name: /^Hazard statements/ })).toHaveAccessibleDescription(
      /is not used together with H224/,
    );
    expect(screen.getByRole('alert')).toHaveTextContent('Some fields are not right.');
    expect(screen.getByRole('textbox', { name: 'Name' })).toHaveValue('Ethanol, absolute');
    expect(quantity).toHaveValue('250');

    expect(requests.find((r) => r.method === 'POST')?.body).toMatchObject({
      name: 'Ethanol, absolute',
      hazardStatements: ['H225', 'H319'],
      reorderPoint: 500,
      reorderQuantity: 250,
      physicalState: 'liquid',
      stockUnit: 'g',
    });
  });

  it('when the CAS RN is already used (409), then the message shows on the CAS RN field', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/chemicals': {
        status: 409,
        body: {
          error: { code: 'conflict', message: 'CAS RN 64-17-5 is already used by Ethanol.' },
        },
      },
    });
    const { user } = await openForm();

    await fillRequired(user, 'Ethyl alcohol');
    await user.type(screen.getByRole('textbox', { name: /^CAS RN/ }), '64-17-5');
    await user.click(screen.getByRole('button', { name: 'Add chemical' }));

    const cas = screen.getByRole('textbox', { name: /^CAS RN/ });
    await waitFor(() => expect(cas).toHaveAccessibleDescription(/already used by Ethanol/));
    expect(cas).toHaveValue('64-17-5');
  });

  it('when the CAS RN check digit is wrong, then leaving the field says so', async () => {
    mockFetch({ 'GET /api/auth/me': { body: { user: manager } } });
    const { user } = await openForm();

    await user.type(screen.getByRole('textbox', { name: /^CAS RN/ }), '64-17-6');
    await user.tab();

    await waitFor(() =>
      expect(screen.getByRole('textbox', { name: /^CAS RN/ })).toHaveAccessibleDescription(
        /Check digit should be 5/,
      ),
    );
  });

  it('when required fields are left empty, then the shared schema’s messages show inline and nothing is sent', async () => {
    const { requests } = mockFetch({ 'GET /api/auth/me': { body: { user: manager } } });
    const { user } = await openForm();

    await user.click(screen.getByRole('button', { name: 'Add chemical' }));

    expect(await screen.findByText('Name is required')).toBeInTheDocument();
    expect(screen.getByRole('combobox', { name: 'Physical state' })).toHaveAccessibleDescription(
      /Physical state must be one of: solid, liquid, gas, solution/,
    );
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('when saved, then the new chemical opens with its hazards and the caution', async () => {
    const created = makeChemical({
      name: 'Acetone',
      formula: 'C3H6O',
      molarMass: 58.08,
      ghsPictograms: ['GHS02', 'GHS07'],
      hazardStatements: ['H225', 'H319', 'H336'],
      storageGroup: 'flammable',
    });
    mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/chemicals': { status: 201, body: created },
      [`GET /api/chemicals/${created.id}`]: { body: created },
    });
    const { user, router } = await openForm();

    await fillRequired(user, 'Acetone');
    await user.click(screen.getByRole('button', { name: 'Add chemical' }));

    expect(await screen.findByRole('heading', { level: 1, name: /Acetone/ })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe(`/chemicals/${created.id}`);
    expect(screen.getByText('May cause drowsiness or dizziness')).toBeInTheDocument();
    expect(screen.getByText(/not a safety approval/)).toBeInTheDocument();
  });
});
