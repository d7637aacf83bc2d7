import { parseSort, type OrderListQuery, type OrderStatus } from '@lotwise/shared';
import { In, type EntityManager } from 'typeorm';
import { lockForWrite } from '../../db/postgres';
import { containsPattern } from '../../db/sql';
import { ChemicalEntity, type ChemicalRow } from '../chemicals/chemical.entity';
import { CatalogItemEntity, type CatalogItemRow } from '../suppliers/catalog-item.entity';
import { SupplierEntity, type SupplierRow } from '../suppliers/supplier.entity';
import { OrderLineEntity, type OrderLineRow } from './order-line.entity';
import { OrderShareEntity, type OrderShareRow } from './order-share.entity';
import { OrderEntity, type OrderRow } from './order.entity';
import { priceOrder, type OrderCost, type PricedLineInput } from './order-pricing';

export type OrderValues = Omit<OrderRow, 'id' | 'supplier' | 'coordinator'>;
export type OrderLineValues = Omit<OrderLineRow, 'id' | 'order' | 'catalogItem' | 'chemical'>;
export type OrderShareValues = Omit<OrderShareRow, 'id' | 'order' | 'line' | 'user' | 'container'>;

/** Which orders a list shows: drafts only to coordinators. */
export interface OrderListScope {
  includeDrafts: boolean;
}

const sortColumns: Record<string, string> = {
  createdAt: 'o.createdAt',
  claimDeadline: 'o.claimDeadline',
  title: 'o.title',
  status: 'o.status',
};

/** An order with its lines, shares and what it costs as it stands. */
export interface OrderRecord {
  order: OrderRow;
  lines: OrderLineRow[];
  shares: OrderShareRow[];
  cost: OrderCost;
}

export function ordersRepository(manager: EntityManager) {
  const orders = manager.getRepository(OrderEntity);
  const lines = manager.getRepository(OrderLineEntity);
  const shares = manager.getRepository(OrderShareEntity);

  async function densities(chemicalIds: number[]): Promise<Map<number, number | null>> {
    if (chemicalIds.length === 0) return new Map();
    const rows = await manager
      .getRepository(ChemicalEntity)
      .createQueryBuilder('c')
      .select(['c.id AS id', 'c.density AS density'])
      .where('c.id IN (:...ids)', { ids: [...new Set(chemicalIds)] })
      .getRawMany<{ id: number; density: number | null }>();
    return new Map(
      rows.map((row) => [Number(row.id), row.density === null ? null : Number(row.density)]),
    );
  }

  return {
    /** A page of order ids matching the list query (by title or supplier name). */
    async list(
      query: OrderListQuery,
      scope: OrderListScope,
    ): Promise<{ ids: number[]; total: number }> {
      const qb = orders.createQueryBuilder('o').select('o.id', 'id');
      if (!scope.includeDrafts) qb.andWhere("o.status <> 'draft'");
      if (query.status) qb.andWhere('o.status = :status', { status: query.status });
      if (query.q) {
        // The supplier is joined only to search its name, so a plain count reads an index.
        qb.innerJoin('suppliers', 's', 's.id = o.supplierId').andWhere(
          "(LOWER(o.title) LIKE :q ESCAPE '\\' OR LOWER(s.name) LIKE :q ESCAPE '\\')",
          {
            q: containsPattern(query.q.toLowerCase()),
          },
        );
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const dir = direction === 'desc' ? 'DESC' : 'ASC';
      const rows = await qb
        .orderBy(sortColumns[field] ?? 'o.createdAt', dir)
        .addOrderBy('o.id', dir)
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<{ id: number }>();
      return { ids: rows.map((row) => Number(row.id)), total };
    },
    async findSupplier(id: number): Promise<SupplierRow | null> {
      return manager.getRepository(SupplierEntity).findOneBy({ id });
    },
    async suppliersByIds(ids: number[]): Promise<SupplierRow[]> {
      if (ids.length === 0) return [];
      return manager.getRepository(SupplierEntity).findBy({ id: In([...new Set(ids)]) });
    },
    async catalogItemsByIds(ids: number[]): Promise<CatalogItemRow[]> {
      if (ids.length === 0) return [];
      return manager.getRepository(CatalogItemEntity).findBy({ id: In([...new Set(ids)]) });
    },
    async chemicalsByIds(ids: number[]): Promise<ChemicalRow[]> {
      if (ids.length === 0) return [];
      return manager.getRepository(ChemicalEntity).findBy({ id: In([...new Set(ids)]) });
    },
    /** Orders in `statuses` a person holds a share of (alert rules: chemicals they claimed). */
    async claimedChemicals(
      userIds: number[],
      statuses: readonly OrderStatus[],
    ): Promise<Map<number, Set<number>>> {
      const claimed = new Map<number, Set<number>>();
      if (userIds.length === 0) return claimed;
      const rows = await shares
        .createQueryBuilder('sh')
        .innerJoin('order_lines', 'l', 'l.id = sh.lineId')
        .innerJoin('orders', 'o', 'o.id = sh.orderId')
        .select(['sh.userId AS "userId"', 'l.chemical_id AS "chemicalId"'])
        .where('sh.userId IN (:...userIds)', { userIds })
        .andWhere('o.status IN (:...statuses)', { statuses: [...statuses] })
        .getRawMany<{ userId: number; chemicalId: number }>();
      for (const row of rows) {
        const set = claimed.get(Number(row.userId)) ?? new Set<number>();
        set.add(Number(row.chemicalId));
        claimed.set(Number(row.userId), set);
      }
      return claimed;
    },
    /**
     * In a transaction on PostgreSQL the order stays locked until it ends, so claims, closing
     * claims, payments and status changes of one order take turns across app instances.
     */
    async findOrder(id: number): Promise<OrderRow | null> {
      return orders.findOne({ where: { id }, ...lockForWrite(manager) });
    },
    async linesOf(orderId: number): Promise<OrderLineRow[]> {
      return lines.find({ where: { orderId }, order: { position: 'ASC', id: 'ASC' } });
    },
    async sharesOf(orderId: number): Promise<OrderShareRow[]> {
      return shares.find({ where: { orderId }, order: { id: 'ASC' } });
    },
    async findShare(id: number): Promise<OrderShareRow | null> {
      return shares.findOneBy({ id });
    },
    /** The order with its lines and shares, priced; null for an unknown id. */
    /** Locked like findOrder; its lines and shares are read after the lock, so they are current. */
    async load(id: number): Promise<OrderRecord | null> {
      const order = await orders.findOne({ where: { id }, ...lockForWrite(manager) });
      if (!order) return null;
      const orderLines = await lines.find({
        where: { orderId: id },
        order: { position: 'ASC', id: 'ASC' },
      });
      const orderShares = await shares.find({ where: { orderId: id }, order: { id: 'ASC' } });
      const density = await densities(orderLines.map((line) => line.chemicalId));
      const priced: PricedLineInput[] = orderLines.map((line) => ({
        ...line,
        densityGPerMl: density.get(line.chemicalId) ?? null,
      }));
      return {
        order,
        lines: orderLines,
        shares: orderShares,
        cost: priceOrder(order, priced, orderShares),
      };
    },
    async insertOrder(values: OrderValues): Promise<number> {
      const result = await orders.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateOrder(id: number, changes: Partial<OrderValues>): Promise<void> {
      await orders.update({ id }, changes);
    },
    async insertLine(values: OrderLineValues): Promise<number> {
      const result = await lines.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateLine(id: number, changes: Partial<OrderLineValues>): Promise<void> {
      await lines.update({ id }, changes);
    },
    async deleteLine(id: number): Promise<void> {
      await lines.delete({ id });
    },
    async insertShare(values: OrderShareValues): Promise<number> {
      const result = await shares.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateShare(id: number, changes: Partial<OrderShareValues>): Promise<void> {
      await shares.update({ id }, changes);
    },
    async deleteShare(id: number): Promise<void> {
      await shares.delete({ id });
    },
  };
}
