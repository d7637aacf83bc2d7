import type { FloorAreaUnit, LabAreaKind, LabUnitClass } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `lab_areas`: a place marked as a lab unit or control area (one per place). */
export interface LabAreaRow {
  id: number;
  locationId: number;
  kind: LabAreaKind;
  unitClass: LabUnitClass;
  floorArea: number;
  floorAreaUnit: FloorAreaUnit;
  storey: number;
  instructional: boolean;
  flammableRuleSetId: number;
  containerSizeRuleSetId: number | null;
  notes: string;
  createdAt: string;
  updatedAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  location?: unknown;
  flammableRuleSet?: unknown;
  containerSizeRuleSet?: unknown;
}

export const LabAreaEntity = new EntitySchema<LabAreaRow>({
  name: 'LabArea',
  tableName: 'lab_areas',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    locationId: { name: 'location_id', type: 'integer' },
    kind: { type: 'varchar', length: 20 },
    unitClass: { name: 'unit_class', type: 'varchar', length: 2 },
    floorArea: { name: 'floor_area', type: 'double precision' },
    floorAreaUnit: { name: 'floor_area_unit', type: 'varchar', length: 4 },
    storey: { type: 'integer' },
    instructional: { type: 'boolean' },
    flammableRuleSetId: { name: 'flammable_rule_set_id', type: 'integer' },
    containerSizeRuleSetId: {
      name: 'container_size_rule_set_id',
      type: 'integer',
      nullable: true,
    },
    notes: { type: 'text' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    location: foreignKey('Location', 'location_id', 'lab_areas_location_fk', 'CASCADE'),
    flammableRuleSet: foreignKey(
      'RuleSet',
      'flammable_rule_set_id',
      'lab_areas_flammable_rule_set_fk',
      'RESTRICT',
    ),
    containerSizeRuleSet: foreignKey(
      'RuleSet',
      'container_size_rule_set_id',
      'lab_areas_container_size_rule_set_fk',
      'RESTRICT',
      true,
    ),
  },
  indices: [
    { name: 'lab_areas_location_unique', columns: ['locationId'], unique: true },
    { name: 'lab_areas_flammable_rule_set_idx', columns: ['flammableRuleSetId'] },
    { name: 'lab_areas_container_size_rule_set_idx', columns: ['containerSizeRuleSetId'] },
  ],
});
