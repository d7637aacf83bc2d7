import type { LineConcentration, LineRole } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `procedure_lines`: one chemical of a procedure at base scale, in order. */
export interface ProcedureLineRow {
  id: number;
  procedureId: number;
  position: number;
  chemicalId: number;
  role: LineRole;
  quantity: number | null;
  unit: string | null;
  coefficient: number | null;
  optional: boolean;
  notes: string;
  concentration: LineConcentration | null;
  solutionDensity: number | null;
  dissolvedInChemicalId: number | null;
  dissolvedInQuantity: number | null;
  dissolvedInUnit: string | null;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  procedure?: unknown;
  chemical?: unknown;
  dissolvedInChemical?: unknown;
}

export const ProcedureLineEntity = new EntitySchema<ProcedureLineRow>({
  name: 'ProcedureLine',
  tableName: 'procedure_lines',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    procedureId: { name: 'procedure_id', type: 'integer' },
    position: { type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    role: { type: 'varchar', length: 20 },
    quantity: { type: 'double precision', nullable: true },
    unit: { type: 'varchar', length: 8, nullable: true },
    coefficient: { type: 'double precision', nullable: true },
    optional: { type: 'boolean' },
    notes: { type: 'text' },
    concentration: { type: 'simple-json', nullable: true },
    solutionDensity: { name: 'solution_density', type: 'double precision', nullable: true },
    dissolvedInChemicalId: { name: 'dissolved_in_chemical_id', type: 'integer', nullable: true },
    dissolvedInQuantity: {
      name: 'dissolved_in_quantity',
      type: 'double precision',
      nullable: true,
    },
    dissolvedInUnit: { name: 'dissolved_in_unit', type: 'varchar', length: 8, nullable: true },
  },
  relations: {
    procedure: foreignKey('Procedure', 'procedure_id', 'procedure_lines_procedure_fk', 'RESTRICT'),
    chemical: foreignKey('Chemical', 'chemical_id', 'procedure_lines_chemical_fk', 'RESTRICT'),
    dissolvedInChemical: foreignKey(
      'Chemical',
      'dissolved_in_chemical_id',
      'procedure_lines_dissolved_in_fk',
      'RESTRICT',
      true,
    ),
  },
  indices: [
    { name: 'procedure_lines_procedure_idx', columns: ['procedureId', 'position'] },
    { name: 'procedure_lines_chemical_idx', columns: ['chemicalId'] },
  ],
});
