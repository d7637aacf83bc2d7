import { LITRES_PER_US_GALLON } from '@lotwise/chem';
import {
  roomRulesReminder,
  ruleSetCitation,
  type WasteAccumulationData,
  type WasteArea,
  type WasteContainer,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { RuleSetRow } from '../rule-sets/rule-set.entity';
import { approximateIn, presentWasteContainers } from './waste-contents';

/**
 * Waste accumulation areas: places marked to collect waste, their open waste containers and
 * the totals against the limits of a waste-accumulation rule set.
 */

const litresPer = { L: 1, gal: LITRES_PER_US_GALLON, qt: LITRES_PER_US_GALLON / 4 } as const;

/** The litres a waste container holds (approximate, from its additions); 0 when unknown. */
function litresOf(container: WasteContainer): number {
  if (container.filled === null) return 0;
  return approximateIn(container.filled, container.capacityUnit, 'L') ?? 0;
}

/** Open and full waste containers in one area, with its totals against `set`. */
export function areaTotals(
  location: { id: number; path: string },
  set: RuleSetRow,
  containers: WasteContainer[],
): WasteArea {
  const hazardousLitres = containers
    .filter((c) => !c.acutelyHazardous)
    .reduce((sum, c) => sum + litresOf(c), 0);
  const acuteLitres = containers
    .filter((c) => c.acutelyHazardous)
    .reduce((sum, c) => sum + litresOf(c), 0);
  const data = set.data as unknown as WasteAccumulationData;
  const hazardousLimit = data.maxHazardous.value * litresPer[data.maxHazardous.unit];
  const acuteLimit = data.maxAcutelyHazardous.value * litresPer[data.maxAcutelyHazardous.unit];
  const fraction = (value: number, max: number) =>
    max > 0 ? value / max : value > 0 ? Infinity : 0;
  const hazardous = {
    litres: hazardousLitres,
    limitLitres: hazardousLimit,
    fraction: fraction(hazardousLitres, hazardousLimit),
  };
  const acutelyHazardous = {
    litres: acuteLitres,
    limitLitres: acuteLimit,
    fraction: fraction(acuteLitres, acuteLimit),
  };
  const worst = Math.max(hazardous.fraction, acutelyHazardous.fraction);
  return {
    locationId: location.id,
    locationPath: location.path,
    ruleSetId: set.id,
    ruleSetName: set.name,
    citation: ruleSetCitation(set),
    hazardous,
    acutelyHazardous,
    daysAllowedOnceExceeded: data.daysAllowedOnceExceeded,
    maxAccumulationDays: data.maxAccumulationDays,
    nearFraction: data.nearFraction,
    state: worst > 1 ? 'over' : worst >= data.nearFraction ? 'near' : 'ok',
    containers,
    reminder: roomRulesReminder,
  };
}

/** Every accumulation area with its waste containers and totals. */
export async function wasteAreas(repos: Repositories, today?: string): Promise<WasteArea[]> {
  const areas = await repos.waste.listAreas();
  if (areas.length === 0) return [];
  const sets = new Map(
    (await repos.ruleSets.rowsByIds([...new Set(areas.map((a) => a.ruleSetId))])).map((s) => [
      s.id,
      s,
    ]),
  );
  const locations = new Map(
    (await repos.locations.rowsByIds(areas.map((a) => a.locationId))).map((l) => [l.id, l]),
  );
  const rows = await repos.waste.listContainers({
    statuses: ['open', 'full'],
    locationIds: areas.map((a) => a.locationId),
  });
  const containers = await presentWasteContainers(repos, rows, today);
  return areas.map((area) =>
    areaTotals(
      locations.get(area.locationId)!,
      sets.get(area.ruleSetId)!,
      containers.filter((c) => c.locationId === area.locationId),
    ),
  );
}
