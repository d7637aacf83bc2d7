import type { LedgerReason, StockUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { microQuantity } from '../../db/quantities';

/** A row of `ledger_entries`: append-only, never updated or deleted. */
export interface LedgerEntryRow {
  id: number;
  containerId: number;
  reason: LedgerReason;
  quantity: number;
  unit: StockUnit;
  balanceAfter: number;
  note: string;
  userId: number | null;
  runId: number | null;
  orderId: number | null;
  stocktakeId: number | null;
  fromLocationId: number | null;
  toLocationId: number | null;
  relatedContainerId: number | null;
  createdAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  container?: unknown;
  user?: unknown;
}

export const LedgerEntryEntity = new EntitySchema<LedgerEntryRow>({
  name: 'LedgerEntry',
  tableName: 'ledger_entries',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    containerId: { name: 'container_id', type: 'integer' },
    reason: { type: 'varchar', length: 12 },
    /** Whole millionths of the unit in the database; g or mL here (see db/quantities). */
    quantity: { name: 'quantity_micro', type: 'bigint', transformer: microQuantity },
    unit: { type: 'varchar', length: 4 },
    balanceAfter: { name: 'balance_after_micro', type: 'bigint', transformer: microQuantity },
    note: { type: 'text' },
    userId: { name: 'user_id', type: 'integer', nullable: true },
    runId: { name: 'run_id', type: 'integer', nullable: true },
    orderId: { name: 'order_id', type: 'integer', nullable: true },
    stocktakeId: { name: 'stocktake_id', type: 'integer', nullable: true },
    fromLocationId: { name: 'from_location_id', type: 'integer', nullable: true },
    toLocationId: { name: 'to_location_id', type: 'integer', nullable: true },
    relatedContainerId: { name: 'related_container_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    container: {
      type: 'many-to-one',
      target: 'Container',
      joinColumn: { name: 'container_id', foreignKeyConstraintName: 'ledger_entries_container_fk' },
      onDelete: 'RESTRICT',
    },
    user: {
      type: 'many-to-one',
      target: 'User',
      joinColumn: { name: 'user_id', foreignKeyConstraintName: 'ledger_entries_user_fk' },
      onDelete: 'SET NULL',
      nullable: true,
    },
  },
  indices: [
    { name: 'ledger_entries_container_idx', columns: ['containerId', 'id'] },
    { name: 'ledger_entries_created_at_idx', columns: ['createdAt'] },
    { name: 'ledger_entries_container_user_idx', columns: ['containerId', 'userId'] },
  ],
});
