import {
  ChemError,
  displayQuantity,
  factorForProduct,
  lineAmounts,
  measuringDensity,
  type ProcedureLine,
} from '@lotwise/chem';
import {
  allocateHolds,
  formatQuantity,
  withRoundedText,
  type StockCheck,
  type StockCheckLine,
  type StockSuggestion,
  type StockTake,
  type StockUnit,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import { toStockUnit } from '../containers/containers.service';
import {
  chemLinesOf,
  chemicalIdsOf,
  chemicalsById,
  loadProcedure,
  type LoadedProcedure,
} from '../procedures/procedures.service';
import type { PlanRow } from './plan.entity';
import type { StockRow } from './plans.repository';

const epsilon = 1e-9;

/** Rounded to a millionth, as stock quantities are kept. */
export function tidy(value: number): number {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Object.is(rounded, -0) ? 0 : rounded;
}

/** How the stock check reads and orders stock (stated on the page). */
export const STOCK_CHECK_RULE =
  'Counted: containers that are sealed or open, not expired on the plan date (or today, whichever is later) and not reserved by another plan. Purity is applied lot by lot: a 95 % lot counts 95 % of its quantity as pure substance. Take from containers expiring soonest first, then open ones, then the smallest remaining.'; // common practice, no source

/** A row the stock check needs to cover, before looking at stock. */
interface Requirement {
  lineIndex: number;
  purpose: 'line' | 'dissolving';
  chemical: ChemicalRow;
  role: StockCheckLine['role'];
  optional: boolean;
  /** As supplied at the chemical's default purity, stock unit, per bench. */
  perBench: number | null;
  /**
   * Grams of pure substance in one stock unit of pure stock: the solute a millilitre of a
   * 1 M NaOH solution holds (0.039997 g), the density of a neat liquid, 1 for a mass.
   * Null when unknown.
   */
  gramsPerPureUnit: number | null;
  problem: string | null;
}

/** A line's scaled amount in its chemical's stock unit (what is measured from the bottle). */
function stockAmountOf(
  line: ProcedureLine,
  chemical: ChemicalRow,
): { value: number | null; gramsPerPureUnit: number | null; problem: string | null } {
  try {
    const amounts = lineAmounts(line);
    const value = chemical.stockUnit === 'g' ? amounts.massG : amounts.volumeMl;
    if (value !== undefined) {
      // The pure substance is what packages/chem says the line holds of the substance itself
      // (for a solution, its solute), not the mass of what is measured.
      const purePerBench = value * (chemical.defaultPurityPercent / 100);
      const gramsPerPureUnit =
        amounts.pureMassG !== undefined && purePerBench > 0
          ? amounts.pureMassG / purePerBench
          : line.concentration
            ? null // a solution's solute is unknown without its molar mass
            : neatGramsPerUnit(chemical);
      return { value, gramsPerPureUnit, problem: null };
    }
    const need =
      chemical.stockUnit === 'mL' && amounts.massG !== undefined
        ? 'its density'
        : amounts.missing.length > 0
          ? amounts.missing.join(' and ')
          : 'a molar mass or density';
    return {
      value: null,
      gramsPerPureUnit: null,
      problem: `${chemical.name} is counted in ${chemical.stockUnit}: give ${need} to turn ${formatQuantity(line.quantity?.value ?? 0, line.quantity?.unit ?? '')} into ${chemical.stockUnit}`,
    };
  } catch (error) {
    if (error instanceof ChemError) {
      return { value: null, gramsPerPureUnit: null, problem: error.message };
    }
    throw error;
  }
}

/** Grams per stock unit of a material taken as it is (a solvent): 1 for g, else its density. */
function neatGramsPerUnit(chemical: ChemicalRow): number | null {
  return chemical.stockUnit === 'g' ? 1 : measuringDensity(chemical);
}

/** What each bench needs, line by line (products are made, not drawn). */
export function requirementsOf(procedure: LoadedProcedure, scaleFactor: number): Requirement[] {
  const lines = chemLinesOf(procedure, scaleFactor);
  const rows: Requirement[] = [];
  procedure.lines.forEach((line, index) => {
    if (line.role === 'product') return;
    const chemical = procedure.chemicals.get(line.chemicalId)!;
    const amount = stockAmountOf(lines[index]!, chemical);
    rows.push({
      lineIndex: index,
      purpose: 'line',
      chemical,
      role: line.role,
      optional: line.optional,
      perBench: amount.value,
      gramsPerPureUnit: amount.gramsPerPureUnit,
      problem: amount.problem,
    });
    if (line.dissolvedInChemicalId !== null) {
      const solvent = procedure.chemicals.get(line.dissolvedInChemicalId)!;
      let perBench: number | null = null;
      let problem: string | null = null;
      try {
        perBench = toStockUnit(
          line.dissolvedInQuantity! * scaleFactor,
          line.dissolvedInUnit!,
          solvent,
          'dissolvedIn',
        );
      } catch (error) {
        problem = error instanceof Error ? error.message : String(error);
      }
      rows.push({
        lineIndex: index,
        purpose: 'dissolving',
        chemical: solvent,
        role: 'solvent',
        optional: line.optional,
        perBench,
        gramsPerPureUnit: neatGramsPerUnit(solvent),
        problem,
      });
    }
  });
  return rows;
}

/** Expiring soonest first (no date last), then open before sealed, then smallest remaining. */
export function takeOrder(a: StockRow, b: StockRow): number {
  if (a.expiresOn !== b.expiresOn) {
    if (a.expiresOn === null) return 1;
    if (b.expiresOn === null) return -1;
    return a.expiresOn < b.expiresOn ? -1 : 1;
  }
  if (a.status !== b.status) return a.status === 'open' ? -1 : 1;
  if (a.quantity !== b.quantity) return a.quantity - b.quantity;
  return a.id - b.id;
}

function roundUp2(value: number): number {
  if (value <= 0) return value;
  const magnitude = 10 ** (Math.floor(Math.log10(value)) - 1);
  return Number((Math.ceil(value / magnitude - 1e-9) * magnitude).toPrecision(2));
}

/** "Prepare it first": procedures (other than `excludeId`) whose product is this chemical. */
async function prepareSuggestions(
  repos: Repositories,
  chemical: ChemicalRow,
  shortfall: number,
  excludeId: number,
  cache: Map<number, LoadedProcedure>,
  producers: number[],
): Promise<StockSuggestion[]> {
  const suggestions: StockSuggestion[] = [];
  for (const procedureId of producers) {
    if (procedureId === excludeId) continue;
    let procedure = cache.get(procedureId);
    if (!procedure) {
      procedure = await loadProcedure(repos, procedureId);
      cache.set(procedureId, procedure);
    }
    const productLineIndex = procedure.lines.findIndex(
      (line) => line.role === 'product' && line.chemicalId === chemical.id,
    );
    const expectedYieldPercent = procedure.row.expectedYieldPercent ?? 100;
    try {
      const lines = chemLinesOf(procedure);
      const factor = factorForProduct(
        lines,
        { value: shortfall, unit: chemical.stockUnit },
        { productIndex: productLineIndex, expectedYieldPercent },
      );
      const roundedFactor = roundUp2(factor);
      suggestions.push({
        kind: 'prepare',
        procedureId,
        procedureTitle: procedure.row.title,
        productLineIndex,
        factor,
        roundedFactor,
        expectedYieldPercent,
        expectedAmount: tidy((shortfall * roundedFactor) / factor),
        unit: chemical.stockUnit,
      });
    } catch (error) {
      if (!(error instanceof ChemError)) throw error;
      // That procedure cannot be scaled to this amount (missing data): no suggestion.
    }
  }
  return suggestions;
}

/** Pure stock (in the stock unit) as grams of the substance itself; null when unknown. */
function pureGrams(pureStock: number, requirement: Requirement): number | null {
  return requirement.gramsPerPureUnit === null
    ? null
    : tidy(pureStock * requirement.gramsPerPureUnit);
}

function display(value: number | null, unit: StockUnit) {
  return value === null ? null : withRoundedText(displayQuantity({ value, unit }));
}

/**
 * Benches a line can serve from what the check takes for it: each bench needs its share of
 * the required amount (overage included), so a line short by a fraction of one bench serves
 * one bench fewer. Null when the amount could not be worked out.
 */
function benchesCovered(
  benches: number,
  requiredPure: number | null,
  shortPure: number,
): number | null {
  if (requiredPure === null) return null;
  if (shortPure <= 1e-7 || requiredPure <= 0) return benches;
  const perBench = requiredPure / benches;
  return Math.max(0, Math.min(benches, Math.floor((requiredPure - shortPure) / perBench + 1e-9)));
}

/**
 * The stock check of a plan: for every line the amount required, what usable stock there
 * is (purity counted, other plans' reservations taken off), the shortfall, the containers
 * to take from in order, what to do when short (reorder, or prepare it first) and how many
 * benches what is on hand serves. The dispensing sheet reads its shortfalls from here.
 */
export async function stockCheckOf(
  repos: Repositories,
  plan: Pick<
    PlanRow,
    'id' | 'procedureId' | 'scaleFactor' | 'benches' | 'overagePercent' | 'plannedOn'
  >,
  today: string,
  procedure?: LoadedProcedure,
): Promise<{ check: StockCheck; procedure: LoadedProcedure }> {
  const loaded = procedure ?? (await loadProcedure(repos, plan.procedureId));
  const asOf = plan.plannedOn > today ? plan.plannedOn : today;
  const requirements = requirementsOf(loaded, plan.scaleFactor);
  const multiplier = plan.benches * (1 + plan.overagePercent / 100);
  const chemicalIds = [...new Set(requirements.map((r) => r.chemical.id))];
  const stock = (await repos.plans.usableContainers(chemicalIds, asOf)).sort(takeOrder);
  const reservations = await repos.plans.activeOn(
    stock.map((row) => row.id),
    today,
  );
  // What each reservation holds now: never more than is left in its container.
  const heldNow = new Map<number, number>();
  for (const row of stock) {
    const claims = reservations.filter((r) => r.containerId === row.id);
    for (const [id, amount] of allocateHolds(row.quantity, claims)) heldNow.set(id, amount);
  }
  const reservedByOthers = new Map<number, number>();
  const reservedByThis = new Map<number, number>();
  for (const reservation of reservations) {
    const map = reservation.planId === plan.id ? reservedByThis : reservedByOthers;
    map.set(
      reservation.containerId,
      (map.get(reservation.containerId) ?? 0) + (heldNow.get(reservation.id) ?? 0),
    );
  }
  // What is still free in each container as the rows take from it, in order.
  const remaining = new Map(
    stock.map((row) => [row.id, Math.max(0, row.quantity - (reservedByOthers.get(row.id) ?? 0))]),
  );
  const cache = new Map<number, LoadedProcedure>([[loaded.row.id, loaded]]);
  // Which procedures make each chemical: read once for every chemical, at the first shortfall.
  let producers: Map<number, number[]> | null = null;
  const lines: StockCheckLine[] = [];
  for (const [index, requirement] of requirements.entries()) {
    const chemical = requirement.chemical;
    const nominal = chemical.defaultPurityPercent / 100;
    const pool = stock.filter((row) => row.chemicalId === chemical.id);
    const available = pool.reduce((sum, row) => sum + remaining.get(row.id)!, 0);
    const availablePure = pool.reduce(
      (sum, row) => sum + (remaining.get(row.id)! * row.purityPercent) / 100,
      0,
    );
    const required = requirement.perBench === null ? null : requirement.perBench * multiplier;
    const requiredPure = required === null ? null : required * nominal;
    const take: StockTake[] = [];
    let stillPure = requiredPure ?? 0;
    for (const row of pool) {
      const free = remaining.get(row.id)!;
      if (stillPure <= epsilon || free <= epsilon) continue;
      const purity = row.purityPercent / 100;
      const takePure = Math.min(stillPure, free * purity);
      const amount = takePure / purity;
      remaining.set(row.id, free - amount);
      stillPure -= takePure;
      take.push({
        containerId: row.id,
        labelCode: row.labelCode,
        lotId: row.lotId,
        locationId: row.locationId,
        locationPath: row.locationPath,
        status: row.status,
        expiresOn: row.expiresOn,
        purityPercent: row.purityPercent,
        quantity: row.quantity,
        reservedByOthers: tidy(reservedByOthers.get(row.id) ?? 0),
        reservedByThisPlan: tidy(reservedByThis.get(row.id) ?? 0),
        free: tidy(Math.max(0, row.quantity - (reservedByOthers.get(row.id) ?? 0))),
        take: tidy(amount),
        takePure: tidy(takePure),
      });
    }
    const shortPure = required === null ? 0 : Math.max(0, stillPure);
    const shortfall = shortPure <= 1e-7 ? 0 : tidy(shortPure / nominal);
    const status: StockCheckLine['status'] =
      required === null ? 'unconvertible' : shortfall > 0 ? 'short' : 'ok';
    const suggestions: StockSuggestion[] = [];
    if (status === 'short') {
      suggestions.push({
        kind: 'reorder',
        chemicalId: chemical.id,
        shortfall,
        unit: chemical.stockUnit,
        reorderQuantity: chemical.reorderQuantity,
        href: `/orders/new?chemicalId=${chemical.id}&quantity=${shortfall}&unit=${chemical.stockUnit}`,
      });
      producers ??= await repos.procedures.producingAny(chemicalIds);
      suggestions.push(
        ...(await prepareSuggestions(
          repos,
          chemical,
          shortfall,
          loaded.row.id,
          cache,
          producers.get(chemical.id) ?? [],
        )),
      );
    }
    const covered = benchesCovered(plan.benches, requiredPure, shortPure);
    lines.push({
      index,
      lineIndex: requirement.lineIndex,
      purpose: requirement.purpose,
      role: requirement.role,
      optional: requirement.optional,
      chemical: {
        id: chemical.id,
        name: chemical.name,
        stockUnit: chemical.stockUnit,
        density: chemical.density,
        defaultPurityPercent: chemical.defaultPurityPercent,
      },
      unit: chemical.stockUnit,
      perBench: requirement.perBench === null ? null : tidy(requirement.perBench),
      perBenchDisplay: display(requirement.perBench, chemical.stockUnit),
      required: required === null ? null : tidy(required),
      requiredDisplay: display(required, chemical.stockUnit),
      requiredPure: requiredPure === null ? null : tidy(requiredPure),
      requiredPureG: requiredPure === null ? null : pureGrams(requiredPure, requirement),
      available: tidy(available),
      availablePure: tidy(availablePure),
      availablePureG: pureGrams(availablePure, requirement),
      shortfall,
      shortfallPureG: shortfall > 0 ? pureGrams(shortPure, requirement) : 0,
      status,
      problem: requirement.problem,
      take,
      suggestions,
      benchesCovered: covered,
      remedy:
        status !== 'short'
          ? null
          : suggestions.some((suggestion) => suggestion.kind === 'prepare')
            ? 'prepare'
            : 'reorder',
    });
  }
  const shortCount = lines.filter((line) => line.status !== 'ok' && !line.optional).length;
  const benchesServed = Math.min(
    plan.benches,
    ...lines.filter((line) => !line.optional).map((line) => line.benchesCovered ?? 0),
  );
  return {
    check: {
      asOf,
      lines,
      ok: shortCount === 0,
      shortCount,
      benchesServed,
      rule: STOCK_CHECK_RULE,
    },
    procedure: loaded,
  };
}

/** Loads the chemicals of a procedure (including products) for hazards. */
export async function planChemicals(repos: Repositories, procedure: LoadedProcedure) {
  return chemicalsById(repos, chemicalIdsOf(procedure.lines), new Map(procedure.chemicals));
}
