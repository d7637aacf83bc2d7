import {
  can,
  cancellableOrderStatuses,
  claimStep,
  hazardStatementTexts,
  safetyDeferral,
  type OrderAbilities,
  type OrderDetail,
  type OrderLine,
  type OrderShare,
  type OrderStatus,
  type OrderSummary,
  type User,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { SupplierRow } from '../suppliers/supplier.entity';
import { claimsOpen, paymentsOpen } from './order-lifecycle';
import type { OrderShareRow } from './order-share.entity';
import type { OrderRecord } from './orders.repository';

/** Quantities are kept to the millionth of the pack unit (db/quantities). */
export function roundQuantity(value: number): number {
  return Math.round(value * 1e6) / 1e6;
}

/** The people and things an order names, read once for a page of orders. */
export interface OrderNames {
  suppliers: Map<number, SupplierRow>;
  chemicals: Map<number, ChemicalRow>;
  people: Map<number, string>;
}

export async function namesFor(repos: Repositories, records: OrderRecord[]): Promise<OrderNames> {
  const supplierIds = records.map((record) => record.order.supplierId);
  const chemicalIds = records.flatMap((record) => record.lines.map((line) => line.chemicalId));
  const userIds = records.flatMap((record) => [
    ...(record.order.coordinatorId ? [record.order.coordinatorId] : []),
    ...record.shares.flatMap((share) => (share.userId ? [share.userId] : [])),
  ]);
  const suppliers = await repos.orders.suppliersByIds(supplierIds);
  const chemicals = await repos.orders.chemicalsByIds(chemicalIds);
  const users = await repos.users.findByIds([...new Set(userIds)]);
  return {
    suppliers: new Map(suppliers.map((row) => [row.id, row])),
    chemicals: new Map(chemicals.map((row) => [row.id, row])),
    people: new Map(users.map((row) => [row.id, row.displayName])),
  };
}

/** A share's amount: fixed once claims close, until then the current estimate. */
function shareAmount(record: OrderRecord, share: OrderShareRow): number {
  if (share.amountMinor !== null) return share.amountMinor;
  return record.cost.shares.find((cost) => cost.shareId === share.id)?.amountMinor ?? 0;
}

function owedBy(record: OrderRecord, share: OrderShareRow): number {
  if (share.amountMinor === null || record.order.status === 'cancelled') return 0;
  if (share.paymentStatus === 'paid' || share.paymentStatus === 'refunded') return 0;
  return Math.max(0, share.amountMinor - share.paidMinor);
}

function person(names: OrderNames, id: number | null) {
  return id === null ? null : { id, displayName: names.people.get(id) ?? 'A former member' };
}

export function presentSummary(record: OrderRecord, names: OrderNames, actor: User): OrderSummary {
  const { order, cost } = record;
  const mine = record.shares.filter((share) => share.userId === actor.id);
  return {
    id: order.id,
    title: order.title,
    status: order.status,
    supplier: {
      id: order.supplierId,
      name: names.suppliers.get(order.supplierId)?.name ?? 'Unknown supplier',
    },
    feeRule: order.feeRule,
    claimDeadline: order.claimDeadline,
    claimsClosedAt: order.claimsClosedAt,
    coordinator: person(names, order.coordinatorId),
    lineCount: record.lines.length,
    totalMinor: cost.totalMinor,
    currency: order.currency,
    unclaimedMinor: cost.unclaimedMinor,
    mine: {
      shareCount: mine.length,
      amountMinor: mine.reduce((sum, share) => sum + shareAmount(record, share), 0),
      amountFixed: mine.length > 0 && mine.every((share) => share.amountMinor !== null),
      owedMinor: mine.reduce((sum, share) => sum + owedBy(record, share), 0),
    },
    createdAt: order.createdAt,
    updatedAt: order.updatedAt,
  };
}

/** The supplier's invoice exists once the order went to the supplier. */
export const invoicedStatuses: readonly OrderStatus[] = ['ordered', 'received', 'closed'];

function abilities(record: OrderRecord, actor: User): OrderAbilities {
  const { order } = record;
  const manage = can(actor.role, 'orders.manage');
  const editable = order.status === 'draft' || claimsOpen(order);
  const open = claimsOpen(order);
  return {
    mayClaim: open && can(actor.role, 'orders.join'),
    mayManage: manage,
    mayEditDraft: manage && editable,
    mayEditLines: manage && editable,
    mayOpen: manage && order.status === 'draft' && record.lines.length > 0,
    mayTakeRemainder: manage && open && record.cost.lines.some((l) => l.unclaimedQuantity > 0),
    mayCloseClaims: manage && open,
    mayMarkOrdered: manage && order.status === 'funded',
    mayRecordInvoice: manage && invoicedStatuses.includes(order.status),
    mayCancel: manage && cancellableOrderStatuses.includes(order.status),
  };
}

function presentLine(
  record: OrderRecord,
  line: OrderRecord['lines'][number],
  names: OrderNames,
): OrderLine {
  const chemical = names.chemicals.get(line.chemicalId);
  const cost = record.cost.lines.find((item) => item.lineId === line.id);
  const ordered = roundQuantity(line.packs * line.packSize);
  const unclaimed = roundQuantity(cost?.unclaimedQuantity ?? 0);
  return {
    id: line.id,
    position: line.position,
    catalogItemId: line.catalogItemId,
    sku: line.sku,
    chemical: {
      id: line.chemicalId,
      name: chemical?.name ?? 'Unknown chemical',
      casNumber: chemical?.casNumber ?? null,
      ghsPictograms: chemical?.ghsPictograms ?? [],
      hazardStatements: (chemical?.hazardStatements ?? []).map((code) => ({
        code,
        text: hazardStatementTexts[code] ?? null,
      })),
    },
    packs: line.packs,
    packSize: line.packSize,
    packUnit: line.packUnit,
    unitPriceMinor: line.unitPriceMinor,
    totalMinor: cost?.totalMinor ?? line.packs * line.unitPriceMinor,
    grade: line.grade,
    purityPercent: line.purityPercent,
    hazardous: line.hazardous,
    splittable: line.splittable,
    orderedQuantity: ordered,
    claimedQuantity: roundQuantity(ordered - unclaimed),
    unclaimedQuantity: unclaimed,
    unclaimedMinor: cost?.unclaimedMinor ?? 0,
    claimStep: claimStep(line),
  };
}

function presentShare(
  record: OrderRecord,
  share: OrderShareRow,
  names: OrderNames,
  actor: User,
): OrderShare {
  const line = record.lines.find((item) => item.id === share.lineId);
  const mine = share.userId !== null && share.userId === actor.id;
  const manage = can(actor.role, 'orders.manage');
  const amountMinor = shareAmount(record, share);
  const payable =
    paymentsOpen(record.order) &&
    amountMinor > 0 &&
    (share.paymentStatus === 'unpaid' || share.paymentStatus === 'pending');
  return {
    id: share.id,
    lineId: share.lineId,
    member: share.forLab ? null : person(names, share.userId),
    forLab: share.forLab,
    quantity: roundQuantity(share.quantity),
    unit: line?.packUnit ?? 'g',
    amountMinor,
    amountFixed: share.amountMinor !== null,
    paymentStatus: share.paymentStatus,
    paidMinor: share.paidMinor,
    refundedMinor: share.refundedMinor,
    mine,
    mayEdit: claimsOpen(record.order) && (mine || (share.forLab && manage)),
    mayPay: payable && mine && can(actor.role, 'orders.join'),
    mayRecordPayment: payable && manage,
  };
}

export function presentDetail(record: OrderRecord, names: OrderNames, actor: User): OrderDetail {
  const { order, cost } = record;
  const supplier = names.suppliers.get(order.supplierId);
  return {
    ...presentSummary(record, names, actor),
    supplier: {
      id: order.supplierId,
      name: supplier?.name ?? 'Unknown supplier',
      orderingNotes: supplier?.orderingNotes ?? '',
      minimumOrderMinor: supplier?.minimumOrderMinor ?? 0,
    },
    notes: order.notes,
    supplierReference: order.supplierReference,
    supplierInvoiceMinor: order.supplierInvoiceMinor,
    cancelReason: order.cancelReason,
    openedAt: order.openedAt,
    orderedAt: order.orderedAt,
    receivedAt: order.receivedAt,
    closedAt: order.closedAt,
    cancelledAt: order.cancelledAt,
    claimsOpen: claimsOpen(order),
    paymentsOpen: paymentsOpen(order),
    goodsMinor: cost.goodsMinor,
    shippingFeeMinor: cost.shippingFeeMinor,
    hazardousFeeMinor: cost.hazardousFeeMinor,
    feesMinor: cost.feesMinor,
    collectedMinor: record.shares.reduce((sum, share) => sum + share.paidMinor, 0),
    refundedMinor: record.shares.reduce((sum, share) => sum + share.refundedMinor, 0),
    owedMinor: record.shares.reduce((sum, share) => sum + owedBy(record, share), 0),
    lines: record.lines.map((line) => presentLine(record, line, names)),
    shares: record.shares.map((share) => presentShare(record, share, names, actor)),
    abilities: abilities(record, actor),
    safetyDeferral,
  };
}
