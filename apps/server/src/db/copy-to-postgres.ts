import type { DataSource, EntityMetadata } from 'typeorm';
import { onPostgres } from './postgres';

/** One table as copied: rows read from SQLite and found in PostgreSQL afterwards. */
export interface CopiedTable {
  table: string;
  rows: number;
  copied: number;
}

/** A sum compared on both sides: every `*_micro` (stock) and `*_minor` (money) column. */
export interface ComparedSum {
  column: string;
  source: bigint;
  target: bigint;
}

export interface CopyReport {
  tables: CopiedTable[];
  sums: ComparedSum[];
  /** True when every count and every sum agrees. */
  ok: boolean;
}

/** Refused before anything was written; the message says what to do. */
export class CopyRefused extends Error {
  override name = 'CopyRefused';
}

const pageSize = 500;

async function appliedMigrations(dataSource: DataSource): Promise<string[]> {
  const rows: { name: string }[] = await dataSource.query(
    'SELECT name FROM migrations ORDER BY id',
  );
  return rows.map((row) => row.name);
}

/** Tables in an order where every table comes after the tables it refers to. */
function inDependencyOrder(metadatas: EntityMetadata[]): EntityMetadata[] {
  const byTable = new Map(metadatas.map((m) => [m.tableName, m]));
  const ordered: EntityMetadata[] = [];
  const placed = new Set<string>();
  const visit = (metadata: EntityMetadata, path: Set<string>) => {
    if (placed.has(metadata.tableName) || path.has(metadata.tableName)) return;
    path.add(metadata.tableName);
    for (const key of metadata.foreignKeys) {
      const referenced = byTable.get(key.referencedEntityMetadata.tableName);
      if (referenced && referenced !== metadata) visit(referenced, path);
    }
    placed.add(metadata.tableName);
    ordered.push(metadata);
  };
  for (const metadata of [...metadatas].sort((a, b) => a.tableName.localeCompare(b.tableName)))
    visit(metadata, new Set());
  return ordered;
}

const quote = (name: string) => `"${name}"`;

/**
 * Tables whose rows the migrations themselves insert (the built-in rule sets and watch lists):
 * the condition those rows meet, or null when every row of the table belongs to one of them.
 * A migrated database holding only such rows still counts as empty.
 */
const shippedRows: Record<string, string | null> = {
  rule_sets: '"built_in" = true',
  watch_lists: '"built_in" = true',
  watch_list_entries: null,
};

/**
 * Copies every row of the Lotwise SQLite database behind `source` into the empty, migrated
 * PostgreSQL database behind `target`, in one transaction, then compares row counts and the
 * sums of every stock (`*_micro`) and money (`*_minor`) column. Both must be at the same
 * migration. Ids are kept (so every reference holds), and PostgreSQL's id sequences continue
 * after the highest copied id. A column referring to its own table (a place's parent) is
 * written after all rows are in. Nothing is written when a check before the copy fails, and
 * the transaction rolls back when a count or a sum differs.
 */
export async function copyToPostgres(source: DataSource, target: DataSource): Promise<CopyReport> {
  if (onPostgres(source) || !onPostgres(target)) {
    throw new CopyRefused('The copy reads a Lotwise SQLite file and writes PostgreSQL.');
  }
  const [fromMigrations, toMigrations] = [
    await appliedMigrations(source),
    await appliedMigrations(target),
  ];
  if (fromMigrations.join() !== toMigrations.join()) {
    throw new CopyRefused(
      `The SQLite file is at migration ${fromMigrations.at(-1) ?? '(none)'} and PostgreSQL at ${toMigrations.at(-1) ?? '(none)'}: start this version of Lotwise once on the SQLite file (it updates it) and copy again.`,
    );
  }
  const metadatas = inDependencyOrder(target.entityMetadatas);
  for (const metadata of metadatas) {
    const shipped = shippedRows[metadata.tableName];
    if (shipped === null) continue;
    const where = shipped ? ` WHERE NOT (${shipped})` : '';
    const [row] = await target.query(
      `SELECT COUNT(*) AS n FROM ${quote(metadata.tableName)}${where}`,
    );
    if (Number(row.n) > 0) {
      throw new CopyRefused(
        `The PostgreSQL database is not empty (${metadata.tableName} has rows): copy into a new, empty database.`,
      );
    }
  }

  const tables: CopiedTable[] = [];
  const sums: ComparedSum[] = [];
  await target.transaction(async (manager) => {
    // The rows the migrations shipped give way to the SQLite file's own (the same sets, as the
    // lab chose and changed them), so that ids and choices carry over.
    for (const metadata of [...metadatas].reverse()) {
      if (metadata.tableName in shippedRows)
        await manager.query(`DELETE FROM ${quote(metadata.tableName)}`);
    }
    for (const metadata of metadatas) {
      const table = metadata.tableName;
      const columns = metadata.columns.map((c) => c.databaseName);
      const booleans = new Set(
        metadata.columns.filter((c) => c.type === 'boolean').map((c) => c.databaseName),
      );
      const selfReferences = metadata.foreignKeys
        .filter((key) => key.referencedEntityMetadata.tableName === table)
        .flatMap((key) => key.columns.map((c) => c.databaseName));
      const keys = metadata.primaryColumns.map((c) => c.databaseName);
      const order = keys.map(quote).join(', ');
      const later: { key: unknown[]; values: Record<string, unknown> }[] = [];
      let rows = 0;
      for (let offset = 0; ; offset += pageSize) {
        const page: Record<string, unknown>[] = await source.query(
          `SELECT ${columns.map(quote).join(', ')} FROM ${quote(table)} ORDER BY ${order} LIMIT ${pageSize} OFFSET ${offset}`,
        );
        if (page.length === 0) break;
        rows += page.length;
        const parameters: unknown[] = [];
        const tuples = page.map((row) => {
          const self = selfReferences.filter((c) => row[c] !== null && row[c] !== undefined);
          if (self.length > 0) {
            later.push({
              key: keys.map((k) => row[k]),
              values: Object.fromEntries(self.map((c) => [c, row[c]])),
            });
          }
          return `(${columns
            .map((column) => {
              let value = row[column];
              if (selfReferences.includes(column)) value = null;
              else if (booleans.has(column) && value !== null) value = Boolean(value);
              parameters.push(value);
              return `$${parameters.length}`;
            })
            .join(', ')})`;
        });
        await manager.query(
          `INSERT INTO ${quote(table)} (${columns.map(quote).join(', ')}) VALUES ${tuples.join(', ')}`,
          parameters,
        );
      }
      for (const { key, values } of later) {
        const sets = Object.keys(values).map((c, i) => `${quote(c)} = $${i + 1}`);
        const where = keys.map((k, i) => `${quote(k)} = $${sets.length + i + 1}`);
        await manager.query(
          `UPDATE ${quote(table)} SET ${sets.join(', ')} WHERE ${where.join(' AND ')}`,
          [...Object.values(values), ...key],
        );
      }
      const generated = metadata.columns.find(
        (c) => c.isGenerated && c.generationStrategy === 'increment',
      );
      if (generated) {
        await manager.query(
          `SELECT setval(pg_get_serial_sequence($1, $2), COALESCE(MAX(${quote(generated.databaseName)}), 1), MAX(${quote(generated.databaseName)}) IS NOT NULL) FROM ${quote(table)}`,
          [quote(table), generated.databaseName],
        );
      }
      const [count] = await manager.query(`SELECT COUNT(*) AS n FROM ${quote(table)}`);
      tables.push({ table, rows, copied: Number(count.n) });
      for (const column of columns.filter((c) => /_(micro|minor)$/.test(c))) {
        const sql = `SELECT CAST(COALESCE(SUM(${quote(column)}), 0) AS TEXT) AS total FROM ${quote(table)}`;
        const [from] = await source.query(sql);
        const [to] = await manager.query(sql);
        sums.push({
          column: `${table}.${column}`,
          source: BigInt(String(from.total).replace(/\.0+$/, '')),
          target: BigInt(String(to.total).replace(/\.0+$/, '')),
        });
      }
    }
    const differs =
      tables.some((t) => t.rows !== t.copied) || sums.some((s) => s.source !== s.target);
    if (differs) throw new CopyMismatch({ tables, sums, ok: false });
  });
  return { tables, sums, ok: true };
}

/** The copy was rolled back because a count or a sum differed; the report says which. */
export class CopyMismatch extends Error {
  override name = 'CopyMismatch';
  constructor(readonly report: CopyReport) {
    super('The copy was rolled back: a row count or a sum differs between SQLite and PostgreSQL.');
  }
}
