import { roundMassForDisplay, roundVolumeForDisplay, type DisplayValue } from '@lotwise/chem';
import {
  safetyDeferral,
  type DispensingSheet,
  withRoundedText,
  type PlanDetail,
  type Procedure,
  type Run,
  type StockCheckLine,
} from '@lotwise/shared';

/** Test data of our own, shaped like the Lotwise API's answers (text by the shared rule). */
export const display = (value: number, unit: 'g' | 'mL'): DisplayValue =>
  withRoundedText(unit === 'g' ? roundMassForDisplay(value) : roundVolumeForDisplay(value));

export function makeStockLine(overrides: Partial<StockCheckLine> = {}): StockCheckLine {
  return {
    index: 0,
    lineIndex: 0,
    purpose: 'line',
    role: 'reagent',
    optional: false,
    chemical: {
      id: 11,
      name: 'Benzaldehyde',
      stockUnit: 'mL',
      density: 1.046,
      defaultPurityPercent: 100,
    },
    unit: 'mL',
    perBench: 0.5,
    perBenchDisplay: display(0.5, 'mL'),
    required: 4.4,
    requiredDisplay: display(4.4, 'mL'),
    requiredPure: 4.4,
    requiredPureG: 4.6024,
    available: 57.25,
    availablePure: 57.25,
    availablePureG: 59.88,
    shortfall: 0,
    shortfallPureG: 0,
    status: 'ok',
    problem: null,
    take: [
      {
        containerId: 25,
        labelCode: 'LW-00025',
        lotId: 12,
        locationId: 19,
        locationPath: 'Room 103 › Club cupboard',
        status: 'open',
        expiresOn: '2026-12-31',
        purityPercent: 100,
        quantity: 57.25,
        reservedByOthers: 0,
        reservedByThisPlan: 0,
        free: 57.25,
        take: 4.4,
        takePure: 4.4,
      },
    ],
    suggestions: [],
    benchesCovered: 8,
    remedy: null,
    ...overrides,
  };
}

export function makePlanDetail(overrides: Partial<PlanDetail> = {}): PlanDetail {
  return {
    id: 2,
    procedure: { id: 4, title: 'Dibenzalacetone by aldol condensation' },
    scaleFactor: 0.25,
    benches: 8,
    overagePercent: 10,
    totalFactor: 2.2,
    plannedOn: '2026-12-10',
    status: 'draft',
    notes: '',
    createdBy: { id: 2, displayName: 'Tess Technician' },
    reservedUntil: null,
    runId: null,
    createdAt: '2026-12-01T08:00:00.000Z',
    updatedAt: '2026-12-01T08:00:00.000Z',
    stockCheck: {
      asOf: '2026-12-10',
      lines: [makeStockLine()],
      ok: true,
      shortCount: 0,
      benchesServed: 8,
      rule: 'Counted: usable containers.',
    },
    hazards: [
      {
        chemicalId: 11,
        name: 'Benzaldehyde',
        ghsPictograms: ['GHS07'],
        hazardStatements: [{ code: 'H302', text: 'Harmful if swallowed' }],
      },
    ],
    cautions: {
      text: 'No flames near the ethanol.',
      flags: {
        exothermicAddition: false,
        keepBelowC: 30,
        flammableSolvent: true,
        toxicGas: false,
        fumeHood: false,
      },
      items: [
        'Keep the mixture below 30 °C.',
        'Flammable solvent: no open flames; heat on a water bath or heating mantle.',
      ],
    },
    safetyDeferral,
    reservations: [],
    ...overrides,
  };
}

/** The dispensing sheet of `plan`, one sheet line per stock check row. */
export function makeDispensingSheet(
  plan: PlanDetail,
  overrides: Partial<DispensingSheet> = {},
): DispensingSheet {
  return {
    planId: plan.id,
    procedure: {
      id: plan.procedure.id,
      title: plan.procedure.title,
      reference: 'Lotwise demo handout C3 (invented).',
      baseScale: 'One bench: 0.70 mL acetone.',
    },
    plannedOn: plan.plannedOn,
    scaleFactor: plan.scaleFactor,
    benches: plan.benches,
    overagePercent: plan.overagePercent,
    lines: plan.stockCheck.lines.map((line) => ({
      lineIndex: line.lineIndex,
      purpose: line.purpose,
      chemicalId: line.chemical.id,
      name: line.chemical.name,
      role: line.role,
      optional: line.optional,
      notes: '',
      perBench: line.perBench === null ? null : { value: line.perBench, unit: line.unit },
      perBenchDisplay: line.perBenchDisplay,
      total: line.required,
      totalDisplay: line.requiredDisplay,
      ghsPictograms: ['GHS07'],
      containers: line.take.map((take) => ({
        containerId: take.containerId,
        labelCode: take.labelCode,
        locationPath: take.locationPath,
        take: take.take,
        quantity: take.quantity,
        unit: line.unit,
      })),
      stock: {
        status: line.status,
        unit: line.unit,
        shortfall: line.shortfall,
        problem: line.problem,
        suggestions: line.suggestions,
        benchesCovered: line.benchesCovered,
        remedy: line.remedy,
      },
    })),
    shortCount: plan.stockCheck.shortCount,
    benchesServed: plan.stockCheck.benchesServed,
    hazards: plan.hazards,
    cautions: plan.cautions,
    rules: ['Balance: 0.01 g.'],
    safetyDeferral: plan.safetyDeferral,
    ...overrides,
  };
}

export function makeRun(overrides: Partial<Run> = {}): Run {
  return {
    id: 12,
    procedure: { id: 1, title: 'Aspirin from salicylic acid and acetic anhydride' },
    planId: null,
    scaleFactor: 1,
    status: 'open',
    performedBy: { id: 2, displayName: 'Tess Technician' },
    performedOn: null,
    theoreticalYieldG: null,
    crudeMassG: null,
    productMassG: null,
    percentYield: null,
    crudePercentYield: null,
    expectedYieldPercent: 80,
    yieldFlag: null,
    crudeYieldFlag: null,
    recordedAt: null,
    createdAt: '2026-12-02T09:00:00.000Z',
    deviationCount: 0,
    notes: '',
    draws: [],
    portions: [],
    stoichiometry: null,
    warnings: [],
    notices: [],
    observations: {
      meltingRangeC: null,
      literatureMeltingC: { low: 135, high: 136 },
      meltingComparison: null,
      appearance: '',
      notes: '',
    },
    ...overrides,
  };
}

type ProcedureLineView = Procedure['lines'][number];

function line(
  index: number,
  chemical: ProcedureLineView['chemical'],
  overrides: Partial<ProcedureLineView>,
): ProcedureLineView {
  return {
    index,
    chemicalId: chemical.id,
    chemical,
    role: 'reagent',
    quantity: null,
    unit: null,
    coefficient: null,
    optional: false,
    notes: '',
    concentration: null,
    solutionDensity: null,
    dissolvedIn: null,
    ...overrides,
  };
}

// Molar masses calculated from CIAAW 2021 standard atomic weights.
export const salicylicAcid = {
  id: 7,
  name: 'Salicylic acid',
  formula: 'C7H6O3',
  molarMass: 138.122,
  density: null,
  defaultPurityPercent: 100,
  stockUnit: 'g' as const,
  ghsPictograms: ['GHS05' as const, 'GHS07' as const],
  hazardStatements: ['H302', 'H318'],
};
export const aceticAnhydride = {
  id: 6,
  name: 'Acetic anhydride',
  formula: 'C4H6O3',
  molarMass: 102.089,
  density: 1.082,
  defaultPurityPercent: 100,
  stockUnit: 'mL' as const,
  ghsPictograms: ['GHS02' as const, 'GHS05' as const, 'GHS06' as const],
  hazardStatements: ['H226', 'H302', 'H314', 'H330'],
};
export const acetylsalicylicAcid = {
  id: 8,
  name: 'Acetylsalicylic acid',
  formula: 'C9H8O4',
  molarMass: 180.159,
  density: null,
  defaultPurityPercent: 100,
  stockUnit: 'g' as const,
  ghsPictograms: ['GHS07' as const],
  hazardStatements: ['H302'],
};

/** The aspirin procedure of docs/preparations-worked-examples.md, without its catalyst. */
export function makeAspirinProcedure(overrides: Partial<Procedure> = {}): Procedure {
  return {
    id: 1,
    title: 'Aspirin from salicylic acid and acetic anhydride',
    reference: 'Invented teaching handout',
    baseScale: 'One bench: 2.0 g salicylic acid',
    expectedYieldPercent: 80,
    literatureMeltingC: { low: 135, high: 136 },
    cautions: 'Acetic anhydride is corrosive: dispense it in the hood.',
    cautionFlags: {
      exothermicAddition: false,
      keepBelowC: null,
      flammableSolvent: false,
      toxicGas: false,
      fumeHood: true,
    },
    lines: [
      line(0, salicylicAcid, { role: 'limiting-reagent', quantity: 2, unit: 'g', coefficient: 1 }),
      line(1, aceticAnhydride, { role: 'reagent', quantity: 5, unit: 'mL', coefficient: 1 }),
      line(2, acetylsalicylicAcid, { role: 'product', coefficient: 1 }),
    ],
    steps: [],
    stoichiometry: null,
    stoichiometryError: null,
    productChemicalIds: [8],
    runCount: 0,
    createdBy: null,
    createdAt: '2026-08-01T08:00:00.000Z',
    updatedAt: '2026-08-01T08:00:00.000Z',
    ...overrides,
  };
}
