import type { PackUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/** A row of `catalog_items`: one pack a supplier sells, at a price in minor units (cents). */
export interface CatalogItemRow {
  id: number;
  supplierId: number;
  /** The supplier's own article number; unique per supplier. */
  sku: string;
  chemicalId: number;
  packSize: number;
  packUnit: PackUnit;
  grade: string | null;
  purityPercent: number | null;
  priceMinor: number;
  currency: string;
  /** Ships as hazardous goods: the order then pays the supplier's hazardous-goods fee. */
  hazardous: boolean;
  /** Members may claim part of a pack (e.g. 100 g of a 500 g pack). */
  splittable: boolean;
  /** No longer sold: kept for orders that name it, left out of suggestions. */
  discontinued: boolean;
  createdAt: string;
  updatedAt: string;
  supplier?: unknown;
  chemical?: unknown;
}

export const CatalogItemEntity = new EntitySchema<CatalogItemRow>({
  name: 'CatalogItem',
  tableName: 'catalog_items',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    supplierId: { name: 'supplier_id', type: 'integer' },
    sku: { type: 'varchar', length: 80 },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    packSize: { name: 'pack_size', type: 'double precision' },
    packUnit: { name: 'pack_unit', type: 'varchar', length: 4 },
    grade: { type: 'varchar', length: 80, nullable: true },
    purityPercent: { name: 'purity_percent', type: 'double precision', nullable: true },
    priceMinor: { name: 'price_minor', type: 'integer' },
    currency: { type: 'varchar', length: 3 },
    hazardous: { type: 'boolean' },
    splittable: { type: 'boolean' },
    discontinued: { type: 'boolean' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    supplier: foreignKey('Supplier', 'supplier_id', 'catalog_items_supplier_fk', 'RESTRICT'),
    chemical: foreignKey('Chemical', 'chemical_id', 'catalog_items_chemical_fk', 'RESTRICT'),
  },
  indices: [
    { name: 'catalog_items_supplier_sku_unique', columns: ['supplierId', 'sku'], unique: true },
    { name: 'catalog_items_chemical_idx', columns: ['chemicalId'] },
  ],
});
