import {
  ghsFlammableHazardStatements,
  liquidClassLabels,
  liquidClassMeanings,
  peroxideClasses,
  type Container,
  type StoredFile,
} from '@lotwise/shared';
import { Link } from 'react-router';
import { FileText, TriangleAlert } from 'lucide-react';
import { LiquidClassBadge } from '../../../components/hazards/liquid-class-badge';
import { HazardStatementList } from '../../../components/hazards/hazard-statement-list';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { WatchListPanel } from '../../../components/hazards/watch-list-badges';
import { buttonClasses } from '../../../components/ui/button';
import { formatDate } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { storedFileUrls } from '../api';

/** The chemical's SDS, one press away from its hazards; where none is uploaded, says so. */
function SdsLink({ chemicalId, sds }: { chemicalId: number; sds: StoredFile | null }) {
  if (!sds) {
    return (
      <p className="flex items-start gap-2 text-sm text-ink-700" data-testid="sds-missing">
        <FileText aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ink-500" />
        <span>
          No SDS is uploaded for this chemical: read the supplier’s SDS before use, and add it on{' '}
          <Link
            to={paths.chemical(chemicalId)}
            className="text-accent-700 underline underline-offset-2"
          >
            the chemical’s page
          </Link>
          .
        </span>
      </p>
    );
  }
  return (
    <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm text-ink-700">
      <a
        href={storedFileUrls.sds(chemicalId)}
        className={buttonClasses('secondary', 'sm')}
        data-testid="sds-link"
      >
        <FileText aria-hidden="true" className="size-4" />
        Open the SDS (PDF)
      </a>
      <span className="text-xs text-ink-600">
        {sds.fileName}, uploaded {formatDate(sds.uploadedAt.slice(0, 10))}
      </span>
    </p>
  );
}

/** The hazards of what a container holds, shown before anything else about it, with its SDS. */
export function ContainerHazards({
  chemical,
  sds,
}: {
  chemical: Container['chemical'];
  sds: StoredFile | null;
}) {
  return (
    <section
      aria-labelledby="container-hazards-heading"
      className="rounded-lg border border-ink-200 bg-white"
    >
      <h2
        id="container-hazards-heading"
        className="flex items-center gap-2 border-b border-ink-200 px-4 py-2.5 text-base font-semibold"
      >
        <TriangleAlert aria-hidden="true" className="size-4 text-ghs-red" />
        Hazards
      </h2>
      <div className="flex flex-col gap-4 px-4 py-3">
        <PictogramList codes={chemical.ghsPictograms} size="lg" />
        <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
          <div>
            <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Hazard statements</h3>
            <HazardStatementList codes={chemical.hazardStatements} />
          </div>
          <div className="flex flex-col gap-3">
            <div>
              <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Storage group</h3>
              <StorageGroupLabel group={chemical.storageGroup} withHint />
            </div>
            {chemical.liquidClass && (
              <div>
                <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Liquid class</h3>
                <p className="flex flex-col gap-1 text-sm text-ink-800">
                  <LiquidClassBadge liquidClass={chemical.liquidClass} />
                  <span>
                    {liquidClassLabels[chemical.liquidClass]}:{' '}
                    {liquidClassMeanings[chemical.liquidClass]}
                    {chemical.ghsFlammableCategory
                      ? `; GHS category ${chemical.ghsFlammableCategory} (${ghsFlammableHazardStatements[chemical.ghsFlammableCategory]})`
                      : ''}
                    . Worked out from the chemical’s flash and boiling point; the SDS decides.
                  </span>
                </p>
              </div>
            )}
            {chemical.peroxideClass && (
              <div>
                <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Peroxide former</h3>
                <p className="text-sm text-ink-800">
                  <span className="font-semibold">Class {chemical.peroxideClass}.</span>{' '}
                  {peroxideClasses[chemical.peroxideClass]}
                </p>
              </div>
            )}
          </div>
        </div>
        <WatchListPanel listings={chemical.watchListings} />
        <SdsLink chemicalId={chemical.id} sds={sds} />
        <SafetyCaution />
      </div>
    </section>
  );
}
