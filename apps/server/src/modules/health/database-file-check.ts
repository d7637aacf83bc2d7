import { accessSync, constants, statSync, type Stats } from 'node:fs';
import type { DataSource } from 'typeorm';

function sqliteFileOf(dataSource: DataSource): string | null {
  const options = dataSource.options as { type: string; database?: unknown };
  if (options.type !== 'better-sqlite3' || typeof options.database !== 'string') return null;
  return options.database === '' || options.database === ':memory:' ? null : options.database;
}

function statOrNull(file: string): Stats | null {
  try {
    return statSync(file);
  } catch {
    return null;
  }
}

/**
 * What is wrong with the SQLite file behind `dataSource` now, or null. Open connections keep
 * reading a file that was deleted, emptied or swapped underneath them (from their cache and
 * memory map), so a query alone does not notice a lost volume: this compares the file at the
 * path with the one the server opened, and checks it can still be read and written.
 */
export function databaseFileCheck(dataSource: DataSource): () => string | null {
  const file = sqliteFileOf(dataSource);
  if (!file) return () => null;
  const opened = statOrNull(file);
  return () => {
    const now = statOrNull(file);
    if (!now) return `the database file ${file} is gone`;
    if (now.size === 0) return `the database file ${file} is empty`;
    if (opened && (now.ino !== opened.ino || now.dev !== opened.dev)) {
      return `the database file ${file} is not the file this server opened`;
    }
    try {
      accessSync(file, constants.R_OK | constants.W_OK);
    } catch {
      return `the database file ${file} cannot be read or written`;
    }
    return null;
  };
}
