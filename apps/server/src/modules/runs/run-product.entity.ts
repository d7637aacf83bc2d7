import type { StockUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `run_products`: a portion of product a run put into stock as a new lot. */
export interface RunProductRow {
  id: number;
  runId: number;
  lineIndex: number;
  label: string;
  lotId: number;
  containerId: number;
  chemicalId: number;
  quantity: number;
  unit: StockUnit;
  massG: number | null;
  percentYield: number | null;
  createdAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  run?: unknown;
  lot?: unknown;
  container?: unknown;
  chemical?: unknown;
}

export const RunProductEntity = new EntitySchema<RunProductRow>({
  name: 'RunProduct',
  tableName: 'run_products',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    runId: { name: 'run_id', type: 'integer' },
    lineIndex: { name: 'line_index', type: 'integer' },
    label: { type: 'varchar', length: 80 },
    lotId: { name: 'lot_id', type: 'integer' },
    containerId: { name: 'container_id', type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    quantity: { type: 'double precision' },
    unit: { type: 'varchar', length: 4 },
    massG: { name: 'mass_g', type: 'double precision', nullable: true },
    percentYield: { name: 'percent_yield', type: 'double precision', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    run: foreignKey('Run', 'run_id', 'run_products_run_fk', 'RESTRICT'),
    lot: foreignKey('Lot', 'lot_id', 'run_products_lot_fk', 'RESTRICT'),
    container: foreignKey('Container', 'container_id', 'run_products_container_fk', 'RESTRICT'),
    chemical: foreignKey('Chemical', 'chemical_id', 'run_products_chemical_fk', 'RESTRICT'),
  },
  indices: [
    { name: 'run_products_run_idx', columns: ['runId'] },
    { name: 'run_products_lot_idx', columns: ['lotId'] },
  ],
});
