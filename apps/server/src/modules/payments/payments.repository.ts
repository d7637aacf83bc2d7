import type { EntityManager } from 'typeorm';
import { lockForWrite } from '../../db/postgres';
import { PaymentEventEntity, type PaymentEventRow } from './payment-event.entity';
import { PaymentEntity, type PaymentRow } from './payment.entity';

export type PaymentValues = Omit<PaymentRow, 'id' | 'order' | 'share' | 'recordedBy'>;

/** Data access for `payments` (the money trail, rows only added and moved forward) and `payment_events`. */
export function paymentsRepository(manager: EntityManager) {
  const payments = manager.getRepository(PaymentEntity);
  const events = manager.getRepository(PaymentEventEntity);
  const plain = (row: PaymentRow | null) => (row ? { ...row } : null);

  return {
    async insert(values: PaymentValues): Promise<PaymentRow> {
      const result = await payments.insert(values);
      return { ...values, id: Number(result.identifiers[0]?.id) };
    },
    async update(id: number, changes: Partial<PaymentValues>): Promise<void> {
      await payments.update({ id }, changes);
    },
    /** In a transaction on PostgreSQL the payment stays locked until it ends (status moves once). */
    async findById(id: number): Promise<PaymentRow | null> {
      return plain(await payments.findOne({ where: { id }, ...lockForWrite(manager) }));
    },
    async findBySession(sessionId: string): Promise<PaymentRow | null> {
      return plain(
        await payments.findOne({
          where: { providerSessionId: sessionId, kind: 'checkout' },
          ...lockForWrite(manager),
        }),
      );
    },
    /** Every row of one share, oldest first. */
    async ofShare(shareId: number): Promise<PaymentRow[]> {
      return (await payments.find({ where: { shareId }, order: { id: 'ASC' } })).map((row) => ({
        ...row,
      }));
    },
    /** Every row of one order, oldest first. */
    async ofOrder(orderId: number): Promise<PaymentRow[]> {
      return (await payments.find({ where: { orderId }, order: { id: 'ASC' } })).map((row) => ({
        ...row,
      }));
    },
    /** Rows that name a provider payment (the checkout that paid it and its refunds). */
    async ofPaymentIntent(paymentIntentId: string): Promise<PaymentRow[]> {
      return (
        await payments.find({
          where: { providerPaymentIntentId: paymentIntentId },
          order: { id: 'ASC' },
        })
      ).map((row) => ({ ...row }));
    },
    async findEvent(id: string): Promise<PaymentEventRow | null> {
      const row = await events.findOneBy({ id });
      return row ? { ...row } : null;
    },
    async insertEvent(row: PaymentEventRow): Promise<void> {
      await events.insert(row);
    },
  };
}
export type PaymentsRepository = ReturnType<typeof paymentsRepository>;
