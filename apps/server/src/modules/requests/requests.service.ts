import { ChemError } from '@lotwise/chem';
import {
  can,
  todayIso,
  type MemberRequest,
  type Page,
  type RequestCreateParsed,
  type RequestFold,
  type RequestListQuery,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { roundToStored } from '../../db/quantities';
import { AppError } from '../../lib/app-error';
import { requireChemicalIn } from '../reorder/purchasing-chemical';
import type { OrderLineRow } from '../orders/order-line.entity';
import { addToDraftOrder } from '../reorder/draft-order';
import { choosePacksFrom, convertAmount } from '../reorder/offers';
import type { OfferRow, PurchasingChemicalRow } from '../reorder/reorder.repository';

const notFound = (id: number) => AppError.notFound(`There is no request #${id}.`);

/** Orders a request can still be folded into: claims not yet closed. */
const foldableStatuses = new Set(['draft', 'open']);

/** A request's quantity as a share of a line: in the line's pack unit, whole packs unless splittable. */
function shareQuantity(
  quantity: number,
  chemical: PurchasingChemicalRow,
  line: Pick<OrderLineRow, 'packSize' | 'packUnit' | 'splittable'>,
): number | null {
  const amount = convertAmount(quantity, chemical.stockUnit, line.packUnit, chemical);
  if (amount === null) return null;
  if (line.splittable) return roundToStored(amount);
  return Math.ceil(amount / line.packSize - 1e-9) * line.packSize;
}

/** The best single catalogue item (one line, so one share) of the offers for a quantity. */
function bestItem(
  offers: readonly OfferRow[],
  quantity: number,
  chemical: PurchasingChemicalRow,
): { item: OfferRow; packs: number } | null {
  if (offers.length === 0) return null;
  const choice = choosePacksFrom(offers, quantity, chemical.stockUnit, chemical, {
    maxPackKinds: 1,
  });
  const pack = choice.chosen?.packs[0];
  const item = pack && offers.find((offer) => offer.catalogItemId === Number(pack.packId));
  return pack && item ? { item, packs: pack.count } : null;
}

/** Member requests: ask, see, withdraw; a coordinator folds one into an order as a claim. */
export function requestsService(store: Store, config: Pick<Config, 'currency'>) {
  const mayManage = (actor: User) => can(actor.role, 'orders.manage');

  async function visible(repos: Repositories, id: number, actor: User) {
    const request = await repos.requests.findRow(id);
    // Another member's request does not exist for you.
    if (!request || (!mayManage(actor) && request.userId !== actor.id)) throw notFound(id);
    return request;
  }

  async function present(repos: Repositories, id: number): Promise<MemberRequest> {
    const view = await repos.requests.findView(id);
    if (!view) throw notFound(id);
    return view;
  }

  /** The line the share goes on (added or topped up as needed) and the share's quantity. */
  async function lineFor(
    repos: Repositories,
    orderId: number,
    chemical: PurchasingChemicalRow,
    quantity: number,
    offers: readonly OfferRow[],
    actor: User,
  ): Promise<{ lineId: number; shareQuantity: number } | null> {
    const lines = (await repos.orders.linesOf(orderId)).filter(
      (line) => line.chemicalId === chemical.id,
    );
    const shares = await repos.orders.sharesOf(orderId);
    const claimed = (lineId: number) =>
      shares.filter((share) => share.lineId === lineId).reduce((sum, s) => sum + s.quantity, 0);
    // A line with room enough first; else the first line of the chemical, topped up with packs.
    for (const line of lines) {
      const wanted = shareQuantity(quantity, chemical, line);
      if (wanted === null) continue;
      if (line.packs * line.packSize - claimed(line.id) >= wanted - 1e-9) {
        return { lineId: line.id, shareQuantity: wanted };
      }
    }
    for (const line of lines) {
      const wanted = shareQuantity(quantity, chemical, line);
      if (wanted === null) continue;
      const room = line.packs * line.packSize - claimed(line.id);
      const extra = Math.ceil((wanted - room) / line.packSize - 1e-9);
      await repos.orders.updateLine(line.id, { packs: line.packs + extra, updatedAt: nowIso() });
      return { lineId: line.id, shareQuantity: wanted };
    }
    const best = bestItem(offers, quantity, chemical);
    if (!best) return null;
    const drafted = await addToDraftOrder(repos, {
      supplierId: best.item.supplierId,
      supplierName: best.item.supplierName,
      lines: [best],
      coordinatorId: actor.id,
      currency: config.currency,
      orderId,
    });
    const lineId = drafted.lineIds.get(best.item.catalogItemId);
    const wanted = shareQuantity(quantity, chemical, best.item);
    return lineId === undefined || wanted === null ? null : { lineId, shareQuantity: wanted };
  }

  return {
    async create(input: RequestCreateParsed, actor: User): Promise<MemberRequest> {
      return store.transaction(async (repos) => {
        const chemical = await requireChemicalIn(repos, input.chemicalId, input.unit);
        if (input.neededBy !== null && input.neededBy < todayIso()) {
          throw AppError.validation('The date needed has passed.', {
            neededBy: 'must be today or later',
          });
        }
        const now = nowIso();
        const id = await repos.requests.insert({
          userId: actor.id,
          chemicalId: chemical.id,
          quantity: input.quantity,
          unit: input.unit,
          neededBy: input.neededBy,
          note: input.note,
          status: 'open',
          orderId: null,
          shareId: null,
          createdAt: now,
          updatedAt: now,
        });
        return present(repos, id);
      });
    },

    async list(query: RequestListQuery, actor: User): Promise<Page<MemberRequest>> {
      const own = query.mine === true || !mayManage(actor);
      const { items, total } = await store.transaction((repos) =>
        repos.requests.list(query, own ? actor.id : null),
      );
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async get(id: number, actor: User): Promise<MemberRequest> {
      return store.transaction(async (repos) => {
        await visible(repos, id, actor);
        return present(repos, id);
      });
    },

    /** The requester (or a coordinator) takes back an open request. */
    async withdraw(id: number, actor: User): Promise<MemberRequest> {
      return store.transaction(async (repos) => {
        const request = await visible(repos, id, actor);
        if (request.status !== 'open') {
          throw AppError.conflict(
            `Request #${id} is ${request.status}; only an open one can be withdrawn.`,
          );
        }
        await repos.requests.update(id, { status: 'withdrawn', updatedAt: nowIso() });
        return present(repos, id);
      });
    },

    /**
     * Folds an open request into an order as the member's claim: a share on a line of the
     * chemical (a line with room, or one topped up with packs, or a new line of the best
     * single catalogue item), all in one transaction.
     */
    async fold(id: number, input: RequestFold, actor: User): Promise<MemberRequest> {
      return store.transaction(async (repos) => {
        const request = await repos.requests.findRow(id);
        if (!request) throw notFound(id);
        if (request.status !== 'open') {
          throw AppError.conflict(
            `Request #${id} is ${request.status}; only an open one can be folded.`,
          );
        }
        const chemical = await repos.reorder.chemical(request.chemicalId);
        if (!chemical) throw notFound(id);
        let offers = await repos.reorder.offers([chemical.id]);
        if (input.supplierId !== undefined) {
          offers = offers.filter((offer) => offer.supplierId === input.supplierId);
        }
        let orderId = input.orderId ?? null;
        if (orderId !== null) {
          const order = await repos.orders.findOrder(orderId);
          if (!order) {
            throw AppError.validation(`There is no order #${orderId}.`, {
              orderId: `no order #${orderId}`,
            });
          }
          if (!foldableStatuses.has(order.status) || order.claimsClosedAt !== null) {
            throw AppError.conflict(
              `Order #${orderId} is ${order.status} with claims closed; fold the request into a draft or open order.`,
            );
          }
          offers = offers.filter((offer) => offer.supplierId === order.supplierId);
        } else {
          let best;
          try {
            best = bestItem(offers, request.quantity, chemical);
          } catch (error) {
            if (error instanceof ChemError) throw AppError.validation(error.message);
            throw error;
          }
          if (!best) {
            throw AppError.conflict(
              `No catalogue pack of ${chemical.name} covers ${request.quantity} ${request.unit}; add it to a supplier's catalogue first.`,
            );
          }
          orderId = (
            await addToDraftOrder(repos, {
              supplierId: best.item.supplierId,
              supplierName: best.item.supplierName,
              lines: [],
              coordinatorId: actor.id,
              currency: config.currency,
            })
          ).orderId;
        }
        const placed = await lineFor(repos, orderId, chemical, request.quantity, offers, actor);
        if (!placed) {
          throw AppError.conflict(
            `Order #${orderId} has no line of ${chemical.name}, and its supplier sells no pack of it that can be counted in ${chemical.stockUnit}.`,
          );
        }
        const now = nowIso();
        const shareId = await repos.orders.insertShare({
          orderId,
          lineId: placed.lineId,
          userId: request.userId,
          forLab: false,
          quantity: placed.shareQuantity,
          amountMinor: null,
          paymentStatus: 'unpaid',
          paidMinor: 0,
          refundedMinor: 0,
          requestId: request.id,
          containerId: null,
          createdAt: now,
          updatedAt: now,
        });
        await repos.requests.update(id, { status: 'folded', orderId, shareId, updatedAt: now });
        return present(repos, id);
      });
    },
  };
}

export type RequestsService = ReturnType<typeof requestsService>;
