import { Link, useParams } from 'react-router';
import { ChevronLeft, ClipboardCheck, MapPin } from 'lucide-react';
import {
  flammableStorageLabels,
  liquidClassLabels,
  roomRulesReminder,
  type LabAreaDetail,
  type LabAreaLimit,
} from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { useLabArea } from '../../../components/room-rules/api';
import { LimitBar } from '../../../components/room-rules/limit-bar';
import { labAreaFacts } from '../../../components/room-rules/room-rules-panel';
import { buttonClasses } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { TableScroll } from '../../../components/ui/table-scroll';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { formatLitres } from '../../../lib/format';
import { CountedWaste } from '../components/counted-waste';

const back = (
  <Link
    to={paths.stockLabAreas}
    className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
  >
    <ChevronLeft aria-hidden="true" className="size-4" />
    All lab areas
  </Link>
);

const link = 'text-accent-700 underline underline-offset-2';

function LimitCard({ limit, citation }: { limit: LabAreaLimit; citation: string }) {
  const over = limit.marginLitres < 0;
  return (
    <li className="flex flex-col gap-2 rounded-md border border-ink-200 p-3">
      <h3 className="font-semibold text-ink-900">{limit.label}</h3>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm tabular-nums sm:grid-cols-4">
        <div>
          <dt className="text-xs text-ink-600">Held</dt>
          <dd className="font-semibold">{formatLitres(limit.heldLitres)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-600">Limit</dt>
          <dd className="font-semibold">{formatLitres(limit.limitLitres)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-600">{over ? 'Over by' : 'Margin'}</dt>
          <dd className="font-semibold">{formatLitres(Math.abs(limit.marginLitres))}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-600">Source</dt>
          <dd className="text-xs">{citation}</dd>
        </div>
      </dl>
      <LimitBar label={limit.label} fraction={limit.fractionUsed} status={limit.status} />
      {limit.working.length > 0 && (
        <div className="text-sm text-ink-700">
          <p className="text-xs text-ink-600">How the limit is worked out</p>
          <ol className="list-inside list-decimal tabular-nums">
            {limit.working.map((step, index) => (
              <li key={index}>{step.text}</li>
            ))}
          </ol>
        </div>
      )}
    </li>
  );
}

function ByClassTable({ area }: { area: LabAreaDetail }) {
  if (area.byClass.length === 0) return null;
  return (
    <TableScroll label="Litres by liquid class">
      <table className="w-full text-sm">
        <caption className="mb-1 text-left font-semibold">Litres by liquid class</caption>
        <thead className="text-left text-xs text-ink-600 uppercase">
          <tr>
            <th scope="col" className="py-1 pr-3">
              Class
            </th>
            <th scope="col" className="py-1 pr-3 text-right">
              In cabinets and safety cans
            </th>
            <th scope="col" className="py-1 pr-3 text-right">
              Outside them
            </th>
            <th scope="col" className="py-1 text-right">
              Total
            </th>
          </tr>
        </thead>
        <tbody>
          {area.byClass.map((row) => (
            <tr key={row.liquidClass} className="border-t border-ink-100">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                {liquidClassLabels[row.liquidClass]}
              </th>
              <td className="py-1 pr-3 text-right tabular-nums">
                {formatLitres(row.inStorageLitres)}
              </td>
              <td className="py-1 pr-3 text-right tabular-nums">
                {formatLitres(row.outsideStorageLitres)}
              </td>
              <td className="py-1 text-right font-semibold tabular-nums">
                {formatLitres(row.totalLitres)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}

function CountedContainers({ area }: { area: LabAreaDetail }) {
  return (
    <section aria-labelledby="counted-heading" className="flex flex-col gap-2">
      <h2 id="counted-heading" className="text-base font-semibold">
        Containers counted
      </h2>
      {area.containers.length === 0 ? (
        <p className="text-sm text-ink-600">
          No flammable or combustible liquid is held here, as far as Lotwise can tell.
        </p>
      ) : (
        <TableScroll label="Containers counted">
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-ink-600 uppercase">
              <tr>
                <th scope="col" className="py-1 pr-3">
                  Container
                </th>
                <th scope="col" className="py-1 pr-3">
                  Hazards
                </th>
                <th scope="col" className="py-1 pr-3">
                  Class
                </th>
                <th scope="col" className="py-1 pr-3 text-right">
                  Litres
                </th>
                <th scope="col" className="py-1">
                  Where
                </th>
              </tr>
            </thead>
            <tbody>
              {area.containers.map((c) => (
                <tr key={c.containerId} className="border-t border-ink-100 align-top">
                  <td className="py-1.5 pr-3">
                    <Link to={paths.stockContainer(c.containerId)} className={`font-mono ${link}`}>
                      {c.labelCode}
                    </Link>{' '}
                    <Link to={paths.chemical(c.chemical.id)} className={link}>
                      {c.chemical.name}
                    </Link>
                  </td>
                  <td className="py-1.5 pr-3">
                    <HazardCodes
                      pictograms={c.chemical.ghsPictograms}
                      statements={c.chemical.hazardStatements}
                    />
                  </td>
                  <td className="py-1.5 pr-3 whitespace-nowrap">{c.liquidClass}</td>
                  <td className="py-1.5 pr-3 text-right tabular-nums">{formatLitres(c.litres)}</td>
                  <td className="py-1.5 text-xs">
                    <span className="block">{c.locationPath}</span>
                    <span className="text-ink-600">
                      {c.inStorage && c.storageKind
                        ? `In storage: ${flammableStorageLabels[c.storageKind].toLowerCase()}`
                        : 'Not in approved storage'}
                    </span>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      )}
    </section>
  );
}

export function LabAreaPage() {
  const params = useParams();
  const id = Number(params.id);
  const query = useLabArea(id);

  if (query.isPending) return <PageSpinner label="Adding up the lab area…" />;
  if (query.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        {isApiError(query.error) && query.error.status === 404 ? (
          <Notice tone="warn" title="No such lab area">
            There is no lab area with the number {params.id} — the place may have been unmarked.
          </Notice>
        ) : (
          <ErrorState
            title="The lab area could not be loaded"
            error={query.error}
            onRetry={() => void query.refetch()}
          />
        )}
      </div>
    );
  }
  const area = query.data;
  const citation = area.flammableRuleSet.citation;

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">{area.path}</h1>
          <p className="text-sm text-ink-700">{labAreaFacts(area)}</p>
          <p className="text-sm text-ink-700">
            Limits from{' '}
            <Link to={paths.stockRuleSet(area.flammableRuleSet.id)} className={link}>
              {citation}
            </Link>
            {area.containerSizeRuleSet && (
              <>
                ; container sizes from{' '}
                <Link to={paths.stockRuleSet(area.containerSizeRuleSet.id)} className={link}>
                  {area.containerSizeRuleSet.citation}
                </Link>
              </>
            )}
            .
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link to={paths.stockLocation(area.locationId)} className={buttonClasses('secondary')}>
            <MapPin aria-hidden="true" className="size-4" />
            The place
          </Link>
          <Link to={paths.stockLabAreaInspection(area.id)} className={buttonClasses('secondary')}>
            <ClipboardCheck aria-hidden="true" className="size-4" />
            Inspection summary
          </Link>
        </div>
      </header>

      <Notice tone="info" title="A reminder, not an approval">
        {area.reminder || roomRulesReminder}
      </Notice>

      <section aria-labelledby="limits-heading" className="flex flex-col gap-2">
        <h2 id="limits-heading" className="text-base font-semibold">
          Litres held against each limit
        </h2>
        {area.limits.length === 0 ? (
          <p className="text-sm text-ink-600">This rule set gives no limits for this area.</p>
        ) : (
          <ul className="grid gap-3 lg:grid-cols-2">
            {area.limits.map((limit) => (
              <LimitCard key={limit.key} limit={limit} citation={citation} />
            ))}
          </ul>
        )}
      </section>

      <ByClassTable area={area} />

      {area.storagePlaces.length > 0 && (
        <section aria-labelledby="storage-heading" className="flex flex-col gap-2">
          <h2 id="storage-heading" className="text-base font-semibold">
            Approved storage inside
          </h2>
          <ul className="flex flex-col gap-1 text-sm">
            {area.storagePlaces.map((place) => (
              <li key={place.locationId}>
                <Link to={paths.stockLocation(place.locationId)} className={link}>
                  {place.path}
                </Link>{' '}
                <span className="text-ink-600">
                  ({flammableStorageLabels[place.storageKind].toLowerCase()})
                </span>{' '}
                <span className="tabular-nums">
                  holds {formatLitres(place.heldLitres)}
                  {place.limitLitres !== null && ` of ${formatLitres(place.limitLitres)} allowed`}
                </span>
              </li>
            ))}
          </ul>
        </section>
      )}

      <CountedContainers area={area} />
      <CountedWaste area={area} />

      {area.notCounted.length > 0 && (
        <section aria-labelledby="not-counted-heading" className="flex flex-col gap-2">
          <h2 id="not-counted-heading" className="text-base font-semibold">
            Not counted: class unknown
          </h2>
          <p className="text-sm text-ink-600">
            Lotwise cannot tell these liquids&apos; class, so they are left out of the totals above.
            Add what is missing to the chemical.
          </p>
          <ul className="flex flex-col gap-1 text-sm">
            {area.notCounted.map((c) => (
              <li key={c.containerId}>
                <Link to={paths.stockContainer(c.containerId)} className={`font-mono ${link}`}>
                  {c.labelCode}
                </Link>{' '}
                {c.chemical.name} at {c.locationPath}: {c.reason} —{' '}
                <Link to={paths.chemicalEdit(c.chemical.id)} className={link}>
                  edit {c.chemical.name}
                </Link>
              </li>
            ))}
          </ul>
        </section>
      )}

      {area.containerSizeBreaches.length > 0 && (
        <section aria-labelledby="sizes-heading" className="flex flex-col gap-2">
          <h2 id="sizes-heading" className="text-base font-semibold">
            Containers larger than allowed
          </h2>
          <ul className="flex flex-col gap-1 text-sm">
            {area.containerSizeBreaches.map((b) => (
              <li key={b.containerId}>
                <Link to={paths.stockContainer(b.containerId)} className={`font-mono ${link}`}>
                  {b.labelCode}
                </Link>{' '}
                {b.chemicalName} (Class {b.liquidClass}):{' '}
                <span className="tabular-nums">
                  {formatLitres(b.capacityLitres)}, the largest allowed is{' '}
                  {formatLitres(b.limitLitres)}
                </span>{' '}
                <span className="text-xs text-ink-600">({b.source})</span>
              </li>
            ))}
          </ul>
        </section>
      )}

      <p className="text-xs text-ink-600">{roomRulesReminder}</p>
    </div>
  );
}
