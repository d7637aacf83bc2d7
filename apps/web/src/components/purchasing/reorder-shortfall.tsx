import { useState } from 'react';
import { Link } from 'react-router';
import { useMutation } from '@tanstack/react-query';
import { Send, ShoppingCart } from 'lucide-react';
import {
  draftedOrderSchema,
  memberRequestSchema,
  type DraftedOrder,
  type StockUnit,
} from '@lotwise/shared';
import { paths } from '../../config/paths';
import { api, errorMessage } from '../../lib/api-client';
import { useCan } from '../../lib/auth';
import { formatAmount } from '../../lib/format';
import { Button } from '../ui/button';

/**
 * Buying a shortfall from where it shows (a plan's stock check). A coordinator drafts an
 * order line for it (on the draft order of the supplier with the best offer, or a new one);
 * a member asks for it with a request; anyone else sees where to look.
 */
export function ReorderShortfall({
  chemicalId,
  chemicalName,
  shortfall,
  unit,
  note,
}: {
  chemicalId: number;
  chemicalName: string;
  shortfall: number;
  unit: StockUnit;
  /** Said on a member's request, e.g. which plan it is for. */
  note?: string;
}) {
  const coordinator = useCan('orders.manage');
  const mayRequest = useCan('orders.join');
  const [done, setDone] = useState<DraftedOrder | 'requested' | null>(null);
  const draft = useMutation({
    mutationFn: () =>
      api.post(
        '/api/reorder-suggestions/shortfall',
        { chemicalId, quantity: shortfall, unit },
        draftedOrderSchema,
      ),
    onSuccess: (order) => setDone(order),
  });
  const ask = useMutation({
    mutationFn: () =>
      api.post(
        '/api/requests',
        { chemicalId, quantity: shortfall, unit, note: note ?? '' },
        memberRequestSchema,
      ),
    onSuccess: () => setDone('requested'),
  });
  const amount = formatAmount(shortfall, unit);

  if (done === 'requested') {
    return (
      <span className="text-xs text-ok-700">
        Requested {amount} of {chemicalName}:{' '}
        <Link to={paths.restock} className="text-accent-700 underline-offset-2 hover:underline">
          see your requests
        </Link>
      </span>
    );
  }
  if (done) {
    return (
      <span className="text-xs text-ok-700">
        {done.created ? 'Drafted' : 'Added to'}{' '}
        <Link
          to={`${paths.orders}/${done.orderId}`}
          className="text-accent-700 underline-offset-2 hover:underline"
        >
          order #{done.orderId} with {done.supplier.name}
        </Link>
      </span>
    );
  }
  const failure = draft.error ?? ask.error;
  return (
    <>
      {coordinator ? (
        <Button
          size="sm"
          busy={draft.isPending}
          icon={<ShoppingCart aria-hidden="true" className="size-4" />}
          onClick={() => draft.mutate()}
        >
          Reorder {amount}
        </Button>
      ) : mayRequest ? (
        <Button
          size="sm"
          busy={ask.isPending}
          icon={<Send aria-hidden="true" className="size-4" />}
          onClick={() => ask.mutate()}
        >
          Request {amount}
        </Button>
      ) : null}
      {failure && (
        <span role="alert" className="text-xs text-danger-700">
          {errorMessage(failure)}
        </span>
      )}
    </>
  );
}
