import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `run_photos`: a photo taken at the bench during a run, kept in the upload folder
 * under `storedName`; unique per run by the id the device gave it (`clientId`).
 */
export interface RunPhotoRow {
  id: number;
  runId: number;
  clientId: string;
  /** The name the file had on the device (sanitized, with the extension of its content). */
  fileName: string;
  storedName: string;
  size: number;
  contentType: string;
  uploadedAt: string;
  uploadedById: number | null;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  run?: unknown;
  uploadedBy?: unknown;
}

export const RunPhotoEntity = new EntitySchema<RunPhotoRow>({
  name: 'RunPhoto',
  tableName: 'run_photos',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    runId: { name: 'run_id', type: 'integer' },
    clientId: { name: 'client_id', type: 'varchar', length: 64 },
    fileName: { name: 'file_name', type: 'varchar', length: 255 },
    storedName: { name: 'stored_name', type: 'varchar', length: 64 },
    size: { type: 'integer' },
    contentType: { name: 'content_type', type: 'varchar', length: 40 },
    uploadedAt: { name: 'uploaded_at', type: 'varchar', length: 24 },
    uploadedById: { name: 'uploaded_by_id', type: 'integer', nullable: true },
  },
  relations: {
    run: foreignKey('Run', 'run_id', 'run_photos_run_fk', 'RESTRICT'),
    uploadedBy: foreignKey('User', 'uploaded_by_id', 'run_photos_uploaded_by_fk', 'SET NULL', true),
  },
  indices: [{ name: 'run_photos_client_unique', columns: ['runId', 'clientId'], unique: true }],
});
