import { formatDecimal, formatNumber, type Run, type RunSummary } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import type { RunRow } from './run.entity';

/**
 * How far a thermometer reading may sit outside the literature range and still agree with
 * it, °C. // common practice, no source
 */
const meltingToleranceC = 1;
/** A pure compound melts within about 2 °C; a wider range points to impurities. // common practice, no source */
const sharpRangeC = 2;

/**
 * Compares a measured melting range with the literature's: it agrees when it lies within the
 * literature range (give or take {@link meltingToleranceC}) and is sharp (at most
 * {@link sharpRangeC} wide). Starting lower means impure or wet (impurities lower and widen
 * the range); ending higher means a thermometer or identity to check.
 */
export function meltingComparison(
  measured: { low: number; high: number } | null,
  literature: { low: number; high: number } | null,
): { agrees: boolean; text: string } | null {
  if (!measured || !literature) return null;
  const range = `${formatDecimal(literature.low, 2)}–${formatDecimal(literature.high, 2)} °C`;
  const problems: string[] = [];
  if (measured.low < literature.low - meltingToleranceC) {
    problems.push(
      `starts ${formatNumber(literature.low - measured.low, 1)} °C below the literature range (${range}): probably impure or still wet`,
    );
  } else if (measured.high > literature.high + meltingToleranceC) {
    problems.push(
      `ends ${formatNumber(measured.high - literature.high, 1)} °C above the literature range (${range}): check the thermometer and the identity of the product`,
    );
  }
  const width = measured.high - measured.low;
  if (width > sharpRangeC) {
    problems.push(
      `a range ${formatNumber(width, 1)} °C wide (more than ${sharpRangeC} °C) suggests impurity`,
    );
  }
  return problems.length === 0
    ? { agrees: true, text: `agrees with the literature range (${range})` }
    : { agrees: false, text: problems.join('; ') };
}

export async function requireRun(repos: Repositories, id: number): Promise<RunRow> {
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
  const deviations = await repos.runTimeline.deviationCounts(rows.map((row) => row.id));
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
      crudeYieldFlag: row.crudeYieldFlag,
      recordedAt: row.recordedAt,
      createdAt: row.createdAt,
      deviationCount: deviations.get(row.id) ?? 0,
    };
  });
}

export async function presentRun(repos: Repositories, id: number): Promise<Run> {
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
  const inputs = await repos.runs.inputsOf(id);
  const containers = await repos.containers.rowsByIds(inputs.map((input) => input.containerId));
  for (const input of inputs) {
    const container = containers.get(input.containerId);
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
