import {
  ChemError,
  computeStoichiometry,
  flagYield,
  measuringDensity,
  productYields,
  type ChemWarning,
  type ProcedureLine,
  type StoichiometryResult,
} from '@lotwise/chem';
import { formatLabelCode, todayIso, type RunRecordParsed, type User } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { ContainerRow } from '../containers/container.entity';
import { appendEntry, roundQuantity, toStockUnit } from '../containers/containers.service';
import { peroxideDueOf } from '../containers/peroxide-dates';
import { markPlanRecorded } from '../plans/plans.service';
import { chemLinesOf, loadProcedure, type LoadedProcedure } from '../procedures/procedures.service';
import { checkWaste, wasteFieldsAt, withWasteWarnings, writeWaste } from '../waste/waste-contents';
import { applyDraws, resolveDraws } from './run-draws';
import { requireOwnRun } from './run-opening';
import { requireRun } from './run-views';

/**
 * Records a run (inside the caller's transaction): every draw as a `drawn` ledger entry of
 * the run, every portion of product as a new prepared lot and container (`received` entry
 * of the run), the crude and purified yields from the amounts really drawn, each with its
 * own flag, the waste sent to waste containers, and the plan's reservations released. Any
 * failure throws and the transaction
 * writes nothing.
 */
export async function recordRunWith(
  repos: Repositories,
  runId: number,
  input: RunRecordParsed,
  actor: User,
  options: { now?: string; today?: string } = {},
): Promise<void> {
  const now = options.now ?? nowIso();
  const today = options.today ?? todayIso();
  const run = await requireRun(repos, runId);
  requireOwnRun(run, actor);
  if (run.status === 'recorded') {
    throw AppError.conflict(`Run #${run.id} is already recorded; its ledger entries stand.`);
  }
  const procedure: LoadedProcedure = await loadProcedure(repos, run.procedureId);
  const performedOn = input.performedOn ?? today;
  const chemicals = new Map(procedure.chemicals);
  const chemicalOf = async (id: number): Promise<ChemicalRow> => {
    if (!chemicals.has(id)) chemicals.set(id, (await repos.chemicals.findRow(id))!);
    return chemicals.get(id)!;
  };

  // 1. The draws, checked (every required line drawn) before anything is written.
  const resolved = await resolveDraws(repos, procedure, input, chemicalOf);

  // 2. The products: portions in the product's stock unit.
  const productIndexes = procedure.lines.flatMap((line, index) =>
    line.role === 'product' ? [index] : [],
  );
  const portions: {
    lineIndex: number;
    label: string;
    stockQuantity: number;
    portion: RunRecordParsed['products'][number]['portions'][number];
    path: string;
  }[] = [];
  const crudeByLine = new Map<number, number>();
  for (const [p, product] of input.products.entries()) {
    const lineIndex = product.lineIndex ?? productIndexes[0];
    if (lineIndex === undefined || procedure.lines[lineIndex]?.role !== 'product') {
      throw AppError.validation(
        `"${procedure.row.title}" has no product line ${(lineIndex ?? 0) + 1}.`,
        {
          [`products.${p}.lineIndex`]: 'is not a product line',
        },
      );
    }
    if (product.crudeMassG !== null) crudeByLine.set(lineIndex, product.crudeMassG);
    const chemical = await chemicalOf(procedure.lines[lineIndex]!.chemicalId);
    for (const [q, portion] of product.portions.entries()) {
      const path = `products.${p}.portions.${q}`;
      portions.push({
        lineIndex,
        label: portion.label,
        stockQuantity: roundQuantity(
          toStockUnit(portion.quantity, portion.unit, chemical, `${path}.quantity`),
        ),
        portion,
        path,
      });
    }
  }

  // 3. The draws written, in the order given (every warning, of holds and of waste, at once).
  const wasteWarnings = await checkWaste(
    repos,
    input.waste.map((waste, i) => ({ input: waste, field: wasteFieldsAt(`waste.${i}.`) })),
    input.confirm,
  );
  const drawnByLine = await withWasteWarnings(wasteWarnings, () =>
    applyDraws(repos, run, procedure, resolved, actor, {
      now,
      performedOn,
      today,
      confirm: input.confirm,
    }),
  );

  // 4. The stoichiometry of what was really drawn (products: the portions put into stock).
  const notices: string[] = [];
  const leftOut = new Set<number>();
  const planned1 = chemLinesOf(procedure, run.scaleFactor);
  const actualLines: ProcedureLine[] = procedure.lines.map((line, index) => {
    const base = { ...planned1[index]! };
    const chemical = chemicals.get(line.chemicalId)!;
    if (line.role === 'product') {
      const total = portions
        .filter((portion) => portion.lineIndex === index)
        .reduce((sum, portion) => sum + portion.stockQuantity, 0);
      // The crude mass has its own yield below; it never stands in for the purified one.
      delete base.quantity;
      if (total > 0) base.quantity = { value: total, unit: chemical.stockUnit };
      return base;
    }
    const draws = drawnByLine.get(index);
    if (!draws?.length) {
      // Only an optional line gets here (resolveDraws refuses the others): it was not used.
      if (base.quantity) {
        notices.push(
          `Line ${index + 1} (${chemical.name}) is optional and nothing was drawn for it: it is left out of the calculation.`,
        );
      }
      leftOut.add(index);
      delete base.quantity;
      return base;
    }
    const total = draws.reduce((sum, d) => sum + d.quantity, 0);
    const actual: ProcedureLine = { ...base, quantity: { value: total, unit: chemical.stockUnit } };
    if (!line.concentration) {
      const purity = draws.reduce((sum, d) => sum + d.quantity * d.purity, 0) / total;
      if (Math.abs(purity - 100) > 1e-9) actual.purityPercent = purity;
      else delete actual.purityPercent;
    }
    return actual;
  });
  let stoichiometry: StoichiometryResult;
  try {
    stoichiometry = computeStoichiometry(actualLines);
  } catch (error) {
    if (error instanceof ChemError)
      throw AppError.validation(error.message, { lines: error.message });
    throw error;
  }
  const mainIndex = input.products[0]?.lineIndex ?? productIndexes[0];
  const main = mainIndex === undefined ? undefined : stoichiometry.lines[mainIndex];
  const theoreticalG = main?.theoretical?.massG ?? null;
  const mainTotal = portions
    .filter((portion) => portion.lineIndex === mainIndex)
    .reduce((sum, portion) => sum + portion.stockQuantity, 0);
  // Purified: by computeStoichiometry (by moles for a solution product); crude: by mass.
  const purified =
    main?.percentYield === undefined ? null : flagYield('purified', main.percentYield);
  const percent = purified?.percent ?? null;
  const crudeMassG = mainIndex === undefined ? null : (crudeByLine.get(mainIndex) ?? null);
  const crude =
    crudeMassG !== null && theoreticalG !== null && theoreticalG > 0
      ? productYields({ theoreticalG, crudeG: crudeMassG }).crude
      : null;
  const crudeWarnings: ChemWarning[] = (crude?.warnings ?? []).map((warning) => ({
    ...warning,
    ...(mainIndex === undefined ? {} : { lineIndex: mainIndex }),
  }));
  const mainChemical =
    mainIndex === undefined ? undefined : chemicals.get(procedure.lines[mainIndex]!.chemicalId);
  const toGrams = (stockQuantity: number, chemical: ChemicalRow | undefined) => {
    if (!chemical) return null;
    if (chemical.stockUnit === 'g') return stockQuantity;
    const density = measuringDensity(chemical); // a solid's bulk density, never its crystal's
    return density === null ? null : stockQuantity * density;
  };
  const productMassG = mainTotal > 0 ? toGrams(mainTotal, mainChemical) : null;

  // 5. Each portion becomes a prepared lot and a labelled container.
  for (const item of portions) {
    const chemical = chemicals.get(procedure.lines[item.lineIndex]!.chemicalId)!;
    const location = await repos.locations.findRow(item.portion.locationId);
    if (!location) {
      throw AppError.validation(`There is no location #${item.portion.locationId}.`, {
        [`${item.path}.locationId`]: `no location #${item.portion.locationId}`,
      });
    }
    const lotId = await repos.lots.insert({
      chemicalId: chemical.id,
      source: 'prepared',
      supplierName: null,
      supplierLotNumber: null,
      grade: null,
      purityPercent: null,
      receivedOn: performedOn,
      expiresOn: item.portion.expiresOn,
      madeByRunId: run.id,
      certificateFileName: null,
      certificateStoredName: null,
      notes: `${item.label} of run #${run.id} (${procedure.row.title})`,
      createdAt: now,
      updatedAt: now,
    });
    const labelNumber = await repos.containers.nextLabelNumber();
    const row: Omit<ContainerRow, 'id'> = {
      labelCode: formatLabelCode(labelNumber),
      labelNumber,
      lotId,
      chemicalId: chemical.id,
      locationId: location.id,
      status: 'sealed',
      quantity: 0,
      unit: chemical.stockUnit,
      tareMass: item.portion.tareMass,
      capacity: null,
      capacityUnit: null,
      openedOn: null,
      expiresOn: item.portion.expiresOn,
      peroxideDueOn:
        peroxideDueOf(chemical.peroxideClass, null, performedOn, item.portion.expiresOn)?.dueOn ??
        null,
      notes: item.portion.notes,
      createdAt: now,
      updatedAt: now,
    };
    const containerId = await repos.containers.insert(row);
    await appendEntry(
      repos,
      { ...row, id: containerId },
      {
        delta: item.stockQuantity,
        reason: 'received',
        note: `Made by run #${run.id} (${procedure.row.title}): ${item.label}, into ${location.path}`,
        toLocationId: location.id,
        runId: run.id,
        at: now,
      },
      actor,
    );
    const share =
      item.lineIndex === mainIndex && percent !== null && mainTotal > 0
        ? (percent * item.stockQuantity) / mainTotal
        : null;
    await repos.runs.insertProduct({
      runId: run.id,
      lineIndex: item.lineIndex,
      label: item.label,
      lotId,
      containerId,
      chemicalId: chemical.id,
      quantity: item.stockQuantity,
      unit: chemical.stockUnit,
      massG: toGrams(item.stockQuantity, chemical),
      percentYield: share,
      createdAt: now,
    });
  }

  // 6. Washings, filtrates and residues into their waste containers.
  for (const waste of input.waste) {
    await writeWaste(repos, waste, { runId: run.id }, actor, { now, today: performedOn });
  }

  // 7. The run itself, and its plan.
  await repos.runs.update(run.id, {
    status: 'recorded',
    performedOn,
    theoreticalYieldG: theoreticalG,
    crudeMassG,
    productMassG,
    percentYield: percent,
    crudePercentYield: crude?.percent ?? null,
    yieldFlag: purified?.flag ?? null,
    crudeYieldFlag: crude?.flag ?? null,
    meltingLowC: input.observations.meltingRangeC?.low ?? null,
    meltingHighC: input.observations.meltingRangeC?.high ?? null,
    appearance: input.observations.appearance,
    observationNotes: input.observations.notes,
    actualLines,
    stoichiometry,
    // A line left out on purpose needs no "no quantity" warning.
    warnings: [
      ...stoichiometry.warnings.filter(
        (w) => !(w.code === 'quantity_missing' && leftOut.has(w.lineIndex ?? -1)),
      ),
      ...crudeWarnings,
    ],
    notices,
    recordedAt: now,
    updatedAt: now,
  });
  if (run.planId !== null) await markPlanRecorded(repos, run.planId, run.id);
}
