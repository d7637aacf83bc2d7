import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

const header =
  'Chemical,CAS RN,Formula,Physical state,Storage group,Supplier,Supplier lot no.,Grade,Purity %,Received on,Expires on,Label code,Quantity,Unit,Tare (g),Status,Location';
const goodRow =
  'Magnesium sulfate heptahydrate,10034-99-8,MgSO4·7H2O,solid,low-hazard,Harbourline Scientific (fictional),HS-3301,laboratory,99,2026-10-01,2030-10-01,,500,g,180.5,sealed,Room 104 Evening store › Shelf 1';
// 10034-99-7 fails the CAS check digit (the right one is 8) — CAS check digit rule
const badRow = goodRow.replace('10034-99-8', '10034-99-7').replace('HS-3301', 'HS-3302');

function csv(...rows: string[]) {
  return {
    name: 'evening-store.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from([header, ...rows].join('\n')),
  };
}

test('when a CSV has one bad row, then the preview names it, nothing is written, and the fixed file imports', async ({
  page,
}) => {
  await signIn(page, demo.manager);
  await page.goto('/stock/import');
  await expect(page.getByRole('heading', { name: 'Import stock from CSV' })).toBeVisible();
  await page.locator('input[type="file"]').setInputFiles(csv(goodRow, badRow));

  const problems = page.getByRole('table', { name: 'Problems in the file' });
  await expect(problems).toBeVisible();
  await expect(problems).toContainText('CAS RN');
  await expect(problems).toContainText('3'); // spreadsheet row 3: header is row 1
  await expect(page.getByRole('button', { name: /^Import 2 rows$/ })).toBeDisabled();
  const before = await page.request.get('/api/containers?q=magnesium sulfate');
  expect(((await before.json()) as { total: number }).total).toBe(0);

  await page
    .locator('input[type="file"]')
    .setInputFiles(csv(goodRow, badRow.replace('10034-99-7', '10034-99-8')));
  const importButton = page.getByRole('button', { name: /^Import 2 rows$/ });
  await expect(importButton).toBeEnabled();
  await importButton.click();
  await expect(page.getByText('evening-store.csv is imported')).toBeVisible();

  const after = await page.request.get('/api/containers?q=magnesium sulfate');
  const { total, items } = (await after.json()) as {
    total: number;
    items: { labelCode: string }[];
  };
  expect(total).toBe(2);

  // print the new labels: one QR code per container, carrying its label code
  await page.goto(`/stock/labels?labelCodes=${items.map((c) => c.labelCode).join(',')}`);
  await page.emulateMedia({ media: 'print' });
  const labels = page.getByTestId('container-label');
  await expect(labels).toHaveCount(2);
  for (const { labelCode } of items) {
    const label = page.getByRole('article', { name: `Label ${labelCode}` });
    await expect(label.getByRole('img', { name: `QR code for ${labelCode}` })).toBeVisible();
    await expect(label.locator('svg[data-qr-value] path')).toHaveCount(1);
  }
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
});

test('when a draw takes a chemical below its reorder point, then an e-mail lands in the dev inbox', async ({
  page,
  playwright,
  baseURL,
}) => {
  const inbox = `http://127.0.0.1:${Number(process.env.E2E_PORT ?? 3199) + 2}`;
  // the technician sets a reorder point just under what is on hand, as a lab would
  const technician = await playwright.request.newContext({ baseURL });
  await technician.post('/api/auth/login', {
    data: { email: demo.manager, password: demo.password },
  });
  const stock = (await (await technician.get('/api/stock?pageSize=200')).json()) as {
    items: {
      chemical: { id: number; name: string };
      total: number;
      unit: string;
      reorderStatus: string;
    }[];
  };
  let pick: { chemical: { id: number; name: string }; containerId: number } | null = null;
  for (const line of stock.items) {
    if (line.reorderStatus !== 'ok' || line.unit !== 'g' || line.total < 10) continue;
    const answer = await technician.get(
      `/api/containers?chemicalId=${line.chemical.id}&status=open&pageSize=50`,
    );
    const open = ((await answer.json()) as { items: { id: number; quantity: number }[] }).items;
    const container = open.find((c) => c.quantity >= 5);
    if (!container) continue;
    const patched = await technician.patch(`/api/chemicals/${line.chemical.id}`, {
      data: { reorderPoint: Math.floor(line.total) - 1 },
    });
    expect(patched.ok()).toBe(true);
    pick = { chemical: line.chemical, containerId: container.id };
    break;
  }
  await technician.dispose();
  expect(pick, 'a demo chemical above its reorder point with an open container').not.toBeNull();
  const { chemical, containerId } = pick!;

  // a club member takes 3 g: the total crosses the reorder point
  await signIn(page, demo.member);
  await page.goto(`/stock/containers/${containerId}`);
  const form = page.getByRole('form', { name: 'Record a draw' });
  await form.locator('label', { hasText: 'Enter the amount' }).click();
  await form.locator('input[name="value"]').fill('3');
  await form.getByRole('button', { name: 'Record draw' }).click();
  await expect(page.getByText('Draw recorded')).toBeVisible();

  await expect
    .poll(
      async () => {
        const mails = (await (await page.request.get(`${inbox}/api/email`)).json()) as {
          subject: string;
          to: { address: string }[];
        }[];
        return mails.some(
          (m) => m.subject.includes(chemical.name) && m.to.some((t) => t.address === demo.member),
        );
      },
      { timeout: 20_000, message: `a low-stock e-mail about ${chemical.name} to ${demo.member}` },
    )
    .toBe(true);
});
