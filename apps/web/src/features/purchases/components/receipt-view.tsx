import { cn } from '../../../lib/cn';
import { orderStatusLabels, type MoneyMovement, type Receipt } from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { formatAmount, formatDate, formatDateTime } from '../../../lib/format';
import { Money, paymentKindLabels } from './money';

function Movements({
  title,
  movements,
  currency,
  empty,
}: {
  title: string;
  movements: MoneyMovement[];
  currency: string;
  empty: string;
}) {
  return (
    <section aria-label={title} className="break-inside-avoid">
      <h2 className="mb-1 text-sm font-semibold text-ink-900">{title}</h2>
      {movements.length === 0 ? (
        <p className="text-sm text-ink-600">{empty}</p>
      ) : (
        <table className="w-full text-sm">
          <thead className="border-b border-ink-300 text-left text-xs text-ink-600">
            <tr>
              <th className="py-1 pr-2 font-semibold">Date</th>
              <th className="py-1 pr-2 font-semibold">How</th>
              <th className="py-1 pr-2 font-semibold">Note</th>
              <th className="py-1 text-right font-semibold">Amount</th>
            </tr>
          </thead>
          <tbody>
            {movements.map((movement) => (
              <tr key={movement.id} className="border-b border-ink-100">
                <td className="py-1 pr-2 whitespace-nowrap">{formatDateTime(movement.at)}</td>
                <td className="py-1 pr-2">{paymentKindLabels[movement.kind]}</td>
                <td className="py-1 pr-2 text-ink-700">{movement.note || '—'}</td>
                <td className="py-1 text-right">
                  <Money minor={movement.amountMinor} currency={currency} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}

function TotalRow({
  label,
  minor,
  currency,
  strong,
  className,
}: {
  label: string;
  minor: number | null;
  currency: string;
  strong?: boolean;
  /** The row's own spacing, e.g. a rule above a total (a `<dl>` holds only its rows). */
  className?: string;
}) {
  return (
    <div className={cn('flex justify-between gap-6', strong && 'font-semibold', className)}>
      <dt>{label}</dt>
      <dd>
        <Money minor={minor} currency={currency} />
      </dd>
    </div>
  );
}

/**
 * A member's receipt for one shared order, laid out to print on one A4 page: who, from whom,
 * what they took (goods and their part of the fees), how and when they paid, refunds, totals.
 */
export function ReceiptView({ receipt }: { receipt: Receipt }) {
  const { currency, totals } = receipt;
  return (
    <article
      aria-label={`Receipt for order #${receipt.orderId}`}
      className="mx-auto flex max-w-3xl flex-col gap-5 rounded-lg border border-ink-200 bg-white px-8 py-7 text-ink-900 print:max-w-none print:rounded-none print:border-0 print:px-0 print:py-0"
    >
      <header className="flex flex-wrap items-start justify-between gap-4 border-b border-ink-300 pb-4">
        <div>
          <p className="text-lg font-semibold">{receipt.labName}</p>
          <h1 className="text-xl font-semibold">Receipt for shared order #{receipt.orderId}</h1>
          <p className="text-sm text-ink-700">{receipt.title}</p>
        </div>
        <dl className="grid grid-cols-[auto_auto] gap-x-3 text-sm">
          <dt className="text-ink-600">Issued</dt>
          <dd>{formatDate(receipt.issuedAt)}</dd>
          <dt className="text-ink-600">Order status</dt>
          <dd>{orderStatusLabels[receipt.status]}</dd>
          {receipt.orderedAt && (
            <>
              <dt className="text-ink-600">Ordered</dt>
              <dd>{formatDate(receipt.orderedAt)}</dd>
            </>
          )}
          {receipt.receivedAt && (
            <>
              <dt className="text-ink-600">Received</dt>
              <dd>{formatDate(receipt.receivedAt)}</dd>
            </>
          )}
        </dl>
      </header>

      <div className="grid gap-4 text-sm sm:grid-cols-2 print:grid-cols-2">
        <div>
          <h2 className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Member</h2>
          <p className="font-semibold">{receipt.member.displayName}</p>
          <p className="text-ink-700">{receipt.member.email}</p>
        </div>
        <div>
          <h2 className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Supplier</h2>
          <p className="font-semibold">{receipt.supplier.name}</p>
          {receipt.supplier.reference && (
            <p className="text-ink-700">Order reference {receipt.supplier.reference}</p>
          )}
        </div>
      </div>

      <section aria-label="What you took" className="break-inside-avoid">
        <h2 className="mb-1 text-sm font-semibold">What you took</h2>
        <table className="w-full text-sm">
          <thead className="border-b border-ink-300 text-left text-xs text-ink-600">
            <tr>
              <th className="py-1 pr-2 font-semibold">Chemical</th>
              <th className="py-1 pr-2 font-semibold">Supplier no.</th>
              <th className="py-1 pr-2 text-right font-semibold">Quantity</th>
              <th className="py-1 pr-2 text-right font-semibold">Goods</th>
              <th className="py-1 pr-2 text-right font-semibold">Fees</th>
              <th className="py-1 text-right font-semibold">Amount</th>
            </tr>
          </thead>
          <tbody>
            {receipt.lines.map((line) => (
              <tr key={line.shareId} className="border-b border-ink-100 align-top">
                <td className="py-1 pr-2">
                  {line.chemicalName}
                  {line.labelCode && (
                    <span className="block text-xs text-ink-600">
                      Container <span className="font-mono">{line.labelCode}</span>
                    </span>
                  )}
                  <HazardCodes pictograms={line.ghsPictograms} statements={line.hazardStatements} />
                </td>
                <td className="py-1 pr-2 font-mono text-xs">{line.sku}</td>
                <td className="py-1 pr-2 text-right tabular-nums">
                  {formatAmount(line.quantity, line.unit)}
                </td>
                <td className="py-1 pr-2 text-right">
                  <Money minor={line.goodsMinor} currency={currency} />
                </td>
                <td className="py-1 pr-2 text-right">
                  <Money minor={line.feesMinor} currency={currency} />
                </td>
                <td className="py-1 text-right">
                  <Money minor={line.amountMinor} currency={currency} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1 text-xs text-ink-600">
          Fees are your part of the supplier’s shipping and hazardous-goods charges for this order.
        </p>
      </section>

      <Movements
        title="Payments"
        movements={receipt.payments}
        currency={currency}
        empty="No payment recorded yet."
      />
      {receipt.refunds.length > 0 && (
        <Movements title="Refunds" movements={receipt.refunds} currency={currency} empty="" />
      )}

      <section aria-label="Totals" className="break-inside-avoid self-end text-sm sm:w-80">
        <dl className="flex flex-col gap-0.5">
          <TotalRow label="Goods" minor={totals.goodsMinor} currency={currency} />
          <TotalRow label="Fees" minor={totals.feesMinor} currency={currency} />
          <TotalRow label="Your amount" minor={totals.amountMinor} currency={currency} strong />
          <TotalRow label="Paid" minor={totals.collectedMinor} currency={currency} />
          <TotalRow label="Refunded" minor={totals.refundedMinor} currency={currency} />
          <TotalRow
            label="Paid in the end"
            minor={totals.netPaidMinor}
            currency={currency}
            strong
            className="mt-1 border-t border-ink-300 pt-1"
          />
          <TotalRow label="Still to pay" minor={totals.owedMinor} currency={currency} strong />
        </dl>
      </section>

      <footer className="flex flex-col gap-2 border-t border-ink-200 pt-3 text-xs text-ink-600">
        <p>
          Amounts in {currency}. This receipt records your part of a shared order placed by{' '}
          {receipt.labName}; it is not the supplier’s invoice.
        </p>
        <SafetyCaution compact />
      </footer>
    </article>
  );
}
