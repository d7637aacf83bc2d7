import { formatCasNumber, tryMolarMass, tryParseUnit, validateCasNumber } from '@lotwise/chem';
import {
  amountProblem,
  containerStatuses,
  formatLabelCode,
  ghsCodes,
  hazardStatementSchema,
  importColumnForHeader,
  importColumns,
  isIsoDate,
  nameCharacterProblem,
  normalizeHeader,
  otherLabelCodePattern,
  parseLabelCode,
  physicalStates,
  storageGroupCodes,
  storageGroups,
  type AmountSign,
  type ContainerStatus,
  type GhsCode,
  type ImportColumnKey,
  type ImportProblem,
  type PeroxideClass,
  type PhysicalState,
  type StorageGroup,
} from '@lotwise/shared';
import { unescapeFormula } from '../../lib/csv';

/** One data row, read and checked on its own; what the plan and the commit work from. */
export interface ImportRowValues {
  /** Row number as a spreadsheet shows it. */
  row: number;
  chemical: {
    name: string;
    casNumber: string | null;
    formula: string | null;
    physicalState: PhysicalState | null;
    density: number | null;
    storageGroup: StorageGroup | null;
    ghsPictograms: GhsCode[] | null;
    hazardStatements: string[] | null;
    peroxideClass: PeroxideClass | null;
  };
  lot: {
    supplierName: string | null;
    supplierLotNumber: string | null;
    grade: string | null;
    purityPercent: number | null;
    /** Null: not given (the import date is used for a new lot). */
    receivedOn: string | null;
    expiresOn: string | null;
  };
  container: {
    labelCode: string | null;
    /** The number of an LW- code, null for other codes and for generated ones. */
    labelNumber: number | null;
    quantity: number;
    unit: string;
    dimension: 'mass' | 'volume';
    tareMass: number | null;
    capacity: number | null;
    capacityUnit: string | null;
    openedOn: string | null;
    /** Null: decided from Opened on and the quantity. */
    status: ContainerStatus | null;
    notes: string;
  };
  /** Place names from the room down. */
  location: string[];
}

const headerOf = new Map(importColumns.map((column) => [column.key, column.header]));
const requiredColumns = importColumns.filter((column) => column.required);

/** What a header row says: column key -> index and header as written, and what is wrong. */
export interface HeaderRead<K extends string> {
  /** Column key -> index in the record and the header as written. */
  columns: Map<K, { index: number; header: string }>;
  /** File-level problems (missing or doubled columns): rows are not read when there are any. */
  problems: ImportProblem[];
  warnings: string[];
}

export type HeaderMap = HeaderRead<ImportColumnKey>;

/** A problem of the whole file (its header), not of one row. */
export function fileProblem(message: string, column: string | null = null): ImportProblem {
  return { row: null, column, field: null, value: null, message };
}

/** How one kind of import names its columns, for {@link readHeaderRow}. */
export interface HeaderSpec<K extends string> {
  /** The column a header means, however it is spelled; undefined for none. */
  columnFor(header: string): K | null | undefined;
  headerOf: ReadonlyMap<K, string>;
  required: readonly { key: K; header: string }[];
  /** Who reads the columns, for the messages: "Lotwise", "a price list". */
  reader: string;
  /** Where every column name is documented. */
  guide: string;
}

/**
 * Reads the header row of an import: which column is which, unknown and unnamed columns
 * (warnings), and doubled or missing required ones (problems). Every kind of import reads its
 * header this way.
 */
export function readHeaderRow<K extends string>(
  header: string[],
  spec: HeaderSpec<K>,
): HeaderRead<K> {
  const columns: HeaderRead<K>['columns'] = new Map();
  const problems: ImportProblem[] = [];
  const warnings: string[] = [];
  header.forEach((raw, index) => {
    const text = unescapeFormula(raw.trim());
    if (text === '') {
      warnings.push(`Column ${index + 1} has no header; it is not read.`);
      return;
    }
    const key = spec.columnFor(text);
    if (!key) {
      warnings.push(`Column "${text}" is not one ${spec.reader} reads; it is not imported.`);
      return;
    }
    const earlier = columns.get(key);
    if (earlier) {
      problems.push(
        fileProblem(
          `Columns "${earlier.header}" and "${text}" both mean ${spec.headerOf.get(key)}; keep one of them.`,
          text,
        ),
      );
      return;
    }
    columns.set(key, { index, header: text });
  });
  const missing = spec.required.filter((column) => !columns.has(column.key));
  if (missing.length > 0) {
    const names = (list: readonly { header: string }[]) =>
      list.map((column) => column.header).join(', ');
    problems.unshift(
      fileProblem(
        `The file has no ${missing.length === 1 ? 'column' : 'columns'} for ${names(missing)}. The first row must name the columns; ${spec.reader} needs at least ${names(spec.required)} (see ${spec.guide} for every name it reads).`,
      ),
    );
  }
  return { columns, problems, warnings };
}

/** Reads the header row of a stock import. */
export function mapHeader(header: string[]): HeaderMap {
  return readHeaderRow<ImportColumnKey>(header, {
    columnFor: importColumnForHeader,
    headerOf,
    required: requiredColumns,
    reader: 'Lotwise',
    guide: 'docs/importing-stock.md',
  });
}

export interface RowOptions {
  /** Read "1,5" as 1.5 (files separated by semicolons or tabs). */
  decimalComma: boolean;
  today: string;
}

/** True when every cell of the record is empty (a blank line or a row of empty cells). */
export function isBlankRecord(record: string[]): boolean {
  return record.every((cell) => cell.trim() === '');
}

const pictogramPattern = /^ghs0?([1-9])$/i;
const statusSet = new Set<string>(containerStatuses);
const stateSet = new Set<string>(physicalStates);
const groupByName = new Map<string, StorageGroup>(
  storageGroupCodes.flatMap((code) => [
    [normalizeHeader(code), code] as const,
    [normalizeHeader(storageGroups[code].label), code] as const,
  ]),
);

/** "Room 101 › Cabinet A" (or with / or >) -> ["Room 101", "Cabinet A"]; null on an empty part. */
export function splitLocationPath(text: string): string[] | null {
  const separator = text.includes('›') ? /›/ : /[/>]/;
  const parts = text.split(separator).map((part) => part.trim().replace(/\s+/g, ' '));
  return parts.some((part) => part === '') ? null : parts;
}

function short(value: string): string {
  return value.length > 100 ? `${value.slice(0, 99)}…` : value;
}

/**
 * Reads one data record on its own: each cell checked, converted and normalized. Problems
 * name the row, the column as written in the file, and what to do.
 */
export function readRow(
  record: string[],
  header: HeaderMap,
  row: number,
  options: RowOptions,
): { values: ImportRowValues | null; problems: ImportProblem[] } {
  const problems: ImportProblem[] = [];
  const cell = (key: ImportColumnKey): string => {
    const column = header.columns.get(key);
    return column ? unescapeFormula((record[column.index] ?? '').trim()) : '';
  };
  const fail = (key: ImportColumnKey, message: string) => {
    const value = cell(key);
    problems.push({
      row,
      column: header.columns.get(key)?.header ?? headerOf.get(key) ?? key,
      field: key,
      value: value === '' ? null : short(value),
      message,
    });
    return null;
  };

  const text = (key: ImportColumnKey, max: number): string | null => {
    const value = cell(key).replace(/\s+/g, ' ');
    if (value === '') return null;
    if (value.length > max)
      return fail(key, `is ${value.length} characters long; at most ${max} fit`);
    const problem = nameCharacterProblem(value);
    return problem ? fail(key, problem) : value;
  };
  const number = (key: ImportColumnKey, suffix?: RegExp): number | null => {
    let value = cell(key).replace(/[\s\u00a0]/g, '');
    if (suffix) value = value.replace(suffix, '');
    if (value === '') return null;
    if (options.decimalComma && /^-?\d*,\d+$/.test(value)) value = value.replace(',', '.');
    const n = Number(value);
    if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(value) || !Number.isFinite(n)) {
      return fail(key, `"${short(cell(key))}" is not a number`);
    }
    return n;
  };
  /** The amount bounds every amount in Lotwise has (see @lotwise/shared `amountProblem`). */
  const outOfBounds = (key: ImportColumnKey, value: number, sign: AmountSign) => {
    const problem = amountProblem(value, sign);
    if (problem) fail(key, problem);
  };
  const date = (key: ImportColumnKey): string | null => {
    const value = cell(key);
    if (value === '') return null;
    const match = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})(?:[T ][\d:.]+Z?)?$/.exec(value);
    const iso = match
      ? `${match[1]}-${match[2]!.padStart(2, '0')}-${match[3]!.padStart(2, '0')}`
      : '';
    if (!match || !isIsoDate(iso)) {
      return fail(
        key,
        `"${short(value)}" is not a date Lotwise reads: write it YYYY-MM-DD, e.g. 2026-03-01 (format the column as text so the spreadsheet keeps that form)`,
      );
    }
    return iso;
  };
  const massOrVolumeUnit = (
    key: ImportColumnKey,
  ): { symbol: string; dimension: 'mass' | 'volume' } | null => {
    const value = cell(key);
    if (value === '') return null;
    const parsed = tryParseUnit(value);
    if (!parsed.ok)
      return fail(
        key,
        parsed.error.message.replace(
          /^unknown unit "[^"]*"/,
          `"${short(value)}" is not a unit Lotwise knows`,
        ),
      );
    if (parsed.value.dimension === 'amount') {
      return fail(
        key,
        `${parsed.value.symbol} is an amount of substance; stock is counted by mass or volume (µg, mg, g, kg, µL, mL or L)`,
      );
    }
    return { symbol: parsed.value.symbol, dimension: parsed.value.dimension };
  };

  // Chemical
  const name = text('chemical', 200);
  if (name === null && cell('chemical') === '')
    fail('chemical', 'is required: the name of the chemical');
  let casNumber: string | null = null;
  const casText = cell('casNumber');
  if (casText !== '') {
    const formatted = /^\d+$/.test(casText) ? formatCasNumber(casText) : casText;
    const check = validateCasNumber(formatted ?? casText);
    if (check.valid) casNumber = formatted ?? casText;
    else fail('casNumber', `"${short(casText)}" is not a valid CAS RN: ${check.reason}`);
  }
  const formula = text('formula', 120);
  if (formula !== null) {
    const result = tryMolarMass(formula);
    if (!result.ok)
      fail('formula', `"${short(formula)}" cannot be read as a formula: ${result.error.message}`);
  }
  let physicalState: PhysicalState | null = null;
  const stateText = cell('physicalState').toLowerCase();
  if (stateText !== '') {
    if (stateSet.has(stateText)) physicalState = stateText as PhysicalState;
    else fail('physicalState', `must be one of: ${physicalStates.join(', ')}`);
  }
  const density = number('density');
  if (density !== null && (density <= 0 || density > 25)) {
    fail('density', 'must be more than 0 and at most 25 g/mL');
  }
  let storageGroup: StorageGroup | null = null;
  const groupText = cell('storageGroup');
  if (groupText !== '') {
    storageGroup = groupByName.get(normalizeHeader(groupText)) ?? null;
    if (!storageGroup) {
      fail(
        'storageGroup',
        `"${short(groupText)}" is not a storage group; use one of: ${storageGroupCodes.join(', ')}`,
      );
    }
  }
  let ghsPictograms: GhsCode[] | null = null;
  const pictogramText = cell('ghsPictograms');
  if (pictogramText !== '') {
    const codes: GhsCode[] = [];
    for (const token of pictogramText.split(/[\s,;|]+/).filter(Boolean)) {
      const match = pictogramPattern.exec(token);
      const code = match ? (`GHS0${match[1]}` as GhsCode) : null;
      if (!code || !ghsCodes.includes(code)) {
        fail('ghsPictograms', `"${short(token)}" is not a GHS pictogram code; use GHS01 to GHS09`);
        break;
      }
      if (!codes.includes(code)) codes.push(code);
    }
    ghsPictograms = codes;
  }
  let hazardStatements: string[] | null = null;
  const statementText = cell('hazardStatements');
  if (statementText !== '') {
    const codes: string[] = [];
    for (const token of statementText.split(/[\s,;|+]+/).filter(Boolean)) {
      const code = token.replace(/^h/, 'H');
      if (!hazardStatementSchema.safeParse(code).success) {
        fail(
          'hazardStatements',
          `"${short(token)}" is not an H-statement code such as H225 or H361d`,
        );
        break;
      }
      if (!codes.includes(code)) codes.push(code);
    }
    hazardStatements = codes;
  }
  let peroxideClass: PeroxideClass | null = null;
  const peroxideText = cell('peroxideClass').toUpperCase();
  if (peroxideText !== '') {
    if (/^[ABCD]$/.test(peroxideText)) peroxideClass = peroxideText as PeroxideClass;
    else
      fail('peroxideClass', 'must be A, B, C or D (or empty when the chemical forms no peroxides)');
  }

  // Lot
  const supplierName = text('supplier', 200);
  const supplierLotNumber = text('supplierLotNumber', 80);
  const grade = text('grade', 80);
  let purityPercent = number('purityPercent', /%$/);
  if (purityPercent !== null && (purityPercent <= 0 || purityPercent > 100)) {
    purityPercent = fail('purityPercent', 'must be more than 0 and at most 100 %');
  }
  const receivedOn = date('receivedOn');
  const expiresOn = date('expiresOn');
  if (expiresOn && expiresOn < (receivedOn ?? options.today)) {
    fail(
      'expiresOn',
      receivedOn
        ? `is before the received date ${receivedOn}`
        : `is before today (${options.today}), the received date used when Received on is empty; give the received date`,
    );
  }

  // Container
  let labelCode: string | null = null;
  let labelNumber: number | null = null;
  const labelText = cell('labelCode');
  if (labelText !== '') {
    const n = parseLabelCode(labelText);
    if (n !== null && n <= 999_999_999) {
      labelNumber = n;
      labelCode = formatLabelCode(n);
    } else if (/^lw[-\s]?\d/i.test(labelText) || !otherLabelCodePattern.test(labelText)) {
      fail(
        'labelCode',
        'must be LW- and a number (LW-00042), or another code of up to 20 letters, digits and - . _ /; leave it empty to get the next LW- code',
      );
    } else {
      labelCode = labelText;
    }
  }
  const quantity = number('quantity');
  if (quantity === null && cell('quantity') === '')
    fail('quantity', 'is required: what the container holds now (0 or more)');
  if (quantity !== null && quantity < 0)
    fail('quantity', 'cannot be negative: give what the container holds now (0 or more)');
  else if (quantity !== null) outOfBounds('quantity', quantity, 'nonNegative');
  const unit = massOrVolumeUnit('unit');
  if (unit === null && cell('unit') === '') fail('unit', 'is required: µg, mg, g, kg, µL, mL or L');
  const tareMass = number('tareMass');
  if (tareMass !== null && tareMass < 0)
    fail('tareMass', 'cannot be negative (the empty container with cap, in g)');
  else if (tareMass !== null) outOfBounds('tareMass', tareMass, 'nonNegative');
  const capacity = number('capacity');
  if (capacity !== null && capacity <= 0) fail('capacity', 'must be more than 0');
  else if (capacity !== null) outOfBounds('capacity', capacity, 'positive');
  const capacityUnit =
    massOrVolumeUnit('capacityUnit') ?? (cell('capacityUnit') === '' ? unit : null);
  if (capacity !== null && cell('capacityUnit') === '' && !unit) {
    fail('capacityUnit', 'is needed with a capacity');
  }
  const openedOn = date('openedOn');
  let status: ContainerStatus | null = null;
  const statusText = cell('status').toLowerCase();
  if (statusText !== '') {
    if (statusSet.has(statusText)) status = statusText as ContainerStatus;
    else fail('status', `must be one of: ${containerStatuses.join(', ')} (or empty)`);
  }
  if (status === 'sealed' && openedOn) {
    fail('status', `is sealed, but Opened on says ${openedOn}: make it open, or clear Opened on`);
  }
  if ((status === 'empty' || status === 'disposed') && quantity !== null && quantity > 0) {
    fail(
      'quantity',
      `is ${quantity}, but the status says ${status}: an ${status} container holds 0`,
    );
  }
  const notes = cell('notes');
  if (notes.length > 2000) fail('notes', `is ${notes.length} characters long; at most 2000 fit`);

  // Location
  let location: string[] | null = null;
  const locationText = cell('location');
  if (locationText === '')
    fail(
      'location',
      'is required: the path from the room down, e.g. Room 101 › Cabinet A › Shelf 2',
    );
  else {
    location = splitLocationPath(locationText);
    if (!location)
      fail(
        'location',
        'has an empty part: write names between the separators, e.g. Room 101 › Cabinet A',
      );
    else if (location.some((part) => part.length > 120))
      fail('location', 'has a place name longer than 120 characters');
    else if (nameCharacterProblem(location.join(' › ')))
      fail('location', nameCharacterProblem(location.join(' › '))!);
    else if (location.length > 12) fail('location', 'is more than 12 places deep');
  }

  if (
    problems.length > 0 ||
    name === null ||
    quantity === null ||
    unit === null ||
    location === null
  ) {
    return { values: null, problems };
  }
  if (capacity !== null && capacityUnit && capacityUnit.dimension === unit.dimension) {
    const full = tryParseUnit(capacityUnit.symbol);
    const held = tryParseUnit(unit.symbol);
    if (
      full.ok &&
      held.ok &&
      quantity * held.value.factor > capacity * full.value.factor * (1 + 1e-9)
    ) {
      fail(
        'quantity',
        `${quantity} ${unit.symbol} is more than the capacity of ${capacity} ${capacityUnit.symbol}`,
      );
      return { values: null, problems };
    }
  }
  return {
    values: {
      row,
      chemical: {
        name,
        casNumber,
        formula,
        physicalState,
        density,
        storageGroup,
        ghsPictograms,
        hazardStatements,
        peroxideClass,
      },
      lot: { supplierName, supplierLotNumber, grade, purityPercent, receivedOn, expiresOn },
      container: {
        labelCode,
        labelNumber,
        quantity,
        unit: unit.symbol,
        dimension: unit.dimension,
        tareMass,
        capacity,
        capacityUnit: capacity === null ? null : (capacityUnit?.symbol ?? null),
        openedOn,
        status,
        notes,
      },
      location,
    },
    problems,
  };
}
