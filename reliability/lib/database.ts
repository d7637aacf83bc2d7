import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/**
 * The database a test's server runs on. By default a new SQLite file in a temporary folder
 * per test; with RELIABILITY_DATABASE_URL set, that database (e.g. PostgreSQL) instead, passed
 * to the server as DATABASE_URL. Tests that only make sense on an SQLite file skip then.
 */
export type ReliabilityDatabase =
  | { kind: 'sqlite'; path: string; folder: string; env: Record<string, string> }
  | { kind: 'url'; url: string; env: Record<string, string> };

/** Set when the suite runs against a database server instead of SQLite files. */
export const databaseUrl = process.env.RELIABILITY_DATABASE_URL || null;

/** True when the tests run on SQLite files (the default). */
export const onSqlite = databaseUrl === null;

const folders: string[] = [];

/** A fresh database for one test: a new SQLite file (not created yet), or the configured URL. */
export function freshDatabase(name: string): ReliabilityDatabase {
  const folder = mkdtempSync(path.join(tmpdir(), `lotwise-reliability-${name}-`));
  folders.push(folder);
  const file = path.join(folder, 'lotwise.sqlite');
  if (databaseUrl) {
    // DATABASE_PATH too, pointing at a throwaway file: a server that does not read
    // DATABASE_URL then fails its checks here instead of using the repository's data/ file.
    return {
      kind: 'url',
      url: databaseUrl,
      env: { DATABASE_URL: databaseUrl, DATABASE_PATH: file },
    };
  }
  return { kind: 'sqlite', path: file, folder, env: { DATABASE_PATH: file } };
}

/** A temporary folder of the test's own (removed with the databases). */
export function scratchFolder(name: string): string {
  const folder = mkdtempSync(path.join(tmpdir(), `lotwise-reliability-${name}-`));
  folders.push(folder);
  return folder;
}

/** Removes the temporary folders; RELIABILITY_KEEP=1 keeps them and prints where they are. */
export function removeDatabases(): void {
  if (process.env.RELIABILITY_KEEP === '1') {
    for (const folder of folders) console.log(`[reliability] kept ${folder}`);
    return;
  }
  for (const folder of folders.splice(0)) rmSync(folder, { recursive: true, force: true });
}
