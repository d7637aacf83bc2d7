import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

test.describe('sign-in and roles', () => {
  test('when the password is wrong, then the page says so and stays on sign-in', async ({
    page,
  }) => {
    await page.goto('/chemicals');
    await expect(page).toHaveURL(/sign-in/);
    await page.getByLabel('E-mail').fill(demo.admin);
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: /sign in/i }).click();
    await expect(page.getByText('Could not sign in')).toBeVisible();
    await expect(page).toHaveURL(/sign-in/);
  });

  test('when a person changes their password, then their other browser is signed out and this one stays', async ({
    page,
    browser,
  }) => {
    // member.three is used by no other spec, so its new password disturbs nothing.
    const email = 'member.three@example.test';
    const other = await browser.newContext();
    const otherPage = await other.newPage();
    await signIn(otherPage, email);
    await signIn(page, email);

    await page.getByRole('link', { name: /your account/i }).click();
    await expect(page.getByRole('heading', { name: 'Your password' })).toBeVisible();
    await page.getByLabel('Current password').fill(demo.password);
    await page.getByLabel('New password', { exact: true }).fill('a-new-bench-password');
    await page.getByLabel('New password again').fill('a-new-bench-password');
    await page.getByRole('button', { name: 'Save new password' }).click();
    await expect(page.getByText('Your new password is saved')).toBeVisible();

    await page.goto('/chemicals');
    await expect(page.getByRole('navigation', { name: /main/i })).toBeVisible();
    await otherPage.goto('/chemicals');
    await expect(otherPage).toHaveURL(/sign-in/);
    await other.close();
  });

  test('when a viewer signs in, then there is no admin and no way to edit', async ({ page }) => {
    await signIn(page, demo.viewer);
    const nav = page.getByRole('navigation', { name: 'Main' });
    await expect(nav.getByRole('link', { name: /chemicals/i })).toBeVisible();
    await expect(nav.getByRole('link', { name: /people/i })).toHaveCount(0);
    await expect(page.getByRole('link', { name: /add a chemical/i })).toHaveCount(0);
    await page.goto('/admin/users');
    await expect(page.getByText(/not available with your role/i)).toBeVisible();
  });

  test('when the admin invites a person, then the link lets them in with the role given', async ({
    page,
    browser,
  }) => {
    await signIn(page, demo.admin);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: /people/i })
      .click();
    await expect(page.getByRole('heading', { name: 'People' })).toBeVisible();
    await page.getByRole('button', { name: 'Add a person' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Evening Club Guest');
    await dialog.getByLabel('E-mail').fill('club.guest@example.test');
    await dialog.getByLabel('Role').selectOption('member');
    await dialog.getByRole('button', { name: 'Add and make link' }).click();
    const link = await dialog.getByLabel(/send this link/i).inputValue();
    expect(link).toMatch(/\/invite\//);
    await dialog.getByRole('button', { name: 'Done' }).click();

    const guest = await browser.newContext();
    const guestPage = await guest.newPage();
    await guestPage.goto(link);
    await expect(guestPage.getByText('club.guest@example.test')).toBeVisible();
    await guestPage.getByLabel('Password', { exact: true }).fill('a long club password');
    await guestPage.getByLabel('Password again').fill('a long club password');
    await guestPage.getByRole('button', { name: 'Save password' }).click();
    await expect(guestPage.getByText('Your password is saved')).toBeVisible();
    await guestPage.getByRole('link', { name: 'Continue to Lotwise' }).click();
    await expect(guestPage.getByRole('navigation', { name: 'Main' })).toBeVisible();
    await expect(guestPage.getByText('Evening Club Guest').first()).toBeVisible();
    await expect(
      guestPage.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /people/i }),
    ).toHaveCount(0);
    await guest.close();

    // the admin makes the guest a viewer; the change shows in the table
    await page.reload();
    const role = page.getByLabel('Role of Evening Club Guest');
    await role.selectOption('viewer');
    await page.getByRole('button', { name: 'Make them a viewer' }).click();
    await expect(role).toHaveValue('viewer');
  });
});

test.describe('chemicals catalogue', () => {
  test('when searching by a synonym, then the chemical is found and its hazards are shown', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    await page.goto('/chemicals');
    await page.getByRole('main').getByLabel('Search').fill('aspirin');
    const row = page.getByRole('row', { name: /acetylsalicylic acid/i });
    await expect(row).toBeVisible();
    await expect(page.getByRole('row')).toHaveCount(2); // header + one match
    await expect(page).toHaveURL(/q=aspirin/);
    await row.getByRole('link', { name: /acetylsalicylic acid/i }).click();
    await expect(page.getByRole('heading', { name: /acetylsalicylic acid/i })).toBeVisible();
    await expect(page.getByText('GHS07')).toBeVisible();
    await expect(page.getByText('Exclamation mark')).toBeVisible();
    await expect(page.getByText('Harmful if swallowed')).toBeVisible();
    await expect(page.getByText(/SDS, local regulations and licensed practice/)).toBeVisible();
    // 180.16 g/mol: CIAAW 2021 abridged atomic weights, C9H8O4 (reference chemicals.tsv)
    await expect(page.getByText('180.16 g/mol')).toBeVisible();
  });

  test('when sorting by molar mass, then the heaviest comes first and the URL keeps it', async ({
    page,
  }) => {
    await signIn(page, demo.viewer);
    await page.goto('/chemicals');
    const header = page.getByRole('button', { name: /molar mass/i });
    await header.click();
    await expect(page).toHaveURL(/sort=molarMass\./);
    if (!page.url().includes('molarMass.desc')) await header.click();
    await expect(page).toHaveURL(/sort=molarMass\.desc/);
    // copper(II) sulfate pentahydrate, 249.68 g/mol, is the heaviest demo chemical (calc, CIAAW 2021)
    await expect(page.getByRole('row').nth(1)).toContainText('Copper(II) sulfate pentahydrate');
  });

  test('when a manager adds a chemical, then bad input is explained inline and the saved one shows its molar mass', async ({
    page,
  }) => {
    await signIn(page, demo.manager);
    await page.goto('/chemicals');
    await page.getByRole('link', { name: /add a chemical/i }).click();
    await page.getByLabel('Name').fill('Potassium ferrocyanide trihydrate');
    const formula = page.getByLabel('Formula');
    await formula.fill('K4Fe(CN)6·3Xx');
    await expect(page.getByText(/unknown element "Xx"/)).toBeVisible();
    await formula.fill('K4Fe(CN)6·3H2O');
    // 422.39 g/mol: calc from CIAAW 2021 (reference formula-masses.tsv)
    await expect(page.getByText('422.39 g/mol')).toBeVisible();
    const cas = page.getByLabel('CAS RN');
    await cas.fill('14459-95-2'); // check digit rule (CAS): the right check digit is 1
    await cas.blur();
    await expect(page.getByText(/check digit/i).first()).toBeVisible();
    await cas.fill('14459-95-1');
    await page.getByLabel('Physical state').selectOption('solid');
    await page.getByRole('checkbox', { name: /GHS07/ }).check();
    await page.getByRole('button', { name: 'Add chemical' }).click();
    await expect(
      page.getByRole('heading', { name: 'Potassium ferrocyanide trihydrate' }),
    ).toBeVisible();
    await expect(page.getByText('422.39 g/mol')).toBeVisible();
    await expect(page.getByText('14459-95-1')).toBeVisible();
  });

  test('when the list page is scanned, then it has no serious accessibility problems', async ({
    page,
  }) => {
    await signIn(page, demo.admin);
    await page.goto('/chemicals');
    await expect(page.getByRole('row').nth(1)).toBeVisible();
    const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    const serious = results.violations.filter(
      (v) => v.impact === 'serious' || v.impact === 'critical',
    );
    expect(serious.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  });
});
