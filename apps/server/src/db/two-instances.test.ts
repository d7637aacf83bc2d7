import { ledgerCheckResultSchema } from '@lotwise/shared';
import type { Express } from 'express';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, ledgerNotesOf } from '../app';
import { alertsService } from '../modules/alerts/alerts.service';
import { createMailTransport } from '../modules/alerts/mail-transport';
import { outboxWorker } from '../modules/alerts/outbox-worker';
import { startSmtpSink } from '../test/smtp-sink';
import { openStore } from './repositories';
import { signedIn } from '../test/factories';
import { onPostgres, testContext } from '../test/harness';
import { preparationFactory } from '../test/preparations';
import { createDataSource } from './data-source';
import { jobLocks } from './postgres';

/**
 * Two app instances on one PostgreSQL database: each with its own DataSource (its own pool),
 * as two processes behind one proxy would be. SQLite has one writer per file and no second
 * instance, so this only runs on PostgreSQL (`npm run test:postgres`).
 */
describe.skipIf(!onPostgres)('two app instances on one PostgreSQL database', () => {
  let second: DataSource;
  let instances: Express[];
  let manager = '';
  let member = '';
  let admin = '';
  const make = preparationFactory(() => manager);

  beforeAll(async () => {
    const { config, app } = testContext();
    second = createDataSource(config.databaseUrl!);
    await second.initialize();
    instances = [app, createApp({ dataSource: second, config })];
    manager = (await signedIn('manager')).cookie;
    member = (await signedIn('member')).cookie;
    admin = (await signedIn('admin')).cookie;
  });

  afterAll(async () => {
    if (instances?.[1]) await ledgerNotesOf(instances[1]).stop();
    if (second?.isInitialized) await second.destroy();
  });

  it('when 60 draws arrive at both instances at once and together would overdraw, then the balance never goes below zero and accepted × amount is what was drawn', async () => {
    const chemical = await make.chemical('Sodium chloride', 'NaCl');
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const container = await make.container(lot.id, shelf.id, { quantity: 100, unit: 'g' });
    const amount = 3; // 60 × 3 g = 180 g > 100 g
    const responses = await Promise.all(
      Array.from({ length: 60 }, (_, i) =>
        request(instances[i % 2]!)
          .post(`/api/containers/${container.id}/draws`)
          .set('Cookie', member)
          .send({ amount, unit: 'g' }),
      ),
    );
    const statuses = responses.map((r) => r.status);
    const accepted = statuses.filter((s) => s === 201).length;
    expect(statuses.filter((s) => s !== 201 && s !== 409)).toEqual([]);
    expect(accepted).toBe(33); // floor(100 / 3)
    const detail = await request(instances[1]!)
      .get(`/api/containers/${container.id}`)
      .set('Cookie', member)
      .expect(200);
    expect(detail.body.quantity).toBeCloseTo(100 - accepted * amount, 6);
    const check = await request(instances[0]!)
      .get('/api/maintenance/ledger-check')
      .set('Cookie', admin)
      .expect(200);
    expect(ledgerCheckResultSchema.parse(check.body).ok).toBe(true);
  });

  it('when both instances receive containers at once, then every container gets its own label code', async () => {
    const chemical = await make.chemical('Sodium chloride', 'NaCl');
    const lot = await make.lot(chemical.id);
    const shelf = await make.location();
    const responses = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        request(instances[i % 2]!)
          .post('/api/containers')
          .set('Cookie', manager)
          .send({ lotId: lot.id, locationId: shelf.id, quantity: 10, unit: 'g' }),
      ),
    );
    expect(responses.map((r) => r.status)).toEqual(Array.from({ length: 20 }, () => 201));
    const codes = responses.map((r) => r.body.container.labelCode as string);
    expect(new Set(codes).size).toBe(20);
  });

  it('when one run is recorded through both instances at once, then it is recorded once and its stock drawn once', async () => {
    const made = await make.aspirin();
    const shelf = await make.location();
    const saLot = await make.lot(made.sa.id, { purityPercent: 100 });
    const sa = await make.container(saLot.id, shelf.id, { quantity: 100, unit: 'g' });
    const ac2oLot = await make.lot(made.ac2o.id);
    const ac2o = await make.container(ac2oLot.id, shelf.id, { quantity: 10, unit: 'mL' });
    const opened = await request(instances[0]!)
      .post('/api/runs')
      .set('Cookie', member)
      .send({ procedureId: made.procedure.id })
      .expect(201);
    const record = {
      lines: [
        { lineIndex: 0, draws: [{ containerId: sa.id, amount: 2, unit: 'g' }] },
        { lineIndex: 1, draws: [{ containerId: ac2o.id, amount: 5, unit: 'mL' }] },
      ],
      products: [{ portions: [{ label: 'crop', quantity: 2.1, unit: 'g', locationId: shelf.id }] }],
    };
    const responses = await Promise.all(
      instances.map((app) =>
        request(app).post(`/api/runs/${opened.body.id}/record`).set('Cookie', member).send(record),
      ),
    );
    expect(responses.map((r) => r.status).sort()).toEqual([200, 409]);
    const after = await request(instances[1]!)
      .get(`/api/containers/${ac2o.id}`)
      .set('Cookie', member)
      .expect(200);
    expect(after.body.quantity).toBeCloseTo(5, 6); // 10 mL - 5 mL, once
  });

  it('when the outbox senders of both instances run at once, then every message is delivered exactly once', async () => {
    const { store, config, dataSource } = testContext();
    const sink = await startSmtpSink();
    const [{ id: adminId }] = await dataSource.query(
      "SELECT id FROM users WHERE role = 'admin' ORDER BY id LIMIT 1",
    );
    const subjects = Array.from({ length: 30 }, (_, i) => `Shared order #${100 + i} is funded`);
    const alerts = alertsService(store, config);
    const at = new Date('2026-03-09T09:00:00.000Z');
    await store.transaction(async (repos) => {
      for (const subject of subjects) {
        await alerts.notify(
          repos,
          {
            kind: 'order-opened',
            recipients: [adminId],
            subject,
            text: 'Every share is paid.',
            link: '/orders/100',
            dedupKey: `two-instances:${subject}`,
          },
          at,
        );
      }
    });
    const senders = [store, openStore(second)].map((onInstance) => {
      const transport = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${sink.port}` })!;
      const worker = outboxWorker({ store: onInstance, transport, config, clock: () => at });
      return { worker, transport };
    });
    try {
      for (let round = 0; round < 4; round++) {
        await Promise.all(senders.map(({ worker }) => worker.runOnce()));
      }
      const delivered = sink.messages.map((m) => m.subject).filter((s) => subjects.includes(s!));
      expect(delivered.sort()).toEqual([...subjects].sort());
    } finally {
      for (const { transport } of senders) transport.close();
      await sink.close();
    }
  });

  it('when one instance is committing an import, then a look at it from the other leaves it alone; once the first is gone, then it shows as failed', async () => {
    const stores = [testContext().store, openStore(second)];
    const now = new Date().toISOString();
    const id = await stores[0]!.repos.imports.insert({
      kind: 'stock',
      supplierId: null,
      status: 'committing',
      fileName: 'shelf-count.csv',
      userId: null,
      totalRows: 20000,
      processedRows: 0,
      errorCount: 0,
      errors: [],
      warnings: [],
      summary: null,
      rows: null,
      failure: null,
      createdAt: now,
      updatedAt: now,
      committedAt: null,
    });
    const job = { kind: jobLocks.imports, id };
    const release = await stores[0]!.holdJob(job);
    expect(release).not.toBeNull();
    expect(await stores[1]!.holdJob(job)).toBeNull();
    expect(await stores[1]!.jobIsFree(job)).toBe(false);
    const seen = await request(instances[1]!)
      .get(`/api/imports/${id}`)
      .set('Cookie', manager)
      .expect(200);
    expect(seen.body.status).toBe('committing');

    await release!(); // as when the first instance's process (and its connection) ends
    expect(await stores[1]!.jobIsFree(job)).toBe(true);
    const after = await request(instances[1]!)
      .get(`/api/imports/${id}`)
      .set('Cookie', manager)
      .expect(200);
    expect(after.body.status).toBe('failed');
  });

  it('when both instances claim the scheduled alert evaluation at once, then one runs it', async () => {
    const stores = [testContext().store, openStore(second)];
    const now = new Date().toISOString();
    const cutoff = new Date(Date.now() - 3_600_000).toISOString();
    const claims = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        stores[i % 2]!.repos.scheduledRuns.claimTurn('two-instance-job', now, cutoff),
      ),
    );
    expect(claims.filter(Boolean)).toHaveLength(1);
  });
});
