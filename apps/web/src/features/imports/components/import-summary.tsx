import type { ReactNode } from 'react';
import { Boxes, FlaskConical, MapPin, PackageCheck } from 'lucide-react';
import type { ImportSummary } from '@lotwise/shared';
import { formatCount } from '../../../lib/format';

function Tile({
  icon,
  title,
  main,
  detail,
}: {
  icon: ReactNode;
  title: string;
  main: string;
  detail: string;
}) {
  return (
    <div className="flex gap-3 rounded-lg border border-ink-200 bg-white px-3 py-2.5">
      <span className="mt-0.5 text-accent-700 [&_svg]:size-5">{icon}</span>
      <div>
        <p className="text-xs font-semibold tracking-wide text-ink-600 uppercase">{title}</p>
        <p className="text-lg font-semibold text-ink-900 tabular-nums">{main}</p>
        <p className="text-xs text-ink-600 tabular-nums">{detail}</p>
      </div>
    </div>
  );
}

/** What an import creates (or created): new and matched chemicals, lots, containers, places. */
export function ImportSummaryTiles({
  summary,
  done = false,
}: {
  summary: ImportSummary;
  done?: boolean;
}) {
  const verb = done ? 'added' : 'to add';
  const { chemicals, lots, containers, locations } = summary;
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-2 sm:grid-cols-2 lg:grid-cols-4">
        <Tile
          icon={<FlaskConical aria-hidden="true" />}
          title="Chemicals"
          main={`${formatCount(chemicals.new)} new`}
          detail={`${formatCount(chemicals.existing)} already in Lotwise`}
        />
        <Tile
          icon={<PackageCheck aria-hidden="true" />}
          title="Lots"
          main={`${formatCount(lots.new)} new`}
          detail={`${formatCount(lots.existing)} already recorded`}
        />
        <Tile
          icon={<Boxes aria-hidden="true" />}
          title="Containers"
          main={`${formatCount(containers.new)} ${verb}`}
          detail={
            containers.generatedLabelCodes > 0
              ? `${formatCount(containers.generatedLabelCodes)} get a new LW- label code`
              : 'all keep the label code in the file'
          }
        />
        <Tile
          icon={<MapPin aria-hidden="true" />}
          title="Locations"
          main={`${formatCount(locations.new)} new`}
          detail={`${formatCount(locations.existing)} already in the tree`}
        />
      </div>
      {(summary.newChemicalNames.length > 0 || summary.newLocationPaths.length > 0) && (
        <details className="rounded-md border border-ink-200 bg-white px-3 py-2 text-sm">
          <summary className="cursor-pointer font-medium text-ink-800">
            Which chemicals and places are new
          </summary>
          <div className="mt-2 grid gap-4 sm:grid-cols-2">
            {summary.newChemicalNames.length > 0 && (
              <div>
                <p className="font-semibold text-ink-800">New chemicals</p>
                <p className="text-xs text-ink-600">
                  Check their hazards and storage group after the import.
                </p>
                <ul className="mt-1 list-disc pl-5">
                  {summary.newChemicalNames.map((name) => (
                    <li key={name}>{name}</li>
                  ))}
                </ul>
              </div>
            )}
            {summary.newLocationPaths.length > 0 && (
              <div>
                <p className="font-semibold text-ink-800">New locations</p>
                <ul className="mt-1 list-disc pl-5">
                  {summary.newLocationPaths.map((path) => (
                    <li key={path}>{path}</li>
                  ))}
                </ul>
              </div>
            )}
          </div>
        </details>
      )}
    </div>
  );
}
