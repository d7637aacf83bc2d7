import { limitsCrossed } from '@lotwise/chem';
import {
  formatQuantity,
  type ConfirmationWarning,
  type ContainerSizeWarning,
  type FlammableLimitWarning,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { LocationRow } from '../locations/location.entity';
import { loadAreaData, totalsOf, type AreaTotals } from './lab-area-totals';
import type { LabAreaPlaced } from './lab-areas.repository';

const litres = (value: number) => formatQuantity(value, 'L', { decimals: 2 });

/**
 * Watches the lab areas a write puts containers into: call before the write with the places
 * it puts them, then `warnings(ids)` inside the same transaction once written. The totals
 * after the change are the areas' totals read again, worked out by the same function as the
 * area page, so what the warning says is what the page will show. A limit the change takes
 * the area over, or further over, is a `flammable_limit` warning; a container of `ids` larger
 * than its class and material allow there, a `container_size` warning.
 */
export async function watchLabAreas(repos: Repositories, places: LocationRow[]) {
  const areas = new Map<number, LabAreaPlaced>();
  const seen = new Set<number>();
  for (const place of places) {
    if (seen.has(place.id)) continue;
    seen.add(place.id);
    for (const area of await repos.labAreas.related(place.idPath)) {
      if (place.idPath.startsWith(area.idPath)) areas.set(area.id, area);
    }
  }
  const watched = [...areas.values()];
  const before: AreaTotals[] =
    watched.length === 0
      ? []
      : ((data) => watched.map((area) => totalsOf(data, area)))(await loadAreaData(repos, watched));

  return {
    async warnings(changedContainerIds: number[]): Promise<ConfirmationWarning[]> {
      if (watched.length === 0) return [];
      const data = await loadAreaData(repos, watched);
      const warnings: ConfirmationWarning[] = [];
      for (const [index, area] of watched.entries()) {
        const was = before[index]!;
        const now = totalsOf(data, area);
        for (const { before: b, after: a } of limitsCrossed(was.area.limits, now.area.limits)) {
          const warning: FlammableLimitWarning = {
            kind: 'flammable_limit',
            message: `${area.path} would hold ${litres(a.heldLitres)} of ${a.label.charAt(0).toLowerCase()}${a.label.slice(1)}; its limit is ${litres(a.limitLitres)} (${now.area.flammableRuleSet.citation}).`,
            labAreaId: area.id,
            labAreaName: area.path,
            limit: a.label,
            heldLitres: b.heldLitres,
            afterLitres: a.heldLitres,
            limitLitres: a.limitLitres,
            source: now.area.flammableRuleSet.citation,
          };
          warnings.push(warning);
        }
        const known = new Set(was.detail.containerSizeBreaches.map((x) => x.containerId));
        for (const breach of now.detail.containerSizeBreaches) {
          if (!changedContainerIds.includes(breach.containerId) || known.has(breach.containerId))
            continue;
          const warning: ContainerSizeWarning = {
            kind: 'container_size',
            message: `${breach.labelCode} (${breach.chemicalName}, Class ${breach.liquidClass}) holds up to ${litres(breach.capacityLitres)} in ${breach.material.replace('-', ' ')}; the largest allowed is ${litres(breach.limitLitres)} (${breach.source}).`,
            liquidClass: breach.liquidClass,
            material: breach.material,
            capacityLitres: breach.capacityLitres,
            limitLitres: breach.limitLitres,
            source: breach.source,
          };
          warnings.push(warning);
        }
      }
      return warnings;
    },
  };
}
