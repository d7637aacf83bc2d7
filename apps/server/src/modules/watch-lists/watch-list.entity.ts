import type { ThresholdComparison } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `watch_lists`: a regulator's list of restricted or reportable substances. */
export interface WatchListRow {
  id: number;
  /** Set on the built-in presets (which the migration inserted); null on a lab's own list. */
  presetKey: string | null;
  jurisdiction: string;
  name: string;
  source: string;
  edition: string;
  notes: string;
  builtIn: boolean;
  chosen: boolean;
  createdAt: string;
  updatedAt: string;
}

export const WatchListEntity = new EntitySchema<WatchListRow>({
  name: 'WatchList',
  tableName: 'watch_lists',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    presetKey: { name: 'preset_key', type: 'varchar', length: 60, nullable: true },
    jurisdiction: { type: 'varchar', length: 120 },
    name: { type: 'varchar', length: 200 },
    source: { type: 'varchar', length: 300 },
    edition: { type: 'varchar', length: 120 },
    notes: { type: 'text' },
    builtIn: { name: 'built_in', type: 'boolean' },
    chosen: { type: 'boolean' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  indices: [
    { name: 'watch_lists_name_unique', columns: ['name'], unique: true },
    { name: 'watch_lists_preset_key_unique', columns: ['presetKey'], unique: true },
  ],
});

/** A row of `watch_list_entries`: one substance on a list, with its threshold and source. */
export interface WatchListEntryRow {
  id: number;
  listId: number;
  substance: string;
  casNumber: string;
  thresholdPercent: number | null;
  thresholdBasis: string;
  comparison: ThresholdComparison;
  action: string;
  source: string;
  list?: unknown;
}

export const WatchListEntryEntity = new EntitySchema<WatchListEntryRow>({
  name: 'WatchListEntry',
  tableName: 'watch_list_entries',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    listId: { name: 'list_id', type: 'integer' },
    substance: { type: 'varchar', length: 200 },
    casNumber: { name: 'cas_number', type: 'varchar', length: 12 },
    thresholdPercent: { name: 'threshold_percent', type: 'double precision', nullable: true },
    thresholdBasis: { name: 'threshold_basis', type: 'varchar', length: 60 },
    comparison: { type: 'varchar', length: 12 },
    action: { type: 'text' },
    source: { type: 'varchar', length: 300 },
  },
  relations: {
    list: foreignKey('WatchList', 'list_id', 'watch_list_entries_list_fk', 'RESTRICT'),
  },
  indices: [
    { name: 'watch_list_entries_list_idx', columns: ['listId'] },
    { name: 'watch_list_entries_cas_idx', columns: ['casNumber'] },
  ],
});

/** A row of `order_watch_approvals`: a manager approved the watched chemicals of an order. */
export interface OrderWatchApprovalRow {
  id: number;
  orderId: number;
  approvedById: number | null;
  reason: string;
  /** The chemicals the approval covered (a new watched chemical on the lines clears it). */
  chemicalIds: number[];
  approvedAt: string;
  order?: unknown;
  approvedBy?: unknown;
}

export const OrderWatchApprovalEntity = new EntitySchema<OrderWatchApprovalRow>({
  name: 'OrderWatchApproval',
  tableName: 'order_watch_approvals',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    orderId: { name: 'order_id', type: 'integer' },
    approvedById: { name: 'approved_by_id', type: 'integer', nullable: true },
    reason: { type: 'text' },
    chemicalIds: { name: 'chemical_ids', type: 'simple-json' },
    approvedAt: { name: 'approved_at', type: 'varchar', length: 24 },
  },
  relations: {
    order: foreignKey('Order', 'order_id', 'order_watch_approvals_order_fk', 'RESTRICT'),
    approvedBy: foreignKey(
      'User',
      'approved_by_id',
      'order_watch_approvals_approved_by_fk',
      'SET NULL',
      true,
    ),
  },
  indices: [{ name: 'order_watch_approvals_order_unique', columns: ['orderId'], unique: true }],
});
