import type { OrderStatus, PackUnit, PaymentKind } from '@lotwise/shared';
import { nowIso } from '../db/sql';
import { PaymentEntity } from '../modules/payments/payment.entity';
import { CatalogItemEntity } from '../modules/suppliers/catalog-item.entity';
import { SupplierEntity } from '../modules/suppliers/supplier.entity';
import { testContext } from './harness';

let counter = 0;
const next = () => ++counter;

export interface LineSpec {
  chemicalId: number;
  packs: number;
  packSize: number;
  packUnit: PackUnit;
  unitPriceMinor: number;
  hazardous?: boolean;
  splittable?: boolean;
  /** Claims on the line: a member's id, or null for the lab's share, and the quantity. */
  shares: { userId: number | null; quantity: number }[];
}

export interface OrderSpec {
  status?: OrderStatus;
  shippingFeeMinor?: number;
  hazardousFeeMinor?: number;
  supplierInvoiceMinor?: number | null;
  lines: LineSpec[];
}

/**
 * A shared order straight in the database, as the orders module would leave it: a supplier,
 * catalogue items, lines, claims closed with every share's amount fixed from `priceOrder`,
 * and the status asked for (`ordered` by default).
 */
export async function makeOrder(spec: OrderSpec) {
  const { dataSource, store } = testContext();
  const now = nowIso();
  const n = next();
  const supplier = await dataSource.getRepository(SupplierEntity).save({
    name: `Kestrel Fine Reagents ${n} (fictional)`,
    contactName: 'Orders desk',
    email: `orders${n}@kestrel.example.test`,
    phone: '',
    website: '',
    orderingNotes: '',
    minimumOrderMinor: 0,
    shippingFeeMinor: spec.shippingFeeMinor ?? 995,
    hazardousFeeMinor: spec.hazardousFeeMinor ?? 1500,
    archived: false,
    createdAt: now,
    updatedAt: now,
  });
  const orderId = await store.repos.orders.insertOrder({
    supplierId: supplier.id,
    title: `Spring order ${n}`,
    status: 'open',
    feeRule: 'value',
    shippingFeeMinor: supplier.shippingFeeMinor,
    hazardousFeeMinor: supplier.hazardousFeeMinor,
    currency: 'EUR',
    claimDeadline: '2026-03-01',
    claimsClosedAt: null,
    supplierInvoiceMinor: spec.supplierInvoiceMinor ?? null,
    supplierReference: `KFR-${n}`,
    notes: '',
    coordinatorId: null,
    openedAt: now,
    orderedAt: null,
    receivedAt: null,
    closedAt: null,
    cancelledAt: null,
    cancelReason: '',
    createdAt: now,
    updatedAt: now,
  });
  for (const [position, line] of spec.lines.entries()) {
    const item = await dataSource.getRepository(CatalogItemEntity).save({
      supplierId: supplier.id,
      sku: `KFR-${n}-${position}`,
      chemicalId: line.chemicalId,
      packSize: line.packSize,
      packUnit: line.packUnit,
      grade: 'reagent',
      purityPercent: null,
      priceMinor: line.unitPriceMinor,
      currency: 'EUR',
      hazardous: line.hazardous ?? false,
      splittable: line.splittable ?? true,
      discontinued: false,
      createdAt: now,
      updatedAt: now,
    });
    const lineId = await store.repos.orders.insertLine({
      orderId,
      catalogItemId: item.id,
      chemicalId: line.chemicalId,
      position,
      sku: item.sku,
      packs: line.packs,
      packSize: line.packSize,
      packUnit: line.packUnit,
      unitPriceMinor: line.unitPriceMinor,
      grade: item.grade,
      purityPercent: null,
      hazardous: item.hazardous,
      splittable: item.splittable,
      createdAt: now,
      updatedAt: now,
    });
    for (const share of line.shares) {
      await store.repos.orders.insertShare({
        orderId,
        lineId,
        userId: share.userId,
        forLab: share.userId === null,
        quantity: share.quantity,
        amountMinor: null,
        paymentStatus: 'unpaid',
        paidMinor: 0,
        refundedMinor: 0,
        requestId: null,
        containerId: null,
        createdAt: now,
        updatedAt: now,
      });
    }
  }
  // Claims close: every share's amount is fixed from the one pricing function.
  const record = (await store.repos.orders.load(orderId))!;
  for (const cost of record.cost.shares) {
    await store.repos.orders.updateShare(cost.shareId, { amountMinor: cost.amountMinor });
  }
  await store.repos.orders.updateOrder(orderId, {
    claimsClosedAt: now,
    status: spec.status ?? 'ordered',
    orderedAt: spec.status === 'open' ? null : now,
  });
  return (await store.repos.orders.load(orderId))!;
}

/**
 * A payment row as the payments module writes it (succeeded unless said otherwise), and the
 * share's paid or refunded figures moved with it.
 */
export async function recordPayment(
  orderId: number,
  shareId: number,
  kind: PaymentKind,
  amountMinor: number,
  status: 'succeeded' | 'pending' | 'failed' = 'succeeded',
) {
  const { dataSource, store } = testContext();
  const now = nowIso();
  await dataSource.getRepository(PaymentEntity).insert({
    orderId,
    shareId,
    kind,
    status,
    amountMinor,
    currency: 'EUR',
    attempt: 1,
    idempotencyKey: null,
    providerSessionId: null,
    providerPaymentIntentId: null,
    providerRefundId: null,
    note: kind === 'cash' ? 'Handed to the coordinator' : '',
    recordedById: null,
    createdAt: now,
    updatedAt: now,
  });
  if (status !== 'succeeded') return;
  const share = (await store.repos.orders.findShare(shareId))!;
  if (kind === 'refund') {
    const refundedMinor = share.refundedMinor + amountMinor;
    await store.repos.orders.updateShare(shareId, {
      refundedMinor,
      paymentStatus: refundedMinor >= share.paidMinor ? 'refunded' : share.paymentStatus,
    });
  } else {
    const paidMinor = share.paidMinor + amountMinor;
    await store.repos.orders.updateShare(shareId, {
      paidMinor,
      paymentStatus: paidMinor >= (share.amountMinor ?? 0) ? 'paid' : share.paymentStatus,
    });
  }
}

/** Every share of an order paid in full, online. */
export async function payAll(orderId: number) {
  const { store } = testContext();
  for (const share of await store.repos.orders.sharesOf(orderId)) {
    await recordPayment(
      orderId,
      share.id,
      share.userId === null ? 'lab_funds' : 'checkout',
      share.amountMinor!,
    );
  }
}
