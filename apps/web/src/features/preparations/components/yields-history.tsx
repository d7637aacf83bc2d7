import { lazy, Suspense } from 'react';
import { Link } from 'react-router';
import { paths } from '../../../config/paths';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { formatDate, formatPercent } from '../../../lib/format';
import { useProcedureRuns } from '../api';
import { Mass } from './rounded';
import { YieldText } from './yield-text';

const YieldsChart = lazy(() => import('./yields-chart'));

/** Yields of a procedure's recorded runs against its expected yield: chart, summary, table. */
export function YieldsHistory({ procedureId }: { procedureId: number }) {
  const history = useProcedureRuns(procedureId);
  const stats = history.data?.stats;
  return (
    <section
      aria-labelledby="yields-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="yields-heading" className="text-base font-semibold">
        Yields over runs
      </h2>
      {history.isPending ? (
        <PageSpinner label="Loading the runs…" />
      ) : history.isError ? (
        <ErrorState
          title="The runs could not be loaded"
          error={history.error}
          onRetry={() => void history.refetch()}
        />
      ) : history.data.runs.length === 0 || !stats ? (
        <p className="text-sm text-ink-600">No run of this procedure has been recorded yet.</p>
      ) : (
        <figure className="flex flex-col gap-2">
          {/* Purified and crude yields are never mixed in one figure. */}
          <figcaption className="flex flex-col gap-1 text-sm text-ink-700">
            <span>
              {stats.count} recorded {stats.count === 1 ? 'run' : 'runs'}.{' '}
              {stats.purifiedCount > 0 ? (
                <>
                  Purified yield over {stats.purifiedCount}{' '}
                  {stats.purifiedCount === 1 ? 'run' : 'runs'}: mean{' '}
                  <strong>{formatPercent(stats.meanPercentYield)}</strong> (lowest{' '}
                  {formatPercent(stats.minPercentYield)}, highest{' '}
                  {formatPercent(stats.maxPercentYield)}) against an expected{' '}
                  {formatPercent(history.data.procedure.expectedYieldPercent)}.
                  {stats.aboveHundredCount > 0 &&
                    ` ${stats.aboveHundredCount} above 100 % (probably wet or impure).`}
                </>
              ) : (
                'No purified product has been put into stock yet.'
              )}
            </span>
            {stats.crude.count > 0 && (
              <span data-testid="crude-stats">
                Crude yield, counted apart, over {stats.crude.count}{' '}
                {stats.crude.count === 1 ? 'run' : 'runs'}: mean{' '}
                {formatPercent(stats.crude.meanPercentYield)} (lowest{' '}
                {formatPercent(stats.crude.minPercentYield)}, highest{' '}
                {formatPercent(stats.crude.maxPercentYield)}).
                {stats.crude.aboveHundredCount > 0 &&
                  ` ${stats.crude.aboveHundredCount} above 100 % (probably wet or impure).`}
              </span>
            )}
          </figcaption>
          <Suspense fallback={<PageSpinner label="Drawing the chart…" />}>
            <YieldsChart
              runs={history.data.runs}
              expectedYieldPercent={history.data.procedure.expectedYieldPercent}
            />
          </Suspense>
          <table className="w-full text-sm">
            <caption className="sr-only">Recorded runs and their yields</caption>
            <thead className="text-left text-xs text-ink-600 uppercase">
              <tr className="border-b border-ink-200">
                <th scope="col" className="py-1.5 pr-3 font-medium">
                  Run
                </th>
                <th scope="col" className="py-1.5 pr-3 font-medium">
                  Performed
                </th>
                <th scope="col" className="py-1.5 pr-3 font-medium">
                  By
                </th>
                <th scope="col" className="py-1.5 pr-3 text-right font-medium">
                  Scale
                </th>
                <th scope="col" className="py-1.5 pr-3 text-right font-medium">
                  Theoretical
                </th>
                <th scope="col" className="py-1.5 pr-3 text-right font-medium">
                  Obtained
                </th>
                <th scope="col" className="py-1.5 pr-3 text-right font-medium">
                  Crude yield
                </th>
                <th scope="col" className="py-1.5 text-right font-medium">
                  Purified yield
                </th>
              </tr>
            </thead>
            <tbody>
              {history.data.runs.map((run) => (
                <tr key={run.id} className="border-b border-ink-100 last:border-b-0">
                  <td className="py-1.5 pr-3">
                    <Link
                      to={paths.run(run.id)}
                      className="text-accent-700 underline-offset-2 hover:underline"
                    >
                      Run #{run.id}
                    </Link>
                  </td>
                  <td className="py-1.5 pr-3 whitespace-nowrap">{formatDate(run.performedOn)}</td>
                  <td className="py-1.5 pr-3">{run.performedBy?.displayName ?? '—'}</td>
                  <td className="py-1.5 pr-3 text-right tabular-nums">× {run.scaleFactor}</td>
                  <td className="py-1.5 pr-3 text-right">
                    <Mass g={run.theoreticalYieldG} />
                  </td>
                  <td className="py-1.5 pr-3 text-right">
                    <Mass g={run.productMassG} />
                  </td>
                  <td className="py-1.5 pr-3 text-right" title={run.crudeYieldFlag ?? undefined}>
                    <YieldText percent={run.crudePercentYield} />
                  </td>
                  <td className="py-1.5 text-right" title={run.yieldFlag ?? undefined}>
                    <YieldText percent={run.percentYield} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </figure>
      )}
    </section>
  );
}
