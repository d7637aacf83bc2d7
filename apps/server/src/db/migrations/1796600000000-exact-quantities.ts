import { type MigrationInterface, type QueryRunner, TableColumn } from 'typeorm';

/** The stock quantity columns: double precision in g or mL before, whole millionths after. */
const columns: { table: string; from: string; to: string }[] = [
  { table: 'containers', from: 'quantity', to: 'quantity_micro' },
  { table: 'ledger_entries', from: 'quantity', to: 'quantity_micro' },
  { table: 'ledger_entries', from: 'balance_after', to: 'balance_after_micro' },
  { table: 'reservations', from: 'quantity', to: 'quantity_micro' },
];

function tablesOf(list: typeof columns): string[] {
  return [...new Set(list.map((c) => c.table))];
}

/**
 * Moves the values of `from` (of type `fromType`) into a new column `to` (of type `toType`)
 * computed by `expression`, drops `from` and makes `to` NOT NULL. Add, update, drop: the
 * same steps on SQLite and PostgreSQL (where a type change through changeColumn would drop
 * the data).
 */
async function moveColumns(
  queryRunner: QueryRunner,
  table: string,
  moves: { from: string; to: string }[],
  toType: string,
  expression: (column: string) => string,
): Promise<void> {
  await queryRunner.addColumns(
    table,
    moves.map((m) => new TableColumn({ name: m.to, type: toType, isNullable: true })),
  );
  const sets = moves.map((m) => `${m.to} = ${expression(m.from)}`).join(', ');
  await queryRunner.query(`UPDATE ${table} SET ${sets}`);
  await queryRunner.dropColumns(
    table,
    moves.map((m) => m.from),
  );
  const current = await queryRunner.getTable(table);
  await queryRunner.changeColumns(
    table,
    moves.map((m) => {
      const oldColumn = current!.findColumnByName(m.to)!;
      const newColumn = oldColumn.clone();
      newColumn.isNullable = false;
      return { oldColumn, newColumn };
    }),
  );
}

/**
 * Stock quantities become whole millionths of the stock unit in `bigint` columns, so a
 * container's balance is exactly the sum of its ledger entries (a sum of doubles drifts).
 * Each value is rounded to the nearest millionth, which is what the app already kept.
 * `bigint` exists on SQLite and PostgreSQL alike. On SQLite the tables are rebuilt, so (as
 * for every rebuild) revert it with foreign keys off: `migration:run` switches them off
 * itself, `migration:revert` inside its transaction cannot.
 */
export class ExactQuantities1796600000000 implements MigrationInterface {
  name = 'ExactQuantities1796600000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    for (const table of tablesOf(columns)) {
      await moveColumns(
        queryRunner,
        table,
        columns.filter((c) => c.table === table),
        'bigint',
        (column) => `CAST(ROUND(${column} * 1000000) AS BIGINT)`,
      );
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of tablesOf(columns)) {
      await moveColumns(
        queryRunner,
        table,
        columns.filter((c) => c.table === table).map((c) => ({ from: c.to, to: c.from })),
        'double precision',
        (column) => `${column} / 1000000.0`,
      );
    }
  }
}
