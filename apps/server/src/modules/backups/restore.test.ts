import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  copyFileSync,
  existsSync,
  mkdtempSync,
  openSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
  writeSync,
  closeSync,
} from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../db/data-source';
import { copyDatabase } from './database-copy';
import { knownMigrationNames } from './database-check';
import { restoreDatabase, RestoreRefused } from './restore';

const serverDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const repoRoot = path.resolve(serverDir, '../..');
const sqliteDriver = createRequire(import.meta.url).resolve('better-sqlite3');
const dirs: string[] = [];
afterAll(() => dirs.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

function freshDir() {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-restore-'));
  dirs.push(dir);
  return dir;
}

/** A migrated Lotwise database at `file` with `users` people in it. */
async function lotwiseDatabase(file: string, users = 1) {
  const dataSource = createDataSource(file);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'all' });
  for (let i = 0; i < users; i++) {
    await dataSource.query(
      "INSERT INTO users (email, display_name, password_hash, role, active, created_at, updated_at) VALUES (?, ?, 'x', 'member', 1, '2026-01-01T00:00:00.000Z', '2026-01-01T00:00:00.000Z')",
      [`person${i}-${path.basename(path.dirname(file))}@example.test`, `Person ${i}`],
    );
  }
  await dataSource.destroy();
}

/** A live database and a good backup of it (2 users), each in a folder of its own. */
async function liveAndBackup() {
  const dir = freshDir();
  const live = path.join(dir, 'lotwise.sqlite');
  await lotwiseDatabase(live, 5);
  const source = path.join(freshDir(), 'source.sqlite');
  await lotwiseDatabase(source, 2);
  const backup = path.join(path.dirname(source), 'backup.sqlite');
  await copyDatabase(source, backup, { check: 'counts' });
  return { dir, live, backup };
}

function users(file: string): number {
  const db = new Database(file, { readonly: true });
  try {
    return db.prepare('SELECT COUNT(*) FROM users').pluck().get() as number;
  } finally {
    db.close();
  }
}

const digest = (file: string) => createHash('sha256').update(readFileSync(file)).digest('hex');

/** Asserts a refusal that changed nothing: same files in the folder, same database bytes. */
function expectRefusedUnchanged(dir: string, live: string, attempt: () => unknown, why: RegExp) {
  const filesBefore = readdirSync(dir).sort();
  const bytesBefore = digest(live);
  expect(attempt).toThrow(RestoreRefused);
  expect(attempt).toThrow(why);
  expect(readdirSync(dir).sort()).toEqual(filesBefore);
  expect(digest(live)).toBe(bytesBefore);
}

describe('restoring a backup', () => {
  it('when the server is stopped, then the backup takes the database place and the replaced one is kept with what its WAL held', async () => {
    const { dir, live, backup } = await liveAndBackup();
    // A process writes into the WAL and is killed before any checkpoint: those rows exist
    // only in lotwise.sqlite-wal.
    const killed = spawnSync(
      process.execPath,
      [
        '-e',
        `const D = require(${JSON.stringify(sqliteDriver)});
         const db = new D(${JSON.stringify(live)}); db.pragma('wal_autocheckpoint = 0');
         db.prepare("INSERT INTO users (email, display_name, password_hash, role, active, created_at, updated_at) VALUES ('late@example.test', 'Late', 'x', 'member', 1, '2026-01-02T00:00:00.000Z', '2026-01-02T00:00:00.000Z')").run();
         process.kill(process.pid, 'SIGKILL');`,
      ],
      { cwd: serverDir },
    );
    expect(killed.signal).toBe('SIGKILL');
    expect(statSync(`${live}-wal`).size).toBeGreaterThan(0);

    const result = restoreDatabase(live, backup, new Date('2026-12-02T10:00:00Z'));

    expect(result.replacedBy).toBe(`${live}.replaced-20261202T100000Z`);
    expect(result.check).toMatchObject({
      migrationsApplied: knownMigrationNames.length,
      migrationsKnown: knownMigrationNames.length,
    });
    expect(users(live)).toBe(2);
    expect(users(result.replacedBy!)).toBe(6); // the 5 it had and the one only its WAL held
    expect(readdirSync(dir).sort()).toEqual([
      'lotwise.sqlite',
      'lotwise.sqlite.replaced-20261202T100000Z',
    ]);
    expect(statSync(live).mode & 0o777).toBe(0o600);
    // the backup itself is left as it was
    expect(users(backup)).toBe(2);
  });

  it('when there is no database yet, then the backup is put in place and nothing is kept', async () => {
    const { backup } = await liveAndBackup();
    const target = path.join(freshDir(), 'lotwise.sqlite');
    const result = restoreDatabase(target, backup);
    expect(result.replacedBy).toBeNull();
    expect(users(target)).toBe(2);
  });

  it('when the database in place cannot be opened, then its files are kept as found and the backup restored', async () => {
    const { dir, live, backup } = await liveAndBackup();
    writeFileSync(live, 'this is not a database, it was overwritten by mistake\n'.repeat(200));
    const result = restoreDatabase(live, backup, new Date('2026-12-02T11:00:00Z'));
    expect(result.replacedWasDamaged).toBe(true);
    expect(readFileSync(result.replacedBy!, 'utf8')).toMatch(/^this is not a database/);
    expect(users(live)).toBe(2);
    expect(readdirSync(dir)).toContain('lotwise.sqlite.replaced-20261202T110000Z');
  });

  it('when the server runs on the database, then the restore is refused and changes nothing; once it stopped, it goes ahead', async () => {
    const { dir, live, backup } = await liveAndBackup();
    const port = 4651;
    const server = spawn(
      path.join(repoRoot, 'node_modules/.bin/tsx'),
      [path.join(serverDir, 'src/main.ts')],
      {
        cwd: repoRoot,
        env: {
          ...process.env,
          NODE_ENV: 'test',
          PORT: String(port),
          DATABASE_PATH: live,
          BACKUP_INTERVAL_HOURS: '0',
          ALERT_INTERVAL_SECONDS: '0',
          OUTBOX_INTERVAL_SECONDS: '0',
          LOG_LEVEL: 'warn',
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      },
    );
    let output = '';
    server.stdout.on('data', (chunk) => (output += String(chunk)));
    server.stderr.on('data', (chunk) => (output += String(chunk)));
    const exited = new Promise((resolve) => server.once('exit', resolve));
    try {
      const deadline = Date.now() + 60_000;
      for (;;) {
        if (server.exitCode !== null) throw new Error(`The server stopped:\n${output}`);
        if (Date.now() > deadline) throw new Error(`The server did not answer:\n${output}`);
        const healthy = await fetch(`http://127.0.0.1:${port}/api/health`).then(
          (response) => response.ok,
          () => false,
        );
        if (healthy) break;
        await new Promise((resolve) => setTimeout(resolve, 200));
      }
      expectRefusedUnchanged(
        dir,
        live,
        () => restoreDatabase(live, backup),
        /has the database .* open\. Stop the server first/,
      );
    } finally {
      server.kill('SIGTERM');
      await exited;
    }
    expect(restoreDatabase(live, backup).replacedBy).not.toBeNull();
    expect(users(live)).toBe(2);
  }, 90_000);

  it('when the backup is damaged, then it is refused and nothing changes', async () => {
    const { dir, live, backup } = await liveAndBackup();
    const damaged = path.join(path.dirname(backup), 'damaged.sqlite');
    copyFileSync(backup, damaged);
    // Garbage over pages in the middle of the file, past the schema on page 1.
    const fd = openSync(damaged, 'r+');
    const size = statSync(damaged).size;
    writeSync(fd, Buffer.alloc(4096 * 8, 0x5a), 0, 4096 * 8, Math.floor(size / 2 / 4096) * 4096);
    closeSync(fd);
    expectRefusedUnchanged(dir, live, () => restoreDatabase(live, damaged), /is damaged/);
  });

  it('when the backup comes from a newer Lotwise, then it is refused and nothing changes', async () => {
    const { dir, live, backup } = await liveAndBackup();
    const db = new Database(backup);
    db.prepare('INSERT INTO migrations (timestamp, name) VALUES (?, ?)').run(
      1899999999999,
      'SomethingLater1899999999999',
    );
    db.close();
    expectRefusedUnchanged(
      dir,
      live,
      () => restoreDatabase(live, backup),
      /comes from a newer version of Lotwise: its schema has migration SomethingLater1899999999999/,
    );
  });

  it('when the backup is an older Lotwise database, then it is accepted and brought up to date at start', async () => {
    const { live, backup } = await liveAndBackup();
    const db = new Database(backup);
    db.prepare('DELETE FROM migrations WHERE name = ?').run(knownMigrationNames.at(-1));
    db.close();
    const result = restoreDatabase(live, backup);
    expect(result.check.migrationsApplied).toBe(knownMigrationNames.length - 1);
  });

  it('when the file is not a Lotwise database, then it is refused and nothing changes', async () => {
    const { dir, live } = await liveAndBackup();
    const other = path.join(freshDir(), 'other.sqlite');
    const db = new Database(other);
    db.exec('CREATE TABLE notes (id INTEGER PRIMARY KEY, text TEXT)');
    db.close();
    expectRefusedUnchanged(
      dir,
      live,
      () => restoreDatabase(live, other),
      /is an SQLite database but not a Lotwise one/,
    );
    const text = path.join(freshDir(), 'notes.txt');
    writeFileSync(text, 'shopping list: 500 g sodium chloride\n'.repeat(100));
    expectRefusedUnchanged(
      dir,
      live,
      () => restoreDatabase(live, text),
      /is not an SQLite database/,
    );
  });

  it('when the file is the database itself, missing, or a live copy with a WAL beside it, then it is refused', async () => {
    const { dir, live, backup } = await liveAndBackup();
    expectRefusedUnchanged(dir, live, () => restoreDatabase(live, live), /is the database itself/);
    expectRefusedUnchanged(
      dir,
      live,
      () => restoreDatabase(live, path.join(dir, 'nothing-here.sqlite')),
      /There is no file at/,
    );
    writeFileSync(`${backup}-wal`, 'pending pages');
    expectRefusedUnchanged(
      dir,
      live,
      () => restoreDatabase(live, backup),
      /write-ahead log beside it/,
    );
    expect(existsSync(`${backup}-wal`)).toBe(true);
  });
});
