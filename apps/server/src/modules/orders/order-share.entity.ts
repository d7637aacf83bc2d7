import type { SharePaymentStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';
import { microQuantity } from '../../db/quantities';

/**
 * A row of `order_shares`: who takes how much of an order line. `userId` null with `forLab`
 * true is the lab's own share (an unclaimed remainder the coordinator took). The amount is
 * null while claims are open (it moves as others claim) and fixed when claims close.
 */
export interface OrderShareRow {
  id: number;
  orderId: number;
  lineId: number;
  userId: number | null;
  forLab: boolean;
  /** In the line's pack unit; whole packs unless the line is splittable. */
  quantity: number;
  amountMinor: number | null;
  paymentStatus: SharePaymentStatus;
  paidMinor: number;
  refundedMinor: number;
  /** The member request this share came from, if any. */
  requestId: number | null;
  /** The container this share became on receiving. */
  containerId: number | null;
  createdAt: string;
  updatedAt: string;
  order?: unknown;
  line?: unknown;
  user?: unknown;
  container?: unknown;
}

export const OrderShareEntity = new EntitySchema<OrderShareRow>({
  name: 'OrderShare',
  tableName: 'order_shares',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    orderId: { name: 'order_id', type: 'integer' },
    lineId: { name: 'line_id', type: 'integer' },
    userId: { name: 'user_id', type: 'integer', nullable: true },
    forLab: { name: 'for_lab', type: 'boolean' },
    quantity: { name: 'quantity_micro', type: 'bigint', transformer: microQuantity },
    amountMinor: { name: 'amount_minor', type: 'integer', nullable: true },
    paymentStatus: { name: 'payment_status', type: 'varchar', length: 10 },
    paidMinor: { name: 'paid_minor', type: 'integer' },
    refundedMinor: { name: 'refunded_minor', type: 'integer' },
    requestId: { name: 'request_id', type: 'integer', nullable: true },
    containerId: { name: 'container_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    order: foreignKey('Order', 'order_id', 'order_shares_order_fk', 'RESTRICT'),
    line: foreignKey('OrderLine', 'line_id', 'order_shares_line_fk', 'RESTRICT'),
    user: foreignKey('User', 'user_id', 'order_shares_user_fk', 'RESTRICT', true),
    container: foreignKey(
      'Container',
      'container_id',
      'order_shares_container_fk',
      'SET NULL',
      true,
    ),
  },
  indices: [
    { name: 'order_shares_order_idx', columns: ['orderId'] },
    { name: 'order_shares_line_idx', columns: ['lineId'] },
    { name: 'order_shares_user_idx', columns: ['userId'] },
  ],
});
