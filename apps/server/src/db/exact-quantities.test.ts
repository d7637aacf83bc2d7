import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkLedger } from '../modules/maintenance/ledger-check';
import { createDataSource } from './data-source';
import { fromMicro, toMicro } from './quantities';
import { openStore } from './repositories';

const now = '2026-01-31T09:15:00.000Z';

/** Ledger rows as the app kept them in double precision: amounts in g, rounded to 1e-6. */
const entries = [
  { reason: 'received', quantity: 0.1, balanceAfter: 0.1 },
  { reason: 'adjusted', quantity: 0.2, balanceAfter: 0.3 },
  { reason: 'received', quantity: 1000.123456, balanceAfter: 1000.423456 },
  { reason: 'drawn', quantity: -0.000001, balanceAfter: 1000.423455 },
  { reason: 'drawn', quantity: -999.1, balanceAfter: 1.323455 },
];

describe('exact quantities migration', () => {
  it('when float quantities are migrated, then they become whole millionths whose sum is the balance exactly, and down restores them', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-exact-'));
    const dataSource = createDataSource(path.join(dir, 'old.sqlite'));
    await dataSource.initialize();
    try {
      await dataSource.runMigrations({ transaction: 'all' });
      // Back to the schema just before the exact-quantities migration, whatever came after it.
      const later =
        dataSource.migrations.length -
        dataSource.migrations.findIndex(
          (migration) => migration.name === 'ExactQuantities1796600000000',
        );
      for (let undo = 0; undo < later; undo += 1) {
        await dataSource.undoLastMigration({ transaction: 'all' });
      }
      // The data of an older database, written straight in, foreign keys enforced.
      const stamps = [now, now];
      await dataSource.query(
        `INSERT INTO chemicals (id, name, synonyms, physical_state, default_purity_percent, ghs_pictograms, hazard_statements, storage_group, stock_unit, restricted, notes, search_text, created_at, updated_at) VALUES (1, 'Sodium chloride', '[]', 'solid', 100, '[]', '[]', 'inorganic-general', 'g', 0, '', 'sodium chloride', ?, ?)`,
        stamps,
      );
      await dataSource.query(
        `INSERT INTO locations (id, name, kind, path, id_path, depth, storage_groups, notes, created_at, updated_at) VALUES (1, 'Room 101', 'room', 'Room 101', '/1/', 0, '[]', '', ?, ?)`,
        stamps,
      );
      await dataSource.query(
        `INSERT INTO lots (id, chemical_id, source, received_on, notes, created_at, updated_at) VALUES (1, 1, 'supplier', '2026-01-01', '', ?, ?)`,
        stamps,
      );
      await dataSource.query(
        `INSERT INTO procedures (id, title, reference, base_scale, cautions, caution_flags, created_at, updated_at) VALUES (1, 'Salt solution', '', '', '[]', '[]', ?, ?)`,
        stamps,
      );
      await dataSource.query(
        `INSERT INTO prep_plans (id, procedure_id, scale_factor, benches, overage_percent, planned_on, status, notes, created_at, updated_at) VALUES (1, 1, 1, 1, 10, '2026-02-01', 'reserved', '', ?, ?)`,
        stamps,
      );
      await dataSource.query(
        `INSERT INTO containers (id, label_code, lot_id, chemical_id, location_id, status, quantity, unit, notes, created_at, updated_at) VALUES (1, 'LW-00001', 1, 1, 1, 'open', ?, 'g', '', ?, ?)`,
        [1.323455, now, now],
      );
      for (const entry of entries) {
        await dataSource.query(
          `INSERT INTO ledger_entries (container_id, reason, quantity, unit, balance_after, note, created_at) VALUES (1, ?, ?, 'g', ?, '', ?)`,
          [entry.reason, entry.quantity, entry.balanceAfter, now],
        );
      }
      await dataSource.query(
        `INSERT INTO reservations (plan_id, container_id, quantity, unit, until, status, created_at) VALUES (1, 1, ?, 'g', '2026-02-01', 'active', ?)`,
        [0.7, now],
      );
      // In doubles the entries do not add up to the balance exactly.
      const [floats] = await dataSource.query(
        'SELECT SUM(quantity) AS total FROM ledger_entries WHERE container_id = 1',
      );
      expect(floats.total).not.toBe(1.323455);

      await dataSource.runMigrations({ transaction: 'all' });

      const [container] = await dataSource.query(
        'SELECT quantity_micro AS q, typeof(quantity_micro) AS type FROM containers WHERE id = 1',
      );
      expect(container).toEqual({ q: 1_323_455, type: 'integer' });
      const rows: { q: number; b: number }[] = await dataSource.query(
        'SELECT quantity_micro AS q, balance_after_micro AS b FROM ledger_entries ORDER BY id',
      );
      expect(rows).toEqual(
        entries.map((e) => ({ q: toMicro(e.quantity), b: toMicro(e.balanceAfter) })),
      );
      expect(rows.map((r) => r.q)).toEqual([100_000, 200_000, 1_000_123_456, -1, -999_100_000]);
      const [sum] = await dataSource.query(
        'SELECT SUM(quantity_micro) AS total FROM ledger_entries WHERE container_id = 1',
      );
      expect(sum.total).toBe(container.q);
      const [reservation] = await dataSource.query('SELECT quantity_micro AS q FROM reservations');
      expect(reservation.q).toBe(700_000);

      // The app reads them back in g, and the ledger check finds them exact.
      const repos = openStore(dataSource).repos;
      expect((await repos.containers.findRow(1))?.quantity).toBe(1.323455);
      const ledger = await repos.containers.entries(1, 1, 10);
      expect(ledger.items.map((e) => e.quantity).reverse()).toEqual(entries.map((e) => e.quantity));
      const check = await checkLedger(repos);
      expect(check).toMatchObject({ ok: true, containersChecked: 1, entriesChecked: 5 });

      // As `migration:run` does: foreign keys off while the tables are rebuilt.
      await dataSource.query('PRAGMA foreign_keys = OFF');
      for (let undo = 0; undo < later; undo += 1) {
        await dataSource.undoLastMigration({ transaction: 'all' });
      }
      await dataSource.query('PRAGMA foreign_keys = ON');
      const back: { quantity: number; balance_after: number }[] = await dataSource.query(
        'SELECT quantity, balance_after FROM ledger_entries ORDER BY id',
      );
      expect(back).toEqual(
        entries.map((e) => ({ quantity: e.quantity, balance_after: e.balanceAfter })),
      );
      const [restored] = await dataSource.query('SELECT quantity FROM containers');
      expect(restored.quantity).toBe(1.323455);
    } finally {
      await dataSource.destroy();
    }
  });
});

describe('stored quantities', () => {
  it('when a quantity is stored and read, then it is the nearest millionth, rounded the same way both sides of zero', () => {
    expect(toMicro(0.1)).toBe(100_000);
    expect(toMicro(0.3)).toBe(300_000);
    expect(toMicro(0.0000005)).toBe(1);
    expect(toMicro(-0.0000005)).toBe(-1);
    expect(toMicro(-0)).toBe(0);
    expect(toMicro(10_000_000)).toBe(10_000_000_000_000);
    expect(fromMicro(300_000)).toBe(0.3);
    expect(fromMicro('1323455')).toBe(1.323455);
    expect(fromMicro(10_000_000_000_000n)).toBe(10_000_000);
  });

  it('when a quantity cannot be stored exactly (Infinity, 1e308, a barcode times a million past 2^53), then storing it throws instead of rounding', () => {
    expect(() => toMicro(Infinity)).toThrow(RangeError);
    expect(() => toMicro(1e308)).toThrow(RangeError);
    expect(() => toMicro(2 ** 63)).toThrow(RangeError);
    expect(() => toMicro(4006381333931)).toThrow(RangeError);
  });
});
