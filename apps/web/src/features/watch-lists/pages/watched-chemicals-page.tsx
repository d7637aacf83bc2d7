import { useState } from 'react';
import { Link } from 'react-router';
import { Download, Eye } from 'lucide-react';
import { addDays } from '@lotwise/chem';
import { todayIso, watchReportQuerySchema, type WatchReportQuery } from '@lotwise/shared';
import { Button, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { TableScroll } from '../../../components/ui/table-scroll';
import { paths } from '../../../config/paths';
import { formatAmount, formatDateTime } from '../../../lib/format';
import { useWatchReport, watchReportCsvUrl } from '../api';

const th = 'px-3 py-2';
const td = 'px-3 py-2';

/** Admin: watched chemicals held now, and their movements in a period, with a CSV export. */
export function WatchedChemicalsPage() {
  const [from, setFrom] = useState(addDays(todayIso(), -90));
  const [to, setTo] = useState(todayIso());
  const [query, setQuery] = useState<WatchReportQuery>({ from, to });
  const [error, setError] = useState<string | null>(null);
  const report = useWatchReport(query);

  function submit(event: React.FormEvent) {
    event.preventDefault();
    const checked = watchReportQuerySchema.safeParse({ from, to });
    if (!checked.success) {
      setError('Give a start and an end date, the end on or after the start.');
      return;
    }
    setError(null);
    setQuery(checked.data);
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="max-w-3xl">
        <h1 className="text-xl font-semibold text-ink-900">Watched chemicals</h1>
        <p className="text-sm text-ink-600">
          Chemicals on the{' '}
          <Link to={paths.adminWatchLists} className="text-accent-700 underline">
            watch lists the lab follows
          </Link>
          : what is held now, and every receipt, draw and move in the period with who did it and
          why.
        </p>
      </div>
      <form onSubmit={submit} className="flex flex-wrap items-end gap-3" noValidate>
        <Field label="From" error={error ?? undefined}>
          {(c) => (
            <Input {...c} type="date" value={from} onChange={(e) => setFrom(e.target.value)} />
          )}
        </Field>
        <Field label="To">
          {(c) => <Input {...c} type="date" value={to} onChange={(e) => setTo(e.target.value)} />}
        </Field>
        <Button type="submit" variant="secondary">
          Show the period
        </Button>
        <a
          href={watchReportCsvUrl(query)}
          className={buttonClasses('secondary')}
          data-testid="watch-report-csv"
        >
          <Download aria-hidden="true" className="size-4" />
          Export CSV (holdings and movements)
        </a>
      </form>
      {report.isPending ? (
        <PageSpinner label="Loading the report…" />
      ) : report.isError ? (
        <ErrorState error={report.error} onRetry={() => void report.refetch()} />
      ) : (
        <>
          <section aria-labelledby="held-heading" className="flex flex-col gap-2">
            <h2 id="held-heading" className="text-base font-semibold">
              Held now
            </h2>
            {report.data.holdings.length === 0 ? (
              <div className="rounded-lg border border-ink-200 bg-white">
                <EmptyState icon={<Eye aria-hidden="true" />} title="Nothing watched is held">
                  No container holds a chemical on a followed list.
                </EmptyState>
              </div>
            ) : (
              <TableScroll className="rounded-lg border border-ink-200 bg-white">
                <table className="w-full text-left text-sm">
                  <caption className="sr-only">Watched chemicals held now</caption>
                  <thead className="bg-ink-50 text-ink-700">
                    <tr>
                      <th scope="col" className={th}>
                        Container
                      </th>
                      <th scope="col" className={th}>
                        Chemical
                      </th>
                      <th scope="col" className={th}>
                        Lists
                      </th>
                      <th scope="col" className={th}>
                        Location
                      </th>
                      <th scope="col" className={`${th} text-right`}>
                        Quantity
                      </th>
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-ink-100">
                    {report.data.holdings.map((h) => (
                      <tr key={h.containerId}>
                        <td className={td}>
                          <Link
                            to={paths.stockContainer(h.containerId)}
                            className="font-mono text-accent-700 underline"
                          >
                            {h.labelCode}
                          </Link>
                        </td>
                        <td className={td}>
                          {h.chemicalName}
                          {h.casNumber && (
                            <span className="ml-1 text-xs text-ink-600 tabular-nums">
                              {h.casNumber}
                            </span>
                          )}
                        </td>
                        <td className={td}>{h.lists}</td>
                        <td className={td}>{h.locationPath}</td>
                        <td className={`${td} text-right whitespace-nowrap tabular-nums`}>
                          {formatAmount(h.quantity, h.unit)}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </TableScroll>
            )}
          </section>
          <section aria-labelledby="moves-heading" className="flex flex-col gap-2">
            <h2 id="moves-heading" className="text-base font-semibold">
              Movements from {query.from} to {query.to}
            </h2>
            {report.data.movements.length === 0 ? (
              <p className="text-sm text-ink-600">No movements in this period.</p>
            ) : (
              <TableScroll className="rounded-lg border border-ink-200 bg-white">
                <table className="w-full text-left text-sm">
                  <caption className="sr-only">
                    Movements of watched chemicals in the period
                  </caption>
                  <thead className="bg-ink-50 text-ink-700">
                    <tr>
                      <th scope="col" className={th}>
                        When
                      </th>
                      <th scope="col" className={th}>
                        Who
                      </th>
                      <th scope="col" className={th}>
                        What
                      </th>
                      <th scope="col" className={th}>
                        Container
                      </th>
                      <th scope="col" className={`${th} text-right`}>
                        Amount
                      </th>
                      <th scope="col" className={th}>
                        Why
                      </th>
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-ink-100">
                    {report.data.movements.map((m) => (
                      <tr key={m.entryId} className="align-top">
                        <td className={`${td} whitespace-nowrap`}>{formatDateTime(m.at)}</td>
                        <td className={td}>{m.userName || '—'}</td>
                        <td className={td}>{m.reason}</td>
                        <td className={td}>
                          <span className="font-mono">{m.labelCode}</span> {m.chemicalName}
                        </td>
                        <td className={`${td} text-right whitespace-nowrap tabular-nums`}>
                          {formatAmount(m.delta, m.unit)}
                        </td>
                        <td className={td}>{m.note || '—'}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </TableScroll>
            )}
          </section>
          <Notice tone="info">{report.data.reminder}</Notice>
        </>
      )}
    </div>
  );
}
