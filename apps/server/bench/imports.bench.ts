import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { casCheckDigit } from '@lotwise/chem';
import request from 'supertest';
import { afterAll, bench, describe } from 'vitest';
import { createApp } from '../src/app';
import { createDataSource } from '../src/db/data-source';
import { hashPassword } from '../src/modules/auth/passwords';
import { csvLine } from '../src/lib/csv';
import { testConfig } from '../src/test/harness';
import { openStore } from '../src/db/repositories';

/**
 * A 10,000-row stock import over HTTP, in-process: validation (POST until ready) and commit
 * (POST …/commit until committed), each polled the way the web app follows progress.
 * `npx vitest bench --run bench/imports.bench.ts` in apps/server.
 */
const rowCount = 10_000;
const chemicalCount = 150;

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-bench-import-'));
const config = testConfig(dir);
const dataSource = createDataSource(config.databasePath);
await dataSource.initialize();
await dataSource.runMigrations({ transaction: 'all' });
const store = openStore(dataSource);
const now = new Date().toISOString();
await store.repos.users.insert({
  email: 'bench@example.test',
  displayName: 'Bench',
  role: 'admin',
  active: true,
  passwordHash: await hashPassword('bench-password', 4),
  inviteTokenHash: null,
  inviteExpiresAt: null,
  lastLoginAt: null,
  createdAt: now,
  updatedAt: now,
});
const app = createApp({ dataSource, config });
const login = await request(app)
  .post('/api/auth/login')
  .send({ email: 'bench@example.test', password: 'bench-password' });
const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;

/** Each run is another lab's file: new chemicals, places and lot numbers, generated codes. */
let run = 0;
function file(): string {
  run++;
  const header = [
    'Chemical',
    'CAS RN',
    'Formula',
    'Storage group',
    'GHS pictograms',
    'Supplier',
    'Supplier lot no.',
    'Received on',
    'Expires on',
    'Quantity',
    'Unit',
    'Tare (g)',
    'Location',
  ];
  let text = csvLine(header);
  for (let i = 0; i < rowCount; i++) {
    const c = i % chemicalCount;
    const digits = String(6_000_000 + run * 1000 + c);
    const cas = `${digits.slice(0, -2)}-${digits.slice(-2)}-${casCheckDigit(digits)}`;
    text += csvLine([
      `Bench import reagent ${run}-${c}`,
      cas,
      'NaCl',
      c % 3 ? 'low-hazard' : 'flammable',
      'GHS07',
      'Fernwood Chemicals (fictional)',
      `B${run}-${i % 400}`,
      '2025-09-01',
      '2028-09-01',
      String(50 + (i % 450)),
      i % 5 ? 'g' : 'kg',
      '120.5',
      `Bench room ${run} › Cabinet ${i % 12} › Shelf ${i % 5}`,
    ]);
  }
  return text;
}

async function until(id: number, statuses: string[]) {
  for (;;) {
    const { body } = await request(app).get(`/api/imports/${id}`).set('Cookie', cookie);
    if (statuses.includes(body.status)) return body;
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

const timings = { validate: [] as number[], commit: [] as number[] };

afterAll(async () => {
  const mean = (list: number[]) => Math.round(list.reduce((a, b) => a + b, 0) / list.length);
  console.log(
    `${rowCount.toLocaleString('en')} rows: validate ${mean(timings.validate)} ms, commit ${mean(timings.commit)} ms (mean of ${timings.commit.length})`,
  );
  await dataSource.destroy();
  rmSync(dir, { recursive: true, force: true });
});

describe(`CSV import of ${rowCount.toLocaleString('en')} rows (HTTP, in-process)`, () => {
  bench(
    'upload + validate, then commit',
    async () => {
      const text = file();
      let started = performance.now();
      const posted = await request(app)
        .post('/api/imports')
        .set('Cookie', cookie)
        .attach('file', Buffer.from(text), 'bench.csv');
      const ready = await until(posted.body.id, ['ready', 'invalid', 'failed']);
      if (ready.status !== 'ready') throw new Error(JSON.stringify(ready.errors.slice(0, 3)));
      timings.validate.push(performance.now() - started);
      started = performance.now();
      await request(app).post(`/api/imports/${ready.id}/commit`).set('Cookie', cookie);
      const done = await until(ready.id, ['committed', 'failed']);
      if (done.status !== 'committed') throw new Error(done.failure);
      timings.commit.push(performance.now() - started);
    },
    { iterations: 3, time: 0, warmupIterations: 0 },
  );
});
