import AxeBuilder from '@axe-core/playwright';
import {
  expect,
  test,
  type APIRequestContext,
  type Browser,
  type BrowserContext,
  type Locator,
  type Page,
} from '@playwright/test';
import { paths } from '../apps/web/src/config/paths';
import { demo, signIn } from './support';

/**
 * Every page of the web app, scanned with axe at a desk and on a phone. The page list is keyed
 * by the names in the web app's `paths`, so a page added there without a line here fails the
 * typecheck (and the first test below): visit it, or say why it is skipped.
 */

type Role = 'admin' | 'manager' | 'member' | 'viewer' | 'signed-out';

/** Real ids from the demo lab (and a few records this spec makes for itself). */
interface DemoIds {
  chemical: number;
  container: number;
  labelCode: string;
  location: number;
  procedure: number;
  plan: number;
  run: number;
  openRun: number;
  lot: number;
  order: number;
  closedOrder: number;
  supplier: number;
  labArea: number;
  ruleSet: number;
  wasteContainer: number;
  inviteToken: string;
}

interface Visit {
  /** The least-privileged role that may open the page (what most people will see). */
  as: Role;
  url: (ids: DemoIds) => string;
}
type Skip = { skip: string };

const pages = {
  home: { as: 'member', url: () => paths.home },
  signIn: { as: 'signed-out', url: () => paths.signIn },
  invite: { as: 'signed-out', url: (ids) => paths.invite(ids.inviteToken) },
  chemicals: { as: 'viewer', url: () => paths.chemicals },
  chemical: { as: 'viewer', url: (ids) => paths.chemical(ids.chemical) },
  chemicalNew: { as: 'manager', url: () => paths.chemicalNew },
  chemicalEdit: { as: 'manager', url: (ids) => paths.chemicalEdit(ids.chemical) },
  stock: { as: 'viewer', url: () => paths.stock },
  stockContainers: { as: 'viewer', url: () => paths.stockContainers },
  stockContainer: { as: 'member', url: (ids) => paths.stockContainer(ids.container) },
  stockContainerByLabel: { as: 'member', url: (ids) => paths.stockContainerByLabel(ids.labelCode) },
  stockChemical: { as: 'viewer', url: (ids) => paths.stockChemical(ids.chemical) },
  stockLocations: { as: 'viewer', url: () => paths.stockLocations },
  stockWaste: { as: 'viewer', url: () => paths.stockWaste },
  stockWasteContainer: {
    as: 'member',
    url: (ids) => paths.stockWasteContainer(ids.wasteContainer),
  },
  stockLocation: { as: 'viewer', url: (ids) => paths.stockLocation(ids.location) },
  stockStocktake: { as: 'manager', url: (ids) => paths.stockStocktake(ids.location) },
  stockSegregation: { as: 'viewer', url: () => paths.stockSegregation },
  stockLabAreas: { as: 'viewer', url: () => paths.stockLabAreas },
  stockLabArea: { as: 'viewer', url: (ids) => paths.stockLabArea(ids.labArea) },
  stockLabAreaInspection: { as: 'viewer', url: (ids) => paths.stockLabAreaInspection(ids.labArea) },
  stockRuleSets: { as: 'viewer', url: () => paths.stockRuleSets },
  stockRuleSetNew: { as: 'manager', url: (ids) => `${paths.stockRuleSetNew}?from=${ids.ruleSet}` },
  stockRuleSet: { as: 'viewer', url: (ids) => paths.stockRuleSet(ids.ruleSet) },
  stockRuleSetEdit: {
    skip: 'the demo lab has no rule set of its own; the form is the one "new" shows',
  },
  stockReceive: { as: 'manager', url: () => paths.stockReceive },
  stockImport: { as: 'manager', url: () => paths.stockImport },
  stockLabels: { as: 'viewer', url: (ids) => `${paths.stockLabels}?ids=${ids.container}` },
  preparations: { as: 'viewer', url: () => paths.preparations },
  procedures: { as: 'viewer', url: () => paths.procedures },
  procedureNew: { as: 'manager', url: () => paths.procedureNew },
  procedure: { as: 'viewer', url: (ids) => paths.procedure(ids.procedure) },
  procedureEdit: { as: 'manager', url: (ids) => paths.procedureEdit(ids.procedure) },
  plans: { as: 'viewer', url: () => paths.plans },
  planNew: { as: 'member', url: (ids) => `${paths.planNew}?procedureId=${ids.procedure}` },
  plan: { as: 'viewer', url: (ids) => paths.plan(ids.plan) },
  planDispensing: { as: 'viewer', url: (ids) => paths.planDispensing(ids.plan) },
  runs: { as: 'viewer', url: () => paths.runs },
  runNew: { as: 'member', url: (ids) => `${paths.runNew}?procedureId=${ids.procedure}` },
  run: { as: 'viewer', url: (ids) => paths.run(ids.run) },
  runRecord: { as: 'admin', url: (ids) => paths.runRecord(ids.openRun) },
  // as the run's own performer sees it (with its forms); a viewer sees the same page read-only
  // as the run's own performer sees it (with its forms); a viewer sees the same page read-only
  runBench: { as: 'admin', url: (ids) => paths.runBench(ids.openRun) },
  runNotebook: { as: 'viewer', url: (ids) => paths.runNotebook(ids.run) },
  chemicalUsage: { as: 'viewer', url: (ids) => paths.chemicalUsage(ids.chemical) },
  lotProvenance: { as: 'viewer', url: (ids) => paths.lotProvenance(ids.lot) },
  orders: { as: 'member', url: () => paths.orders },
  orderNew: { as: 'manager', url: () => paths.orderNew },
  order: { as: 'member', url: (ids) => paths.order(ids.order) },
  restock: { as: 'manager', url: () => paths.restock },
  suppliers: { as: 'member', url: () => paths.suppliers },
  supplier: { as: 'member', url: (ids) => paths.supplier(ids.supplier) },
  priceListImport: { skip: 'the import page (stockImport) with a supplier chosen' },
  purchases: { as: 'member', url: () => paths.purchases },
  orderReceipt: { as: 'member', url: (ids) => paths.orderReceipt(ids.closedOrder) },
  orderMoney: { as: 'manager', url: (ids) => paths.orderMoney(ids.closedOrder) },
  orderReceive: { as: 'manager', url: (ids) => paths.orderReceive(ids.order) },
  alerts: { as: 'viewer', url: () => paths.alerts },
  alertPreferences: { as: 'member', url: () => paths.alertPreferences },
  adminOutbox: { as: 'admin', url: () => paths.adminOutbox },
  adminUsers: { as: 'admin', url: () => paths.adminUsers },
  adminBackups: { as: 'admin', url: () => paths.adminBackups },
  adminWatchLists: { as: 'admin', url: () => paths.adminWatchLists },
  adminWatchedChemicals: { as: 'admin', url: () => paths.adminWatchedChemicals },
  account: { as: 'member', url: () => paths.account },
  help: { as: 'viewer', url: () => paths.help },
} satisfies Record<keyof typeof paths, Visit | Skip>;

const viewports = [
  { name: 'desktop', width: 1280, height: 800 },
  { name: 'phone', width: 390, height: 844 },
] as const;

const wcagTags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

const emails: Record<Exclude<Role, 'signed-out'>, string> = {
  admin: demo.admin,
  manager: demo.manager,
  member: demo.member,
  viewer: demo.viewer,
};

/** Signed-in browser state per role, made once for the whole file. */
const sessions = new Map<Role, Awaited<ReturnType<BrowserContext['storageState']>>>();
let ids: DemoIds;

async function sessionFor(browser: Browser, role: Role) {
  if (role === 'signed-out') return undefined;
  const known = sessions.get(role);
  if (known) return known;
  // through the API: the sign-in page itself is scanned and walked by keyboard below
  const context = await browser.newContext();
  const response = await context.request.post('/api/auth/login', {
    data: { email: emails[role], password: demo.password },
  });
  expect(response.ok(), `sign-in as ${role}`).toBe(true);
  const state = await context.storageState();
  await context.close();
  sessions.set(role, state);
  return state;
}

async function firstId(api: APIRequestContext, url: string): Promise<number> {
  const response = await api.get(url);
  expect(response.ok(), url).toBe(true);
  const body = (await response.json()) as { items: { id: number }[] };
  expect(body.items.length, `${url} lists something`).toBeGreaterThan(0);
  return body.items[0]!.id;
}

/** Looks up real records of the demo lab and makes the few a scan needs of its own. */
async function demoIds(browser: Browser): Promise<DemoIds> {
  const context = await browser.newContext({ storageState: await sessionFor(browser, 'admin') });
  const api = context.request;
  const containers = (await (
    await api.get('/api/containers?q=salicylic&status=open&pageSize=1')
  ).json()) as { items: { id: number; labelCode: string; chemical: { id: number } }[] };
  const container = containers.items[0]!;
  const locations = (await (await api.get('/api/locations')).json()) as {
    items: { id: number; containerCount: number }[];
  };
  const orders = (await (await api.get('/api/orders')).json()) as {
    items: { id: number; status: string }[];
  };
  const procedure = await firstId(api, '/api/procedures');
  // A run left open, so the record form is there to scan.
  const run = await api.post('/api/runs', { data: { procedureId: procedure } });
  expect(run.status()).toBe(201);
  // A pending invitation for someone who does not exist yet.
  const invited = await api.post('/api/users', {
    data: {
      email: `a11y-${Date.now()}@example.test`,
      displayName: 'Invited Scanner',
      role: 'member',
    },
  });
  expect(invited.status()).toBe(201);
  const { inviteUrl } = (await invited.json()) as { inviteUrl: string };
  const result: DemoIds = {
    chemical: container.chemical.id,
    container: container.id,
    labelCode: container.labelCode,
    location: locations.items.find((l) => l.containerCount > 0)!.id,
    procedure,
    plan: await firstId(api, '/api/plans'),
    run: await firstId(api, '/api/runs?status=recorded'),
    openRun: ((await run.json()) as { id: number }).id,
    lot: await firstId(api, '/api/lots'),
    order: orders.items.find((o) => o.status === 'open')!.id,
    closedOrder: orders.items.find((o) => o.status !== 'open')!.id,
    supplier: await firstId(api, '/api/suppliers'),
    labArea: await firstId(api, '/api/lab-areas'),
    ruleSet: await firstId(api, '/api/rule-sets?kind=flammable-limits'),
    wasteContainer: await firstId(api, '/api/containers?kind=waste'),
    inviteToken: inviteUrl.split('/invite/')[1]!,
  };
  await context.close();
  return result;
}

/** Waits until the page has its heading and nothing is still loading. */
async function settled(page: Page) {
  const patient = { timeout: 30_000 };
  await expect(page.locator('h1').first()).toBeVisible(patient);
  await expect(page.locator('[role="status"]').filter({ hasText: /loading|opening/i })).toHaveCount(
    0,
    patient,
  );
  await expect(page.locator('[aria-busy="true"]')).toHaveCount(0, patient);
}

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(wcagTags).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

// axe reads every node's colours and names: a long page takes a while on a busy machine
test.describe.configure({ timeout: 120_000 });

test.beforeAll(async ({ browser }) => {
  test.setTimeout(120_000);
  ids = await demoIds(browser);
});

test('when a page exists in the web app, then it is scanned or skipped with a reason', () => {
  expect(Object.keys(pages).sort()).toEqual(Object.keys(paths).sort());
  for (const [name, entry] of Object.entries(pages)) {
    if ('skip' in entry) expect(entry.skip.length, name).toBeGreaterThan(10);
  }
});

for (const [name, entry] of Object.entries(pages) as [string, Visit | Skip][]) {
  if ('skip' in entry) continue;
  for (const viewport of viewports) {
    test(`when ${name} is opened on a ${viewport.name} as ${entry.as}, then axe finds nothing serious`, async ({
      browser,
    }) => {
      const context = await browser.newContext({
        viewport: { width: viewport.width, height: viewport.height },
        storageState: await sessionFor(browser, entry.as),
      });
      const page = await context.newPage();
      await page.goto(entry.url(ids));
      await settled(page);
      expect(await seriousViolations(page)).toEqual([]);
      await context.close();
    });
  }
}

/**
 * Presses Tab until `target` has the focus, checking on the way that every stop shows where
 * the focus is (an outline on the control, or on the label of a visually hidden radio).
 */
async function tabTo(page: Page, target: Locator, most = 80) {
  for (let presses = 1; presses <= most; presses++) {
    await page.keyboard.press('Tab');
    const stop = await page.evaluate(() => {
      const active = document.activeElement as HTMLElement | null;
      if (!active || active === document.body) return { shown: true, name: 'body' };
      const marked = (el: Element | null) =>
        el !== null && getComputedStyle(el).outlineStyle !== 'none';
      return {
        shown: marked(active) || marked(active.closest('label')),
        name: `${active.tagName.toLowerCase()} ${active.getAttribute('aria-label') ?? active.textContent?.trim().slice(0, 40) ?? ''}`,
      };
    });
    expect(stop.shown, `focus is shown on ${stop.name}`).toBe(true);
    if (await target.evaluate((el) => el === document.activeElement)) return presses;
  }
  throw new Error(`${String(target)} was not reached with ${most} presses of Tab`);
}

test.describe('by keyboard, forms and colour', () => {
  test('when someone signs in with the keyboard alone, then the app opens', async ({ page }) => {
    await page.goto(paths.signIn);
    await expect(page.locator('h1').first()).toBeVisible();
    await tabTo(page, page.getByLabel('E-mail'));
    await page.keyboard.type(demo.member);
    await tabTo(page, page.getByLabel('Password'));
    await page.keyboard.type(demo.password);
    await page.keyboard.press('Enter');
    await expect(page.getByRole('navigation', { name: /main/i })).toBeVisible();
  });

  test('when a chemical is opened from the list with the keyboard, then its page shows', async ({
    page,
  }) => {
    await signIn(page, demo.viewer);
    await page.goto(paths.chemicals);
    await settled(page);
    const first = page.getByRole('table').getByRole('link').first();
    const name = (await first.textContent())!.trim();
    await tabTo(page, first);
    await page.keyboard.press('Enter');
    await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
  });

  test('when a draw is recorded with the keyboard alone, then it is saved', async ({ page }) => {
    await signIn(page, demo.member);
    const water = (await (
      await page.request.get('/api/containers?q=water&status=open&pageSize=1')
    ).json()) as { items: { id: number; unit: string }[] };
    await page.goto(paths.stockContainer(water.items[0]!.id));
    await settled(page);
    const form = page.getByRole('form', { name: 'Record a draw' });
    await tabTo(page, form.getByRole('radio').first());
    await page.keyboard.press('ArrowRight');
    await expect(form.getByRole('radio').nth(1)).toBeChecked();
    await tabTo(page, form.getByRole('textbox').first());
    await page.keyboard.type('1');
    await tabTo(page, form.getByRole('button', { name: 'Record draw' }));
    await page.keyboard.press('Enter');
    await expect(page.getByText('Draw recorded')).toBeVisible();
  });

  test('when a form is sent with a required field empty, then the error is tied to that field', async ({
    page,
  }) => {
    await signIn(page, demo.manager);
    await page.goto(paths.chemicalNew);
    await settled(page);
    await page.getByRole('button', { name: 'Add chemical' }).click();
    const name = page.getByRole('textbox', { name: 'Name', exact: true });
    await expect(name).toHaveAttribute('aria-invalid', 'true');
    await expect(name).toHaveAccessibleDescription(/required/i);
    await expect(name).toBeFocused();
  });

  test('when statuses are shown in colour, then each also says it in words', async ({ page }) => {
    await signIn(page, demo.member);
    for (const url of [paths.stock, paths.stockContainers, paths.plan(ids.plan), paths.orders]) {
      await page.goto(url);
      await settled(page);
      // the shared Badge: a coloured chip that must carry a word, never colour alone
      const badges = page.locator('main span.inline-flex.rounded.border.text-xs');
      expect(await badges.count(), `status chips on ${url}`).toBeGreaterThan(0);
      for (const text of await badges.allInnerTexts()) {
        expect(text.trim().length, `a chip on ${url} says something`).toBeGreaterThan(1);
      }
    }
  });
});
