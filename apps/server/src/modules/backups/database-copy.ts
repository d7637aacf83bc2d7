import { closeSync, existsSync, openSync, renameSync, statSync, unlinkSync } from 'node:fs';
import { open } from 'node:fs/promises';
import path from 'node:path';
import Database from 'better-sqlite3';
import { partialSuffix } from './backup-folder';

/** A backup could not be taken; the message says why (nothing was left behind). */
export class BackupError extends Error {
  override name = 'BackupError';
}

export interface DatabaseCopy {
  file: string;
  bytes: number;
  /** The moment the copy holds: the start of its read transaction on the database. */
  takenAt: Date;
  /** Rows per table, counted in the database at that moment and found again in the copy. */
  rowCounts: Record<string, number>;
}

export interface CopyOptions {
  /**
   * `counts` compares the row counts of every table in the copy with the database's;
   * `integrity` also runs SQLite's integrity check over the whole copy (it reads every page:
   * the command line does it; the server, which would wait for it, does not).
   */
  check: 'counts' | 'integrity';
  /** Pages copied per step; between steps the process goes on with other work. */
  pagesPerStep?: number;
  /** Called inside the read transaction the copy is taken from (tests read the same moment). */
  atSnapshot?: (db: Database.Database) => void;
}

/** SQLite's quoting of a table name in SQL. */
export function quoteName(name: string): string {
  return `"${name.replaceAll('"', '""')}"`;
}

function tableNames(db: Database.Database): string[] {
  return db
    .prepare(
      "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name",
    )
    .pluck()
    .all() as string[];
}

/** Rows of every table of `db` (SQLite's own tables left out), by table name. */
export function countRows(db: Database.Database): Record<string, number> {
  const tables = tableNames(db);
  return Object.fromEntries(
    tables.map((table) => [
      table,
      db
        .prepare(`SELECT COUNT(*) FROM ${quoteName(table)}`)
        .pluck()
        .get() as number,
    ]),
  );
}

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * `countRows`, counted a range of row ids at a time with a turn of the event loop between
 * ranges: one COUNT(*) over a million ledger entries holds the process for about 100 ms, and
 * the server counts while it serves requests. Call it inside a transaction so that every range
 * sees the same moment.
 */
export async function countRowsInSteps(
  db: Database.Database,
  rowsPerStep = 10_000,
): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of tableNames(db)) {
    const name = quoteName(table);
    let low: number | null = null;
    let high: number | null = null;
    try {
      // Two statements: SQLite finds MIN or MAX alone from the b-tree's edge, both in one by
      // reading the whole table.
      low = db.prepare(`SELECT MIN(rowid) FROM ${name}`).pluck().get() as number | null;
      high = db.prepare(`SELECT MAX(rowid) FROM ${name}`).pluck().get() as number | null;
    } catch {
      // a table without row ids: counted at once below
    }
    if (low === null || high === null || (high - low) / rowsPerStep > 100_000) {
      counts[table] = db.prepare(`SELECT COUNT(*) FROM ${name}`).pluck().get() as number;
      continue;
    }
    const range = db.prepare(`SELECT COUNT(*) FROM ${name} WHERE rowid BETWEEN ? AND ?`).pluck();
    let rows = 0;
    for (let from = low; from <= high; from += rowsPerStep) {
      rows += range.get(from, from + rowsPerStep - 1) as number;
      await nextTurn();
    }
    counts[table] = rows;
  }
  return counts;
}

/**
 * Writes a file's data and its folder's entry to disk, so a power cut keeps the file. On the
 * thread pool: syncing a large file takes long enough to hold up the server's requests.
 */
export async function syncToDisk(file: string): Promise<void> {
  const handle = await open(file, 'r');
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
  const dir = await open(path.dirname(file), 'r');
  try {
    await dir.sync();
  } catch {
    // some file systems cannot sync a folder; the file itself is on disk
  } finally {
    await dir.close();
  }
}

/**
 * Copies the SQLite database at `source` to `destination` (which must not exist) with
 * SQLite's online backup API, as one consistent snapshot, while other connections and
 * processes go on reading and writing.
 *
 * The copy reads through a connection of its own that holds one read transaction from the
 * first page to the last: in WAL mode that transaction sees the database as it was when it
 * began, writers are never blocked by it, and the backup never restarts because of their
 * commits (it would, page by page, without the transaction). Pages are copied a step at a
 * time, so the event loop keeps serving between steps. The copy is written beside its final
 * name (`.partial`, mode 0600), switched to a rollback journal so it is one self-contained
 * file, checked, synced to disk and only then renamed into place.
 */
export async function copyDatabase(
  source: string,
  destination: string,
  { check, pagesPerStep = 256, atSnapshot }: CopyOptions,
): Promise<DatabaseCopy> {
  if (!existsSync(source) || !statSync(source).isFile()) {
    throw new BackupError(`There is no database file at ${source}.`);
  }
  if (existsSync(destination)) {
    throw new BackupError(`${destination} already exists; choose a new file name.`);
  }
  if (!existsSync(path.dirname(destination))) {
    throw new BackupError(`The folder ${path.dirname(destination)} does not exist.`);
  }
  const partial = destination + partialSuffix;
  // Created empty with mode 0600 first: SQLite writes into it and keeps the mode.
  try {
    closeSync(openSync(partial, 'wx', 0o600));
  } catch (error) {
    if ((error as { code?: string }).code !== 'EEXIST') throw error;
    throw new BackupError(`Another backup is writing ${partial}; try again in a moment.`);
  }
  try {
    const { takenAt, rowCounts } = await copySnapshot(source, partial, pagesPerStep, atSnapshot);
    await checkCopy(partial, rowCounts, check);
    await syncToDisk(partial);
    if (existsSync(destination)) {
      throw new BackupError(`${destination} appeared while the backup was written; it is kept.`);
    }
    renameSync(partial, destination);
    await syncToDisk(destination);
    return { file: destination, bytes: statSync(destination).size, takenAt, rowCounts };
  } catch (error) {
    if (existsSync(partial)) unlinkSync(partial);
    throw error;
  }
}

async function copySnapshot(
  source: string,
  partial: string,
  pagesPerStep: number,
  atSnapshot: CopyOptions['atSnapshot'],
) {
  let db: Database.Database;
  try {
    db = new Database(source, { fileMustExist: true });
  } catch (error) {
    throw new BackupError(`The database ${source} cannot be opened: ${(error as Error).message}.`);
  }
  try {
    db.pragma('busy_timeout = 5000');
    // This connection only reads; closing it as the last one still tidies the WAL files.
    db.pragma('query_only = ON');
    db.exec('BEGIN');
    // The first read opens the read transaction: from here on the copy sees this moment.
    db.prepare('SELECT COUNT(*) FROM sqlite_master').get();
    const takenAt = new Date();
    atSnapshot?.(db);
    const rowCounts = await countRowsInSteps(db);
    await backUpWithFlushes(db, partial, pagesPerStep);
    db.exec('COMMIT');
    return { takenAt, rowCounts };
  } finally {
    db.close();
  }
}

/** Pages written to the copy between two flushes to disk (16 MiB of 4 KiB pages). */
const pagesPerFlush = 4096;

/**
 * `db.backup()` into `partial`, flushing what it wrote so far to disk on the thread pool every
 * few thousand pages. SQLite syncs the copy when its last step commits, on the main thread:
 * without the flushes on the way that one sync writes the whole file out and holds the server
 * for as long (most of 100 ms for 58 MB here, far longer on a slow disk).
 */
async function backUpWithFlushes(db: Database.Database, partial: string, pagesPerStep: number) {
  const handle = await open(partial, 'r');
  let flushing: Promise<void> = Promise.resolve();
  let inFlight = false;
  let copiedAtLastFlush = 0;
  try {
    await db.backup(partial, {
      progress: ({ totalPages, remainingPages }) => {
        const copied = totalPages - remainingPages;
        if (!inFlight && copied - copiedAtLastFlush >= pagesPerFlush) {
          copiedAtLastFlush = copied;
          inFlight = true;
          flushing = handle
            .datasync()
            .catch(() => undefined) // the final sync by SQLite still comes
            .finally(() => {
              inFlight = false;
            });
        }
        return pagesPerStep;
      },
    });
  } finally {
    await flushing;
    await handle.close();
  }
  await nextTurn();
}

async function checkCopy(
  file: string,
  expected: Record<string, number>,
  check: CopyOptions['check'],
) {
  await nextTurn();
  const copy = new Database(file, { fileMustExist: true });
  try {
    // The source's WAL mode came along in the header; a backup is one file, without a WAL.
    copy.pragma('journal_mode = DELETE');
    if (check === 'integrity') {
      const problems = (copy.pragma('integrity_check', { simple: false }) as object[])
        .map((row) => Object.values(row)[0] as string)
        .filter((line) => line !== 'ok');
      if (problems.length > 0) {
        throw new BackupError(
          `The copy failed SQLite's integrity check (${problems.slice(0, 3).join('; ')}); it was deleted.`,
        );
      }
    }
    const found = await countRowsInSteps(copy);
    for (const [table, rows] of Object.entries(expected)) {
      if (found[table] !== rows) {
        throw new BackupError(
          `The copy has ${found[table] ?? 'no'} rows in ${table} where the database had ${rows}; it was deleted.`,
        );
      }
    }
  } finally {
    copy.close();
  }
}
