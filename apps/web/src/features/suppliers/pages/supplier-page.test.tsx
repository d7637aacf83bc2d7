import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { CatalogItem, Chemical, Supplier } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const manager = makeUser({ role: 'manager' });
const member = makeUser({ role: 'member' });

const supplier: Supplier = {
  id: 3,
  name: 'Northfield Lab Supply',
  contactName: 'Orders desk',
  email: 'orders@northfield.example.test',
  phone: '',
  website: '',
  orderingNotes: 'Quote account NF-0042.',
  minimumOrderMinor: 5000,
  shippingFeeMinor: 995,
  hazardousFeeMinor: 1800,
  currency: 'EUR',
  archived: false,
  catalogItemCount: 1,
  orderCount: 0,
  createdAt: '2026-11-30T10:00:00.000Z',
  updatedAt: '2026-11-30T10:00:00.000Z',
};

const acid = {
  id: 7,
  name: 'Sulfuric acid 98 %',
  casNumber: '7664-93-9',
  ghsPictograms: ['GHS05' as const],
  hazardStatements: ['H290', 'H314'],
};

const item: CatalogItem = {
  id: 11,
  supplierId: 3,
  supplierName: supplier.name,
  sku: 'HC-20-050',
  chemicalId: acid.id,
  chemical: acid,
  packSize: 1,
  packUnit: 'L',
  grade: 'Reagent',
  purityPercent: 98,
  priceMinor: 2450,
  currency: 'EUR',
  hazardous: true,
  splittable: false,
  discontinued: false,
  orderLineCount: 0,
  createdAt: '2026-11-30T10:00:00.000Z',
  updatedAt: '2026-11-30T10:00:00.000Z',
};

const chemical = {
  ...acid,
  synonyms: [],
  formula: 'H2SO4',
  molarMass: 98.07,
  physicalState: 'solution',
  density: 1.84,
  bulkDensity: null,
  defaultPurityPercent: 98,
  storageGroup: 'inorganic-acid',
  peroxideClass: null,
  extraHazardGroups: [],
  stockUnit: 'mL',
  reorderPoint: null,
  reorderQuantity: null,
  restricted: false,
  notes: '',
  sds: null,
  createdAt: '2026-11-30T10:00:00.000Z',
  updatedAt: '2026-11-30T10:00:00.000Z',
} satisfies Chemical;

const page = (items: CatalogItem[]) => ({ items, total: items.length, page: 1, pageSize: 25 });

describe('Supplier page', () => {
  it('when a member opens a supplier, then fees and each pack show in money with the chemical’s hazards, and nothing can be changed', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/suppliers/3': { body: supplier },
      'GET /api/catalog-items': { body: page([item]) },
    });
    renderApp('/purchasing/suppliers/3');

    expect(
      await screen.findByRole('heading', { name: 'Northfield Lab Supply' }, { timeout: 5000 }),
    ).toBeVisible();
    expect(screen.getByText('€9.95')).toBeInTheDocument();
    expect(screen.getByText('€18.00')).toBeInTheDocument();
    expect(screen.getByText('€50.00')).toBeInTheDocument();
    const table = await screen.findByRole('table', { name: 'Catalogue' });
    const row = within(table).getAllByRole('row')[1]!;
    expect(within(row).getByText('HC-20-050')).toBeInTheDocument();
    expect(within(row).getByText('€24.50')).toBeInTheDocument();
    expect(within(row).getByText('CAS RN 7664-93-9')).toBeInTheDocument();
    expect(within(row).getByText(/GHS05/)).toBeInTheDocument();
    expect(within(row).getByText('Hazardous goods')).toBeInTheDocument();
    expect(screen.getByText(/SDS/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Add an item' })).toBeNull();
    expect(screen.queryByRole('link', { name: /Import price list/ })).toBeNull();
  });

  it('when a manager adds an item with a price of a fraction of a cent, then the field says so; 12.50 is sent as 1250 cents', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/suppliers/3': { body: supplier },
      'GET /api/catalog-items': { body: page([]) },
      'GET /api/chemicals': { body: { items: [chemical], total: 1, page: 1, pageSize: 12 } },
      'POST /api/catalog-items': { status: 201, body: item },
    });
    const user = userEvent.setup();
    renderApp('/purchasing/suppliers/3');

    expect(
      await screen.findByText('No catalogue items yet', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Import price list/ })).toHaveAttribute(
      'href',
      '/stock/import?kind=price-list&supplierId=3',
    );
    await user.click(screen.getByRole('button', { name: 'Add an item' }));
    const dialog = await screen.findByRole('dialog', { name: 'Add a catalogue item' });
    await user.type(within(dialog).getByLabelText('Chemical'), 'sulf');
    await user.click(await within(dialog).findByRole('option', { name: /Sulfuric acid/ }));
    expect(within(dialog).getByText('CAS RN 7664-93-9')).toBeInTheDocument();
    await user.type(within(dialog).getByLabelText(/SKU/), 'HC-20-050');
    await user.type(within(dialog).getByLabelText('Pack size'), '1');
    await user.selectOptions(within(dialog).getByLabelText('Unit'), 'L');
    await user.type(within(dialog).getByLabelText('Price per pack (EUR)'), '12.505');
    await user.click(within(dialog).getByRole('button', { name: 'Add item' }));

    expect(
      await within(dialog).findByText(/Price per pack must be an amount in EUR such as 12.50/),
    ).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    await user.clear(within(dialog).getByLabelText('Price per pack (EUR)'));
    await user.type(within(dialog).getByLabelText('Price per pack (EUR)'), '12.50');
    await user.click(within(dialog).getByLabelText(/Ships as hazardous goods/));
    await user.click(within(dialog).getByRole('button', { name: 'Add item' }));

    await waitFor(() => expect(requests.some((r) => r.method === 'POST')).toBe(true));
    const post = requests.find((r) => r.method === 'POST')!;
    expect(post.body).toMatchObject({
      supplierId: 3,
      chemicalId: 7,
      sku: 'HC-20-050',
      packSize: 1,
      packUnit: 'L',
      priceMinor: 1250,
      currency: 'EUR',
      hazardous: true,
      splittable: false,
    });
  }, 20_000);
});
