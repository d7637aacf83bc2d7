import type { RequestStatus, StockUnit } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';
import { microQuantity } from '../../db/quantities';

/** A row of `purchase_requests`: a member asks for an amount of a chemical, maybe by a date. */
export interface PurchaseRequestRow {
  id: number;
  userId: number;
  chemicalId: number;
  quantity: number;
  unit: StockUnit;
  neededBy: string | null;
  note: string;
  status: RequestStatus;
  /** The order (and the share in it) the request was folded into. */
  orderId: number | null;
  shareId: number | null;
  createdAt: string;
  updatedAt: string;
  user?: unknown;
  chemical?: unknown;
  order?: unknown;
}

export const PurchaseRequestEntity = new EntitySchema<PurchaseRequestRow>({
  name: 'PurchaseRequest',
  tableName: 'purchase_requests',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    userId: { name: 'user_id', type: 'integer' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    quantity: { name: 'quantity_micro', type: 'bigint', transformer: microQuantity },
    unit: { type: 'varchar', length: 4 },
    neededBy: { name: 'needed_by', type: 'varchar', length: 10, nullable: true },
    note: { type: 'text' },
    status: { type: 'varchar', length: 10 },
    orderId: { name: 'order_id', type: 'integer', nullable: true },
    shareId: { name: 'share_id', type: 'integer', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  relations: {
    user: foreignKey('User', 'user_id', 'purchase_requests_user_fk', 'RESTRICT'),
    chemical: foreignKey('Chemical', 'chemical_id', 'purchase_requests_chemical_fk', 'RESTRICT'),
    order: foreignKey('Order', 'order_id', 'purchase_requests_order_fk', 'SET NULL', true),
  },
  indices: [
    { name: 'purchase_requests_status_idx', columns: ['status'] },
    { name: 'purchase_requests_user_idx', columns: ['userId'] },
  ],
});
