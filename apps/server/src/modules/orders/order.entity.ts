import type { FeeRule, OrderStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `orders`: a shared order with one supplier. Fees are copied from the supplier when
 * the order is drafted and may be changed until claims close; from then on every share's
 * amount is fixed (order_shares.amount_minor).
 */
export interface OrderRow {
  id: number;
  supplierId: number;
  title: string;
  status: OrderStatus;
  feeRule: FeeRule;
  shippingFeeMinor: number;
  /** Charged only when a line is hazardous goods. */
  hazardousFeeMinor: number;
  currency: string;
  /** Members may claim until the end of this day. */
  claimDeadline: string | null;
  /** Set when the coordinator closes claims: amounts are fixed and members pay. */
  claimsClosedAt: string | null;
  /** What the supplier's invoice says, for the books; null until known. */
  supplierInvoiceMinor: number | null;
  supplierReference: string;
  notes: string;
  coordinatorId: number | null;
  openedAt: string | null;
  orderedAt: string | null;
  receivedAt: string | null;
  closedAt: string | null;
  cancelledAt: string | null;
  cancelReason: string;
  createdAt: string;
  updatedAt: string;
  supplier?: unknown;
  coordinator?: unknown;
}

export const OrderEntity = new EntitySchema<OrderRow>({
  name: 'Order',
  tableName: 'orders',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    supplierId: { name: 'supplier_id', type: 'integer' },
    title: { type: 'varchar', length: 200 },
    status: { type: 'varchar', length: 10 },
    feeRule: { name: 'fee_rule', type: 'varchar', length: 8 },
    shippingFeeMinor: { name: 'shipping_fee_minor', type: 'integer' },
    hazardousFeeMinor: { name: 'hazardous_fee_minor', type: 'integer' },
    currency: { type: 'varchar', length: 3 },
    claimDeadline: { name: 'claim_deadline', type: 'varchar', length: 10, nullable: true },
    claimsClosedAt: { name: 'claims_closed_at', type: 'varchar', length: 24, nullable: true },
    supplierInvoiceMinor: { name: 'supplier_invoice_minor', type: 'integer', nullable: true },
    supplierReference: { name: 'supplier_reference', type: 'varchar', length: 120 },
    notes: { type: 'text' },
    coordinatorId: { name: 'coordinator_id', type: 'integer', nullable: true },
    openedAt: { name: 'opened_at', type: 'varchar', length: 24, nullable: true },
    orderedAt: { name: 'ordered_at', type: 'varchar', length: 24, nullable: true },
    receivedAt: { name: 'received_at', type: 'varchar', length: 24, nullable: true },
    closedAt: { name: 'closed_at', type: 'varchar', length: 24, nullable: true },
    cancelledAt: { name: 'cancelled_at', type: 'varchar', length: 24, nullable: true },
    cancelReason: { name: 'cancel_reason', type: 'text' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    supplier: foreignKey('Supplier', 'supplier_id', 'orders_supplier_fk', 'RESTRICT'),
    coordinator: foreignKey('User', 'coordinator_id', 'orders_coordinator_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'orders_status_idx', columns: ['status'] },
    { name: 'orders_supplier_idx', columns: ['supplierId'] },
    { name: 'orders_created_at_idx', columns: ['createdAt'] },
    { name: 'orders_claim_deadline_idx', columns: ['claimDeadline'] },
    { name: 'orders_title_idx', columns: ['title'] },
  ],
});
