import { expect, test, type Locator, type Page } from '@playwright/test';
import { demo, signIn } from './support';

async function chooseChemical(page: Page, line: Locator, typed: string, name: RegExp) {
  await line.getByRole('combobox', { name: 'Chemical' }).fill(typed);
  await page.getByRole('option', { name }).first().click();
}

test('when a manager writes two steps into a new procedure, then the procedure page, the plan and every bench page of the dispensing sheet show them with the bench amount', async ({
  page,
}) => {
  test.setTimeout(90_000);
  await signIn(page, demo.manager);
  const title = `Aspirin with written steps ${Date.now().toString(36)}`;

  await page.goto('/preparations/procedures/new');
  const form = page.getByRole('form', { name: 'Procedure' });
  await form.getByLabel('Title').fill(title);
  const first = form.getByRole('listitem', { name: 'Line 1' });
  await chooseChemical(page, first, 'salicylic', /^Salicylic acid/);
  await first.getByLabel('Amount').fill('2,0'); // a decimal comma, as some readers write it
  const second = form.getByRole('listitem', { name: 'Line 2' });
  await chooseChemical(page, second, 'acetic an', /^Acetic anhydride/);
  await second.getByLabel('Amount').fill('5.0');
  await second.getByLabel('Unit').selectOption('mL');
  await chooseChemical(
    page,
    form.getByRole('listitem', { name: 'Line 3' }),
    'acetylsal',
    /^Acetylsalicylic acid/,
  );

  await form.getByRole('button', { name: 'Add a step' }).click();
  const add = form.getByRole('listitem', { name: 'Step 1' });
  await add.getByLabel('What to do').fill('Add the anhydride to the salicylic acid in the flask.');
  await add
    .getByLabel(/Line added in this step/)
    .selectOption({ label: 'Line 2: Acetic anhydride' });
  await add.getByLabel(/How it is added/).fill('dropwise over about 2 min');
  await add.getByLabel(/Caution/).selectOption({ label: 'Needs a fume hood' });

  await form.getByRole('button', { name: 'Add a step' }).click();
  const warm = form.getByRole('listitem', { name: 'Step 2' });
  await warm.getByLabel('What to do').fill('Warm the flask on the water bath, swirling.');
  await warm.getByLabel(/Time \(min\)/).fill('15');
  await warm.getByLabel(/Keep from/).fill('50');
  await warm.getByLabel(/Keep up to/).fill('60');
  await warm.getByLabel(/If the temperature leaves the window/).fill('take the flask off the bath');
  await warm.getByLabel(/Hold point/).fill('all the solid has dissolved');
  await form.getByRole('button', { name: 'Save procedure' }).click();

  // the procedure page
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  const steps = page.getByRole('region', { name: 'Steps' });
  await expect(steps.getByRole('listitem', { name: 'Step 1' })).toContainText(
    'Add: Acetic anhydride',
  );
  await expect(steps.getByRole('listitem', { name: 'Step 1' })).toContainText(
    'Caution: Needs a fume hood',
  );
  await expect(steps.getByRole('listitem', { name: 'Step 2' })).toContainText(
    'Keep the temperature: 50–60 °C',
  );
  await expect(steps.getByRole('listitem', { name: 'Step 2' })).toContainText(
    'Hold point: do not go on until all the solid has dissolved',
  );

  // a plan of two benches at half scale: 5.0 mL × 1/2 = 2.5 mL of anhydride per bench
  await page.getByRole('link', { name: 'Plan a session' }).click();
  const plan = page.getByRole('form', { name: 'Plan a session' });
  await plan.getByLabel('Scale per bench').fill('1/2');
  await plan.getByLabel('Benches or groups').fill('2');
  await plan.getByRole('button', { name: 'Check stock for this session' }).click();
  await page.getByRole('button', { name: 'Save this plan' }).click();
  const planSteps = page.getByRole('region', { name: 'Steps' });
  await expect(planSteps.getByRole('listitem', { name: 'Step 1' })).toContainText(
    'Add: Acetic anhydride — 2.5 mL',
  );

  await page.getByRole('link', { name: 'Dispensing sheet' }).click();
  for (const bench of [1, 2]) {
    const sheet = page
      .getByRole('region', { name: `Bench ${bench}`, exact: true })
      .getByRole('region', { name: `Steps at bench ${bench}` });
    await expect(sheet.getByRole('listitem', { name: 'Step 1' })).toContainText(
      'Add: Acetic anhydride — 2.5 mL, dropwise over about 2 min',
    );
    await expect(sheet.getByRole('listitem', { name: 'Step 2' })).toContainText('Time: 15 min');
    await expect(sheet.getByRole('listitem', { name: 'Step 2' })).toContainText(
      'Outside it: take the flask off the bath',
    );
  }
  await expect(
    page.getByText(/SDS, local regulations and licensed practice/).first(),
  ).toBeVisible();
});
