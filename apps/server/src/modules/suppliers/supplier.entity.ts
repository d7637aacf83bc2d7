import { EntitySchema } from 'typeorm';

/** A row of `suppliers`: a shop the lab buys from, with its fees in minor units (cents). */
export interface SupplierRow {
  id: number;
  name: string;
  contactName: string;
  email: string;
  phone: string;
  website: string;
  orderingNotes: string;
  /** Smallest order the supplier accepts, before fees; 0 for none. */
  minimumOrderMinor: number;
  shippingFeeMinor: number;
  /** Charged once per order that holds any hazardous-goods item. */
  hazardousFeeMinor: number;
  archived: boolean;
  createdAt: string;
  updatedAt: string;
}

export const SupplierEntity = new EntitySchema<SupplierRow>({
  name: 'Supplier',
  tableName: 'suppliers',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    name: { type: 'varchar', length: 200 },
    contactName: { name: 'contact_name', type: 'varchar', length: 200 },
    email: { type: 'varchar', length: 254 },
    phone: { type: 'varchar', length: 60 },
    website: { type: 'varchar', length: 300 },
    orderingNotes: { name: 'ordering_notes', type: 'text' },
    minimumOrderMinor: { name: 'minimum_order_minor', type: 'integer' },
    shippingFeeMinor: { name: 'shipping_fee_minor', type: 'integer' },
    hazardousFeeMinor: { name: 'hazardous_fee_minor', type: 'integer' },
    archived: { type: 'boolean' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  indices: [{ name: 'suppliers_name_unique', columns: ['name'], unique: true }],
});
