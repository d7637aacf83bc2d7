import { lazy, Suspense, useId, useState } from 'react';
import type { StockHistory } from '@lotwise/shared';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { PageSpinner } from '../../../components/ui/spinner';
import { formatAmount, formatDate } from '../../../lib/format';
import { useStockHistory } from '../api';

const StockHistoryChart = lazy(() => import('./stock-history-chart'));

const windows = [
  { days: 90, label: 'Last 3 months' },
  { days: 365, label: 'Last 12 months' },
  { days: 730, label: 'Last 2 years' },
];

function summary(history: StockHistory): string {
  const first = history.points[0];
  const last = history.points[history.points.length - 1];
  if (!first || !last) return 'No stock was recorded in this period.';
  if (first === last) {
    return `${formatAmount(first.total, history.unit)} held on ${formatDate(first.date)}; no change since.`;
  }
  return `${formatAmount(first.total, history.unit)} held on ${formatDate(first.date)}, ${formatAmount(last.total, history.unit)} on ${formatDate(last.date)}.`;
}

/** Stock of one chemical over time, from its ledger: a chart, a summary and the numbers. */
export function StockHistorySection({ chemicalId, name }: { chemicalId: number; name: string }) {
  const [days, setDays] = useState(365);
  const history = useStockHistory(chemicalId, days);
  const selectId = useId();
  const captionId = useId();

  return (
    <section
      aria-labelledby="history-heading"
      className="rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <div className="mb-2 flex flex-wrap items-end justify-between gap-3">
        <h2 id="history-heading" className="text-base font-semibold">
          Stock over time
        </h2>
        <div className="flex items-center gap-2 text-sm">
          <label htmlFor={selectId}>Period</label>
          <Select
            id={selectId}
            className="w-40"
            value={days}
            onChange={(event) => setDays(Number(event.target.value))}
          >
            {windows.map((w) => (
              <option key={w.days} value={w.days}>
                {w.label}
              </option>
            ))}
          </Select>
        </div>
      </div>
      {history.isPending ? (
        <PageSpinner label="Loading the history…" />
      ) : history.isError ? (
        <ErrorState
          title="The history could not be loaded"
          error={history.error}
          onRetry={() => void history.refetch()}
        />
      ) : (
        <figure aria-labelledby={captionId} className="flex flex-col gap-2">
          <figcaption id={captionId} className="text-sm text-ink-700">
            Total of {name} held in all containers at the end of each day with a change (
            {history.data.unit}). {summary(history.data)}
          </figcaption>
          {history.data.points.length > 0 && (
            <Suspense fallback={<PageSpinner label="Drawing the chart…" />}>
              <StockHistoryChart history={history.data} />
            </Suspense>
          )}
          {history.data.points.length > 0 && (
            <details className="text-sm">
              <summary className="cursor-pointer text-accent-700">
                Show the numbers as a table
              </summary>
              <table className="mt-2 w-full max-w-md text-sm">
                <caption className="sr-only">Stock of {name} by day</caption>
                <thead className="text-left text-xs text-ink-600 uppercase">
                  <tr>
                    <th scope="col" className="py-1">
                      Date
                    </th>
                    <th scope="col" className="py-1 text-right">
                      Held
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {history.data.points.map((point) => (
                    <tr key={point.date} className="border-t border-ink-100">
                      <td className="py-1 tabular-nums">{formatDate(point.date)}</td>
                      <td className="py-1 text-right tabular-nums">
                        {formatAmount(point.total, history.data.unit)}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </details>
          )}
        </figure>
      )}
    </section>
  );
}
