import { Link } from 'react-router';
import { ArrowLeftRight, CircleCheck, MapPin, ShieldAlert } from 'lucide-react';
import { safetyDeferral, storageGroups, type ConflictContainer } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useSegregationConflicts } from '../api';

function ContainerLinks({
  containers,
  withGroup,
}: {
  containers: readonly ConflictContainer[];
  withGroup?: boolean;
}) {
  return (
    <ul className="flex flex-col gap-0.5 text-sm">
      {containers.map((c) => (
        <li key={c.id}>
          <Link
            to={paths.stockContainer(c.id)}
            className="font-mono text-accent-700 underline-offset-2 hover:underline"
          >
            {c.labelCode}
          </Link>{' '}
          <span className="text-ink-800">{c.chemicalName}</span>
          {withGroup && (
            <span className="ml-2 text-xs text-ink-600">
              <StorageGroupLabel group={c.storageGroup} />
            </span>
          )}
        </li>
      ))}
    </ul>
  );
}

export function SegregationPage() {
  const conflicts = useSegregationConflicts();

  return (
    <div className="flex flex-col gap-5">
      <header>
        <h1 className="text-xl font-semibold text-ink-900">Storage conflicts</h1>
        <p className="text-sm text-ink-600">
          Places that hold storage groups which should be kept apart, with the reason and where the
          rule comes from — and containers put somewhere not meant for their group.
        </p>
      </header>
      <SafetyCaution />

      {conflicts.isPending ? (
        <PageSpinner label="Checking every location…" />
      ) : conflicts.isError ? (
        <ErrorState
          title="The storage check could not be loaded"
          error={conflicts.error}
          onRetry={() => void conflicts.refetch()}
        />
      ) : (
        <>
          {conflicts.data.notice && conflicts.data.notice !== safetyDeferral && (
            <p className="text-sm text-ink-700">{conflicts.data.notice}</p>
          )}
          {conflicts.data.items.length === 0 ? (
            <p className="flex items-center gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3 text-sm text-ink-800">
              <CircleCheck aria-hidden="true" className="size-4 text-ok-700" />
              No location holds groups that Lotwise’s table says to keep apart. This is a reminder
              list, not a safety approval.
            </p>
          ) : (
            <>
              <p className="text-sm font-medium text-ink-800">
                {formatCount(conflicts.data.total)}{' '}
                {conflicts.data.total === 1 ? 'place needs' : 'places need'} a look.
              </p>
              <ul className="flex flex-col gap-4">
                {conflicts.data.items.map((conflict) => (
                  <li
                    key={conflict.location.id}
                    className="rounded-lg border border-warn-200 bg-white"
                  >
                    <h2 className="flex items-center gap-2 border-b border-warn-200 bg-warn-50 px-4 py-2 text-base font-semibold text-ink-900">
                      <MapPin aria-hidden="true" className="size-4 text-warn-700" />
                      <Link
                        to={paths.stockLocation(conflict.location.id)}
                        className="underline-offset-2 hover:underline"
                      >
                        {conflict.location.path}
                      </Link>
                    </h2>
                    <div className="flex flex-col gap-4 px-4 py-3">
                      {conflict.pairs.map((pair) => (
                        <section
                          key={pair.groups.join('|')}
                          aria-label={`${pair.groups.join(' and ')} at ${conflict.location.path}`}
                          className="flex flex-col gap-2"
                        >
                          <p className="flex flex-wrap items-center gap-2 text-sm font-semibold text-ink-900">
                            <ShieldAlert aria-hidden="true" className="size-4 text-warn-700" />
                            <StorageGroupLabel group={pair.groups[0]} />
                            <span className="inline-flex items-center gap-1 font-normal text-ink-600">
                              <ArrowLeftRight aria-hidden="true" className="size-4" />
                              keep apart from
                            </span>
                            <StorageGroupLabel group={pair.groups[1]} />
                          </p>
                          <p className="text-sm text-ink-800">
                            {pair.reason}{' '}
                            <span className="text-ink-600">(source: {pair.source})</span>
                          </p>
                          <div className="grid gap-3 sm:grid-cols-2">
                            {([pair.first, pair.second] as const).map((side, index) => (
                              <div key={index}>
                                <p className="text-xs font-semibold tracking-wide text-ink-600 uppercase">
                                  {storageGroups[pair.groups[index]!].label} here
                                </p>
                                <ContainerLinks containers={side} />
                              </div>
                            ))}
                          </div>
                        </section>
                      ))}
                      {conflict.mismatches.length > 0 && (
                        <section aria-label={`Not meant for ${conflict.location.path}`}>
                          <p className="text-sm font-semibold text-ink-900">
                            Stored in a place meant for other groups
                          </p>
                          <ContainerLinks containers={conflict.mismatches} withGroup />
                        </section>
                      )}
                    </div>
                  </li>
                ))}
              </ul>
            </>
          )}
        </>
      )}
    </div>
  );
}
