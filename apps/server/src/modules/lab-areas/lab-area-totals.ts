import {
  ChemError,
  LITRES_PER_US_GALLON,
  convert,
  countsTowardCombinedLimit,
  dimensionOf,
  flammableLimitsFor,
  flammableTotals,
  liquidClassOf,
  type FlammableVolume,
  type LabAreaInput,
  type LiquidClass,
} from '@lotwise/chem';
import {
  ghsFlammableHazardStatements,
  labAreaNearFraction,
  roomRulesReminder,
  ruleSetCitation,
  type ContainerSizesData,
  type FlammableLimitsData,
  type LabArea,
  type LabAreaContainerSizeBreach,
  type LabAreaCountedWaste,
  type LabAreaCountedContainer,
  type LabAreaDetail,
  type LabAreaNotCounted,
  type LabAreaStoragePlace,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import type { RuleSetRow } from '../rule-sets/rule-set.entity';
import { ignitableWasteUnder, type IgnitableWaste } from '../waste/waste.service';
import type { AreaContainer, LabAreaPlaced, StoragePlace } from './lab-areas.repository';

/** GHS hazard statements of flammable liquids (H224–H226) and combustible ones (H227). */
const flammableStatements = Object.values(ghsFlammableHazardStatements);

/** Volumes counted beside the containers (e.g. ignitable waste), by area id. */
export type ExtraVolumes = Map<number, (FlammableVolume & { what: string })[]>;

/** What an area's totals are worked out from, loaded in a fixed number of statements. */
export interface AreaData {
  areas: LabAreaPlaced[];
  ruleSets: Map<number, RuleSetRow>;
  storagePlaces: StoragePlace[];
  containers: AreaContainer[];
  /** Ignitable liquid waste under the areas (counted when the rule set says so). */
  ignitableWaste: IgnitableWaste[];
}

/**
 * Loads what the totals of `areas` need: the rule sets, the flagged places and the liquid
 * containers inside them: three statements, whatever the number of containers.
 */
export async function loadAreaData(repos: Repositories, areas: LabAreaPlaced[]): Promise<AreaData> {
  const setIds = [
    ...new Set(
      areas.flatMap((a) =>
        a.containerSizeRuleSetId === null
          ? [a.flammableRuleSetId]
          : [a.flammableRuleSetId, a.containerSizeRuleSetId],
      ),
    ),
  ];
  const idPaths = areas.map((a) => a.idPath);
  const [sets, storagePlaces, containers, ignitableWaste] = [
    await repos.ruleSets.rowsByIds(setIds),
    await repos.labAreas.storagePlaces(idPaths),
    await repos.labAreas.liquidContainers(idPaths),
    await ignitableWasteUnder(repos, idPaths),
  ];
  return {
    areas,
    ruleSets: new Map(sets.map((s) => [s.id, s])),
    storagePlaces,
    containers,
    ignitableWaste,
  };
}

function litresOfCapacity(c: AreaContainer): number | null {
  if (c.capacity === null || !c.capacityUnit) return null;
  try {
    if (dimensionOf(c.capacityUnit) === 'volume') return convert(c.capacity, c.capacityUnit, 'L');
    if (c.density) return convert(c.capacity, c.capacityUnit, 'g') / c.density / 1000;
  } catch (error) {
    if (!(error instanceof ChemError)) throw error;
  }
  return null;
}

function setToLitres(value: number, unit: 'L' | 'gal'): number {
  return unit === 'gal' ? value * LITRES_PER_US_GALLON : value;
}

export interface AreaTotals {
  area: LabArea;
  detail: LabAreaDetail;
  /** Volumes counted, by container id (for the warnings). */
  counted: LabAreaCountedContainer[];
}

function ruleSetRef(row: RuleSetRow) {
  return {
    id: row.id,
    name: row.name,
    citation: ruleSetCitation(row),
    builtIn: Boolean(row.builtIn),
  };
}

/** The limits of an area under its set (400 naming the field when the set cannot give them). */
export function limitsOf(area: LabAreaInput, set: RuleSetRow) {
  try {
    return flammableLimitsFor(set.data as unknown as FlammableLimitsData, area);
  } catch (error) {
    if (error instanceof ChemError) {
      throw AppError.validation(`${set.name}: ${error.message}.`, { unitClass: error.message });
    }
    throw error;
  }
}

/** One area's limits against what it holds (and `extra` volumes), from loaded data. */
export function totalsOf(
  data: AreaData,
  area: LabAreaPlaced,
  extra: ExtraVolumes = new Map(),
): AreaTotals {
  const set = data.ruleSets.get(area.flammableRuleSetId)!;
  const sizeSet =
    area.containerSizeRuleSetId === null
      ? null
      : (data.ruleSets.get(area.containerSizeRuleSetId) ?? null);
  const limits = limitsOf(area, set);
  const places = data.storagePlaces.filter((p) => p.idPath.startsWith(area.idPath));
  const storageOf = (idPath: string) =>
    places
      .filter((p) => idPath.startsWith(p.idPath))
      .sort((a, b) => b.idPath.length - a.idPath.length)[0] ?? null;

  const counted: LabAreaCountedContainer[] = [];
  const notCounted: LabAreaNotCounted[] = [];
  const breaches: LabAreaContainerSizeBreach[] = [];
  const volumes: FlammableVolume[] = [];
  const heldIn = new Map<number, number>();
  for (const c of data.containers) {
    if (!c.locationIdPath.startsWith(area.idPath)) continue;
    const chemical = {
      id: c.chemicalId,
      name: c.chemicalName,
      ghsPictograms: c.ghsPictograms,
      hazardStatements: c.hazardStatements,
    };
    const liquidClass: LiquidClass | null = liquidClassOf(c.flashPointC, c.boilingPointC);
    if (liquidClass === null) {
      const flammable =
        c.hazardStatements.length === 0 ||
        c.hazardStatements.some((h) => flammableStatements.some((f) => h.startsWith(f)));
      if (flammable) {
        notCounted.push({
          containerId: c.id,
          labelCode: c.labelCode,
          chemical,
          locationPath: c.locationPath,
          reason:
            c.flashPointC === null
              ? `not counted: add the flash point and boiling point of ${c.chemicalName}`
              : `not counted: add the boiling point of ${c.chemicalName} (its flash point is below 22.8 °C)`,
        });
      }
      continue;
    }
    let litres: number;
    if (c.unit === 'mL') litres = c.quantity / 1000;
    else if (c.density) litres = c.quantity / c.density / 1000;
    else {
      notCounted.push({
        containerId: c.id,
        labelCode: c.labelCode,
        chemical,
        locationPath: c.locationPath,
        reason: `not counted: add the density of ${c.chemicalName} (it is kept in g)`,
      });
      continue;
    }
    const storage = storageOf(c.locationIdPath);
    const capacityLitres = litresOfCapacity(c);
    counted.push({
      containerId: c.id,
      labelCode: c.labelCode,
      chemical,
      liquidClass,
      litres,
      inStorage: storage !== null,
      storageKind: storage?.flammableStorage ?? null,
      locationId: c.locationId,
      locationPath: c.locationPath,
      material: c.material,
      capacityLitres,
    });
    volumes.push({ liquidClass, litres, inStorage: storage !== null });
    if (storage && countsTowardCombinedLimit(liquidClass)) {
      heldIn.set(storage.id, (heldIn.get(storage.id) ?? 0) + litres);
    }
    if (sizeSet && c.material) {
      const sizes = sizeSet.data as unknown as ContainerSizesData;
      const rule = sizes.limits.find(
        (l) => l.liquidClass === liquidClass && l.material === c.material,
      );
      const size = capacityLitres ?? litres;
      if (rule) {
        const limitLitres = setToLitres(rule.maxCapacity, sizes.unit);
        if (size > limitLitres + 1e-9) {
          breaches.push({
            containerId: c.id,
            labelCode: c.labelCode,
            chemicalName: c.chemicalName,
            liquidClass,
            material: c.material,
            capacityLitres: size,
            limitLitres,
            source: ruleSetCitation(sizeSet),
          });
        }
      }
    }
  }
  for (const v of extra.get(area.id) ?? []) volumes.push(v);
  const data45 = set.data as unknown as FlammableLimitsData;
  // Waste ignitable liquids count toward the totals when the set says so (NFPA 45 does).
  const countedWaste: LabAreaCountedWaste[] = [];
  for (const w of data45.countsIgnitableWaste ? data.ignitableWaste : []) {
    if (!w.idPath.startsWith(area.idPath)) continue;
    const storage = storageOf(w.idPath);
    volumes.push({ liquidClass: w.liquidClass, litres: w.litres, inStorage: storage !== null });
    if (storage && countsTowardCombinedLimit(w.liquidClass)) {
      heldIn.set(storage.id, (heldIn.get(storage.id) ?? 0) + w.litres);
    }
    countedWaste.push({
      wasteContainerId: w.wasteContainerId,
      labelCode: w.labelCode,
      title: w.title,
      locationPath: w.locationPath,
      liquidClass: w.liquidClass,
      liquidClassNote: w.liquidClassNote,
      litres: w.litres,
      inStorage: storage !== null,
    });
  }

  const totals = flammableTotals(volumes, limits, labAreaNearFraction);
  const storagePlaces: LabAreaStoragePlace[] = places.map((p) => ({
    locationId: p.id,
    path: p.path,
    storageKind: p.flammableStorage,
    heldLitres: heldIn.get(p.id) ?? 0,
    limitLitres:
      p.flammableStorage === 'cabinet' && data45.perCabinet !== null
        ? setToLitres(data45.perCabinet, data45.unit)
        : null,
  }));
  const area_: LabArea = {
    id: area.id,
    locationId: area.locationId,
    name: area.name,
    path: area.path,
    kind: area.kind,
    unitClass: area.unitClass,
    floorArea: area.floorArea,
    floorAreaUnit: area.floorAreaUnit,
    storey: area.storey,
    instructional: area.instructional,
    notes: area.notes,
    flammableRuleSet: ruleSetRef(set),
    containerSizeRuleSet: sizeSet ? ruleSetRef(sizeSet) : null,
    limits: totals.limits.map((l) => ({
      key: l.key,
      label: l.label,
      limitLitres: l.litres,
      heldLitres: l.heldLitres,
      marginLitres: l.marginLitres,
      fractionUsed: l.fractionUsed,
      status: l.status,
      working: l.working,
    })),
    worstFractionUsed: totals.worstFractionUsed,
    status: totals.status,
    notCountedCount: notCounted.length,
    containerSizeBreachCount: breaches.length,
    reminder: roomRulesReminder,
    createdAt: area.createdAt,
    updatedAt: area.updatedAt,
  };
  return {
    area: area_,
    detail: {
      ...area_,
      byClass: totals.byClass,
      containers: counted,
      countedWaste,
      notCounted,
      containerSizeBreaches: breaches,
      storagePlaces,
    },
    counted,
  };
}
