import { expect, test, type Page } from '@playwright/test';
import { demo, signIn } from './support';

/** Today as the server counts it (UTC). */
function isoToday(): string {
  return new Date().toISOString().slice(0, 10);
}

/** A plan of our own for today, so the spec needs nothing another spec left behind. */
async function planForToday(page: Page): Promise<number> {
  const procedures = await page.request.get('/api/procedures?q=Dibenzalacetone&pageSize=5');
  expect(procedures.ok()).toBe(true);
  const procedure = ((await procedures.json()) as { items: { id: number; title: string }[] })
    .items[0]!;
  const created = await page.request.post('/api/plans', {
    data: { procedureId: procedure.id, scaleFactor: '1/4', benches: 8, plannedOn: isoToday() },
  });
  expect(created.status()).toBe(201);
  return ((await created.json()) as { id: number }).id;
}

test.describe('the start page', () => {
  test('when the technician signs in, then the day’s sections from the demo lab show and a plan opens from them', async ({
    page,
  }) => {
    await signIn(page, demo.manager);
    await expect(page).toHaveURL(/\/$/);
    await expect(page.getByRole('heading', { name: 'Today', level: 1 })).toBeVisible();
    const planId = await planForToday(page);
    await page.reload();
    // the app's code loads again after the reload: on a busy machine that takes a while
    await expect(page.getByRole('region').first()).toBeVisible({ timeout: 20_000 });

    // the demo lab has chemicals below their reorder point and expired containers
    const low = page.getByRole('region', { name: 'Below reorder point' });
    await expect(low.getByRole('link').first()).toBeVisible();
    await expect(low.getByText(/reorder point/).first()).toBeVisible();
    const expiry = page.getByRole('region', { name: 'Expired and expiring' });
    await expect(expiry.getByText('Expired').first()).toBeVisible();
    await expect(expiry.getByText(/GHS0\d/).first()).toBeVisible();
    await expect(page.getByRole('region', { name: 'Storage conflicts' })).toBeVisible();
    await expect(page.getByRole('region', { name: 'My runs still open' })).toBeVisible();
    await expect(page.getByRole('region', { name: 'E-mails not sent' })).toHaveCount(0);
    await expect(page.getByText(/SDS, local regulations and licensed practice/)).toBeVisible();

    // 8 benches of dibenzalacetone need more 1 M sodium hydroxide solution than the lab holds
    const sessions = page.getByRole('region', { name: 'Sessions today and this week' });
    const plan = sessions.getByRole('listitem').filter({
      has: page.locator(`a[href="/preparations/plans/${planId}"]`),
    });
    await expect(plan.getByText(/^Short of \d reagents?$/)).toBeVisible();
    await expect(plan.getByText(/short by [\d.,]+ mL/).first()).toBeVisible();
    await expect(plan.getByText(/^Today · 8 benches/)).toBeVisible();

    await plan.getByRole('link', { name: 'Dibenzalacetone by aldol condensation' }).click();
    await expect(page).toHaveURL(new RegExp(`/preparations/plans/${planId}$`));
    await expect(page.getByText(/factor 2\.2 of the base scale/)).toBeVisible();

    // back home through the header link, then the same page on a phone: one column, no sideways scroll
    await page.getByRole('link', { name: 'Lotwise, home' }).click();
    await expect(page.getByRole('heading', { name: 'Today', level: 1 })).toBeVisible();
    await page.setViewportSize({ width: 390, height: 844 });
    await expect(sessions).toBeVisible();
    const scrollWidth = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(scrollWidth).toBeLessThanOrEqual(390);
  });

  test('when the visitor signs in, then only what a viewer may see is on the start page', async ({
    page,
  }) => {
    await signIn(page, demo.viewer);
    await expect(page.getByRole('heading', { name: 'Today', level: 1 })).toBeVisible();
    await expect(page.getByRole('region', { name: 'Sessions today and this week' })).toBeVisible();
    await expect(page.getByRole('region', { name: 'Storage conflicts' })).toBeVisible();
    // the demo teaching lab holds about 94 % of its Class I limit
    const areas = page.getByRole('region', { name: 'Lab areas near a flammable-liquid limit' });
    await expect(areas.getByRole('link', { name: /Room 101 Teaching lab/ })).toBeVisible();
    await expect(page.getByRole('region')).toHaveCount(3);
    await expect(page.getByText('Below reorder point')).toHaveCount(0);
    await expect(page.getByText('My runs still open')).toHaveCount(0);
  });
});
