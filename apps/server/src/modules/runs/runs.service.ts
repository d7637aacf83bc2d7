import {
  ChemError,
  computeStoichiometry,
  convert,
  percentYield,
  YIELD_ABOVE_100_ADVICE,
  type ProcedureLine,
  type StoichiometryResult,
} from '@lotwise/chem';
import {
  can,
  formatDecimal,
  formatFullPrecision,
  formatLabelCode,
  formatQuantity,
  todayIso,
  type ChemicalUsage,
  type LotProvenance,
  type Page,
  type ProcedureRuns,
  type Run,
  type RunCreateParsed,
  type RunListQuery,
  type RunRecordParsed,
  type RunSummary,
  type User,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { ContainerRow } from '../containers/container.entity';
import {
  appendEntry,
  roundQuantity,
  statusAfter,
  toStockUnit,
} from '../containers/containers.service';
import { peroxideDueOf } from '../containers/peroxide-dates';
import { markPlanRecorded, requireOwnPlan } from '../plans/plans.service';
import { chemLinesOf, loadProcedure, type LoadedProcedure } from '../procedures/procedures.service';
import type { RunRow } from './run.entity';

const epsilon = 1e-6;

/** Compares a measured melting range with the literature's. // common practice, no source */
export function meltingComparison(
  measured: { low: number; high: number } | null,
  literature: { low: number; high: number } | null,
): string | null {
  if (!measured || !literature) return null;
  const range = `${formatDecimal(literature.low, 2)}–${formatDecimal(literature.high, 2)} °C`;
  let text: string;
  if (measured.high < literature.low) {
    text = `${formatDecimal(literature.low - measured.high, 1)} °C below the literature range (${range}): probably impure or still wet`;
  } else if (measured.low > literature.high) {
    text = `${formatDecimal(measured.low - literature.high, 1)} °C above the literature range (${range}): check the thermometer and the identity of the product`;
  } else {
    text = `within or overlapping the literature range (${range})`;
  }
  // A melting range wider than about 2 °C points to impurities. // common practice, no source
  if (measured.high - measured.low > 2) text += '; a range wider than 2 °C suggests impurity';
  return text;
}

/** A run its performer may record; anyone else needs `plans.manage`. */
function requireOwnRun(run: RunRow, actor: User) {
  if (run.performedById !== actor.id && !can(actor.role, 'plans.manage')) {
    throw AppError.forbidden(
      `Run #${run.id} belongs to someone else: only the person running it or a manager can record it.`,
    );
  }
}

async function requireRun(repos: Repositories, id: number): Promise<RunRow> {
  const run = await repos.runs.findRow(id);
  if (!run) throw AppError.notFound(`There is no run #${id}.`);
  return run;
}

export async function runSummaries(repos: Repositories, rows: RunRow[]): Promise<RunSummary[]> {
  const procedures = new Map(
    (await repos.procedures.rowsByIds([...new Set(rows.map((r) => r.procedureId))])).map((p) => [
      p.id,
      p,
    ]),
  );
  const users = new Map(
    (
      await repos.users.findByIds([
        ...new Set(rows.flatMap((r) => (r.performedById === null ? [] : [r.performedById]))),
      ])
    ).map((user) => [user.id, user]),
  );
  return rows.map((row) => {
    const procedure = procedures.get(row.procedureId);
    const user = row.performedById === null ? undefined : users.get(row.performedById);
    return {
      id: row.id,
      procedure: { id: row.procedureId, title: procedure?.title ?? '' },
      planId: row.planId,
      scaleFactor: row.scaleFactor,
      status: row.status,
      performedBy: user ? { id: user.id, displayName: user.displayName } : null,
      performedOn: row.performedOn,
      theoreticalYieldG: row.theoreticalYieldG,
      crudeMassG: row.crudeMassG,
      productMassG: row.productMassG,
      percentYield: row.percentYield,
      crudePercentYield: row.crudePercentYield,
      expectedYieldPercent: procedure?.expectedYieldPercent ?? null,
      yieldFlag: row.yieldFlag,
      recordedAt: row.recordedAt,
      createdAt: row.createdAt,
    };
  });
}

async function presentRun(repos: Repositories, id: number): Promise<Run> {
  const row = await requireRun(repos, id);
  const [summary] = await runSummaries(repos, [row]);
  const procedure = await repos.procedures.findRow(row.procedureId);
  const chemicals = new Map<number, string>();
  const nameOf = async (chemicalId: number) => {
    if (!chemicals.has(chemicalId)) {
      chemicals.set(chemicalId, (await repos.chemicals.findRow(chemicalId))?.name ?? '');
    }
    return chemicals.get(chemicalId)!;
  };
  const draws = [];
  for (const input of await repos.runs.inputsOf(id)) {
    const container = await repos.containers.findRow(input.containerId);
    draws.push({
      id: input.id,
      lineIndex: input.lineIndex,
      purpose: input.purpose,
      containerId: input.containerId,
      labelCode: container?.labelCode ?? '',
      lotId: input.lotId,
      chemicalId: input.chemicalId,
      chemicalName: await nameOf(input.chemicalId),
      quantity: input.quantity,
      unit: input.unit,
      purityPercent: input.purityPercent,
      ledgerEntryId: input.ledgerEntryId,
    });
  }
  const portions = [];
  for (const product of await repos.runs.productsOf(id)) {
    const view = await repos.containers.findView(product.containerId);
    portions.push({
      id: product.id,
      lineIndex: product.lineIndex,
      label: product.label,
      lotId: product.lotId,
      containerId: product.containerId,
      labelCode: view?.labelCode ?? '',
      locationPath: view?.locationPath ?? '',
      chemicalId: product.chemicalId,
      chemicalName: await nameOf(product.chemicalId),
      quantity: product.quantity,
      unit: product.unit,
      massG: product.massG,
      percentYield: product.percentYield,
    });
  }
  const measured =
    row.meltingLowC === null || row.meltingHighC === null
      ? null
      : { low: row.meltingLowC, high: row.meltingHighC };
  const literature =
    procedure?.meltingLowC === null ||
    procedure?.meltingHighC === null ||
    procedure?.meltingLowC === undefined ||
    procedure?.meltingHighC === undefined
      ? null
      : { low: procedure.meltingLowC, high: procedure.meltingHighC };
  return {
    ...summary!,
    notes: row.notes,
    draws,
    portions,
    stoichiometry: row.stoichiometry,
    warnings: row.warnings,
    notices: row.notices,
    observations: {
      meltingRangeC: measured,
      literatureMeltingC: literature,
      meltingComparison: meltingComparison(measured, literature),
      appearance: row.appearance,
      notes: row.observationNotes,
    },
  };
}

/** Opens a run (inside the caller's transaction); answers its id. */
export async function openRun(
  repos: Repositories,
  input: RunCreateParsed,
  actor: User,
  now = nowIso(),
): Promise<number> {
  let procedureId: number;
  let scaleFactor: number;
  let planId: number | null = null;
  if (input.planId !== undefined) {
    const plan = await repos.plans.findRow(input.planId);
    if (!plan) {
      throw AppError.validation(`There is no plan #${input.planId}.`, {
        planId: `no plan #${input.planId}`,
      });
    }
    requireOwnPlan(plan, actor);
    if (plan.status === 'recorded' || plan.status === 'cancelled') {
      throw AppError.conflict(`Plan #${plan.id} is ${plan.status}; start an ad hoc run instead.`);
    }
    procedureId = plan.procedureId;
    planId = plan.id;
    // The whole session: every bench at the plan's scale.
    scaleFactor = input.scaleFactor ?? plan.scaleFactor * plan.benches;
  } else {
    const procedure = await repos.procedures.findRow(input.procedureId!);
    if (!procedure) {
      throw AppError.validation(`There is no procedure #${input.procedureId}.`, {
        procedureId: `no procedure #${input.procedureId}`,
      });
    }
    procedureId = procedure.id;
    scaleFactor = input.scaleFactor ?? 1;
  }
  return repos.runs.insert({
    procedureId,
    planId,
    scaleFactor,
    status: 'open',
    performedById: actor.id,
    performedOn: null,
    theoreticalYieldG: null,
    crudeMassG: null,
    productMassG: null,
    percentYield: null,
    crudePercentYield: null,
    yieldFlag: null,
    meltingLowC: null,
    meltingHighC: null,
    appearance: '',
    observationNotes: '',
    notes: input.notes,
    actualLines: null,
    stoichiometry: null,
    warnings: [],
    notices: [],
    recordedAt: null,
    createdAt: now,
    updatedAt: now,
  });
}

interface PlannedDraw {
  path: string;
  lineIndex: number | null;
  purpose: string;
  containerId: number;
  amount?: number;
  grossMassBefore?: number;
  grossMassAfter?: number;
  unit: string;
  note: string;
}

/**
 * Records a run (inside the caller's transaction): every draw as a `drawn` ledger entry of
 * the run, every portion of product as a new prepared lot and container (`received` entry
 * of the run), the percent yield from the amounts really used, and the plan's reservations
 * released. Any failure throws and the transaction writes nothing.
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

  // 1. The draws, in the order given.
  const planned: PlannedDraw[] = [];
  for (const [i, line] of input.lines.entries()) {
    const procedureLine = procedure.lines[line.lineIndex];
    if (!procedureLine || procedureLine.role === 'product') {
      throw AppError.validation(
        `Line ${line.lineIndex + 1} is not a line of "${procedure.row.title}" that is drawn from stock.`,
        { [`lines.${i}.lineIndex`]: 'is not a reagent, solvent, catalyst or work-up line' },
      );
    }
    for (const [j, draw] of line.draws.entries()) {
      planned.push({
        ...draw,
        path: `lines.${i}.draws.${j}`,
        lineIndex: line.lineIndex,
        purpose: '',
      });
    }
  }
  for (const [k, draw] of input.extraDraws.entries()) {
    planned.push({ ...draw, path: `extraDraws.${k}`, lineIndex: null, purpose: draw.purpose });
  }

  const current = new Map<number, ContainerRow>();
  const drawnByLine = new Map<number, { quantity: number; purity: number }[]>();
  const inputs: {
    container: ContainerRow;
    draw: PlannedDraw;
    quantity: number;
    purity: number;
    chemical: ChemicalRow;
  }[] = [];
  for (const draw of planned) {
    const container =
      current.get(draw.containerId) ?? (await repos.containers.findRow(draw.containerId));
    if (!container) {
      throw AppError.validation(`There is no container #${draw.containerId}.`, {
        [`${draw.path}.containerId`]: `no container #${draw.containerId}`,
      });
    }
    const chemical = await chemicalOf(container.chemicalId);
    if (draw.lineIndex !== null) {
      const line = procedure.lines[draw.lineIndex]!;
      if (
        container.chemicalId !== line.chemicalId &&
        container.chemicalId !== line.dissolvedInChemicalId
      ) {
        const wanted = chemicals.get(line.chemicalId)?.name ?? `chemical #${line.chemicalId}`;
        throw AppError.validation(
          `${container.labelCode} holds ${chemical.name}, but line ${draw.lineIndex + 1} is ${wanted}.`,
          { [`${draw.path}.containerId`]: `${container.labelCode} holds ${chemical.name}` },
        );
      }
    }
    if (container.status === 'disposed' || container.status === 'empty') {
      throw AppError.conflict(
        `${container.labelCode} is ${container.status}; nothing can be drawn from it. The run was not recorded.`,
        { [`${draw.path}.containerId`]: `${container.labelCode} is ${container.status}` },
      );
    }
    let drawn: number;
    let note = draw.note;
    if (draw.grossMassAfter !== undefined) {
      const afterG = convert(draw.grossMassAfter, draw.unit, 'g');
      if (draw.grossMassBefore !== undefined) {
        const beforeG = convert(draw.grossMassBefore, draw.unit, 'g');
        drawn = toStockUnit(beforeG - afterG, 'g', chemical, `${draw.path}.grossMassAfter`);
        note ||= `Weighed ${formatQuantity(beforeG, 'g')} before, ${formatQuantity(afterG, 'g')} after`;
      } else {
        if (container.tareMass === null) {
          throw AppError.validation(
            `${container.labelCode} has no tare mass: give grossMassBefore as well, or the amount taken.`,
            { [`${draw.path}.grossMassAfter`]: `${container.labelCode} has no tare mass recorded` },
          );
        }
        if (afterG < container.tareMass - epsilon) {
          throw AppError.validation(
            `A gross mass of ${formatQuantity(afterG, 'g')} is less than the tare of ${container.labelCode} (${formatQuantity(container.tareMass, 'g')}).`,
            {
              [`${draw.path}.grossMassAfter`]: `is below the tare of ${formatQuantity(container.tareMass, 'g')}`,
            },
          );
        }
        const net = toStockUnit(
          Math.max(0, afterG - container.tareMass),
          'g',
          chemical,
          `${draw.path}.grossMassAfter`,
        );
        drawn = container.quantity - net;
        note ||= `Weighed ${formatQuantity(afterG, 'g')} gross after`;
      }
    } else {
      drawn = toStockUnit(draw.amount!, draw.unit, chemical, `${draw.path}.amount`);
    }
    drawn = roundQuantity(drawn);
    if (drawn <= epsilon) {
      throw AppError.validation(
        `The draw from ${container.labelCode} works out to nothing; check the masses.`,
        { [`${draw.path}.amount`]: 'works out to no change' },
      );
    }
    if (drawn > container.quantity + epsilon) {
      throw AppError.conflict(
        `${container.labelCode} holds only ${formatQuantity(container.quantity, container.unit)}; ${formatQuantity(drawn, container.unit)} cannot be drawn from it. The run was not recorded: nothing was written.`,
        {
          [`${draw.path}.${draw.grossMassAfter !== undefined ? 'grossMassAfter' : 'amount'}`]: `at most ${formatQuantity(container.quantity, container.unit, { rounding: 'down' })} is in ${container.labelCode}`,
        },
      );
    }
    const lot = (await repos.lots.findRow(container.lotId))!;
    const purity = lot.purityPercent ?? chemical.defaultPurityPercent;
    const next = statusAfter(
      container.status,
      container.quantity - drawn,
      performedOn,
      container.openedOn,
    );
    const label =
      draw.lineIndex === null ? draw.purpose || 'extra draw' : `line ${draw.lineIndex + 1}`;
    const { entry, container: after } = await appendEntry(
      repos,
      container,
      {
        delta: -Math.min(drawn, container.quantity),
        reason: 'drawn',
        note: note || `Run #${run.id} (${procedure.row.title}): ${label}`,
        runId: run.id,
        at: now,
      },
      actor,
      {
        ...next,
        peroxideDueOn:
          peroxideDueOf(chemical.peroxideClass, next.openedOn, lot.receivedOn, lot.expiresOn)
            ?.dueOn ?? null,
      },
    );
    current.set(container.id, after);
    await repos.runs.insertInput({
      runId: run.id,
      lineIndex: draw.lineIndex,
      purpose: draw.purpose,
      containerId: container.id,
      lotId: container.lotId,
      chemicalId: container.chemicalId,
      ledgerEntryId: entry.id,
      quantity: drawn,
      unit: container.unit,
      purityPercent: purity,
    });
    inputs.push({ container, draw, quantity: drawn, purity, chemical });
    if (
      draw.lineIndex !== null &&
      container.chemicalId === procedure.lines[draw.lineIndex]!.chemicalId
    ) {
      const list = drawnByLine.get(draw.lineIndex) ?? [];
      list.push({ quantity: drawn, purity });
      drawnByLine.set(draw.lineIndex, list);
    }
  }

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

  // 3. The stoichiometry of what was really used.
  const notices: string[] = [];
  const planned1 = chemLinesOf(procedure, run.scaleFactor);
  const actualLines: ProcedureLine[] = procedure.lines.map((line, index) => {
    const base = { ...planned1[index]! };
    const chemical = chemicals.get(line.chemicalId)!;
    if (line.role === 'product') {
      const total = portions
        .filter((portion) => portion.lineIndex === index)
        .reduce((sum, portion) => sum + portion.stockQuantity, 0);
      const crude = crudeByLine.get(index);
      delete base.quantity;
      if (total > 0) base.quantity = { value: total, unit: chemical.stockUnit };
      else if (crude !== undefined) base.quantity = { value: crude, unit: 'g' };
      return base;
    }
    const draws = drawnByLine.get(index);
    if (!draws?.length) {
      if (line.role === 'limiting-reagent' || line.role === 'reagent') {
        notices.push(
          `Line ${index + 1} (${chemical.name}): no draw was recorded, so the planned amount at ×${formatFullPrecision(run.scaleFactor)} is used for the yield.`,
        );
      }
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
  const percent = main?.percentYield ?? null;
  const crudeMassG = mainIndex === undefined ? null : (crudeByLine.get(mainIndex) ?? null);
  const crudePercent =
    crudeMassG !== null && theoreticalG !== null && theoreticalG > 0
      ? percentYield(crudeMassG, theoreticalG).percent
      : null;
  const mainChemical =
    mainIndex === undefined ? undefined : chemicals.get(procedure.lines[mainIndex]!.chemicalId);
  const toGrams = (stockQuantity: number, chemical: ChemicalRow | undefined) =>
    !chemical
      ? null
      : chemical.stockUnit === 'g'
        ? stockQuantity
        : chemical.density === null
          ? null
          : stockQuantity * chemical.density;
  const productMassG = mainTotal > 0 ? toGrams(mainTotal, mainChemical) : null;

  // 4. Each portion becomes a prepared lot and a labelled container.
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

  // 5. The run itself, and its plan.
  await repos.runs.update(run.id, {
    status: 'recorded',
    performedOn,
    theoreticalYieldG: theoreticalG,
    crudeMassG,
    productMassG,
    percentYield: percent,
    crudePercentYield: crudePercent,
    yieldFlag:
      percent !== null && percent > 100
        ? `Yield above 100 %: the product is ${YIELD_ABOVE_100_ADVICE}.`
        : null,
    meltingLowC: input.observations.meltingRangeC?.low ?? null,
    meltingHighC: input.observations.meltingRangeC?.high ?? null,
    appearance: input.observations.appearance,
    observationNotes: input.observations.notes,
    actualLines,
    stoichiometry,
    warnings: stoichiometry.warnings,
    notices,
    recordedAt: now,
    updatedAt: now,
  });
  if (run.planId !== null) await markPlanRecorded(repos, run.planId, run.id);
}

export function runsService(store: Store) {
  return {
    async list(query: RunListQuery): Promise<Page<RunSummary>> {
      const { rows, total } = await store.repos.runs.list(query);
      return {
        items: await runSummaries(store.repos, rows),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    get: (id: number) => presentRun(store.repos, id),

    async create(input: RunCreateParsed, actor: User): Promise<Run> {
      return store.transaction(async (repos) => {
        const id = await openRun(repos, input, actor);
        return presentRun(repos, id);
      });
    },

    async record(id: number, input: RunRecordParsed, actor: User): Promise<Run> {
      return store.transaction(async (repos) => {
        await recordRunWith(repos, id, input, actor);
        return presentRun(repos, id);
      });
    },

    async procedureRuns(procedureId: number): Promise<ProcedureRuns> {
      const procedure = await store.repos.procedures.findRow(procedureId);
      if (!procedure) throw AppError.notFound(`There is no procedure #${procedureId}.`);
      const runs = await runSummaries(store.repos, await store.repos.runs.recordedOf(procedureId));
      const yields = runs.flatMap((run) => (run.percentYield === null ? [] : [run.percentYield]));
      return {
        procedure: {
          id: procedure.id,
          title: procedure.title,
          expectedYieldPercent: procedure.expectedYieldPercent,
        },
        runs,
        stats: {
          count: runs.length,
          meanPercentYield: yields.length
            ? yields.reduce((a, b) => a + b, 0) / yields.length
            : null,
          minPercentYield: yields.length ? Math.min(...yields) : null,
          maxPercentYield: yields.length ? Math.max(...yields) : null,
          aboveHundredCount: yields.filter((y) => y > 100).length,
        },
      };
    },

    async chemicalUsage(chemicalId: number): Promise<ChemicalUsage> {
      const repos = store.repos;
      const chemical = await repos.chemicals.findRow(chemicalId);
      if (!chemical) throw AppError.notFound(`There is no chemical #${chemicalId}.`);
      const inputs = await repos.runs.inputsOfChemical(chemicalId);
      const products = await repos.runs.productsOfChemical(chemicalId);
      const runIds = [...new Set([...inputs, ...products].map((row) => row.runId))];
      const runs = new Map(
        (await runSummaries(repos, await repos.runs.rowsByIds(runIds))).map((r) => [r.id, r]),
      );
      const uses = new Map<string, ChemicalUsage['runs'][number]>();
      const add = (
        runId: number,
        use: 'input' | 'extra' | 'product',
        quantity: number,
        unit: ChemicalRow['stockUnit'],
      ) => {
        const run = runs.get(runId)!;
        const key = `${runId}:${use}`;
        const existing = uses.get(key);
        if (existing) existing.quantity = roundQuantity(existing.quantity + quantity);
        else {
          uses.set(key, {
            runId,
            procedureId: run.procedure.id,
            procedureTitle: run.procedure.title,
            performedOn: run.performedOn,
            use,
            quantity,
            unit,
          });
        }
      };
      for (const input of inputs)
        add(input.runId, input.lineIndex === null ? 'extra' : 'input', input.quantity, input.unit);
      for (const product of products) add(product.runId, 'product', product.quantity, product.unit);
      const listed = await repos.procedures.using(chemicalId);
      const procedureRows = new Map(
        (await repos.procedures.rowsByIds([...new Set(listed.map((l) => l.procedureId))])).map(
          (p) => [p.id, p],
        ),
      );
      const procedures = new Map<number, { id: number; title: string; roles: string[] }>();
      for (const { procedureId, role } of listed) {
        const entry = procedures.get(procedureId) ?? {
          id: procedureId,
          title: procedureRows.get(procedureId)?.title ?? '',
          roles: [],
        };
        if (!entry.roles.includes(role)) entry.roles.push(role);
        procedures.set(procedureId, entry);
      }
      return {
        chemical: { id: chemical.id, name: chemical.name },
        runs: [...uses.values()].sort(
          (a, b) => (b.performedOn ?? '').localeCompare(a.performedOn ?? '') || b.runId - a.runId,
        ),
        procedures: [...procedures.values()],
      };
    },

    async lotProvenance(lotId: number): Promise<LotProvenance> {
      const repos = store.repos;
      const lot = await repos.lots.findById(lotId);
      if (!lot) throw AppError.notFound(`There is no lot #${lotId}.`);
      let run: RunSummary | null = null;
      const inputs: LotProvenance['inputs'] = [];
      if (lot.madeByRunId !== null) {
        const row = await repos.runs.findRow(lot.madeByRunId);
        if (row) {
          run = (await runSummaries(repos, [row]))[0]!;
          for (const input of await repos.runs.inputsOf(row.id)) {
            const inputLot = (await repos.lots.findById(input.lotId))!;
            const container = await repos.containers.findRow(input.containerId);
            inputs.push({
              lotId: input.lotId,
              chemicalId: input.chemicalId,
              chemicalName: inputLot.chemicalName,
              source: inputLot.source,
              supplierName: inputLot.supplierName,
              supplierLotNumber: inputLot.supplierLotNumber,
              labelCode: container?.labelCode ?? '',
              lineIndex: input.lineIndex,
              quantity: input.quantity,
              unit: input.unit,
            });
          }
        }
      }
      const containers: LotProvenance['containers'] = [];
      const rows = await repos.containers.rowsForLot(lotId);
      const uses = await repos.runs.inputsFromContainers(rows.map((r) => r.id));
      const usingRuns = new Map(
        (
          await runSummaries(
            repos,
            await repos.runs.rowsByIds([...new Set(uses.map((u) => u.runId))]),
          )
        ).map((r) => [r.id, r]),
      );
      for (const row of rows.sort((a, b) => a.id - b.id)) {
        const view = (await repos.containers.findView(row.id))!;
        const { items } = await repos.containers.entries(row.id, 1, 200);
        containers.push({
          id: row.id,
          labelCode: row.labelCode,
          status: row.status,
          quantity: row.quantity,
          unit: row.unit,
          locationPath: view.locationPath,
          usedBy: uses
            .filter((use) => use.containerId === row.id)
            .map((use) => ({
              runId: use.runId,
              procedureTitle: usingRuns.get(use.runId)?.procedure.title ?? '',
              quantity: use.quantity,
              performedOn: usingRuns.get(use.runId)?.performedOn ?? null,
            })),
          movements: items.reverse().map((entry) => ({
            reason: entry.reason,
            quantity: entry.quantity,
            balanceAfter: entry.balanceAfter,
            note: entry.note,
            runId: entry.runId,
            createdAt: entry.createdAt,
          })),
        });
      }
      return {
        lot: {
          id: lot.id,
          chemicalId: lot.chemicalId,
          chemicalName: lot.chemicalName,
          source: lot.source,
          receivedOn: lot.receivedOn,
          madeByRunId: lot.madeByRunId,
        },
        run,
        inputs,
        containers,
      };
    },
  };
}
export type RunsService = ReturnType<typeof runsService>;
