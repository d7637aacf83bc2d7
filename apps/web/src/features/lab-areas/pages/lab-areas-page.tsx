import { Link } from 'react-router';
import { Flame } from 'lucide-react';
import { countOf, roomRulesReminder } from '@lotwise/shared';
import { useLabAreas } from '../../../components/room-rules/api';
import { LimitBar } from '../../../components/room-rules/limit-bar';
import { labAreaFacts } from '../../../components/room-rules/room-rules-panel';
import { worstLimit } from '../../../components/room-rules/lab-unit-classes';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { TableScroll } from '../../../components/ui/table-scroll';
import { paths } from '../../../config/paths';
import { formatLitres } from '../../../lib/format';

export function LabAreasPage() {
  const areas = useLabAreas();

  return (
    <div className="flex flex-col gap-5">
      <header>
        <h1 className="text-xl font-semibold text-ink-900">Lab areas</h1>
        <p className="text-sm text-ink-600">
          Rooms marked as lab units or control areas, with the flammable and combustible liquids
          they hold against the limits of their rule set. Mark a room on its location page.
        </p>
      </header>

      {areas.isPending ? (
        <PageSpinner label="Adding up the lab areas…" />
      ) : areas.isError ? (
        <ErrorState
          title="The lab areas could not be loaded"
          error={areas.error}
          onRetry={() => void areas.refetch()}
        />
      ) : areas.data.items.length === 0 ? (
        <EmptyState icon={<Flame />} title="No lab areas yet">
          Open a room under{' '}
          <Link to={paths.stockLocations} className="text-accent-700 underline">
            Locations
          </Link>{' '}
          and choose “Mark as a lab area” to count its liquids against a rule set.
        </EmptyState>
      ) : (
        <TableScroll label="Lab areas">
          <table className="w-full text-sm">
            <caption className="sr-only">Lab areas and the limit each uses most of</caption>
            <thead className="text-left text-xs text-ink-600 uppercase">
              <tr>
                <th scope="col" className="py-1 pr-3">
                  Area
                </th>
                <th scope="col" className="py-1 pr-3">
                  Most used limit
                </th>
                <th scope="col" className="py-1 pr-3">
                  Rule set
                </th>
                <th scope="col" className="py-1">
                  To look at
                </th>
              </tr>
            </thead>
            <tbody>
              {areas.data.items.map((area) => {
                const worst = worstLimit(area);
                return (
                  <tr key={area.id} className="border-t border-ink-100 align-top">
                    <td className="py-2 pr-3">
                      <Link
                        to={paths.stockLabArea(area.id)}
                        className="font-medium text-accent-700 underline-offset-2 hover:underline"
                      >
                        {area.path}
                      </Link>
                      <p className="text-xs text-ink-600">{labAreaFacts(area)}</p>
                    </td>
                    <td className="min-w-56 py-2 pr-3">
                      {worst ? (
                        <LimitBar
                          label={`${area.name}: ${worst.label}`}
                          fraction={worst.fractionUsed}
                          status={worst.status}
                          detail={`${formatLitres(worst.heldLitres)} of ${formatLitres(worst.limitLitres)}`}
                        />
                      ) : (
                        <span className="text-ink-600">No limits in this rule set</span>
                      )}
                      {worst && <p className="text-xs text-ink-600">{worst.label}</p>}
                    </td>
                    <td className="py-2 pr-3 text-xs text-ink-700">
                      {area.flammableRuleSet.citation}
                    </td>
                    <td className="py-2 text-xs text-ink-700">
                      {area.notCountedCount === 0 && area.containerSizeBreachCount === 0
                        ? '—'
                        : [
                            area.notCountedCount > 0
                              ? `${countOf(area.notCountedCount, 'container')} not counted`
                              : null,
                            area.containerSizeBreachCount > 0
                              ? `${countOf(area.containerSizeBreachCount, 'container')} too large`
                              : null,
                          ]
                            .filter(Boolean)
                            .join('; ')}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </TableScroll>
      )}
      <p className="text-xs text-ink-600">{roomRulesReminder}</p>
    </div>
  );
}
