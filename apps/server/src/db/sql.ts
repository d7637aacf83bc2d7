import type { DataSource } from 'typeorm';
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
