import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../db/data-source';
import { openStore } from '../../db/repositories';
import { signedIn } from '../../test/factories';
import { onPostgres, testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';
import { checkLedger } from '../maintenance/ledger-check';
import { countRows } from './database-copy';
import { restoreDatabase } from './restore';
import { takeBackup } from './take-backup';

/** What must come back identical: rows of every table, the ledger's sums, every balance. */
function figures(db: Database.Database) {
  return {
    rows: countRows(db),
    ledger: db
      .prepare(
        'SELECT unit, COUNT(*) AS entries, SUM(quantity_micro) AS total FROM ledger_entries GROUP BY unit ORDER BY unit',
      )
      .all(),
    balances: db
      .prepare(
        `SELECT c.id, c.quantity_micro AS stored,
                (SELECT SUM(e.quantity_micro) FROM ledger_entries e WHERE e.container_id = c.id) AS summed
           FROM containers c ORDER BY c.id`,
      )
      .all() as { id: number; stored: number; summed: number | null }[],
  };
}

const restoredDir = mkdtempSync(path.join(tmpdir(), 'lotwise-restored-'));
afterAll(() => rmSync(restoredDir, { recursive: true, force: true }));

let manager = '';
let member = '';
const make = preparationFactory(() => manager);
beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
});

const post = (route: string, body: object) =>
  request(testContext().app).post(route).set('Cookie', member).send(body);

// backups copy the SQLite file; PostgreSQL is backed up with pg_dump (docs/operations.md)
describe.skipIf(onPostgres)('a backup taken while draws and runs are recorded', () => {
  it('when it is restored into a new place, then counts, ledger sums and every balance equal the database at the backup moment', async () => {
    const { config } = testContext();
    const made = await make.aspirin();
    const shelf = await make.location();
    const saLot = await make.lot(made.sa.id, { purityPercent: 100 });
    const ac2oLot = await make.lot(made.ac2o.id);
    const bottles = await Promise.all(
      Array.from({ length: 6 }, (_, i) =>
        i % 2 === 0
          ? make.container(saLot.id, shelf.id, { quantity: 5000, unit: 'g' })
          : make.container(ac2oLot.id, shelf.id, { quantity: 5000, unit: 'mL' }),
      ),
    );
    const [sa, ac2o] = [bottles[0]!, bottles[1]!];

    // Writers: members drawing from every bottle, and runs opened and recorded, until told to stop.
    let stop = false;
    let draws = 0;
    let runs = 0;
    const drawing = async (bottle: (typeof bottles)[number]) => {
      while (!stop) {
        const unit = bottle.unit;
        await post(`/api/containers/${bottle.id}/draws`, { amount: 0.125, unit }).expect(201);
        draws++;
      }
    };
    const running = async () => {
      while (!stop) {
        const run = await post('/api/runs', { procedureId: made.procedure.id }).expect(201);
        await post(`/api/runs/${run.body.id}/record`, {
          performedOn: '2026-03-02',
          lines: [
            { lineIndex: 0, draws: [{ containerId: sa.id, amount: 2, unit: 'g' }] },
            { lineIndex: 1, draws: [{ containerId: ac2o.id, amount: 5, unit: 'mL' }] },
          ],
          products: [
            { portions: [{ label: 'crop', quantity: 2.1, unit: 'g', locationId: shelf.id }] },
          ],
        }).expect(200);
        runs++;
      }
    };
    const writers = [...bottles.map(drawing), running(), running()];
    while (draws < 20 || runs < 2) await new Promise((resolve) => setTimeout(resolve, 5));

    let atBackup: ReturnType<typeof figures> | null = null;
    const before = { draws, runs };
    const backup = await takeBackup(config, 'manual', {
      // One page per step: the backup spans many turns of the event loop, writes in between.
      pagesPerStep: 1,
      atSnapshot: (db) => {
        atBackup = figures(db);
      },
    });
    const during = { draws: draws - before.draws, runs: runs - before.runs };
    stop = true;
    await Promise.all(writers);

    const restoredPath = path.join(restoredDir, 'lotwise.sqlite');
    const restored = restoreDatabase(restoredPath, backup.file);
    expect(restored.replacedBy).toBeNull();
    const db = new Database(restoredPath, { readonly: true });
    const afterRestore = figures(db);
    db.close();
    const live = new Database(config.databasePath, { readonly: true });
    const liveNow = figures(live);
    live.close();

    expect(atBackup).not.toBeNull();
    const snapshot = atBackup!;
    expect(afterRestore).toEqual(snapshot);
    expect(backup.rowCounts).toEqual(snapshot.rows);
    for (const balance of afterRestore.balances) expect(balance.stored).toBe(balance.summed);
    // The writers really wrote while the backup was being copied, and after its moment.
    expect(during.draws + during.runs).toBeGreaterThan(0);
    expect(liveNow.rows.ledger_entries).toBeGreaterThan(snapshot.rows.ledger_entries!);

    const dataSource = createDataSource(restoredPath);
    await dataSource.initialize();
    const ledger = await checkLedger(openStore(dataSource).repos);
    await dataSource.destroy();
    expect(ledger).toMatchObject({ ok: true });

    console.log(
      `backup under load: ${snapshot.rows.ledger_entries} ledger entries, ${snapshot.rows.runs} runs, ${snapshot.balances.length} containers restored identical; ${during.draws} draws and ${during.runs} runs recorded while it was copied (${backup.bytes} bytes, one page per step)`,
    );
  });
});
