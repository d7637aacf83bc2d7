import {
  parseSort,
  type ContainerListQuery,
  type ContainerStatus,
  type GhsCode,
  type LedgerEntry,
  type LotSource,
  type PeroxideClass,
  type PhysicalState,
  type StockUnit,
  type StorageGroup,
} from '@lotwise/shared';
import { In, type EntityManager, type SelectQueryBuilder } from 'typeorm';
import { fromMicro, microPerUnit } from '../../db/quantities';
import { advisoryLocks, lockForWrite, takeTurn } from '../../db/postgres';
import { containsPattern } from '../../db/sql';
import { ContainerEntity, type ContainerRow } from './container.entity';
import { LedgerEntryEntity, type LedgerEntryRow } from './ledger-entry.entity';

export type ContainerValues = Omit<ContainerRow, 'id' | 'lot' | 'chemical' | 'location' | 'owner'>;
export type LedgerEntryValues = Omit<LedgerEntryRow, 'id' | 'container' | 'user'>;

/** A container joined with its chemical, lot and place: what the service presents. */
export interface ContainerView extends ContainerRow {
  chemicalName: string;
  chemicalFormula: string | null;
  chemicalCasNumber: string | null;
  chemicalDensity: number | null;
  chemicalPhysicalState: PhysicalState;
  chemicalBulkDensity: number | null;
  chemicalStorageGroup: StorageGroup;
  chemicalExtraHazardGroups: StorageGroup[];
  chemicalGhsPictograms: GhsCode[];
  chemicalHazardStatements: string[];
  chemicalPeroxideClass: PeroxideClass | null;
  chemicalStockUnit: StockUnit;
  chemicalFlashPointC: number | null;
  chemicalBoilingPointC: number | null;
  chemicalDefaultPurity: number;
  lotSource: LotSource;
  lotSupplierName: string | null;
  lotSupplierLotNumber: string | null;
  lotGrade: string | null;
  lotPurityPercent: number | null;
  lotReceivedOn: string;
  lotExpiresOn: string | null;
  locationName: string;
  locationPath: string;
  ownerName: string | null;
}

const viewColumns: [string, keyof ContainerView][] = [
  ['c.id', 'id'],
  ['c.label_code', 'labelCode'],
  ['c.label_number', 'labelNumber'],
  ['c.lot_id', 'lotId'],
  ['c.chemical_id', 'chemicalId'],
  ['c.location_id', 'locationId'],
  ['c.status', 'status'],
  ['c.quantity_micro', 'quantity'],
  ['c.unit', 'unit'],
  ['c.tare_mass', 'tareMass'],
  ['c.capacity', 'capacity'],
  ['c.capacity_unit', 'capacityUnit'],
  ['c.material', 'material'],
  ['c.opened_on', 'openedOn'],
  ['c.expires_on', 'expiresOn'],
  ['c.peroxide_due_on', 'peroxideDueOn'],
  ['c.notes', 'notes'],
  ['c.created_at', 'createdAt'],
  ['c.updated_at', 'updatedAt'],
  ['ch.name', 'chemicalName'],
  ['ch.formula', 'chemicalFormula'],
  ['ch.cas_number', 'chemicalCasNumber'],
  ['ch.density', 'chemicalDensity'],
  ['ch.physical_state', 'chemicalPhysicalState'],
  ['ch.bulk_density', 'chemicalBulkDensity'],
  ['ch.storage_group', 'chemicalStorageGroup'],
  ['ch.extra_hazard_groups', 'chemicalExtraHazardGroups'],
  ['ch.ghs_pictograms', 'chemicalGhsPictograms'],
  ['ch.hazard_statements', 'chemicalHazardStatements'],
  ['ch.peroxide_class', 'chemicalPeroxideClass'],
  ['ch.stock_unit', 'chemicalStockUnit'],
  ['ch.flash_point_c', 'chemicalFlashPointC'],
  ['ch.boiling_point_c', 'chemicalBoilingPointC'],
  ['ch.default_purity_percent', 'chemicalDefaultPurity'],
  ['l.source', 'lotSource'],
  ['l.supplier_name', 'lotSupplierName'],
  ['l.supplier_lot_number', 'lotSupplierLotNumber'],
  ['l.grade', 'lotGrade'],
  ['l.purity_percent', 'lotPurityPercent'],
  ['l.received_on', 'lotReceivedOn'],
  ['l.expires_on', 'lotExpiresOn'],
  ['loc.name', 'locationName'],
  ['loc.path', 'locationPath'],
  ['c.owner_id', 'ownerId'],
  ['own.display_name', 'ownerName'],
];

const jsonColumns = new Set<keyof ContainerView>([
  'chemicalExtraHazardGroups',
  'chemicalGhsPictograms',
  'chemicalHazardStatements',
]);
const numberColumns = new Set<keyof ContainerView>(['id', 'lotId', 'chemicalId', 'locationId']);

function toView(raw: Record<string, unknown>): ContainerView {
  const view: Record<string, unknown> = { ...raw };
  for (const key of jsonColumns) {
    const text = raw[key];
    view[key] = typeof text === 'string' && text ? JSON.parse(text) : [];
  }
  for (const key of numberColumns) view[key] = Number(raw[key]);
  view.ownerId = raw.ownerId === null || raw.ownerId === undefined ? null : Number(raw.ownerId);
  view.quantity = fromMicro(raw.quantity);
  return view as unknown as ContainerView;
}

const sortColumns: Record<string, string> = {
  labelCode: 'c.label_code',
  chemical: 'LOWER(ch.name)',
  quantity: 'c.quantity_micro',
  expiresOn: 'c.expires_on',
  location: 'LOWER(loc.path)',
  updatedAt: 'c.updated_at',
};

/** SQL for "usable": sealed or open, and not past the lot's expiry. Needs `:today`. */
export const usableSql = (alias: string) =>
  `${alias}.status IN ('sealed', 'open') AND (${alias}.expires_on IS NULL OR ${alias}.expires_on >= :today)`;

/**
 * SQL for a chemical's usable total in whole millionths (see db/quantities), `chemical` being
 * the alias of its row in `chemicals`. Needs `:today`.
 */
export const usableTotalMicroSql = (chemical: string) =>
  `COALESCE((SELECT SUM(u.quantity_micro) FROM containers u WHERE u.chemical_id = ${chemical}.id AND ${usableSql('u')}), 0)`;

/** SQL: the usable total (whole millionths) of `chemical` is at or below its reorder point. */
export const atOrBelowReorderPointCondition = (chemical: string, totalMicroSql: string) =>
  `${chemical}.reorder_point IS NOT NULL AND ${totalMicroSql} <= ROUND(${chemical}.reorder_point * ${microPerUnit})`;

/** Chemicals at or below their reorder point (usable total). Needs `:today`. */
export const atOrBelowReorderPointSql = `SELECT rc.id FROM chemicals rc WHERE ${atOrBelowReorderPointCondition('rc', usableTotalMicroSql('rc'))}`;

/** Extra filter data the service works out: dates relative to today, a place's subtree. */
export interface ContainerFilterContext {
  today: string;
  expiringBefore?: string;
  peroxideBefore?: string;
  locationIdPath?: string;
  exactLabelCode?: string | null;
}

interface RawEntry extends LedgerEntryRow {
  userDisplayName: string | null;
}

function toEntry(raw: RawEntry): LedgerEntry {
  const n = (value: unknown) => (value === null || value === undefined ? null : Number(value));
  return {
    id: Number(raw.id),
    containerId: Number(raw.containerId),
    reason: raw.reason,
    quantity: fromMicro(raw.quantity),
    unit: raw.unit,
    balanceAfter: fromMicro(raw.balanceAfter),
    note: raw.note,
    user:
      raw.userId === null || raw.userId === undefined
        ? null
        : { id: Number(raw.userId), displayName: raw.userDisplayName ?? '' },
    runId: n(raw.runId),
    orderId: n(raw.orderId),
    stocktakeId: n(raw.stocktakeId),
    fromLocationId: n(raw.fromLocationId),
    toLocationId: n(raw.toLocationId),
    relatedContainerId: n(raw.relatedContainerId),
    createdAt: raw.createdAt,
  };
}

/** A stored count of millionths read as text: a bigint, or null when it is not a whole number. */
function wholeMicro(text: unknown): bigint | null {
  return typeof text === 'string' && /^-?\d+$/.test(text) ? BigInt(text) : null;
}

/** Data access for `containers` and `ledger_entries`; answers plain objects. */
export function containersRepository(manager: EntityManager) {
  const repo = manager.getRepository(ContainerEntity);
  const entries = manager.getRepository(LedgerEntryEntity);

  /**
   * Containers joined with their chemical, lot, place and owner. `placesFirst`: the unary `+`
   * (a no-op on the value) keeps SQLite from starting the join at chemicals or lots, so a list
   * sorted by place walks the few places in path order and stops at the page, instead of
   * reading and sorting every container.
   */
  function view(placesFirst = false): SelectQueryBuilder<object> {
    const plus = placesFirst ? '+' : '';
    const qb = manager
      .createQueryBuilder()
      .from('containers', 'c')
      .innerJoin('chemicals', 'ch', `ch.id = ${plus}c.chemical_id`)
      .innerJoin('lots', 'l', `l.id = ${plus}c.lot_id`)
      .innerJoin('locations', 'loc', 'loc.id = c.location_id')
      .leftJoin('users', 'own', 'own.id = c.owner_id');
    qb.select(viewColumns[0]![0], viewColumns[0]![1]);
    for (const [column, alias] of viewColumns.slice(1)) qb.addSelect(column, alias);
    return qb;
  }

  function entryQuery() {
    return manager
      .createQueryBuilder()
      .select('e.id', 'id')
      .addSelect('e.container_id', 'containerId')
      .addSelect('e.reason', 'reason')
      .addSelect('e.quantity_micro', 'quantity')
      .addSelect('e.unit', 'unit')
      .addSelect('e.balance_after_micro', 'balanceAfter')
      .addSelect('e.note', 'note')
      .addSelect('e.user_id', 'userId')
      .addSelect('u.display_name', 'userDisplayName')
      .addSelect('e.run_id', 'runId')
      .addSelect('e.order_id', 'orderId')
      .addSelect('e.stocktake_id', 'stocktakeId')
      .addSelect('e.from_location_id', 'fromLocationId')
      .addSelect('e.to_location_id', 'toLocationId')
      .addSelect('e.related_container_id', 'relatedContainerId')
      .addSelect('e.created_at', 'createdAt')
      .from('ledger_entries', 'e')
      .leftJoin('users', 'u', 'u.id = e.user_id');
  }

  return {
    /** In a transaction on PostgreSQL the row stays locked until it ends (its balance may change). */
    async findRow(id: number): Promise<ContainerRow | null> {
      return repo.findOne({ where: { id }, ...lockForWrite(manager) });
    },
    /**
     * The containers of `ids` in one read, by id (missing ids are absent); locked like findRow,
     * in id order, so two transactions locking overlapping sets wait instead of deadlocking.
     */
    async rowsByIds(ids: number[]): Promise<Map<number, ContainerRow>> {
      const unique = [...new Set(ids)];
      if (unique.length === 0) return new Map();
      const rows = await repo.find({
        where: { id: In(unique) },
        order: { id: 'ASC' },
        ...lockForWrite(manager),
      });
      return new Map(rows.map((row) => [row.id, row]));
    },
    async findView(id: number): Promise<ContainerView | null> {
      const raw = await view().where('c.id = :id', { id }).getRawOne<Record<string, unknown>>();
      return raw ? toView(raw) : null;
    },
    /**
     * The container of a label code: written exactly, else in upper or lower case (a code an
     * import kept as written may be typed or read in another case). Each form is an index read.
     */
    async findViewByLabel(labelCode: string): Promise<ContainerView | null> {
      const forms = [...new Set([labelCode, labelCode.toUpperCase(), labelCode.toLowerCase()])];
      const rows = await view()
        .where('c.label_code IN (:...forms)', { forms })
        .getRawMany<Record<string, unknown>>();
      const views = rows.map(toView);
      return views.find((v) => v.labelCode === labelCode) ?? views[0] ?? null;
    },
    async viewsAt(locationIdPath: string, statuses: ContainerStatus[]): Promise<ContainerView[]> {
      const rows = await view()
        .where("loc.id_path LIKE :prefix ESCAPE '\\'", { prefix: `${locationIdPath}%` })
        .andWhere('c.status IN (:...statuses)', { statuses })
        .orderBy('loc.path', 'ASC')
        .addOrderBy('c.label_code', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map(toView);
    },
    /**
     * The next free `LW-` number. On PostgreSQL the transaction takes its turn first, so two
     * instances creating containers at once do not pick the same number.
     */
    async nextLabelNumber(): Promise<number> {
      await takeTurn(manager, advisoryLocks.labelNumbers);
      const row = await manager
        .createQueryBuilder()
        .select('MAX(c.label_number)', 'n')
        .from('containers', 'c')
        .getRawOne<{ n: number | null }>();
      return Number(row?.n ?? 0) + 1;
    },
    async insert(values: ContainerValues): Promise<number> {
      const result = await repo.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<ContainerValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    async rowsForLot(lotId: number): Promise<ContainerRow[]> {
      return repo.findBy({ lotId });
    },
    async countForLot(lotId: number): Promise<number> {
      return repo.countBy({ lotId });
    },
    async countForChemical(chemicalId: number): Promise<number> {
      return repo.countBy({ chemicalId });
    },
    /** Copy a lot's expiry onto its containers (kept there for fast filters). */
    async setLotExpiry(lotId: number, expiresOn: string | null): Promise<void> {
      await repo.update({ lotId }, { expiresOn });
    },

    async list(
      query: ContainerListQuery,
      context: ContainerFilterContext,
    ): Promise<{ items: ContainerView[]; total: number }> {
      // Filters are written on `c` alone (sub-selects on the small tables), so the count
      // needs no joins and every filter can use an index of containers.
      const filters: [string, Record<string, unknown>][] = [];
      if (context.exactLabelCode) {
        // A label code is unique: no need to search chemical names for it.
        filters.push(['c.label_code = :exact', { exact: context.exactLabelCode }]);
      } else if (query.q) {
        filters.push([
          "(c.chemical_id IN (SELECT qc.id FROM chemicals qc WHERE qc.search_text LIKE :q ESCAPE '\\') OR LOWER(c.label_code) LIKE :q ESCAPE '\\')",
          { q: containsPattern(query.q.toLowerCase()) },
        ]);
      }
      if (context.locationIdPath) {
        filters.push([
          "c.location_id IN (SELECT sl.id FROM locations sl WHERE sl.id_path LIKE :prefix ESCAPE '\\')",
          { prefix: `${context.locationIdPath}%` },
        ]);
      }
      if (query.chemicalId)
        filters.push(['c.chemical_id = :chemicalId', { chemicalId: query.chemicalId }]);
      if (query.lotId) filters.push(['c.lot_id = :lotId', { lotId: query.lotId }]);
      if (query.status) filters.push(['c.status = :status', { status: query.status }]);
      if (query.storageGroup) {
        filters.push([
          'c.chemical_id IN (SELECT gc.id FROM chemicals gc WHERE gc.storage_group = :storageGroup)',
          { storageGroup: query.storageGroup },
        ]);
      }
      if (context.expiringBefore) {
        filters.push([
          "c.expires_on IS NOT NULL AND c.expires_on >= :today AND c.expires_on <= :expiringBefore AND c.status IN ('sealed', 'open')",
          { expiringBefore: context.expiringBefore },
        ]);
      }
      if (query.expired === true)
        filters.push(["c.expires_on < :today AND c.status <> 'disposed'", {}]);
      else if (query.expired === false)
        filters.push(['(c.expires_on IS NULL OR c.expires_on >= :today)', {}]);
      if (query.belowReorderPoint === true)
        filters.push([`c.chemical_id IN (${atOrBelowReorderPointSql})`, {}]);
      else if (query.belowReorderPoint === false) {
        filters.push([`c.chemical_id NOT IN (${atOrBelowReorderPointSql})`, {}]);
      }
      if (query.peroxideDue === true) {
        filters.push([
          "c.peroxide_due_on IS NOT NULL AND c.peroxide_due_on <= :peroxideBefore AND c.status IN ('sealed', 'open')",
          { peroxideBefore: context.peroxideBefore },
        ]);
      } else if (query.peroxideDue === false) {
        filters.push([
          '(c.peroxide_due_on IS NULL OR c.peroxide_due_on > :peroxideBefore)',
          { peroxideBefore: context.peroxideBefore },
        ]);
      }
      const { field, direction } = parseSort(query.sort);
      const qb = view(field === 'location')
        .where('1 = 1')
        .setParameter('today', context.today);
      const count = manager
        .createQueryBuilder()
        .select('COUNT(*)', 'n')
        .from('containers', 'c')
        .where('1 = 1')
        .setParameter('today', context.today);
      for (const [sql, parameters] of filters) {
        qb.andWhere(sql, parameters);
        count.andWhere(sql, parameters);
      }
      const total = Number((await count.getRawOne<{ n: number }>())?.n ?? 0);
      const column = sortColumns[field] ?? sortColumns.labelCode!;
      const rows = await qb
        // Containers without an expiry last in both directions (an index serves NULLS LAST).
        .addOrderBy(column, direction === 'desc' ? 'DESC' : 'ASC', 'NULLS LAST')
        .addOrderBy('c.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<Record<string, unknown>>();
      return { items: rows.map(toView), total };
    },

    /** Label codes for the global search: the exact one first, then those starting with `prefix`. */
    async searchLabels(
      exact: string | null,
      prefix: string,
      limit: number,
    ): Promise<
      {
        id: number;
        labelCode: string;
        status: ContainerStatus;
        chemicalId: number;
        chemicalName: string;
        locationPath: string;
      }[]
    > {
      const qb = manager
        .createQueryBuilder()
        .select('c.id', 'id')
        .addSelect('c.label_code', 'labelCode')
        .addSelect('c.status', 'status')
        .addSelect('c.chemical_id', 'chemicalId')
        .addSelect('ch.name', 'chemicalName')
        .addSelect('loc.path', 'locationPath')
        .from('containers', 'c')
        .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
        .innerJoin('locations', 'loc', 'loc.id = c.location_id')
        // A range on the unique index instead of LIKE, which SQLite cannot serve from it.
        .where('(c.label_code >= :low AND c.label_code < :high)', {
          low: prefix,
          high: `${prefix}\uffff`,
        });
      if (exact) {
        qb.orWhere('c.label_code = :exact', { exact }).orderBy(
          'CASE WHEN c.label_code = :exact THEN 0 ELSE 1 END',
          'ASC',
        );
      }
      const rows = await qb.addOrderBy('c.label_code', 'ASC').limit(limit).getRawMany();
      return rows.map((row) => ({
        ...row,
        id: Number(row.id),
        chemicalId: Number(row.chemicalId),
      }));
    },

    async insertEntry(values: LedgerEntryValues): Promise<LedgerEntry> {
      const result = await entries.insert(values);
      const id = Number(result.identifiers[0]?.id);
      const raw = await entryQuery().where('e.id = :id', { id }).getRawOne<RawEntry>();
      return toEntry(raw!);
    },
    async entries(
      containerId: number,
      page: number,
      pageSize: number,
    ): Promise<{ items: LedgerEntry[]; total: number }> {
      const total = await entries.countBy({ containerId });
      const rows = await entryQuery()
        .where('e.container_id = :containerId', { containerId })
        .orderBy('e.id', 'DESC')
        .offset((page - 1) * pageSize)
        .limit(pageSize)
        .getRawMany<RawEntry>();
      return { items: rows.map(toEntry), total };
    },

    /**
     * Every container's stored balance, in whole millionths of its unit (see db/quantities),
     * read as text into a bigint so even a value past 2^53 compares exactly.
     */
    async balances(): Promise<
      { id: number; labelCode: string; unit: StockUnit; quantityMicro: bigint | null }[]
    > {
      const rows = await manager
        .createQueryBuilder()
        .select('c.id', 'id')
        .addSelect('c.label_code', 'labelCode')
        .addSelect('c.unit', 'unit')
        .addSelect('CAST(c.quantity_micro AS TEXT)', 'quantityMicro')
        .from('containers', 'c')
        .orderBy('c.id', 'ASC')
        .getRawMany();
      return rows.map((row) => ({
        id: Number(row.id),
        labelCode: row.labelCode,
        unit: row.unit,
        quantityMicro: wholeMicro(row.quantityMicro),
      }));
    },
    /**
     * Every entry's container, change and balance after, in whole millionths as bigints, in
     * the order written.
     */
    async chain(): Promise<
      { containerId: number; quantityMicro: bigint | null; balanceAfterMicro: bigint | null }[]
    > {
      const rows = await manager
        .createQueryBuilder()
        .select('e.container_id', 'containerId')
        .addSelect('CAST(e.quantity_micro AS TEXT)', 'quantityMicro')
        .addSelect('CAST(e.balance_after_micro AS TEXT)', 'balanceAfterMicro')
        .from('ledger_entries', 'e')
        .orderBy('e.container_id', 'ASC')
        .addOrderBy('e.id', 'ASC')
        .getRawMany();
      return rows.map((row) => ({
        containerId: Number(row.containerId),
        quantityMicro: wholeMicro(row.quantityMicro),
        balanceAfterMicro: wholeMicro(row.balanceAfterMicro),
      }));
    },
  };
}
export type ContainersRepository = ReturnType<typeof containersRepository>;
