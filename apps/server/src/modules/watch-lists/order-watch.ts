import type { OrderWatch, User, WatchedOrderChemical } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { listNames, watchListingsFor } from './watch-matching';

/** What the watch rules read of an order: its id and its lines' chemicals. */
export interface OrderForWatch {
  order: { id: number };
  lines: readonly { chemicalId: number }[];
}

/**
 * The chemicals on an order's lines that need a manager's approval: on a chosen watch list at
 * their concentration, or marked restricted on the chemical.
 */
export async function watchedOnOrder(
  repos: Repositories,
  record: OrderForWatch,
): Promise<WatchedOrderChemical[]> {
  const chemicals = await repos.watchLists.chemicalsFor({
    ids: record.lines.map((line) => line.chemicalId),
  });
  const listings = await watchListingsFor(repos, chemicals);
  return chemicals
    .map((chemical) => ({
      chemicalId: chemical.id,
      name: chemical.name,
      casNumber: chemical.casNumber,
      restricted: chemical.restricted,
      listings: listings.get(chemical.id) ?? [],
    }))
    .filter((chemical) => chemical.restricted || chemical.listings.length > 0);
}

/** The order page's view: watched chemicals, the approval (who, when, why) and whether it is due. */
export async function orderWatchOf(
  repos: Repositories,
  record: OrderForWatch,
): Promise<OrderWatch> {
  const chemicals = await watchedOnOrder(repos, record);
  const approval = await repos.watchLists.approvalOf(record.order.id);
  const names = await repos.watchLists.userNames(
    approval?.approvedById ? [approval.approvedById] : [],
  );
  const covered = new Set(approval?.chemicalIds ?? []);
  return {
    chemicals,
    approval: approval
      ? {
          approvedAt: approval.approvedAt,
          approvedById: approval.approvedById,
          approvedByName: approval.approvedById
            ? (names.get(approval.approvedById) ?? 'a former user')
            : 'a former user',
          reason: approval.reason,
          chemicalIds: approval.chemicalIds,
        }
      : null,
    approvalNeeded: chemicals.some((chemical) => !covered.has(chemical.chemicalId)),
  };
}

function whyWatched(chemical: WatchedOrderChemical): string {
  const lists = listNames(chemical.listings);
  if (lists && chemical.restricted) return `${chemical.name} (on ${lists}; marked restricted)`;
  if (lists) return `${chemical.name} (on ${lists})`;
  return `${chemical.name} (marked restricted)`;
}

/** Refuses to open an order whose watched chemicals are not all covered by an approval. */
export async function requireWatchApproval(repos: Repositories, record: OrderForWatch) {
  const watch = await orderWatchOf(repos, record);
  if (!watch.approvalNeeded) return;
  const covered = new Set(watch.approval?.chemicalIds ?? []);
  const pending = watch.chemicals.filter((chemical) => !covered.has(chemical.chemicalId));
  throw AppError.conflict(
    `This order cannot open before a manager approves it with a recorded reason: ${pending.map(whyWatched).join(', ')}.`,
  );
}

/** Records a manager's approval of the order's watched chemicals as they stand now. */
export async function approveOrderWatch(
  repos: Repositories,
  record: OrderForWatch,
  reason: string,
  actor: User,
): Promise<WatchedOrderChemical[]> {
  const chemicals = await watchedOnOrder(repos, record);
  if (chemicals.length === 0) {
    throw AppError.conflict(
      'No chemical on this order is watched or restricted: nothing to approve.',
    );
  }
  await repos.watchLists.saveApproval({
    orderId: record.order.id,
    approvedById: actor.id,
    reason,
    chemicalIds: chemicals.map((chemical) => chemical.chemicalId),
    approvedAt: nowIso(),
  });
  return chemicals;
}

/**
 * After the lines changed: an approval that does not cover a watched chemical now on the lines
 * is cleared (the next approval must name it). Answers the chemicals it did not cover.
 */
export async function clearStaleWatchApproval(
  repos: Repositories,
  record: OrderForWatch,
): Promise<WatchedOrderChemical[]> {
  const approval = await repos.watchLists.approvalOf(record.order.id);
  if (!approval) return [];
  const covered = new Set(approval.chemicalIds);
  const uncovered = (await watchedOnOrder(repos, record)).filter(
    (chemical) => !covered.has(chemical.chemicalId),
  );
  if (uncovered.length > 0) await repos.watchLists.clearApproval(record.order.id);
  return uncovered;
}
