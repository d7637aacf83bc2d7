import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

// The demo lab's open order "Evening club: esters and acids" has its claims closed: member
// one and the lab's share are paid, members two and three still owe their shares.
const orderTitle = 'Evening club: esters and acids';

test('a member pays their share on the hosted page: a declined card, then a card that succeeds', async ({
  page,
}) => {
  await signIn(page, 'member.two@example.test');
  await page
    .getByRole('navigation', { name: /main/i })
    .getByRole('link', { name: 'Orders' })
    .click();
  await page.getByRole('link', { name: orderTitle }).click();
  await expect(page.getByRole('heading', { level: 1, name: orderTitle })).toBeVisible();
  // the amount is the server's fixed share, written in the reader's format
  const pay = page.getByRole('button', { name: /^Pay €\d+\.\d{2}$/ });
  await expect(pay).toBeVisible();
  await pay.click();

  // the payment provider's page (our local fake)
  await expect(page.getByRole('button', { name: 'Test card succeeds' })).toBeVisible();
  await page.getByRole('button', { name: 'Test card is declined' }).click();
  await expect(page.getByText(/declined/i).first()).toBeVisible();
  await page.getByRole('button', { name: 'Test card succeeds' }).click();

  // back in Lotwise: the share reads paid once the signed webhook arrived
  await expect(page).toHaveURL(/\/orders\/\d+\?paid=\d+/);
  const shares = page.getByRole('region', { name: 'Who claimed what' });
  await expect(shares.getByRole('row', { name: /Club Member Two/ })).toContainText('Paid', {
    timeout: 15_000,
  });
});

test('a coordinator takes the last payment in cash, orders, receives the delivery, and the member finds their own container', async ({
  page,
}) => {
  await signIn(page, demo.manager);
  await page
    .getByRole('navigation', { name: /main/i })
    .getByRole('link', { name: 'Orders' })
    .click();
  await page.getByRole('link', { name: orderTitle }).click();
  await expect(page.getByRole('heading', { level: 1, name: orderTitle })).toBeVisible();

  // every share still unpaid is settled in cash, so the order is funded
  const shares = page.getByRole('region', { name: 'Who claimed what' });
  for (let i = 0; i < 3; i++) {
    const record = shares.getByRole('button', { name: /Record cash payment/ }).first();
    if (!(await record.isVisible().catch(() => false))) break;
    await record.click();
    const dialog = page.getByRole('dialog', { name: 'Record cash payment' });
    await dialog.getByLabel('Note').fill('Paid in cash at the club evening');
    await dialog.getByRole('button', { name: /^Record €/ }).click();
    await expect(dialog).toBeHidden();
  }
  await expect(page.getByText('Funded').first()).toBeVisible();

  await page.getByRole('button', { name: 'Mark ordered' }).first().click();
  const ordered = page.getByRole('dialog', { name: 'Mark ordered' });
  await ordered.getByLabel('Supplier’s order number or reference').fill('HC-2026-5521');
  await ordered.getByRole('button', { name: 'Mark ordered' }).click();
  await expect(ordered).toBeHidden();

  await page.getByRole('link', { name: 'Receive the delivery' }).click();
  await page.getByLabel('Store the portions in').selectOption({ index: 1 });
  await page.getByRole('button', { name: /^Receive into \d+ containers?$/ }).click();
  const confirm = page.getByRole('button', { name: 'Save anyway' });
  const done = page.getByText('The delivery is in stock');
  await expect(confirm.or(done)).toBeVisible();
  if (await confirm.isVisible()) await confirm.click();
  await expect(done).toBeVisible();
  const made = page.getByRole('table', { name: 'Containers made for the portions' });
  const memberRow = made.getByRole('row', { name: /Club Member Two/ });
  const label = (await memberRow.getByRole('link').first().textContent())?.trim() ?? '';
  expect(label).toMatch(/^LW-\d+$/);

  // the member sees the container as theirs in stock, under its label
  await page.context().clearCookies();
  await signIn(page, 'member.two@example.test');
  await page.goto(`/stock/c/${label}`);
  await expect(page.getByText(label).first()).toBeVisible();
  await expect(page.getByText(/Belongs to/)).toBeVisible();
  await expect(page.getByText('Club Member Two').first()).toBeVisible();
});
