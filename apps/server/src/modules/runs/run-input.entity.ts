import type { StockUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `run_inputs`: one draw of a run from a container (provenance of its products). */
export interface RunInputRow {
  id: number;
  runId: number;
  /** Procedure line, or null for an extra draw. */
  lineIndex: number | null;
  purpose: string;
  containerId: number;
  lotId: number;
  chemicalId: number;
  ledgerEntryId: number;
  /** Drawn (positive), in the container's unit. */
  quantity: number;
  unit: StockUnit;
  purityPercent: number;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  run?: unknown;
  container?: unknown;
  lot?: unknown;
  chemical?: unknown;
  ledgerEntry?: unknown;
}

export const RunInputEntity = new EntitySchema<RunInputRow>({
  name: 'RunInput',
  tableName: 'run_inputs',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    runId: { name: 'run_id', type: 'integer' },
    lineIndex: { name: 'line_index', type: 'integer', nullable: true },
    purpose: { type: 'text' },
    containerId: { name: 'container_id', type: 'integer' },
    lotId: { name: 'lot_id', type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    ledgerEntryId: { name: 'ledger_entry_id', type: 'integer' },
    quantity: { type: 'double precision' },
    unit: { type: 'varchar', length: 4 },
    purityPercent: { name: 'purity_percent', type: 'double precision' },
  },
  relations: {
    run: foreignKey('Run', 'run_id', 'run_inputs_run_fk', 'RESTRICT'),
    container: foreignKey('Container', 'container_id', 'run_inputs_container_fk', 'RESTRICT'),
    lot: foreignKey('Lot', 'lot_id', 'run_inputs_lot_fk', 'RESTRICT'),
    chemical: foreignKey('Chemical', 'chemical_id', 'run_inputs_chemical_fk', 'RESTRICT'),
    ledgerEntry: foreignKey(
      'LedgerEntry',
      'ledger_entry_id',
      'run_inputs_ledger_entry_fk',
      'RESTRICT',
    ),
  },
  indices: [
    { name: 'run_inputs_run_idx', columns: ['runId'] },
    { name: 'run_inputs_lot_idx', columns: ['lotId'] },
    { name: 'run_inputs_chemical_idx', columns: ['chemicalId'] },
    { name: 'run_inputs_container_idx', columns: ['containerId'] },
  ],
});
