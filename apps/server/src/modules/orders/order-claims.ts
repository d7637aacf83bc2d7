import { can, formatQuantity, isWholeSteps, claimStep, type User } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { claimsOpen } from './order-lifecycle';
import type { OrderLineRow } from './order-line.entity';
import type { OrderShareRow } from './order-share.entity';
import { roundQuantity } from './order-views';
import type { OrderRecord } from './orders.repository';

/**
 * Members' claims on an order's lines: whole packs, or part of a pack where the line may be
 * split, never more than what remains unclaimed. One share per member per line.
 */

export async function loadOrder(repos: Repositories, id: number): Promise<OrderRecord> {
  const record = await repos.orders.load(id);
  if (!record) throw AppError.notFound(`Order ${id} does not exist.`);
  return record;
}

export function requireClaimsOpen(record: OrderRecord): void {
  if (!claimsOpen(record.order)) {
    const why =
      record.order.status === 'draft'
        ? 'it is still a draft'
        : record.order.claimsClosedAt
          ? 'claims are closed and the amounts are fixed'
          : `it is ${record.order.status}`;
    throw AppError.conflict(`Claims on this order cannot change: ${why}.`);
  }
}

function lineOf(record: OrderRecord, lineId: number): OrderLineRow {
  const line = record.lines.find((item) => item.id === lineId);
  if (!line) throw AppError.notFound(`Line ${lineId} is not on order ${record.order.id}.`);
  return line;
}

function unclaimedOf(record: OrderRecord, lineId: number): number {
  return roundQuantity(
    record.cost.lines.find((item) => item.lineId === lineId)?.unclaimedQuantity ?? 0,
  );
}

/** 400 unless `quantity` is whole packs, or whole steps of a splittable line. */
function checkStep(line: OrderLineRow, quantity: number): void {
  const step = claimStep(line);
  if (isWholeSteps(quantity, step)) return;
  const message = line.splittable
    ? `must be in steps of ${formatQuantity(step, line.packUnit)}`
    : `must be whole packs of ${formatQuantity(line.packSize, line.packUnit)} (this pack cannot be split)`;
  throw AppError.validation(`The quantity ${message}.`, { quantity: message });
}

/** 409 when `extra` is more than what remains of the line, saying what remains. */
function checkRemaining(record: OrderRecord, line: OrderLineRow, extra: number): void {
  const remaining = unclaimedOf(record, line.id);
  if (extra <= remaining + 1e-9) return;
  const message =
    remaining <= 0
      ? 'Nothing of this line remains unclaimed.'
      : `Only ${formatQuantity(remaining, line.packUnit)} of this line remains unclaimed; you asked for ${formatQuantity(extra, line.packUnit)} more.`;
  throw AppError.conflict(message, { quantity: message });
}

/** Claims `quantity` of a line for `actor`; a second claim on the same line adds to the first. */
export async function claimShare(
  repos: Repositories,
  orderId: number,
  input: { lineId: number; quantity: number },
  actor: User,
): Promise<number> {
  const record = await loadOrder(repos, orderId);
  requireClaimsOpen(record);
  const line = lineOf(record, input.lineId);
  const quantity = roundQuantity(input.quantity);
  checkStep(line, quantity);
  checkRemaining(record, line, quantity);
  const now = nowIso();
  const existing = record.shares.find(
    (share) => share.lineId === line.id && share.userId === actor.id && !share.forLab,
  );
  if (existing) {
    await repos.orders.updateShare(existing.id, {
      quantity: roundQuantity(existing.quantity + quantity),
      updatedAt: now,
    });
    return existing.id;
  }
  return repos.orders.insertShare({
    orderId,
    lineId: line.id,
    userId: actor.id,
    forLab: false,
    quantity,
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

/** The share, when `actor` may change it: their own, or the lab's for a coordinator. */
function ownShare(record: OrderRecord, shareId: number, actor: User): OrderShareRow {
  const share = record.shares.find((item) => item.id === shareId);
  if (!share) throw AppError.notFound(`Share ${shareId} is not on order ${record.order.id}.`);
  const mine = share.userId !== null && share.userId === actor.id;
  if (!mine && !(share.forLab && can(actor.role, 'orders.manage'))) {
    throw AppError.forbidden('You can change only your own claim.');
  }
  return share;
}

/** Sets a claim's quantity while claims are open. */
export async function changeShare(
  repos: Repositories,
  orderId: number,
  shareId: number,
  quantity: number,
  actor: User,
): Promise<void> {
  const record = await loadOrder(repos, orderId);
  const share = ownShare(record, shareId, actor);
  requireClaimsOpen(record);
  const line = lineOf(record, share.lineId);
  const wanted = roundQuantity(quantity);
  checkStep(line, wanted);
  checkRemaining(record, line, roundQuantity(wanted - share.quantity));
  await repos.orders.updateShare(share.id, { quantity: wanted, updatedAt: nowIso() });
}

/** Withdraws a claim while claims are open. */
export async function withdrawShare(
  repos: Repositories,
  orderId: number,
  shareId: number,
  actor: User,
): Promise<void> {
  const record = await loadOrder(repos, orderId);
  const share = ownShare(record, shareId, actor);
  requireClaimsOpen(record);
  await repos.orders.deleteShare(share.id);
}

/**
 * The coordinator takes every unclaimed rest as the lab's own share (one per line, added to
 * the lab's share already there). Answers what was taken per line.
 */
export async function takeLabRemainder(
  repos: Repositories,
  record: OrderRecord,
): Promise<{ lineId: number; quantity: number }[]> {
  requireClaimsOpen(record);
  const now = nowIso();
  const taken: { lineId: number; quantity: number }[] = [];
  for (const line of record.lines) {
    const rest = unclaimedOf(record, line.id);
    if (rest <= 0) continue;
    const lab = record.shares.find((share) => share.lineId === line.id && share.forLab);
    if (lab) {
      await repos.orders.updateShare(lab.id, {
        quantity: roundQuantity(lab.quantity + rest),
        updatedAt: now,
      });
    } else {
      await repos.orders.insertShare({
        orderId: record.order.id,
        lineId: line.id,
        userId: null,
        forLab: true,
        quantity: rest,
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
    taken.push({ lineId: line.id, quantity: rest });
  }
  if (taken.length === 0) throw AppError.conflict('Nothing on this order is unclaimed.');
  return taken;
}
