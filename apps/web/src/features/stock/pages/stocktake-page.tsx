import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { ChevronLeft, CircleCheck, ClipboardList, PackageX, Scale } from 'lucide-react';
import {
  stocktakeCreateSchema,
  type Stocktake,
  type StocktakeCreate,
  type StocktakeExpected,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { AmountInput } from '../../../components/ui/amount-input';
import { Checkbox, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { formatAmount, formatCount } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { paths } from '../../../config/paths';
import { useCommitStocktake, useStocktakeExpected } from '../api';

type Outcome = 'confirmed' | 'counted' | 'missing';
interface Count {
  outcome?: Outcome;
  counted: string;
}
type Expected = StocktakeExpected['containers'][number];

const outcomeLabels: Record<Outcome, string> = {
  confirmed: 'As recorded',
  counted: 'Counted',
  missing: 'Missing',
};

function CountRow({
  container,
  count,
  onChange,
}: {
  container: Expected;
  count: Count;
  onChange: (count: Count) => void;
}) {
  const name = `outcome-${container.id}`;
  const countedValue = parseDecimal(count.counted);
  const badNumber =
    count.outcome === 'counted' &&
    (countedValue === null || Number.isNaN(countedValue) || countedValue < 0);
  return (
    <li className="grid gap-2 border-b border-ink-100 py-3 md:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
      <div>
        <p>
          <Link
            to={paths.stockContainer(container.id)}
            className="font-mono font-medium text-accent-700 underline-offset-2 hover:underline"
          >
            {container.labelCode}
          </Link>{' '}
          <span className="font-medium text-ink-900">{container.chemicalName}</span>
        </p>
        <p className="text-sm text-ink-600 tabular-nums">
          Recorded {formatAmount(container.quantity, container.unit)}
          {container.tareMass !== null && ` · tare ${formatAmount(container.tareMass, 'g')}`}
          {' · '}
          {container.locationPath}
        </p>
      </div>
      <fieldset className="flex flex-wrap items-center gap-2">
        <legend className="sr-only">
          What you found for {container.labelCode} ({container.chemicalName})
        </legend>
        {(['confirmed', 'counted', 'missing'] as const).map((outcome) => (
          <label
            key={outcome}
            className={cn(
              'flex cursor-pointer items-center gap-1.5 rounded-md border px-2.5 py-1 text-sm has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent-600',
              count.outcome === outcome
                ? 'border-accent-600 bg-accent-50 font-medium text-accent-800'
                : 'border-ink-300 bg-white text-ink-700',
            )}
          >
            <input
              type="radio"
              name={name}
              className="sr-only"
              checked={count.outcome === outcome}
              onChange={() => onChange({ ...count, outcome })}
            />
            {outcome === 'confirmed' && <CircleCheck aria-hidden="true" className="size-4" />}
            {outcome === 'counted' && <Scale aria-hidden="true" className="size-4" />}
            {outcome === 'missing' && <PackageX aria-hidden="true" className="size-4" />}
            {outcomeLabels[outcome]}
          </label>
        ))}
        {count.outcome === 'counted' && (
          <span className="flex items-center gap-1.5">
            <AmountInput
              aria-label={`Counted amount of ${container.labelCode} in ${container.unit}`}
              aria-invalid={badNumber || undefined}
              className="w-28 tabular-nums"
              value={count.counted}
              onChange={(event) => onChange({ ...count, counted: event.target.value })}
            />
            <span className="text-sm text-ink-700">{container.unit}</span>
          </span>
        )}
        {!count.outcome && <span className="text-xs text-ink-600">Not counted yet</span>}
      </fieldset>
    </li>
  );
}

export function StocktakePage() {
  const params = useParams();
  const locationId = Number(params.id);
  const [includeSublocations, setIncludeSublocations] = useState(true);
  const expected = useStocktakeExpected(locationId, includeSublocations);
  const commit = useCommitStocktake();
  const [counts, setCounts] = useState<Record<number, Count>>({});
  const [note, setNote] = useState('');
  const [step, setStep] = useState<'count' | 'review'>('count');
  const [result, setResult] = useState<Stocktake | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const back = (
    <Link
      to={paths.stockLocation(locationId)}
      className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      Back to the location
    </Link>
  );

  if (expected.isPending) return <PageSpinner label="Loading what should be there…" />;
  if (expected.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The stocktake could not be started"
          error={expected.error}
          onRetry={() => void expected.refetch()}
        />
      </div>
    );
  }
  const { location, containers } = expected.data;
  const countOf = (id: number): Count => counts[id] ?? { counted: '' };
  const confirmed = containers.filter((c) => countOf(c.id).outcome === 'confirmed');
  const corrected = containers.filter((c) => countOf(c.id).outcome === 'counted');
  const missing = containers.filter((c) => countOf(c.id).outcome === 'missing');
  const notCounted = containers.filter((c) => !countOf(c.id).outcome);

  function buildBody(): StocktakeCreate {
    return {
      locationId,
      includeSublocations,
      note: note.trim(),
      counts: containers.flatMap((c): StocktakeCreate['counts'] => {
        const count = countOf(c.id);
        if (!count.outcome) return [];
        if (count.outcome === 'counted') {
          const value = parseDecimal(count.counted);
          return [
            {
              containerId: c.id,
              outcome: 'counted' as const,
              countedQuantity: value === null ? undefined : value,
              unit: c.unit,
            },
          ];
        }
        return [{ containerId: c.id, outcome: count.outcome }];
      }),
    };
  }

  function handleReview() {
    const checked = stocktakeCreateSchema.safeParse(buildBody());
    if (!checked.success) {
      const issue = checked.error.issues[0];
      const index = issue?.path[1];
      const container =
        typeof index === 'number'
          ? containers.filter((c) => countOf(c.id).outcome)[index]
          : undefined;
      setProblem(
        container
          ? `${container.labelCode}: the counted amount ${issue?.message ?? 'is not right'}.`
          : (issue?.message ?? 'Something is not filled in.').replace(/^count/, 'Count'),
      );
      return;
    }
    setProblem(null);
    setStep('review');
  }

  function handleCommit() {
    commit.mutate(buildBody(), { onSuccess: setResult });
  }

  if (result) {
    const s = result.summary;
    return (
      <div className="flex max-w-3xl flex-col gap-4">
        {back}
        <h1 className="text-xl font-semibold text-ink-900">Stocktake of {location.path} saved</h1>
        <Notice tone="ok" title="All counts were written in one go">
          {formatCount(s.confirmed)} confirmed, {formatCount(s.corrected)} corrected (adjusted in
          the ledger), {formatCount(s.missing)} marked missing (disposed),{' '}
          {formatCount(s.notCounted)} not counted and left as they were.
        </Notice>
        <Link to={paths.stockLocation(locationId)} className="text-sm text-accent-700 underline">
          Back to {location.name}
        </Link>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header>
        <h1 className="flex items-center gap-2 text-xl font-semibold text-ink-900">
          <ClipboardList aria-hidden="true" className="size-5 text-accent-600" />
          Stocktake: {location.path}
        </h1>
        <p className="text-sm text-ink-600">
          Walk the place and check each container against what Lotwise has recorded. Nothing is
          saved until you confirm the summary.
        </p>
      </header>

      {step === 'count' ? (
        <>
          <label className="flex items-center gap-2 text-sm">
            <Checkbox
              checked={includeSublocations}
              onChange={(event) => {
                setIncludeSublocations(event.target.checked);
                setCounts({});
              }}
            />
            Include the places inside {location.name}
          </label>
          {containers.length === 0 ? (
            <EmptyState icon={<ClipboardList />} title="Nothing is recorded here">
              There are no containers to count at {location.path}.
            </EmptyState>
          ) : (
            <>
              <div className="flex flex-wrap items-center gap-2">
                <Button
                  size="sm"
                  onClick={() =>
                    setCounts((current) => {
                      const next = { ...current };
                      for (const c of containers) {
                        if (!next[c.id]?.outcome)
                          next[c.id] = { counted: '', outcome: 'confirmed' };
                      }
                      return next;
                    })
                  }
                  icon={<CircleCheck aria-hidden="true" className="size-4" />}
                >
                  Mark the rest as recorded
                </Button>
                <span className="text-sm text-ink-600 tabular-nums">
                  {formatCount(containers.length - notCounted.length)} of{' '}
                  {formatCount(containers.length)} checked
                </span>
              </div>
              <ul
                aria-label="Containers to count"
                className="rounded-lg border border-ink-200 bg-white px-4"
              >
                {containers.map((container) => (
                  <CountRow
                    key={container.id}
                    container={container}
                    count={countOf(container.id)}
                    onChange={(count) =>
                      setCounts((current) => ({ ...current, [container.id]: count }))
                    }
                  />
                ))}
              </ul>
              {problem && (
                <Notice tone="danger" title="Check the counts">
                  {problem}
                </Notice>
              )}
              <div>
                <Button variant="primary" onClick={handleReview}>
                  Review before saving
                </Button>
              </div>
            </>
          )}
        </>
      ) : (
        <section aria-labelledby="review-heading" className="flex max-w-3xl flex-col gap-4">
          <h2 id="review-heading" className="text-base font-semibold">
            Summary
          </h2>
          <ul className="grid gap-2 text-sm sm:grid-cols-2">
            <li className="flex items-center gap-2">
              <CircleCheck aria-hidden="true" className="size-4 text-ok-700" />
              {formatCount(confirmed.length)} as recorded — no change
            </li>
            <li className="flex items-center gap-2">
              <Scale aria-hidden="true" className="size-4 text-accent-600" />
              {formatCount(corrected.length)} counted — written as adjustments
            </li>
            <li className="flex items-center gap-2">
              <PackageX aria-hidden="true" className="size-4 text-danger-700" />
              {formatCount(missing.length)} missing — marked disposed
            </li>
            <li className="flex items-center gap-2 text-ink-600">
              {formatCount(notCounted.length)} not counted — left as they are
            </li>
          </ul>
          {corrected.length > 0 && (
            <table className="w-full text-sm">
              <caption className="mb-1 text-left font-semibold">Counted amounts</caption>
              <thead className="text-left text-xs text-ink-600 uppercase">
                <tr>
                  <th scope="col">Container</th>
                  <th scope="col" className="text-right">
                    Recorded
                  </th>
                  <th scope="col" className="text-right">
                    Counted
                  </th>
                </tr>
              </thead>
              <tbody>
                {corrected.map((c) => (
                  <tr key={c.id} className="border-t border-ink-100">
                    <td className="py-1">
                      <span className="font-mono">{c.labelCode}</span> {c.chemicalName}
                    </td>
                    <td className="py-1 text-right tabular-nums">
                      {formatAmount(c.quantity, c.unit)}
                    </td>
                    <td className="py-1 text-right font-semibold tabular-nums">
                      {formatAmount(parseDecimal(countOf(c.id).counted), c.unit)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {missing.length > 0 && (
            <div className="text-sm">
              <p className="font-semibold">Missing, to be marked disposed</p>
              <ul className="list-disc pl-5">
                {missing.map((c) => (
                  <li key={c.id}>
                    <span className="font-mono">{c.labelCode}</span> {c.chemicalName}
                  </li>
                ))}
              </ul>
            </div>
          )}
          <div className="flex flex-col gap-1">
            <label htmlFor="stocktake-note" className="text-sm font-medium text-ink-800">
              Note <span className="font-normal text-ink-600">(optional)</span>
            </label>
            <Textarea
              id="stocktake-note"
              rows={2}
              value={note}
              onChange={(e) => setNote(e.target.value)}
            />
          </div>
          {commit.isError && (
            <Notice tone="danger" title="Not saved">
              {errorMessage(commit.error)} Nothing was written; your counts are still here.
            </Notice>
          )}
          <div className="flex gap-2">
            <Button onClick={() => setStep('count')} disabled={commit.isPending}>
              Back to counting
            </Button>
            <Button variant="primary" onClick={handleCommit} busy={commit.isPending}>
              Save stocktake
            </Button>
          </div>
        </section>
      )}
    </div>
  );
}
