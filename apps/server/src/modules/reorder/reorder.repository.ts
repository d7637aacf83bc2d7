import type {
  GhsCode,
  OrderStatus,
  PackUnit,
  PhysicalState,
  RestockChemical,
  StockUnit,
  StorageGroup,
} from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { fromMicro } from '../../db/quantities';
import { containsPattern } from '../../db/sql';
import { usableTotalMicroSql } from '../containers/containers.repository';

/** A chemical as purchasing needs it: hazards to show, and what converts its packs. */
export interface PurchasingChemicalRow extends RestockChemical {
  density: number | null;
  bulkDensity: number | null;
  reorderPoint: number | null;
  reorderQuantity: number | null;
}

/** A chemical with a reorder point and its usable stock. */
export interface ReorderChemicalRow extends PurchasingChemicalRow {
  reorderPoint: number;
  onHand: number;
}

/** One catalogue item still sold, with its supplier's fees. */
export interface OfferRow {
  catalogItemId: number;
  chemicalId: number;
  sku: string;
  packSize: number;
  packUnit: PackUnit;
  priceMinor: number;
  hazardous: boolean;
  splittable: boolean;
  grade: string | null;
  purityPercent: number | null;
  supplierId: number;
  supplierName: string;
  shippingFeeMinor: number;
  hazardousFeeMinor: number;
  minimumOrderMinor: number;
}

/** An order line not yet received: what is already on its way (or about to be). */
export interface PendingLineRow {
  chemicalId: number;
  packs: number;
  packSize: number;
  packUnit: PackUnit;
}

/** Orders whose lines count as "on order": drafted, open for claims, paid up or sent. */
export const pendingOrderStatuses: readonly OrderStatus[] = ['draft', 'open', 'funded', 'ordered'];

const chemicalColumns = (alias: string) => `
  ${alias}.id AS id, ${alias}.name AS name, ${alias}.cas_number AS "casNumber",
  ${alias}.formula AS formula, ${alias}.physical_state AS "physicalState",
  ${alias}.stock_unit AS "stockUnit", ${alias}.ghs_pictograms AS "ghsPictograms",
  ${alias}.hazard_statements AS "hazardStatements", ${alias}.storage_group AS "storageGroup",
  ${alias}.restricted AS restricted, ${alias}.density AS density,
  ${alias}.bulk_density AS "bulkDensity", ${alias}.reorder_point AS "reorderPoint",
  ${alias}.reorder_quantity AS "reorderQuantity"`;

const numberOrNull = (value: unknown) =>
  value === null || value === undefined ? null : Number(value);

function toChemical(raw: Record<string, unknown>): PurchasingChemicalRow {
  const list = (value: unknown) => (typeof value === 'string' && value ? JSON.parse(value) : []);
  return {
    id: Number(raw.id),
    name: String(raw.name),
    casNumber: (raw.casNumber as string | null) ?? null,
    formula: (raw.formula as string | null) ?? null,
    physicalState: raw.physicalState as PhysicalState,
    stockUnit: raw.stockUnit as StockUnit,
    ghsPictograms: list(raw.ghsPictograms) as GhsCode[],
    hazardStatements: list(raw.hazardStatements) as string[],
    storageGroup: raw.storageGroup as StorageGroup,
    restricted: Boolean(Number(raw.restricted)),
    density: numberOrNull(raw.density),
    bulkDensity: numberOrNull(raw.bulkDensity),
    reorderPoint: numberOrNull(raw.reorderPoint),
    reorderQuantity: numberOrNull(raw.reorderQuantity),
  };
}

/** Reads for reorder suggestions: stock, use over a window, catalogue offers, open orders. */
export function reorderRepository(manager: EntityManager) {
  return {
    /** Chemicals with a reorder point, matching `q`, with their usable stock on `today`. */
    async chemicalsWithReorderPoint(q: string, today: string): Promise<ReorderChemicalRow[]> {
      const qb = manager
        .createQueryBuilder()
        .select(chemicalColumns('ch'))
        .addSelect(usableTotalMicroSql('ch'), 'onHandMicro')
        .from('chemicals', 'ch')
        .where('ch.reorder_point IS NOT NULL')
        .setParameters({ today })
        .orderBy('LOWER(ch.name)', 'ASC')
        .addOrderBy('ch.id', 'ASC');
      if (q) {
        qb.andWhere("ch.search_text LIKE :q ESCAPE '\\'", {
          q: containsPattern(q.toLowerCase()),
        });
      }
      const rows = await qb.getRawMany<Record<string, unknown>>();
      return rows.map((raw) => ({
        ...toChemical(raw),
        reorderPoint: Number(raw.reorderPoint),
        onHand: fromMicro(raw.onHandMicro),
      }));
    },

    /** One chemical as purchasing shows it, or null. */
    async chemical(id: number): Promise<PurchasingChemicalRow | null> {
      const raw = await manager
        .createQueryBuilder()
        .select(chemicalColumns('ch'))
        .from('chemicals', 'ch')
        .where('ch.id = :id', { id })
        .getRawOne<Record<string, unknown>>();
      return raw ? toChemical(raw) : null;
    },

    /** Usable stock of one chemical on `today`, in its stock unit. */
    async onHand(chemicalId: number, today: string): Promise<number> {
      const raw = await manager
        .createQueryBuilder()
        .select(usableTotalMicroSql('ch'), 'n')
        .from('chemicals', 'ch')
        .where('ch.id = :chemicalId', { chemicalId })
        .setParameters({ today })
        .getRawOne<{ n: unknown }>();
      return fromMicro(raw?.n ?? 0);
    },

    /**
     * Draws (by hand and by runs: ledger reason `drawn`) of the chemicals since `since`, as
     * positive amounts in the stock unit, oldest first.
     */
    async drawsSince(
      chemicalIds: number[],
      since: string,
    ): Promise<{ chemicalId: number; at: string; quantity: number }[]> {
      if (chemicalIds.length === 0) return [];
      const rows = await manager
        .createQueryBuilder()
        .select('c.chemical_id', 'chemicalId')
        .addSelect('e.created_at', 'at')
        .addSelect('e.quantity_micro', 'quantityMicro')
        .from('ledger_entries', 'e')
        .innerJoin('containers', 'c', 'c.id = e.container_id')
        .where('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere("e.reason = 'drawn'")
        .andWhere('e.created_at >= :since', { since })
        .orderBy('e.created_at', 'ASC')
        .addOrderBy('e.id', 'ASC')
        .getRawMany<{ chemicalId: number; at: string; quantityMicro: unknown }>();
      return rows.map((row) => ({
        chemicalId: Number(row.chemicalId),
        at: row.at,
        quantity: -fromMicro(row.quantityMicro),
      }));
    },

    /** When each chemical's first ledger entry was made (its stock history starts there). */
    async firstEntryAt(chemicalIds: number[]): Promise<Map<number, string>> {
      if (chemicalIds.length === 0) return new Map();
      const rows = await manager
        .createQueryBuilder()
        .select('c.chemical_id', 'chemicalId')
        .addSelect('MIN(e.created_at)', 'at')
        .from('ledger_entries', 'e')
        .innerJoin('containers', 'c', 'c.id = e.container_id')
        .where('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .groupBy('c.chemical_id')
        .getRawMany<{ chemicalId: number; at: string }>();
      return new Map(rows.map((row) => [Number(row.chemicalId), row.at]));
    },

    /** Catalogue items still sold by suppliers not archived, for the chemicals. */
    async offers(chemicalIds: number[]): Promise<OfferRow[]> {
      if (chemicalIds.length === 0) return [];
      const rows = await manager
        .createQueryBuilder()
        .select('ci.id', 'catalogItemId')
        .addSelect('ci.chemical_id', 'chemicalId')
        .addSelect('ci.sku', 'sku')
        .addSelect('ci.pack_size', 'packSize')
        .addSelect('ci.pack_unit', 'packUnit')
        .addSelect('ci.price_minor', 'priceMinor')
        .addSelect('ci.hazardous', 'hazardous')
        .addSelect('ci.splittable', 'splittable')
        .addSelect('ci.grade', 'grade')
        .addSelect('ci.purity_percent', 'purityPercent')
        .addSelect('s.id', 'supplierId')
        .addSelect('s.name', 'supplierName')
        .addSelect('s.shipping_fee_minor', 'shippingFeeMinor')
        .addSelect('s.hazardous_fee_minor', 'hazardousFeeMinor')
        .addSelect('s.minimum_order_minor', 'minimumOrderMinor')
        .from('catalog_items', 'ci')
        .innerJoin('suppliers', 's', 's.id = ci.supplier_id')
        .where('ci.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere('ci.discontinued = :no', { no: false })
        .andWhere('s.archived = :no')
        .orderBy('s.id', 'ASC')
        .addOrderBy('ci.id', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map((raw) => ({
        catalogItemId: Number(raw.catalogItemId),
        chemicalId: Number(raw.chemicalId),
        sku: String(raw.sku),
        packSize: Number(raw.packSize),
        packUnit: raw.packUnit as PackUnit,
        priceMinor: Number(raw.priceMinor),
        hazardous: Boolean(Number(raw.hazardous)),
        splittable: Boolean(Number(raw.splittable)),
        grade: (raw.grade as string | null) ?? null,
        purityPercent: numberOrNull(raw.purityPercent),
        supplierId: Number(raw.supplierId),
        supplierName: String(raw.supplierName),
        shippingFeeMinor: Number(raw.shippingFeeMinor),
        hazardousFeeMinor: Number(raw.hazardousFeeMinor),
        minimumOrderMinor: Number(raw.minimumOrderMinor),
      }));
    },

    /** Lines of orders not yet received or cancelled, for the chemicals. */
    async pendingLines(chemicalIds: number[]): Promise<PendingLineRow[]> {
      if (chemicalIds.length === 0) return [];
      const rows = await manager
        .createQueryBuilder()
        .select('l.chemical_id', 'chemicalId')
        .addSelect('l.packs', 'packs')
        .addSelect('l.pack_size', 'packSize')
        .addSelect('l.pack_unit', 'packUnit')
        .from('order_lines', 'l')
        .innerJoin('orders', 'o', 'o.id = l.order_id')
        .where('l.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere('o.status IN (:...statuses)', { statuses: pendingOrderStatuses })
        .getRawMany<Record<string, unknown>>();
      return rows.map((raw) => ({
        chemicalId: Number(raw.chemicalId),
        packs: Number(raw.packs),
        packSize: Number(raw.packSize),
        packUnit: raw.packUnit as PackUnit,
      }));
    },

    /** The newest draft order of a supplier, or null. */
    async latestDraftOrderOf(supplierId: number): Promise<number | null> {
      const raw = await manager
        .createQueryBuilder()
        .select('o.id', 'id')
        .from('orders', 'o')
        .where('o.supplier_id = :supplierId', { supplierId })
        .andWhere("o.status = 'draft'")
        .orderBy('o.id', 'DESC')
        .limit(1)
        .getRawOne<{ id: number }>();
      return raw ? Number(raw.id) : null;
    },

    /** Supplier names by id. */
    async supplierNames(ids: number[]): Promise<Map<number, string>> {
      if (ids.length === 0) return new Map();
      const rows = await manager
        .createQueryBuilder()
        .select('s.id', 'id')
        .addSelect('s.name', 'name')
        .from('suppliers', 's')
        .where('s.id IN (:...ids)', { ids })
        .getRawMany<{ id: number; name: string }>();
      return new Map(rows.map((row) => [Number(row.id), row.name]));
    },
  };
}

export type ReorderRepository = ReturnType<typeof reorderRepository>;
