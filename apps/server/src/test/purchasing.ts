import request from 'supertest';
import { nowIso } from '../db/sql';
import { SupplierEntity } from '../modules/suppliers/supplier.entity';
import { CatalogItemEntity } from '../modules/suppliers/catalog-item.entity';
import { chemicalInput } from './factories';
import { testContext } from './harness';

export interface ClaimInput {
  userId: number | null;
  /** Grams of the 500 g pack. */
  quantity: number;
}

export interface OrderFixture {
  orderId: number;
  lineId: number;
  shares: { id: number; userId: number | null; amountMinor: number }[];
  totalMinor: number;
}

/**
 * A shared order whose claims are closed (members pay now): one splittable 500 g pack split
 * over the given claims, priced by the order pricing (shares add up to the total), amounts
 * fixed as closing claims fixes them.
 */
export async function orderReadyToPay(
  managerCookie: string,
  claims: ClaimInput[],
  options: { priceMinor?: number; shippingFeeMinor?: number; hazardousFeeMinor?: number } = {},
): Promise<OrderFixture> {
  const { app, store, dataSource } = testContext();
  const chemical = await request(app)
    .post('/api/chemicals')
    .set('Cookie', managerCookie)
    .send(chemicalInput())
    .expect(201);
  const now = nowIso();
  const supplierInsert = await dataSource.getRepository(SupplierEntity).insert({
    name: `Reagent shop ${Date.now().toString(36)}`,
    contactName: 'Sales desk',
    email: 'sales@shop.example.test',
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
    shippingFeeMinor: options.shippingFeeMinor ?? 995,
    hazardousFeeMinor: options.hazardousFeeMinor ?? 1500,
    shippingFeeMinor: spec.shippingFeeMinor ?? 995,
    hazardousFeeMinor: spec.hazardousFeeMinor ?? 1500,
    archived: false,
    createdAt: now,
    updatedAt: now,
  });
  const supplierId = Number(supplierInsert.identifiers[0]?.id);
  const itemInsert = await dataSource.getRepository(CatalogItemEntity).insert({
    supplierId,
    sku: `SKU-${Date.now().toString(36)}`,
    chemicalId: (chemical.body as { id: number }).id,
    packSize: 500,
    packUnit: 'g',
    grade: 'reagent',
    purityPercent: 99.5,
    priceMinor: options.priceMinor ?? 4999,
    currency: 'EUR',
    hazardous: true,
    splittable: true,
    discontinued: false,
    createdAt: now,
    updatedAt: now,
  });
  return store.transaction(async (repos) => {
    const orderId = await repos.orders.insertOrder({
      supplierId,
      title: 'Evening club reagents',
      status: 'open',
      feeRule: 'value',
      shippingFeeMinor: options.shippingFeeMinor ?? 995,
      hazardousFeeMinor: options.hazardousFeeMinor ?? 1500,
      currency: 'EUR',
      claimDeadline: null,
      claimsClosedAt: null,
      supplierInvoiceMinor: null,
      supplierReference: '',
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
    const lineId = await repos.orders.insertLine({
      orderId,
      catalogItemId: Number(itemInsert.identifiers[0]?.id),
      chemicalId: (chemical.body as { id: number }).id,
      position: 1,
      sku: 'SKU',
      packs: 1,
      packSize: 500,
      packUnit: 'g',
      unitPriceMinor: options.priceMinor ?? 4999,
      grade: 'reagent',
      purityPercent: 99.5,
      hazardous: true,
      splittable: true,
      createdAt: now,
      updatedAt: now,
    });
    for (const claim of claims) {
      await repos.orders.insertShare({
        orderId,
        lineId,
        userId: claim.userId,
        forLab: claim.userId === null,
        quantity: claim.quantity,
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
    const record = (await repos.orders.load(orderId))!;
    for (const cost of record.cost.shares) {
      await repos.orders.updateShare(cost.shareId, { amountMinor: cost.amountMinor });
    }
    await repos.orders.updateOrder(orderId, { claimsClosedAt: now });
    return {
      orderId,
      lineId,
      totalMinor: record.cost.totalMinor,
      shares: record.shares.map((share) => ({
        id: share.id,
        userId: share.userId,
        amountMinor: record.cost.shares.find((cost) => cost.shareId === share.id)!.amountMinor,
      })),
    };
  });
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
