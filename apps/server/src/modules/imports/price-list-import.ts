import { validateCasNumber } from '@lotwise/chem';
import {
  amountProblem,
  currencyDigits,
  decimalTextToMinor,
  minorAmountSchema,
  nameCharacterProblem,
  normalizeHeader,
  priceListChangesShown,
  priceListColumns,
  type ImportProblem,
  type PackUnit,
  type PriceListAction,
  type PriceListColumnKey,
  type PriceListSummary,
} from '@lotwise/shared';
import { unescapeFormula } from '../../lib/csv';
import { readHeaderRow, type HeaderRead } from './import-rows';
import type { Repositories } from '../../db/store';
import { currencyProblem } from '../suppliers/suppliers.service';

/**
 * The price-list kind of import: one row per pack a supplier sells. Rows are read one by one
 * (`readPriceListRow`), then planned against the supplier's catalogue (`planPriceList`): an SKU
 * the supplier has updates its item, a new SKU adds one. The plan runs at the preview and again
 * inside the commit's transaction, which writes it (`writePriceList`).
 */

/** One price-list row, read and checked on its own. */
export interface PriceListRowValues {
  row: number;
  sku: string;
  /** A chemical's name or CAS RN, as written. */
  chemical: string;
  packSize: number;
  packUnit: PackUnit;
  priceMinor: number;
  grade: string | null;
  purityPercent: number | null;
  hazardous: boolean;
  splittable: boolean;
}

export type PriceListHeader = HeaderRead<PriceListColumnKey>;

const headerOf = new Map(priceListColumns.map((column) => [column.key, column.header]));
const columnOrder = new Map(priceListColumns.map((column, i) => [column.key, i]));
const columnByHeader = new Map<string, PriceListColumnKey>(
  priceListColumns.flatMap((column) =>
    [column.header, column.key, ...column.aliases].map(
      (name) => [normalizeHeader(name), column.key] as const,
    ),
  ),
);
const requiredColumns = priceListColumns.filter((column) => column.required);

/** Reads the header row of a price list: which column is which, what is missing or doubled. */
export function mapPriceListHeader(header: string[]): PriceListHeader {
  return readHeaderRow(header, {
    columnFor: (text) => columnByHeader.get(normalizeHeader(text)),
    headerOf,
    required: requiredColumns,
    reader: 'a price list',
    guide: 'docs/importing-price-lists.md',
  });
}

const packUnitByText: Record<string, PackUnit> = { g: 'g', kg: 'kg', mg: 'mg', ml: 'mL', l: 'L' };
const yes = new Set(['yes', 'y', 'true', '1']);
const no = new Set(['no', 'n', 'false', '0', '']);

function short(value: string): string {
  return value.length > 100 ? `${value.slice(0, 99)}…` : value;
}

/** Reads one price-list record on its own; problems name the row, the column and what to do. */
export function readPriceListRow(
  record: string[],
  header: PriceListHeader,
  row: number,
  options: { currency: string; decimalComma: boolean },
): { values: PriceListRowValues | null; problems: ImportProblem[] } {
  const problems: ImportProblem[] = [];
  const cell = (key: PriceListColumnKey): string => {
    const column = header.columns.get(key);
    return column ? unescapeFormula((record[column.index] ?? '').trim()) : '';
  };
  const fail = (key: PriceListColumnKey, message: string): null => {
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
  const text = (key: PriceListColumnKey, max: number, required: string | null) => {
    const value = cell(key).replace(/\s+/g, ' ');
    if (value === '') return required ? fail(key, required) : null;
    if (value.length > max)
      return fail(key, `is ${value.length} characters long; at most ${max} fit`);
    const problem = nameCharacterProblem(value);
    return problem ? fail(key, problem) : value;
  };
  const number = (key: PriceListColumnKey, suffix?: RegExp): number | null => {
    let value = cell(key).replace(/[\s\u00a0]/g, '');
    if (suffix) value = value.replace(suffix, '');
    if (value === '') return null;
    if (options.decimalComma && /^\d*,\d+$/.test(value)) value = value.replace(',', '.');
    if (!/^(\d+\.?\d*|\.\d+)$/.test(value))
      return fail(key, `"${short(cell(key))}" is not a number`);
    return Number(value);
  };
  const flag = (key: PriceListColumnKey): boolean => {
    const value = cell(key).toLowerCase();
    if (yes.has(value)) return true;
    if (!no.has(value)) fail(key, 'must be yes or no (empty means no)');
    return false;
  };

  const sku = text('sku', 80, "is required: the supplier's article number");
  const chemical = text('chemical', 200, 'is required: the chemical by name or CAS RN');

  const packSize = number('packSize');
  if (packSize === null && cell('packSize') === '')
    fail('packSize', 'is required: how much one pack holds');
  else if (packSize !== null) {
    const problem = amountProblem(packSize, 'positive');
    if (problem) fail('packSize', problem);
  }
  const unitText = cell('packUnit');
  const packUnit = packUnitByText[unitText.toLowerCase()] ?? null;
  if (!packUnit)
    fail(
      'packUnit',
      unitText === '' ? 'is required: g, kg, mg, mL or L' : 'must be one of: g, kg, mg, mL, L',
    );

  const digits = currencyDigits(options.currency);
  const priceText = cell('price');
  let priceMinor: number | null = null;
  if (priceText === '') fail('price', `is required: the price of one pack in ${options.currency}`);
  else {
    priceMinor = decimalTextToMinor(priceText, options.currency);
    if (priceMinor === null) {
      const fraction = /^\s*\d+[.,](\d+)\s*$/.exec(priceText)?.[1];
      fail(
        'price',
        fraction && fraction.length > digits
          ? `has ${fraction.length} decimals; ${options.currency} has ${digits}: round it to whole ${digits === 0 ? 'units' : 'cents'}`
          : `"${short(priceText)}" is not a price: write the amount in ${options.currency} with a point or comma for the decimals, e.g. 12.50, without currency sign or thousands separators`,
      );
    } else if (!minorAmountSchema.safeParse(priceMinor).success) {
      priceMinor = fail('price', 'is more than any pack costs (at most 100,000,000.00)');
    }
  }
  const currencyText = cell('currency').toUpperCase();
  const wrongCurrency = currencyProblem(currencyText, options.currency);
  if (wrongCurrency) fail('currency', wrongCurrency);

  const grade = text('grade', 80, null);
  let purityPercent = number('purityPercent', /%$/);
  if (purityPercent !== null && (purityPercent <= 0 || purityPercent > 100)) {
    purityPercent = fail('purityPercent', 'must be more than 0 and at most 100 %');
  }
  const hazardous = flag('hazardous');
  const splittable = flag('splittable');

  if (
    problems.length > 0 ||
    sku === null ||
    chemical === null ||
    packSize === null ||
    packUnit === null ||
    priceMinor === null
  ) {
    return { values: null, problems };
  }
  return {
    values: {
      row,
      sku,
      chemical,
      packSize,
      packUnit,
      priceMinor,
      grade,
      purityPercent,
      hazardous,
      splittable,
    },
    problems,
  };
}

/** A row's effect on the catalogue: a new item, or the id and new values of an existing one. */
export interface PlannedPriceListItem {
  row: number;
  existingId: number | null;
  action: PriceListAction;
  values: Omit<PriceListRowValues, 'row' | 'chemical'> & { chemicalId: number };
}

export interface PriceListPlan {
  items: PlannedPriceListItem[];
  problems: ImportProblem[];
  summary: PriceListSummary;
}

/** Problems in file order: by row, then by column. */
export function sortPriceListProblems(problems: ImportProblem[]): ImportProblem[] {
  return problems.sort(
    (a, b) =>
      (a.row ?? 0) - (b.row ?? 0) ||
      (columnOrder.get(a.field as PriceListColumnKey) ?? 99) -
        (columnOrder.get(b.field as PriceListColumnKey) ?? 99),
  );
}

/**
 * Matches each row's chemical (CAS RN, else name) and SKU against what Lotwise holds for the
 * supplier: what the commit adds, updates or leaves as it is.
 */
export async function planPriceList(
  rows: PriceListRowValues[],
  repos: Repositories,
  supplier: { id: number; name: string },
  context: { currency: string; blankRows: number; header: PriceListHeader | null },
): Promise<PriceListPlan> {
  const problems: ImportProblem[] = [];
  const fail = (row: PriceListRowValues, key: PriceListColumnKey, value: string, message: string) =>
    problems.push({
      row: row.row,
      column: context.header?.columns.get(key)?.header ?? headerOf.get(key) ?? key,
      field: key,
      value: short(value),
      message,
    });

  const chemicals = await repos.imports.knownChemicals();
  const byCas = new Map(chemicals.flatMap((c) => (c.casNumber ? [[c.casNumber, c] as const] : [])));
  const byName = new Map<string, typeof chemicals>();
  for (const chemical of chemicals) {
    const key = chemical.name.toLowerCase();
    byName.set(key, [...(byName.get(key) ?? []), chemical]);
  }
  const existing = await repos.suppliers.itemsBySku(supplier.id);
  const seenSku = new Map<string, number>();
  const items: PlannedPriceListItem[] = [];
  const changes: PriceListSummary['changes'] = [];

  for (const row of rows) {
    const skuKey = row.sku.toLowerCase();
    const earlier = seenSku.get(skuKey);
    if (earlier !== undefined) {
      fail(row, 'sku', row.sku, `${row.sku} is also on row ${earlier}: one row per SKU`);
      continue;
    }
    seenSku.set(skuKey, row.row);

    const looksLikeCas = /^\d{2,7}-\d{2}-\d$/.test(row.chemical);
    let chemical: (typeof chemicals)[number] | undefined;
    if (looksLikeCas) {
      const check = validateCasNumber(row.chemical);
      if (!check.valid) {
        fail(
          row,
          'chemical',
          row.chemical,
          `${row.chemical} is not a valid CAS RN: ${check.reason}`,
        );
        continue;
      }
      chemical = byCas.get(row.chemical);
    } else {
      const named = byName.get(row.chemical.toLowerCase()) ?? [];
      if (named.length > 1) {
        fail(
          row,
          'chemical',
          row.chemical,
          `${named.length} chemicals in Lotwise are called ${row.chemical}: give the CAS RN instead`,
        );
        continue;
      }
      chemical = named[0];
    }
    if (!chemical) {
      fail(
        row,
        'chemical',
        row.chemical,
        `Lotwise has no chemical ${looksLikeCas ? 'with the CAS RN' : 'called'} ${row.chemical}: add it under Chemicals first, or correct the ${looksLikeCas ? 'number' : 'name'}`,
      );
      continue;
    }

    const { row: rowNumber, chemical: _chemical, ...fields } = row;
    const values = { ...fields, chemicalId: chemical.id };
    const current = existing.get(skuKey);
    let action: PriceListAction = 'create';
    if (current) {
      const same =
        current.discontinued === false &&
        current.chemicalId === values.chemicalId &&
        current.packSize === values.packSize &&
        current.packUnit === values.packUnit &&
        current.priceMinor === values.priceMinor &&
        current.currency === context.currency &&
        current.grade === values.grade &&
        current.purityPercent === values.purityPercent &&
        current.hazardous === values.hazardous &&
        current.splittable === values.splittable;
      action = same ? 'unchanged' : 'update';
    }
    items.push({ row: rowNumber, existingId: current?.id ?? null, action, values });
    if (changes.length < priceListChangesShown) {
      changes.push({
        row: rowNumber,
        sku: current?.sku ?? row.sku,
        chemical: chemical.name,
        packSize: values.packSize,
        packUnit: values.packUnit,
        priceMinor: values.priceMinor,
        previousPriceMinor: current?.priceMinor ?? null,
        action,
      });
    }
  }

  const count = (action: PriceListAction) => items.filter((i) => i.action === action).length;
  return {
    items,
    problems: sortPriceListProblems(problems),
    summary: {
      rows: rows.length,
      blankRowsSkipped: context.blankRows,
      supplier,
      currency: context.currency,
      items: { new: count('create'), updated: count('update'), unchanged: count('unchanged') },
      changes,
    },
  };
}

/** Writes a plan: new items inserted, changed ones updated (and sold again if discontinued). */
export async function writePriceList(
  repos: Repositories,
  supplierId: number,
  currency: string,
  plan: PriceListPlan,
  now: string,
): Promise<void> {
  for (const item of plan.items) {
    if (item.action === 'unchanged') continue;
    if (item.existingId === null) {
      await repos.suppliers.insertItem({
        ...item.values,
        supplierId,
        currency,
        discontinued: false,
        createdAt: now,
        updatedAt: now,
      });
    } else {
      // The SKU keeps the letter case it was created with.
      const { sku: _sku, ...changes } = item.values;
      await repos.suppliers.updateItem(item.existingId, {
        ...changes,
        currency,
        discontinued: false,
        updatedAt: now,
      });
    }
  }
}
