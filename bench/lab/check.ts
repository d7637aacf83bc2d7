import type Database from 'better-sqlite3';
import type { LabSize } from './shape';

export interface LabCounts {
  chemicals: number;
  locations: number;
  lots: number;
  containers: number;
  ledgerEntries: number;
  procedures: number;
  procedureLines: number;
  users: number;
}

/** Rows of each table the generator fills. */
export function countRows(db: Database.Database): LabCounts {
  const count = (table: string) =>
    (db.prepare(`SELECT COUNT(*) AS n FROM ${table}`).get() as { n: number }).n;
  return {
    chemicals: count('chemicals'),
    locations: count('locations'),
    lots: count('lots'),
    containers: count('containers'),
    ledgerEntries: count('ledger_entries'),
    procedures: count('procedures'),
    procedureLines: count('procedure_lines'),
    users: count('users'),
  };
}

/** A generated lab keeps Lotwise's invariants; throws naming the first that does not hold. */
export function selfCheck(db: Database.Database, size?: LabSize): void {
  const one = (sql: string) => (db.prepare(sql).get() as { n: number }).n;
  const problems: string[] = [];
  const unbalanced = one(
    `SELECT COUNT(*) AS n FROM containers c
     LEFT JOIN (SELECT container_id, SUM(quantity_micro) AS total FROM ledger_entries GROUP BY container_id) s
       ON s.container_id = c.id
     WHERE c.quantity_micro IS NOT COALESCE(s.total, 0)`,
  );
  if (unbalanced)
    problems.push(`${unbalanced} containers whose quantity is not the sum of their ledger`);
  const lastBalance = one(
    `SELECT COUNT(*) AS n FROM containers c
     JOIN ledger_entries e ON e.id = (SELECT MAX(id) FROM ledger_entries WHERE container_id = c.id)
     WHERE e.balance_after_micro <> c.quantity_micro`,
  );
  if (lastBalance)
    problems.push(
      `${lastBalance} containers whose last ledger balance differs from their quantity`,
    );
  const badStatus = one(
    `SELECT COUNT(*) AS n FROM containers
     WHERE (status IN ('empty', 'disposed') AND quantity_micro <> 0)
        OR (status IN ('sealed', 'open') AND quantity_micro <= 0)`,
  );
  if (badStatus)
    problems.push(`${badStatus} containers whose status disagrees with their quantity`);
  const negative = one('SELECT COUNT(*) AS n FROM ledger_entries WHERE balance_after_micro < 0');
  if (negative) problems.push(`${negative} ledger entries with a negative balance`);
  const badFk = db.prepare('PRAGMA foreign_key_check').all();
  if (badFk.length)
    problems.push(`${badFk.length} rows break a foreign key (first: ${JSON.stringify(badFk[0])})`);
  if (size) {
    const containers = one('SELECT COUNT(*) AS n FROM containers');
    if (containers !== size.containers)
      problems.push(`${containers} containers, expected ${size.containers}`);
  }
  if (problems.length) throw new Error(`The generated lab is wrong: ${problems.join('; ')}`);
}
