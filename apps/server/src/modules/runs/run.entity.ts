import type { ChemWarning, ProcedureLine, StoichiometryResult } from '@lotwise/chem';
import type { RunStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `runs`: one performance of a procedure. Open until recorded; recording stores
 * the amounts really used (`actualLines`) and their stoichiometry, so later edits of the
 * procedure do not change the history.
 */
export interface RunRow {
  id: number;
  procedureId: number;
  planId: number | null;
  scaleFactor: number;
  status: RunStatus;
  performedById: number | null;
  performedOn: string | null;
  theoreticalYieldG: number | null;
  crudeMassG: number | null;
  productMassG: number | null;
  percentYield: number | null;
  crudePercentYield: number | null;
  /** Flag of the purified yield (portions put into stock). */
  yieldFlag: string | null;
  /** Flag of the crude yield, on its own. */
  crudeYieldFlag: string | null;
  meltingLowC: number | null;
  meltingHighC: number | null;
  appearance: string;
  observationNotes: string;
  notes: string;
  actualLines: ProcedureLine[] | null;
  stoichiometry: StoichiometryResult | null;
  warnings: ChemWarning[];
  notices: string[];
  recordedAt: string | null;
  createdAt: string;
  updatedAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  procedure?: unknown;
  plan?: unknown;
  performedBy?: unknown;
}

export const RunEntity = new EntitySchema<RunRow>({
  name: 'Run',
  tableName: 'runs',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    procedureId: { name: 'procedure_id', type: 'integer' },
    planId: { name: 'plan_id', type: 'integer', nullable: true },
    scaleFactor: { name: 'scale_factor', type: 'double precision' },
    status: { type: 'varchar', length: 10 },
    performedById: { name: 'performed_by_id', type: 'integer', nullable: true },
    performedOn: { name: 'performed_on', type: 'varchar', length: 10, nullable: true },
    theoreticalYieldG: { name: 'theoretical_yield_g', type: 'double precision', nullable: true },
    crudeMassG: { name: 'crude_mass_g', type: 'double precision', nullable: true },
    productMassG: { name: 'product_mass_g', type: 'double precision', nullable: true },
    percentYield: { name: 'percent_yield', type: 'double precision', nullable: true },
    crudePercentYield: { name: 'crude_percent_yield', type: 'double precision', nullable: true },
    yieldFlag: { name: 'yield_flag', type: 'text', nullable: true },
    crudeYieldFlag: { name: 'crude_yield_flag', type: 'text', nullable: true },
    meltingLowC: { name: 'melting_low_c', type: 'double precision', nullable: true },
    meltingHighC: { name: 'melting_high_c', type: 'double precision', nullable: true },
    appearance: { type: 'text' },
    observationNotes: { name: 'observation_notes', type: 'text' },
    notes: { type: 'text' },
    actualLines: { name: 'actual_lines', type: 'simple-json', nullable: true },
    stoichiometry: { type: 'simple-json', nullable: true },
    warnings: { type: 'simple-json' },
    notices: { type: 'simple-json' },
    recordedAt: { name: 'recorded_at', type: 'varchar', length: 24, nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    procedure: foreignKey('Procedure', 'procedure_id', 'runs_procedure_fk', 'RESTRICT'),
    plan: foreignKey('Plan', 'plan_id', 'runs_plan_fk', 'RESTRICT', true),
    performedBy: foreignKey('User', 'performed_by_id', 'runs_performed_by_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'runs_procedure_idx', columns: ['procedureId', 'status'] },
    { name: 'runs_plan_idx', columns: ['planId'] },
    { name: 'runs_created_at_idx', columns: ['createdAt'] },
    { name: 'runs_performed_on_idx', columns: ['performedOn'] },
    { name: 'runs_percent_yield_idx', columns: ['percentYield'] },
    { name: 'runs_status_idx', columns: ['status', 'createdAt'] },
  ],
});
