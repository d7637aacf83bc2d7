import type { PlanStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `prep_plans`: a procedure at a scale for some benches on a date. */
export interface PlanRow {
  id: number;
  procedureId: number;
  scaleFactor: number;
  benches: number;
  overagePercent: number;
  plannedOn: string;
  status: PlanStatus;
  notes: string;
  createdById: number | null;
  /** The run recorded from it (no foreign key: runs point at plans). */
  runId: number | null;
  createdAt: string;
  updatedAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  procedure?: unknown;
  createdBy?: unknown;
}

export const PlanEntity = new EntitySchema<PlanRow>({
  name: 'Plan',
  tableName: 'prep_plans',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    procedureId: { name: 'procedure_id', type: 'integer' },
    scaleFactor: { name: 'scale_factor', type: 'double precision' },
    benches: { type: 'integer' },
    overagePercent: { name: 'overage_percent', type: 'double precision' },
    plannedOn: { name: 'planned_on', type: 'varchar', length: 10 },
    status: { type: 'varchar', length: 10 },
    notes: { type: 'text' },
    createdById: { name: 'created_by_id', type: 'integer', nullable: true },
    runId: { name: 'run_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    procedure: foreignKey('Procedure', 'procedure_id', 'prep_plans_procedure_fk', 'RESTRICT'),
    createdBy: foreignKey('User', 'created_by_id', 'prep_plans_created_by_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'prep_plans_procedure_idx', columns: ['procedureId'] },
    { name: 'prep_plans_status_idx', columns: ['status', 'plannedOn'] },
    { name: 'prep_plans_planned_on_idx', columns: ['plannedOn'] },
    { name: 'prep_plans_updated_at_idx', columns: ['updatedAt'] },
    { name: 'prep_plans_created_by_idx', columns: ['createdById', 'plannedOn'] },
  ],
});
