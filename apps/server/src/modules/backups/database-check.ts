import Database from 'better-sqlite3';
import { migrations } from '../../db/data-source';
import { countRows } from './database-copy';

/** A file cannot be restored (or a restore cannot go ahead now); nothing was changed. */
export class RestoreRefused extends Error {
  override name = 'RestoreRefused';
}

export interface CheckedDatabase {
  /** Migrations the file has, all of them this version's first ones, in order. */
  migrationsApplied: number;
  /** Migrations this version of Lotwise has. */
  migrationsKnown: number;
  rowCounts: Record<string, number>;
}

/** The migrations of this version, in the order they run: a database's history is a prefix. */
export const knownMigrationNames: string[] = migrations.map(
  (migration) => (new migration() as { name?: string }).name ?? migration.name,
);

/** Tables every Lotwise database has had since its first migration. */
const coreTables = ['users', 'chemicals', 'containers', 'ledger_entries', 'migrations'];

/**
 * Checks that `file` can stand in for the Lotwise database: SQLite opens it, its integrity
 * check and foreign-key check are clean, it has Lotwise's tables, and the migrations it
 * records are this version's first ones in order (an older database is brought up to date at
 * start; one from a newer version of Lotwise is refused). Throws RestoreRefused saying why.
 * Reads `file` through a connection that may write: check a copy, not the original.
 */
export function checkDatabaseFile(file: string, label = file): CheckedDatabase {
  let db: Database.Database;
  try {
    db = new Database(file, { fileMustExist: true });
  } catch (error) {
    throw new RestoreRefused(`${label} cannot be opened: ${(error as Error).message}.`);
  }
  try {
    return inspect(db, label);
  } catch (error) {
    if (error instanceof RestoreRefused) throw error;
    const code = (error as { code?: string }).code;
    if (code === 'SQLITE_NOTADB') {
      throw new RestoreRefused(`${label} is not an SQLite database, so not a Lotwise backup.`);
    }
    throw new RestoreRefused(
      `${label} is damaged: SQLite cannot read it (${(error as Error).message}).`,
    );
  } finally {
    db.close();
  }
}

function inspect(db: Database.Database, label: string): CheckedDatabase {
  db.pragma('query_only = ON');
  const problems = (db.pragma('integrity_check') as Record<string, string>[])
    .map((row) => Object.values(row)[0])
    .filter((line) => line !== 'ok');
  if (problems.length > 0) {
    throw new RestoreRefused(
      `${label} is damaged: SQLite's integrity check found ${problems.slice(0, 3).join('; ')}${
        problems.length > 3 ? ` and ${problems.length - 3} more problems` : ''
      }.`,
    );
  }
  const rowCounts = countRows(db);
  const missing = coreTables.filter((table) => !(table in rowCounts));
  if (missing.length > 0) {
    throw new RestoreRefused(
      `${label} is an SQLite database but not a Lotwise one (it has no ${missing.join(', ')} table${
        missing.length > 1 ? 's' : ''
      }).`,
    );
  }
  const applied = db.prepare('SELECT name FROM migrations ORDER BY id').pluck().all() as string[];
  const firstUnknown = applied.findIndex((name, index) => knownMigrationNames[index] !== name);
  if (firstUnknown >= 0) {
    const name = applied[firstUnknown]!;
    const newer = firstUnknown >= knownMigrationNames.length || !knownMigrationNames.includes(name);
    throw new RestoreRefused(
      newer
        ? `${label} comes from a newer version of Lotwise: its schema has migration ${name}, which this version does not know. Restore it with that version of Lotwise (or a later one).`
        : `${label} has migrations in an order this version of Lotwise never ran (${name} at position ${firstUnknown + 1}); it cannot be restored with this version.`,
    );
  }
  if (applied.length === 0) {
    throw new RestoreRefused(`${label} records no Lotwise migrations; it is not a Lotwise backup.`);
  }
  const foreignKeyProblems = db.pragma('foreign_key_check') as { table: string }[];
  if (foreignKeyProblems.length > 0) {
    throw new RestoreRefused(
      `${label} has ${foreignKeyProblems.length} rows whose references point nowhere (first in ${foreignKeyProblems[0]!.table}).`,
    );
  }
  return {
    migrationsApplied: applied.length,
    migrationsKnown: knownMigrationNames.length,
    rowCounts,
  };
}
