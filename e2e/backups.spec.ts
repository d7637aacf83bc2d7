import { readFileSync } from 'node:fs';
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

test.describe('backups', () => {
  test('when the admin backs up now, then the backup is listed and downloads as an SQLite file', async ({
    page,
  }) => {
    await signIn(page, demo.admin);
    await page
      .getByRole('navigation', { name: /main/i })
      .getByRole('link', { name: 'Backups' })
      .click();
    await expect(page.getByRole('heading', { name: 'Backups' })).toBeVisible();
    await expect(page.getByText(/every 24 hours and keeps the latest 14/)).toBeVisible();

    // From the keyboard: the button is reached and pressed like any other.
    const backUp = page.getByRole('button', { name: 'Back up now' }).first();
    await backUp.focus();
    await page.keyboard.press('Enter');
    const done = page.getByRole('status').filter({ hasText: 'Backup taken' });
    await expect(done).toBeVisible();
    const name = /lotwise-\d{8}T\d{6}Z-manual\.sqlite/.exec((await done.textContent()) ?? '')?.[0];
    expect(name).toBeTruthy();

    const row = page.getByRole('row').filter({ hasText: name! });
    await expect(row.getByText('by hand')).toBeVisible();
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      row.getByRole('link', { name: `Download ${name}` }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(name);
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 16).toString('latin1')).toBe('SQLite format 3\0');

    const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    const serious = results.violations.filter(
      (v) => v.impact === 'serious' || v.impact === 'critical',
    );
    expect(serious.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  });

  test('when a manager opens the backups address, then there is nothing to see', async ({
    page,
  }) => {
    await signIn(page, demo.manager);
    await expect(page.getByRole('link', { name: 'Backups' })).toHaveCount(0);
    await page.goto('/admin/backups');
    await expect(page.getByRole('button', { name: 'Back up now' })).toHaveCount(0);
  });
});
