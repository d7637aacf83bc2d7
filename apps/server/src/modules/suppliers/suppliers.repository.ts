import {
  parseSort,
  type CatalogItemListQuery,
  type PurchasingChemical,
  type SupplierListQuery,
} from '@lotwise/shared';
import { In, type EntityManager } from 'typeorm';
import { containsPattern } from '../../db/sql';
import { ChemicalEntity } from '../chemicals/chemical.entity';
import { CatalogItemEntity, type CatalogItemRow } from './catalog-item.entity';
import { SupplierEntity, type SupplierRow } from './supplier.entity';

export type SupplierValues = Omit<SupplierRow, 'id'>;
export type CatalogItemValues = Omit<CatalogItemRow, 'id' | 'supplier' | 'chemical'>;

export interface SupplierWithCounts extends SupplierRow {
  catalogItemCount: number;
  orderCount: number;
}
export interface CatalogItemWithNames extends CatalogItemRow {
  supplierName: string;
  chemical: PurchasingChemical;
  orderLineCount: number;
}

const supplierSort: Record<string, string> = {
  name: 'LOWER(s.name)',
  updatedAt: 's.updatedAt',
};
const itemSort: Record<string, string> = {
  sku: 'LOWER(i.sku)',
  chemical: 'LOWER(c.name)',
  packSize: 'i.packSize',
  price: 'i.priceMinor',
  updatedAt: 'i.updatedAt',
};

/** Data access for `suppliers` and `catalog_items`; answers plain objects. */
export function suppliersRepository(manager: EntityManager) {
  const suppliers = manager.getRepository(SupplierEntity);
  const items = manager.getRepository(CatalogItemEntity);
  const chemicals = manager.getRepository(ChemicalEntity);

  async function countBy(
    table: string,
    column: string,
    ids: number[],
    where = '',
    parameters: Record<string, unknown> = {},
  ) {
    if (ids.length === 0) return new Map<number, number>();
    const rows: { id: number; n: number }[] = await manager
      .createQueryBuilder()
      .select(`t.${column}`, 'id')
      .addSelect('COUNT(*)', 'n')
      .from(table, 't')
      .where(`t.${column} IN (:...ids)`, { ids })
      .andWhere(where || '1 = 1', parameters)
      .groupBy(`t.${column}`)
      .getRawMany();
    return new Map(rows.map((r) => [Number(r.id), Number(r.n)]));
  }

  async function withCounts(rows: SupplierRow[]): Promise<SupplierWithCounts[]> {
    const ids = rows.map((r) => r.id);
    const itemCounts = await countBy('catalog_items', 'supplier_id', ids, 't.discontinued = :no', {
      no: false,
    });
    const orderCounts = await countBy('orders', 'supplier_id', ids);
    return rows.map((row) => ({
      ...row,
      catalogItemCount: itemCounts.get(row.id) ?? 0,
      orderCount: orderCounts.get(row.id) ?? 0,
    }));
  }

  async function withNames(rows: CatalogItemRow[]): Promise<CatalogItemWithNames[]> {
    if (rows.length === 0) return [];
    const supplierRows = await suppliers.findBy({
      id: In([...new Set(rows.map((r) => r.supplierId))]),
    });
    const chemicalRows = await chemicals.findBy({
      id: In([...new Set(rows.map((r) => r.chemicalId))]),
    });
    const lineCounts = await countBy(
      'order_lines',
      'catalog_item_id',
      rows.map((r) => r.id),
    );
    const supplierName = new Map(supplierRows.map((s) => [s.id, s.name]));
    const chemical = new Map(
      chemicalRows.map((c) => [
        c.id,
        {
          id: c.id,
          name: c.name,
          casNumber: c.casNumber,
          ghsPictograms: c.ghsPictograms,
          hazardStatements: c.hazardStatements,
        },
      ]),
    );
    return rows.map(({ supplier: _s, chemical: _c, ...row }) => ({
      ...row,
      supplierName: supplierName.get(row.supplierId) ?? '',
      chemical: chemical.get(row.chemicalId)!,
      orderLineCount: lineCounts.get(row.id) ?? 0,
    }));
  }

  return {
    async findSupplier(id: number): Promise<SupplierWithCounts | null> {
      const row = await suppliers.findOneBy({ id });
      return row ? (await withCounts([row]))[0]! : null;
    },
    async supplierNamed(name: string): Promise<SupplierRow | null> {
      return suppliers
        .createQueryBuilder('s')
        .where('LOWER(s.name) = :name', { name: name.toLowerCase() })
        .getOne();
    },
    async listSuppliers(
      query: SupplierListQuery,
    ): Promise<{ items: SupplierWithCounts[]; total: number }> {
      const qb = suppliers.createQueryBuilder('s');
      if (query.q) {
        qb.andWhere(
          "(LOWER(s.name) LIKE :q ESCAPE '\\' OR LOWER(s.contactName) LIKE :q ESCAPE '\\' OR LOWER(s.email) LIKE :q ESCAPE '\\')",
          { q: containsPattern(query.q.toLowerCase()) },
        );
      }
      if (query.archived !== undefined)
        qb.andWhere('s.archived = :archived', { archived: query.archived });
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const rows = await qb
        .orderBy(supplierSort[field] ?? supplierSort.name!, direction === 'desc' ? 'DESC' : 'ASC')
        .addOrderBy('s.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getMany();
      return { items: await withCounts(rows), total };
    },
    async insertSupplier(values: SupplierValues): Promise<number> {
      const result = await suppliers.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateSupplier(id: number, changes: Partial<SupplierValues>): Promise<void> {
      await suppliers.update({ id }, changes);
    },
    async deleteSupplier(id: number): Promise<void> {
      await items.delete({ supplierId: id });
      await suppliers.delete({ id });
    },
    /** Order lines that name any item of the supplier. */
    async orderLinesOfSupplier(id: number): Promise<number> {
      const row = await manager
        .createQueryBuilder()
        .select('COUNT(*)', 'n')
        .from('order_lines', 'l')
        .innerJoin('catalog_items', 'i', 'i.id = l.catalog_item_id')
        .where('i.supplier_id = :id', { id })
        .getRawOne<{ n: number }>();
      return Number(row?.n ?? 0);
    },

    async findItem(id: number): Promise<CatalogItemWithNames | null> {
      const row = await items.findOneBy({ id });
      return row ? (await withNames([row]))[0]! : null;
    },
    async itemBySku(supplierId: number, sku: string): Promise<CatalogItemRow | null> {
      return items
        .createQueryBuilder('i')
        .where('i.supplierId = :supplierId', { supplierId })
        .andWhere('LOWER(i.sku) = :sku', { sku: sku.toLowerCase() })
        .getOne();
    },
    /** Every item of the supplier, for a price-list import: SKU (lower case) -> row. */
    async itemsBySku(supplierId: number): Promise<Map<string, CatalogItemRow>> {
      const rows = await items.findBy({ supplierId });
      return new Map(rows.map((row) => [row.sku.toLowerCase(), row]));
    },
    async listItems(
      query: CatalogItemListQuery,
    ): Promise<{ items: CatalogItemWithNames[]; total: number }> {
      const qb = items.createQueryBuilder('i').innerJoin('chemicals', 'c', 'c.id = i.chemical_id');
      if (query.q) {
        qb.andWhere(
          "(LOWER(i.sku) LIKE :q ESCAPE '\\' OR c.search_text LIKE :q ESCAPE '\\' OR LOWER(COALESCE(i.grade, '')) LIKE :q ESCAPE '\\')",
          { q: containsPattern(query.q.toLowerCase()) },
        );
      }
      if (query.supplierId)
        qb.andWhere('i.supplierId = :supplierId', { supplierId: query.supplierId });
      if (query.chemicalId)
        qb.andWhere('i.chemicalId = :chemicalId', { chemicalId: query.chemicalId });
      if (query.discontinued !== undefined) {
        qb.andWhere('i.discontinued = :discontinued', { discontinued: query.discontinued });
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const rows = await qb
        .orderBy(itemSort[field] ?? itemSort.chemical!, direction === 'desc' ? 'DESC' : 'ASC')
        .addOrderBy('i.packSize', 'ASC')
        .addOrderBy('i.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getMany();
      return { items: await withNames(rows), total };
    },
    async insertItem(values: CatalogItemValues): Promise<number> {
      const result = await items.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateItem(id: number, changes: Partial<CatalogItemValues>): Promise<void> {
      await items.update({ id }, changes);
    },
    async deleteItem(id: number): Promise<void> {
      await items.delete({ id });
    },
  };
}
export type SuppliersRepository = ReturnType<typeof suppliersRepository>;
