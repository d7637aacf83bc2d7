import { Link } from 'react-router';
import { Lock, Printer } from 'lucide-react';
import type { ReceivingView } from '@lotwise/shared';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { paths } from '../../../config/paths';
import { errorMessage, withQuery } from '../../../lib/api-client';
import { formatAmount, formatDateTime } from '../../../lib/format';
import { useCloseOrder } from '../api';
import { ChemicalCell } from './line-parts';
import { OrderStatusBadge } from './order-status-badge';
import { TableScroll } from '../../../components/ui/table-scroll';

const th = 'px-2.5 py-2';

/** After receiving: each portion's container, its owner and place, and closing the order. */
export function ReceivedView({ view }: { view: ReceivingView }) {
  const close = useCloseOrder(view.orderId);
  const ids = view.lines.flatMap((line) =>
    line.shares.flatMap((share) => (share.container ? [share.container.id] : [])),
  );
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="ok" title="The delivery is in stock">
        Received {view.receivedAt ? formatDateTime(view.receivedAt) : ''}. Each portion below is its
        own labelled container; members were e-mailed where theirs is. Put a label with its code on
        each container.
      </Notice>
      <TableScroll className="rounded-lg border border-ink-200 bg-white">
        <table className="w-full text-sm" aria-label="Containers made for the portions">
          <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
            <tr>
              <th className={th}>Chemical</th>
              <th className={th}>Lot</th>
              <th className={th}>Belongs to</th>
              <th className={th}>Label code</th>
              <th className={`${th} text-right`}>Quantity</th>
              <th className={th}>Location</th>
            </tr>
          </thead>
          <tbody>
            {view.lines.flatMap((line) =>
              line.shares.map((share, index) => (
                <tr
                  key={share.shareId}
                  className="border-b border-ink-100 align-top last:border-b-0"
                >
                  <td className={th}>{index === 0 ? <ChemicalCell line={line} /> : null}</td>
                  <td className={th}>
                    {index === 0 && line.lot
                      ? (line.lot.supplierLotNumber ?? `#${line.lot.id}`)
                      : null}
                  </td>
                  <td className={th}>{share.holder}</td>
                  <td className={th}>
                    {share.container ? (
                      <Link
                        to={paths.stockContainer(share.container.id)}
                        className="font-mono font-semibold text-accent-700 underline-offset-2 hover:underline"
                      >
                        {share.container.labelCode}
                      </Link>
                    ) : (
                      '—'
                    )}
                  </td>
                  <td className={`${th} text-right tabular-nums`}>
                    {share.container
                      ? formatAmount(share.container.quantity, share.container.unit)
                      : '—'}
                  </td>
                  <td className={th}>{share.container?.locationPath ?? '—'}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      </TableScroll>
      <div className="flex flex-wrap items-center gap-2">
        <Link
          to={withQuery(paths.stockLabels, { ids: ids.join(',') })}
          className={buttonClasses('primary')}
        >
          <Printer aria-hidden="true" className="size-4" />
          Print labels
        </Link>
        {view.status === 'received' && (
          <Button
            onClick={() => close.mutate()}
            busy={close.isPending}
            disabled={!view.closable}
            icon={<Lock aria-hidden="true" className="size-4" />}
          >
            Close order
          </Button>
        )}
        {view.status === 'closed' && <OrderStatusBadge status="closed" />}
      </div>
      {view.status === 'received' && view.closeBlockers.length > 0 && (
        <Notice tone="warn" title="Not ready to close">
          {view.closeBlockers.join(' ')}
        </Notice>
      )}
      {close.isError && <Notice tone="danger">{errorMessage(close.error)}</Notice>}
    </div>
  );
}
