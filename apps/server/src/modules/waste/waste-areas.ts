import { LITRES_PER_US_GALLON } from '@lotwise/chem';
import {
  roomRulesReminder,
  ruleSetCitation,
  type WasteAccumulationData,
  type WasteArea,
  type WasteContainer,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { approximateIn, presentWasteContainers } from './waste-contents';

/**
 * Waste accumulation areas: places marked to collect waste, their open waste containers and
 * the totals against the limits of a waste-accumulation rule set.
 */

/**
 * The US EPA satellite accumulation limits, used for an area with no rule set of its own:
 * 40 CFR 262.15(a)(1) and (a)(6): 55 gallons of hazardous waste or 1 quart of acutely
 * hazardous waste, and 3 consecutive calendar days to remove the excess once exceeded; no
 * time limit before that. Figures as published in the eCFR (Title 40, §262.15, 2016 rule).
 */
export const epaSatelliteAccumulation: {
  source: string;
  edition: string;
  reference: string;
  data: WasteAccumulationData;
} = {
  source: 'US EPA, 40 CFR 262.15',
  edition: '2016',
  reference: 'satellite accumulation, (a)(1) and (a)(6)',
  data: {
    maxHazardous: { value: 55, unit: 'gal' }, // 40 CFR 262.15(a)(1)
    maxAcutelyHazardous: { value: 1, unit: 'qt' }, // 40 CFR 262.15(a)(1)
    daysAllowedOnceExceeded: 3, // 40 CFR 262.15(a)(6)
    maxAccumulationDays: null, // no time limit for satellite accumulation below the limits
    nearFraction: 0.9, // common practice, no source
  },
};

const litresPer = { L: 1, gal: LITRES_PER_US_GALLON, qt: LITRES_PER_US_GALLON / 4 } as const;

/** The litres a waste container holds (approximate, from its additions); 0 when unknown. */
function litresOf(container: WasteContainer): number {
  if (container.filled === null) return 0;
  return approximateIn(container.filled, container.capacityUnit, 'L') ?? 0;
}

/** Open and full waste containers in one area, with its totals against `set`. */
export function areaTotals(
  location: { id: number; path: string },
  ruleSetId: number | null,
  set: typeof epaSatelliteAccumulation,
  containers: WasteContainer[],
): WasteArea {
  const hazardousLitres = containers
    .filter((c) => !c.acutelyHazardous)
    .reduce((sum, c) => sum + litresOf(c), 0);
  const acuteLitres = containers
    .filter((c) => c.acutelyHazardous)
    .reduce((sum, c) => sum + litresOf(c), 0);
  const hazardousLimit = set.data.maxHazardous.value * litresPer[set.data.maxHazardous.unit];
  const acuteLimit =
    set.data.maxAcutelyHazardous.value * litresPer[set.data.maxAcutelyHazardous.unit];
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
    ruleSetId,
    citation: ruleSetCitation(set),
    hazardous,
    acutelyHazardous,
    daysAllowedOnceExceeded: set.data.daysAllowedOnceExceeded,
    maxAccumulationDays: set.data.maxAccumulationDays,
    nearFraction: set.data.nearFraction,
    state: worst > 1 ? 'over' : worst >= set.data.nearFraction ? 'near' : 'ok',
    containers,
    reminder: roomRulesReminder,
  };
}

/** Every accumulation area with its waste containers and totals. */
export async function wasteAreas(repos: Repositories, today?: string): Promise<WasteArea[]> {
  const areas = await repos.waste.listAreas();
  if (areas.length === 0) return [];
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
      area.ruleSetId,
      epaSatelliteAccumulation,
      containers.filter((c) => c.locationId === area.locationId),
    ),
  );
}
