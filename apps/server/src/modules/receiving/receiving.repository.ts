import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { OrderShareEntity } from '../orders/order-share.entity';
import { OrderEntity, type OrderRow } from '../orders/order.entity';
import { PaymentEntity, type PaymentRow } from '../payments/payment.entity';
import { SupplierEntity } from '../suppliers/supplier.entity';
import { UserEntity } from '../users/user.entity';

export interface PersonName {
  id: number;
  displayName: string;
  email: string;
}

/**
 * The reads receiving and the money views need beyond an order itself: supplier names,
 * people's names, the payment rows of orders, and which orders a member has shares in.
 */
export function receivingRepository(manager: EntityManager) {
  const payments = manager.getRepository(PaymentEntity);
  return {
    async supplierNames(ids: number[]): Promise<Map<number, string>> {
      if (ids.length === 0) return new Map();
      const rows = await manager
        .getRepository(SupplierEntity)
        .find({ where: { id: In([...new Set(ids)]) }, select: { id: true, name: true } });
      return new Map(rows.map((row) => [row.id, row.name]));
    },
    async people(ids: number[]): Promise<Map<number, PersonName>> {
      if (ids.length === 0) return new Map();
      const rows = await manager.getRepository(UserEntity).find({
        where: { id: In([...new Set(ids)]) },
        select: { id: true, displayName: true, email: true },
      });
      return new Map(
        rows.map((row) => [row.id, { id: row.id, displayName: row.displayName, email: row.email }]),
      );
    },
    /** Every payment row of the orders, oldest first. */
    async paymentsOf(orderIds: number[]): Promise<PaymentRow[]> {
      if (orderIds.length === 0) return [];
      return payments.find({
        where: { orderId: In([...new Set(orderIds)]) },
        order: { createdAt: 'ASC', id: 'ASC' },
      });
    },
    /** Orders the member has a share in, newest first. */
    async ordersOfMember(userId: number): Promise<OrderRow[]> {
      const shareRows = await manager
        .getRepository(OrderShareEntity)
        .find({ where: { userId }, select: { orderId: true } });
      const ids = [...new Set(shareRows.map((row) => row.orderId))];
      if (ids.length === 0) return [];
      return manager
        .getRepository(OrderEntity)
        .find({ where: { id: In(ids) }, order: { createdAt: 'DESC', id: 'DESC' } });
    },
    /** Orders that have money to account for (every order past draft), oldest first. */
    async accountableOrders(): Promise<OrderRow[]> {
      return manager
        .getRepository(OrderEntity)
        .createQueryBuilder('o')
        .where("o.status <> 'draft'")
        .orderBy('o.id', 'ASC')
        .getMany();
    },
  };
}
export type ReceivingRepository = ReturnType<typeof receivingRepository>;
