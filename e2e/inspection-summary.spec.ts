import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

/**
 * The inspection summary of the demo lab area, opened from the area's page as a newcomer
 * would: the four sections, the rule set and its citation beside the figures, the reminder,
 * and the page as it prints. Reads only; the demo data is left as it is.
 */
test('the inspection summary of a lab area shows each section with its sources and prints on one page', async ({
  page,
}, testInfo) => {
  await signIn(page, demo.viewer);
  const areas = await page.request.get('/api/lab-areas');
  expect(areas.ok()).toBe(true);
  const { items } = (await areas.json()) as { items: { id: number; name: string }[] };
  expect(items.length).toBeGreaterThan(0);
  const area = items[0]!;

  await page.goto(`/stock/lab-areas/${area.id}`);
  await page.getByRole('link', { name: 'Inspection summary' }).click();
  await expect(page).toHaveURL(new RegExp(`/stock/lab-areas/${area.id}/inspection$`));

  const summary = page.getByRole('article', { name: 'Inspection summary' });
  await expect(summary.getByRole('heading', { level: 1 })).toHaveText(area.name);
  for (const title of [
    'Flammable and combustible liquids',
    'Watched chemicals held',
    'Waste on hand',
    'Storage conflicts',
  ]) {
    await expect(summary.getByRole('heading', { level: 2, name: title })).toBeVisible();
  }
  const flammable = summary.getByRole('region', { name: 'Flammable and combustible liquids' });
  await expect(flammable).toContainText('Measured against: NFPA 45 (2024), Table 9.1.1');
  await expect(flammable.getByRole('cell', { name: 'IB', exact: true })).toBeVisible();
  await expect(summary).toContainText(/authority having jurisdiction/i);
  await expect(page.getByRole('button', { name: 'Print' })).toBeVisible();

  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await page.screenshot({
    path: testInfo.outputPath('inspection-summary-print.png'),
    fullPage: true,
  });
  const pdf = await page.pdf({ format: 'A4' });
  const pages = pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? [];
  expect(pages.length).toBe(1);
});
