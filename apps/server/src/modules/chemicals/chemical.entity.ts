import type {
  GhsCode,
  PeroxideClass,
  PhysicalState,
  StockUnit,
  StorageGroup,
} from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/** A row of `chemicals`. Lists are JSON text; `searchText` is a lower-cased search key. */
export interface ChemicalRow {
  id: number;
  name: string;
  synonyms: string[];
  casNumber: string | null;
  formula: string | null;
  molarMass: number | null;
  physicalState: PhysicalState;
  density: number | null;
  /** g/mL of the poured solid (air included): what a volume of a solid is weighed with. */
  bulkDensity: number | null;
  defaultPurityPercent: number;
  ghsPictograms: GhsCode[];
  hazardStatements: string[];
  storageGroup: StorageGroup;
  peroxideClass: PeroxideClass | null;
  /** Null on rows from before the column existed: read as none. */
  extraHazardGroups: StorageGroup[] | null;
  stockUnit: StockUnit;
  reorderPoint: number | null;
  reorderQuantity: number | null;
  restricted: boolean;
  notes: string;
  /** °C; null when not recorded. */
  flashPointC: number | null;
  boilingPointC: number | null;
  /** Where each figure came from; empty when not said. */
  flashPointSource: string;
  boilingPointSource: string;
  /** Name, synonyms, CAS RN and formula, lower-cased, one per line: what `q` searches. */
  searchText: string;
  /** The current safety data sheet: original name, random stored name, bytes, type, time. */
  sdsFileName: string | null;
  sdsStoredName: string | null;
  sdsSize: number | null;
  sdsContentType: string | null;
  sdsUploadedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export const ChemicalEntity = new EntitySchema<ChemicalRow>({
  name: 'Chemical',
  tableName: 'chemicals',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    name: { type: 'varchar', length: 200 },
    synonyms: { type: 'simple-json' },
    casNumber: { name: 'cas_number', type: 'varchar', length: 12, nullable: true },
    formula: { type: 'varchar', length: 120, nullable: true },
    molarMass: { name: 'molar_mass', type: 'double precision', nullable: true },
    physicalState: { name: 'physical_state', type: 'varchar', length: 10 },
    density: { type: 'double precision', nullable: true },
    bulkDensity: { name: 'bulk_density', type: 'double precision', nullable: true },
    defaultPurityPercent: { name: 'default_purity_percent', type: 'double precision' },
    ghsPictograms: { name: 'ghs_pictograms', type: 'simple-json' },
    hazardStatements: { name: 'hazard_statements', type: 'simple-json' },
    storageGroup: { name: 'storage_group', type: 'varchar', length: 20 },
    peroxideClass: { name: 'peroxide_class', type: 'varchar', length: 1, nullable: true },
    extraHazardGroups: { name: 'extra_hazard_groups', type: 'simple-json', nullable: true },
    stockUnit: { name: 'stock_unit', type: 'varchar', length: 4 },
    reorderPoint: { name: 'reorder_point', type: 'double precision', nullable: true },
    reorderQuantity: { name: 'reorder_quantity', type: 'double precision', nullable: true },
    restricted: { type: 'boolean' },
    notes: { type: 'text' },
    flashPointC: { name: 'flash_point_c', type: 'double precision', nullable: true },
    boilingPointC: { name: 'boiling_point_c', type: 'double precision', nullable: true },
    flashPointSource: { name: 'flash_point_source', type: 'varchar', length: 120, default: '' },
    boilingPointSource: {
      name: 'boiling_point_source',
      type: 'varchar',
      length: 120,
      default: '',
    },
    searchText: { name: 'search_text', type: 'text' },
    sdsFileName: { name: 'sds_file_name', type: 'varchar', length: 255, nullable: true },
    sdsStoredName: { name: 'sds_stored_name', type: 'varchar', length: 100, nullable: true },
    sdsSize: { name: 'sds_size', type: 'integer', nullable: true },
    sdsContentType: { name: 'sds_content_type', type: 'varchar', length: 40, nullable: true },
    sdsUploadedAt: { name: 'sds_uploaded_at', type: 'varchar', length: 24, nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  indices: [
    { name: 'chemicals_name_idx', columns: ['name'] },
    { name: 'chemicals_cas_number_unique', columns: ['casNumber'], unique: true },
    { name: 'chemicals_storage_group_idx', columns: ['storageGroup'] },
    { name: 'chemicals_formula_idx', columns: ['formula'] },
    { name: 'chemicals_molar_mass_idx', columns: ['molarMass'] },
    { name: 'chemicals_updated_at_idx', columns: ['updatedAt'] },
    { name: 'chemicals_reorder_point_idx', columns: ['reorderPoint'] },
    { name: 'chemicals_physical_state_idx', columns: ['physicalState'] },
    // On LOWER(name): made by the migration, not by TypeORM, which cannot declare it.
    { name: 'chemicals_name_lower_idx', columns: ['name'], synchronize: false },
  ],
});
