import { useState } from 'react';
import { Banknote, Landmark } from 'lucide-react';
import type { OrderDetail, OrderShare } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field } from '../../../components/ui/field';
import { Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { formatAmount } from '../../../lib/format';
import { useRecordPayment } from '../api';
import { money, PaymentStatusBadge } from '../labels';
import { TableScroll } from '../../../components/ui/table-scroll';

function RecordPaymentDialog({
  order,
  share,
  onClose,
}: {
  order: OrderDetail;
  share: OrderShare;
  onClose: () => void;
}) {
  const record = useRecordPayment(order.id);
  const [note, setNote] = useState('');
  const who = share.forLab ? 'the lab' : (share.member?.displayName ?? 'this member');
  return (
    <Dialog
      open
      onClose={onClose}
      size="sm"
      title={share.forLab ? 'Record lab funds' : 'Record cash payment'}
      description={`${money(share.amountMinor, order.currency)} for ${who}. It goes in the audit trail.`}
      footer={
        <>
          <Button onClick={onClose} disabled={record.isPending}>
            Go back
          </Button>
          <Button
            variant="primary"
            busy={record.isPending}
            disabled={note.trim() === ''}
            onClick={() =>
              record.mutate({ shareId: share.id, note: note.trim() }, { onSuccess: onClose })
            }
          >
            Record {money(share.amountMinor, order.currency)}
          </Button>
        </>
      }
    >
      <div className="flex flex-col gap-3">
        <Field
          label="Note"
          hint={
            share.forLab
              ? 'Which budget pays it, e.g. the club’s consumables budget'
              : 'Who paid and when, e.g. received at the club evening on 3 March'
          }
        >
          {(control) => (
            <Textarea
              {...control}
              rows={2}
              value={note}
              onChange={(e) => setNote(e.target.value)}
            />
          )}
        </Field>
        {record.isError && <Notice tone="danger">{errorMessage(record.error)}</Notice>}
      </div>
    </Dialog>
  );
}

/** Who claimed what, for how much, and whether it is paid. */
export function SharesTable({ order }: { order: OrderDetail }) {
  const [recording, setRecording] = useState<OrderShare | null>(null);
  const lineName = (lineId: number) =>
    order.lines.find((line) => line.id === lineId)?.chemical.name ?? 'A line';
  return (
    <section aria-labelledby="order-shares-heading" className="flex flex-col gap-2">
      <h2 id="order-shares-heading" className="text-base font-semibold text-ink-900">
        Who claimed what
      </h2>
      {order.shares.length === 0 ? (
        <p className="rounded-lg border border-ink-200 bg-white px-3 py-4 text-sm text-ink-600">
          Nobody has claimed anything yet.
        </p>
      ) : (
        <TableScroll className="rounded-lg border border-ink-200 bg-white">
          <table className="w-full text-sm">
            <thead className="bg-ink-50 text-left text-xs text-ink-600">
              <tr>
                <th className="px-3 py-2 font-semibold">Who</th>
                <th className="px-3 py-2 font-semibold">Chemical</th>
                <th className="px-3 py-2 text-right font-semibold">Quantity</th>
                <th className="px-3 py-2 text-right font-semibold">Amount</th>
                <th className="px-3 py-2 font-semibold">Payment</th>
                {order.abilities.mayManage && (
                  <th className="px-3 py-2 font-semibold">
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {order.shares.map((share) => (
                <tr
                  key={share.id}
                  data-testid={`share-${share.id}`}
                  className="border-t border-ink-100"
                >
                  <td className="px-3 py-2">
                    {share.forLab ? 'The lab' : (share.member?.displayName ?? '—')}
                    {share.mine && <span className="ml-1 text-xs text-ink-600">(you)</span>}
                  </td>
                  <td className="px-3 py-2">{lineName(share.lineId)}</td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {formatAmount(share.quantity, share.unit)}
                  </td>
                  <td className="px-3 py-2 text-right tabular-nums">
                    {money(share.amountMinor, order.currency)}
                    {!share.amountFixed && (
                      <span className="block text-xs text-ink-600">estimate</span>
                    )}
                  </td>
                  <td className="px-3 py-2">
                    <PaymentStatusBadge status={share.paymentStatus} />
                    {share.refundedMinor > 0 && (
                      <span className="block text-xs text-ink-600 tabular-nums">
                        {money(share.refundedMinor, order.currency)} refunded
                      </span>
                    )}
                  </td>
                  {order.abilities.mayManage && (
                    <td className="px-3 py-2 text-right">
                      {share.mayRecordPayment && (
                        <Button
                          size="sm"
                          icon={
                            share.forLab ? (
                              <Landmark aria-hidden="true" className="size-4" />
                            ) : (
                              <Banknote aria-hidden="true" className="size-4" />
                            )
                          }
                          onClick={() => setRecording(share)}
                        >
                          {share.forLab ? 'Record lab funds' : 'Record cash payment'}
                        </Button>
                      )}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      )}
      {recording && (
        <RecordPaymentDialog order={order} share={recording} onClose={() => setRecording(null)} />
      )}
    </section>
  );
}
