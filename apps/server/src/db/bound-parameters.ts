import type { DataSource } from 'typeorm';

/**
 * A JS number as SQLite should receive it: a whole number as an INTEGER (better-sqlite3 binds
 * a plain number as REAL, which would store `1.0` into a text column), anything else as is.
 */
function bindable(value: unknown): unknown {
  return typeof value === 'number' && Number.isSafeInteger(value) ? BigInt(value) : value;
}

interface SqliteDriver {
  escapeQueryWithParameters(
    sql: string,
    parameters: Record<string, unknown>,
    nativeParameters: Record<string, unknown>,
  ): [string, unknown[]];
  createParameter(name: string, index: number): string;
}

/**
 * TypeORM's SQLite drivers write every numeric parameter of a query builder into the SQL text
 * (`WHERE "id" = 12`, `SET "quantity_micro" = 98800000`), so each new number is a new
 * statement for SQLite to parse and plan and the driver's statement cache never hits on a
 * write. This binds numbers as parameters like every other value; the rest of the driver's
 * rules are kept (functions are raw SQL, booleans 0/1, dates as UTC text, `:...list` spreads).
 */
export function bindNumbersAsParameters(dataSource: DataSource): void {
  if (!/sqlite/.test(dataSource.options.type)) return;
  const driver = dataSource.driver as unknown as SqliteDriver;
  driver.escapeQueryWithParameters = function (sql, parameters) {
    const bound: unknown[] = [];
    if (!parameters || Object.keys(parameters).length === 0) return [sql, bound];
    const text = sql.replaceAll(
      /:(\.\.\.)?([A-Za-z0-9_.]+)/g,
      (full: string, spread: string | undefined, key: string) => {
        if (!Object.prototype.hasOwnProperty.call(parameters, key)) return full;
        const value = parameters[key];
        if (spread) {
          return (value as unknown[])
            .map((item) => {
              bound.push(bindable(typeof item === 'boolean' ? +item : item));
              return driver.createParameter(key, bound.length - 1);
            })
            .join(', ');
        }
        if (typeof value === 'function') return (value as () => string)();
        if (typeof value === 'boolean') bound.push(+value);
        else if (value instanceof Date) bound.push(value.toISOString().replace('T', ' ').slice(0, 23));
        else bound.push(bindable(value));
        return driver.createParameter(key, bound.length - 1);
      },
    );
    return [text, bound];
  };
}
