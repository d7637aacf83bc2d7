import type { StockUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';
import { microQuantity } from '../../db/quantities';

export type ReservationStatus = 'active' | 'released';
export type ReleaseReason = 'recorded' | 'cancelled' | 'lapsed' | 'replaced';

/**
 * A row of `reservations`: part of a container held for a plan until a date. Active ones
 * with `until` on or after today count against availability for every other plan.
 */
export interface ReservationRow {
  id: number;
  planId: number;
  containerId: number;
  requirementIndex: number | null;
  quantity: number;
  unit: StockUnit;
  until: string;
  status: ReservationStatus;
  releasedReason: ReleaseReason | null;
  releasedAt: string | null;
  createdById: number | null;
  createdAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  plan?: unknown;
  container?: unknown;
  createdBy?: unknown;
}

export const ReservationEntity = new EntitySchema<ReservationRow>({
  name: 'Reservation',
  tableName: 'reservations',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    planId: { name: 'plan_id', type: 'integer' },
    containerId: { name: 'container_id', type: 'integer' },
    requirementIndex: { name: 'requirement_index', type: 'integer', nullable: true },
    /** Whole millionths of the unit in the database; g or mL here (see db/quantities). */
    quantity: { name: 'quantity_micro', type: 'bigint', transformer: microQuantity },
    unit: { type: 'varchar', length: 4 },
    until: { type: 'varchar', length: 10 },
    status: { type: 'varchar', length: 10 },
    releasedReason: { name: 'released_reason', type: 'varchar', length: 12, nullable: true },
    releasedAt: { name: 'released_at', type: 'varchar', length: 24, nullable: true },
    createdById: { name: 'created_by_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    plan: foreignKey('Plan', 'plan_id', 'reservations_plan_fk', 'RESTRICT'),
    container: foreignKey('Container', 'container_id', 'reservations_container_fk', 'RESTRICT'),
    createdBy: foreignKey('User', 'created_by_id', 'reservations_created_by_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'reservations_container_idx', columns: ['containerId', 'status'] },
    { name: 'reservations_plan_idx', columns: ['planId', 'status'] },
  ],
});
