import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Indexes for the filters and sorts of the list pages (checked by db/query-plans.test.ts):
 * a covering index of containers for the stock sums (chemical, status, expiry, quantity,
 * place), containers by place and status, and one index per sort column of containers,
 * chemicals, lots, orders, runs, plans, the outbox and the audit trail. Chemicals sorted by
 * name and places by path sort on LOWER(…), so those two are indexes on that expression. The
 * new containers indexes start with the columns of the two they replace.
 */
/** An index: its name, its table, and its columns (or expression) as SQL. */
type IndexSpec = [name: string, table: string, columns: string];

const added: IndexSpec[] = [
  [
    'containers_stock_idx',
    'containers',
    '"chemical_id", "status", "expires_on", "quantity_micro", "location_id"',
  ],
  ['containers_location_status_idx', 'containers', '"location_id", "status", "chemical_id"'],
  ['containers_quantity_idx', 'containers', '"quantity_micro"'],
  ['containers_updated_at_idx', 'containers', '"updated_at"'],
  ['chemicals_formula_idx', 'chemicals', '"formula"'],
  ['chemicals_molar_mass_idx', 'chemicals', '"molar_mass"'],
  ['chemicals_updated_at_idx', 'chemicals', '"updated_at"'],
  ['chemicals_reorder_point_idx', 'chemicals', '"reorder_point"'],
  ['chemicals_physical_state_idx', 'chemicals', '"physical_state"'],
  ['lots_received_on_idx', 'lots', '"received_on"'],
  ['lots_updated_at_idx', 'lots', '"updated_at"'],
  ['lots_source_idx', 'lots', '"source", "received_on"'],
  ['orders_created_at_idx', 'orders', '"created_at"'],
  ['orders_claim_deadline_idx', 'orders', '"claim_deadline"'],
  ['orders_title_idx', 'orders', '"title"'],
  ['runs_created_at_idx', 'runs', '"created_at"'],
  ['runs_performed_on_idx', 'runs', '"performed_on"'],
  ['runs_percent_yield_idx', 'runs', '"percent_yield"'],
  ['runs_status_idx', 'runs', '"status", "created_at"'],
  ['prep_plans_planned_on_idx', 'prep_plans', '"planned_on"'],
  ['prep_plans_updated_at_idx', 'prep_plans', '"updated_at"'],
  ['prep_plans_created_by_idx', 'prep_plans', '"created_by_id", "planned_on"'],
  ['outbox_attempts_idx', 'outbox', '"attempts"'],
  ['outbox_kind_idx', 'outbox', '"kind", "created_at"'],
  ['outbox_next_attempt_idx', 'outbox', '"next_attempt_at"'],
  ['audit_events_action_idx', 'audit_events', '"action"'],
  ['audit_events_target_idx', 'audit_events', '"target_type", "target_id", "created_at"'],
  ['chemicals_name_lower_idx', 'chemicals', 'LOWER("name")'],
  ['locations_path_lower_idx', 'locations', 'LOWER("path")'],
];

/** Replaced by the first two above, which start with the same columns. */
const replaced: IndexSpec[] = [
  ['containers_chemical_status_idx', 'containers', '"chemical_id", "status"'],
  ['containers_location_idx', 'containers', '"location_id"'],
];

const create = ([name, table, columns]: IndexSpec) =>
  `CREATE INDEX "${name}" ON "${table}" (${columns})`;

export class ListIndexes1796800000000 implements MigrationInterface {
  name = 'ListIndexes1796800000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    for (const [name] of replaced) await queryRunner.query(`DROP INDEX "${name}"`);
    for (const index of added) await queryRunner.query(create(index));
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const [name] of [...added].reverse()) await queryRunner.query(`DROP INDEX "${name}"`);
    for (const index of replaced) await queryRunner.query(create(index));
  }
}
