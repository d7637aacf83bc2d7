import { peroxideClasses, type Container } from '@lotwise/shared';
import { TriangleAlert } from 'lucide-react';
import { HazardStatementList } from '../../../components/hazards/hazard-statement-list';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';

/** The hazards of what a container holds, shown before anything else about it. */
export function ContainerHazards({ chemical }: { chemical: Container['chemical'] }) {
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
        <SafetyCaution />
      </div>
    </section>
  );
}
