import { useState } from 'react';
import { can, type OrderDetail } from '@lotwise/shared';
import { Eye, ShieldCheck } from 'lucide-react';
import { WatchListBadges } from '../../../components/hazards/watch-list-badges';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useCurrentUser } from '../../../lib/auth';
import { formatDateTime } from '../../../lib/format';
import { useApproveWatch } from '../api';

/**
 * Watched and restricted chemicals on an order's lines: which, why, the approval they need
 * before the order opens (who, when, why), and for a manager the form to approve.
 */
export function WatchApprovalPanel({ order }: { order: OrderDetail }) {
  const user = useCurrentUser().data;
  const approve = useApproveWatch(order.id);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const watch = order.watch;
  if (!watch || watch.chemicals.length === 0) return null;
  const mayApprove =
    user && can(user.role, 'orders.manage') && !['closed', 'cancelled'].includes(order.status);

  function submit(event: React.FormEvent) {
    event.preventDefault();
    if (reason.trim().length < 5) {
      setError('Say why the order is approved, in a few words.');
      return;
    }
    setError(null);
    approve.mutate(reason.trim(), { onSuccess: () => setReason('') });
  }

  return (
    <section
      aria-labelledby="watch-approval-heading"
      className="flex flex-col gap-3 rounded-lg border border-warn-200 bg-white px-4 py-3"
      data-testid="watch-approval"
    >
      <h2 id="watch-approval-heading" className="flex items-center gap-2 text-base font-semibold">
        <Eye aria-hidden="true" className="size-4 text-warn-700" />
        Watched chemicals on this order
      </h2>
      <ul className="flex flex-col gap-1.5 text-sm text-ink-800">
        {watch.chemicals.map((chemical) => (
          <li key={chemical.chemicalId} className="flex flex-wrap items-center gap-1.5">
            <span className="font-medium">{chemical.name}</span>
            {chemical.casNumber && (
              <span className="text-xs text-ink-600 tabular-nums">{chemical.casNumber}</span>
            )}
            <WatchListBadges listings={chemical.listings} />
            {chemical.restricted && <Badge tone="warn">Marked restricted</Badge>}
          </li>
        ))}
      </ul>
      {watch.approval && (
        <p
          className="flex items-start gap-2 text-sm text-ink-800"
          data-testid="watch-approval-record"
        >
          <ShieldCheck aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ok-700" />
          <span>
            Approved by <strong>{watch.approval.approvedByName}</strong> on{' '}
            {formatDateTime(watch.approval.approvedAt)}: “{watch.approval.reason}”
          </span>
        </p>
      )}
      {watch.approvalNeeded ? (
        <Notice tone="warn" title="Needs a manager’s approval">
          {watch.approval
            ? 'A chemical was added after the approval: the order opens once a manager approves it again.'
            : 'The order opens for claims once a manager approves it, with the reason recorded.'}
        </Notice>
      ) : (
        <p className="text-sm text-ink-700">
          <Badge tone="ok" icon={<ShieldCheck aria-hidden="true" />}>
            approved
          </Badge>{' '}
          The approval covers every watched chemical on the lines.
        </p>
      )}
      {mayApprove && watch.approvalNeeded && (
        <form onSubmit={submit} className="flex flex-col gap-2" noValidate>
          <Field
            label="Reason for approving"
            error={error ?? undefined}
            hint="Who needs it and for what; it is recorded with your name and shown here."
          >
            {(c) => (
              <Textarea
                {...c}
                rows={2}
                value={reason}
                onChange={(event) => setReason(event.target.value)}
              />
            )}
          </Field>
          {approve.isError && (
            <Notice tone="danger" title="Not approved">
              {errorMessage(approve.error)}
            </Notice>
          )}
          <div>
            <Button
              type="submit"
              variant="primary"
              busy={approve.isPending}
              icon={<ShieldCheck aria-hidden="true" className="size-4" />}
            >
              Approve the order
            </Button>
          </div>
        </form>
      )}
      <p className="text-xs text-ink-600">
        Watch lists are reminders of the regulations they cite; the regulation’s current text and
        your authority decide.
      </p>
    </section>
  );
}
