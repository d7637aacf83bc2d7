import { expect, test, type Locator, type Page } from '@playwright/test';
import { demo } from './support';

/**
 * The everyday jobs at the bench, on a phone and a tablet in both orientations, with a finger
 * (touch, a coarse pointer): the menu, a container at the shelf, a plan's stock check and its
 * dispensing sheet, and a run. Each job makes its own plan or draws from a container no other
 * spec counts on (ethyl acetate), so the specs stay independent.
 */
const sizes = [
  { name: 'phone portrait', width: 390, height: 844, phone: true, stacked: true },
  { name: 'phone landscape', width: 844, height: 390, phone: false, stacked: true },
  { name: 'tablet portrait', width: 820, height: 1180, phone: false, stacked: true },
  { name: 'tablet landscape', width: 1180, height: 820, phone: false, stacked: false },
] as const;

/** Apple's and WCAG 2.5.5's 44 CSS px: the least a gloved finger should be asked to hit. */
const touchTarget = 44;

async function signInAtTheBench(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).not.toHaveURL(/sign-in/, { timeout: 20_000 });
  await expect(page.getByRole('banner')).toBeVisible({ timeout: 20_000 });
}

async function expectNoSidewaysScroll(page: Page) {
  const { scrollWidth, clientWidth } = await page.evaluate(() => {
    const root = document.scrollingElement!;
    return { scrollWidth: root.scrollWidth, clientWidth: root.clientWidth };
  });
  expect(scrollWidth, 'the page scrolls sideways').toBeLessThanOrEqual(clientWidth);
}

async function expectTouchTarget(target: Locator, what: string) {
  const box = await target.boundingBox();
  expect(box, `${what} is on screen`).not.toBeNull();
  expect(box!.height, `${what} height`).toBeGreaterThanOrEqual(touchTarget);
  expect(box!.width, `${what} width`).toBeGreaterThanOrEqual(touchTarget);
}

/** Inside the first screen, without scrolling. */
async function expectInFirstScreen(page: Page, target: Locator, what: string) {
  const box = await target.boundingBox();
  expect(box, `${what} is on screen`).not.toBeNull();
  const height = page.viewportSize()!.height;
  expect(box!.y + box!.height, `${what} lies inside the first screen`).toBeLessThanOrEqual(height);
}

async function shoot(page: Page, size: (typeof sizes)[number], job: string) {
  await page.screenshot({
    path: `e2e/.artifacts/bench-sizes/${job}-${size.width}x${size.height}.png`,
  });
}

/** A plan of our own, far from today so no list of this week's work picks it up. */
async function createPlan(page: Page, body: Record<string, unknown>): Promise<number> {
  const response = await page.request.post('/api/plans', {
    data: { plannedOn: '2027-09-14', notes: 'Bench-size check', ...body },
  });
  expect(response.ok(), await response.text()).toBe(true);
  return ((await response.json()) as { id: number }).id;
}

async function procedureId(page: Page, title: string): Promise<number> {
  const response = await page.request.get(
    `/api/procedures?q=${encodeURIComponent(title)}&pageSize=5`,
  );
  const { items } = (await response.json()) as { items: { id: number; title: string }[] };
  const found = items.find((item) => item.title === title);
  expect(found, `the demo procedure ${title}`).toBeTruthy();
  return found!.id;
}

for (const size of sizes) {
  test.describe(`at the bench on a ${size.name} (${size.width}×${size.height})`, () => {
    test.use({ viewport: { width: size.width, height: size.height }, hasTouch: true });
    test.beforeEach(() => test.setTimeout(120_000));

    test('when the menu is used, then it opens, leads to Runs and marks it alone as current', async ({
      page,
    }) => {
      await signInAtTheBench(page, demo.viewer);
      await page.goto('/stock');
      const nav = page.getByRole('navigation', { name: 'Main' });
      const menuButton = page.getByRole('button', { name: 'Menu' });
      if (size.width < 768) {
        await expect(nav).toBeHidden();
        await expectTouchTarget(menuButton, 'the menu button');
        await expect(menuButton).toHaveAttribute('aria-expanded', 'false');
        await menuButton.click();
        await expect(menuButton).toHaveAttribute('aria-expanded', 'true');
        await expect(nav.getByRole('link', { name: 'Today' })).toBeFocused();
        await shoot(page, size, 'menu-open');
        await page.keyboard.press('Escape');
        await expect(nav).toBeHidden();
        await expect(menuButton).toBeFocused();
        await menuButton.click();
      } else {
        await expect(menuButton).toBeHidden();
        await expect(nav).toBeVisible();
      }
      const runs = nav.getByRole('link', { name: 'Runs' });
      await expectTouchTarget(runs, 'the Runs entry');
      await runs.click();
      await expect(page).toHaveURL(/\/preparations\/runs$/);
      await expect(page.getByRole('heading', { name: 'Runs', level: 1 })).toBeVisible({
        timeout: 20_000,
      });
      if (size.width < 768) await expect(nav).toBeHidden();
      // counted in the markup: on a phone the closed menu holds the same entries, hidden
      const current = page.locator('nav[aria-label="Main"] [aria-current="page"]');
      await expect(current).toHaveCount(1);
      await expect(current).toHaveText('Runs');
      await expectNoSidewaysScroll(page);
      await shoot(page, size, 'runs');
    });

    test('when a member draws at the shelf, then the container page fits and the draw form is one tap away', async ({
      page,
    }) => {
      await signInAtTheBench(page, demo.member);
      const list = await page.request.get(
        '/api/containers?q=ethyl acetate&status=open&pageSize=20',
      );
      const { items } = (await list.json()) as {
        items: { id: number; quantity: number; chemical: { name: string } }[];
      };
      const container = items.find((c) => c.chemical.name === 'Ethyl acetate' && c.quantity > 20);
      expect(container, 'an open ethyl acetate container').toBeTruthy();

      await page.goto(`/stock/containers/${container!.id}`);
      await expect(page.getByRole('heading', { name: 'Ethyl acetate', level: 1 })).toBeVisible({
        timeout: 20_000,
      });
      await expect(page.getByRole('region', { name: 'Hazards' })).toContainText('H225');
      await expectNoSidewaysScroll(page);
      const jump = page.getByRole('button', { name: 'Record a draw' });
      await expectInFirstScreen(page, jump, '"Record a draw"');
      await expectTouchTarget(jump, '"Record a draw"');
      await shoot(page, size, 'container');

      await jump.click();
      const form = page.getByRole('form', { name: 'Record a draw' });
      await form.locator('label', { hasText: 'Enter the amount' }).click();
      await expect(form.getByRole('combobox', { name: 'Unit' })).toHaveValue('mL');
      const amount = form.getByRole('textbox', { name: /amount taken/i });
      await expectTouchTarget(amount, 'the amount field');
      await amount.fill('1.5');
      const submit = form.getByRole('button', { name: 'Record draw' });
      await expectTouchTarget(submit, '"Record draw"');
      await submit.click();
      await expect(page.getByText('Draw recorded')).toBeVisible({ timeout: 20_000 });
      await expect(page.getByRole('table', { name: /ledger/i })).toContainText('1.50 mL');
      await expectNoSidewaysScroll(page);
    });

    test("when a plan is short, then its stock check and dispensing sheet show each line's shortfall and where to take it from", async ({
      page,
    }) => {
      await signInAtTheBench(page, demo.manager);
      // 10 benches of isoamyl acetate at 20 times the base scale: more sulfuric and acetic
      // acid than the demo lab holds (a few benches, so the sheet stays short to print)
      const planId = await createPlan(page, {
        procedureId: await procedureId(page, 'Isoamyl acetate by Fischer esterification'),
        scaleFactor: 20,
        benches: 10,
      });

      await page.goto(`/preparations/plans/${planId}`);
      const check = page.getByRole('table', { name: 'Stock check' });
      await expect(check).toBeVisible({ timeout: 20_000 });
      const sulfuric = check.locator('tbody', { hasText: 'Sulfuric acid 98 %' });
      await expect(sulfuric).toContainText(/short by/);
      await expect(sulfuric).toContainText(/LW-\d{5}/);
      const row = sulfuric.locator('tr').first();
      await expect(row).toHaveCSS('display', size.stacked ? 'grid' : 'table-row');
      await row.scrollIntoViewIfNeeded();
      await expectNoSidewaysScroll(page);
      const take = row.getByRole('link', { name: /LW-\d{5}/ }).first();
      const takeBox = await take.boundingBox();
      expect(takeBox!.x + takeBox!.width).toBeLessThanOrEqual(size.width);
      await shoot(page, size, 'stock-check');

      const sheetLink = page.getByRole('link', { name: 'Dispensing sheet' });
      await expectTouchTarget(sheetLink, '"Dispensing sheet"');
      await sheetLink.click();
      const totals = page.getByRole('region', { name: 'Session totals' });
      await expect(totals).toBeVisible({ timeout: 20_000 });
      const line = totals
        .getByRole('table', { name: 'What to dispense for the whole session' })
        .locator('tr', { hasText: 'Sulfuric acid 98 %' });
      await expect(line).toContainText(/Short by/);
      await expect(line).toContainText(/LW-\d{5}/);
      await expect(line).toHaveCSS('display', size.stacked ? 'grid' : 'table-row');
      await line.scrollIntoViewIfNeeded();
      await expectNoSidewaysScroll(page);
      await shoot(page, size, 'dispensing');
      await expectTouchTarget(page.getByRole('button', { name: 'Print' }), '"Print"');

      // paper keeps the table, whatever the screen
      await page.emulateMedia({ media: 'print' });
      await expect(line).toHaveCSS('display', 'table-row');
      await page.emulateMedia({ media: 'screen' });
    });

    test('when a member records a run from a plan, then the run is saved with its yield', async ({
      page,
    }) => {
      await signInAtTheBench(page, demo.member);
      const planId = await createPlan(page, {
        procedureId: await procedureId(page, 'Isoamyl acetate by Fischer esterification'),
        scaleFactor: 0.5,
        benches: 1,
      });

      await page.goto(`/preparations/plans/${planId}`);
      const start = page.getByRole('link', { name: 'Record a run' });
      await expectTouchTarget(start, '"Record a run"');
      await start.click();
      await page.getByRole('button', { name: 'Start recording' }).click();
      const record = page.getByRole('form', { name: 'Record the run' });
      await expect(record).toBeVisible({ timeout: 20_000 });
      const portion = record.getByRole('listitem', { name: 'Portion 1' });
      await portion.getByRole('textbox', { name: 'Amount' }).fill('2.1');
      await portion.getByLabel('Location').selectOption({ index: 1 });
      await expectNoSidewaysScroll(page);
      await shoot(page, size, 'run-record');
      const save = record.getByRole('button', { name: 'Record the run' });
      await expectTouchTarget(save, '"Record the run"');
      await save.click();

      await expect(page.getByTestId('percent-yield')).toBeVisible({ timeout: 15_000 });
      await expect(page.getByRole('link', { name: /LW-\d{5}/ }).first()).toBeVisible();
      await expectNoSidewaysScroll(page);
      await shoot(page, size, 'run');
    });
  });
}
