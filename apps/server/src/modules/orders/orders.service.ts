import {
  can,
  cancellableOrderStatuses,
  formatQuantity,
  todayIso,
  type OrderCancel,
  type OrderCreate,
  type OrderDetail,
  type OrderLineInput,
  type OrderListQuery,
  type OrderMarkOrdered,
  type OrderPatch,
  type OrderSummary,
  type Page,
  type ShareClaim,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import {
  changeShare,
  claimShare,
  loadOrder,
  requireClaimsOpen,
  takeLabRemainder,
  withdrawShare,
} from './order-claims';
import { addOrderLines, auditOrder, draftOrderFromLines } from './order-drafts';
import { claimsOpen, fundIfAllPaid, mayMove } from './order-lifecycle';
import {
  mailClaimsClosed,
  mailOrderCancelled,
  mailOrderOpened,
  type OrderNotifier,
} from './order-mail';
import {
  invoicedStatuses,
  namesFor,
  presentDetail,
  presentSummary,
  roundQuantity,
} from './order-views';
import type { OrderRecord } from './orders.repository';
import {
  approveOrderWatch,
  clearStaleWatchApproval,
  orderWatchOf,
  requireWatchApproval,
} from '../watch-lists/order-watch';

/**
 * What happens to money when an order is cancelled: every paid share is refunded through the
 * payment provider and recorded, and the refund e-mails go out. Called after the cancellation
 * has committed (the order takes no more payments from then on).
 */
export interface OrderCancellation {
  refundPaidShares(orderId: number, actor: User): Promise<unknown>;
}

export interface OrdersServiceOptions {
  alerts: OrderNotifier;
  /** Without it, an order with paid shares cannot be cancelled (nothing could refund them). */
  cancellation?: OrderCancellation;
}

function hasPaidMoney(record: OrderRecord): boolean {
  return record.shares.some((share) => share.paidMinor > share.refundedMinor);
}

export function ordersService(store: Store, config: Config, options: OrdersServiceOptions) {
  const { alerts } = options;

  async function detail(repos: Repositories, id: number, actor: User): Promise<OrderDetail> {
    const record = await loadOrder(repos, id);
    if (record.order.status === 'draft' && !can(actor.role, 'orders.manage')) {
      throw AppError.notFound(`Order ${id} does not exist.`);
    }
    return {
      ...presentDetail(record, await namesFor(repos, [record]), actor),
      watch: await orderWatchOf(repos, record),
    };
  }

  /** Runs a coordinator's change in one transaction and answers the order as it now stands. */
  async function change(
    id: number,
    actor: User,
    work: (repos: Repositories, record: OrderRecord) => Promise<void>,
  ): Promise<OrderDetail> {
    await store.transaction(async (repos) => work(repos, await loadOrder(repos, id)));
    return detail(store.repos, id, actor);
  }

  function requireEditable(record: OrderRecord): void {
    if (record.order.status !== 'draft' && !claimsOpen(record.order)) {
      throw AppError.conflict(
        'Lines and fees can change only while the order is a draft or its claims are open.',
      );
    }
  }

  return {
    async list(query: OrderListQuery, actor: User): Promise<Page<OrderSummary>> {
      const includeDrafts = can(actor.role, 'orders.manage');
      const { ids, total } = await store.repos.orders.list(query, { includeDrafts });
      const records: OrderRecord[] = [];
      for (const id of ids) {
        const record = await store.repos.orders.load(id);
        if (record) records.push(record);
      }
      const names = await namesFor(store.repos, records);
      return {
        items: records.map((record) => presentSummary(record, names, actor)),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    get(id: number, actor: User): Promise<OrderDetail> {
      return detail(store.repos, id, actor);
    },

    async create(body: OrderCreate, actor: User): Promise<OrderDetail> {
      const id = await store.transaction((repos) =>
        draftOrderFromLines(repos, {
          supplierId: body.supplierId,
          lines: body.lines ?? [],
          actor,
          title: body.title,
          feeRule: body.feeRule,
          claimDeadline: body.claimDeadline ?? null,
          notes: body.notes,
          currency: config.currency,
        }),
      );
      return detail(store.repos, id, actor);
    },

    update(id: number, patch: OrderPatch, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        const money =
          patch.feeRule !== undefined ||
          patch.shippingFeeMinor !== undefined ||
          patch.hazardousFeeMinor !== undefined;
        if (money) requireEditable(record);
        if (['received', 'closed', 'cancelled'].includes(record.order.status)) {
          throw AppError.conflict(`A ${record.order.status} order cannot be changed.`);
        }
        await repos.orders.updateOrder(id, { ...patch, updatedAt: nowIso() });
        await auditOrder(repos, actor.id, 'order.updated', id, { changes: patch });
      });
    },

    addLine(id: number, input: OrderLineInput, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        requireEditable(record);
        const [lineId] = await addOrderLines(repos, record.order, [input]);
        await auditOrder(repos, actor.id, 'order.line_added', id, { lineId, ...input });
        const uncovered = await clearStaleWatchApproval(repos, await loadOrder(repos, id));
        if (uncovered.length > 0) {
          await auditOrder(repos, actor.id, 'order.watch_approval_cleared', id, {
            chemicals: uncovered.map((chemical) => chemical.name),
          });
        }
      });
    },

    /** A manager approves the watched and restricted chemicals on the lines, with a reason. */
    approveWatch(id: number, reason: string, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        if (['closed', 'cancelled'].includes(record.order.status)) {
          throw AppError.conflict(`A ${record.order.status} order needs no approval.`);
        }
        const chemicals = await approveOrderWatch(repos, record, reason, actor);
        await auditOrder(repos, actor.id, 'order.watch_approved', id, {
          reason,
          chemicals: chemicals.map((chemical) => chemical.name),
        });
      });
    },

    changeLine(id: number, lineId: number, packs: number, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        requireEditable(record);
        const line = record.lines.find((item) => item.id === lineId);
        if (!line) throw AppError.notFound(`Line ${lineId} is not on order ${id}.`);
        const claimed = record.shares
          .filter((share) => share.lineId === lineId)
          .reduce((sum, share) => sum + share.quantity, 0);
        if (roundQuantity(packs * line.packSize) < roundQuantity(claimed)) {
          const needed = Math.ceil(roundQuantity(claimed / line.packSize));
          throw AppError.conflict(
            `${formatQuantity(claimed, line.packUnit)} of this line is claimed: it needs at least ${needed} pack${needed === 1 ? '' : 's'}.`,
            { packs: `at least ${needed}` },
          );
        }
        await repos.orders.updateLine(lineId, { packs, updatedAt: nowIso() });
        await auditOrder(repos, actor.id, 'order.line_changed', id, {
          lineId,
          from: line.packs,
          to: packs,
        });
      });
    },

    removeLine(id: number, lineId: number, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        requireEditable(record);
        const line = record.lines.find((item) => item.id === lineId);
        if (!line) throw AppError.notFound(`Line ${lineId} is not on order ${id}.`);
        if (record.shares.some((share) => share.lineId === lineId)) {
          throw AppError.conflict(
            'Members have claimed part of this line: they withdraw their claims first.',
          );
        }
        await repos.orders.deleteLine(lineId);
        await auditOrder(repos, actor.id, 'order.line_removed', id, { lineId, sku: line.sku });
      });
    },

    /** Draft -> open: members are told and may claim until the deadline. */
    open(id: number, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        const { order } = record;
        if (!mayMove(order.status, 'open') || order.status !== 'draft') {
          throw AppError.conflict(`Only a draft can be opened; this order is ${order.status}.`);
        }
        if (record.lines.length === 0) {
          throw AppError.conflict('Add at least one line before opening the order.');
        }
        if (!order.claimDeadline) {
          throw AppError.validation('Set a claim deadline before opening the order.', {
            claimDeadline: 'required to open the order',
          });
        }
        if (order.claimDeadline < todayIso()) {
          throw AppError.validation('The claim deadline has passed: choose a later date.', {
            claimDeadline: 'must be today or later',
          });
        }
        await requireWatchApproval(repos, record);
        const now = nowIso();
        await repos.orders.updateOrder(id, { status: 'open', openedAt: now, updatedAt: now });
        await auditOrder(repos, actor.id, 'order.opened', id, {
          claimDeadline: order.claimDeadline,
        });
        const opened = await loadOrder(repos, id);
        await mailOrderOpened(alerts, repos, opened, await namesFor(repos, [opened]), config.text);
      });
    },

    takeLabRemainder(id: number, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        const taken = await takeLabRemainder(repos, record);
        await auditOrder(repos, actor.id, 'order.lab_remainder_taken', id, { lines: taken });
      });
    },

    /**
     * Fixes every share's amount from the order's pricing, in one transaction, so the shares
     * add up exactly to the total; refused while any rest is unclaimed.
     */
    closeClaims(id: number, actor: User, now = new Date()): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        requireClaimsOpen(record);
        if (record.shares.length === 0) {
          throw AppError.conflict('Nobody has claimed anything yet: there is nothing to close.');
        }
        const { chemicals } = await namesFor(repos, [record]);
        const rests = record.lines.flatMap((line) => {
          const rest = record.cost.lines.find((item) => item.lineId === line.id);
          const name = chemicals.get(line.chemicalId)?.name ?? 'a line';
          return rest && rest.unclaimedQuantity > 0
            ? [
                `${formatQuantity(roundQuantity(rest.unclaimedQuantity), line.packUnit)} of ${name} (${line.sku})`,
              ]
            : [];
        });
        if (rests.length > 0) {
          throw AppError.conflict(
            `Claims cannot close while part of the order is unclaimed (${rests.join('; ')}). Take the rest for the lab, or reduce the packs.`,
          );
        }
        const stamp = now.toISOString();
        for (const cost of record.cost.shares) {
          await repos.orders.updateShare(cost.shareId, {
            amountMinor: cost.amountMinor,
            // A share that costs nothing has nothing to pay.
            ...(cost.amountMinor === 0 ? { paymentStatus: 'paid' as const } : {}),
            updatedAt: stamp,
          });
        }
        const fixed = record.cost.shares.reduce((sum, cost) => sum + cost.amountMinor, 0);
        if (fixed !== record.cost.totalMinor) {
          throw new Error(
            `Order ${id}: shares add up to ${fixed}, the total is ${record.cost.totalMinor}`,
          );
        }
        await repos.orders.updateOrder(id, { claimsClosedAt: stamp, updatedAt: stamp });
        await auditOrder(repos, actor.id, 'order.claims_closed', id, {
          totalMinor: record.cost.totalMinor,
          shares: record.cost.shares.map(({ shareId, amountMinor }) => ({ shareId, amountMinor })),
        });
        await fundIfAllPaid(repos, id, stamp);
        const closed = await loadOrder(repos, id);
        await mailClaimsClosed(
          alerts,
          repos,
          closed,
          await namesFor(repos, [closed]),
          config.text,
          now,
        );
      });
    },

    markOrdered(id: number, body: OrderMarkOrdered, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        if (record.order.status !== 'funded' || !mayMove(record.order.status, 'ordered')) {
          throw AppError.conflict(
            `Only a funded order can be marked ordered; this one is ${record.order.status}.`,
          );
        }
        const now = nowIso();
        await repos.orders.updateOrder(id, {
          status: 'ordered',
          orderedAt: now,
          supplierReference: body.supplierReference,
          ...(body.supplierInvoiceMinor != null
            ? { supplierInvoiceMinor: body.supplierInvoiceMinor }
            : {}),
          updatedAt: now,
        });
        await auditOrder(repos, actor.id, 'order.ordered', id, {
          supplierReference: body.supplierReference,
          supplierInvoiceMinor: body.supplierInvoiceMinor ?? null,
        });
      });
    },

    recordInvoice(id: number, supplierInvoiceMinor: number, actor: User): Promise<OrderDetail> {
      return change(id, actor, async (repos, record) => {
        if (!invoicedStatuses.includes(record.order.status)) {
          throw AppError.conflict(
            `The supplier's invoice is recorded once the order is ordered; this one is ${record.order.status}.`,
          );
        }
        await repos.orders.updateOrder(id, { supplierInvoiceMinor, updatedAt: nowIso() });
        await auditOrder(repos, actor.id, 'order.invoice_recorded', id, {
          from: record.order.supplierInvoiceMinor,
          to: supplierInvoiceMinor,
        });
      });
    },

    /** Cancels the order, tells its members, then has every paid share refunded. */
    async cancel(id: number, body: OrderCancel, actor: User): Promise<OrderDetail> {
      let refund = false;
      await store.transaction(async (repos) => {
        const record = await loadOrder(repos, id);
        const { order } = record;
        if (
          !cancellableOrderStatuses.includes(order.status) ||
          !mayMove(order.status, 'cancelled')
        ) {
          throw AppError.conflict(`A ${order.status} order cannot be cancelled.`);
        }
        refund = hasPaidMoney(record);
        if (refund && !options.cancellation) {
          throw AppError.conflict(
            'Members have paid for this order and refunds are not available on this server: nothing was cancelled.',
          );
        }
        const now = nowIso();
        await repos.orders.updateOrder(id, {
          status: 'cancelled',
          cancelledAt: now,
          cancelReason: body.reason,
          updatedAt: now,
        });
        await auditOrder(repos, actor.id, 'order.cancelled', id, {
          from: order.status,
          reason: body.reason,
          refund,
        });
        await mailOrderCancelled(alerts, repos, record, body.reason);
      });
      if (refund) await options.cancellation!.refundPaidShares(id, actor);
      return detail(store.repos, id, actor);
    },

    async claim(id: number, body: ShareClaim, actor: User): Promise<OrderDetail> {
      await store.transaction((repos) => claimShare(repos, id, body, actor));
      return detail(store.repos, id, actor);
    },

    async changeShare(
      id: number,
      shareId: number,
      quantity: number,
      actor: User,
    ): Promise<OrderDetail> {
      await store.transaction((repos) => changeShare(repos, id, shareId, quantity, actor));
      return detail(store.repos, id, actor);
    },

    async withdrawShare(id: number, shareId: number, actor: User): Promise<OrderDetail> {
      await store.transaction((repos) => withdrawShare(repos, id, shareId, actor));
      return detail(store.repos, id, actor);
    },
  };
}
export type OrdersService = ReturnType<typeof ordersService>;
