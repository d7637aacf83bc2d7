import type { LabAreaDetail, Location, LocationDetail, RuleSet } from '@lotwise/shared';
import { roomRulesReminder } from '@lotwise/shared';

const stamp = '2026-11-01T08:00:00.000Z';

/**
 * The built-in flammable-limits set as the server answers it.
 * NFPA 45 (2024) Table 9.1.1, figures as given in public summaries of the standard.
 */
export const nfpa45: RuleSet = {
  id: 1,
  name: 'NFPA 45 flammable-liquid limits',
  source: 'NFPA 45',
  edition: '2024',
  reference: 'Table 9.1.1',
  notes: '',
  builtIn: true,
  citation: 'NFPA 45 (2024), Table 9.1.1',
  createdAt: stamp,
  updatedAt: stamp,
  kind: 'flammable-limits',
  data: {
    unit: 'gal',
    perFloorArea: { value: 100, unit: 'ft2' },
    byUnitClass: [
      {
        unitClass: 'A',
        perArea: { classI: 20, classesIToIIIA: 40 },
        maxPerUnit: { classI: 480, classesIToIIIA: 1600 },
      },
      {
        unitClass: 'B',
        perArea: { classI: 10, classesIToIIIA: 20 },
        maxPerUnit: { classI: 480, classesIToIIIA: 800 },
      },
      {
        unitClass: 'C',
        perArea: { classI: 4, classesIToIIIA: 8 },
        maxPerUnit: { classI: 300, classesIToIIIA: 400 },
      },
      {
        unitClass: 'D',
        perArea: { classI: 2, classesIToIIIA: 2 },
        maxPerUnit: { classI: 150, classesIToIIIA: 150 },
      },
    ],
    outsideStorageFactor: 0.5,
    instructional: { allowedUnitClasses: ['C', 'D'], limitedToUnitClass: 'C', factor: 0.5 },
    storeyReductions: [
      { unitClasses: ['B'], fromStorey: 4, toStorey: null, factor: 0.5 },
      { unitClasses: ['C', 'D'], fromStorey: 4, toStorey: 6, factor: 0.75 },
      { unitClasses: ['C', 'D'], fromStorey: 7, toStorey: null, factor: 0.5 },
    ],
    countsIgnitableWaste: true,
    perCabinet: null,
  },
};

/** An invented container-size set (figures made up for the test). */
export const sizes: RuleSet = {
  id: 2,
  name: 'Campus container sizes',
  source: 'Campus safety office',
  edition: '2026',
  reference: '',
  notes: '',
  builtIn: false,
  citation: 'Campus safety office (2026)',
  createdAt: stamp,
  updatedAt: stamp,
  kind: 'container-sizes',
  data: {
    unit: 'L',
    limits: [
      { liquidClass: 'IA', material: 'glass', maxCapacity: 0.5 },
      { liquidClass: 'IA', material: 'metal', maxCapacity: 4 },
    ],
  },
};

export function place(overrides: Partial<LocationDetail> = {}): LocationDetail {
  return {
    id: 10,
    name: 'Room 204',
    kind: 'room',
    parentId: null,
    path: 'Room 204',
    depth: 0,
    storageGroups: [],
    notes: '',
    flammableStorage: null,
    containerCount: 0,
    childCount: 0,
    createdAt: stamp,
    updatedAt: stamp,
    ancestors: [],
    children: [],
    subtreeContainerCount: 0,
    warnings: [],
    ...overrides,
  };
}

export function listedPlace(overrides: Partial<Location> = {}): Location {
  const {
    ancestors: _a,
    children: _c,
    subtreeContainerCount: _s,
    warnings: _w,
    ...rest
  } = place(overrides);
  return rest;
}

/** 37.2 m² ≈ 400 ft², Class B, storey 2: Class I 10 gal per 100 ft² → 40 gal = 151.4 L. */
export const room204: LabAreaDetail = {
  id: 3,
  locationId: 10,
  name: 'Room 204',
  path: 'Room 204',
  kind: 'lab-unit',
  unitClass: 'B',
  floorArea: 37.2,
  floorAreaUnit: 'm2',
  storey: 2,
  instructional: false,
  notes: '',
  flammableRuleSet: { id: 1, name: nfpa45.name, citation: nfpa45.citation, builtIn: true },
  containerSizeRuleSet: { id: 2, name: sizes.name, citation: sizes.citation, builtIn: false },
  limits: [
    {
      key: 'class-i',
      label: 'Class I liquids, cabinets and safety cans included',
      limitLitres: 151.4,
      heldLitres: 140.0,
      marginLitres: 11.4,
      fractionUsed: 0.925,
      status: 'near',
      working: [
        { text: '37.2 m² ≈ 400 ft²', litres: 0 },
        { text: '400 ft² × 10 gal per 100 ft² = 40 gal = 151.4 L', litres: 151.4 },
      ],
    },
    {
      key: 'class-i-outside-storage',
      label: 'Class I liquids outside cabinets and safety cans',
      limitLitres: 75.7,
      heldLitres: 80.0,
      marginLitres: -4.3,
      fractionUsed: 1.057,
      status: 'over',
      working: [{ text: 'half of 151.4 L = 75.7 L', litres: 75.7 }],
    },
  ],
  worstFractionUsed: 1.057,
  status: 'over',
  notCountedCount: 1,
  containerSizeBreachCount: 1,
  reminder: roomRulesReminder,
  createdAt: stamp,
  updatedAt: stamp,
  byClass: [{ liquidClass: 'IB', inStorageLitres: 60, outsideStorageLitres: 80, totalLitres: 140 }],
  containers: [
    {
      containerId: 71,
      labelCode: 'LW-00071',
      chemical: {
        id: 5,
        name: 'Ethanol',
        ghsPictograms: ['GHS02', 'GHS07'],
        hazardStatements: ['H225', 'H319'],
      },
      liquidClass: 'IB',
      litres: 80,
      inStorage: false,
      storageKind: null,
      locationId: 10,
      locationPath: 'Room 204',
      material: 'metal',
      capacityLitres: 100,
    },
  ],
  countedWaste: [],
  notCounted: [
    {
      containerId: 72,
      labelCode: 'LW-00072',
      chemical: { id: 6, name: 'Mystery solvent', ghsPictograms: ['GHS02'], hazardStatements: [] },
      locationPath: 'Room 204',
      reason: 'add its flash point',
    },
  ],
  containerSizeBreaches: [
    {
      containerId: 73,
      labelCode: 'LW-00073',
      chemicalName: 'Diethyl ether',
      liquidClass: 'IA',
      material: 'glass',
      capacityLitres: 1,
      limitLitres: 0.5,
      source: 'Campus safety office (2026)',
    },
  ],
  storagePlaces: [],
};

export function listedArea(area: LabAreaDetail = room204) {
  const {
    byClass: _b,
    containers: _c,
    countedWaste: _cw,
    notCounted: _n,
    containerSizeBreaches: _s,
    storagePlaces: _p,
    ...rest
  } = area;
  return rest;
}
