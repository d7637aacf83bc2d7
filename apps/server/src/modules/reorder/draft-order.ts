import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import { addOrderLines, draftOrderFromLines } from '../orders/order-drafts';
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
 * that supplier's newest draft, else a new draft — through the orders module's drafting, so
 * fees, copied catalogue values and the audit trail are the same as for any order. Runs inside
 * the caller's transaction.
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
  const lines = input.lines.map(({ item, packs }) => ({
    catalogItemId: item.catalogItemId,
    packs,
  }));
  const found = input.orderId ?? (await repos.reorder.latestDraftOrderOf(input.supplierId));
  const order = found === null ? null : await repos.orders.findOrder(found);
  let orderId: number;
  if (order) {
    orderId = order.id;
    await addOrderLines(repos, order, lines);
    await repos.orders.updateOrder(orderId, { updatedAt: nowIso() });
  } else {
    orderId = await draftOrderFromLines(repos, {
      supplierId: input.supplierId,
      lines,
      actor: { id: input.coordinatorId },
      title: `Restock from ${input.supplierName}, ${nowIso().slice(0, 10)}`,
      currency: input.currency,
    });
  }
  const lineIds = new Map(
    (await repos.orders.linesOf(orderId)).map((line) => [line.catalogItemId, line.id]),
  );
  return { orderId, created: order === null, lineIds };
}
