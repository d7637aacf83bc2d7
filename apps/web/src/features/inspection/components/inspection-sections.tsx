import type { ReactNode } from 'react';
import {
  labAreaStatusLabels,
  liquidClassLabels,
  storageGroups,
  type InspectionSummary,
} from '@lotwise/shared';
import { formatAmount, formatDate, formatFixed, formatLitres } from '../../../lib/format';

/**
 * The four sections of the inspection summary. Each shows another capability's figures as
 * the server sent them and names what they were measured against.
 */

const cell = 'border-b border-ink-100 px-2 py-1 text-left align-top print:px-1 print:py-0.5';
const figure = `${cell} whitespace-nowrap`;
const head = 'border-b border-ink-300 px-2 py-1 text-left text-xs font-semibold text-ink-700';

function Section({
  id,
  title,
  sources,
  children,
}: {
  id: string;
  title: string;
  /** The rule sets or lists the section was measured against, each with its source. */
  sources: ReactNode;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-1.5 break-inside-avoid">
      <h2 id={id} className="border-b border-ink-800 pb-0.5 text-base font-semibold text-ink-900">
        {title}
      </h2>
      <p className="text-xs text-ink-700">
        <span className="font-semibold">Measured against: </span>
        {sources}
      </p>
      {children}
    </section>
  );
}

function None({ children }: { children: ReactNode }) {
  return <p className="text-sm text-ink-700">{children}</p>;
}

export function FlammableSection({ flammable }: { flammable: InspectionSummary['flammable'] }) {
  return (
    <Section
      id="inspection-flammable"
      title="Flammable and combustible liquids"
      sources={flammable.ruleSets.map((r) => r.citation).join('; ')}
    >
      <p className="text-sm">
        Overall: <span className="font-semibold">{labAreaStatusLabels[flammable.status]}</span>
      </p>
      <div className="grid items-start gap-3 md:grid-cols-2 print:grid-cols-2">
        <table className="w-full text-sm tabular-nums">
          <caption className="text-left text-xs font-semibold text-ink-700">
            Litres held by NFPA 30 class
          </caption>
          <thead>
            <tr>
              <th className={head}>Class</th>
              <th className={head}>In cabinets and safety cans</th>
              <th className={head}>Outside them</th>
              <th className={head}>Total</th>
            </tr>
          </thead>
          <tbody>
            {flammable.byClass.length === 0 ? (
              <tr>
                <td className={cell} colSpan={4}>
                  No flammable or combustible liquid counted.
                </td>
              </tr>
            ) : (
              flammable.byClass.map((row) => (
                <tr key={row.liquidClass}>
                  <td className={cell} title={liquidClassLabels[row.liquidClass]}>
                    {row.liquidClass}
                  </td>
                  <td className={figure}>{formatLitres(row.inStorageLitres)}</td>
                  <td className={figure}>{formatLitres(row.outsideStorageLitres)}</td>
                  <td className={figure}>{formatLitres(row.totalLitres)}</td>
                </tr>
              ))
            )}
          </tbody>
        </table>
        <table className="w-full text-sm tabular-nums">
          <caption className="text-left text-xs font-semibold text-ink-700">
            Against each limit
          </caption>
          <thead>
            <tr>
              <th className={head}>Limit</th>
              <th className={head}>Held</th>
              <th className={head}>Allowed</th>
              <th className={head}>Margin</th>
            </tr>
          </thead>
          <tbody>
            {flammable.limits.map((limit) => (
              <tr key={limit.key}>
                <td className={cell}>
                  {limit.label}
                  <span className="block text-xs text-ink-600">
                    {labAreaStatusLabels[limit.status]}
                  </span>
                </td>
                <td className={figure}>{formatLitres(limit.heldLitres)}</td>
                <td className={figure}>{formatLitres(limit.limitLitres)}</td>
                <td className={figure}>
                  {limit.marginLitres < 0
                    ? `over by ${formatLitres(-limit.marginLitres)}`
                    : formatLitres(limit.marginLitres)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {flammable.notCounted.length > 0 && (
        <p className="text-xs text-ink-700">
          Not counted ({flammable.notCounted.length}):{' '}
          {flammable.notCounted.map((c) => `${c.labelCode} ${c.chemical.name}`).join('; ')} — add
          their flash and boiling points.
        </p>
      )}
      {flammable.containerSizeBreaches.length > 0 && (
        <p className="text-xs text-ink-700">
          Containers larger than allowed:{' '}
          {flammable.containerSizeBreaches
            .map(
              (b) =>
                `${b.labelCode} ${b.chemicalName} (${formatLitres(b.capacityLitres)}, at most ${formatLitres(b.limitLitres)} — ${b.source})`,
            )
            .join('; ')}
          .
        </p>
      )}
    </Section>
  );
}

export function WatchedSection({ watched }: { watched: InspectionSummary['watched'] }) {
  const sources =
    watched.lists.length === 0
      ? 'no watch list is chosen for this lab'
      : watched.lists
          .map(
            (l) => `${l.name} (${l.jurisdiction}): ${l.source}${l.edition ? `, ${l.edition}` : ''}`,
          )
          .join('; ');
  return (
    <Section id="inspection-watched" title="Watched chemicals held" sources={sources}>
      {watched.holdings.length === 0 ? (
        <None>No container of a watched chemical is held here.</None>
      ) : (
        <table className="w-full text-sm tabular-nums">
          <thead>
            <tr>
              <th className={head}>Label</th>
              <th className={head}>Chemical</th>
              <th className={head}>CAS RN</th>
              <th className={head}>Lists</th>
              <th className={head}>Place</th>
              <th className={head}>Held</th>
            </tr>
          </thead>
          <tbody>
            {watched.holdings.map((h) => (
              <tr key={h.containerId}>
                <td className={figure}>{h.labelCode}</td>
                <td className={cell}>{h.chemicalName}</td>
                <td className={figure}>{h.casNumber ?? '—'}</td>
                <td className={cell}>{h.lists}</td>
                <td className={cell}>{h.locationPath}</td>
                <td className={figure}>{formatAmount(h.quantity, h.unit)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Section>
  );
}

export function WasteSection({ waste }: { waste: InspectionSummary['waste'] }) {
  const sources =
    waste.accumulationAreas.length === 0
      ? 'no accumulation area is set up inside this area; ignitable waste counts toward the flammable limits above'
      : [...new Set(waste.accumulationAreas.map((a) => a.citation))].join('; ');
  return (
    <Section id="inspection-waste" title="Waste on hand" sources={sources}>
      {waste.containers.length === 0 ? (
        <None>No open or full waste container is here.</None>
      ) : (
        <>
          <table className="w-full text-sm tabular-nums">
            <thead>
              <tr>
                <th className={head}>Label</th>
                <th className={head}>Collects</th>
                <th className={head}>Place</th>
                <th className={head}>Filled</th>
                <th className={head}>Hazards</th>
                <th className={head}>Since</th>
              </tr>
            </thead>
            <tbody>
              {waste.containers.map((c) => (
                <tr key={c.id}>
                  <td className={figure}>{c.labelCode}</td>
                  <td className={cell}>{c.title}</td>
                  <td className={cell}>{c.locationPath}</td>
                  <td className={cell}>
                    {c.filled === null
                      ? '—'
                      : `${formatFixed(c.filled, 1)} of ${formatFixed(c.capacity, 1)} ${c.capacityUnit}`}
                  </td>
                  <td className={cell}>
                    {[...c.characteristics, c.liquidClass ? `Class ${c.liquidClass}` : null]
                      .filter(Boolean)
                      .join(', ') || '—'}
                  </td>
                  <td className={cell}>
                    {c.accumulationStartOn ? formatDate(c.accumulationStartOn) : '—'}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-xs text-ink-700">
            About {formatLitres(waste.litres)} in all (amounts as entered, approximate).
          </p>
        </>
      )}
      {waste.accumulationAreas.map((a) => (
        <p key={a.locationId} className="text-xs text-ink-700">
          Accumulation area {a.locationPath}: {formatLitres(a.hazardous.litres)} of{' '}
          {formatLitres(a.hazardous.limitLitres)} hazardous waste,{' '}
          {labAreaStatusLabels[a.state === 'ok' ? 'within' : a.state]} — {a.citation}
        </p>
      ))}
    </Section>
  );
}

export function ConflictsSection({
  conflicts,
}: {
  conflicts: InspectionSummary['storageConflicts'];
}) {
  const label = (group: keyof typeof storageGroups) => storageGroups[group].label;
  return (
    <Section
      id="inspection-conflicts"
      title="Storage conflicts"
      sources={
        conflicts.sources.length > 0
          ? conflicts.sources.join('; ')
          : 'Lotwise’s segregation table of storage groups'
      }
    >
      {conflicts.items.length === 0 ? (
        <None>No place inside this area holds groups that should be kept apart.</None>
      ) : (
        <ul className="flex flex-col gap-1 text-sm">
          {conflicts.items.map((item) => (
            <li key={item.location.id}>
              <span className="font-semibold">{item.location.path}</span>
              {item.pairs.map((pair) => (
                <span key={pair.groups.join('-')} className="block">
                  {label(pair.groups[0])} ({pair.first.map((c) => c.labelCode).join(', ')}) with{' '}
                  {label(pair.groups[1])} ({pair.second.map((c) => c.labelCode).join(', ')}):{' '}
                  {pair.reason}
                </span>
              ))}
              {item.mismatches.length > 0 && (
                <span className="block">
                  Not meant for this place:{' '}
                  {item.mismatches.map((c) => `${c.labelCode} ${c.chemicalName}`).join('; ')}
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
      <p className="text-xs text-ink-700">{conflicts.notice}</p>
    </Section>
  );
}
