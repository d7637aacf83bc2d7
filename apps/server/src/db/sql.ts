import type { DataSource } from 'typeorm';
import { AppError } from '../lib/app-error';
import { onPostgres } from './postgres';

/** `%text%` for LIKE with `ESCAPE '\'`, so `%` and `_` typed by a person match literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** True for a unique-constraint violation on SQLite or PostgreSQL. */
export function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string; driverError?: { code?: string }; message?: string };
  const code = e?.driverError?.code ?? e?.code;
  return (
    code === 'SQLITE_CONSTRAINT_UNIQUE' ||
    code === '23505' ||
    /UNIQUE constraint failed/.test(e?.message ?? '')
  );
}

/** The driver's code of a failed query: SQLite's `SQLITE_…` name or PostgreSQL's SQLSTATE. */
function driverCode(error: unknown): string | null {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string') return code;
    e = (e as { driverError?: unknown }).driverError;
  }
  return null;
}

/** True for a foreign-key violation on SQLite or PostgreSQL (a row still referred to, or gone). */
export function isForeignKeyViolation(error: unknown): boolean {
  const code = driverCode(error);
  return code === 'SQLITE_CONSTRAINT_FOREIGNKEY' || code === '23503';
}

/**
 * What a write that collided with another one at the same time is answered with, the same on
 * both databases; null for any other error. Unique and foreign-key violations that a service
 * did not turn into a message of its own, and (PostgreSQL) a transaction still rolled back by
 * a deadlock or a serialization failure after its retries, are 409s: nothing was written, and
 * the request may be sent again once the person has seen the current state.
 */
export function concurrentWriteConflict(error: unknown): AppError | null {
  if (isUniqueViolation(error)) {
    return AppError.conflict(
      'Someone else saved the same name, code or number at the same moment; nothing was saved. Reload and try again.',
    );
  }
  if (isForeignKeyViolation(error)) {
    return AppError.conflict(
      'Something this change refers to was changed or removed at the same moment (or is still in use); nothing was saved. Reload and try again.',
    );
  }
  const code = driverCode(error);
  if (code === '40001' || code === '40P01') {
    return AppError.conflict(
      'Others were changing the same records at the same moment; nothing was saved. Try again.',
    );
  }
  return null;
}

/** Now as an ISO-8601 UTC string, the form every timestamp column holds. */
export function nowIso(): string {
  return new Date().toISOString();
}

/**
 * Raw SQL written with `?` placeholders (SQLite's) as `dataSource` takes it: PostgreSQL numbers
 * them (`$1`, `$2`, …). For the few raw statements outside the query builder; the SQL must have
 * no `?` inside string literals.
 */
export function withPlaceholders(dataSource: DataSource, sql: string): string {
  if (!onPostgres(dataSource)) return sql;
  let index = 0;
  return sql.replace(/\?/g, () => `$${++index}`);
}
