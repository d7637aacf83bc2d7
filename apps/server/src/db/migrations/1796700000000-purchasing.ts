import {
  type MigrationInterface,
  type QueryRunner,
  Table,
  TableColumn,
  TableForeignKey,
  type TableColumnOptions,
  type TableForeignKeyOptions,
  type TableIndexOptions,
} from 'typeorm';

const id: TableColumnOptions = {
  name: 'id',
  type: 'integer',
  isPrimary: true,
  isGenerated: true,
  generationStrategy: 'increment',
};
const text = (name: string): TableColumnOptions => ({ name, type: 'text' });
const varchar = (name: string, length: number, isNullable = false): TableColumnOptions => ({
  name,
  type: 'varchar',
  length: String(length),
  isNullable,
});
const integer = (name: string, isNullable = false): TableColumnOptions => ({
  name,
  type: 'integer',
  isNullable,
});
const double = (name: string, isNullable = false): TableColumnOptions => ({
  name,
  type: 'double precision',
  isNullable,
});
const bigint = (name: string): TableColumnOptions => ({ name, type: 'bigint' });
const boolean = (name: string): TableColumnOptions => ({ name, type: 'boolean' });
const stamps = [varchar('created_at', 24), varchar('updated_at', 24)];

function fk(
  name: string,
  column: string,
  table: string,
  onDelete: 'RESTRICT' | 'SET NULL' = 'RESTRICT',
): TableForeignKeyOptions {
  return {
    name,
    columnNames: [column],
    referencedTableName: table,
    referencedColumnNames: ['id'],
    onDelete,
    onUpdate: 'NO ACTION',
  };
}
const index = (name: string, columnNames: string[], isUnique = false): TableIndexOptions => ({
  name,
  columnNames,
  isUnique,
});

/** Created in this order, dropped in reverse. */
const tables: Table[] = [
  new Table({
    name: 'suppliers',
    columns: [
      id,
      varchar('name', 200),
      varchar('contact_name', 200),
      varchar('email', 254),
      varchar('phone', 60),
      varchar('website', 300),
      text('ordering_notes'),
      integer('minimum_order_minor'),
      integer('shipping_fee_minor'),
      integer('hazardous_fee_minor'),
      boolean('archived'),
      ...stamps,
    ],
    indices: [index('suppliers_name_unique', ['name'], true)],
  }),
  new Table({
    name: 'catalog_items',
    columns: [
      id,
      integer('supplier_id'),
      varchar('sku', 80),
      integer('chemical_id'),
      double('pack_size'),
      varchar('pack_unit', 4),
      varchar('grade', 80, true),
      double('purity_percent', true),
      integer('price_minor'),
      varchar('currency', 3),
      boolean('hazardous'),
      boolean('splittable'),
      boolean('discontinued'),
      ...stamps,
    ],
    foreignKeys: [
      fk('catalog_items_supplier_fk', 'supplier_id', 'suppliers'),
      fk('catalog_items_chemical_fk', 'chemical_id', 'chemicals'),
    ],
    indices: [
      index('catalog_items_supplier_sku_unique', ['supplier_id', 'sku'], true),
      index('catalog_items_chemical_idx', ['chemical_id']),
    ],
  }),
  new Table({
    name: 'orders',
    columns: [
      id,
      integer('supplier_id'),
      varchar('title', 200),
      varchar('status', 10),
      varchar('fee_rule', 8),
      integer('shipping_fee_minor'),
      integer('hazardous_fee_minor'),
      varchar('currency', 3),
      varchar('claim_deadline', 10, true),
      varchar('claims_closed_at', 24, true),
      integer('supplier_invoice_minor', true),
      varchar('supplier_reference', 120),
      text('notes'),
      integer('coordinator_id', true),
      varchar('opened_at', 24, true),
      varchar('ordered_at', 24, true),
      varchar('received_at', 24, true),
      varchar('closed_at', 24, true),
      varchar('cancelled_at', 24, true),
      text('cancel_reason'),
      ...stamps,
    ],
    foreignKeys: [
      fk('orders_supplier_fk', 'supplier_id', 'suppliers'),
      fk('orders_coordinator_fk', 'coordinator_id', 'users', 'SET NULL'),
    ],
    indices: [
      index('orders_status_idx', ['status']),
      index('orders_supplier_idx', ['supplier_id']),
    ],
  }),
  new Table({
    name: 'order_lines',
    columns: [
      id,
      integer('order_id'),
      integer('catalog_item_id'),
      integer('chemical_id'),
      integer('position'),
      varchar('sku', 80),
      integer('packs'),
      double('pack_size'),
      varchar('pack_unit', 4),
      integer('unit_price_minor'),
      varchar('grade', 80, true),
      double('purity_percent', true),
      boolean('hazardous'),
      boolean('splittable'),
      ...stamps,
    ],
    foreignKeys: [
      fk('order_lines_order_fk', 'order_id', 'orders'),
      fk('order_lines_catalog_item_fk', 'catalog_item_id', 'catalog_items'),
      fk('order_lines_chemical_fk', 'chemical_id', 'chemicals'),
    ],
    indices: [index('order_lines_order_idx', ['order_id'])],
  }),
  new Table({
    name: 'order_shares',
    columns: [
      id,
      integer('order_id'),
      integer('line_id'),
      integer('user_id', true),
      boolean('for_lab'),
      bigint('quantity_micro'),
      integer('amount_minor', true),
      varchar('payment_status', 10),
      integer('paid_minor'),
      integer('refunded_minor'),
      integer('request_id', true),
      integer('container_id', true),
      ...stamps,
    ],
    foreignKeys: [
      fk('order_shares_order_fk', 'order_id', 'orders'),
      fk('order_shares_line_fk', 'line_id', 'order_lines'),
      fk('order_shares_user_fk', 'user_id', 'users'),
      fk('order_shares_container_fk', 'container_id', 'containers', 'SET NULL'),
    ],
    indices: [
      index('order_shares_order_idx', ['order_id']),
      index('order_shares_line_idx', ['line_id']),
      index('order_shares_user_idx', ['user_id']),
    ],
  }),
  new Table({
    name: 'purchase_requests',
    columns: [
      id,
      integer('user_id'),
      integer('chemical_id'),
      bigint('quantity_micro'),
      varchar('unit', 4),
      varchar('needed_by', 10, true),
      text('note'),
      varchar('status', 10),
      integer('order_id', true),
      integer('share_id', true),
      ...stamps,
    ],
    foreignKeys: [
      fk('purchase_requests_user_fk', 'user_id', 'users'),
      fk('purchase_requests_chemical_fk', 'chemical_id', 'chemicals'),
      fk('purchase_requests_order_fk', 'order_id', 'orders', 'SET NULL'),
    ],
    indices: [
      index('purchase_requests_status_idx', ['status']),
      index('purchase_requests_user_idx', ['user_id']),
    ],
  }),
  new Table({
    name: 'payments',
    columns: [
      id,
      integer('order_id'),
      integer('share_id'),
      varchar('kind', 10),
      varchar('status', 10),
      integer('amount_minor'),
      varchar('currency', 3),
      integer('attempt'),
      varchar('idempotency_key', 120, true),
      varchar('provider_session_id', 120, true),
      varchar('provider_payment_intent_id', 120, true),
      varchar('provider_refund_id', 120, true),
      text('note'),
      integer('recorded_by_id', true),
      ...stamps,
    ],
    foreignKeys: [
      fk('payments_order_fk', 'order_id', 'orders'),
      fk('payments_share_fk', 'share_id', 'order_shares'),
      fk('payments_recorded_by_fk', 'recorded_by_id', 'users', 'SET NULL'),
    ],
    indices: [
      index('payments_share_idx', ['share_id']),
      index('payments_order_idx', ['order_id']),
      index('payments_provider_session_idx', ['provider_session_id']),
    ],
  }),
  new Table({
    name: 'payment_events',
    columns: [
      { name: 'id', type: 'varchar', length: '120', isPrimary: true },
      varchar('type', 80),
      text('outcome'),
      varchar('received_at', 24),
    ],
  }),
];

/**
 * Shared purchasing: suppliers and their catalogue, member requests, shared orders with lines
 * and members' shares, the payments trail and the payment provider's handled events; and a
 * container's owner (a member's portion of a shared order). Money is in whole minor units.
 * Reverting rebuilds `containers` on SQLite: do it with foreign keys off (as `migration:run`
 * does), like every rebuild.
 */
export class Purchasing1796700000000 implements MigrationInterface {
  name = 'Purchasing1796700000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    for (const table of tables) await queryRunner.createTable(table, false, true, true);
    await queryRunner.addColumn(
      'containers',
      new TableColumn({ name: 'owner_id', type: 'integer', isNullable: true }),
    );
    await queryRunner.createForeignKey(
      'containers',
      new TableForeignKey(fk('containers_owner_fk', 'owner_id', 'users', 'SET NULL')),
    );
    await queryRunner.query('CREATE INDEX "containers_owner_idx" ON "containers" ("owner_id")');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP INDEX "containers_owner_idx"');
    await queryRunner.dropForeignKey('containers', 'containers_owner_fk');
    await queryRunner.dropColumn('containers', 'owner_id');
    for (const table of [...tables].reverse()) await queryRunner.dropTable(table.name);
  }
}
