import { readFileSync } from 'node:fs';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { demo, signIn } from './support';

/** A CAS RN with a valid check digit that no demo chemical has (fictional substance). */
function casNumberFor(seed: number): string {
  const body = String(900000 + (seed % 90000));
  const digits = `${body.slice(0, -2)}${body.slice(-2)}`.split('').reverse();
  const sum = digits.reduce((total, digit, index) => total + (index + 1) * Number(digit), 0);
  return `${body.slice(0, -2)}-${body.slice(-2)}-${sum % 10}`;
}

async function created(api: APIRequestContext, path: string, data: object) {
  const response = await api.post(path, { data });
  expect(response.status(), `${path}: ${await response.text()}`).toBe(201);
  return (await response.json()) as { id: number; [key: string]: unknown };
}

test('the admin follows a watch list: its chemical shows the badge, an order of it needs approval with a reason, and the report exports', async ({
  page,
}) => {
  await signIn(page, demo.admin);
  const api = page.request;
  const stamp = Date.now();
  const casNumber = casNumberFor(stamp);
  const listName = `Example county oxidisers ${stamp % 100000} (fictional)`;
  // The spec's own list and chemical: the demo lab's lists stay as they are for other specs.
  await created(api, '/api/watch-lists', {
    jurisdiction: 'Example county (fictional)',
    name: listName,
    source: 'County order 7 (fictional)',
    chosen: false,
    entries: [
      {
        substance: 'Example oxidiser',
        casNumber,
        thresholdPercent: 20,
        comparison: 'above',
        action: 'Tell the county office of every sale.',
        source: 'Paragraph 2',
      },
    ],
  });
  const chemical = await created(api, '/api/chemicals', {
    name: `Example oxidiser solution 30 % ${stamp % 100000}`,
    casNumber,
    physicalState: 'solution',
    defaultPurityPercent: 30,
    density: 1.11,
    stockUnit: 'mL',
    ghsPictograms: ['GHS03', 'GHS05'],
    hazardStatements: ['H272', 'H314'],
    storageGroup: 'oxidizer',
  });

  // Follow the list on the admin page.
  await page
    .getByRole('navigation', { name: /main/i })
    .getByRole('link', { name: 'Watch lists' })
    .click();
  await expect(page.getByRole('heading', { level: 1, name: 'Watch lists' })).toBeVisible();
  const card = page.getByTestId('watch-list').filter({ hasText: listName });
  const follow = card.getByLabel('The lab follows this list');
  await follow.click();
  await expect(follow).toBeChecked();
  await expect(card.getByText('followed', { exact: true })).toBeVisible();

  // The chemical's hazards name the list, with the action required.
  await page.goto(`/chemicals/${chemical.id}`);
  const panel = page.getByTestId('watch-panel');
  await expect(panel.getByText(`Watched: ${listName}`)).toBeVisible();
  await expect(panel.getByText('Tell the county office of every sale.')).toBeVisible();

  // An order of it opens only after a manager's approval with a reason.
  const supplier = await created(api, '/api/suppliers', {
    name: `Example oxidiser supplier ${stamp % 100000} (fictional)`,
    email: 'orders@oxidisers.example.test',
  });
  const item = await created(api, '/api/catalog-items', {
    supplierId: supplier.id,
    chemicalId: chemical.id,
    sku: `EOX-${stamp % 100000}`,
    packSize: 500,
    packUnit: 'mL',
    priceMinor: 1850,
  });
  const deadline = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
  const order = await created(api, '/api/orders', {
    supplierId: supplier.id,
    title: `Oxidiser for the spring practicals ${stamp % 100000}`,
    claimDeadline: deadline,
    lines: [{ catalogItemId: item.id, packs: 1 }],
  });
  await page.goto(`/orders/${order.id}`);
  const approval = page.getByTestId('watch-approval');
  await expect(approval.getByText('Needs a manager’s approval')).toBeVisible();
  const [refused] = await Promise.all([
    page.waitForResponse((r) => r.url().endsWith(`/api/orders/${order.id}/open`)),
    page.getByRole('button', { name: 'Open for claims' }).click(),
  ]);
  expect(refused.status()).toBe(409);
  await expect(page.getByText(/cannot open before a manager approves it/)).toBeVisible();
  await approval.getByLabel('Reason for approving').fill('Spring practicals, quantities checked');
  await approval.getByRole('button', { name: 'Approve the order' }).click();
  await expect(approval.getByTestId('watch-approval-record')).toContainText(
    'Spring practicals, quantities checked',
  );
  await page.getByRole('button', { name: 'Open for claims' }).click();
  await expect(page.getByRole('button', { name: 'Open for claims' })).toBeHidden();

  // Received with a reason; the report lists it and exports.
  const lot = await created(api, '/api/lots', {
    chemicalId: chemical.id,
    supplierName: 'Example oxidiser supplier (fictional)',
    receivedOn: new Date().toISOString().slice(0, 10),
  });
  const locations = (await (await api.get('/api/locations')).json()) as {
    items: { id: number; storageGroups: string[] }[];
  };
  const shelf =
    locations.items.find((l) => l.storageGroups.includes('oxidizer')) ?? locations.items[0]!;
  const receipt = await created(api, '/api/containers', {
    lotId: lot.id,
    locationId: shelf.id,
    quantity: 500,
    unit: 'mL',
    note: 'Delivery for the spring practicals',
    confirm: true,
  });
  const labelCode = (receipt.container as { labelCode: string }).labelCode;

  await page
    .getByRole('navigation', { name: /main/i })
    .getByRole('link', { name: 'Watched chemicals' })
    .click();
  await expect(page.getByRole('heading', { level: 1, name: 'Watched chemicals' })).toBeVisible();
  await expect(page.getByRole('row').filter({ hasText: labelCode }).first()).toBeVisible();
  await expect(page.getByText('Delivery for the spring practicals').first()).toBeVisible();
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByTestId('watch-report-csv').click(),
  ]);
  expect(download.suggestedFilename()).toMatch(/^lotwise-watched-chemicals-.*\.csv$/);
  const csv = readFileSync((await download.path())!, 'utf8');
  expect(csv).toContain('Container,Chemical,CAS RN,Lists,Location,Quantity,Unit');
  expect(csv).toContain(labelCode);
  expect(csv).toContain('Delivery for the spring practicals');
});
