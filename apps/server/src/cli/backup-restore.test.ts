import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../db/data-source';
import { testConfig } from '../test/harness';
import { runBackup } from './backup-command';
import { runRestore } from './restore-command';

const dirs: string[] = [];
afterAll(() => dirs.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

/** A configuration on a new, migrated database in a folder of its own. */
async function migratedConfig() {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-cli-backup-'));
  dirs.push(dir);
  const config = testConfig(dir);
  const dataSource = createDataSource(config.databasePath);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'all' });
  await dataSource.destroy();
  return { dir, config };
}

function io() {
  const out: string[] = [];
  const err: string[] = [];
  return {
    io: { out: (line: string) => out.push(line), err: (line: string) => err.push(line) },
    out: () => out.join('\n'),
    err: () => err.join('\n'),
  };
}

describe('npm run backup and npm run restore', () => {
  it('when run without a file, then a checked backup lands in the backups folder and the output names it, its size and the rows', async () => {
    const { config } = await migratedConfig();
    const printed = io();
    expect(await runBackup([], config, printed.io)).toBe(0);
    const [name] = readdirSync(config.backup.dir);
    expect(name).toMatch(/^lotwise-\d{8}T\d{6}Z-manual\.sqlite$/);
    expect(printed.out()).toContain(`Backup written: ${path.join(config.backup.dir, name!)}`);
    expect(printed.out()).toMatch(/Size: [\d.]+ KiB \([\d,]+ bytes\)/);
    expect(printed.out()).toMatch(/integrity check passed/);
    expect(printed.out()).toMatch(/^ {2}migrations +\d+$/m);
  });

  it('when a file is named relative to where the command was typed, then it is written there; an existing one is refused', async () => {
    const { dir, config } = await migratedConfig();
    const first = io();
    expect(await runBackup(['copy.sqlite'], config, first.io, dir)).toBe(0);
    expect(existsSync(path.join(dir, 'copy.sqlite'))).toBe(true);
    const again = io();
    expect(await runBackup(['copy.sqlite'], config, again.io, dir)).toBe(1);
    expect(again.err()).toMatch(/No backup was written: .*copy\.sqlite already exists/);
    const itself = io();
    expect(await runBackup([config.databasePath], config, itself.io)).toBe(1);
  });

  it('when a backup is restored, then it checks, keeps the replaced file and says so; --check changes nothing', async () => {
    const { dir, config } = await migratedConfig();
    expect(await runBackup(['backup.sqlite'], config, io().io, dir)).toBe(0);
    const checked = io();
    const before = readdirSync(dir).sort();
    expect(runRestore(['--check', 'backup.sqlite'], config, checked.io, dir)).toBe(0);
    expect(checked.out()).toMatch(
      /is a sound Lotwise database: integrity and foreign keys are clean, the schema of this version/,
    );
    expect(readdirSync(dir).sort()).toEqual(before);

    const restored = io();
    expect(runRestore(['backup.sqlite'], config, restored.io, dir)).toBe(0);
    expect(restored.out()).toMatch(
      /The database it replaced is kept, complete, as .*lotwise\.sqlite\.replaced-\d{8}T\d{6}Z/,
    );
    expect(restored.out()).toMatch(/Restored to .*lotwise\.sqlite\. Start Lotwise again\./);
  });

  it('when the file is refused, then the reason is printed and the exit code is 1', async () => {
    const { dir, config } = await migratedConfig();
    writeFileSync(path.join(dir, 'notes.sqlite'), 'not a database at all\n'.repeat(100));
    const refused = io();
    expect(runRestore(['notes.sqlite'], config, refused.io, dir)).toBe(1);
    expect(refused.err()).toMatch(/^Not restored: .*notes\.sqlite is not an SQLite database/);
    const none = io();
    expect(runRestore([], config, none.io, dir)).toBe(1);
    expect(none.err()).toMatch(/Name the backup file to restore/);
    const db = new Database(config.databasePath, { readonly: true });
    expect(db.prepare('SELECT COUNT(*) FROM migrations').pluck().get()).toBeGreaterThan(0);
    db.close();
  });
});
