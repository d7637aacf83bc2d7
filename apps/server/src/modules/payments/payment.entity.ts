import type { PaymentKind, PaymentStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `payments`: one movement of money for a share — a checkout attempt, cash handed to
 * the coordinator, the lab's own funds, or a refund (kind `refund`, amount given back). Rows are
 * only added and have their status moved forward, never deleted: they are the money trail.
 */
export interface PaymentRow {
  id: number;
  orderId: number;
  shareId: number;
  kind: PaymentKind;
  status: PaymentStatus;
  amountMinor: number;
  currency: string;
  /** Checkout attempts of a share are numbered 1, 2, …; part of the idempotency key. */
  attempt: number;
  idempotencyKey: string | null;
  providerSessionId: string | null;
  providerPaymentIntentId: string | null;
  providerRefundId: string | null;
  note: string;
  recordedById: number | null;
  createdAt: string;
  updatedAt: string;
  order?: unknown;
  share?: unknown;
  recordedBy?: unknown;
}

export const PaymentEntity = new EntitySchema<PaymentRow>({
  name: 'Payment',
  tableName: 'payments',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    orderId: { name: 'order_id', type: 'integer' },
    shareId: { name: 'share_id', type: 'integer' },
    kind: { type: 'varchar', length: 10 },
    status: { type: 'varchar', length: 10 },
    amountMinor: { name: 'amount_minor', type: 'integer' },
    currency: { type: 'varchar', length: 3 },
    attempt: { type: 'integer' },
    idempotencyKey: { name: 'idempotency_key', type: 'varchar', length: 120, nullable: true },
    providerSessionId: {
      name: 'provider_session_id',
      type: 'varchar',
      length: 120,
      nullable: true,
    },
    providerPaymentIntentId: {
      name: 'provider_payment_intent_id',
      type: 'varchar',
      length: 120,
      nullable: true,
    },
    providerRefundId: {
      name: 'provider_refund_id',
      type: 'varchar',
      length: 120,
      nullable: true,
    },
    note: { type: 'text' },
    recordedById: { name: 'recorded_by_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    order: foreignKey('Order', 'order_id', 'payments_order_fk', 'RESTRICT'),
    share: foreignKey('OrderShare', 'share_id', 'payments_share_fk', 'RESTRICT'),
    recordedBy: foreignKey('User', 'recorded_by_id', 'payments_recorded_by_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'payments_share_idx', columns: ['shareId'] },
    { name: 'payments_order_idx', columns: ['orderId'] },
    { name: 'payments_provider_session_idx', columns: ['providerSessionId'] },
  ],
});
