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

  if (requests.length === 0) return <p className="text-sm text-ink-600">{emptyText}</p>;
  return (
    <div className="flex flex-col gap-2">
      {failure && <Notice tone="danger">{errorMessage(failure)}</Notice>}
      <ul className="flex flex-col divide-y divide-ink-200 rounded-lg border border-ink-200 bg-white">
        {requests.map((request) => {
          const look = statusLooks[request.status];
          return (
            <li key={request.id} className="flex flex-col gap-1.5 px-3 py-2.5 text-sm">
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
