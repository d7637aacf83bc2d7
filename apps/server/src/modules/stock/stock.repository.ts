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

const sortColumns: Record<string, string> = {
  name: 'LOWER(ch.name)',
  total: 'COALESCE(s.total, 0)',
  containerCount: 'COALESCE(s.container_count, 0)',
  nextExpiresOn: 's.next_expires_on',
};

/** Stock reads across chemicals and containers, and stocktake records; plain objects. */
export function stockRepository(manager: EntityManager) {
  const stocktakes = manager.getRepository(StocktakeEntity);

  return {
    async overview(
      query: StockListQuery,
      context: { today: string; locationIdPath?: string; expiringBefore?: string },
    ): Promise<{ rows: StockRow[]; total: number }> {
      const usable = usableSql('c');
      // Containers are summed per chemical first (one pass over the containers index), then
      // joined to the chemicals, so the outer query has no GROUP BY.
      const perChemical = manager
        .createQueryBuilder()
        .select('c.chemical_id', 'chemical_id')
        .addSelect(`SUM(CASE WHEN ${usable} THEN c.quantity_micro ELSE 0 END)`, 'total')
        .addSelect('COUNT(*)', 'container_count')
        .addSelect(`SUM(CASE WHEN ${usable} THEN 1 ELSE 0 END)`, 'usable_count')
        .addSelect(
          "SUM(CASE WHEN c.status IN ('sealed', 'open') AND c.expires_on < :today THEN 1 ELSE 0 END)",
          'expired_count',
        )
        .addSelect(`MIN(CASE WHEN ${usable} THEN c.expires_on END)`, 'next_expires_on')
        .addSelect(
          `SUM(CASE WHEN ${usable} AND c.expires_on <= :expiringBefore THEN 1 ELSE 0 END)`,
          'expiring_count',
        )
        .from('containers', 'c')
        .where("c.status <> 'disposed'")
        .groupBy('c.chemical_id');
      if (context.locationIdPath) {
        perChemical.andWhere(
          "c.location_id IN (SELECT sl.id FROM locations sl WHERE sl.id_path LIKE :prefix ESCAPE '\\')",
        );
      }
      const totalSql = 'COALESCE(s.total, 0)';
      const qb = manager
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
        .leftJoin(`(${perChemical.getQuery()})`, 's', 's.chemical_id = ch.id')
        .where('1 = 1')
        .setParameters({
          today: context.today,
          prefix: `${context.locationIdPath ?? ''}%`,
          expiringBefore: context.expiringBefore ?? '',
        });
      if (query.q) {
        qb.andWhere("ch.search_text LIKE :q ESCAPE '\\'", {
          q: containsPattern(query.q.toLowerCase()),
        });
      }
      if (query.storageGroup)
        qb.andWhere('ch.storage_group = :group', { group: query.storageGroup });
      if (context.locationIdPath) qb.andWhere('s.container_count > 0');
      if (query.belowReorderPoint === true) {
        qb.andWhere(atOrBelowReorderPointCondition('ch', totalSql));
      } else if (query.belowReorderPoint === false) {
        qb.andWhere(`NOT (${atOrBelowReorderPointCondition('ch', totalSql)})`);
      }
      if (context.expiringBefore) qb.andWhere('s.expiring_count > 0');
      // Without filters on the sums, the count needs only the chemicals (no pass over containers).
      const needsSums =
        Boolean(context.locationIdPath) ||
        query.belowReorderPoint !== undefined ||
        Boolean(context.expiringBefore);
      const countQuery = needsSums
        ? manager.createQueryBuilder().select('COUNT(*)', 'n').from(`(${qb.getQuery()})`, 'x')
        : manager
            .createQueryBuilder()
            .select('COUNT(*)', 'n')
            .from('chemicals', 'ch')
            .where('1 = 1');
      if (!needsSums && query.q) countQuery.andWhere("ch.search_text LIKE :q ESCAPE '\\'");
      if (!needsSums && query.storageGroup) countQuery.andWhere('ch.storage_group = :group');
      const total = Number(
        (await countQuery.setParameters(qb.getParameters()).getRawOne<{ n: number }>())?.n ?? 0,
      );
      const { field, direction } = parseSort(query.sort);
      const column = sortColumns[field] ?? sortColumns.name!;
      if (field === 'nextExpiresOn')
        qb.orderBy(`CASE WHEN ${column} IS NULL THEN 1 ELSE 0 END`, 'ASC');
      const rows = await qb
        .addOrderBy(column, direction === 'desc' ? 'DESC' : 'ASC')
        .addOrderBy('ch.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<StockRow>();
      return {
        rows: rows.map((row) => ({
          ...row,
          id: Number(row.id),
          total: fromMicro(row.total),
          containerCount: Number(row.containerCount),
          usableContainerCount: Number(row.usableContainerCount ?? 0),
          expiredContainerCount: Number(row.expiredContainerCount ?? 0),
          reorderPoint: row.reorderPoint === null ? null : Number(row.reorderPoint),
          reorderQuantity: row.reorderQuantity === null ? null : Number(row.reorderQuantity),
        })),
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
