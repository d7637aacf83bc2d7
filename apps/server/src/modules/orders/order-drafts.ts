import {
  todayIso,
  type FeeRule,
  type OrderAuditAction,
  type OrderLineInput,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import type { CatalogItemRow } from '../suppliers/catalog-item.entity';
import type { OrderRow } from './order.entity';

/** Records a coordinator's action on an order in the audit trail. */
export async function auditOrder(
  repos: Repositories,
  actorId: number,
  action: OrderAuditAction,
  orderId: number,
  detail: Record<string, unknown> = {},
): Promise<void> {
  await repos.audit.insert({
    actorId,
    action,
    targetType: 'order',
    targetId: orderId,
    detail,
    createdAt: nowIso(),
  });
}

/** What a draft is made from; everything but the supplier and the lines has a default. */
export interface DraftOrderInput {
  supplierId: number;
  lines: readonly OrderLineInput[];
  actor: { id: number };
  title?: string;
  feeRule?: FeeRule;
  claimDeadline?: string | null;
  notes?: string;
  /** The lab's currency; taken from the catalogue items when not given. */
  currency?: string;
}

/**
 * The catalogue items of `lines`, checked: each is the supplier's, still sold and priced in
 * `currency`. Throws a 400 naming the line, before anything is written.
 */
async function catalogueFor(
  repos: Repositories,
  supplierId: number,
  lines: readonly OrderLineInput[],
  currency: string | undefined,
): Promise<{ items: Map<number, CatalogItemRow>; currency: string | undefined }> {
  const rows = await repos.orders.catalogItemsByIds(lines.map((line) => line.catalogItemId));
  const items = new Map(rows.map((row) => [row.id, row]));
  const fields: Record<string, string> = {};
  let lineCurrency = currency;
  lines.forEach((line, index) => {
    const item = items.get(line.catalogItemId);
    const field = `lines.${index}.catalogItemId`;
    if (!item) fields[field] = 'no such catalogue item';
    else if (item.supplierId !== supplierId) fields[field] = 'is sold by another supplier';
    else if (item.discontinued) fields[field] = `${item.sku} is no longer sold`;
    else if (lineCurrency !== undefined && item.currency !== lineCurrency) {
      fields[field] = `${item.sku} is priced in ${item.currency}; the order is in ${lineCurrency}`;
    } else lineCurrency = item.currency;
  });
  if (Object.keys(fields).length > 0) {
    throw AppError.validation('Some lines cannot go on this order.', fields);
  }
  return { items, currency: lineCurrency };
}

/**
 * Adds packs of catalogue items to an order: a new line copies pack, price and flags from the
 * catalogue (a later price list does not change it); an item already on the order gets the
 * packs added to its line.
 */
export async function addOrderLines(
  repos: Repositories,
  order: Pick<OrderRow, 'id' | 'supplierId' | 'currency'>,
  lines: readonly OrderLineInput[],
): Promise<number[]> {
  const { items } = await catalogueFor(repos, order.supplierId, lines, order.currency);
  const existing = await repos.orders.linesOf(order.id);
  let position = existing.reduce((max, line) => Math.max(max, line.position), 0);
  const now = nowIso();
  const ids: number[] = [];
  for (const input of lines) {
    const item = items.get(input.catalogItemId)!;
    const same = existing.find((line) => line.catalogItemId === item.id);
    if (same) {
      same.packs += input.packs;
      await repos.orders.updateLine(same.id, { packs: same.packs, updatedAt: now });
      ids.push(same.id);
      continue;
    }
    position += 1;
    const values = {
      orderId: order.id,
      catalogItemId: item.id,
      chemicalId: item.chemicalId,
      position,
      sku: item.sku,
      packs: input.packs,
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
    ids.push(id);
  }
  return ids;
}

/**
 * Drafts a shared order with one supplier from catalogue lines: the supplier's fees are
 * copied onto it, the caller becomes its coordinator. Call it inside a transaction (reorder
 * suggestions, the plan page's Reorder button and `POST /api/orders` all draft through it);
 * answers the new order's id.
 */
export async function draftOrderFromLines(
  repos: Repositories,
  input: DraftOrderInput,
): Promise<number> {
  const supplier = await repos.orders.findSupplier(input.supplierId);
  if (!supplier) {
    throw AppError.validation('Choose a supplier.', { supplierId: 'no such supplier' });
  }
  if (supplier.archived) {
    throw AppError.conflict(`${supplier.name} is archived: orders cannot be drafted with it.`);
  }
  const { currency } = await catalogueFor(repos, supplier.id, input.lines, input.currency);
  if (currency === undefined) {
    throw AppError.validation('Add at least one catalogue item.', {
      lines: 'at least one line',
    });
  }
  const now = nowIso();
  const id = await repos.orders.insertOrder({
    supplierId: supplier.id,
    title: input.title?.trim() || `${supplier.name}, ${todayIso()}`,
    status: 'draft',
    feeRule: input.feeRule ?? 'value',
    shippingFeeMinor: supplier.shippingFeeMinor,
    hazardousFeeMinor: supplier.hazardousFeeMinor,
    currency,
    claimDeadline: input.claimDeadline ?? null,
    claimsClosedAt: null,
    supplierInvoiceMinor: null,
    supplierReference: '',
    notes: input.notes ?? '',
    coordinatorId: input.actor.id,
    openedAt: null,
    orderedAt: null,
    receivedAt: null,
    closedAt: null,
    cancelledAt: null,
    cancelReason: '',
    createdAt: now,
    updatedAt: now,
  });
  await addOrderLines(repos, { id, supplierId: supplier.id, currency }, input.lines);
  await auditOrder(repos, input.actor.id, 'order.drafted', id, {
    supplierId: supplier.id,
    lines: input.lines.length,
  });
  return id;
}
