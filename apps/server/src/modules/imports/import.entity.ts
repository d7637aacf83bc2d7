import type {
  ImportKind,
  ImportProblem,
  ImportStatus,
  ImportSummary,
  PriceListSummary,
} from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `imports`: one uploaded CSV, validated, then committed. `rows` holds the parsed,
 * normalized rows as JSON text until the commit (read only by the commit).
 */
export interface ImportRow {
  id: number;
  kind: ImportKind;
  /** The supplier of a price list; null for stock. */
  supplierId: number | null;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  supplier?: unknown;
  status: ImportStatus;
  fileName: string;
  userId: number | null;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  user?: unknown;
  totalRows: number;
  processedRows: number;
  errorCount: number;
  errors: ImportProblem[];
  warnings: string[];
  /** What the commit writes: a stock summary or a price-list summary, by `kind`. */
  summary: ImportSummary | PriceListSummary | null;
  rows: string | null;
  failure: string | null;
  createdAt: string;
  updatedAt: string;
  committedAt: string | null;
}

export const ImportEntity = new EntitySchema<ImportRow>({
  name: 'Import',
  tableName: 'imports',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    kind: { type: 'varchar', length: 12, default: 'stock' },
    supplierId: { name: 'supplier_id', type: 'integer', nullable: true },
    status: { type: 'varchar', length: 12 },
    fileName: { name: 'file_name', type: 'varchar', length: 255 },
    userId: { name: 'user_id', type: 'integer', nullable: true },
    totalRows: { name: 'total_rows', type: 'integer' },
    processedRows: { name: 'processed_rows', type: 'integer' },
    errorCount: { name: 'error_count', type: 'integer' },
    errors: { type: 'simple-json' },
    warnings: { type: 'simple-json' },
    summary: { type: 'simple-json', nullable: true },
    rows: { type: 'text', nullable: true },
    failure: { type: 'text', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
    committedAt: { name: 'committed_at', type: 'varchar', length: 24, nullable: true },
  },
  relations: {
    user: {
      type: 'many-to-one',
      target: 'User',
      joinColumn: { name: 'user_id', foreignKeyConstraintName: 'imports_user_fk' },
      onDelete: 'SET NULL',
      nullable: true,
    },
    supplier: foreignKey('Supplier', 'supplier_id', 'imports_supplier_fk', 'SET NULL', true),
  },
  indices: [{ name: 'imports_created_at_idx', columns: ['createdAt'] }],
});
