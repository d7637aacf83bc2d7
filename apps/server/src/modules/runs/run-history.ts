import type {
  ChemicalUsage,
  LotProvenance,
  ProcedureRuns,
  RunSummary,
  YieldStats,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import { roundQuantity } from '../containers/containers.service';
import { runSummaries } from './run-views';

/** Count, mean, lowest, highest and how many above 100 % of one kind of yield. */
export function yieldStats(yields: number[]): YieldStats {
  return {
    count: yields.length,
    meanPercentYield: yields.length ? yields.reduce((a, b) => a + b, 0) / yields.length : null,
    minPercentYield: yields.length ? Math.min(...yields) : null,
    maxPercentYield: yields.length ? Math.max(...yields) : null,
    aboveHundredCount: yields.filter((y) => y > 100).length,
  };
}

/**
 * A procedure's recorded runs with their yields. Purified and crude yields are counted
 * apart: a run that only weighed its crude adds to the crude figures, never to the purified.
 */
export async function procedureRunsOf(
  repos: Repositories,
  procedureId: number,
): Promise<ProcedureRuns> {
  const procedure = await repos.procedures.findRow(procedureId);
  if (!procedure) throw AppError.notFound(`There is no procedure #${procedureId}.`);
  const runs = await runSummaries(repos, await repos.runs.recordedOf(procedureId));
  const purified = yieldStats(
    runs.flatMap((run) => (run.percentYield === null ? [] : [run.percentYield])),
  );
  const crude = yieldStats(
    runs.flatMap((run) => (run.crudePercentYield === null ? [] : [run.crudePercentYield])),
  );
  return {
    procedure: {
      id: procedure.id,
      title: procedure.title,
      expectedYieldPercent: procedure.expectedYieldPercent,
    },
    runs,
    stats: {
      count: runs.length,
      purifiedCount: purified.count,
      meanPercentYield: purified.meanPercentYield,
      minPercentYield: purified.minPercentYield,
      maxPercentYield: purified.maxPercentYield,
      aboveHundredCount: purified.aboveHundredCount,
      crude,
    },
  };
}

export async function chemicalUsageOf(
  repos: Repositories,
  chemicalId: number,
): Promise<ChemicalUsage> {
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
    (await repos.procedures.rowsByIds([...new Set(listed.map((l) => l.procedureId))])).map((p) => [
      p.id,
      p,
    ]),
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
}

export async function lotProvenanceOf(repos: Repositories, lotId: number): Promise<LotProvenance> {
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
      await runSummaries(repos, await repos.runs.rowsByIds([...new Set(uses.map((u) => u.runId))]))
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
}
