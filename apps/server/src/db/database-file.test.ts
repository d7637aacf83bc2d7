import Database from 'better-sqlite3';
import { existsSync, mkdtempSync, openSync, readFileSync, writeFileSync, writeSync, closeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { StartupError } from '../config';
import { createLogger } from '../lib/logger';
import { testConfig } from '../test/harness';
import { openDatabase, type OpenedDatabase } from './database-file';

const logger = createLogger('silent');
const opened: OpenedDatabase[] = [];

afterEach(async () => {
  for (const database of opened.splice(0)) await database.dataSource.destroy();
});

function folder(): string {
  return mkdtempSync(path.join(tmpdir(), 'lotwise-dbfile-'));
}

async function open(dir: string, env: NodeJS.ProcessEnv = {}) {
  const database = await openDatabase(testConfig(dir, env), logger);
  opened.push(database);
  return database;
}

async function userCount(database: OpenedDatabase): Promise<number> {
  const [row] = await database.dataSource.query('SELECT COUNT(*) AS n FROM users');
  return Number(row.n);
}

describe('opening the database file', () => {
  it('when an existing database file is empty, then its tables are made but no demo lab is loaded unless asked', async () => {
    const dir = folder();
    writeFileSync(path.join(dir, 'lotwise.sqlite'), '');
    const database = await open(dir);
    expect(database).toMatchObject({ found: 'empty', seeded: false });
    expect(database.applied.length).toBeGreaterThan(0);
    expect(await userCount(database)).toBe(0);
  });

  it('when SEED_DEMO=true and the database is empty, then the demo lab is loaded', async () => {
    const dir = folder();
    writeFileSync(path.join(dir, 'lotwise.sqlite'), '');
    const database = await open(dir, { SEED_DEMO: 'true' });
    expect(database.seeded).toBe(true);
    expect(await userCount(database)).toBeGreaterThan(0);
  });

  it('when production starts with --init on a missing file, then it creates an empty database and never seeds', async () => {
    const dir = folder();
    const database = await open(dir, { NODE_ENV: 'production', DATABASE_INIT: 'true' });
    expect(database).toMatchObject({ found: 'missing', seeded: false });
    expect(existsSync(path.join(dir, 'lotwise.sqlite'))).toBe(true);
    expect(await userCount(database)).toBe(0);
  });

  it('when the file holds garbage bytes, then start-up stops naming the file and saying to restore a backup', async () => {
    const dir = folder();
    const file = path.join(dir, 'lotwise.sqlite');
    const garbage = Buffer.from('this is not an SQLite database, just bytes '.repeat(200));
    writeFileSync(file, garbage);
    const attempt = open(dir);
    await expect(attempt).rejects.toThrow(StartupError);
    await expect(open(dir)).rejects.toThrow(`The database file ${file} cannot be used`);
    await expect(open(dir)).rejects.toThrow(/restore the file from your latest backup/);
    // Nothing was written over the damaged file.
    expect(readFileSync(file).equals(garbage)).toBe(true);
  });

  it('when a page deep in the file is damaged, then the whole-file check stops start-up after an unclean stop or with DATABASE_CHECK=full', async () => {
    const dir = folder();
    const file = path.join(dir, 'lotwise.sqlite');
    // a database with a table spread over many pages, closed cleanly
    const db = new Database(file);
    db.exec('CREATE TABLE users (id INTEGER PRIMARY KEY, filler TEXT)');
    const insert = db.prepare('INSERT INTO users (filler) VALUES (?)');
    db.transaction(() => {
      for (let i = 0; i < 2000; i++) insert.run('x'.repeat(200));
    })();
    db.close();
    // scribble over a page in the middle of the table
    const handle = openSync(file, 'r+');
    writeSync(handle, Buffer.alloc(4096, 0x5a), 0, 4096, 4096 * 50);
    closeSync(handle);
    const damaged = /cannot be used: .*(integrity check found|malformed)/;
    await expect(open(dir, { DATABASE_CHECK: 'full' })).rejects.toThrow(damaged);
    // a write-ahead log left beside the file: the last process did not close it
    writeFileSync(`${file}-wal`, Buffer.alloc(32, 1));
    await expect(open(dir)).rejects.toThrow(damaged);
  });

  it('when the file is an SQLite database of something else, then start-up stops instead of adding tables to it', async () => {
    const dir = folder();
    const file = path.join(dir, 'lotwise.sqlite');
    const other = new Database(file);
    other.exec('CREATE TABLE recipes (id INTEGER PRIMARY KEY, name TEXT)');
    other.close();
    await expect(open(dir)).rejects.toThrow(/not a Lotwise one/);
  });

  it('when production finds an SQLite file without tables, then it refuses without --init', async () => {
    const dir = folder();
    const file = path.join(dir, 'lotwise.sqlite');
    const blank = new Database(file);
    blank.pragma('user_version = 1');
    blank.close();
    await expect(open(dir, { NODE_ENV: 'production' })).rejects.toThrow(/holds no tables/);
  });
});
