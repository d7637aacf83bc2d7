import { convert } from '@lotwise/chem';
import { formatQuantity, type RunRecordParsed, type User } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { ContainerRow } from '../containers/container.entity';
import {
  appendEntry,
  roundQuantity,
  statusAfter,
  toStockUnit,
} from '../containers/containers.service';
import { peroxideDueOf } from '../containers/peroxide-dates';
import { requireHoldsConfirmed } from '../plans/holds';
import type { LoadedProcedure } from '../procedures/procedures.service';
import type { RunRow } from './run.entity';

const epsilon = 1e-6;

/** One draw of a run as asked, with where it sits in the request (for field errors). */
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

/** A planned draw with its container and chemical looked up and checked. */
interface ResolvedDraw {
  draw: PlannedDraw;
  container: ContainerRow;
  chemical: ChemicalRow;
  /** True when it draws the line's own chemical (not the water a solute is dissolved in). */
  forLineChemical: boolean;
}

/** What was drawn for each procedure line's own chemical (stock unit, lot purity %). */
export type DrawnByLine = Map<number, { quantity: number; purity: number }[]>;

/** The draws of a record request in the order given, each line checked against the procedure. */
function plannedDraws(procedure: LoadedProcedure, input: RunRecordParsed): PlannedDraw[] {
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
  return planned;
}

/**
 * Every draw's container looked up and checked, before anything is written: it exists,
 * holds the line's chemical (or the solvent the line is dissolved in) and can be drawn from.
 * Then the rule that keeps the yield honest: every line that is not optional must draw its
 * own chemical, since the yield is worked out only from what was drawn (an amount nobody
 * drew would count for the yield and take nothing from stock).
 */
export async function resolveDraws(
  repos: Repositories,
  procedure: LoadedProcedure,
  input: RunRecordParsed,
  chemicalOf: (id: number) => Promise<ChemicalRow>,
): Promise<ResolvedDraw[]> {
  const resolved: ResolvedDraw[] = [];
  const planned = plannedDraws(procedure, input);
  const containers = await repos.containers.rowsByIds(planned.map((draw) => draw.containerId));
  for (const draw of planned) {
    const container = containers.get(draw.containerId);
    if (!container) {
      throw AppError.validation(`There is no container #${draw.containerId}.`, {
        [`${draw.path}.containerId`]: `no container #${draw.containerId}`,
      });
    }
    const chemical = await chemicalOf(container.chemicalId);
    let forLineChemical = false;
    if (draw.lineIndex !== null) {
      const line = procedure.lines[draw.lineIndex]!;
      forLineChemical = container.chemicalId === line.chemicalId;
      if (!forLineChemical && container.chemicalId !== line.dissolvedInChemicalId) {
        const wanted =
          procedure.chemicals.get(line.chemicalId)?.name ?? `chemical #${line.chemicalId}`;
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
    resolved.push({ draw, container, chemical, forLineChemical });
  }

  const drawnLines = new Set(
    resolved.filter((r) => r.forLineChemical).map((r) => r.draw.lineIndex),
  );
  const missing = procedure.lines.flatMap((line, index) =>
    line.role === 'product' || line.optional || drawnLines.has(index)
      ? []
      : [`line ${index + 1} (${procedure.chemicals.get(line.chemicalId)?.name ?? 'unknown'})`],
  );
  if (missing.length > 0) {
    const list = missing.join(', ');
    throw AppError.validation(
      `Record what was drawn, and from which container, for ${list}. The yield is worked out only from amounts drawn from stock; a line left empty would count for the yield and take nothing from the shelf. Nothing was recorded.`,
      { lines: `no draw recorded for ${list}` },
    );
  }
  return resolved;
}

/** How much a draw takes, in the container's unit: an amount, or a weighing. */
function drawnAmount(
  draw: PlannedDraw,
  container: ContainerRow,
  chemical: ChemicalRow,
): { drawn: number; note: string } {
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
  if (drawn <= 0) {
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
  return { drawn, note };
}

/**
 * Writes every resolved draw as a `drawn` ledger entry of the run (inside the caller's
 * transaction) and a `run_inputs` row; answers what each line's own chemical drew.
 */
export async function applyDraws(
  repos: Repositories,
  run: RunRow,
  procedure: LoadedProcedure,
  resolved: ResolvedDraw[],
  actor: User,
  at: { now: string; performedOn: string; today: string; confirm: boolean | undefined },
): Promise<DrawnByLine> {
  const current = new Map<number, ContainerRow>();
  const drawnByLine: DrawnByLine = new Map();
  const taken: { container: ContainerRow; drawn: number }[] = [];
  const lots = await repos.lots.rowsByIds(resolved.map(({ container }) => container.lotId));
  for (const { draw, chemical, forLineChemical, ...looked } of resolved) {
    // A container drawn twice in one run: the second draw sees the first.
    const container = current.get(looked.container.id) ?? looked.container;
    const { drawn, note } = drawnAmount(draw, container, chemical);
    const lot = lots.get(container.lotId)!;
    const purity = lot.purityPercent ?? chemical.defaultPurityPercent;
    const next = statusAfter(
      container.status,
      container.quantity - drawn,
      at.performedOn,
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
        at: at.now,
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
    taken.push({ container, drawn });
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
    if (draw.lineIndex !== null && forLineChemical) {
      const list = drawnByLine.get(draw.lineIndex) ?? [];
      list.push({ quantity: drawn, purity });
      drawnByLine.set(draw.lineIndex, list);
    }
  }
  // Another plan's hold is taken only with the person's confirmation (the transaction rolls back).
  await requireHoldsConfirmed(repos, taken, {
    today: at.today,
    exceptPlanId: run.planId,
    confirmed: at.confirm === true,
  });
  return drawnByLine;
}
