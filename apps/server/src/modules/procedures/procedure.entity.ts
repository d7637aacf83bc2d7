import type { CautionFlags, ProcedureStep } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `procedures`: a preparation at base scale; its lines are in `procedure_lines`. */
export interface ProcedureRow {
  id: number;
  title: string;
  reference: string;
  baseScale: string;
  expectedYieldPercent: number | null;
  meltingLowC: number | null;
  meltingHighC: number | null;
  cautions: string;
  cautionFlags: CautionFlags;
  /** In order (JSON); see shared `procedureStepInputSchema`. */
  steps: ProcedureStep[];
  createdById: number | null;
  createdAt: string;
  updatedAt: string;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  createdBy?: unknown;
}

export const ProcedureEntity = new EntitySchema<ProcedureRow>({
  name: 'Procedure',
  tableName: 'procedures',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    title: { type: 'varchar', length: 200 },
    reference: { type: 'text' },
    baseScale: { name: 'base_scale', type: 'text' },
    expectedYieldPercent: {
      name: 'expected_yield_percent',
      type: 'double precision',
      nullable: true,
    },
    meltingLowC: { name: 'melting_low_c', type: 'double precision', nullable: true },
    meltingHighC: { name: 'melting_high_c', type: 'double precision', nullable: true },
    cautions: { type: 'text' },
    cautionFlags: { name: 'caution_flags', type: 'simple-json' },
    steps: { type: 'simple-json', default: '[]' },
    createdById: { name: 'created_by_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    createdBy: foreignKey('User', 'created_by_id', 'procedures_created_by_fk', 'SET NULL', true),
  },
  indices: [{ name: 'procedures_title_idx', columns: ['title'] }],
});
