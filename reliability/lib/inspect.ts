import Database from 'better-sqlite3';
import type { ReliabilityDatabase } from './database';

/**
 * Reads a test's database behind the server's back, for the final checks only (the data a
 * test works with is made through the API). On SQLite the file is opened read-only, after
 * the server stopped or was killed.
 */
export interface DatabaseProbe {
  /** Rows of a query written with `?` placeholders. */
  all<T>(sql: string, params?: unknown[]): Promise<T[]>;
  close(): Promise<void>;
}

export async function openProbe(database: ReliabilityDatabase): Promise<DatabaseProbe> {
  if (database.kind === 'sqlite') {
    const db = new Database(database.path, { readonly: true, fileMustExist: true });
    return {
      all: async <T>(sql: string, params: unknown[] = []) => db.prepare(sql).all(...params) as T[],
      close: async () => {
        db.close();
      },
    };
  }
  // A database server: through the `pg` driver, which the PostgreSQL support brings.
  const driver = 'pg';
  const pg = (await import(driver)) as {
    default: {
      Client: new (options: { connectionString: string }) => {
        connect(): Promise<void>;
        query(sql: string, params: unknown[]): Promise<{ rows: unknown[] }>;
        end(): Promise<void>;
      };
    };
  };
  const client = new pg.default.Client({ connectionString: database.url });
  await client.connect();
  return {
    all: async <T>(sql: string, params: unknown[] = []) => {
      let n = 0;
      const numbered = sql.replace(/\?/g, () => `$${++n}`);
      return (await client.query(numbered, params)).rows as T[];
    },
    close: () => client.end(),
  };
}

/** What the final checks of a stopped server's database found. */
export interface DatabaseReport {
  /** `PRAGMA integrity_check` lines other than `ok` (SQLite only; empty elsewhere). */
  integrityProblems: string[];
  /** Rows of `PRAGMA foreign_key_check` (SQLite), or of the same check by joins. */
  foreignKeyProblems: number;
  containers: number;
  entries: number;
  /** Containers whose stored balance differs from the sum of their ledger entries. */
  balanceMismatches: number;
  /** Ledger entries whose balance after is below zero. */
  negativeBalances: number;
}

const num = (value: unknown) => Number(value ?? 0);

/** Integrity, foreign keys, and every stored balance against the sum of its entries. */
export async function inspectDatabase(database: ReliabilityDatabase): Promise<DatabaseReport> {
  const probe = await openProbe(database);
  try {
    let integrityProblems: string[] = [];
    let foreignKeyProblems = 0;
    if (database.kind === 'sqlite') {
      integrityProblems = (await probe.all<{ integrity_check: string }>('PRAGMA integrity_check'))
        .map((row) => row.integrity_check)
        .filter((line) => line !== 'ok');
      foreignKeyProblems = (await probe.all('PRAGMA foreign_key_check')).length;
    } else {
      const [row] = await probe.all<{ n: unknown }>(
        `SELECT (SELECT COUNT(*) FROM ledger_entries e LEFT JOIN containers c ON c.id = e.container_id WHERE c.id IS NULL)
              + (SELECT COUNT(*) FROM containers c LEFT JOIN lots l ON l.id = c.lot_id WHERE l.id IS NULL) AS n`,
      );
      foreignKeyProblems = num(row?.n);
    }
    const [totals] = await probe.all<Record<string, unknown>>(
      `SELECT (SELECT COUNT(*) FROM containers) AS containers,
              (SELECT COUNT(*) FROM ledger_entries) AS entries,
              (SELECT COUNT(*) FROM ledger_entries WHERE balance_after_micro < 0) AS negative,
              (SELECT COUNT(*) FROM containers c
                 LEFT JOIN (SELECT container_id, SUM(quantity_micro) AS total
                            FROM ledger_entries GROUP BY container_id) s ON s.container_id = c.id
                WHERE c.quantity_micro <> COALESCE(s.total, 0)) AS mismatches`,
    );
    return {
      integrityProblems,
      foreignKeyProblems,
      containers: num(totals?.containers),
      entries: num(totals?.entries),
      balanceMismatches: num(totals?.mismatches),
      negativeBalances: num(totals?.negative),
    };
  } finally {
    await probe.close();
  }
}

/** True when nothing is wrong: the figure lines say "clean". */
export function clean(report: DatabaseReport): boolean {
  return (
    report.integrityProblems.length === 0 &&
    report.foreignKeyProblems === 0 &&
    report.balanceMismatches === 0 &&
    report.negativeBalances === 0
  );
}
