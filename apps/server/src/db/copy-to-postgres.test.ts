import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, ledgerNotesOf } from '../app';
import { runDbCopy } from '../cli/db-copy-command';
import { createLogger } from '../lib/logger';
import { checkLedger } from '../modules/maintenance/ledger-check';
import {
  createTestPostgresDatabase,
  dropTestPostgresDatabase,
  onPostgres,
  testConfig,
} from '../test/harness';
import { createDataSource } from './data-source';
import { openStore } from './repositories';
import { demoAccounts, demoPassword, seedDemo } from './seed/demo-seed';
import { seedDemoOrders } from './seed/demo-orders';

/**
 * `npm run db:copy`: the demo lab (stock, runs, shared orders with payments) on an SQLite file
 * is copied into an empty PostgreSQL database. Needs both, so it runs with test:postgres.
 */
describe.skipIf(!onPostgres)('copying an SQLite database into PostgreSQL', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-copy-'));
  const file = path.join(dir, 'lab.sqlite');
  const config = testConfig(dir, { DATABASE_PATH: file });
  const databases: string[] = [];
  const lines: string[] = [];
  const io = { out: (line: string) => lines.push(line), err: (line: string) => lines.push(line) };
  let target: { name: string; url: string };

  beforeAll(async () => {
    const source = createDataSource(file);
    await source.initialize();
    await source.runMigrations({ transaction: 'all' });
    await seedDemo(source, 4, config.currency);
    await seedDemoOrders(source, config, createLogger('silent'));
    await source.destroy();
    target = await createTestPostgresDatabase();
    databases.push(target.name);
  }, 120_000);

  afterAll(async () => {
    for (const name of databases) await dropTestPostgresDatabase(name);
    rmSync(dir, { recursive: true, force: true });
  });

  it('when the demo lab is copied, then every count and sum agrees, the ledger holds, and people sign in', async () => {
    expect(await runDbCopy(['--to', target.url], config, io)).toBe(0);
    expect(lines.at(-1)).toMatch(/every count and sum agrees/);
    expect(lines.join('\n')).toMatch(/ledger_entries\s+[1-9]\d* rows/);
    expect(lines.join('\n')).toMatch(/payments.amount_minor\s+[1-9]\d* in SQLite/);

    const copied: DataSource = createDataSource(target.url);
    await copied.initialize();
    const app = createApp({ dataSource: copied, config: { ...config, databaseUrl: target.url } });
    try {
      expect((await checkLedger(openStore(copied).repos)).ok).toBe(true);
      const login = await request(app)
        .post('/api/auth/login')
        .send({ email: demoAccounts[1]!.email, password: demoPassword })
        .expect(200);
      // New rows continue after the copied ids.
      const chemical = await request(app)
        .post('/api/chemicals')
        .set('Cookie', login.headers['set-cookie']!)
        .send({ name: 'Copied-lab test salt', physicalState: 'solid', stockUnit: 'g' })
        .expect(201);
      const [highest] = await copied.query('SELECT MAX(id) AS id FROM chemicals');
      expect(chemical.body.id).toBe(highest.id);
    } finally {
      await ledgerNotesOf(app).stop();
      await copied.destroy();
    }
  });

  it('when the PostgreSQL database is not empty, then nothing is copied', async () => {
    lines.length = 0;
    expect(await runDbCopy(['--to', target.url], config, io)).toBe(1);
    expect(lines.join('\n')).toMatch(/is not empty/);
  });
});
