import { useParams } from 'react-router';
import { Download } from 'lucide-react';
import { sharePaymentStatusLabels, type OrderMoney } from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { buttonClasses } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { formatAmount, formatDateTime } from '../../../lib/format';
import { moneyCsvUrl, useOrderMoney } from '../api';
import { Money, paymentKindLabels } from '../components/money';
import { BackLink } from '../components/back-link';
import { OrderStatusBadge } from '../components/order-status-badge';
import { TableScroll } from '../../../components/ui/table-scroll';

const th = 'px-2.5 py-2';
const num = 'px-2.5 py-2 text-right';

function Figure({
  label,
  minor,
  currency,
  hint,
}: {
  label: string;
  minor: number | null;
  currency: string;
  hint?: string;
}) {
  return (
    <div className="rounded-lg border border-ink-200 bg-white px-3 py-2">
      <dt className="text-xs font-semibold tracking-wide text-ink-600 uppercase">{label}</dt>
      <dd className="text-lg font-semibold text-ink-900">
        <Money minor={minor} currency={currency} />
        {/* inside the value: a definition list's groups hold only terms and values */}
        {hint && <span className="block text-xs font-normal text-ink-600">{hint}</span>}
      </dd>
    </div>
  );
}

function differenceHint(money: OrderMoney): string {
  if (money.invoiceDifferenceMinor === null) return 'Record the supplier’s invoice on the order.';
  if (money.invoiceDifferenceMinor === 0) return 'The invoice matches the order’s total.';
  return money.invoiceDifferenceMinor > 0
    ? 'The supplier billed more than the order’s total.'
    : 'The supplier billed less than the order’s total.';
}

/** `/orders/:id/money`: what an order's members owe, paid and got back, for its coordinator. */
export function OrderMoneyPage() {
  const orderId = Number(useParams().id);
  const query = useOrderMoney(orderId);
  if (query.isPending) return <PageSpinner label="Loading the order’s money…" />;
  if (query.isError) {
    return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  }
  const money = query.data;
  const { currency } = money;
  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.orders}>Orders</BackLink>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">
            Money of order #{money.orderId}: {money.title}
          </h1>
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-600">
            <OrderStatusBadge status={money.status} />
            {money.supplierName}
            {money.supplierReference && ` · reference ${money.supplierReference}`}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <a href={moneyCsvUrl(money.orderId)} download className={buttonClasses('secondary')}>
            <Download aria-hidden="true" className="size-4" />
            This order as CSV
          </a>
          <a href={moneyCsvUrl()} download className={buttonClasses('ghost')}>
            <Download aria-hidden="true" className="size-4" />
            All orders as CSV
          </a>
        </div>
      </header>

      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Figure
          label="Order total"
          minor={money.totalMinor}
          currency={currency}
          hint="Goods and fees"
        />
        <Figure
          label="Collected"
          minor={money.collectedMinor}
          currency={currency}
          hint="Online, cash and lab funds"
        />
        <Figure label="Refunded" minor={money.refundedMinor} currency={currency} />
        <Figure label="Still owed" minor={money.owedMinor} currency={currency} />
        <Figure
          label="Net collected"
          minor={money.netCollectedMinor}
          currency={currency}
          hint="Collected less refunds"
        />
        <Figure label="Supplier’s invoice" minor={money.supplierInvoiceMinor} currency={currency} />
        <Figure
          label="Invoice − total"
          minor={money.invoiceDifferenceMinor}
          currency={currency}
          hint={differenceHint(money)}
        />
        {money.unclaimedMinor > 0 && (
          <Figure
            label="Unclaimed"
            minor={money.unclaimedMinor}
            currency={currency}
            hint="Claims are still open"
          />
        )}
      </dl>

      <section aria-labelledby="money-shares-heading" className="flex flex-col gap-2">
        <h2 id="money-shares-heading" className="text-base font-semibold">
          Shares
        </h2>
        <TableScroll className="rounded-lg border border-ink-200 bg-white">
          <table className="w-full text-sm" aria-label="Shares and their money">
            <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
              <tr>
                <th className={th}>Who</th>
                <th className={th}>Chemical</th>
                <th className={num}>Quantity</th>
                <th className={num}>Goods</th>
                <th className={num}>Fees</th>
                <th className={num}>Amount</th>
                <th className={num}>Collected</th>
                <th className={num}>Refunded</th>
                <th className={num}>Owed</th>
                <th className={th}>Payment</th>
              </tr>
            </thead>
            <tbody>
              {money.shares.map((row) => (
                <tr key={row.shareId} className="border-b border-ink-100 last:border-b-0">
                  <td className={th}>{row.holder}</td>
                  <td className={th}>
                    {row.chemicalName}
                    <span className="block font-mono text-xs text-ink-600">{row.sku}</span>
                    <HazardCodes pictograms={row.ghsPictograms} statements={row.hazardStatements} />
                  </td>
                  <td className={`${num} tabular-nums`}>{formatAmount(row.quantity, row.unit)}</td>
                  <td className={num}>
                    <Money minor={row.goodsMinor} currency={currency} />
                  </td>
                  <td className={num}>
                    <Money minor={row.feesMinor} currency={currency} />
                  </td>
                  <td className={num}>
                    <Money minor={row.amountMinor} currency={currency} />
                  </td>
                  <td className={num}>
                    <Money minor={row.collectedMinor} currency={currency} />
                  </td>
                  <td className={num}>
                    <Money minor={row.refundedMinor} currency={currency} />
                  </td>
                  <td className={num}>
                    <Money
                      minor={row.owedMinor}
                      currency={currency}
                      className={row.owedMinor > 0 ? 'font-semibold text-warn-700' : ''}
                    />
                  </td>
                  <td className={th}>{sharePaymentStatusLabels[row.paymentStatus]}</td>
                </tr>
              ))}
            </tbody>
            <tfoot className="border-t border-ink-200 bg-ink-50 font-semibold">
              <tr>
                <td className={th} colSpan={3}>
                  Totals
                </td>
                <td className={num}>
                  <Money minor={money.goodsMinor} currency={currency} />
                </td>
                <td className={num}>
                  <Money minor={money.feesMinor} currency={currency} />
                </td>
                <td className={num}>
                  <Money minor={money.totalMinor - money.unclaimedMinor} currency={currency} />
                </td>
                <td className={num}>
                  <Money minor={money.collectedMinor} currency={currency} />
                </td>
                <td className={num}>
                  <Money minor={money.refundedMinor} currency={currency} />
                </td>
                <td className={num}>
                  <Money minor={money.owedMinor} currency={currency} />
                </td>
                <td />
              </tr>
            </tfoot>
          </table>
        </TableScroll>
      </section>

      <section aria-labelledby="money-movements-heading" className="flex flex-col gap-2">
        <h2 id="money-movements-heading" className="text-base font-semibold">
          Payments and refunds
        </h2>
        {money.movements.length === 0 ? (
          <p className="text-sm text-ink-600">No money has moved on this order yet.</p>
        ) : (
          <TableScroll className="rounded-lg border border-ink-200 bg-white">
            <table className="w-full text-sm" aria-label="Payments and refunds">
              <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
                <tr>
                  <th className={th}>When</th>
                  <th className={th}>Who</th>
                  <th className={th}>How</th>
                  <th className={th}>Note</th>
                  <th className={num}>Amount</th>
                </tr>
              </thead>
              <tbody>
                {money.movements.map((movement) => (
                  <tr key={movement.id} className="border-b border-ink-100 last:border-b-0">
                    <td className={th}>{formatDateTime(movement.at)}</td>
                    <td className={th}>
                      {money.shares.find((s) => s.shareId === movement.shareId)?.holder ?? '—'}
                    </td>
                    <td className={th}>{paymentKindLabels[movement.kind]}</td>
                    <td className={th}>{movement.note || '—'}</td>
                    <td className={num}>
                      <Money
                        minor={
                          movement.kind === 'refund' ? -movement.amountMinor : movement.amountMinor
                        }
                        currency={currency}
                      />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        )}
      </section>
      <SafetyCaution compact />
    </div>
  );
}

export { OrderMoneyPage as Component };
