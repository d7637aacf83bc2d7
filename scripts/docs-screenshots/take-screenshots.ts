import { expect, test, type Browser, type BrowserContext, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import path from 'node:path';

/**
 * The pictures of the README and docs/user-guide.md, taken from the running demo lab: desktop
 * (1280 wide) and phone (390 × 844) for the everyday jobs. Names are kept: the documents link
 * them. Each picture is one test, so a page that changed shows up by name.
 */

const out = path.resolve(
  process.env.DOCS_SCREENSHOTS_OUT ?? path.join(import.meta.dirname, '../../docs/screenshots'),
);
mkdirSync(out, { recursive: true });

const password = 'lotwise-demo-2026';
const accounts = {
  admin: 'instructor@example.test',
  manager: 'technician@example.test',
  member: 'member.one@example.test',
} as const;
type Account = keyof typeof accounts;

const desktop = { viewport: { width: 1280, height: 900 } };
const phone = {
  viewport: { width: 390, height: 844 },
  deviceScaleFactor: 2,
  isMobile: true,
  hasTouch: true,
};
type Device = typeof desktop | typeof phone;

const sessions = new Map<Account, Awaited<ReturnType<BrowserContext['storageState']>>>();

async function session(browser: Browser, who: Account) {
  const known = sessions.get(who);
  if (known) return known;
  const context = await browser.newContext();
  const response = await context.request.post('/api/auth/login', {
    data: { email: accounts[who], password },
  });
  expect(response.ok(), `sign-in as ${who}`).toBe(true);
  const state = await context.storageState();
  await context.close();
  sessions.set(who, state);
  return state;
}

async function open(browser: Browser, who: Account | null, device: Device = desktop) {
  const context = await browser.newContext({
    ...device,
    storageState: who ? await session(browser, who) : undefined,
  });
  return context.newPage();
}

/** Waits for the page's heading and for anything still loading. */
async function settled(page: Page) {
  await expect(page.locator('h1').first()).toBeVisible();
  await expect(page.locator('[role="status"]').filter({ hasText: /loading|opening/i })).toHaveCount(
    0,
  );
  await expect(page.locator('[aria-busy="true"]')).toHaveCount(0);
  await page.evaluate(() => document.fonts.ready);
}

/**
 * Saves the picture and closes the page. A whole page is taken by making the window as tall
 * as the page (a full-page capture would paint the sticky header and section tabs mid-page).
 */
async function shot(page: Page, name: string, options: { fullPage?: boolean } = {}) {
  if (options.fullPage) {
    const width = page.viewportSize()!.width;
    const height = await page.evaluate(() => document.documentElement.scrollHeight);
    await page.setViewportSize({ width, height: Math.min(Math.max(height, 900), 3000) });
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.waitForTimeout(300);
  }
  await page.screenshot({ path: path.join(out, `${name}.png`) });
  await page.context().close();
}

async function visit(page: Page, url: string) {
  await page.goto(url);
  await settled(page);
}

async function json<T>(page: Page, url: string): Promise<T> {
  const response = await page.request.get(url);
  expect(response.ok(), url).toBe(true);
  return (await response.json()) as T;
}

interface Listed<T> {
  items: T[];
}
interface ContainerRow {
  id: number;
  labelCode: string;
  chemical: { id: number; name: string };
}

async function containerOf(page: Page, query: string): Promise<ContainerRow> {
  const list = await json<Listed<ContainerRow>>(
    page,
    `/api/containers?q=${encodeURIComponent(query)}&status=open&pageSize=1`,
  );
  expect(list.items.length, `an open container of ${query}`).toBeGreaterThan(0);
  return list.items[0]!;
}

async function orderIds(page: Page) {
  const orders = await json<Listed<{ id: number; status: string }>>(page, '/api/orders');
  return {
    open: orders.items.find((o) => o.status === 'open')!.id,
    closed: orders.items.find((o) => o.status === 'closed')!.id,
  };
}

test('sign-in', async ({ browser }) => {
  const page = await open(browser, null);
  await visit(page, '/sign-in');
  await shot(page, 'sign-in');
});

test('chemicals', async ({ browser }) => {
  let page = await open(browser, 'manager');
  await visit(page, '/chemicals');
  await shot(page, 'chemicals-list');

  page = await open(browser, 'manager');
  const chemicals = await json<Listed<{ id: number }>>(page, '/api/chemicals?q=acetic%20anhydride');
  await visit(page, `/chemicals/${chemicals.items[0]!.id}`);
  await shot(page, 'chemical-detail', { fullPage: true });

  page = await open(browser, 'manager');
  await visit(page, '/chemicals/new');
  await page.getByLabel('Name', { exact: true }).fill('Copper(II) sulfate pentahydrate');
  await page.getByLabel('Formula').fill('CuSO4·5H2O');
  await page.getByLabel('Formula').blur();
  await shot(page, 'chemical-form', { fullPage: true });
});

test('stock overview, containers and places', async ({ browser }) => {
  let page = await open(browser, 'member');
  await visit(page, '/stock');
  await shot(page, 'stock-overview');

  page = await open(browser, 'member');
  await visit(page, '/stock/containers?expiry=month');
  await shot(page, 'containers-expiring');

  page = await open(browser, 'member');
  await visit(page, '/stock/locations');
  await shot(page, 'locations', { fullPage: true });

  page = await open(browser, 'member');
  await visit(page, '/stock/segregation');
  await shot(page, 'segregation');
});

test('a draw at the shelf, at a desk and on a phone', async ({ browser }) => {
  for (const [device, name] of [
    [desktop, 'container-draw'],
    [phone, 'container-draw-phone'],
  ] as const) {
    const page = await open(browser, 'member', device);
    const found = await containerOf(page, 'salicylic acid');
    const container = await json<{ tareMass: number; quantity: number }>(
      page,
      `/api/containers/${found.id}`,
    );
    await visit(page, `/stock/containers/${found.id}`);
    const form = page.getByRole('form', { name: 'Record a draw' });
    // what the balance would show after taking about 2.5 g
    const gross = (container.tareMass + container.quantity - 2.5).toFixed(2);
    await form.locator('input[name="value"]').fill(gross);
    await form.locator('input[name="value"]').scrollIntoViewIfNeeded();
    await shot(page, name, { fullPage: device === desktop });
  }
});

test('receiving and importing stock, labels', async ({ browser }) => {
  let page = await open(browser, 'manager');
  await visit(page, '/stock/receive');
  await shot(page, 'receive', { fullPage: true });

  page = await open(browser, 'manager');
  await visit(page, '/stock/import');
  await page
    .locator('input[type="file"]')
    .first()
    .setInputFiles(path.resolve(import.meta.dirname, '../../docs/examples/stock-import.csv'));
  await expect(page.getByRole('button', { name: /^Import/ }).last()).toBeVisible();
  await shot(page, 'import-preview', { fullPage: true });

  page = await open(browser, 'manager');
  const container = await containerOf(page, 'acetic anhydride');
  await visit(page, `/stock/labels?ids=${container.id}`);
  await shot(page, 'labels');
});

test('checking stock before a preparation, at a desk and on a phone', async ({ browser }) => {
  for (const [device, name] of [
    [desktop, 'plan-shortfall'],
    [phone, 'plan-shortfall-phone'],
  ] as const) {
    const page = await open(browser, 'manager', device);
    await visit(page, '/preparations/plans/new');
    const form = page.getByRole('form', { name: 'Plan a session' });
    await form
      .getByLabel('Procedure')
      .selectOption({ label: 'Dibenzalacetone by aldol condensation' });
    await form.getByLabel('Scale per bench').fill('1/4');
    await form.getByLabel('Benches or groups').fill('8');
    await form.getByRole('button', { name: 'Check stock for this session' }).click();
    await expect(page.getByRole('heading', { name: 'Stock check' })).toBeVisible();
    await settled(page);
    await page.getByRole('heading', { name: 'Stock check' }).scrollIntoViewIfNeeded();
    await shot(page, name, { fullPage: device === desktop });
  }
});

test('the dispensing sheet and a held container', async ({ browser }) => {
  let page = await open(browser, 'manager');
  const plans = await json<Listed<{ id: number }>>(page, '/api/plans');
  // the demo lab's own plan (the oldest), which has enough of everything
  const plan = Math.min(...plans.items.map((p) => p.id));
  await visit(page, `/preparations/plans/${plan}`);
  await page.getByRole('button', { name: 'Reserve', exact: true }).click();
  await expect(page.getByRole('table', { name: 'Held for this plan' })).toBeVisible();
  await visit(page, `/preparations/plans/${plan}/dispensing`);
  await shot(page, 'dispensing');

  page = await open(browser, 'manager');
  const held = await json<{ reservations: { containerId: number }[] }>(page, `/api/plans/${plan}`);
  const containerId = held.reservations[0]?.containerId;
  expect(containerId, 'the plan holds a container').toBeDefined();
  await visit(page, `/stock/containers/${containerId}`);
  await shot(page, 'container-hold', { fullPage: true });
});

test('procedures and runs, at a desk and on a phone', async ({ browser }) => {
  let page = await open(browser, 'member');
  const procedures = await json<Listed<{ id: number; title: string }>>(page, '/api/procedures');
  const aspirin = procedures.items.find((p) => p.title.startsWith('Aspirin'))!;
  await visit(page, `/preparations/procedures/${aspirin.id}`);
  await shot(page, 'procedure', { fullPage: true });

  page = await open(browser, 'member');
  const runs = await json<Listed<{ id: number }>>(page, '/api/runs?status=recorded');
  await visit(page, `/preparations/runs/${runs.items[0]!.id}`);
  await shot(page, 'run-recorded', { fullPage: true });

  page = await open(browser, 'member', phone);
  await visit(page, `/preparations/runs/new?procedureId=${aspirin.id}`);
  await page.getByRole('button', { name: 'Start recording' }).click();
  await expect(page.getByRole('form', { name: 'Record the run' })).toBeVisible();
  await settled(page);
  // past the hazards (read before the session) to the first line to fill in
  await page
    .getByRole('heading', { name: 'What was really used' })
    .evaluate((heading) => heading.scrollIntoView({ block: 'start' }));
  await page.evaluate(() => window.scrollBy(0, -80));
  await shot(page, 'run-record-phone');
});

test('alerts and a low-stock e-mail, at a desk and on a phone', async ({ browser }) => {
  let page = await open(browser, 'manager');
  await visit(page, '/alerts');
  await shot(page, 'alerts');

  page = await open(browser, 'admin');
  const evaluated = await page.request.post('/api/alerts/evaluate');
  expect(evaluated.ok()).toBe(true);
  // the local inbox listens two ports above the app
  const app = new URL(test.info().project.use.baseURL!);
  const inbox = `http://127.0.0.1:${Number(app.port) + 2}`;
  let mail: { id: string; subject: string; html?: string } | undefined;
  await expect
    .poll(
      async () => {
        const mails = (await (await page.request.get(`${inbox}/api/email`)).json()) as {
          id: string;
          subject: string;
          html?: string;
        }[];
        mail = mails.find((m) => m.subject.startsWith('Low stock'));
        return mail !== undefined;
      },
      { timeout: 30_000, message: 'a low-stock e-mail in the local inbox' },
    )
    .toBe(true);
  // the message alone, as a mail program shows it
  const html =
    mail!.html ?? (await (await page.request.get(`${inbox}/api/email/${mail!.id}/html`)).text());
  await page.setViewportSize({ width: 720, height: 900 });
  await page.setContent(html);
  await shot(page, 'low-stock-email', { fullPage: true });

  page = await open(browser, 'member', phone);
  await visit(page, '/alerts');
  await shot(page, 'alerts-phone');
});

test('restock, suppliers and shared orders, at a desk and on a phone', async ({ browser }) => {
  let page = await open(browser, 'manager');
  await visit(page, '/orders/restock');
  await shot(page, 'restock', { fullPage: true });

  page = await open(browser, 'manager');
  const suppliers = await json<Listed<{ id: number }>>(page, '/api/suppliers');
  await visit(page, `/purchasing/suppliers/${suppliers.items[0]!.id}`);
  await shot(page, 'supplier');

  page = await open(browser, 'manager');
  const orders = await orderIds(page);
  await visit(page, `/orders/${orders.open}`);
  await shot(page, 'order-coordinator', { fullPage: true });

  page = await open(browser, 'member', phone);
  await visit(page, `/orders/${orders.open}`);
  await shot(page, 'order-phone');

  page = await open(browser, 'manager');
  await visit(page, `/orders/${orders.closed}`);
  await shot(page, 'order-received', { fullPage: true });

  page = await open(browser, 'manager');
  await visit(page, `/orders/${orders.closed}/money`);
  await shot(page, 'order-money', { fullPage: true });

  page = await open(browser, 'member');
  await visit(page, '/purchases');
  await shot(page, 'my-purchases');

  page = await open(browser, 'member');
  await visit(page, `/orders/${orders.closed}/receipt`);
  await shot(page, 'receipt', { fullPage: true });
});

test('the start page and the help page, at a desk and on a phone', async ({ browser }) => {
  for (const [device, name] of [
    [desktop, 'start-page'],
    [phone, 'start-page-phone'],
  ] as const) {
    const page = await open(browser, 'manager', device);
    await visit(page, '/');
    await shot(page, name, { fullPage: device === desktop });
  }

  const page = await open(browser, 'member');
  await visit(page, '/help');
  await shot(page, 'help');
});

test('admin pages', async ({ browser }) => {
  let page = await open(browser, 'admin');
  await visit(page, '/admin/users');
  await shot(page, 'admin-users');

  page = await open(browser, 'admin');
  await visit(page, '/admin/backups');
  await shot(page, 'admin-backups');
});

test('the safety data sheet of a chemical', async ({ browser }) => {
  const page = await open(browser, 'manager');
  const chemicals = await json<Listed<{ id: number }>>(page, '/api/chemicals?q=ethanol');
  const ethanol = chemicals.items[0]!.id;
  // an invented one-page PDF stands in for the supplier's sheet
  const uploaded = await page.request.post(`/api/chemicals/${ethanol}/sds`, {
    multipart: {
      file: {
        name: 'ethanol-sds.pdf',
        mimeType: 'application/pdf',
        buffer: Buffer.from('%PDF-1.4\n% Lotwise demo sheet\n%%EOF\n'),
      },
    },
  });
  expect(uploaded.ok(), 'the SDS upload').toBe(true);
  await visit(page, `/stock/chemicals/${ethanol}`);
  await page.getByRole('heading', { name: 'Safety data sheet' }).scrollIntoViewIfNeeded();
  await shot(page, 'sds');
});
