import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { OfferRow } from './reorder.repository';

/** Packs of one catalogue item to put on an order. */
export interface DraftLine {
  item: OfferRow;
  packs: number;
}

/** Where lines went: the order, whether it was made now, and each catalogue item's line. */
export interface DraftedLines {
  orderId: number;
  created: boolean;
  lineIds: Map<number, number>;
}

/**
 * Adds packs to a draft order of the lines' supplier: the order `orderId` when given, else
 * that supplier's newest draft, else a new draft (fees copied from the supplier, the fee
 * split by value). A catalogue item already on the order gets the packs added to its line;
 * another gets a new line with the catalogue's pack, price and flags copied. Runs inside the
 * caller's transaction.
 */
export async function addToDraftOrder(
  repos: Repositories,
  input: {
    supplierId: number;
    supplierName: string;
    lines: readonly DraftLine[];
    coordinatorId: number;
    currency: string;
    orderId?: number;
  },
): Promise<DraftedLines> {
  const now = nowIso();
  const first = input.lines[0]?.item;
  let orderId = input.orderId ?? (await repos.reorder.latestDraftOrderOf(input.supplierId));
  let created = false;
  if (orderId === null) {
    orderId = await repos.orders.insertOrder({
      supplierId: input.supplierId,
      title: `Restock from ${input.supplierName}, ${now.slice(0, 10)}`,
      status: 'draft',
      feeRule: 'value',
      shippingFeeMinor: first?.shippingFeeMinor ?? 0,
      hazardousFeeMinor: first?.hazardousFeeMinor ?? 0,
      currency: input.currency,
      claimDeadline: null,
      claimsClosedAt: null,
      supplierInvoiceMinor: null,
      supplierReference: '',
      notes: '',
      coordinatorId: input.coordinatorId,
      openedAt: null,
      orderedAt: null,
      receivedAt: null,
      closedAt: null,
      cancelledAt: null,
      cancelReason: '',
      createdAt: now,
      updatedAt: now,
    });
    created = true;
  }
  const existing = await repos.orders.linesOf(orderId);
  let position = existing.reduce((top, line) => Math.max(top, line.position), 0);
  const lineIds = new Map<number, number>();
  for (const { item, packs } of input.lines) {
    const line = existing.find((candidate) => candidate.catalogItemId === item.catalogItemId);
    if (line) {
      line.packs += packs;
      await repos.orders.updateLine(line.id, { packs: line.packs, updatedAt: now });
      lineIds.set(item.catalogItemId, line.id);
      continue;
    }
    position += 1;
    const values = {
      orderId,
      catalogItemId: item.catalogItemId,
      chemicalId: item.chemicalId,
      position,
      sku: item.sku,
      packs,
      packSize: item.packSize,
      packUnit: item.packUnit,
      unitPriceMinor: item.priceMinor,
      grade: item.grade,
      purityPercent: item.purityPercent,
      hazardous: item.hazardous,
      splittable: item.splittable,
      createdAt: now,
      updatedAt: now,
    };
    const id = await repos.orders.insertLine(values);
    existing.push({ id, ...values });
    lineIds.set(item.catalogItemId, id);
  }
  if (!created) await repos.orders.updateOrder(orderId, { updatedAt: now });
  return { orderId, created, lineIds };
}
