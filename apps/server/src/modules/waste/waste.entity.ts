import type { WasteCharacteristic, WasteForm, WasteStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `waste_containers`: a container that collects waste until its pickup. */
export interface WasteContainerRow {
  id: number;
  labelCode: string;
  labelNumber: number;
  title: string;
  locationId: number;
  capacity: number;
  capacityUnit: string;
  form: WasteForm;
  characteristics: WasteCharacteristic[];
  acutelyHazardous: boolean;
  accumulationStartOn: string | null;
  status: WasteStatus;
  pickupId: number | null;
  notes: string;
  createdAt: string;
  updatedAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  location?: unknown;
  pickup?: unknown;
}

export const WasteContainerEntity = new EntitySchema<WasteContainerRow>({
  name: 'WasteContainer',
  tableName: 'waste_containers',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    labelCode: { name: 'label_code', type: 'varchar', length: 20 },
    labelNumber: { name: 'label_number', type: 'integer' },
    title: { type: 'varchar', length: 120 },
    locationId: { name: 'location_id', type: 'integer' },
    capacity: { type: 'double precision' },
    capacityUnit: { name: 'capacity_unit', type: 'varchar', length: 8 },
    form: { type: 'varchar', length: 8 },
    characteristics: { type: 'simple-json' },
    acutelyHazardous: { name: 'acutely_hazardous', type: 'boolean' },
    accumulationStartOn: {
      name: 'accumulation_start_on',
      type: 'varchar',
      length: 10,
      nullable: true,
    },
    status: { type: 'varchar', length: 12 },
    pickupId: { name: 'pickup_id', type: 'integer', nullable: true },
    notes: { type: 'text' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    location: foreignKey('Location', 'location_id', 'waste_containers_location_fk', 'RESTRICT'),
    pickup: foreignKey('WastePickup', 'pickup_id', 'waste_containers_pickup_fk', 'RESTRICT', true),
  },
  indices: [
    { name: 'waste_containers_label_unique', columns: ['labelCode'], unique: true },
    { name: 'waste_containers_label_number_unique', columns: ['labelNumber'], unique: true },
    { name: 'waste_containers_status_location_idx', columns: ['status', 'locationId'] },
    { name: 'waste_containers_location_idx', columns: ['locationId'] },
    { name: 'waste_containers_pickup_idx', columns: ['pickupId'] },
  ],
});

/** A row of `waste_additions`: something that went into a waste container. */
export interface WasteAdditionRow {
  id: number;
  wasteContainerId: number;
  description: string;
  quantity: number;
  unit: string;
  runId: number | null;
  ledgerEntryId: number | null;
  addedById: number | null;
  addedAt: string;
  wasteContainer?: unknown;
  run?: unknown;
  ledgerEntry?: unknown;
  addedBy?: unknown;
}

export const WasteAdditionEntity = new EntitySchema<WasteAdditionRow>({
  name: 'WasteAddition',
  tableName: 'waste_additions',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    wasteContainerId: { name: 'waste_container_id', type: 'integer' },
    description: { type: 'varchar', length: 300 },
    quantity: { type: 'double precision' },
    unit: { type: 'varchar', length: 8 },
    runId: { name: 'run_id', type: 'integer', nullable: true },
    ledgerEntryId: { name: 'ledger_entry_id', type: 'integer', nullable: true },
    addedById: { name: 'added_by_id', type: 'integer', nullable: true },
    addedAt: { name: 'added_at', type: 'varchar', length: 24 },
  },
  relations: {
    wasteContainer: foreignKey(
      'WasteContainer',
      'waste_container_id',
      'waste_additions_container_fk',
      'RESTRICT',
    ),
    run: foreignKey('Run', 'run_id', 'waste_additions_run_fk', 'RESTRICT', true),
    ledgerEntry: foreignKey(
      'LedgerEntry',
      'ledger_entry_id',
      'waste_additions_ledger_entry_fk',
      'RESTRICT',
      true,
    ),
    addedBy: foreignKey('User', 'added_by_id', 'waste_additions_added_by_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'waste_additions_container_idx', columns: ['wasteContainerId'] },
    { name: 'waste_additions_run_idx', columns: ['runId'] },
    { name: 'waste_additions_ledger_entry_idx', columns: ['ledgerEntryId'] },
  ],
});

/** A row of `waste_addition_chemicals`: a chemical that went in with an addition. */
export interface WasteAdditionChemicalRow {
  id: number;
  wasteAdditionId: number;
  chemicalId: number;
  wasteAddition?: unknown;
  chemical?: unknown;
}

export const WasteAdditionChemicalEntity = new EntitySchema<WasteAdditionChemicalRow>({
  name: 'WasteAdditionChemical',
  tableName: 'waste_addition_chemicals',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    wasteAdditionId: { name: 'waste_addition_id', type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
  },
  relations: {
    wasteAddition: foreignKey(
      'WasteAddition',
      'waste_addition_id',
      'waste_addition_chemicals_addition_fk',
      'RESTRICT',
    ),
    chemical: foreignKey(
      'Chemical',
      'chemical_id',
      'waste_addition_chemicals_chemical_fk',
      'RESTRICT',
    ),
  },
  indices: [
    {
      name: 'waste_addition_chemicals_unique',
      columns: ['wasteAdditionId', 'chemicalId'],
      unique: true,
    },
    { name: 'waste_addition_chemicals_chemical_idx', columns: ['chemicalId'] },
  ],
});

/** A row of `waste_pickups`: a contractor took containers away under a manifest. */
export interface WastePickupRow {
  id: number;
  pickedUpOn: string;
  contractor: string;
  manifestNumber: string;
  notes: string;
  recordedById: number | null;
  createdAt: string;
  recordedBy?: unknown;
}

export const WastePickupEntity = new EntitySchema<WastePickupRow>({
  name: 'WastePickup',
  tableName: 'waste_pickups',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    pickedUpOn: { name: 'picked_up_on', type: 'varchar', length: 10 },
    contractor: { type: 'varchar', length: 200 },
    manifestNumber: { name: 'manifest_number', type: 'varchar', length: 60 },
    notes: { type: 'text' },
    recordedById: { name: 'recorded_by_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    recordedBy: foreignKey(
      'User',
      'recorded_by_id',
      'waste_pickups_recorded_by_fk',
      'SET NULL',
      true,
    ),
  },
  indices: [{ name: 'waste_pickups_picked_up_on_idx', columns: ['pickedUpOn'] }],
});

/** A row of `waste_areas`: a place marked as a waste accumulation area. */
export interface WasteAreaRow {
  id: number;
  locationId: number;
  ruleSetId: number;
  createdAt: string;
  location?: unknown;
  ruleSet?: unknown;
}

export const WasteAreaEntity = new EntitySchema<WasteAreaRow>({
  name: 'WasteArea',
  tableName: 'waste_areas',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    locationId: { name: 'location_id', type: 'integer' },
    ruleSetId: { name: 'rule_set_id', type: 'integer' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    location: foreignKey('Location', 'location_id', 'waste_areas_location_fk', 'RESTRICT'),
    ruleSet: foreignKey('RuleSet', 'rule_set_id', 'waste_areas_rule_set_fk', 'RESTRICT'),
  },
  indices: [
    { name: 'waste_areas_location_unique', columns: ['locationId'], unique: true },
    { name: 'waste_areas_rule_set_idx', columns: ['ruleSetId'] },
  ],
});

export const wasteEntities = [
  WastePickupEntity,
  WasteContainerEntity,
  WasteAdditionEntity,
  WasteAdditionChemicalEntity,
  WasteAreaEntity,
];
