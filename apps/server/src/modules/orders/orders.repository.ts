import type { EntityManager } from 'typeorm';
import { ChemicalEntity } from '../chemicals/chemical.entity';
import { OrderLineEntity, type OrderLineRow } from './order-line.entity';
import { OrderShareEntity, type OrderShareRow } from './order-share.entity';
import { OrderEntity, type OrderRow } from './order.entity';
import { priceOrder, type OrderCost, type PricedLineInput } from './order-pricing';

export type OrderValues = Omit<OrderRow, 'id' | 'supplier' | 'coordinator'>;
export type OrderLineValues = Omit<OrderLineRow, 'id' | 'order' | 'catalogItem' | 'chemical'>;
export type OrderShareValues = Omit<OrderShareRow, 'id' | 'order' | 'line' | 'user' | 'container'>;

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
    async findOrder(id: number): Promise<OrderRow | null> {
      return orders.findOneBy({ id });
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
    async load(id: number): Promise<OrderRecord | null> {
      const order = await orders.findOneBy({ id });
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
