import {
  minorToDecimalText,
  type MoneyShareRow,
  type OrderMoney,
  type PurchaseList,
  type PurchaseSummary,
  type Receipt,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { csvLine, csvLines, utf8Bom, type CsvValue } from '../../lib/csv';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { OrderRecord } from '../orders/orders.repository';
import type { PaymentRow } from '../payments/payment.entity';
import { movementsOf, requireOrder, shareFigures, sumFigures } from './money';

/**
 * The money views of shared orders: a member's purchases and receipts, the coordinator's
 * summary per order and the CSV files for the books. Amounts come from `priceOrder` (goods
 * and fees of each share), the shares' fixed amounts and the payment rows; nothing here
 * works out a price of its own.
 */

/** Every share of an order with its goods, fees and money, and the order's totals. */
async function orderMoney(
  repos: Repositories,
  record: OrderRecord,
  payments: PaymentRow[],
): Promise<OrderMoney> {
  const { order, lines, shares, cost } = record;
  const supplierName =
    (await repos.receiving.supplierNames([order.supplierId])).get(order.supplierId) ??
    `Supplier #${order.supplierId}`;
  const people = await repos.receiving.people(
    shares.flatMap((share) => (share.userId === null ? [] : [share.userId])),
  );
  const chemicals = new Map<
    number,
    Pick<ChemicalRow, 'name' | 'ghsPictograms' | 'hazardStatements'>
  >();
  for (const line of lines) {
    const chemical = await repos.chemicals.findRow(line.chemicalId);
    chemicals.set(line.id, {
      name: chemical?.name ?? `Chemical #${line.chemicalId}`,
      ghsPictograms: chemical?.ghsPictograms ?? [],
      hazardStatements: chemical?.hazardStatements ?? [],
    });
  }
  const rows = shares.map((share): MoneyShareRow => {
    const line = lines.find((l) => l.id === share.lineId)!;
    const priced = cost.shares.find((s) => s.shareId === share.id);
    const figures = shareFigures(order, share, payments);
    const amount = share.amountMinor ?? priced?.amountMinor ?? 0;
    const goodsMinor = priced?.goodsMinor ?? 0;
    return {
      shareId: share.id,
      holder:
        share.userId === null
          ? 'Lab'
          : (people.get(share.userId)?.displayName ?? `Member #${share.userId}`),
      userId: share.userId,
      forLab: share.forLab || share.userId === null,
      sku: line.sku,
      chemicalName: chemicals.get(line.id)!.name,
      ghsPictograms: chemicals.get(line.id)!.ghsPictograms,
      hazardStatements: chemicals.get(line.id)!.hazardStatements,
      quantity: share.quantity,
      unit: line.packUnit,
      // The fixed amount is what the member pays; its fees are what is left after the goods.
      goodsMinor,
      feesMinor: amount - goodsMinor,
      paymentStatus: share.paymentStatus,
      ...figures,
    };
  });
  const totals = sumFigures(rows);
  const { payments: paid, refunds } = movementsOf(payments);
  return {
    orderId: order.id,
    title: order.title,
    status: order.status,
    currency: order.currency,
    supplierName,
    supplierReference: order.supplierReference,
    totalMinor: cost.totalMinor,
    goodsMinor: cost.goodsMinor,
    feesMinor: cost.feesMinor,
    unclaimedMinor: cost.unclaimedMinor,
    collectedMinor: totals.collectedMinor,
    refundedMinor: totals.refundedMinor,
    owedMinor: totals.owedMinor,
    netCollectedMinor: totals.collectedMinor - totals.refundedMinor,
    supplierInvoiceMinor: order.supplierInvoiceMinor,
    invoiceDifferenceMinor:
      order.supplierInvoiceMinor === null ? null : order.supplierInvoiceMinor - cost.totalMinor,
    shares: rows,
    movements: [...paid, ...refunds].sort((a, b) => a.at.localeCompare(b.at) || a.id - b.id),
  };
}

const shareCsvHeader = [
  'order_id',
  'order_title',
  'supplier',
  'order_status',
  'share_id',
  'holder',
  'chemical',
  'sku',
  'quantity',
  'unit',
  'goods',
  'fees',
  'amount',
  'collected',
  'refunded',
  'owed',
  'payment_status',
  'currency',
];

const orderCsvHeader = [
  'order_id',
  'order_title',
  'supplier',
  'supplier_reference',
  'order_status',
  'total',
  'collected',
  'refunded',
  'net_collected',
  'owed',
  'supplier_invoice',
  'invoice_difference',
  'currency',
];

export function purchasesService(store: Store, config: Pick<Config, 'labName'>) {
  const money = (repos: Repositories, record: OrderRecord) =>
    repos.receiving
      .paymentsOf([record.order.id])
      .then((payments) => orderMoney(repos, record, payments));

  return {
    /** The signed-in member's orders with what they owe, paid and got back on each. */
    async mine(actor: User): Promise<PurchaseList> {
      const repos = store.repos;
      const orders = await repos.receiving.ordersOfMember(actor.id);
      const payments = await repos.receiving.paymentsOf(orders.map((o) => o.id));
      const suppliers = await repos.receiving.supplierNames(orders.map((o) => o.supplierId));
      const items: PurchaseSummary[] = [];
      for (const order of orders) {
        const shares = (await repos.orders.sharesOf(order.id)).filter(
          (share) => share.userId === actor.id,
        );
        const figures = sumFigures(shares.map((share) => shareFigures(order, share, payments)));
        items.push({
          orderId: order.id,
          title: order.title,
          supplierName: suppliers.get(order.supplierId) ?? `Supplier #${order.supplierId}`,
          status: order.status,
          currency: order.currency,
          shareCount: shares.length,
          updatedAt: order.updatedAt,
          ...figures,
        });
      }
      const totals = sumFigures(items);
      return {
        currency: orders[0]?.currency ?? '',
        items,
        totals: {
          collectedMinor: totals.collectedMinor,
          refundedMinor: totals.refundedMinor,
          owedMinor: totals.owedMinor,
        },
      };
    },

    /** The member's receipt for one order: 404 when they have no share in it. */
    async receipt(orderId: number, actor: User): Promise<Receipt> {
      const repos = store.repos;
      const record = await requireOrder(repos, orderId);
      const mine = record.shares.filter((share) => share.userId === actor.id);
      if (mine.length === 0) {
        throw AppError.notFound(`You have no share in order #${orderId}.`);
      }
      const summary = await money(repos, record);
      const rows = summary.shares.filter((row) => row.userId === actor.id);
      const myShareIds = new Set(mine.map((share) => share.id));
      const payments = summary.movements.filter((m) => myShareIds.has(m.shareId));
      const labels = new Map<number, string>();
      for (const share of mine) {
        if (share.containerId === null) continue;
        const container = await repos.containers.findRow(share.containerId);
        if (container) labels.set(share.id, container.labelCode);
      }
      const totals = sumFigures(rows);
      const person = (await repos.receiving.people([actor.id])).get(actor.id);
      return {
        labName: config.labName,
        orderId,
        title: record.order.title,
        status: record.order.status,
        currency: record.order.currency,
        supplier: { name: summary.supplierName, reference: record.order.supplierReference },
        member: {
          id: actor.id,
          displayName: person?.displayName ?? actor.displayName,
          email: person?.email ?? actor.email,
        },
        claimsClosedAt: record.order.claimsClosedAt,
        orderedAt: record.order.orderedAt,
        receivedAt: record.order.receivedAt,
        lines: rows.map((row) => ({
          shareId: row.shareId,
          sku: row.sku,
          chemicalName: row.chemicalName,
          ghsPictograms: row.ghsPictograms,
          hazardStatements: row.hazardStatements,
          quantity: row.quantity,
          unit: row.unit,
          goodsMinor: row.goodsMinor,
          feesMinor: row.feesMinor,
          amountMinor: row.goodsMinor + row.feesMinor,
          paymentStatus: row.paymentStatus,
          labelCode: labels.get(row.shareId) ?? null,
        })),
        payments: payments.filter((m) => m.kind !== 'refund'),
        refunds: payments.filter((m) => m.kind === 'refund'),
        totals: {
          ...totals,
          goodsMinor: rows.reduce((sum, row) => sum + row.goodsMinor, 0),
          feesMinor: rows.reduce((sum, row) => sum + row.feesMinor, 0),
          netPaidMinor: totals.collectedMinor - totals.refundedMinor,
        },
        issuedAt: nowIso(),
      };
    },

    /** The coordinator's view of one order's money. */
    async orderMoney(orderId: number): Promise<OrderMoney> {
      return money(store.repos, await requireOrder(store.repos, orderId));
    },

    /** One order's shares as CSV for the books: plain decimals, one currency column. */
    async orderMoneyCsv(orderId: number): Promise<string> {
      const summary = await money(store.repos, await requireOrder(store.repos, orderId));
      const decimal = (minor: number | null) =>
        minor === null ? '' : minorToDecimalText(minor, summary.currency);
      const records: CsvValue[][] = summary.shares.map((row) => [
        summary.orderId,
        summary.title,
        summary.supplierName,
        summary.status,
        row.shareId,
        row.holder,
        row.chemicalName,
        row.sku,
        row.quantity,
        row.unit,
        decimal(row.goodsMinor),
        decimal(row.feesMinor),
        decimal(row.amountMinor),
        decimal(row.collectedMinor),
        decimal(row.refundedMinor),
        decimal(row.owedMinor),
        row.paymentStatus,
        summary.currency,
      ]);
      return utf8Bom + csvLine(shareCsvHeader) + csvLines(records);
    },

    /** Every order past draft, one line each, as CSV for the books. */
    async allMoneyCsv(): Promise<string> {
      const repos = store.repos;
      const records: CsvValue[][] = [];
      for (const order of await repos.receiving.accountableOrders()) {
        const summary = await money(repos, (await repos.orders.load(order.id))!);
        const decimal = (minor: number | null) =>
          minor === null ? '' : minorToDecimalText(minor, summary.currency);
        records.push([
          summary.orderId,
          summary.title,
          summary.supplierName,
          summary.supplierReference,
          summary.status,
          decimal(summary.totalMinor),
          decimal(summary.collectedMinor),
          decimal(summary.refundedMinor),
          decimal(summary.netCollectedMinor),
          decimal(summary.owedMinor),
          decimal(summary.supplierInvoiceMinor),
          decimal(summary.invoiceDifferenceMinor),
          summary.currency,
        ]);
      }
      return utf8Bom + csvLine(orderCsvHeader) + csvLines(records);
    },
  };
}
export type PurchasesService = ReturnType<typeof purchasesService>;
