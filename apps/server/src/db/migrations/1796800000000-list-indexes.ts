import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Indexes for the filters and sorts of the list pages (checked by db/query-plans.test.ts):
 * a covering index of containers for the stock sums (chemical, status, expiry, quantity,
 * place), containers by place and status, and one index per sort column of containers,
 * chemicals, lots, orders, runs, plans, the outbox and the audit trail. Chemicals sorted by
 * name and places by path sort on LOWER(…), so those two are indexes on that expression. The
 * new containers indexes start with the columns of the two they replace.
 */
export class ListIndexes1796800000000 implements MigrationInterface {
  name = 'ListIndexes1796800000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP INDEX "containers_chemical_status_idx"');
    await queryRunner.query('DROP INDEX "containers_location_idx"');
    await queryRunner.query(
      'CREATE INDEX "containers_stock_idx" ON "containers" ("chemical_id", "status", "expires_on", "quantity_micro", "location_id")',
    );
    await queryRunner.query(
      'CREATE INDEX "containers_location_status_idx" ON "containers" ("location_id", "status")',
    );
    await queryRunner.query(
      'CREATE INDEX "containers_quantity_idx" ON "containers" ("quantity_micro")',
    );
    await queryRunner.query(
      'CREATE INDEX "containers_updated_at_idx" ON "containers" ("updated_at")',
    );
    await queryRunner.query('CREATE INDEX "chemicals_formula_idx" ON "chemicals" ("formula")');
    await queryRunner.query(
      'CREATE INDEX "chemicals_molar_mass_idx" ON "chemicals" ("molar_mass")',
    );
    await queryRunner.query(
      'CREATE INDEX "chemicals_updated_at_idx" ON "chemicals" ("updated_at")',
    );
    await queryRunner.query(
      'CREATE INDEX "chemicals_reorder_point_idx" ON "chemicals" ("reorder_point")',
    );
    await queryRunner.query(
      'CREATE INDEX "chemicals_physical_state_idx" ON "chemicals" ("physical_state")',
    );
    await queryRunner.query('CREATE INDEX "lots_received_on_idx" ON "lots" ("received_on")');
    await queryRunner.query('CREATE INDEX "lots_updated_at_idx" ON "lots" ("updated_at")');
    await queryRunner.query('CREATE INDEX "lots_source_idx" ON "lots" ("source", "received_on")');
    await queryRunner.query('CREATE INDEX "orders_created_at_idx" ON "orders" ("created_at")');
    await queryRunner.query(
      'CREATE INDEX "orders_claim_deadline_idx" ON "orders" ("claim_deadline")',
    );
    await queryRunner.query('CREATE INDEX "orders_title_idx" ON "orders" ("title")');
    await queryRunner.query('CREATE INDEX "runs_created_at_idx" ON "runs" ("created_at")');
    await queryRunner.query('CREATE INDEX "runs_performed_on_idx" ON "runs" ("performed_on")');
    await queryRunner.query('CREATE INDEX "runs_percent_yield_idx" ON "runs" ("percent_yield")');
    await queryRunner.query('CREATE INDEX "runs_status_idx" ON "runs" ("status", "created_at")');
    await queryRunner.query(
      'CREATE INDEX "prep_plans_planned_on_idx" ON "prep_plans" ("planned_on")',
    );
    await queryRunner.query(
      'CREATE INDEX "prep_plans_updated_at_idx" ON "prep_plans" ("updated_at")',
    );
    await queryRunner.query(
      'CREATE INDEX "prep_plans_created_by_idx" ON "prep_plans" ("created_by_id", "planned_on")',
    );
    await queryRunner.query('CREATE INDEX "outbox_attempts_idx" ON "outbox" ("attempts")');
    await queryRunner.query('CREATE INDEX "outbox_kind_idx" ON "outbox" ("kind", "created_at")');
    await queryRunner.query(
      'CREATE INDEX "outbox_next_attempt_idx" ON "outbox" ("next_attempt_at")',
    );
    await queryRunner.query('CREATE INDEX "audit_events_action_idx" ON "audit_events" ("action")');
    await queryRunner.query(
      'CREATE INDEX "audit_events_target_idx" ON "audit_events" ("target_type", "target_id", "created_at")',
    );
    await queryRunner.query(
      'CREATE INDEX "chemicals_name_lower_idx" ON "chemicals" (LOWER("name"))',
    );
    await queryRunner.query(
      'CREATE INDEX "locations_path_lower_idx" ON "locations" (LOWER("path"))',
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP INDEX "locations_path_lower_idx"');
    await queryRunner.query('DROP INDEX "chemicals_name_lower_idx"');
    await queryRunner.query('DROP INDEX "audit_events_target_idx"');
    await queryRunner.query('DROP INDEX "audit_events_action_idx"');
    await queryRunner.query('DROP INDEX "outbox_next_attempt_idx"');
    await queryRunner.query('DROP INDEX "outbox_kind_idx"');
    await queryRunner.query('DROP INDEX "outbox_attempts_idx"');
    await queryRunner.query('DROP INDEX "prep_plans_created_by_idx"');
    await queryRunner.query('DROP INDEX "prep_plans_updated_at_idx"');
    await queryRunner.query('DROP INDEX "prep_plans_planned_on_idx"');
    await queryRunner.query('DROP INDEX "runs_status_idx"');
    await queryRunner.query('DROP INDEX "runs_percent_yield_idx"');
    await queryRunner.query('DROP INDEX "runs_performed_on_idx"');
    await queryRunner.query('DROP INDEX "runs_created_at_idx"');
    await queryRunner.query('DROP INDEX "orders_title_idx"');
    await queryRunner.query('DROP INDEX "orders_claim_deadline_idx"');
    await queryRunner.query('DROP INDEX "orders_created_at_idx"');
    await queryRunner.query('DROP INDEX "lots_source_idx"');
    await queryRunner.query('DROP INDEX "lots_updated_at_idx"');
    await queryRunner.query('DROP INDEX "lots_received_on_idx"');
    await queryRunner.query('DROP INDEX "chemicals_physical_state_idx"');
    await queryRunner.query('DROP INDEX "chemicals_reorder_point_idx"');
    await queryRunner.query('DROP INDEX "chemicals_updated_at_idx"');
    await queryRunner.query('DROP INDEX "chemicals_molar_mass_idx"');
    await queryRunner.query('DROP INDEX "chemicals_formula_idx"');
    await queryRunner.query('DROP INDEX "containers_updated_at_idx"');
    await queryRunner.query('DROP INDEX "containers_quantity_idx"');
    await queryRunner.query('DROP INDEX "containers_location_status_idx"');
    await queryRunner.query('DROP INDEX "containers_stock_idx"');
    await queryRunner.query(
      'CREATE INDEX "containers_chemical_status_idx" ON "containers" ("chemical_id", "status")',
    );
    await queryRunner.query(
      'CREATE INDEX "containers_location_idx" ON "containers" ("location_id")',
    );
  }
}
