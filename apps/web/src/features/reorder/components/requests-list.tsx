import { Link } from 'react-router';
import { CircleCheck, CircleSlash, Clock, FolderInput, Undo2, XCircle } from 'lucide-react';
import { requestStatusLabels, type MemberRequest, type RequestStatus } from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { formatAmount, formatDate } from '../../../lib/format';
import { useFoldRequest, useWithdrawRequest } from '../api';
import { orderHref } from './restock-format';

const statusLooks: Record<RequestStatus, { tone: BadgeTone; icon: React.ReactNode }> = {
  open: { tone: 'accent', icon: <Clock aria-hidden="true" /> },
  folded: { tone: 'ok', icon: <CircleCheck aria-hidden="true" /> },
  withdrawn: { tone: 'neutral', icon: <Undo2 aria-hidden="true" /> },
  declined: { tone: 'neutral', icon: <CircleSlash aria-hidden="true" /> },
};

/**
 * Member requests as a list. `mode="coordinator"` offers to fold an open request into the
 * supplier's draft order as the member's share; `mode="own"` offers to withdraw it.
 */
export function RequestsList({
  requests,
  mode,
  emptyText,
}: {
  requests: MemberRequest[];
  mode: 'coordinator' | 'own';
  emptyText: string;
}) {
  const fold = useFoldRequest();
  const withdraw = useWithdrawRequest();
  const busyId = fold.isPending
    ? fold.variables?.id
    : withdraw.isPending
      ? withdraw.variables
      : undefined;
  const failure = fold.error ?? withdraw.error;
  const folded = fold.data;

  const foldedNotice = folded && folded.orderId !== null && (
    <Notice tone="ok">
      {formatAmount(folded.quantity, folded.unit)} of {folded.chemical.name} is now{' '}
      {folded.requester.displayName}’s share in{' '}
      <Link
        to={orderHref(folded.orderId)}
        className="text-accent-700 underline-offset-2 hover:underline"
      >
        order #{folded.orderId}
      </Link>
      .
    </Notice>
  );
  if (requests.length === 0) {
    return (
      <div className="flex flex-col gap-2">
        {foldedNotice}
        <p className="text-sm text-ink-600">{emptyText}</p>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      {failure && <Notice tone="danger">{errorMessage(failure)}</Notice>}
      {foldedNotice}
      <ul className="grid gap-2 md:grid-cols-2 xl:grid-cols-3 min-[1800px]:grid-cols-1">
        {requests.map((request) => {
          const look = statusLooks[request.status];
          return (
            <li
              key={request.id}
              className="flex flex-col gap-1.5 rounded-lg border border-ink-200 bg-white px-3 py-2.5 text-sm"
            >
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <p className="text-ink-900">
                  <strong className="tabular-nums">
                    {formatAmount(request.quantity, request.unit)}
                  </strong>{' '}
                  of <strong>{request.chemical.name}</strong>
                  {mode === 'coordinator' && (
                    <span className="text-ink-600"> for {request.requester.displayName}</span>
                  )}
                  {request.neededBy && (
                    <span className="text-ink-600"> by {formatDate(request.neededBy)}</span>
                  )}
                </p>
                <Badge tone={look.tone} icon={look.icon}>
                  {requestStatusLabels[request.status]}
                </Badge>
              </div>
              <HazardCodes
                pictograms={request.chemical.ghsPictograms}
                statements={request.chemical.hazardStatements}
              />
              {request.note && <p className="text-ink-700">“{request.note}”</p>}
              <div className="flex flex-wrap items-center gap-2">
                {request.orderId !== null && (
                  <Link
                    to={orderHref(request.orderId)}
                    className="text-accent-700 underline-offset-2 hover:underline"
                  >
                    In order #{request.orderId}
                  </Link>
                )}
                {request.status === 'open' && mode === 'coordinator' && (
                  <Button
                    size="sm"
                    icon={<FolderInput aria-hidden="true" className="size-4" />}
                    busy={busyId === request.id}
                    onClick={() => fold.mutate({ id: request.id })}
                  >
                    Add to a draft order as their share
                  </Button>
                )}
                {request.status === 'open' && mode === 'own' && (
                  <Button
                    size="sm"
                    variant="ghost"
                    icon={<XCircle aria-hidden="true" className="size-4" />}
                    busy={busyId === request.id}
                    onClick={() => withdraw.mutate(request.id)}
                  >
                    Withdraw
                  </Button>
                )}
              </div>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
