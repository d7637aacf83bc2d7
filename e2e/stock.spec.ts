import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

interface ContainerRow {
  id: number;
  labelCode: string;
  quantity: number;
  unit: string;
  tareMass: number | null;
  status: string;
}

test.describe('stock', () => {
  test('when a member weighs a container, then the draw, balance and ledger follow from the tare', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    // pick an open salicylic acid container with a tare and enough in it, as a person would from the list
    const list = await page.request.get('/api/containers?q=salicylic&status=open&pageSize=50');
    expect(list.ok()).toBe(true);
    const { items } = (await list.json()) as { items: ContainerRow[] };
    const container = items.find((c) => c.tareMass !== null && c.quantity > 30 && c.unit === 'g');
    expect(container, 'an open salicylic acid container with a tare').toBeTruthy();
    const { labelCode, tareMass, quantity } = container!;

    // type the label code into the global search, as a scanner would, and jump to it
    const search = page.getByPlaceholder(/scan a label/i);
    await search.fill(labelCode);
    await search.press('Enter');
    await expect(page.getByRole('heading', { name: /salicylic acid/i })).toBeVisible();
    await expect(page.getByText(labelCode).first()).toBeVisible();
    await expect(page.getByText('GHS05').first()).toBeVisible();

    // weighing by difference: gross = tare + balance − 12.50 g means 12.50 g were taken
    const gross = (tareMass! + quantity - 12.5).toFixed(2);
    const form = page.getByRole('form', { name: 'Record a draw' });
    await form.locator('label', { hasText: 'Weigh the container' }).click();
    await expect(form.getByRole('radio', { name: /weigh the container/i })).toBeChecked();
    await form.getByLabel(/gross mass/i).fill(gross);
    await expect(form.getByText('12.50 g')).toBeVisible(); // the preview before saving
    await form.getByRole('button', { name: 'Record draw' }).click();
    await expect(page.getByText('Draw recorded')).toBeVisible();

    const expectedBalance = (quantity - 12.5).toFixed(2);
    const ledger = page.getByRole('table', { name: /ledger/i });
    const newest = ledger.getByRole('row').nth(1);
    await expect(newest).toContainText('Drawn');
    await expect(newest).toContainText('12.50 g');
    await expect(newest).toContainText(`${expectedBalance} g`);
    await expect(newest).toContainText('Club Member One');
  });

  test('when a draw would take more than the container holds, then it is refused with the amount available', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    const list = await page.request.get(
      '/api/containers?q=sodium chloride&status=open&pageSize=50',
    );
    const { items } = (await list.json()) as { items: ContainerRow[] };
    const container = items.find((c) => c.quantity > 0);
    expect(container).toBeTruthy();
    await page.goto(`/stock/containers/${container!.id}`);
    const form = page.getByRole('form', { name: 'Record a draw' });
    await form.locator('label', { hasText: 'Enter the amount' }).click();
    await expect(form.getByRole('radio', { name: 'Enter the amount' })).toBeChecked();
    await form.locator('input[name="value"]').fill(String(Math.ceil(container!.quantity + 100)));
    await form.getByRole('button', { name: 'Record draw' }).click();
    await expect(page.getByText('Not recorded')).toBeVisible();
    await expect(page.getByText(new RegExp(`${container!.labelCode} holds only`))).toBeVisible();
  });

  test('when a newcomer looks for what expires this month and what is stored badly, then the overview leads there', async ({
    page,
  }) => {
    await signIn(page, demo.viewer);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: /stock/i })
      .click();
    await page
      .getByRole('link', { name: /expiring this month/i })
      .first()
      .click();
    await expect(page).toHaveURL(/expiring/i);
    await expect(page.getByRole('row').nth(1)).toBeVisible();

    await page
      .getByRole('link', { name: /storage conflicts/i })
      .first()
      .click();
    // the demo lab keeps one bottle of hydrochloric acid on the bases shelf on purpose
    await expect(page.getByText(/hydrochloric acid/i).first()).toBeVisible();
    await expect(page.getByText(/bases/i).first()).toBeVisible();
  });
});
