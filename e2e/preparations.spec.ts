import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

test('when a technician plans 8 benches at 1/4 scale, then the shortfall, make-versus-buy, reservation and recorded run with two crops all follow', async ({
  page,
}) => {
  test.setTimeout(120_000);
  await signIn(page, demo.manager);

  // plan the session
  await page.goto('/preparations/plans/new');
  const form = page.getByRole('form', { name: 'Plan a session' });
  await form
    .getByLabel('Procedure')
    .selectOption({ label: 'Dibenzalacetone by aldol condensation' });
  await form.getByLabel('Scale per bench').fill('1/4');
  await form.getByLabel('Benches or groups').fill('8');
  await form.getByRole('button', { name: 'Check stock for this session' }).click();
  // the check is shown first, unsaved; saving is a step of its own
  await expect(page.getByRole('heading', { name: 'Stock check (not saved yet)' })).toBeVisible();
  await page.getByRole('button', { name: 'Save this plan' }).click();

  // 8 benches × 1/4 × 1.10 overage = factor 2.2 of the base scale (hand calculation)
  await expect(page.getByText(/factor 2\.2 of the base scale/)).toBeVisible();
  await expect(
    page.getByText(/SDS, local regulations and licensed practice/).first(),
  ).toBeVisible();
  await expect(page.getByText('GHS05').first()).toBeVisible();
  // the demo lab holds 13.5 mL of 1 M NaOH solution against 44.0 mL needed
  await expect(page.getByText('short by 30.50 mL')).toBeVisible();
  await expect(page.getByText(/Prepare it first/)).toBeVisible();
  await expect(page.getByRole('link', { name: 'Plan that preparation' })).toBeVisible();

  await page.getByRole('button', { name: 'Reserve', exact: true }).click();
  await expect(page.getByRole('table', { name: 'Held for this plan' })).toBeVisible();
  const planUrl = page.url();

  // every sheet says what is short: 13.5 mL serves 2 benches (5.5 mL a bench with overage)
  await page.getByRole('link', { name: 'Dispensing sheet' }).click();
  const totals = page.getByRole('region', { name: 'Session totals' });
  await expect(totals).toBeVisible({ timeout: 20_000 });
  await expect(totals.getByRole('note')).toContainText(
    'Short: 1 line. Benches 1–2 can be served from what is on hand; benches 3–8 cannot.',
  );
  await expect(totals).toContainText('Prepare it first: Sodium hydroxide solution 1 M');
  for (const bench of [1, 3, 8]) {
    await expect(page.getByRole('region', { name: `Bench ${bench}`, exact: true })).toContainText(
      /Short by 30\.50? mL for the session/,
    );
  }
  await expect(page.getByRole('region', { name: 'Bench 2', exact: true })).toContainText(
    'Bench 2 can be served from what is on hand',
  );
  await expect(page.getByRole('region', { name: 'Bench 3', exact: true })).toContainText(
    'Bench 3 cannot be served from what is on hand',
  );

  // a member runs the technician's plan: the run is theirs, the plan stays the technician's
  await page.context().clearCookies();
  await signIn(page, demo.member);
  await page.goto(planUrl);
  await expect(page.getByText(/Planned by .*You can record a run from this plan/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Reserve again' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Cancel plan' })).toHaveCount(0);

  // record the run: acetone (the limiting reagent) weighed before and after, benzaldehyde by amount
  await page.getByRole('link', { name: 'Record a run' }).click();
  await page.getByRole('button', { name: 'Start recording' }).click();
  const record = page.getByRole('form', { name: 'Record the run' });
  await expect(record).toBeVisible();
  const acetone = record.getByRole('listitem', { name: /Line \d+: Acetone/ });
  const acetoneDraw = acetone.getByRole('group', { name: /draw 1$/ });
  await acetoneDraw.locator('label', { hasText: 'Weighed the container' }).click();
  await acetoneDraw.getByLabel('Gross mass before (g)').fill('250.00');
  await acetoneDraw.getByLabel('Gross mass after (g)').fill('248.89'); // 1.11 g of acetone
  const benzaldehyde = record.getByRole('listitem', { name: /Line \d+: Benzaldehyde/ });
  await benzaldehyde
    .getByRole('group', { name: /draw 1$/ })
    .getByRole('textbox', { name: 'Amount' })
    .fill('4.4');

  // the rest as planned: all of the 13.5 mL of NaOH solution there is, the solvent and the water
  for (const [name, amount] of [
    ['Sodium hydroxide solution 1 M', '13.5'],
    ['Ethanol', '33'],
    ['Water, deionised', '110'],
  ] as const) {
    await record
      .getByRole('listitem', { name: new RegExp(`Line \\d+: ${name.replace(/[,.]/g, '.')}`) })
      .getByRole('group', { name: /draw 1$/ })
      .getByRole('textbox', { name: 'Amount' })
      .fill(amount);
  }

  const first = record.getByRole('listitem', { name: 'Portion 1' });
  await first.getByRole('textbox', { name: 'Amount' }).fill('2.45');
  await first.getByLabel('Location').selectOption({ index: 1 });
  await record.getByRole('button', { name: 'Add a second crop' }).click();
  const second = record.getByRole('listitem', { name: 'Portion 2' });
  await second.getByRole('textbox', { name: 'Amount' }).fill('0.38');
  await second.getByLabel('Location').selectOption({ index: 1 });
  await record.getByRole('button', { name: 'Record the run' }).click();

  // percent yield from the acetone really used: 1.11 g × 0.995 / 58.08 g/mol = 19.016 mmol
  // → 19.016 mmol × 234.298 g/mol = 4.455 g theoretical; 2.83 g / 4.455 g = 63.5 %
  // (calc from CIAAW 2021; purity 99.5 % of the demo acetone lot)
  await expect(page.getByTestId('percent-yield')).toContainText('63.5');
  const newLabel = page.getByRole('link', { name: /LW-\d{5}/ }).first();
  await expect(newLabel).toBeVisible();
  const labelCode = (await newLabel.textContent())!.match(/LW-\d{5}/)![0];

  // the product is in stock as a prepared lot
  const search = page.getByPlaceholder(/scan a label/i);
  await search.fill(labelCode);
  await search.press('Enter');
  await expect(page.getByRole('heading', { name: /dibenzalacetone/i })).toBeVisible();
  await expect(page.getByText('2.45 g').first()).toBeVisible();
});
