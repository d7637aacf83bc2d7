import type { ContainerMaterial, ContainerStatus, StockUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';
import { microQuantity } from '../../db/quantities';

/**
 * A row of `containers`. `quantity` is the running balance of its ledger entries, written
 * only together with an entry. `chemicalId`, `expiresOn` (the lot's) and `peroxideDueOn`
 * are copies kept for fast filters.
 */
export interface ContainerRow {
  id: number;
  labelCode: string;
  /** The number of an `LW-` label code, for generating the next one; null for other codes. */
  labelNumber: number | null;
  lotId: number;
  chemicalId: number;
  locationId: number;
  status: ContainerStatus;
  quantity: number;
  unit: StockUnit;
  tareMass: number | null;
  capacity: number | null;
  capacityUnit: string | null;
  /** What it is made of, for the container-size limits; null: not said. */
  material?: ContainerMaterial | null;
  openedOn: string | null;
  expiresOn: string | null;
  peroxideDueOn: string | null;
  notes: string;
  /** The member a container belongs to (their portion of a shared order); null: the lab's. */
  ownerId?: number | null;
  createdAt: string;
  updatedAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  lot?: unknown;
  chemical?: unknown;
  location?: unknown;
  owner?: unknown;
}

export const ContainerEntity = new EntitySchema<ContainerRow>({
  name: 'Container',
  tableName: 'containers',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    labelCode: { name: 'label_code', type: 'varchar', length: 20 },
    labelNumber: { name: 'label_number', type: 'integer', nullable: true },
    lotId: { name: 'lot_id', type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    locationId: { name: 'location_id', type: 'integer' },
    status: { type: 'varchar', length: 10 },
    /** Whole millionths of the unit in the database; g or mL here (see db/quantities). */
    quantity: { name: 'quantity_micro', type: 'bigint', transformer: microQuantity },
    unit: { type: 'varchar', length: 4 },
    tareMass: { name: 'tare_mass', type: 'double precision', nullable: true },
    capacity: { type: 'double precision', nullable: true },
    capacityUnit: { name: 'capacity_unit', type: 'varchar', length: 8, nullable: true },
    material: { type: 'varchar', length: 20, nullable: true },
    openedOn: { name: 'opened_on', type: 'varchar', length: 10, nullable: true },
    expiresOn: { name: 'expires_on', type: 'varchar', length: 10, nullable: true },
    peroxideDueOn: { name: 'peroxide_due_on', type: 'varchar', length: 10, nullable: true },
    notes: { type: 'text' },
    ownerId: { name: 'owner_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    lot: {
      type: 'many-to-one',
      target: 'Lot',
      joinColumn: { name: 'lot_id', foreignKeyConstraintName: 'containers_lot_fk' },
      onDelete: 'RESTRICT',
    },
    chemical: {
      type: 'many-to-one',
      target: 'Chemical',
      joinColumn: { name: 'chemical_id', foreignKeyConstraintName: 'containers_chemical_fk' },
      onDelete: 'RESTRICT',
    },
    location: {
      type: 'many-to-one',
      target: 'Location',
      joinColumn: { name: 'location_id', foreignKeyConstraintName: 'containers_location_fk' },
      onDelete: 'RESTRICT',
    },
    owner: foreignKey('User', 'owner_id', 'containers_owner_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'containers_owner_idx', columns: ['ownerId'] },
    { name: 'containers_label_code_unique', columns: ['labelCode'], unique: true },
    { name: 'containers_label_number_unique', columns: ['labelNumber'], unique: true },
    { name: 'containers_lot_idx', columns: ['lotId'] },
    { name: 'containers_status_idx', columns: ['status'] },
    { name: 'containers_expires_on_idx', columns: ['expiresOn'] },
    { name: 'containers_peroxide_due_on_idx', columns: ['peroxideDueOn'] },
    {
      name: 'containers_stock_idx',
      columns: ['chemicalId', 'status', 'expiresOn', 'quantity', 'locationId'],
    },
    { name: 'containers_location_status_idx', columns: ['locationId', 'status', 'chemicalId'] },
    { name: 'containers_quantity_idx', columns: ['quantity'] },
    { name: 'containers_updated_at_idx', columns: ['updatedAt'] },
  ],
});
