import { useState } from 'react';
import { Link } from 'react-router';
import { BookLock, ChevronDown, Eye } from 'lucide-react';
import { thresholdText, watchListReminder, type WatchList } from '@lotwise/shared';
import { Badge } from '../../../components/ui/badge';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { TableScroll } from '../../../components/ui/table-scroll';
import { paths } from '../../../config/paths';
import { errorMessage } from '../../../lib/api-client';
import { formatCount } from '../../../lib/format';
import { useChooseWatchList, useWatchList, useWatchLists } from '../api';
import { OwnListForm } from '../components/own-list-form';

function Entries({ list }: { list: WatchList }) {
  const [open, setOpen] = useState(false);
  const detail = useWatchList(list.id, open);
  return (
    <details onToggle={(event) => setOpen(event.currentTarget.open)} className="text-sm">
      <summary className="inline-flex cursor-pointer items-center gap-1 text-accent-700">
        <ChevronDown aria-hidden="true" className="size-4" />
        {formatCount(list.entryCount)} {list.entryCount === 1 ? 'substance' : 'substances'}
      </summary>
      {detail.isPending ? (
        <p className="py-2 text-ink-600">Loading…</p>
      ) : detail.isError ? (
        <p className="py-2 text-danger-700">{errorMessage(detail.error)}</p>
      ) : (
        <TableScroll className="mt-2 rounded border border-ink-200">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Substances on {list.name}</caption>
            <thead className="bg-ink-50 text-ink-700">
              <tr>
                <th scope="col" className="px-2 py-1.5">
                  Substance
                </th>
                <th scope="col" className="px-2 py-1.5">
                  CAS RN
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Applies
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Action required
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Source
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink-100">
              {detail.data.entries.map((entry) => (
                <tr key={entry.id} className="align-top">
                  <td className="px-2 py-1.5 font-medium">{entry.substance}</td>
                  <td className="px-2 py-1.5 whitespace-nowrap tabular-nums">{entry.casNumber}</td>
                  <td className="px-2 py-1.5">{thresholdText(entry)}</td>
                  <td className="px-2 py-1.5 text-ink-700">{entry.action}</td>
                  <td className="px-2 py-1.5 text-ink-700">{entry.source}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      )}
    </details>
  );
}

/** Admin: the watch lists Lotwise knows, which ones the lab follows, and what is on each. */
export function WatchListsPage() {
  const lists = useWatchLists();
  const choose = useChooseWatchList();

  return (
    <div className="flex flex-col gap-4">
      <div className="max-w-3xl">
        <h1 className="text-xl font-semibold text-ink-900">Watch lists</h1>
        <p className="text-sm text-ink-600">
          Substances a regulator restricts or asks to be reported. Tick the lists that apply to your
          lab: their chemicals get a badge wherever their hazards show, orders of them need a
          manager’s approval with a reason, and receiving or drawing them asks why. The{' '}
          <Link to={paths.adminWatchedChemicals} className="text-accent-700 underline">
            watched-chemicals report
          </Link>{' '}
          lists what you hold and what moved.
        </p>
      </div>
      <Notice tone="info" title="A reminder, not legal advice">
        {watchListReminder}
      </Notice>
      {choose.isError && (
        <Notice tone="danger" title="Not changed">
          {errorMessage(choose.error)}
        </Notice>
      )}
      {lists.isPending ? (
        <PageSpinner label="Loading the watch lists…" />
      ) : lists.isError ? (
        <ErrorState error={lists.error} onRetry={() => void lists.refetch()} />
      ) : (
        <ul className="flex flex-col gap-3">
          {lists.data.items.map((list) => (
            <li
              key={list.id}
              className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
              data-testid="watch-list"
            >
              <div className="flex flex-wrap items-start justify-between gap-3">
                <div className="min-w-0">
                  <h2 className="text-base font-semibold text-ink-900">{list.name}</h2>
                  <p className="text-sm text-ink-700">
                    {list.jurisdiction} · {list.source}
                    {list.edition && ` · ${list.edition}`}
                  </p>
                  {list.notes && <p className="mt-1 text-xs text-ink-600">{list.notes}</p>}
                </div>
                <div className="flex items-center gap-3">
                  {list.chosen ? (
                    <Badge tone="warn" icon={<Eye aria-hidden="true" />}>
                      followed
                    </Badge>
                  ) : (
                    <Badge tone="neutral" icon={<BookLock aria-hidden="true" />}>
                      not followed
                    </Badge>
                  )}
                  <label className="inline-flex items-center gap-2 text-sm font-medium text-ink-800">
                    <input
                      type="checkbox"
                      className="size-4 accent-accent-600"
                      checked={list.chosen}
                      disabled={choose.isPending}
                      onChange={(event) =>
                        choose.mutate({ id: list.id, chosen: event.target.checked })
                      }
                    />
                    The lab follows this list
                  </label>
                </div>
              </div>
              <Entries list={list} />
            </li>
          ))}
        </ul>
      )}
      <section
        aria-labelledby="own-list-heading"
        className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
      >
        <h2 id="own-list-heading" className="text-base font-semibold">
          Your regulator’s own list
        </h2>
        <p className="text-sm text-ink-600">
          Where your authority restricts other substances or other concentrations, enter its list
          here, with the source of every row. The lab follows it once saved.
        </p>
        <OwnListForm />
      </section>
    </div>
  );
}
