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
    phone: '',
    website: '',
    orderingNotes: '',
    minimumOrderMinor: 0,
    shippingFeeMinor: options.shippingFeeMinor ?? 995,
    hazardousFeeMinor: options.hazardousFeeMinor ?? 1500,
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
