import { peroxideClasses, type Chemical } from '@lotwise/shared';
import { TriangleAlert } from 'lucide-react';
import { HazardStatementList } from '../../../components/hazards/hazard-statement-list';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { WatchListPanel } from '../../../components/hazards/watch-list-badges';

/** The hazards of one chemical, shown before anything else about it. */
export function HazardSection({ chemical }: { chemical: Chemical }) {
  return (
    <section
      aria-labelledby="hazards-heading"
      className="rounded-lg border border-ink-200 bg-white"
    >
      <h2
        id="hazards-heading"
        className="flex items-center gap-2 border-b border-ink-200 px-4 py-2.5 text-base font-semibold"
      >
        <TriangleAlert aria-hidden="true" className="size-4 text-ghs-red" />
        Hazards
      </h2>
      <div className="flex flex-col gap-5 px-4 py-4">
        <PictogramList codes={chemical.ghsPictograms} size="lg" />
        <div className="grid gap-5 lg:grid-cols-[3fr_2fr]">
          <div>
            <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Hazard statements</h3>
            <HazardStatementList codes={chemical.hazardStatements} />
          </div>
          <div className="flex flex-col gap-4">
            <div>
              <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Storage group</h3>
              <StorageGroupLabel group={chemical.storageGroup} withHint />
            </div>
            <div>
              <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Peroxide former</h3>
              {chemical.peroxideClass ? (
                <p className="text-sm text-ink-800">
                  <span className="font-semibold">Class {chemical.peroxideClass}.</span>{' '}
                  {peroxideClasses[chemical.peroxideClass]}
                </p>
              ) : (
                <p className="text-sm text-ink-600">Not recorded as a peroxide former</p>
              )}
            </div>
          </div>
        </div>
        <WatchListPanel listings={chemical.watchListings} />
        <SafetyCaution />
      </div>
    </section>
  );
}
