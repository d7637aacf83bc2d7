import { Link, useParams, useSearchParams } from 'react-router';
import { ChevronLeft } from 'lucide-react';
import type { OrderDetail } from '@lotwise/shared';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { useOrder } from '../api';
import { CoordinatorActions } from '../components/coordinator-actions';
import { WatchApprovalPanel } from '../components/watch-approval-panel';
import { OrderMoneyLinks } from '../../../components/purchasing/order-money-links';
import { useCurrentUser } from '../../../lib/auth';
import { DeadlineEditor } from '../components/deadline-editor';
import { OrderLinesTable } from '../components/order-lines-table';
import { OrderTotals } from '../components/order-totals';
import { SharesTable } from '../components/shares-table';
import { YourSharePanel } from '../components/your-share-panel';
import { feeRuleExplanations, feeRuleLabel, OrderStatusBadge } from '../labels';

function OrderHeader({ order }: { order: OrderDetail }) {
  return (
    <header className="flex flex-col gap-2">
      <Link
        to={paths.orders}
        className="inline-flex items-center gap-1 self-start text-sm text-ink-600 hover:text-ink-900"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        All orders
      </Link>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-xl font-semibold text-ink-900">{order.title}</h1>
        <OrderStatusBadge status={order.status} claimsClosedAt={order.claimsClosedAt} />
      </div>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-600">Supplier</dt>
        <dd className="text-ink-900">
          {order.supplier.name}
          {order.supplier.orderingNotes && (
            <span className="block text-xs text-ink-600">{order.supplier.orderingNotes}</span>
          )}
        </dd>
        <dt className="text-ink-600">Claims until</dt>
        <dd className="text-ink-900">
          {order.claimDeadline ? formatDate(order.claimDeadline) : 'No deadline set yet'}
          {order.claimsClosedAt && (
            <span className="text-ink-600"> · closed {formatDate(order.claimsClosedAt)}</span>
          )}
          {order.abilities.mayEditDraft && <DeadlineEditor order={order} />}
        </dd>
        <dt className="text-ink-600">Fees shared</dt>
        <dd className="text-ink-900">
          {feeRuleLabel(order.feeRule)}
          <span className="block text-xs text-ink-600">{feeRuleExplanations[order.feeRule]}</span>
        </dd>
        <dt className="text-ink-600">Coordinator</dt>
        <dd className="text-ink-900">{order.coordinator?.displayName ?? '—'}</dd>
        {order.supplierReference && (
          <>
            <dt className="text-ink-600">Supplier reference</dt>
            <dd className="text-ink-900">{order.supplierReference}</dd>
          </>
        )}
      </dl>
      {order.notes && <p className="text-sm whitespace-pre-line text-ink-700">{order.notes}</p>}
      {order.status === 'cancelled' && (
        <Notice tone="warn" title="This order was cancelled">
          {order.cancelReason}
        </Notice>
      )}
    </header>
  );
}

/** What the page says after coming back from the provider's checkout page. */
function PaymentReturn({
  order,
  paid,
  cancelled,
}: {
  order: OrderDetail;
  paid: number | null;
  cancelled: number | null;
}) {
  if (paid !== null) {
    const share = order.shares.find((item) => item.id === paid);
    if (share?.paymentStatus === 'paid') {
      return (
        <Notice tone="ok" title="Paid">
          Your payment is confirmed; the share reads paid.
        </Notice>
      );
    }
    return (
      <Notice tone="info" title="Payment received — it shows as paid once the provider confirms">
        This page checks again every few seconds.
      </Notice>
    );
  }
  if (cancelled !== null) {
    return (
      <Notice tone="info" title="Payment not made">
        You left the payment page: nothing was charged. You can pay again whenever you are ready.
      </Notice>
    );
  }
  return null;
}

function shareParam(value: string | null): number | null {
  const n = Number(value);
  return value && Number.isInteger(n) && n > 0 ? n : null;
}

export function OrderPage() {
  const { id } = useParams();
  const orderId = Number(id);
  const [search] = useSearchParams();
  const paid = shareParam(search.get('paid'));
  const cancelled = shareParam(search.get('cancelled'));
  const order = useOrder(orderId, paid);
  const user = useCurrentUser().data;

  if (order.isPending) return <PageSpinner label="Loading the order…" />;
  if (order.isError) {
    const missing = isApiError(order.error) && [400, 404].includes(order.error.status);
    return (
      <ErrorState
        title={missing ? 'There is no such order' : 'The order could not be loaded'}
        error={order.error}
        onRetry={missing ? undefined : () => void order.refetch()}
      />
    );
  }
  const data = order.data;
  return (
    <div className="flex flex-col gap-5">
      <OrderHeader order={data} />
      <PaymentReturn order={data} paid={paid} cancelled={cancelled} />
      <CoordinatorActions order={data} />
      <WatchApprovalPanel order={data} />
      {user && (
        <OrderMoneyLinks
          orderId={data.id}
          status={data.status}
          role={user.role}
          hasShare={data.shares.some((share) => share.mine)}
        />
      )}
      <div className="grid gap-5 lg:grid-cols-[1fr_20rem]">
        <div className="flex min-w-0 flex-col gap-5">
          <YourSharePanel order={data} />
          <OrderLinesTable order={data} />
          <SharesTable order={data} />
        </div>
        <div className="flex flex-col gap-5">
          <OrderTotals order={data} />
        </div>
      </div>
    </div>
  );
}
