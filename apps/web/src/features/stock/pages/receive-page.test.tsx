import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { ContainerCreate, LotCreate } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeContainer, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const manager = makeUser({ role: 'manager' });
const ethanol = makeChemical({
  id: 4,
  name: 'Ethanol',
  formula: 'C2H6O',
  casNumber: '64-17-5',
  physicalState: 'liquid',
  density: 0.789,
  stockUnit: 'mL',
  storageGroup: 'flammable',
  ghsPictograms: ['GHS02', 'GHS07'],
  hazardStatements: ['H225', 'H319'],
});
const cabinet = {
  id: 7,
  name: 'Flammables cabinet',
  kind: 'cabinet' as const,
  parentId: 1,
  path: 'Room 101 › Flammables cabinet',
  depth: 1,
  storageGroups: ['flammable' as const],
  notes: '',
  flammableStorage: null,
  containerCount: 3,
  childCount: 0,
  createdAt: '2026-08-01T08:00:00.000Z',
  updatedAt: '2026-08-01T08:00:00.000Z',
};
const lot = {
  id: 31,
  chemicalId: 4,
  chemicalName: 'Ethanol',
  source: 'purchased' as const,
  supplierName: 'Northgate Lab Supply',
  supplierLotNumber: 'NG-26-0412',
  grade: 'absolute',
  purityPercent: 99.8,
  receivedOn: '2026-11-30',
  expiresOn: '2029-11-30',
  madeByRunId: null,
  certificateFileName: null,
  certificate: null,
  notes: '',
  flammableStorage: null,
  containerCount: 0,
  createdAt: '2026-11-30T10:00:00.000Z',
  updatedAt: '2026-11-30T10:00:00.000Z',
};

describe('Receive stock', () => {
  it('when a delivery is entered, then the lot is saved first and then each container, and their label codes are shown', async () => {
    let labelNumber = 120;
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/chemicals': { body: page([ethanol]) },
      'GET /api/lots': { body: page([]) },
      'GET /api/locations': { body: page([cabinet]) },
      'POST /api/lots': { status: 201, body: lot },
      'POST /api/containers': (request) => {
        const body = request.body as ContainerCreate;
        labelNumber += 1;
        const container = makeContainer({
          id: labelNumber,
          labelCode: `LW-00${labelNumber}`,
          quantity: body.quantity,
          unit: 'mL',
          location: { id: 7, name: cabinet.name, path: cabinet.path },
        });
        return {
          status: 201,
          body: {
            container,
            entries: [],
            warnings:
              labelNumber === 122
                ? [
                    {
                      code: 'incompatible_groups',
                      message: 'LW-00122 sits with an oxidizer at Room 101 › Flammables cabinet.',
                      reason: 'Oxidizers feed a fire.',
                      source: 'Lotwise storage table',
                      groups: ['flammable', 'oxidizer'],
                      labelCodes: ['LW-00009'],
                    },
                  ]
                : [],
          },
        };
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/receive');

    await user.type(
      await screen.findByRole('combobox', { name: 'Chemical' }, { timeout: 5000 }),
      'ethan',
    );
    await user.click(await screen.findByRole('option', { name: /Ethanol/ }));
    expect(screen.getByText('Ethanol')).toBeInTheDocument();
    expect(screen.getByText('GHS02')).toBeInTheDocument();

    await user.type(
      screen.getByRole('textbox', { name: /^Supplier\s*\(optional\)$/ }),
      'Northgate Lab Supply',
    );
    await user.type(screen.getByLabelText(/Supplier lot number/), 'NG-26-0412');
    await user.type(screen.getByLabelText(/Purity/), '99.8');
    await user.type(screen.getByLabelText(/Expires on/), '2029-11-30');

    const first = screen.getByRole('listitem', { name: 'Container 1' });
    await user.type(within(first).getByLabelText('Quantity'), '1000');
    await user.type(within(first).getByLabelText(/Tare/), '412.5');
    await user.selectOptions(within(first).getByLabelText('Material'), 'glass');
    await user.selectOptions(await within(first).findByLabelText('Location'), '7');
    await user.click(within(first).getByRole('button', { name: 'Copy' }));
    const second = screen.getByRole('listitem', { name: 'Container 2' });
    await user.clear(within(second).getByLabelText('Quantity'));
    await user.type(within(second).getByLabelText('Quantity'), '500');

    await user.click(screen.getByRole('button', { name: 'Receive 2 containers' }));

    expect(await screen.findByText('2 containers of Ethanol received')).toBeInTheDocument();
    const writes = requests.filter((r) => r.method === 'POST');
    expect(writes.map((r) => r.url.pathname)).toEqual([
      '/api/lots',
      '/api/containers',
      '/api/containers',
    ]);
    expect(writes[0]!.body).toMatchObject({
      chemicalId: 4,
      supplierName: 'Northgate Lab Supply',
      supplierLotNumber: 'NG-26-0412',
      purityPercent: 99.8,
      expiresOn: '2029-11-30',
    } satisfies Partial<LotCreate>);
    expect(writes[1]!.body).toMatchObject({
      lotId: 31,
      locationId: 7,
      quantity: 1000,
      unit: 'mL',
      tareMass: 412.5,
      material: 'glass',
      status: 'sealed',
    });
    expect(writes[2]!.body).toMatchObject({ lotId: 31, quantity: 500 });

    expect(screen.getByRole('link', { name: 'LW-00121' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'LW-00122' })).toBeInTheDocument();
    expect(screen.getByText(/sits with an oxidizer/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Print labels' })).toHaveAttribute(
      'href',
      '/stock/labels?ids=121%2C122',
    );
  });

  it('when a container has no quantity or place, then nothing is sent and the fields say why', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/chemicals': { body: page([ethanol]) },
      'GET /api/lots': { body: page([]) },
      'GET /api/locations': { body: page([cabinet]) },
    });
    const user = userEvent.setup();
    renderApp('/stock/receive');
    await user.type(
      await screen.findByRole('combobox', { name: 'Chemical' }, { timeout: 5000 }),
      'eth',
    );
    await user.click(await screen.findByRole('option', { name: /Ethanol/ }));
    await user.click(screen.getByRole('button', { name: 'Receive 1 container' }));

    const first = screen.getByRole('listitem', { name: 'Container 1' });
    expect(await within(first).findByText(/Location is required/)).toBeInTheDocument();
    expect(within(first).getByText(/Quantity must be a number/)).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('when the person goes back at a storage warning for the first container of a new lot, then the new lot is removed again and the form keeps what was typed', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/chemicals': { body: page([ethanol]) },
      'GET /api/lots': { body: page([]) },
      'GET /api/locations': { body: page([cabinet]) },
      'POST /api/lots': { status: 201, body: lot },
      'DELETE /api/lots/31': { status: 204 },
      'POST /api/containers': {
        status: 409,
        body: {
          error: {
            code: 'confirmation_required',
            message: 'Confirm first.',
            warnings: [
              {
                kind: 'storage_conflict',
                message:
                  'Ethanol (flammable) and potassium permanganate (oxidizer) must be kept apart: oxidizers feed a fire.',
                code: 'incompatible_groups',
                reason: 'Oxidizers feed a fire.',
                source: 'Lotwise storage table',
                locationId: 7,
                locationPath: cabinet.path,
                groups: ['flammable', 'oxidizer'],
                labelCodes: ['LW-00009'],
              },
            ],
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/receive');
    await user.type(
      await screen.findByRole('combobox', { name: 'Chemical' }, { timeout: 5000 }),
      'eth',
    );
    await user.click(await screen.findByRole('option', { name: /Ethanol/ }));
    const first = screen.getByRole('listitem', { name: 'Container 1' });
    await user.type(within(first).getByLabelText('Quantity'), '1000');
    await user.selectOptions(await within(first).findByLabelText('Location'), '7');
    await user.click(screen.getByRole('button', { name: 'Receive 1 container' }));

    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText(/must be kept apart/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Go back' }));

    await expect
      .poll(() => requests.map((r) => `${r.method} ${r.url.pathname}`))
      .toContain('DELETE /api/lots/31');
    expect(within(first).getByLabelText('Quantity')).toHaveValue('1000');
    expect(screen.queryByText(/received/)).not.toBeInTheDocument();
  });
});
