import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

interface ContainerRow {
  id: number;
  labelCode: string;
  quantity: number;
  unit: string;
  tareMass: number | null;
}

test('when a session is planned, then the stock check is shown unsaved first and saved as a step of its own', async ({
  page,
}) => {
  await signIn(page, demo.manager);
  const before = (await (await page.request.get('/api/plans?pageSize=1')).json()) as {
    total: number;
  };
  await page.goto('/preparations/plans/new');
  expect(await page.evaluate(() => window.scrollY)).toBe(0);
  const form = page.getByRole('form', { name: 'Plan a session' });
  await form.getByLabel('Procedure').selectOption({ index: 1 });
  await expect(form.getByTestId('hazard-summary')).toBeVisible();
  await form.getByRole('button', { name: 'Check stock for this session' }).click();
  await expect(page.getByRole('heading', { name: 'Stock check (not saved yet)' })).toBeVisible();
  const during = (await (await page.request.get('/api/plans?pageSize=1')).json()) as {
    total: number;
  };
  expect(during.total).toBe(before.total);
  await page.getByRole('button', { name: 'Save this plan' }).click();
  await expect(page).toHaveURL(/\/preparations\/plans\/\d+$/);
});

test('when an opened run is discarded, then it is gone after a confirmation', async ({ page }) => {
  await signIn(page, demo.member);
  const procedures = (await (await page.request.get('/api/procedures?pageSize=1')).json()) as {
    items: { id: number }[];
  };
  const opened = await page.request.post('/api/runs', {
    data: { procedureId: procedures.items[0]!.id },
  });
  expect(opened.status()).toBe(201);
  const run = (await opened.json()) as { id: number };
  await page.goto(`/preparations/runs/${run.id}`);
  await page.getByRole('button', { name: 'Discard this run' }).click();
  const dialog = page.getByRole('dialog', { name: `Discard run #${run.id}?` });
  await expect(dialog).toContainText('changes no container and no ledger');
  await dialog.getByRole('button', { name: 'Discard the run' }).click();
  await expect(page).toHaveURL(/\/preparations\/runs$/);
  expect((await page.request.get(`/api/runs/${run.id}`)).status()).toBe(404);
});

test('when an admin changes a role, then a dialog names the person, the old and the new role first', async ({
  page,
}) => {
  await signIn(page, demo.admin);
  const email = `rough-edges-${Date.now()}@example.test`;
  const created = await page.request.post('/api/users', {
    data: { email, displayName: 'Rough Edges Guest', role: 'member' },
  });
  expect(created.status()).toBe(201);
  await page.goto(`/admin/users?q=${encodeURIComponent('Rough Edges Guest')}`);
  const role = page.getByLabel('Role of Rough Edges Guest');
  await role.selectOption('viewer');
  const dialog = page.getByRole('dialog', { name: 'Change the role of Rough Edges Guest?' });
  await expect(dialog).toContainText('is a member and becomes a viewer');
  await dialog.getByRole('button', { name: 'Cancel' }).click();
  await expect(role).toHaveValue('member');
  await role.selectOption('viewer');
  await page.getByRole('button', { name: 'Make them a viewer' }).click();
  await expect(page.getByText('Rough Edges Guest is now a viewer.')).toBeVisible();
});

test.describe('in German', () => {
  test.use({ locale: 'de-DE' });

  test('when a draw is typed as "1,5", then 1.5 g is recorded and shown as "1,50 g"', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    const list = await page.request.get('/api/containers?q=sodium chloride&pageSize=50');
    const { items } = (await list.json()) as { items: ContainerRow[] };
    const container = items.find((c) => c.unit === 'g' && c.quantity > 5);
    expect(container).toBeTruthy();
    await page.goto(`/stock/containers/${container!.id}`);
    const form = page.getByRole('form', { name: 'Record a draw' });
    await form.locator('label', { hasText: 'Enter the amount' }).click();
    await form.getByRole('textbox', { name: 'Amount taken' }).fill('1,5');
    await form.getByRole('button', { name: 'Record draw' }).click();
    await expect(form.getByText(/Drawn 1,50 g from/)).toBeVisible();
  });
});
