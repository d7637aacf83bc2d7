import {
  ChemError,
  checkMeasurableFactor,
  computeStoichiometry,
  displayQuantity,
  factorForLimitingReagent,
  factorForProduct,
  roundMassForDisplay,
  roundVolumeForDisplay,
  type StoichiometryResult,
} from '@lotwise/chem';
import {
  countOf,
  procedureLinesFor,
  roundingRules,
  withRoundedText,
  type LineChemicalFacts,
  type Page,
  type Procedure,
  type ProcedureCreateParsed,
  type ProcedureLineDraft,
  type ProcedureLineParsed,
  type ProcedureListQuery,
  type ProcedurePatch,
  type ProcedureStep,
  type ScaledProcedure,
  type ScaledQuery,
  type User,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { ProcedureLineRow } from './procedure-line.entity';
import type { ProcedureRow } from './procedure.entity';
import type { ProcedureLineValues } from './procedures.repository';

/** A procedure with its lines and every chemical they name. */
export interface LoadedProcedure {
  row: ProcedureRow;
  lines: ProcedureLineRow[];
  chemicals: Map<number, ChemicalRow>;
}

/** What a stoichiometry needs of a chemical. */
export function factsOf(chemical: ChemicalRow): LineChemicalFacts {
  return {
    id: chemical.id,
    name: chemical.name,
    molarMass: chemical.molarMass,
    density: chemical.density,
    defaultPurityPercent: chemical.defaultPurityPercent,
    physicalState: chemical.physicalState,
    bulkDensity: chemical.bulkDensity,
  };
}

/** A stored line as the shared mapping takes it. */
export function draftOf(line: ProcedureLineRow): ProcedureLineDraft {
  return {
    chemicalId: line.chemicalId,
    role: line.role,
    quantity: line.quantity,
    unit: line.unit,
    coefficient: line.coefficient,
    concentration: line.concentration,
    solutionDensity: line.solutionDensity,
  };
}

/** Chemical rows by id (each read once). */
export async function chemicalsById(
  repos: Repositories,
  ids: Iterable<number>,
  into = new Map<number, ChemicalRow>(),
): Promise<Map<number, ChemicalRow>> {
  const missing = [...new Set(ids)].filter((id) => !into.has(id));
  for (const row of await repos.chemicals.findRows(missing)) into.set(row.id, row);
  return into;
}

export function chemicalIdsOf(lines: ProcedureLineRow[]): number[] {
  return lines.flatMap((line) =>
    line.dissolvedInChemicalId === null
      ? [line.chemicalId]
      : [line.chemicalId, line.dissolvedInChemicalId],
  );
}

export async function loadProcedure(repos: Repositories, id: number): Promise<LoadedProcedure> {
  const row = await repos.procedures.findRow(id);
  if (!row) throw AppError.notFound(`There is no procedure #${id}.`);
  const lines = await repos.procedures.lines(id);
  return { row, lines, chemicals: await chemicalsById(repos, chemicalIdsOf(lines)) };
}

/** The @lotwise/chem lines of a loaded procedure at `factor`. */
export function chemLinesOf(procedure: LoadedProcedure, factor = 1) {
  const facts = new Map([...procedure.chemicals].map(([id, row]) => [id, factsOf(row)]));
  return procedureLinesFor(procedure.lines.map(draftOf), facts, factor);
}

/**
 * Each line's quantity at `factor`, rounded for the bench as the dispensing sheet shows it
 * (balance, glassware or amount rule); null for a line without a quantity.
 */
export function scaledLineDisplays(procedure: LoadedProcedure, factor: number) {
  return chemLinesOf(procedure, factor).map((chem) =>
    chem.quantity ? withRoundedText(displayQuantity(chem.quantity)) : null,
  );
}

/** A ChemError as a 400 naming the line when it has one. */
export function chemProblem(error: unknown, prefix = 'lines'): never {
  if (error instanceof ChemError) {
    const field = error.lineIndex === undefined ? prefix : `${prefix}.${error.lineIndex}`;
    throw AppError.validation(error.message, { [field]: error.message });
  }
  throw error;
}

/**
 * Refuse a scale factor at which every line of the procedure rounds to zero on the balance
 * and the glassware (400 on `field`, stating the lowest factor they allow).
 */
export function requireMeasurableFactor(
  procedure: LoadedProcedure,
  factor: number,
  field = 'factor',
): number {
  try {
    return checkMeasurableFactor(chemLinesOf(procedure), factor);
  } catch (error) {
    if (error instanceof ChemError && error.code === 'factor_too_small') {
      const message = `${error.message.charAt(0).toUpperCase()}${error.message.slice(1)}.`;
      throw AppError.validation(message, { [field]: error.message });
    }
    if (error instanceof ChemError) return factor; // lines that cannot be worked out say so elsewhere
    throw error;
  }
}

function tryStoichiometry(procedure: LoadedProcedure, factor = 1) {
  try {
    return { result: computeStoichiometry(chemLinesOf(procedure, factor)), error: null };
  } catch (error) {
    if (error instanceof ChemError) {
      return {
        result: null,
        error: {
          code: error.code,
          message: error.message,
          ...(error.lineIndex === undefined ? {} : { lineIndex: error.lineIndex }),
        },
      };
    }
    throw error;
  }
}

function lineValues(procedureId: number, lines: ProcedureLineParsed[]): ProcedureLineValues[] {
  return lines.map((line, position) => ({
    procedureId,
    position,
    chemicalId: line.chemicalId,
    role: line.role,
    quantity: line.quantity,
    unit: line.unit,
    coefficient: line.coefficient,
    optional: line.optional,
    notes: line.notes,
    concentration: line.concentration,
    solutionDensity: line.solutionDensity,
    dissolvedInChemicalId: line.dissolvedIn?.chemicalId ?? null,
    dissolvedInQuantity: line.dissolvedIn?.quantity ?? null,
    dissolvedInUnit: line.dissolvedIn?.unit ?? null,
  }));
}

/** Every chemical a line names must exist (400 naming the field otherwise). */
async function checkLines(repos: Repositories, lines: ProcedureLineParsed[]) {
  const chemicals = new Map<number, ChemicalRow>();
  for (const [index, line] of lines.entries()) {
    const pairs: [number, string][] = [[line.chemicalId, `lines.${index}.chemicalId`]];
    if (line.dissolvedIn) pairs.push([line.dissolvedIn.chemicalId, `lines.${index}.dissolvedIn`]);
    for (const [id, field] of pairs) {
      const row = chemicals.get(id) ?? (await repos.chemicals.findRow(id));
      if (!row)
        throw AppError.validation(`There is no chemical #${id}.`, {
          [field]: `no chemical #${id}`,
        });
      chemicals.set(id, row);
    }
  }
  // The calculation must at least run (a bad unit or a clash of purity and concentration).
  const facts = new Map([...chemicals].map(([id, row]) => [id, factsOf(row)]));
  try {
    computeStoichiometry(
      procedureLinesFor(
        lines.map((line) => ({ ...line })),
        facts,
      ),
    );
  } catch (error) {
    chemProblem(error);
  }
}

/** The API shape of a loaded procedure, with its stoichiometry at base scale. */
export async function presentProcedure(
  repos: Repositories,
  procedure: LoadedProcedure,
): Promise<Procedure> {
  const { row, lines, chemicals } = procedure;
  const stoichiometry = tryStoichiometry(procedure);
  const runCount = (await repos.procedures.runCounts([row.id])).get(row.id) ?? 0;
  const creator = row.createdById === null ? null : await repos.users.findById(row.createdById);
  return {
    id: row.id,
    title: row.title,
    reference: row.reference,
    baseScale: row.baseScale,
    expectedYieldPercent: row.expectedYieldPercent,
    literatureMeltingC:
      row.meltingLowC === null || row.meltingHighC === null
        ? null
        : { low: row.meltingLowC, high: row.meltingHighC },
    cautions: row.cautions,
    cautionFlags: row.cautionFlags,
    steps: row.steps.map((step, index) => ({ index, ...step })),
    lines: lines.map((line, index) => {
      const chemical = chemicals.get(line.chemicalId)!;
      const solvent =
        line.dissolvedInChemicalId === null ? undefined : chemicals.get(line.dissolvedInChemicalId);
      return {
        index,
        chemicalId: line.chemicalId,
        chemical: {
          id: chemical.id,
          name: chemical.name,
          formula: chemical.formula,
          molarMass: chemical.molarMass,
          density: chemical.density,
          defaultPurityPercent: chemical.defaultPurityPercent,
          physicalState: chemical.physicalState,
          bulkDensity: chemical.bulkDensity,
          stockUnit: chemical.stockUnit,
          ghsPictograms: chemical.ghsPictograms,
          hazardStatements: chemical.hazardStatements,
        },
        role: line.role,
        quantity: line.quantity,
        unit: line.unit,
        coefficient: line.coefficient,
        optional: line.optional,
        notes: line.notes,
        concentration: line.concentration,
        solutionDensity: line.solutionDensity,
        dissolvedIn:
          solvent && line.dissolvedInQuantity !== null && line.dissolvedInUnit !== null
            ? {
                chemicalId: solvent.id,
                chemicalName: solvent.name,
                quantity: line.dissolvedInQuantity,
                unit: line.dissolvedInUnit,
              }
            : null,
      };
    }),
    stoichiometry: stoichiometry.result,
    stoichiometryError: stoichiometry.error,
    productChemicalIds: [
      ...new Set(lines.filter((l) => l.role === 'product').map((l) => l.chemicalId)),
    ],
    runCount,
    createdBy: creator ? { id: creator.id, displayName: creator.displayName } : null,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/** Every step's line must be one of the procedure's (400 naming the step otherwise). */
function checkStepLines(steps: readonly ProcedureStep[], lineCount: number) {
  steps.forEach((step, index) => {
    if (step.lineIndex !== null && step.lineIndex >= lineCount) {
      const message = `points at line ${step.lineIndex + 1}, but the procedure has ${countOf(lineCount, 'line')}`;
      throw AppError.validation(`Step ${index + 1} ${message}.`, {
        [`steps.${index}.lineIndex`]: message,
      });
    }
  });
}

/** Writes a new procedure with its lines (inside the caller's transaction). */
export async function insertProcedure(
  repos: Repositories,
  input: ProcedureCreateParsed,
  createdById: number | null,
  now = nowIso(),
): Promise<number> {
  await checkLines(repos, input.lines);
  const id = await repos.procedures.insert({
    title: input.title,
    reference: input.reference,
    baseScale: input.baseScale,
    expectedYieldPercent: input.expectedYieldPercent,
    meltingLowC: input.literatureMeltingC?.low ?? null,
    meltingHighC: input.literatureMeltingC?.high ?? null,
    cautions: input.cautions,
    cautionFlags: input.cautionFlags,
    steps: input.steps,
    createdById,
    createdAt: now,
    updatedAt: now,
  });
  await repos.procedures.replaceLines(id, lineValues(id, input.lines));
  return id;
}

/** The first product line's theoretical yield of a stoichiometry, for the API. */
export function theoreticalYieldOf(
  procedure: LoadedProcedure,
  result: StoichiometryResult,
  expectedYieldPercent: number | null,
): ScaledProcedure['theoreticalYield'] {
  const index = procedure.lines.findIndex((line) => line.role === 'product');
  const line = procedure.lines[index];
  const theoretical = result.lines[index]?.theoretical;
  if (!line || !theoretical) return null;
  const massG = theoretical.massG ?? null;
  return {
    lineIndex: index,
    chemicalId: line.chemicalId,
    name: procedure.chemicals.get(line.chemicalId)?.name ?? `line ${index + 1}`,
    amountMol: theoretical.amountMol,
    massG,
    volumeMl: theoretical.volumeMl ?? null,
    display: massG === null ? null : withRoundedText(roundMassForDisplay(massG)),
    expectedMassG:
      massG === null || expectedYieldPercent === null ? null : (massG * expectedYieldPercent) / 100,
  };
}

export function proceduresService(store: Store) {
  return {
    async list(query: ProcedureListQuery): Promise<Page<Procedure>> {
      const { rows, total } = await store.repos.procedures.list(query);
      const items: Procedure[] = [];
      for (const row of rows) {
        const lines = await store.repos.procedures.lines(row.id);
        const chemicals = await chemicalsById(store.repos, chemicalIdsOf(lines));
        items.push(await presentProcedure(store.repos, { row, lines, chemicals }));
      }
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async get(id: number): Promise<Procedure> {
      return presentProcedure(store.repos, await loadProcedure(store.repos, id));
    },

    async create(input: ProcedureCreateParsed, actor: User): Promise<Procedure> {
      return store.transaction(async (repos) => {
        const id = await insertProcedure(repos, input, actor.id);
        return presentProcedure(repos, await loadProcedure(repos, id));
      });
    },

    async update(id: number, patch: ProcedurePatch): Promise<Procedure> {
      return store.transaction(async (repos) => {
        const current = await loadProcedure(repos, id);
        const { lines, literatureMeltingC, ...fields } = patch;
        checkStepLines(patch.steps ?? current.row.steps, lines?.length ?? current.lines.length);
        if (lines) {
          await checkLines(repos, lines);
          await repos.procedures.replaceLines(id, lineValues(id, lines));
        }
        await repos.procedures.update(id, {
          ...fields,
          ...(literatureMeltingC === undefined
            ? {}
            : {
                meltingLowC: literatureMeltingC?.low ?? null,
                meltingHighC: literatureMeltingC?.high ?? null,
              }),
          updatedAt: nowIso(),
        });
        return presentProcedure(repos, await loadProcedure(repos, id));
      });
    },

    async remove(id: number): Promise<void> {
      await store.transaction(async (repos) => {
        await loadProcedure(repos, id);
        const used = await repos.procedures.planOrRunCount(id);
        if (used > 0) {
          throw AppError.conflict(
            `Procedure #${id} has ${countOf(used, 'plan or run', 'plans or runs')} and cannot be deleted; its history depends on it.`,
          );
        }
        await repos.procedures.delete(id);
      });
    },

    async scaled(id: number, query: ScaledQuery): Promise<ScaledProcedure> {
      const procedure = await loadProcedure(store.repos, id);
      const base = chemLinesOf(procedure);
      let factor: number;
      let basis: ScaledProcedure['basis'] = 'factor';
      let yieldBasis: ScaledProcedure['yieldBasis'] = null;
      let notice: string | null = null;
      try {
        if (query.factor !== undefined) factor = query.factor;
        else if (query.targetLimitingMass !== undefined) {
          basis = 'limiting-reagent';
          factor = factorForLimitingReagent(base, {
            value: query.targetLimitingMass,
            unit: query.unit,
          });
        } else {
          basis = 'product';
          const expected = procedure.row.expectedYieldPercent;
          yieldBasis = query.basis === 'expected' && expected !== null ? 'expected' : 'theoretical';
          if (query.basis === 'expected' && expected === null) {
            notice =
              'This procedure states no expected yield, so the factor was worked out from the theoretical yield (100 %): expect less product than the target. Record runs or add an expected yield to the procedure to plan for the real one.';
          }
          factor = factorForProduct(
            base,
            { value: query.targetProductMass!, unit: query.unit },
            yieldBasis === 'expected' && expected !== null
              ? { expectedYieldPercent: expected }
              : {},
          );
        }
      } catch (error) {
        chemProblem(error, query.factor !== undefined ? 'factor' : 'unit');
      }
      requireMeasurableFactor(
        procedure,
        factor,
        query.factor !== undefined
          ? 'factor'
          : query.targetLimitingMass !== undefined
            ? 'targetLimitingMass'
            : 'targetProductMass',
      );
      const scaledLines = chemLinesOf(procedure, factor);
      const displays = scaledLineDisplays(procedure, factor);
      let result: StoichiometryResult;
      try {
        result = computeStoichiometry(scaledLines);
      } catch (error) {
        chemProblem(error);
      }
      return {
        procedureId: id,
        title: procedure.row.title,
        factor,
        basis,
        yieldBasis,
        notice,
        lines: procedure.lines.map((line, index) => {
          const chem = scaledLines[index]!;
          const computed = result.lines[index];
          const solvent =
            line.dissolvedInChemicalId === null
              ? undefined
              : procedure.chemicals.get(line.dissolvedInChemicalId);
          const dissolved =
            solvent && line.dissolvedInQuantity !== null && line.dissolvedInUnit !== null
              ? { value: line.dissolvedInQuantity * factor, unit: line.dissolvedInUnit }
              : null;
          return {
            index,
            chemicalId: line.chemicalId,
            name: procedure.chemicals.get(line.chemicalId)?.name ?? `line ${index + 1}`,
            role: line.role,
            optional: line.optional,
            notes: line.notes,
            quantity: chem.quantity ?? null,
            originalQuantity:
              line.quantity === null || line.unit === null
                ? null
                : { value: line.quantity, unit: line.unit },
            display: displays[index] ?? null,
            massG: computed?.massG ?? null,
            volumeMl: computed?.volumeMl ?? null,
            amountMol: computed?.amountMol ?? null,
            massDisplay:
              computed?.massG === undefined
                ? null
                : withRoundedText(roundMassForDisplay(computed.massG)),
            volumeDisplay:
              computed?.volumeMl === undefined
                ? null
                : withRoundedText(roundVolumeForDisplay(computed.volumeMl)),
            equivalents: computed?.equivalents ?? null,
            dissolvedIn:
              solvent && dissolved
                ? {
                    chemicalId: solvent.id,
                    chemicalName: solvent.name,
                    quantity: dissolved.value,
                    unit: dissolved.unit,
                    display: withRoundedText(displayQuantity(dissolved)),
                  }
                : null,
          };
        }),
        stoichiometry: result,
        theoreticalYield: theoreticalYieldOf(procedure, result, procedure.row.expectedYieldPercent),
        rules: { ...roundingRules },
      };
    },
  };
}
export type ProceduresService = ReturnType<typeof proceduresService>;
