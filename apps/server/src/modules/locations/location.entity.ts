import type { FlammableStorageKind, LocationKind, StorageGroup } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/**
 * A row of `locations`. `path` (names) and `idPath` (`/1/4/9/`) are kept for every place so
 * a path reads without recursion and a subtree is one `LIKE '/1/4/%'`.
 */
export interface LocationRow {
  id: number;
  name: string;
  kind: LocationKind;
  parentId: number | null;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  parent?: unknown;
  path: string;
  idPath: string;
  depth: number;
  storageGroups: StorageGroup[];
  notes: string;
  /** An approved flammable-storage cabinet or safety-can place; null: neither. */
  flammableStorage?: FlammableStorageKind | null;
  createdAt: string;
  updatedAt: string;
}

export const LocationEntity = new EntitySchema<LocationRow>({
  name: 'Location',
  tableName: 'locations',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    name: { type: 'varchar', length: 120 },
    kind: { type: 'varchar', length: 12 },
    parentId: { name: 'parent_id', type: 'integer', nullable: true },
    path: { type: 'text' },
    idPath: { name: 'id_path', type: 'varchar', length: 400 },
    depth: { type: 'integer' },
    storageGroups: { name: 'storage_groups', type: 'simple-json' },
    notes: { type: 'text' },
    flammableStorage: { name: 'flammable_storage', type: 'varchar', length: 12, nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    parent: {
      type: 'many-to-one',
      target: 'Location',
      joinColumn: { name: 'parent_id', foreignKeyConstraintName: 'locations_parent_fk' },
      onDelete: 'RESTRICT',
      nullable: true,
    },
  },
  indices: [
    { name: 'locations_parent_idx', columns: ['parentId'] },
    { name: 'locations_id_path_idx', columns: ['idPath'] },
    // On LOWER(path): made by the migration, not by TypeORM, which cannot declare it.
    { name: 'locations_path_lower_idx', columns: ['path'], synchronize: false },
  ],
});
