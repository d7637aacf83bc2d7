import { expect, test, type Page } from '@playwright/test';
import { demo, signIn } from './support';

/** Takes the focus out of any field, so the next key is a shortcut. */
async function leaveFields(page: Page) {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
}

/** The shortcuts load just after the first page shows; the body says when they listen. */
async function shortcutsListening(page: Page) {
  await expect(page.locator('body[data-shortcuts="on"]')).toHaveCount(1, { timeout: 30_000 });
}

test.describe('help and keyboard shortcuts', () => {
  // Each test signs in and walks several pages, each loading its code the first time.
  test.describe.configure({ timeout: 120_000 });
  // A page opened for the first time loads its code before the address changes.
  const opened = { timeout: 30_000 };

  test('when ? is pressed, then the overlay lists the shortcuts; Escape closes it and the focus goes back', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    await page.goto('/help');
    const helpLink = page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Help' });
    await shortcutsListening(page);
    await helpLink.focus();

    await page.keyboard.press('?');
    const overlay = page.getByRole('dialog', { name: 'Keyboard shortcuts' });
    await expect(overlay).toBeVisible();
    for (const label of [
      'Search',
      'Record a draw',
      'Record a run',
      'Go to the start page',
      'Go to stock',
    ]) {
      await expect(overlay.getByText(label, { exact: true })).toBeVisible();
    }
    // The focus stays inside while the overlay is open.
    for (let i = 0; i < 4; i++) await page.keyboard.press('Tab');
    expect(await overlay.evaluate((dialog) => dialog.contains(document.activeElement))).toBe(true);

    await page.keyboard.press('Escape');
    await expect(overlay).toBeHidden();
    await expect(helpLink).toBeFocused();
  });

  test('when g then s, and r are pressed, then stock and a new run open', async ({ page }) => {
    await signIn(page, demo.member);
    await page.goto('/help');
    await expect(page.getByRole('heading', { name: 'Help', level: 1 })).toBeVisible(opened);
    await shortcutsListening(page);

    await page.keyboard.press('g');
    await page.keyboard.press('s');
    await expect(page).toHaveURL(/\/stock$/, opened);

    await page.keyboard.press('r');
    await expect(page).toHaveURL(/\/preparations\/runs\/new$/, opened);
    await expect(page.getByRole('heading', { name: 'Record a run', level: 1 })).toBeVisible(opened);
  });

  test('when / or d is pressed away from a container, then the search at the top takes the cursor', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    await page.goto('/help');
    await expect(page.getByRole('heading', { name: 'Help', level: 1 })).toBeVisible(opened);
    const search = page.getByRole('combobox', { name: 'Search chemicals and containers' });
    await shortcutsListening(page);

    await page.keyboard.press('/');
    await expect(search).toBeFocused();
    await expect(search).toHaveValue('');

    await leaveFields(page);
    await page.keyboard.press('d');
    await expect(search).toBeFocused();
    await expect(page.getByText('Find a container to draw from', { exact: false })).toBeVisible();
  });

  test('when d is pressed on a container page, then its draw form takes the cursor', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    const list = await page.request.get('/api/containers?q=sodium chloride&status=open&pageSize=5');
    const { items } = (await list.json()) as { items: { id: number }[] };
    expect(items.length).toBeGreaterThan(0);
    await page.goto(`/stock/containers/${items[0]!.id}`);
    const form = page.getByRole('form', { name: 'Record a draw' });
    await expect(form).toBeVisible(opened);
    await shortcutsListening(page);

    await leaveFields(page);
    await page.keyboard.press('d');
    await expect
      .poll(() => form.evaluate((element) => element.contains(document.activeElement)))
      .toBe(true);
  });

  test('when the help page opens, then it lists the API operations from /api/openapi.json and filters them', async ({
    page,
  }) => {
    const answer = await page.request.get('/api/openapi.json');
    expect(answer.ok()).toBe(true);
    const document = (await answer.json()) as { openapi: string; paths: Record<string, object> };
    expect(document.openapi).toBe('3.1.0');
    const count = Object.values(document.paths).reduce(
      (sum, item) => sum + Object.keys(item).length,
      0,
    );

    await signIn(page, demo.viewer);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Help' })
      .click();
    await expect(page.getByRole('heading', { name: 'Help', level: 1 })).toBeVisible(opened);
    await expect(
      page.getByText('The SDS, local regulations and licensed practice take precedence', {
        exact: false,
      }),
    ).toBeVisible();
    await expect(page.getByText(`${count} operations`)).toBeVisible(opened);
    const containers = page.getByRole('region', { name: 'Operations: containers' });
    const draw = containers.getByRole('listitem').filter({ hasText: '/api/containers/{id}/draws' });
    await expect(draw).toContainText('Record a draw from a container');
    await expect(draw).toContainText('stock.draw');

    await page.getByRole('searchbox', { name: 'Filter operations' }).fill('openapi');
    await expect(page.getByText(`1 of ${count} operations`)).toBeVisible();
    await expect(page.getByRole('region', { name: 'Operations: openapi' })).toContainText('public');
  });
});
