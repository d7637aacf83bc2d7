import pg from 'pg';
import type { DataSource } from 'typeorm';

/** True for a `postgres://` or `postgresql://` URL (DATABASE_URL), false for a file path. */
export function isPostgresUrl(location: string): boolean {
  return /^postgres(ql)?:\/\//i.test(location);
}

/** True when `dataSource` talks to PostgreSQL (several connections, row locks) rather than SQLite. */
export function onPostgres(dataSource: DataSource): boolean {
  return dataSource.options.type === 'postgres';
}

/** A URL with its password replaced, for messages and logs. */
export function redactedUrl(url: string): string {
  try {
    const parsed = new URL(url);
    if (parsed.password) parsed.password = '***';
    return parsed.toString();
  } catch {
    return 'postgres://…';
  }
}

const int8Oid = 20;
const numericOid = 1700;

/**
 * A whole number as PostgreSQL sends it in text (bigint columns, COUNT(*), SUM of integers) as
 * a JS number, refused when it would not be exact: quantities in millionths and money in minor
 * units must never be rounded on the way out.
 */
export function parseExactInteger(text: string): number {
  const value = Number(text);
  if (!Number.isSafeInteger(value)) {
    throw new RangeError(`The database answered ${text}, too large to hold exactly.`);
  }
  return value;
}

/** NUMERIC (SUM of a bigint column, AVG): exact when whole, else the nearest double. */
function parseNumeric(text: string): number {
  return /^-?\d+$/.test(text) ? parseExactInteger(text) : Number(text);
}

/**
 * Type parsers of Lotwise's connections (per pool, not pg's global ones): bigint and numeric
 * become numbers, as better-sqlite3 answers them, so repositories read the same values on both
 * databases; everything else as pg parses it.
 */
export const lotwiseTypes = {
  getTypeParser(oid: number, format?: 'text' | 'binary') {
    if (format !== 'binary' && oid === int8Oid) return parseExactInteger;
    if (format !== 'binary' && oid === numericOid) return parseNumeric;
    return pg.types.getTypeParser(oid, format as 'text');
  },
};

/** PostgreSQL's SQLSTATE of a failed query (TypeORM keeps the driver's error inside its own). */
export function postgresCode(error: unknown): string | null {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
    e = (e as { driverError?: unknown }).driverError;
  }
  return null;
}

/**
 * True when PostgreSQL rolled a transaction back because it ran into another one: a
 * serialization failure (40001) or a deadlock (40P01). The whole transaction may run again.
 */
export function isTransactionConflict(error: unknown): boolean {
  const code = postgresCode(error);
  return code === '40001' || code === '40P01';
}
