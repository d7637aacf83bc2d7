import { addDays } from '@lotwise/chem';
import { formatDate, formatMoney, formatQuantity, safetyDeferral, todayIso } from '@lotwise/shared';
import type { TextConfig } from '../../config';
import type { Repositories } from '../../db/store';
import type { AlertsService } from '../alerts/alerts.service';
import type { OrderNames } from './order-views';
import type { OrderRecord } from './orders.repository';

/**
 * Members are asked to pay within this many days of claims closing: long enough to reach
 * everyone over a weekend, short enough for the supplier's quote to hold.
 * // common practice, no source
 */
export const paymentWindowDays = 7;

export type OrderNotifier = Pick<AlertsService, 'notify'>;

function lineList(record: OrderRecord, names: OrderNames, text: TextConfig): string {
  return record.lines
    .map((line) => {
      const name = names.chemicals.get(line.chemicalId)?.name ?? line.sku;
      const pack = formatQuantity(line.packSize, line.packUnit);
      const price = formatMoney(line.unitPriceMinor, record.order.currency, text.locale);
      return `- ${line.packs} × ${pack} ${name} (${line.sku}), ${price} per pack${line.splittable ? ', may be split' : ''}`;
    })
    .join('\n');
}

/** To every member: the order is open for claims until its deadline. */
export async function mailOrderOpened(
  alerts: OrderNotifier,
  repos: Repositories,
  record: OrderRecord,
  names: OrderNames,
  text: TextConfig,
): Promise<void> {
  const { order } = record;
  const supplier = names.suppliers.get(order.supplierId)?.name ?? 'the supplier';
  await alerts.notify(repos, {
    kind: 'order-opened',
    audience: 'members',
    subject: `Shared order open: ${order.title}`,
    text: [
      `A shared order from ${supplier} is open for claims until ${formatDate(order.claimDeadline, { locale: text.locale })}.`,
      '',
      lineList(record, names, text),
      '',
      `Fees (shipping and hazardous goods) are shared ${order.feeRule === 'value' ? 'by the value of each share' : order.feeRule === 'member' ? 'equally per member' : 'by the mass of each share'}.`,
      'Claim what you need in Lotwise; amounts are fixed when claims close.',
      '',
      safetyDeferral,
    ].join('\n'),
    link: `/orders/${order.id}`,
    dedupKey: `order-opened:${order.id}`,
  });
}

/** To each member with a share: claims closed, your amount is X, please pay by a date. */
export async function mailClaimsClosed(
  alerts: OrderNotifier,
  repos: Repositories,
  record: OrderRecord,
  names: OrderNames,
  text: TextConfig,
  now: Date,
): Promise<void> {
  const { order } = record;
  const payBy = formatDate(addDays(todayIso(now), paymentWindowDays), { locale: text.locale });
  const members = [...new Set(record.shares.flatMap((s) => (s.userId ? [s.userId] : [])))];
  for (const userId of members) {
    const mine = record.shares.filter((share) => share.userId === userId);
    const total = mine.reduce((sum, share) => sum + (share.amountMinor ?? 0), 0);
    const items = mine.map((share) => {
      const line = record.lines.find((item) => item.id === share.lineId);
      const name = line ? (names.chemicals.get(line.chemicalId)?.name ?? line.sku) : 'a line';
      const quantity = line ? formatQuantity(share.quantity, line.packUnit) : '';
      return `- ${quantity} ${name}: ${formatMoney(share.amountMinor ?? 0, order.currency, text.locale)}`;
    });
    await alerts.notify(repos, {
      kind: 'order-deadline',
      recipients: [userId],
      subject: `Please pay ${formatMoney(total, order.currency, text.locale)} for ${order.title}`,
      text: [
        `Claims on the shared order "${order.title}" are closed and the amounts are fixed.`,
        '',
        ...items,
        '',
        `Your amount is ${formatMoney(total, order.currency, text.locale)} (goods and your part of the fees). Please pay by ${payBy} in Lotwise, or in cash to the coordinator.`,
      ].join('\n'),
      link: `/orders/${order.id}`,
      dedupKey: `order-claims-closed:${order.id}`,
    });
  }
}

/** To each member with a share: the order is cancelled, and why. Refund mails come separately. */
export async function mailOrderCancelled(
  alerts: OrderNotifier,
  repos: Repositories,
  record: OrderRecord,
  reason: string,
): Promise<void> {
  const { order } = record;
  const members = [...new Set(record.shares.flatMap((s) => (s.userId ? [s.userId] : [])))];
  if (members.length === 0) return;
  const paid = record.shares.some((share) => share.paidMinor > share.refundedMinor);
  await alerts.notify(repos, {
    kind: 'order-cancelled',
    recipients: members,
    subject: `Shared order cancelled: ${order.title}`,
    text: [
      `The shared order "${order.title}" was cancelled.`,
      `Reason: ${reason}`,
      '',
      paid
        ? 'Every amount paid for it is refunded; you get a separate e-mail for each refund.'
        : 'Nothing was charged for it.',
    ].join('\n'),
    link: `/orders/${order.id}`,
    dedupKey: `order-cancelled:${order.id}`,
  });
}
