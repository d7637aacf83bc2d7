import pg from 'pg';
import type { DataSource, EntityManager } from 'typeorm';

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

/**
 * Find options that lock the rows read (`SELECT … FOR UPDATE`) until the transaction ends, on
 * PostgreSQL inside a transaction; nothing on SQLite, whose one writer already keeps other
 * transactions out, nor outside a transaction. For rows a transaction reads in order to
 * change them (a container's balance before a draw): a second transaction on another
 * connection or another app instance waits, then reads the committed result.
 */
export function lockForWrite(manager: EntityManager): { lock?: { mode: 'pessimistic_write' } } {
  const inTransaction = manager.queryRunner?.isTransactionActive ?? false;
  return onPostgres(manager.connection) && inTransaction
    ? { lock: { mode: 'pessimistic_write' } }
    : {};
}

/** Advisory lock keys: each names one sequence that concurrent transactions take turns on. */
export const advisoryLocks = {
  migrations: 7_469_631_001,
  labelNumbers: 7_469_631_002,
  adminCount: 7_469_631_003,
  alertRules: 7_469_631_004,
} as const;

/**
 * Kinds of job a process holds while it works on one row (`store.holdJob`): the first key
 * of PostgreSQL's two-key advisory locks (a 32-bit integer), the row id the second.
 */
export const jobLocks = {
  imports: 74_696_301,
} as const;

/**
 * On PostgreSQL inside a transaction, waits until no other transaction holds `key`, and
 * holds it until this one ends (`pg_advisory_xact_lock`). For a read-then-insert with no row
 * to lock, such as the next label number (MAX + 1). Nothing on SQLite.
 */
export async function takeTurn(manager: EntityManager, key: number): Promise<void> {
  if (!onPostgres(manager.connection) || !manager.queryRunner?.isTransactionActive) return;
  await manager.query('SELECT pg_advisory_xact_lock($1)', [key]);
}

/**
 * Runs `work` so that, when it fails, the transaction goes on without it, as after a failed
 * statement on SQLite. PostgreSQL marks the whole transaction failed instead, so there the
 * work runs inside a savepoint that is rolled back on error. For a write whose failure is
 * answered by reading more in the same transaction (a label code taken since the preview).
 */
export async function undoneOnError<T>(manager: EntityManager, work: () => Promise<T>): Promise<T> {
  if (!onPostgres(manager.connection) || !manager.queryRunner?.isTransactionActive) return work();
  await manager.query('SAVEPOINT lotwise_attempt');
  try {
    const result = await work();
    await manager.query('RELEASE SAVEPOINT lotwise_attempt');
    return result;
  } catch (error) {
    await manager.query('ROLLBACK TO SAVEPOINT lotwise_attempt');
    throw error;
  }
}
