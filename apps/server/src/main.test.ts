import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { demoPassword } from './db/seed/demo-seed';

const serverDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const tsx = path.resolve(serverDir, '../../node_modules/.bin/tsx');
const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-main-'));

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

interface Started {
  child: ChildProcess;
  output: () => string;
  exited: Promise<number | null>;
}

/** How the server is run: from source under tsx (`npm run dev`), or compiled (`npm start`). */
const fromSource = [tsx, 'apps/server/src/main.ts'];
const compiled = [process.execPath, '--enable-source-maps', 'apps/server/dist/main.js'];

/** Starts the server from the repository root, from source unless told otherwise. */
function start(env: NodeJS.ProcessEnv, args: string[] = [], command = fromSource): Started {
  let output = '';
  const [program = tsx, ...programArgs] = command;
  const child = spawn(program, [...programArgs, ...args], {
    cwd: path.resolve(serverDir, '../..'),
    env: { ...process.env, BCRYPT_COST: '4', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (chunk) => (output += String(chunk)));
  child.stderr?.on('data', (chunk) => (output += String(chunk)));
  const exited = new Promise<number | null>((resolve) => child.once('exit', resolve));
  return { child, output: () => output, exited };
}

async function waitForHealth(url: string, started: Started): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (started.child.exitCode !== null) throw new Error(`Server exited:\n${started.output()}`);
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 150));
  }
  throw new Error(`No health answer in time:\n${started.output()}`);
}

const running: Started[] = [];
afterAll(async () => {
  for (const started of running) {
    if (started.child.exitCode === null) {
      started.child.kill('SIGTERM');
      await started.exited;
    }
  }
  rmSync(dir, { recursive: true, force: true });
});

describe('src/main.ts', { timeout: 90_000 }, () => {
  it('when started on an empty database, then it migrates, seeds, serves health and a demo user can sign in', async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const started = start({ PORT: String(port), DATABASE_PATH: path.join(dir, 'main.sqlite') });
    running.push(started);
    await waitForHealth(url, started);

    const health = await (await fetch(`${url}/api/health`)).json();
    expect(health).toMatchObject({ status: 'ok', database: 'ok' });
    const login = await fetch(`${url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'instructor@example.test', password: demoPassword }),
    });
    expect(login.status).toBe(200);
    expect(((await login.json()) as { user: { role: string } }).user.role).toBe('admin');
    expect(started.output()).toContain(`Lotwise is running at ${url}`);
    expect(started.output()).toContain('instructor@example.test');

    started.child.kill('SIGTERM');
    expect(await started.exited).toBe(0);
  });

  it('when PORT is bad, then the process stops with exit code 1 and a message naming PORT', async () => {
    const started = start({ PORT: 'eighty', DATABASE_PATH: path.join(dir, 'bad.sqlite') });
    running.push(started);
    expect(await started.exited).toBe(1);
    expect(started.output()).toMatch(/Invalid configuration: PORT/);
  });

  it('when production starts on a missing database file, then it exits 1 naming the file and creates nothing', async () => {
    const file = path.join(dir, 'lost-volume', 'lotwise.sqlite');
    const started = start({
      NODE_ENV: 'production',
      PORT: String(await freePort()),
      DATABASE_PATH: file,
    });
    running.push(started);
    expect(await started.exited).toBe(1);
    expect(started.output()).toContain(`There is no database file at ${file}`);
    expect(started.output()).toMatch(/restore the file from your latest backup/);
    expect(existsSync(file)).toBe(false);
  });

  it('when production starts with --init, then it creates an empty database without the demo lab', async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const file = path.join(dir, 'new-lab.sqlite');
    const started = start(
      { NODE_ENV: 'production', PORT: String(port), DATABASE_PATH: file, DEV_MAIL: 'false' },
      ['--init'],
    );
    running.push(started);
    await waitForHealth(url, started);
    expect(existsSync(file)).toBe(true);
    const login = await fetch(`${url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'instructor@example.test', password: demoPassword }),
    });
    expect(login.status).toBe(401);
    expect(started.output()).not.toContain(demoPassword);
    expect(started.output()).toMatch(
      /no users yet: create the first admin with npm run user:create/,
    );
    started.child.kill('SIGTERM');
    expect(await started.exited).toBe(0);
  });

  it('when started in development without payment keys, then the local payments fake starts beside it and its address is printed', async () => {
    const port = await freePort();
    const fakePort = await freePort();
    const started = start({
      NODE_ENV: 'development',
      PORT: String(port),
      DATABASE_PATH: path.join(dir, 'with-fake.sqlite'),
      DEV_MAIL: 'false',
      SEED_DEMO: 'false',
      ALERT_INTERVAL_SECONDS: '0',
      STRIPE_API_URL: `http://127.0.0.1:${fakePort}`,
    });
    running.push(started);
    await waitForHealth(`http://127.0.0.1:${port}`, started);
    expect(started.output()).toContain(
      `Local payments fake (test cards, no real money): http://127.0.0.1:${fakePort}`,
    );
    const answer = await fetch(`http://127.0.0.1:${fakePort}/v1/checkout/sessions/cs_test_none`);
    expect(answer.status).toBe(401);
    started.child.kill('SIGTERM');
    expect(await started.exited).toBe(0);
  });

  it('when the database file is damaged, then the process exits 1 with a message naming the file', async () => {
    const file = path.join(dir, 'damaged.sqlite');
    writeFileSync(file, Buffer.alloc(8192, 0x5a));
    const started = start({
      PORT: String(await freePort()),
      DATABASE_PATH: file,
      DEV_MAIL: 'false',
    });
    running.push(started);
    expect(await started.exited).toBe(1);
    expect(started.output()).toContain(`The database file ${file} cannot be used`);
    expect(started.output()).not.toMatch(/\n\s+at /);
  });
});

describe('dist/main.js, the server `npm start` runs', { timeout: 90_000 }, () => {
  it('when compiled ahead and started on an empty database, then it migrates, seeds, serves the web app, and a demo user signs in and draws', async () => {
    execFileSync(process.execPath, ['build.mjs'], { cwd: serverDir, stdio: 'pipe' });
    const web = path.join(dir, 'compiled-web');
    mkdirSync(web, { recursive: true });
    writeFileSync(path.join(web, 'index.html'), '<!doctype html><title>Lotwise</title>');
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const started = start(
      {
        PORT: String(port),
        DATABASE_PATH: path.join(dir, 'compiled', 'lotwise.sqlite'),
        WEB_DIST: web,
        DEV_MAIL: 'false',
        PAYMENTS_FAKE: 'false',
        ALERT_INTERVAL_SECONDS: '0',
      },
      [],
      compiled,
    );
    running.push(started);
    await waitForHealth(url, started);
    expect(started.output()).toContain('Applied migrations: Initial1796160000000');
    expect(started.output()).toContain('Seeded the demo lab');

    const page = await fetch(`${url}/chemicals`);
    expect(await page.text()).toContain('<title>Lotwise</title>');
    const login = await fetch(`${url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: url },
      body: JSON.stringify({ email: 'technician@example.test', password: demoPassword }),
    });
    expect(login.status).toBe(200);
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0] ?? '';
    const list = (await (
      await fetch(`${url}/api/containers?status=open`, { headers: { Cookie: cookie } })
    ).json()) as { items: { id: number; quantity: number; unit: string }[] };
    const container = list.items.find((item) => item.quantity > 1);
    if (!container) throw new Error('The demo lab has no open container to draw from');
    const draw = await fetch(`${url}/api/containers/${container.id}/draws`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Cookie: cookie, Origin: url },
      body: JSON.stringify({ amount: 0.5, unit: container.unit, confirm: true }),
    });
    expect(draw.status).toBe(201);
    const drawn = (await draw.json()) as { container: { quantity: number } };
    expect(drawn.container.quantity).toBeCloseTo(container.quantity - 0.5, 6);

    started.child.kill('SIGTERM');
    expect(await started.exited).toBe(0);
  });
});
