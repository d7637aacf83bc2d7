import type { LotSource } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/** A row of `lots`: one batch of one chemical, purchased or prepared. */
export interface LotRow {
  id: number;
  chemicalId: number;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  chemical?: unknown;
  source: LotSource;
  supplierName: string | null;
  supplierLotNumber: string | null;
  grade: string | null;
  /** Null: the chemical's default purity applies. */
  purityPercent: number | null;
  receivedOn: string;
  expiresOn: string | null;
  /** Filled in by runs; no foreign key until the runs table exists. */
  madeByRunId: number | null;
  /** Certificate of analysis: original name, random stored name, bytes, detected type, time. */
  certificateFileName: string | null;
  certificateStoredName: string | null;
  certificateSize: number | null;
  certificateContentType: string | null;
  certificateUploadedAt: string | null;
  notes: string;
  createdAt: string;
  updatedAt: string;
}

export const LotEntity = new EntitySchema<LotRow>({
  name: 'Lot',
  tableName: 'lots',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    source: { type: 'varchar', length: 10 },
    supplierName: { name: 'supplier_name', type: 'varchar', length: 200, nullable: true },
    supplierLotNumber: {
      name: 'supplier_lot_number',
      type: 'varchar',
      length: 80,
      nullable: true,
    },
    grade: { type: 'varchar', length: 80, nullable: true },
    purityPercent: { name: 'purity_percent', type: 'double precision', nullable: true },
    receivedOn: { name: 'received_on', type: 'varchar', length: 10 },
    expiresOn: { name: 'expires_on', type: 'varchar', length: 10, nullable: true },
    madeByRunId: { name: 'made_by_run_id', type: 'integer', nullable: true },
    certificateFileName: {
      name: 'certificate_file_name',
      type: 'varchar',
      length: 255,
      nullable: true,
    },
    certificateStoredName: {
      name: 'certificate_stored_name',
      type: 'varchar',
      length: 100,
      nullable: true,
    },
    certificateSize: { name: 'certificate_size', type: 'integer', nullable: true },
    certificateContentType: {
      name: 'certificate_content_type',
      type: 'varchar',
      length: 40,
      nullable: true,
    },
    certificateUploadedAt: {
      name: 'certificate_uploaded_at',
      type: 'varchar',
      length: 24,
      nullable: true,
    },
    notes: { type: 'text' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    chemical: {
      type: 'many-to-one',
      target: 'Chemical',
      joinColumn: { name: 'chemical_id', foreignKeyConstraintName: 'lots_chemical_fk' },
      onDelete: 'RESTRICT',
    },
  },
  indices: [
    { name: 'lots_chemical_idx', columns: ['chemicalId'] },
    { name: 'lots_expires_on_idx', columns: ['expiresOn'] },
    { name: 'lots_received_on_idx', columns: ['receivedOn'] },
    { name: 'lots_updated_at_idx', columns: ['updatedAt'] },
    { name: 'lots_source_idx', columns: ['source', 'receivedOn'] },
  ],
});
