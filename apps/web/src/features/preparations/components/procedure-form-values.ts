import type { FieldErrors, Resolver } from 'react-hook-form';
import {
  coefficientRoles,
  procedureCreateSchema,
  type LineRole,
  type Procedure,
  type ProcedureCreate,
  type ProcedureLineDraft,
  type StepCaution,
} from '@lotwise/shared';
import { parseDecimal } from '../../../lib/numbers';
import type { PickedChemical } from './line-chemical-picker';

export type SolutionKind = 'neat' | 'molarity' | 'percentWw' | 'dissolved';

export interface LineFormValues {
  /** Stays with the line while lines are added and removed: a step points at it by this. */
  key: string;
  chemical: PickedChemical | null;
  role: LineRole;
  quantity: string;
  unit: string;
  coefficient: string;
  optional: boolean;
  notes: string;
  solution: SolutionKind;
  concentration: string;
  solutionDensity: string;
  dissolvedChemical: PickedChemical | null;
  dissolvedQuantity: string;
  dissolvedUnit: string;
}

/** One step as typed; `lineKey` names the line it adds ('' for none). */
export interface StepFormValues {
  text: string;
  durationMinutes: string;
  temperatureLowC: string;
  temperatureHighC: string;
  outsideWindow: string;
  lineKey: string;
  addition: string;
  caution: StepCaution | '';
  holdPoint: string;
}

/** The form holds text as typed; numbers are read from it when checking and saving. */
export interface ProcedureFormValues {
  title: string;
  reference: string;
  baseScale: string;
  expectedYieldPercent: string;
  meltingLow: string;
  meltingHigh: string;
  cautions: string;
  exothermicAddition: boolean;
  keepBelowC: string;
  flammableSolvent: boolean;
  toxicGas: boolean;
  fumeHood: boolean;
  lines: LineFormValues[];
  steps: StepFormValues[];
}

let lastLineKey = 0;
const newLineKey = () => `line-${++lastLineKey}`;

export const emptyLine = (role: LineRole = 'reagent'): LineFormValues => ({
  key: newLineKey(),
  chemical: null,
  role,
  quantity: '',
  unit: role === 'product' ? '' : 'g',
  coefficient: '',
  optional: false,
  notes: '',
  solution: 'neat',
  concentration: '',
  solutionDensity: '',
  dissolvedChemical: null,
  dissolvedQuantity: '',
  dissolvedUnit: 'mL',
});

export const emptyProcedure: ProcedureFormValues = {
  title: '',
  reference: '',
  baseScale: '',
  expectedYieldPercent: '',
  meltingLow: '',
  meltingHigh: '',
  cautions: '',
  exothermicAddition: false,
  keepBelowC: '',
  flammableSolvent: false,
  toxicGas: false,
  fumeHood: false,
  lines: [emptyLine('limiting-reagent'), emptyLine('reagent'), emptyLine('product')],
  steps: [],
};

export const emptyStep = (): StepFormValues => ({
  text: '',
  durationMinutes: '',
  temperatureLowC: '',
  temperatureHighC: '',
  outsideWindow: '',
  lineKey: '',
  addition: '',
  caution: '',
  holdPoint: '',
});

const text = (value: number | null | undefined) =>
  value === null || value === undefined ? '' : String(value);

export function procedureToFormValues(procedure: Procedure): ProcedureFormValues {
  const keys = procedure.lines.map(() => newLineKey());
  return {
    title: procedure.title,
    reference: procedure.reference,
    baseScale: procedure.baseScale,
    expectedYieldPercent: text(procedure.expectedYieldPercent),
    meltingLow: text(procedure.literatureMeltingC?.low),
    meltingHigh: text(procedure.literatureMeltingC?.high),
    cautions: procedure.cautions,
    exothermicAddition: procedure.cautionFlags.exothermicAddition,
    keepBelowC: text(procedure.cautionFlags.keepBelowC),
    flammableSolvent: procedure.cautionFlags.flammableSolvent,
    toxicGas: procedure.cautionFlags.toxicGas,
    fumeHood: procedure.cautionFlags.fumeHood,
    lines: procedure.lines.map((line, index) => ({
      key: keys[index]!,
      chemical: line.chemical,
      role: line.role,
      quantity: text(line.quantity),
      unit: line.unit ?? '',
      coefficient: text(line.coefficient),
      optional: line.optional,
      notes: line.notes,
      solution: line.dissolvedIn
        ? 'dissolved'
        : line.concentration
          ? 'molarity' in line.concentration
            ? 'molarity'
            : 'percentWw'
          : 'neat',
      concentration: line.concentration
        ? String(
            'molarity' in line.concentration
              ? line.concentration.molarity
              : line.concentration.percentWw,
          )
        : '',
      solutionDensity: text(line.solutionDensity),
      dissolvedChemical: line.dissolvedIn
        ? {
            id: line.dissolvedIn.chemicalId,
            name: line.dissolvedIn.chemicalName,
            formula: null,
            molarMass: null,
            density: null,
            defaultPurityPercent: 100,
            stockUnit: 'mL',
            ghsPictograms: [],
            hazardStatements: [],
          }
        : null,
      dissolvedQuantity: line.dissolvedIn ? String(line.dissolvedIn.quantity) : '',
      dissolvedUnit: line.dissolvedIn?.unit ?? 'mL',
    })),
    steps: procedure.steps.map((step) => ({
      text: step.text,
      durationMinutes: text(step.durationMinutes),
      temperatureLowC: text(step.temperatureLowC),
      temperatureHighC: text(step.temperatureHighC),
      outsideWindow: step.outsideWindow,
      lineKey: step.lineIndex === null ? '' : (keys[step.lineIndex] ?? ''),
      addition: step.addition,
      caution: step.caution ?? '',
      holdPoint: step.holdPoint,
    })),
  };
}

/** Empty text is "not given"; anything else goes to the schema as a number (NaN fails it). */
const number = (value: string) => parseDecimal(value) ?? null;
const optionalNumber = (value: string) => {
  const n = parseDecimal(value);
  return n === null ? null : n;
};

function concentrationOf(line: LineFormValues) {
  if (line.solution === 'molarity') return { molarity: number(line.concentration) ?? Number.NaN };
  if (line.solution === 'percentWw') return { percentWw: number(line.concentration) ?? Number.NaN };
  return null;
}

/** The form's text as the body `POST /api/procedures` takes. */
export function toProcedureBody(values: ProcedureFormValues): ProcedureCreate {
  const low = optionalNumber(values.meltingLow);
  const high = optionalNumber(values.meltingHigh);
  return {
    title: values.title,
    reference: values.reference,
    baseScale: values.baseScale,
    expectedYieldPercent: optionalNumber(values.expectedYieldPercent),
    literatureMeltingC:
      low === null && high === null ? null : { low: low ?? Number.NaN, high: high ?? Number.NaN },
    cautions: values.cautions,
    cautionFlags: {
      exothermicAddition: values.exothermicAddition,
      keepBelowC: optionalNumber(values.keepBelowC),
      flammableSolvent: values.flammableSolvent,
      toxicGas: values.toxicGas,
      fumeHood: values.fumeHood,
    },
    lines: values.lines.map((line) => ({
      chemicalId: line.chemical?.id as number,
      role: line.role,
      quantity: optionalNumber(line.quantity),
      unit: line.unit || null,
      coefficient: coefficientRoles.includes(line.role) ? optionalNumber(line.coefficient) : null,
      optional: line.optional,
      notes: line.notes,
      concentration: concentrationOf(line),
      solutionDensity:
        line.solution === 'molarity' || line.solution === 'percentWw'
          ? optionalNumber(line.solutionDensity)
          : null,
      dissolvedIn:
        line.solution === 'dissolved'
          ? {
              chemicalId: line.dissolvedChemical?.id as number,
              quantity: number(line.dissolvedQuantity) ?? Number.NaN,
              unit: line.dissolvedUnit,
            }
          : null,
    })),
    steps: values.steps.map((step) => {
      // A step whose line was removed adds nothing (the form says so beside it).
      const lineIndex = values.lines.findIndex((line) => line.key === step.lineKey);
      return {
        text: step.text,
        durationMinutes: optionalNumber(step.durationMinutes),
        temperatureLowC: optionalNumber(step.temperatureLowC),
        temperatureHighC: optionalNumber(step.temperatureHighC),
        outsideWindow: step.outsideWindow,
        lineIndex: lineIndex === -1 ? null : lineIndex,
        addition: step.addition,
        caution: step.caution || null,
        holdPoint: step.holdPoint,
      };
    }),
  };
}

/** Where a schema issue lands in the form (the body and the form name a few things apart). */
export function formPath(path: readonly PropertyKey[]): string[] {
  const parts = path.map(String);
  if (parts[0] === 'steps' && parts[2] === 'lineIndex') return ['steps', parts[1]!, 'lineKey'];
  if ((parts[0] === 'lines' || parts[0] === 'steps') && parts.length === 1)
    return [parts[0], 'root'];
  if (parts[0] === 'lines' && parts[2] === 'chemicalId') return ['lines', parts[1]!, 'chemical'];
  if (parts[0] === 'lines' && parts[2] === 'dissolvedIn') {
    const field = parts[3] === 'chemicalId' ? 'dissolvedChemical' : 'dissolvedQuantity';
    return ['lines', parts[1]!, parts[3] === 'unit' ? 'dissolvedUnit' : field];
  }
  if (parts[0] === 'lines' && parts[2] === 'concentration')
    return ['lines', parts[1]!, 'concentration'];
  if (parts[0] === 'literatureMeltingC') return [parts[1] === 'low' ? 'meltingLow' : 'meltingHigh'];
  if (parts[0] === 'cautionFlags') return [parts[1] ?? 'keepBelowC'];
  return parts;
}

function setIn(target: Record<string, unknown>, path: string[], value: unknown) {
  let node = target;
  path.slice(0, -1).forEach((key) => {
    node[key] ??= {};
    node = node[key] as Record<string, unknown>;
  });
  const last = path[path.length - 1]!;
  node[last] ??= value;
}

/** The shared schema the server applies, run on the form's text. */
export const procedureResolver: Resolver<ProcedureFormValues> = async (values) => {
  const parsed = procedureCreateSchema.safeParse(toProcedureBody(values));
  if (parsed.success) return { values, errors: {} };
  const errors: Record<string, unknown> = {};
  for (const issue of parsed.error.issues) {
    const message =
      issue.code === 'invalid_type' && issue.expected === 'number'
        ? 'must be a number'
        : issue.message;
    setIn(errors, formPath(issue.path), { type: 'validation', message });
  }
  return { values: {}, errors: errors as FieldErrors<ProcedureFormValues> };
};

/** What the live calculation reads of one line as it is being typed (unreadable = missing). */
export function draftOf(line: LineFormValues): ProcedureLineDraft {
  const positive = (value: string) => {
    const n = parseDecimal(value);
    return n === null || Number.isNaN(n) ? null : n;
  };
  const concentrationValue = positive(line.concentration);
  return {
    chemicalId: line.chemical?.id ?? null,
    role: line.role,
    quantity: positive(line.quantity),
    unit: line.unit || null,
    coefficient: coefficientRoles.includes(line.role) ? positive(line.coefficient) : null,
    concentration:
      concentrationValue === null
        ? null
        : line.solution === 'molarity'
          ? { molarity: concentrationValue }
          : line.solution === 'percentWw'
            ? { percentWw: concentrationValue }
            : null,
    solutionDensity:
      line.solution === 'molarity' || line.solution === 'percentWw'
        ? positive(line.solutionDensity)
        : null,
  };
}
