import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { createDataSource, migrations } from './data-source';
import {
  createTestPostgresDatabase,
  dropTestPostgresDatabase,
  onPostgres,
  testContext,
} from '../test/harness';

async function tables(dataSource: ReturnType<typeof createDataSource>): Promise<string[]> {
  if (dataSource.options.type === 'postgres') {
    const names: { name: string }[] = await dataSource.query(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE' ORDER BY name",
    );
    return names.map((row) => row.name);
  }
  const rows: { name: string }[] = await dataSource.query(
    "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name",
  );
  return rows.map((row) => row.name);
}

describe('migrations', () => {
  it('when run on an empty file, then every table exists, and undoing the last migration removes them', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-migrate-'));
    const dataSource = createDataSource(path.join(dir, 'fresh.sqlite'));
    await dataSource.initialize();
    try {
      const applied = await dataSource.runMigrations({ transaction: 'all' });
      expect(applied.map((m) => m.name)).toEqual(migrations.map((m) => m.name));
      expect(await tables(dataSource)).toEqual([
        'alert_preferences',
        'audit_events',
        'catalog_items',
        'chemicals',
        'containers',
        'imports',
        'lab_areas',
        'ledger_change_notes',
        'ledger_entries',
        'locations',
        'lots',
        'migrations',
        'order_lines',
        'order_shares',
        'orders',
        'outbox',
        'payment_events',
        'payments',
        'prep_plans',
        'procedure_lines',
        'procedures',
        'purchase_requests',
        'reservations',
        'rule_sets',
        'run_inputs',
        'run_photos',
        'run_products',
        'run_timeline_entries',
        'runs',
        'scheduled_runs',
        'stocktakes',
        'suppliers',
        'users',
        'waste_addition_chemicals',
        'waste_additions',
        'waste_areas',
        'waste_containers',
        'waste_pickups',
      ]);
      expect(await dataSource.showMigrations()).toBe(false);

      for (let i = 0; i < migrations.length; i++)
        await dataSource.undoLastMigration({ transaction: 'all' });
      expect(await tables(dataSource)).toEqual(['migrations']);

      // And forward again: the down really reverses the up.
      await dataSource.runMigrations({ transaction: 'all' });
      expect(await tables(dataSource)).toContain('chemicals');
    } finally {
      await dataSource.destroy();
    }
  });

  it.runIf(onPostgres)(
    'when run on an empty PostgreSQL database, then every table exists, undoing every migration leaves none, and they run again',
    async () => {
      const database = await createTestPostgresDatabase();
      const dataSource = createDataSource(database.url);
      await dataSource.initialize();
      try {
        await dataSource.runMigrations({ transaction: 'all' });
        expect(await tables(dataSource)).toHaveLength(38);
        expect(await tables(dataSource)).toContain('ledger_entries');
        for (let i = 0; i < migrations.length; i++)
          await dataSource.undoLastMigration({ transaction: 'all' });
        expect(await tables(dataSource)).toEqual(['migrations']);
        await dataSource.runMigrations({ transaction: 'all' });
        expect(await dataSource.showMigrations()).toBe(false);
        const pending = await dataSource.driver.createSchemaBuilder().log();
        expect(pending.upQueries.map((q) => q.query)).toEqual([]);
      } finally {
        await dataSource.destroy();
        await dropTestPostgresDatabase(database.name);
      }
    },
  );

  it.skipIf(onPostgres)(
    'when the database is open, then it runs in WAL mode with foreign keys enforced',
    async () => {
      const { dataSource } = testContext();
      const [journal] = await dataSource.query('PRAGMA journal_mode');
      const [foreignKeys] = await dataSource.query('PRAGMA foreign_keys');
      expect(journal.journal_mode).toBe('wal');
      expect(foreignKeys.foreign_keys).toBe(1);
      await expect(
        dataSource.query(
          "INSERT INTO audit_events (actor_id, action, target_type, detail, created_at) VALUES (987654, 'x', 'y', '{}', 'now')",
        ),
      ).rejects.toThrow(/FOREIGN KEY/);
    },
  );

  it('when the schema is compared with the entities, then nothing is missing (no pending changes)', async () => {
    const { dataSource } = testContext();
    const sql = await dataSource.driver.createSchemaBuilder().log();
    expect(sql.upQueries.map((q) => q.query)).toEqual([]);
  });
});
