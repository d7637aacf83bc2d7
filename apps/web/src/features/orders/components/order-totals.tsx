import type { OrderDetail } from '@lotwise/shared';
import { money } from '../labels';

function Row({
  label,
  minor,
  currency,
  strong,
  hint,
  testId,
}: {
  label: string;
  minor: number;
  currency: string;
  strong?: boolean;
  hint?: string;
  testId: string;
}) {
  return (
    <div className="flex items-baseline justify-between gap-4 py-1">
      <dt className={strong ? 'font-semibold text-ink-900' : 'text-ink-700'}>
        {label}
        {hint && <span className="block text-xs font-normal text-ink-600">{hint}</span>}
      </dt>
      <dd
        data-testid={testId}
        className={`tabular-nums ${strong ? 'font-semibold text-ink-900' : 'text-ink-800'}`}
      >
        {money(minor, currency)}
      </dd>
    </div>
  );
}

/** The order's money as the server worked it out; nothing here is added up in the browser. */
export function OrderTotals({ order }: { order: OrderDetail }) {
  const c = order.currency;
  return (
    <section
      aria-labelledby="order-totals-heading"
      className="rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="order-totals-heading" className="text-base font-semibold text-ink-900">
        Money
      </h2>
      <dl className="mt-1 divide-y divide-ink-100 text-sm">
        <Row label="Goods" minor={order.goodsMinor} currency={c} testId="total-goods" />
        <Row label="Shipping" minor={order.shippingFeeMinor} currency={c} testId="total-shipping" />
        <Row
          label="Hazardous-goods fee"
          minor={order.hazardousFeeMinor}
          currency={c}
          hint={order.hazardousFeeMinor === 0 ? 'no line ships as hazardous goods' : undefined}
          testId="total-hazardous"
        />
        <Row label="Order total" minor={order.totalMinor} currency={c} strong testId="total" />
        <Row
          label="Unclaimed"
          minor={order.unclaimedMinor}
          currency={c}
          hint="part of the total no share pays yet"
          testId="total-unclaimed"
        />
        <Row label="Collected" minor={order.collectedMinor} currency={c} testId="total-collected" />
        {order.refundedMinor > 0 && (
          <Row label="Refunded" minor={order.refundedMinor} currency={c} testId="total-refunded" />
        )}
        <Row
          label="Still owed"
          minor={order.owedMinor}
          currency={c}
          hint={order.claimsOpen ? 'amounts are fixed when claims close' : undefined}
          testId="total-owed"
        />
        {order.supplierInvoiceMinor !== null && (
          <Row
            label="Supplier’s invoice"
            minor={order.supplierInvoiceMinor}
            currency={c}
            testId="total-invoice"
          />
        )}
      </dl>
    </section>
  );
}
