import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { nowIso } from '../../db/sql';
import { signedIn, stockFactory } from '../../test/factories';
import { alertRulesSettled, testContext } from '../../test/harness';
import { createLogger } from '../../lib/logger';
import { alertsService } from './alerts.service';
import { ledgerNotesWorker } from './ledger-notes-worker';

type Person = Awaited<ReturnType<typeof signedIn>>;
let manager: Person;
const make = stockFactory(() => manager.cookie);

beforeAll(async () => {
  manager = await signedIn('manager');
});

const notesOf = (chemicalId: number): Promise<{ attempts: number; last_error: string | null }[]> =>
  testContext().dataSource.query('SELECT * FROM ledger_change_notes WHERE chemical_id = ?', [
    chemicalId,
  ]);
const lowStockMails = async (chemicalId: number): Promise<unknown[]> =>
  testContext().dataSource.query('SELECT id FROM outbox WHERE dedup_key LIKE ?', [
    `low-stock:chemical:${chemicalId}:%`,
  ]);

/** A chemical with a reorder point of 100 g and a 150 g container. */
async function stocked() {
  const chemical = await make.chemical({ reorderPoint: 100 });
  const shelf = await make.location();
  const lot = await make.lot(chemical.id);
  const container = await make.container(lot.id, shelf.id, { quantity: 150, unit: 'g' });
  await alertRulesSettled();
  return { chemical, container };
}

function draw(containerId: number, amount: number) {
  return request(testContext().app)
    .post(`/api/containers/${containerId}/draws`)
    .set('Cookie', manager.cookie)
    .send({ amount, unit: 'g' });
}

describe('alert rules after a ledger change', () => {
  it('when a draw crosses the reorder point, then the draw commits a note and the rules run after it: the note is gone and the e-mails are queued', async () => {
    const { chemical, container } = await stocked();
    await draw(container.id, 60).expect(201);
    await alertRulesSettled();
    expect(await notesOf(chemical.id)).toEqual([]);
    expect((await lowStockMails(chemical.id)).length).toBeGreaterThan(0);
  });

  it('when a draw is refused, then it leaves no note (the note is part of its transaction)', async () => {
    const { chemical, container } = await stocked();
    const { dataSource } = testContext();
    const [before] = await dataSource.query('SELECT COUNT(*) AS n FROM ledger_change_notes');
    await draw(container.id, 500).expect(409);
    const [after] = await dataSource.query('SELECT COUNT(*) AS n FROM ledger_change_notes');
    expect(after.n).toBe(before.n);
    expect(await notesOf(chemical.id)).toEqual([]);
  });

  it('when the rules fail, then the notes stay with the error and are evaluated once they fall due again', async () => {
    const { store, config } = testContext();
    const { chemical } = await stocked();
    // a note as a draw leaves it, e.g. one the server had not evaluated when it stopped
    await store.repos.ledgerNotes.noteChanges([chemical.id], nowIso());
    await testContext().dataSource.query(
      'UPDATE containers SET quantity_micro = 50000000 WHERE chemical_id = ?',
      [chemical.id],
    );
    const alerts = alertsService(store, config);
    let failures = 1;
    const worker = ledgerNotesWorker({
      store,
      logger: createLogger('silent'),
      retryBaseMs: 30,
      alerts: {
        evaluate: async (...args) => {
          if (failures-- > 0) throw new Error('the mail template could not be read');
          return alerts.evaluate(...args);
        },
      },
    });
    worker.kick();
    await worker.idle();
    expect(await notesOf(chemical.id)).toEqual([
      expect.objectContaining({ attempts: 1, last_error: 'the mail template could not be read' }),
    ]);
    expect(await lowStockMails(chemical.id)).toEqual([]);

    await new Promise((resolve) => setTimeout(resolve, 40));
    worker.kick();
    await worker.idle();
    expect(await notesOf(chemical.id)).toEqual([]);
    expect((await lowStockMails(chemical.id)).length).toBeGreaterThan(0);
    await worker.stop();
  });

  it('when the worker starts, then it evaluates notes an earlier run left behind', async () => {
    const { store, config } = testContext();
    const { chemical } = await stocked();
    await store.repos.ledgerNotes.noteChanges([chemical.id], nowIso());
    const worker = ledgerNotesWorker({
      store,
      logger: createLogger('silent'),
      alerts: alertsService(store, config),
    });
    worker.start();
    await worker.idle();
    await worker.stop();
    expect(await notesOf(chemical.id)).toEqual([]);
  });
});
