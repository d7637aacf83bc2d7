import { type MigrationInterface, type QueryRunner, Table, type TableColumnOptions } from 'typeorm';
import { onPostgres } from '../postgres';
import { withPlaceholders } from '../sql';

const id: TableColumnOptions = {
  name: 'id',
  type: 'integer',
  isPrimary: true,
  isGenerated: true,
  generationStrategy: 'increment',
};
const varchar = (name: string, length: number, isNullable = false): TableColumnOptions => ({
  name,
  type: 'varchar',
  length: String(length),
  isNullable,
});

const GALLONS_PER_PINT = 0.125; // NIST SP 811: 1 US pint = 1/8 US gallon
const GALLONS_PER_QUART = 0.25; // NIST SP 811: 1 US quart = 1/4 US gallon

/**
 * The rule sets Lotwise ships with. Frozen here as they were first shipped: a later edition is
 * a new set in a new migration, never an edit of this one.
 */
const builtInSets = [
  {
    kind: 'flammable-limits',
    name: 'NFPA 45 laboratory unit limits',
    source: 'NFPA 45',
    edition: '2024',
    reference: 'Table 9.1.1',
    notes:
      'Figures as published in public summaries of NFPA 45 (2024) Table 9.1.1, not read from the text of the standard. Confirm them with the edition your authority having jurisdiction adopted.',
    data: {
      unit: 'gal',
      // NFPA 45 (2024) Table 9.1.1 (public summary): figures per 100 ft² of lab unit.
      perFloorArea: { value: 100, unit: 'ft2' },
      byUnitClass: [
        // NFPA 45 (2024) Table 9.1.1 (public summary): Class A 20 / 40 gal, at most 480 / 1,600 gal
        {
          unitClass: 'A',
          perArea: { classI: 20, classesIToIIIA: 40 },
          maxPerUnit: { classI: 480, classesIToIIIA: 1600 },
        },
        // NFPA 45 (2024) Table 9.1.1 (public summary): Class B 10 / 20 gal, at most 480 / 800 gal
        {
          unitClass: 'B',
          perArea: { classI: 10, classesIToIIIA: 20 },
          maxPerUnit: { classI: 480, classesIToIIIA: 800 },
        },
        // NFPA 45 (2024) Table 9.1.1 (public summary): Class C 4 / 8 gal, at most 300 / 400 gal
        {
          unitClass: 'C',
          perArea: { classI: 4, classesIToIIIA: 8 },
          maxPerUnit: { classI: 300, classesIToIIIA: 400 },
        },
        // NFPA 45 (2024) Table 9.1.1 (public summary): Class D 2 / 2 gal, at most 150 / 150 gal
        {
          unitClass: 'D',
          perArea: { classI: 2, classesIToIIIA: 2 },
          maxPerUnit: { classI: 150, classesIToIIIA: 150 },
        },
      ],
      // NFPA 45 (2024) Table 9.1.1 (public summary): outside cabinets and safety cans, half.
      outsideStorageFactor: 0.5,
      // NFPA 45 (2024) Table 9.1.1 (public summary): instructional labs Class C or D, 50 % of C.
      instructional: { allowedUnitClasses: ['C', 'D'], limitedToUnitClass: 'C', factor: 0.5 },
      storeyReductions: [
        // NFPA 45 (2024) Table 9.1.1 (public summary): Class B −50 % above the 3rd storey.
        { unitClasses: ['B'], fromStorey: 4, toStorey: null, factor: 0.5 },
        // NFPA 45 (2024) Table 9.1.1 (public summary): Classes C, D −25 % on storeys 4–6.
        { unitClasses: ['C', 'D'], fromStorey: 4, toStorey: 6, factor: 0.75 },
        // NFPA 45 (2024) Table 9.1.1 (public summary): Classes C, D −50 % above the 6th storey.
        { unitClasses: ['C', 'D'], fromStorey: 7, toStorey: null, factor: 0.5 },
      ],
      // NFPA 45 (2024) §9.1 (public summary): waste ignitable liquids count toward the totals.
      countsIgnitableWaste: true,
      perCabinet: null,
    },
  },
  {
    kind: 'container-sizes',
    name: 'Largest container for flammable and combustible liquids',
    source: 'NFPA 30',
    edition: '2024',
    reference: 'Table 9.4.3',
    notes:
      'From memory of NFPA 30 Table 9.4.3 (NFPA 45 repeats the same sizes for laboratories), not read from the text: glass, metal (other than drums) or approved plastic, and safety cans. Class IIIB is not limited here. Confirm with the edition your authority adopted.',
    data: {
      unit: 'gal',
      limits: [
        // from memory (NFPA 30 Table 9.4.3): glass IA 1 pt, IB 1 qt, IC 1 gal, II 1 gal, IIIA 5 gal
        { liquidClass: 'IA', material: 'glass', maxCapacity: GALLONS_PER_PINT },
        { liquidClass: 'IB', material: 'glass', maxCapacity: GALLONS_PER_QUART },
        { liquidClass: 'IC', material: 'glass', maxCapacity: 1 },
        { liquidClass: 'II', material: 'glass', maxCapacity: 1 },
        { liquidClass: 'IIIA', material: 'glass', maxCapacity: 5 },
        // from memory (NFPA 30 Table 9.4.3): metal IA 1 gal, IB–IIIA 5 gal
        { liquidClass: 'IA', material: 'metal', maxCapacity: 1 },
        { liquidClass: 'IB', material: 'metal', maxCapacity: 5 },
        { liquidClass: 'IC', material: 'metal', maxCapacity: 5 },
        { liquidClass: 'II', material: 'metal', maxCapacity: 5 },
        { liquidClass: 'IIIA', material: 'metal', maxCapacity: 5 },
        // from memory (NFPA 30 Table 9.4.3): approved plastic as metal
        { liquidClass: 'IA', material: 'approved-plastic', maxCapacity: 1 },
        { liquidClass: 'IB', material: 'approved-plastic', maxCapacity: 5 },
        { liquidClass: 'IC', material: 'approved-plastic', maxCapacity: 5 },
        { liquidClass: 'II', material: 'approved-plastic', maxCapacity: 5 },
        { liquidClass: 'IIIA', material: 'approved-plastic', maxCapacity: 5 },
        // from memory (NFPA 30 Table 9.4.3): safety cans IA 2 gal, IB–IIIA 5 gal
        { liquidClass: 'IA', material: 'safety-can', maxCapacity: 2 },
        { liquidClass: 'IB', material: 'safety-can', maxCapacity: 5 },
        { liquidClass: 'IC', material: 'safety-can', maxCapacity: 5 },
        { liquidClass: 'II', material: 'safety-can', maxCapacity: 5 },
        { liquidClass: 'IIIA', material: 'safety-can', maxCapacity: 5 },
      ],
    },
  },
  {
    kind: 'waste-accumulation',
    name: 'Satellite accumulation area',
    source: 'US EPA, 40 CFR',
    edition: '',
    reference: '§262.15',
    notes:
      'Up to 55 gallons of hazardous waste, or 1 quart of liquid acutely hazardous waste, at or near the point of generation; once exceeded, the excess is removed within 3 consecutive calendar days. States may be stricter.',
    data: {
      maxHazardous: { value: 55, unit: 'gal' }, // 40 CFR 262.15(a): 55 gallons
      maxAcutelyHazardous: { value: 1, unit: 'qt' }, // 40 CFR 262.15(a): 1 quart
      daysAllowedOnceExceeded: 3, // 40 CFR 262.15(a)(6): 3 consecutive calendar days
      maxAccumulationDays: null, // 40 CFR 262.15: no time limit below the volume limits
      nearFraction: 0.9, // common practice, no source
    },
  },
];

/**
 * Room rules: rule sets as data (`rule_sets`, with the built-in ones), lab areas marked on
 * places (`lab_areas`), places flagged as approved flammable storage
 * (`locations.flammable_storage`) and what a container is made of (`containers.material`).
 */
export class LabAreas1796980000000 implements MigrationInterface {
  name = 'LabAreas1796980000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'rule_sets',
        columns: [
          id,
          varchar('kind', 30),
          varchar('name', 120),
          varchar('source', 300),
          varchar('edition', 60),
          varchar('reference', 120),
          { name: 'notes', type: 'text' },
          { name: 'built_in', type: 'boolean' },
          { name: 'data', type: 'text' },
          varchar('created_at', 24),
          varchar('updated_at', 24),
        ],
        indices: [{ name: 'rule_sets_kind_idx', columnNames: ['kind'] }],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'lab_areas',
        columns: [
          id,
          { name: 'location_id', type: 'integer' },
          varchar('kind', 20),
          varchar('unit_class', 2),
          { name: 'floor_area', type: 'double precision' },
          varchar('floor_area_unit', 4),
          { name: 'storey', type: 'integer' },
          { name: 'instructional', type: 'boolean' },
          { name: 'flammable_rule_set_id', type: 'integer' },
          { name: 'container_size_rule_set_id', type: 'integer', isNullable: true },
          { name: 'notes', type: 'text' },
          varchar('created_at', 24),
          varchar('updated_at', 24),
        ],
        foreignKeys: [
          {
            name: 'lab_areas_location_fk',
            columnNames: ['location_id'],
            referencedTableName: 'locations',
            referencedColumnNames: ['id'],
            onDelete: 'CASCADE',
            onUpdate: 'NO ACTION',
          },
          {
            name: 'lab_areas_flammable_rule_set_fk',
            columnNames: ['flammable_rule_set_id'],
            referencedTableName: 'rule_sets',
            referencedColumnNames: ['id'],
            onDelete: 'RESTRICT',
            onUpdate: 'NO ACTION',
          },
          {
            name: 'lab_areas_container_size_rule_set_fk',
            columnNames: ['container_size_rule_set_id'],
            referencedTableName: 'rule_sets',
            referencedColumnNames: ['id'],
            onDelete: 'RESTRICT',
            onUpdate: 'NO ACTION',
          },
        ],
        indices: [
          { name: 'lab_areas_location_unique', columnNames: ['location_id'], isUnique: true },
          { name: 'lab_areas_flammable_rule_set_idx', columnNames: ['flammable_rule_set_id'] },
          {
            name: 'lab_areas_container_size_rule_set_idx',
            columnNames: ['container_size_rule_set_id'],
          },
        ],
      }),
    );
    await queryRunner.query('ALTER TABLE "locations" ADD COLUMN "flammable_storage" varchar(12)');
    await queryRunner.query('ALTER TABLE "containers" ADD COLUMN "material" varchar(20)');
    const now = new Date().toISOString();
    for (const set of builtInSets) {
      await queryRunner.query(
        withPlaceholders(
          queryRunner.connection,
          'INSERT INTO "rule_sets" ("kind", "name", "source", "edition", "reference", "notes", "built_in", "data", "created_at", "updated_at") VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
        ),
        [
          set.kind,
          set.name,
          set.source,
          set.edition,
          set.reference,
          set.notes,
          onPostgres(queryRunner.connection) ? true : 1,
          JSON.stringify(set.data),
          now,
          now,
        ],
      );
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE "containers" DROP COLUMN "material"');
    await queryRunner.query('ALTER TABLE "locations" DROP COLUMN "flammable_storage"');
    await queryRunner.dropTable('lab_areas');
    await queryRunner.dropTable('rule_sets');
  }
}
