import type { PackUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `order_lines`: a number of packs of one catalogue item. Pack, price and flags are
 * copied from the catalogue when the line is added, so a later price-list import does not
 * change an order already made.
 */
export interface OrderLineRow {
  id: number;
  orderId: number;
  catalogItemId: number;
  chemicalId: number;
  position: number;
  sku: string;
  packs: number;
  packSize: number;
  packUnit: PackUnit;
  unitPriceMinor: number;
  grade: string | null;
  purityPercent: number | null;
  hazardous: boolean;
  splittable: boolean;
  createdAt: string;
  updatedAt: string;
  order?: unknown;
  catalogItem?: unknown;
  chemical?: unknown;
}

export const OrderLineEntity = new EntitySchema<OrderLineRow>({
  name: 'OrderLine',
  tableName: 'order_lines',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    orderId: { name: 'order_id', type: 'integer' },
    catalogItemId: { name: 'catalog_item_id', type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    position: { type: 'integer' },
    sku: { type: 'varchar', length: 80 },
    packs: { type: 'integer' },
    packSize: { name: 'pack_size', type: 'double precision' },
    packUnit: { name: 'pack_unit', type: 'varchar', length: 4 },
    unitPriceMinor: { name: 'unit_price_minor', type: 'integer' },
    grade: { type: 'varchar', length: 80, nullable: true },
    purityPercent: { name: 'purity_percent', type: 'double precision', nullable: true },
    hazardous: { type: 'boolean' },
    splittable: { type: 'boolean' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    order: foreignKey('Order', 'order_id', 'order_lines_order_fk', 'RESTRICT'),
    catalogItem: foreignKey(
      'CatalogItem',
      'catalog_item_id',
      'order_lines_catalog_item_fk',
      'RESTRICT',
    ),
    chemical: foreignKey('Chemical', 'chemical_id', 'order_lines_chemical_fk', 'RESTRICT'),
  },
  indices: [{ name: 'order_lines_order_idx', columns: ['orderId'] }],
});
