import { parseSort, type StockListQuery, type StockUnit, type StorageGroup } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { fromMicro } from '../../db/quantities';
import { containsPattern } from '../../db/sql';
import { atOrBelowReorderPointCondition, usableSql } from '../containers/containers.repository';
import { StocktakeEntity, type StocktakeRow } from './stocktake.entity';

export interface StockRow {
  id: number;
  name: string;
  formula: string | null;
  casNumber: string | null;
  storageGroup: StorageGroup;
  ghsPictograms: string;
  hazardStatements: string;
  stockUnit: StockUnit;
  reorderPoint: number | null;
  reorderQuantity: number | null;
  total: number;
  containerCount: number;
  usableContainerCount: number;
  expiredContainerCount: number;
  nextExpiresOn: string | null;
}

const totalSql = 'COALESCE(s.total, 0)';

const sortColumns: Record<string, string> = {
  name: 'LOWER(ch.name)',
  total: totalSql,
  containerCount: 'COALESCE(s.container_count, 0)',
  nextExpiresOn: 's.next_expires_on',
};

/** Stock reads across chemicals and containers, and stocktake records; plain objects. */
export function stockRepository(manager: EntityManager) {
  const stocktakes = manager.getRepository(StocktakeEntity);

  /** The sums the overview shows or filters on, per chemical; see `perChemicalSums`. */
  const sumColumns = {
    total: `SUM(CASE WHEN ${usableSql('c')} THEN c.quantity_micro ELSE 0 END)`,
    container_count: 'COUNT(*)',
    usable_count: `SUM(CASE WHEN ${usableSql('c')} THEN 1 ELSE 0 END)`,
    expired_count:
      "SUM(CASE WHEN c.status IN ('sealed', 'open') AND c.expires_on < :today THEN 1 ELSE 0 END)",
    next_expires_on: `MIN(CASE WHEN ${usableSql('c')} THEN c.expires_on END)`,
    expiring_count: `SUM(CASE WHEN ${usableSql('c')} AND c.expires_on <= :expiringBefore THEN 1 ELSE 0 END)`,
  };
  type SumColumn = keyof typeof sumColumns;

  /**
   * Containers summed per chemical (not disposed; only below the asked place, if any), only
   * the `columns` asked. Needs `:today`, `:expiringBefore` and, with a place, `:prefix`.
   */
  function perChemicalSums(
    context: { locationIdPath?: string },
    columns: SumColumn[] = Object.keys(sumColumns) as SumColumn[],
  ) {
    const sums = manager
      .createQueryBuilder()
      .select('c.chemical_id', 'chemical_id')
      .from('containers', 'c')
      .where("c.status <> 'disposed'")
      .groupBy('c.chemical_id');
    for (const column of new Set(columns)) sums.addSelect(sumColumns[column], column);
    if (context.locationIdPath) {
      sums.andWhere(
        "c.location_id IN (SELECT sl.id FROM locations sl WHERE sl.id_path LIKE :prefix ESCAPE '\\')",
      );
    }
    return sums;
  }

  return {
    /**
     * A page of the stock overview. Page first: the chemicals of the page are picked (filters
     * and sort applied), then containers are summed for those alone. Only a filter or sort on
     * the sums (a place, reorder point, expiring, sort by total, count or next expiry) sums
     * first, and then only over the chemicals the other filters let through, from the
     * covering index `containers_stock_idx` (no table rows read).
     */
    async overview(
      query: StockListQuery,
      context: { today: string; locationIdPath?: string; expiringBefore?: string },
    ): Promise<{ rows: StockRow[]; total: number }> {
      const parameters: Record<string, unknown> = {
        today: context.today,
        prefix: `${context.locationIdPath ?? ''}%`,
        expiringBefore: context.expiringBefore ?? '',
      };
      /** Conditions on the chemical row alone, for the alias `alias`. */
      const chemicalFilters = (alias: string): string[] => {
        const conditions: string[] = [];
        if (query.q) conditions.push(`${alias}.search_text LIKE :q ESCAPE '\\'`);
        if (query.storageGroup) conditions.push(`${alias}.storage_group = :group`);
        // Only a chemical with a reorder point can be at or below it.
        if (query.belowReorderPoint === true) conditions.push(`${alias}.reorder_point IS NOT NULL`);
        return conditions;
      };
      if (query.q) parameters.q = containsPattern(query.q.toLowerCase());
      if (query.storageGroup) parameters.group = query.storageGroup;

      const { field, direction } = parseSort(query.sort);

      // 1. The ids of the page, in order, and how many chemicals match.
      const picked = manager.createQueryBuilder().select('ch.id', 'id').from('chemicals', 'ch');
      for (const condition of chemicalFilters('ch')) picked.andWhere(condition);
      const needed: SumColumn[] = [];
      if (field === 'total' || query.belowReorderPoint !== undefined) needed.push('total');
      if (field === 'containerCount' || context.locationIdPath) needed.push('container_count');
      if (field === 'nextExpiresOn') needed.push('next_expires_on');
      if (context.expiringBefore) needed.push('expiring_count');
      if (needed.length > 0) {
        const restrict = chemicalFilters('f');
        const sums = perChemicalSums(context, needed);
        if (restrict.length > 0) {
          sums.andWhere(
            `c.chemical_id IN (SELECT f.id FROM chemicals f WHERE ${restrict.join(' AND ')})`,
          );
        }
        if (context.expiringBefore) {
          // Chemicals with a usable container expiring soon (anywhere: a superset when a
          // place is asked), found from the expiry index.
          sums.andWhere(
            "c.chemical_id IN (SELECT soon.chemical_id FROM containers soon WHERE soon.expires_on >= :today AND soon.expires_on <= :expiringBefore AND soon.status IN ('sealed', 'open'))",
          );
        }
        picked[context.locationIdPath || context.expiringBefore ? 'innerJoin' : 'leftJoin'](
          `(${sums.getQuery()})`,
          's',
          's.chemical_id = ch.id',
        );
        if (query.belowReorderPoint === true) {
          picked.andWhere(atOrBelowReorderPointCondition('ch', totalSql));
        } else if (query.belowReorderPoint === false) {
          picked.andWhere(`NOT (${atOrBelowReorderPointCondition('ch', totalSql)})`);
        }
        if (context.expiringBefore) picked.andWhere('s.expiring_count > 0');
      }
      picked.setParameters(parameters);
      const column = sortColumns[field] ?? sortColumns.name!;
      // When the sums must be worked out for every chemical anyway, the count comes with the
      // page in the same pass (a window over the whole result, before LIMIT).
      const countWithPage = needed.length > 0;
      if (countWithPage) picked.addSelect('COUNT(*) OVER ()', 'matching');
      if (field === 'nextExpiresOn')
        picked.orderBy(`CASE WHEN ${column} IS NULL THEN 1 ELSE 0 END`, 'ASC');
      const page = await picked
        .addOrderBy(column, direction === 'desc' ? 'DESC' : 'ASC')
        .addOrderBy('ch.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<{ id: number; matching?: number }>();
      const ids = page.map((row) => Number(row.id));
      const total =
        countWithPage && page.length > 0
          ? Number(page[0]!.matching)
          : Number(
              (
                await manager
                  .createQueryBuilder()
                  .select('COUNT(*)', 'n')
                  .from(`(${picked.orderBy().offset(undefined).limit(undefined).getQuery()})`, 'x')
                  .setParameters(parameters)
                  .getRawOne<{ n: number }>()
              )?.n ?? 0,
            );
      if (ids.length === 0) return { rows: [], total };

      // 2. The chemicals of the page with their sums, over their containers only.
      const pageSums = perChemicalSums(context).andWhere('c.chemical_id IN (:...ids)');
      const raw = await manager
        .createQueryBuilder()
        .select('ch.id', 'id')
        .addSelect('ch.name', 'name')
        .addSelect('ch.formula', 'formula')
        .addSelect('ch.cas_number', 'casNumber')
        .addSelect('ch.storage_group', 'storageGroup')
        .addSelect('ch.ghs_pictograms', 'ghsPictograms')
        .addSelect('ch.hazard_statements', 'hazardStatements')
        .addSelect('ch.stock_unit', 'stockUnit')
        .addSelect('ch.reorder_point', 'reorderPoint')
        .addSelect('ch.reorder_quantity', 'reorderQuantity')
        .addSelect(totalSql, 'total')
        .addSelect('COALESCE(s.container_count, 0)', 'containerCount')
        .addSelect('COALESCE(s.usable_count, 0)', 'usableContainerCount')
        .addSelect('COALESCE(s.expired_count, 0)', 'expiredContainerCount')
        .addSelect('s.next_expires_on', 'nextExpiresOn')
        .from('chemicals', 'ch')
        .leftJoin(`(${pageSums.getQuery()})`, 's', 's.chemical_id = ch.id')
        .where('ch.id IN (:...ids)')
        .setParameters({ ...parameters, ids })
        .getRawMany<StockRow>();
      const byId = new Map(raw.map((row) => [Number(row.id), row]));
      return {
        rows: ids.map((id) => {
          const row = byId.get(id)!;
          return {
            ...row,
            id,
            total: fromMicro(row.total),
            containerCount: Number(row.containerCount),
            usableContainerCount: Number(row.usableContainerCount ?? 0),
            expiredContainerCount: Number(row.expiredContainerCount ?? 0),
            reorderPoint: row.reorderPoint === null ? null : Number(row.reorderPoint),
            reorderQuantity: row.reorderQuantity === null ? null : Number(row.reorderQuantity),
          };
        }),
        total,
      };
    },

    /** Sum of every entry of the chemical's containers before `since`, and per day from then. */
    async history(
      chemicalId: number,
      since: string,
    ): Promise<{ before: number; days: { date: string; change: number }[] }> {
      const before = await manager
        .createQueryBuilder()
        .select('COALESCE(SUM(e.quantity_micro), 0)', 'n')
        .from('ledger_entries', 'e')
        .innerJoin('containers', 'c', 'c.id = e.container_id')
        .where('c.chemical_id = :chemicalId', { chemicalId })
        .andWhere('e.created_at < :since', { since })
        .getRawOne<{ n: number }>();
      const days = await manager
        .createQueryBuilder()
        .select('SUBSTR(e.created_at, 1, 10)', 'date')
        .addSelect('SUM(e.quantity_micro)', 'change')
        .from('ledger_entries', 'e')
        .innerJoin('containers', 'c', 'c.id = e.container_id')
        .where('c.chemical_id = :chemicalId', { chemicalId })
        .andWhere('e.created_at >= :since', { since })
        .groupBy('SUBSTR(e.created_at, 1, 10)')
        .orderBy('date', 'ASC')
        .getRawMany<{ date: string; change: number }>();
      return {
        before: fromMicro(before?.n ?? 0),
        days: days.map((d) => ({ date: d.date, change: fromMicro(d.change) })),
      };
    },

    async searchChemicals(
      q: string,
      limit: number,
    ): Promise<
      {
        id: number;
        name: string;
        casNumber: string | null;
        formula: string | null;
        synonyms: string;
      }[]
    > {
      const rows = await manager
        .createQueryBuilder()
        .select('ch.id', 'id')
        .addSelect('ch.name', 'name')
        .addSelect('ch.cas_number', 'casNumber')
        .addSelect('ch.formula', 'formula')
        .addSelect('ch.synonyms', 'synonyms')
        .from('chemicals', 'ch')
        .where("ch.search_text LIKE :q ESCAPE '\\'", { q: containsPattern(q.toLowerCase()) })
        .orderBy(
          'CASE WHEN LOWER(ch.name) = :exact OR ch.cas_number = :raw THEN 0 ELSE 1 END',
          'ASC',
        )
        .addOrderBy('LOWER(ch.name)', 'ASC')
        .setParameters({ exact: q.toLowerCase(), raw: q })
        .limit(limit)
        .getRawMany();
      return rows.map((row) => ({ ...row, id: Number(row.id) }));
    },

    async insertStocktake(values: Omit<StocktakeRow, 'id' | 'location' | 'user'>): Promise<number> {
      const result = await stocktakes.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateStocktake(
      id: number,
      changes: Partial<Omit<StocktakeRow, 'id' | 'location' | 'user'>>,
    ) {
      await stocktakes.update({ id }, changes);
    },
    async findStocktake(id: number): Promise<StocktakeRow | null> {
      return stocktakes.findOneBy({ id });
    },
    async listStocktakes(
      locationId: number | undefined,
      page: number,
      pageSize: number,
      direction: 'ASC' | 'DESC',
    ): Promise<{ rows: StocktakeRow[]; total: number }> {
      const qb = stocktakes.createQueryBuilder('s');
      if (locationId) qb.where('s.locationId = :locationId', { locationId });
      const total = await qb.getCount();
      const rows = await qb
        .orderBy('s.createdAt', direction)
        .addOrderBy('s.id', direction)
        .offset((page - 1) * pageSize)
        .limit(pageSize)
        .getMany();
      return { rows, total };
    },
  };
}
export type StockRepository = ReturnType<typeof stockRepository>;
