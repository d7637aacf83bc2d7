import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { ShoppingCart } from 'lucide-react';
import type { DraftedOrder } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Checkbox, Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { useCan } from '../../../lib/auth';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { useDraftOrders, useReorderSuggestions, useRequests } from '../api';
import { RequestForm } from '../components/request-form';
import { RequestsList } from '../components/requests-list';
import { orderHref } from '../components/restock-format';
import { SuggestionsTable } from '../components/suggestions-table';

function DraftedNotice({ orders }: { orders: DraftedOrder[] }) {
  return (
    <Notice tone="ok" title={`Drafted ${orders.length} orders, one per supplier`}>
      <ul className="mt-1 flex flex-col gap-0.5">
        {orders.map((order) => (
          <li key={order.orderId}>
            <Link
              to={orderHref(order.orderId)}
              className="text-accent-700 underline-offset-2 hover:underline"
            >
              Order #{order.orderId} with {order.supplier.name}
            </Link>{' '}
            ({order.lineCount} {order.lineCount === 1 ? 'line' : 'lines'},{' '}
            {order.created ? 'new draft' : 'added to its draft'})
          </li>
        ))}
      </ul>
    </Notice>
  );
}

/**
 * Restock: what runs low and what it costs to buy, with members' requests beside it. A
 * coordinator picks rows and drafts shared orders (one per supplier) in one click; a member
 * asks for what they need.
 */
export function RestockPage() {
  const [q, setQ] = useState('');
  const [dueOnly, setDueOnly] = useState(false);
  const [selected, setSelected] = useState<ReadonlySet<number>>(new Set());
  const [drafted, setDrafted] = useState<DraftedOrder[] | null>(null);
  const debounced = useDebouncedValue(q, 250);
  const suggestions = useReorderSuggestions({ q: debounced.trim(), dueOnly });
  const coordinator = useCan('orders.manage');
  const mayRequest = useCan('orders.join');
  const openRequests = useRequests(coordinator ? { status: 'open' } : { mine: true });
  const draft = useDraftOrders();
  const navigate = useNavigate();

  function handleToggle(chemicalId: number) {
    setSelected((current) => {
      const next = new Set(current);
      if (next.has(chemicalId)) next.delete(chemicalId);
      else next.add(chemicalId);
      return next;
    });
  }

  function handleDraft() {
    setDrafted(null);
    draft.mutate(
      { items: [...selected].map((chemicalId) => ({ chemicalId })) },
      {
        onSuccess: ({ orders }) => {
          setSelected(new Set());
          const [only] = orders;
          if (orders.length === 1 && only) void navigate(orderHref(only.orderId));
          else setDrafted(orders);
        },
      },
    );
  }

  const draftFields = isApiError(draft.error) ? Object.values(draft.error.fields) : [];

  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-xl font-semibold text-ink-900">Restock</h1>
        <p className="text-sm text-ink-600">
          Chemicals with a reorder point: how long the stock lasts at the recent rate of use, how
          much to buy, and the catalogue packs that cost least per gram (or mL) once the supplier’s
          shipping and hazardous-goods fees are counted.
        </p>
      </div>
      <SafetyCaution />
      {/* Requests sit above the table, and beside it where the screen is wide enough. */}
      <div className="grid gap-4 min-[1800px]:grid-cols-[minmax(0,1fr)_20rem]">
        <section
          aria-labelledby="suggestions-heading"
          className="order-last flex min-w-0 flex-col gap-3 min-[1800px]:order-first"
        >
          <h2 id="suggestions-heading" className="sr-only">
            Reorder suggestions
          </h2>
          <div className="flex flex-wrap items-end gap-3">
            <label className="flex flex-col gap-1 text-sm font-medium text-ink-800">
              Find a chemical
              <Input
                type="search"
                value={q}
                onChange={(event) => setQ(event.target.value)}
                placeholder="Name, CAS RN or formula"
                className="w-64"
              />
            </label>
            <label className="flex h-9 items-center gap-2 text-sm text-ink-800">
              <Checkbox checked={dueOnly} onChange={(event) => setDueOnly(event.target.checked)} />
              Only what is at or below its reorder point
            </label>
            {coordinator && (
              <Button
                variant="primary"
                className="ml-auto"
                disabled={selected.size === 0}
                busy={draft.isPending}
                icon={<ShoppingCart aria-hidden="true" className="size-4" />}
                onClick={handleDraft}
              >
                Draft a shared order
                {selected.size > 0 ? ` (${selected.size} chosen)` : ''}
              </Button>
            )}
          </div>
          {draft.isError && (
            <Notice tone="danger" title={errorMessage(draft.error)}>
              {draftFields.length > 0 && (
                <ul className="list-disc pl-4">
                  {draftFields.map((text) => (
                    <li key={text}>{text}</li>
                  ))}
                </ul>
              )}
            </Notice>
          )}
          {drafted && <DraftedNotice orders={drafted} />}
          {suggestions.isPending ? (
            <PageSpinner label="Working out what to reorder…" />
          ) : suggestions.isError ? (
            <ErrorState error={suggestions.error} onRetry={() => void suggestions.refetch()} />
          ) : suggestions.data.items.length === 0 ? (
            <EmptyState title="Nothing to show">
              {dueOnly || debounced
                ? 'No chemical with a reorder point matches.'
                : 'No chemical has a reorder point yet: set one on a chemical to see it here.'}
            </EmptyState>
          ) : (
            <>
              <SuggestionsTable
                items={suggestions.data.items}
                currency={suggestions.data.currency}
                windowWeeks={suggestions.data.windowWeeks}
                {...(coordinator ? { selected, onToggle: handleToggle } : {})}
              />
              <p className="text-xs text-ink-600">
                Use is what was drawn by hand and in runs over the last{' '}
                {suggestions.data.windowWeeks} weeks (from the first delivery for newer chemicals),
                counted on {suggestions.data.asOf}. {suggestions.data.packRule}
              </p>
            </>
          )}
        </section>
        <aside className="grid items-start gap-4 lg:grid-cols-2 min-[1800px]:grid-cols-1">
          {mayRequest && !coordinator && <RequestForm />}
          <section
            aria-labelledby="requests-heading"
            className={cn(
              'flex flex-col gap-2',
              coordinator && 'lg:col-span-2 min-[1800px]:col-span-1',
            )}
          >
            <h2 id="requests-heading" className="text-base font-semibold text-ink-900">
              {coordinator ? 'Members’ open requests' : 'Your requests'}
            </h2>
            {openRequests.isPending ? (
              <PageSpinner label="Loading requests…" />
            ) : openRequests.isError ? (
              <ErrorState error={openRequests.error} onRetry={() => void openRequests.refetch()} />
            ) : (
              <RequestsList
                requests={openRequests.data.items}
                mode={coordinator ? 'coordinator' : 'own'}
                emptyText={
                  coordinator
                    ? 'No member is waiting for anything.'
                    : 'You have asked for nothing yet.'
                }
              />
            )}
          </section>
        </aside>
      </div>
    </div>
  );
}
