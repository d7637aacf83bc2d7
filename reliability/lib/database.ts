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
  | { kind: 'url'; url: string; adminUrl: string; name: string; env: Record<string, string> };

/** Set when the suite runs against a database server instead of SQLite files. */
export const databaseUrl = process.env.RELIABILITY_DATABASE_URL || null;

/** True when the tests run on SQLite files (the default). */
export const onSqlite = databaseUrl === null;

const folders: string[] = [];
/** Databases made on the server for this run's tests, dropped with the folders. */
const serverDatabases: { adminUrl: string; name: string }[] = [];

/** A fresh database for one test: a new SQLite file (not created yet), or the configured URL. */
export function freshDatabase(name: string): ReliabilityDatabase {
  const folder = mkdtempSync(path.join(tmpdir(), `lotwise-reliability-${name}-`));
  folders.push(folder);
  const file = path.join(folder, 'lotwise.sqlite');
  if (databaseUrl) {
    // DATABASE_PATH too, pointing at a throwaway file: a server that does not read
    // DATABASE_URL then fails its checks here instead of using the repository's data/ file.
    // A database of the test's own on that server (created before its server first starts).
    const suffix = `${name}_${process.pid}_${Math.random().toString(36).slice(2, 8)}`;
    const own = `lotwise_reliability_${suffix.replace(/[^a-z0-9_]/gi, '_').toLowerCase()}`;
    const url = new URL(databaseUrl);
    url.pathname = `/${own}`;
    return {
      kind: 'url',
      url: url.toString(),
      adminUrl: databaseUrl,
      name: own,
      env: { DATABASE_URL: url.toString(), DATABASE_PATH: file },
    };
  }
  return { kind: 'sqlite', path: file, folder, env: { DATABASE_PATH: file } };
}

type PgClient = {
  connect(): Promise<void>;
  query(sql: string): Promise<unknown>;
  end(): Promise<void>;
};

/** Runs `sql` on the server's admin database (RELIABILITY_DATABASE_URL). */
async function onAdminDatabase(adminUrl: string, sql: string): Promise<void> {
  // through the `pg` driver, which the PostgreSQL support brings
  const driver = 'pg';
  const pg = (await import(driver)) as {
    default: { Client: new (options: { connectionString: string }) => PgClient };
  };
  const client = new pg.default.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/** Creates the test's own database on the server once (nothing to do for an SQLite file). */
export async function createDatabase(database: ReliabilityDatabase): Promise<void> {
  if (database.kind !== 'url') return;
  if (serverDatabases.some((made) => made.name === database.name)) return;
  await onAdminDatabase(database.adminUrl, `CREATE DATABASE "${database.name}"`);
  serverDatabases.push({ adminUrl: database.adminUrl, name: database.name });
}

/** Drops the databases this run made on the server (kept with RELIABILITY_KEEP=1). */
export async function dropServerDatabases(): Promise<void> {
  if (process.env.RELIABILITY_KEEP === '1') return;
  for (const made of serverDatabases.splice(0)) {
    await onAdminDatabase(made.adminUrl, `DROP DATABASE IF EXISTS "${made.name}" WITH (FORCE)`);
  }
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
