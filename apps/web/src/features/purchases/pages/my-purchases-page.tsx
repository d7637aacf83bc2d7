import { Link } from 'react-router';
import { ReceiptText, ShoppingBag } from 'lucide-react';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useMyPurchases } from '../api';
import { Money } from '../components/money';
import { OrderStatusBadge } from '../components/order-status-badge';
import { TableScroll } from '../../../components/ui/table-scroll';

const th = 'px-2.5 py-2';
const num = 'px-2.5 py-2 text-right';

/** `/purchases`: the shared orders the signed-in member has shares in, and their money. */
export function MyPurchasesPage() {
  const purchases = useMyPurchases();
  return (
    <div className="flex flex-col gap-5">
      <header>
        <h1 className="text-xl font-semibold text-ink-900">My purchases</h1>
        <p className="max-w-3xl text-sm text-ink-600">
          Every shared order you have a share in: your amount once claims are closed, what you have
          paid, what was given back, and what is still to pay. Each has a receipt you can print or
          save as PDF.
        </p>
      </header>
      {purchases.isPending ? (
        <PageSpinner label="Loading your purchases…" />
      ) : purchases.isError ? (
        <ErrorState error={purchases.error} onRetry={() => void purchases.refetch()} />
      ) : purchases.data.items.length === 0 ? (
        <EmptyState icon={<ShoppingBag aria-hidden="true" />} title="No purchases yet">
          When you claim a share of a shared order it appears here.
        </EmptyState>
      ) : (
        <TableScroll className="rounded-lg border border-ink-200 bg-white">
          <table className="w-full text-sm" aria-label="My purchases">
            <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
              <tr>
                <th className={th}>Order</th>
                <th className={th}>Supplier</th>
                <th className={th}>Status</th>
                <th className={num}>Your amount</th>
                <th className={num}>Paid</th>
                <th className={num}>Refunded</th>
                <th className={num}>Still to pay</th>
                <th className={th}>
                  <span className="sr-only">Receipt</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {purchases.data.items.map((item) => (
                <tr key={item.orderId} className="border-b border-ink-100 last:border-b-0">
                  <td className={th}>
                    <span className="font-medium text-ink-900">{item.title}</span>
                    <span className="block text-xs text-ink-600">
                      #{item.orderId} · {item.shareCount}{' '}
                      {item.shareCount === 1 ? 'share' : 'shares'}
                    </span>
                  </td>
                  <td className={th}>{item.supplierName}</td>
                  <td className={th}>
                    <OrderStatusBadge status={item.status} />
                  </td>
                  <td className={num}>
                    {item.amountMinor === null ? (
                      <span className="text-ink-600">claims open</span>
                    ) : (
                      <Money minor={item.amountMinor} currency={item.currency} />
                    )}
                  </td>
                  <td className={num}>
                    <Money minor={item.collectedMinor} currency={item.currency} />
                  </td>
                  <td className={num}>
                    <Money minor={item.refundedMinor} currency={item.currency} />
                  </td>
                  <td className={num}>
                    <Money
                      minor={item.owedMinor}
                      currency={item.currency}
                      className={item.owedMinor > 0 ? 'font-semibold text-warn-700' : ''}
                    />
                  </td>
                  <td className={th}>
                    <Link
                      to={paths.orderReceipt(item.orderId)}
                      className="inline-flex items-center gap-1 text-accent-700 underline-offset-2 hover:underline"
                    >
                      <ReceiptText aria-hidden="true" className="size-4" />
                      Receipt
                    </Link>
                  </td>
                </tr>
              ))}
            </tbody>
            <tfoot className="border-t border-ink-200 bg-ink-50 font-semibold">
              <tr>
                <td className={th} colSpan={4}>
                  All orders
                </td>
                <td className={num}>
                  <Money
                    minor={purchases.data.totals.collectedMinor}
                    currency={purchases.data.currency}
                  />
                </td>
                <td className={num}>
                  <Money
                    minor={purchases.data.totals.refundedMinor}
                    currency={purchases.data.currency}
                  />
                </td>
                <td className={num}>
                  <Money
                    minor={purchases.data.totals.owedMinor}
                    currency={purchases.data.currency}
                  />
                </td>
                <td />
              </tr>
            </tfoot>
          </table>
        </TableScroll>
      )}
    </div>
  );
}

export { MyPurchasesPage as Component };
