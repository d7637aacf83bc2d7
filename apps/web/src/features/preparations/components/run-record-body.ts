import { tryParseUnit } from '@lotwise/chem';
import type { PlanDetail, Procedure, ProcedureLineView, RunRecord } from '@lotwise/shared';
import { parseDecimal } from '../../../lib/numbers';
import { drawBody, newDraw, type DrawValues } from './container-draw';
import type { PickedChemical } from './line-chemical-picker';

/** Where a filled-in draw came from, so the form can say so before saving. */
export interface DrawSource {
  kind: 'held' | 'suggested' | 'planned';
  /** The container filled in ('' when left to choose). */
  containerId: string;
  /** The amount filled in, in `unit`. */
  amount: number;
  unit: string;
}

/** One draw of a line in the form, with where its filled-in values came from. */
export interface LineDraw extends DrawValues {
  source?: DrawSource;
}

export interface ExtraDraw {
  key: string;
  chemical: PickedChemical | null;
  purpose: string;
  draw: DrawValues;
}

export interface PortionValues {
  key: string;
  label: string;
  quantity: string;
  unit: string;
  locationId: string;
  tareMass: string;
  notes: string;
}

let nextKey = 1;
export const formKey = (prefix: string) => `${prefix}-${nextKey++}`;

export const newPortion = (label: string, unit: string, locationId = ''): PortionValues => ({
  key: formKey('portion'),
  label,
  quantity: '',
  unit,
  locationId,
  tareMass: '',
  notes: '',
});

/** A number as a person would type it into an amount field (no trailing float noise). */
function typed(value: number): string {
  return String(Number(value.toPrecision(6)));
}

function drawFrom(containerId: number, amount: number, unit: string, kind: DrawSource['kind']) {
  const draw: LineDraw = { ...newDraw(String(containerId), unit), amount: typed(amount) };
  draw.source = {
    kind,
    containerId: String(containerId),
    amount: Number(amount.toPrecision(6)),
    unit,
  };
  return draw;
}

/**
 * A plan's line at the run's scale, split over the containers held for it (first) and those
 * its stock check suggests, each no more than it holds for the plan. Null when the plan
 * cannot say (no plan, the amount could not be put in the stock unit).
 */
function drawsFromPlan(
  line: ProcedureLineView,
  plan: PlanDetail,
  runScaleFactor: number,
): LineDraw[] | null {
  const check = plan.stockCheck.lines.find(
    (l) => l.lineIndex === line.index && l.purpose === 'line',
  );
  if (!check || check.perBench === null || plan.scaleFactor <= 0) return null;
  let left = (check.perBench * runScaleFactor) / plan.scaleFactor;
  const draws: LineDraw[] = [];
  const held = plan.reservations.filter(
    (r) => r.status === 'active' && r.requirementIndex === check.index,
  );
  for (const reservation of held) {
    if (left <= 1e-9) break;
    const amount = Math.min(left, reservation.quantity);
    draws.push(drawFrom(reservation.containerId, amount, reservation.unit, 'held'));
    left -= amount;
  }
  for (const take of check.take) {
    if (left <= 1e-9) break;
    if (held.some((r) => r.containerId === take.containerId)) continue;
    const amount = Math.min(left, take.take);
    draws.push(drawFrom(take.containerId, amount, check.unit, 'suggested'));
    left -= amount;
  }
  return draws;
}

/**
 * The draws the form starts from. From a plan, every required line is filled in with its
 * planned amount at the run's scale, from the containers held for the plan or suggested by its
 * stock check — shown as such, to be changed to what was really taken. Without a plan the
 * planned amount is filled in and the container is left to choose. Optional lines start empty:
 * left empty, they were not used.
 */
export function initialDraws(
  procedure: Procedure,
  plan: PlanDetail | undefined,
  runScaleFactor: number,
): Record<number, LineDraw[]> {
  const draws: Record<number, LineDraw[]> = {};
  for (const line of procedure.lines) {
    if (line.role === 'product') continue;
    const empty = [newDraw('', line.chemical.stockUnit)];
    if (line.optional) {
      draws[line.index] = empty;
      continue;
    }
    const fromPlan = plan ? drawsFromPlan(line, plan, runScaleFactor) : null;
    if (fromPlan && fromPlan.length > 0) {
      draws[line.index] = fromPlan;
      continue;
    }
    const unit = line.unit ? tryParseUnit(line.unit) : null;
    if (line.quantity !== null && line.unit && unit?.ok && unit.value.dimension !== 'amount') {
      draws[line.index] = [
        { ...newDraw('', line.unit), amount: typed(line.quantity * runScaleFactor) },
      ];
      draws[line.index]![0]!.source = {
        kind: 'planned',
        containerId: '',
        amount: Number((line.quantity * runScaleFactor).toPrecision(6)),
        unit: line.unit,
      };
      continue;
    }
    draws[line.index] = empty;
  }
  return draws;
}

/** Required lines (not optional, not the product) with no draw entered: the server refuses these. */
export function undrawnLines(procedure: Procedure, draws: Record<number, LineDraw[]>) {
  return procedure.lines.filter(
    (line) =>
      line.role !== 'product' &&
      !line.optional &&
      (draws[line.index] ?? []).every((draw) => drawBody(draw) === null),
  );
}

/** Where a schema issue is, in words a person recognises. */
export function issuePlace(
  path: readonly PropertyKey[],
  procedure: Procedure,
  body: RunRecord,
): string {
  const [section, index, , drawIndex] = path;
  if (section === 'lines' && typeof index === 'number') {
    const lineIndex = body.lines?.[index]?.lineIndex ?? 0;
    const name = procedure.lines[lineIndex]?.chemical.name ?? '';
    return `Line ${lineIndex + 1} (${name}), draw ${Number(drawIndex ?? 0) + 1}`;
  }
  if (section === 'extraDraws' && typeof index === 'number') return `Extra draw ${index + 1}`;
  if (section === 'products') {
    const portion = path[3];
    return typeof portion === 'number' ? `Portion ${portion + 1}` : 'Product';
  }
  if (section === 'observations') return 'Observations';
  return String(section ?? 'Record');
}

/** What the form holds, as `POST /api/runs/:id/record` takes it. */
export function recordBody(values: {
  performedOn: string;
  draws: Record<number, LineDraw[]>;
  extras: ExtraDraw[];
  productLineIndex: number | null;
  crude: string;
  portions: PortionValues[];
  meltingLow: string;
  meltingHigh: string;
  appearance: string;
  notes: string;
}): RunRecord {
  const low = parseDecimal(values.meltingLow);
  const high = parseDecimal(values.meltingHigh);
  return {
    performedOn: values.performedOn,
    lines: Object.entries(values.draws)
      .map(([lineIndex, list]) => ({
        lineIndex: Number(lineIndex),
        draws: list.map(drawBody).filter((d) => d !== null),
      }))
      .filter((line) => line.draws.length > 0),
    extraDraws: values.extras
      .map((extra) => {
        const body = drawBody(extra.draw);
        return body ? { ...body, purpose: extra.purpose } : null;
      })
      .filter((d) => d !== null),
    products:
      values.productLineIndex === null
        ? []
        : [
            {
              lineIndex: values.productLineIndex,
              crudeMassG: parseDecimal(values.crude),
              portions: values.portions.map((p) => ({
                label: p.label,
                quantity: parseDecimal(p.quantity) ?? (undefined as unknown as number),
                unit: p.unit,
                locationId: p.locationId ? Number(p.locationId) : (undefined as unknown as number),
                tareMass: parseDecimal(p.tareMass),
                notes: p.notes,
              })),
            },
          ],
    observations: {
      meltingRangeC:
        low === null && high === null
          ? null
          : { low: low ?? Number.NaN, high: high ?? low ?? Number.NaN },
      appearance: values.appearance,
      notes: values.notes,
    },
  };
}
