import { roomRulesReminder, todayIso, type InspectionSummary } from '@lotwise/shared';
import type { Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { labAreasService } from '../lab-areas/lab-areas.service';
import { segregationService } from '../segregation/segregation.service';
import { wasteAreas } from '../waste/waste-areas';
import { wasteOnHandIn } from '../waste/waste.service';
import { watchedHoldingsIn } from '../watch-lists/watch-matching';

/**
 * The inspection summary of one lab area: each section is another capability's answer for
 * the places inside the area, taken as it is (the figures equal those of the lab-area page,
 * the watch-list report, the waste pages and the storage-conflicts page).
 */
export function inspectionService(store: Store) {
  const labAreas = labAreasService(store);

  return {
    async summary(areaId: number): Promise<InspectionSummary> {
      const detail = await labAreas.get(areaId);
      const repos = store.repos;
      const place = await repos.locations.findRow(detail.locationId);
      if (!place) throw AppError.notFound(`The place of lab area #${areaId} is gone.`);
      const inside = [place, ...(await repos.locations.descendants(place))];
      const insideIds = inside.map((l) => l.id);
      const insideSet = new Set(insideIds);
      const today = todayIso();

      const holdings = await watchedHoldingsIn(repos, insideIds);
      const lists = await repos.watchLists.listAll();
      const waste = await wasteOnHandIn(repos, insideIds, today);
      const accumulation = await wasteAreas(repos, today);
      const conflicts = await segregationService(repos).conflicts();
      const conflictItems = conflicts.items.filter((item) => insideSet.has(item.location.id));

      return {
        area: {
          id: detail.id,
          locationId: detail.locationId,
          name: detail.name,
          path: detail.path,
          kind: detail.kind,
          unitClass: detail.unitClass,
          floorArea: detail.floorArea,
          floorAreaUnit: detail.floorAreaUnit,
          storey: detail.storey,
          instructional: detail.instructional,
        },
        date: today,
        generatedAt: nowIso(),
        flammable: {
          ruleSets: [
            detail.flammableRuleSet,
            ...(detail.containerSizeRuleSet ? [detail.containerSizeRuleSet] : []),
          ],
          status: detail.status,
          byClass: detail.byClass,
          limits: detail.limits,
          notCounted: detail.notCounted,
          containerSizeBreaches: detail.containerSizeBreaches,
        },
        watched: {
          lists: lists
            .filter((list) => list.chosen)
            .map((list) => ({
              id: list.id,
              name: list.name,
              jurisdiction: list.jurisdiction,
              source: list.source,
              edition: list.edition,
            })),
          holdings,
        },
        waste: {
          containers: waste.containers,
          litres: waste.litres,
          ignitableLitresByClass: Object.fromEntries(
            Object.entries(waste.ignitableLitresByClass).filter(
              (entry): entry is [string, number] => typeof entry[1] === 'number',
            ),
          ),
          accumulationAreas: accumulation.filter((a) => insideSet.has(a.locationId)),
        },
        storageConflicts: {
          items: conflictItems,
          sources: [...new Set(conflictItems.flatMap((item) => item.pairs.map((p) => p.source)))],
          notice: conflicts.notice,
        },
        reminder: roomRulesReminder,
      };
    },
  };
}
export type InspectionService = ReturnType<typeof inspectionService>;
