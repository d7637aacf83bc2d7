import {
  chmodSync,
  closeSync,
  copyFileSync,
  fsyncSync,
  openSync,
  constants as fsConstants,
  existsSync,
  linkSync,
  realpathSync,
  renameSync,
  rmSync,
  statSync,
} from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { databaseFiles } from '../../db/data-source';
import { compactUtc } from './backup-folder';
import { checkDatabaseFile, RestoreRefused, type CheckedDatabase } from './database-check';

export { RestoreRefused } from './database-check';

export interface RestoreResult {
  check: CheckedDatabase;
  /** Where the database that was replaced is kept; null when there was none. */
  replacedBy: string | null;
  /** True when the replaced file could not be opened (it was kept as it was, with its WAL). */
  replacedWasDamaged: boolean;
}

/** Writes a file and its folder's entry to disk (the restore is a command; it may wait). */
function syncNow(file: string) {
  for (const [target, mode] of [
    [file, 'r'],
    [path.dirname(file), 'r'],
  ] as const) {
    const fd = openSync(target, mode);
    try {
      fsyncSync(fd);
    } catch {
      // some file systems cannot sync a folder
    } finally {
      closeSync(fd);
    }
  }
}

function isFile(file: string): boolean {
  return statSync(file, { throwIfNoEntry: false })?.isFile() ?? false;
}

/** Refuses a backup file that cannot be one: missing, empty, the live file, or a live copy. */
function refuseUnlikelyFile(source: string, databasePath: string) {
  if (!isFile(source)) throw new RestoreRefused(`There is no file at ${source}.`);
  if (statSync(source).size === 0) throw new RestoreRefused(`${source} is empty.`);
  if (existsSync(databasePath) && realpathSync(source) === realpathSync(databasePath)) {
    throw new RestoreRefused(`${source} is the database itself; name a backup file.`);
  }
  const wal = `${source}-wal`;
  if (isFile(wal) && statSync(wal).size > 0) {
    throw new RestoreRefused(
      `${source} has a write-ahead log beside it (${wal}): it is a database in use, or a copy of one taken without it, not a backup. Take a backup with npm run backup.`,
    );
  }
}

/**
 * Checks `source` as a backup through a copy in a temporary place: nothing in it is changed.
 */
export function checkBackupFile(source: string, scratchDir: string): CheckedDatabase {
  refuseUnlikelyFile(source, path.join(scratchDir, 'none'));
  const copy = path.join(scratchDir, `check-${process.pid}-${Date.now()}.sqlite`);
  copyFileSync(source, copy, fsConstants.COPYFILE_EXCL);
  try {
    return checkDatabaseFile(copy, source);
  } finally {
    for (const file of databaseFiles(copy)) rmSync(file, { force: true });
  }
}

/**
 * Holds the live database for the restore: an exclusive lock that SQLite grants only while no
 * other connection, in any process, has the file open. The server keeps its connections open
 * from start to stop (and a killed server's locks die with it), so the lock answers "is
 * Lotwise running on this file?" without a lock file that a crash could leave behind. While
 * held, a server that starts waits and then stops with "database is locked".
 */
function lockLiveDatabase(databasePath: string): Database.Database | 'damaged' {
  let db: Database.Database | null = null;
  try {
    db = new Database(databasePath, { fileMustExist: true });
    db.pragma('busy_timeout = 0');
    db.pragma('locking_mode = EXCLUSIVE');
    // Takes the lock (and keeps it: exclusive locking mode never lets go until close).
    // Nothing is written yet: a refusal later leaves the file as it was.
    db.exec('BEGIN EXCLUSIVE; COMMIT');
    return db;
  } catch (error) {
    db?.close();
    const code = String((error as { code?: string }).code ?? '');
    if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
      throw new RestoreRefused(
        `Lotwise (or another program) has the database ${databasePath} open. Stop the server first, then run the restore again. Nothing was changed.`,
      );
    }
    if (code.startsWith('SQLITE_NOTADB') || code.startsWith('SQLITE_CORRUPT')) return 'damaged';
    throw new RestoreRefused(
      `The database ${databasePath} cannot be locked for the restore: ${(error as Error).message}. Nothing was changed.`,
    );
  }
}

/**
 * Puts the backup `source` in place of the database at `databasePath`, with the server
 * stopped. In order: refuses while anything has the database open (see lockLiveDatabase);
 * copies the backup beside the database and checks the copy (checkDatabaseFile); keeps the
 * current database, with its WAL folded in, as `<name>.replaced-<UTC time>`; moves the checked
 * copy into place in one rename. Every refusal throws RestoreRefused before anything is
 * overwritten, and leaves no file behind.
 */
export function restoreDatabase(
  databasePath: string,
  source: string,
  now = new Date(),
): RestoreResult {
  refuseUnlikelyFile(source, databasePath);
  const dir = path.dirname(databasePath);
  if (!existsSync(dir)) throw new RestoreRefused(`The folder ${dir} does not exist.`);
  const stamp = compactUtc(now);
  const replacedBy = `${databasePath}.replaced-${stamp}`;
  const incoming = `${databasePath}.restoring-${stamp}`;
  if (existsSync(replacedBy) || existsSync(incoming)) {
    throw new RestoreRefused(`${replacedBy} already exists; wait a second and try again.`);
  }

  const live = isFile(databasePath) ? lockLiveDatabase(databasePath) : null;
  try {
    copyFileSync(source, incoming, fsConstants.COPYFILE_EXCL);
    chmodSync(incoming, 0o600);
    let check: CheckedDatabase;
    try {
      check = checkDatabaseFile(incoming, source);
      const standalone = new Database(incoming, { fileMustExist: true });
      standalone.pragma('journal_mode = DELETE');
      standalone.close();
      syncNow(incoming);
    } catch (error) {
      for (const file of databaseFiles(incoming)) rmSync(file, { force: true });
      throw error;
    }

    if (live === null) {
      renameSync(incoming, databasePath);
    } else if (live === 'damaged') {
      // Set aside as found, with whatever WAL and shared memory it had.
      for (const [from, to] of databaseFiles(databasePath).map(
        (file, i) => [file, databaseFiles(replacedBy)[i]!] as const,
      )) {
        if (existsSync(from)) renameSync(from, to);
      }
      renameSync(incoming, databasePath);
    } else {
      // Everything in the WAL goes into the file, which then stands alone: nothing is lost
      // when it is set aside.
      live.pragma('wal_checkpoint(TRUNCATE)');
      live.pragma('journal_mode = DELETE');
      keepReplaced(databasePath, replacedBy);
      // The old file's shared memory (its WAL is gone) must not meet the new file.
      for (const file of databaseFiles(databasePath).slice(1)) rmSync(file, { force: true });
      renameSync(incoming, databasePath);
    }
    syncNow(databasePath);
    return {
      check,
      replacedBy: live === null ? null : replacedBy,
      replacedWasDamaged: live === 'damaged',
    };
  } finally {
    if (live !== null && live !== 'damaged') live.close();
  }
}

/**
 * A second name for the current file (a hard link), so the database path is never without a
 * file while the new one moves in; a copy where the file system has no hard links.
 */
function keepReplaced(databasePath: string, replacedBy: string) {
  try {
    linkSync(databasePath, replacedBy);
  } catch {
    copyFileSync(databasePath, replacedBy, fsConstants.COPYFILE_EXCL);
  }
  syncNow(replacedBy);
}
