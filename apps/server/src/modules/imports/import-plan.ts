import { convert, measuringDensity } from '@lotwise/chem';
import {
  formatQuantity,
  amountProblem,
  chemicalCreateSchema,
  importColumns,
  type ChemicalCreateParsed,
  type ContainerStatus,
  type ImportColumnKey,
  type ImportProblem,
  type ImportSummary,
  type LocationKind,
  type PeroxideClass,
  type PhysicalState,
  type StockUnit,
} from '@lotwise/shared';
import { roundQuantity } from '../containers/containers.service';
import type { HeaderMap, ImportRowValues } from './import-rows';

/** A chemical Lotwise already has, as the plan needs it. */
export interface KnownChemical {
  id: number;
  name: string;
  casNumber: string | null;
  stockUnit: StockUnit;
  density: number | null;
  physicalState: PhysicalState;
  /** g/mL of the poured solid: what a volume of a solid is converted with. */
  bulkDensity: number | null;
  peroxideClass: PeroxideClass | null;
}
export interface KnownLocation {
  id: number;
  path: string;
}
export interface KnownLot {
  id: number;
  chemicalId: number;
  supplierName: string | null;
  supplierLotNumber: string;
  receivedOn: string;
  expiresOn: string | null;
}

/** Where the plan reads what Lotwise already holds (inside the commit's transaction, or not). */
export interface PlanSource {
  chemicals(): Promise<KnownChemical[]>;
  locations(): Promise<KnownLocation[]>;
  lotsWithNumbers(chemicalIds: number[]): Promise<KnownLot[]>;
  /** Codes of `codes` already on containers; null skips the check (the unique index guards). */
  takenLabelCodes: ((codes: string[]) => Promise<Set<string>>) | null;
}

export interface NewLot {
  key: string;
  chemicalKey: string;
  row: number;
  supplierName: string | null;
  supplierLotNumber: string | null;
  grade: string | null;
  purityPercent: number | null;
  receivedOn: string;
  expiresOn: string | null;
}
export interface NewLocation {
  key: string;
  parentKey: string | null;
  name: string;
  kind: LocationKind;
  path: string;
}
export interface PlannedContainer {
  row: number;
  chemicalKey: string;
  lotKey: string;
  locationKey: string;
  labelCode: string | null;
  labelNumber: number | null;
  /** In the chemical's stock unit. */
  quantity: number;
  unit: StockUnit;
  tareMass: number | null;
  capacity: number | null;
  capacityUnit: string | null;
  openedOn: string | null;
  status: ContainerStatus;
  notes: string;
}

export interface ImportPlan {
  containers: PlannedContainer[];
  newChemicals: Map<string, { row: number; input: ChemicalCreateParsed }>;
  knownChemicals: Map<string, KnownChemical>;
  newLots: Map<string, NewLot>;
  knownLots: Map<string, KnownLot>;
  /** Parents before children. */
  newLocations: NewLocation[];
  knownLocations: Map<string, KnownLocation>;
  /** The highest LW- number the file gives, 0 when none. */
  highestLabelNumber: number;
  problems: ImportProblem[];
  summary: ImportSummary;
}

const headerOf = new Map(importColumns.map((column) => [column.key, column.header]));
const columnOrder = new Map(importColumns.map((column, i) => [column.key, i]));
const tick = () => new Promise<void>((resolve) => setImmediate(resolve));
const yieldEvery = 1000;

/** Key of a place path: names lower-cased, joined by a character no name holds. */
export function locationKey(parts: string[]): string {
  return parts.map((part) => part.toLowerCase()).join('\u001f');
}

const kindByDepth: LocationKind[] = ['room', 'cabinet', 'shelf'];

type ChemicalField =
  | 'casNumber'
  | 'formula'
  | 'physicalState'
  | 'density'
  | 'storageGroup'
  | 'ghsPictograms'
  | 'hazardStatements'
  | 'peroxideClass';
const chemicalFields: ChemicalField[] = [
  'casNumber',
  'formula',
  'physicalState',
  'density',
  'storageGroup',
  'ghsPictograms',
  'hazardStatements',
  'peroxideClass',
];

interface NewChemicalDraft {
  key: string;
  row: number;
  name: string;
  stockUnit: StockUnit;
  values: ImportRowValues['chemical'];
  /** The row each field's value came from. */
  from: Partial<Record<ChemicalField, number>>;
}

function shown(value: unknown): string {
  return Array.isArray(value) ? value.join(', ') : String(value);
}

/** Problems in file order: by row, then by column. */
export function sortProblems(problems: ImportProblem[]): ImportProblem[] {
  return problems.sort(
    (a, b) =>
      (a.row ?? 0) - (b.row ?? 0) ||
      (columnOrder.get(a.field as ImportColumnKey) ?? 99) -
        (columnOrder.get(b.field as ImportColumnKey) ?? 99),
  );
}

/**
 * Works out, for rows that each read well on their own, what the commit creates and what
 * it finds: chemicals by CAS RN then name, lots by supplier and lot number, places by path,
 * label codes unique in the file and (when `takenLabelCodes` is given) in Lotwise. The
 * same code runs at the preview and again inside the commit's transaction.
 */
export async function planImport(
  rows: ImportRowValues[],
  source: PlanSource,
  options: { today: string; header: Pick<HeaderMap, 'columns'> | null; blankRows: number },
): Promise<ImportPlan> {
  const problems: ImportProblem[] = [];
  const fail = (row: ImportRowValues, key: ImportColumnKey, value: unknown, message: string) => {
    problems.push({
      row: row.row,
      column: options.header?.columns.get(key)?.header ?? headerOf.get(key) ?? key,
      field: key,
      value: value === null || value === undefined ? null : shown(value).slice(0, 100),
      message,
    });
  };
  const failed = new Set<number>();

  // Chemicals: CAS RN first, then name; a new one is defined by its first row.
  const known = await source.chemicals();
  const knownByCas = new Map(
    known.flatMap((c) => (c.casNumber ? [[c.casNumber, c] as const] : [])),
  );
  const knownByName = new Map<string, KnownChemical[]>();
  for (const chemical of known) {
    const list = knownByName.get(chemical.name.toLowerCase()) ?? [];
    list.push(chemical);
    knownByName.set(chemical.name.toLowerCase(), list);
  }
  const drafts = new Map<string, NewChemicalDraft>();
  const draftByCas = new Map<string, NewChemicalDraft>();
  const draftByName = new Map<string, NewChemicalDraft>();
  const knownChemicals = new Map<string, KnownChemical>();
  const chemicalOfRow = new Map<number, string>();

  let i = 0;
  for (const row of rows) {
    if (++i % yieldEvery === 0) await tick();
    const { name, casNumber } = row.chemical;
    const lower = name.toLowerCase();
    let key: string;
    let knownMatch = casNumber ? knownByCas.get(casNumber) : undefined;
    knownMatch ??= knownByName
      .get(lower)
      ?.find((c) => c.casNumber === null || !casNumber || c.casNumber === casNumber);
    let draftMatch = knownMatch || !casNumber ? undefined : draftByCas.get(casNumber);
    if (!knownMatch && !draftMatch) {
      const sameName = draftByName.get(lower);
      if (
        sameName &&
        (!sameName.values.casNumber || !casNumber || sameName.values.casNumber === casNumber)
      )
        draftMatch = sameName;
    }
    if (knownMatch) {
      key = `db:${knownMatch.id}`;
      knownChemicals.set(key, knownMatch);
    } else if (casNumber && knownByName.get(lower)?.length) {
      const other = knownByName.get(lower)![0]!;
      fail(
        row,
        'casNumber',
        casNumber,
        `${other.name} is already in Lotwise with CAS RN ${other.casNumber}; this row says ${casNumber}. Correct the CAS RN, or the name if it is another chemical`,
      );
      failed.add(row.row);
      continue;
    } else if (draftMatch) {
      key = draftMatch.key;
      for (const field of chemicalFields) {
        const value = row.chemical[field];
        if (value === null) continue;
        const current = draftMatch.values[field];
        if (current === null) {
          (draftMatch.values as Record<ChemicalField, unknown>)[field] = value;
          draftMatch.from[field] = row.row;
          if (field === 'casNumber') draftByCas.set(value as string, draftMatch);
        } else if (JSON.stringify(current) !== JSON.stringify(value)) {
          fail(
            row,
            field,
            value,
            `differs from row ${draftMatch.from[field]} (${shown(current)}) for ${draftMatch.name}: one chemical has one ${headerOf.get(field)}`,
          );
          failed.add(row.row);
        }
      }
    } else if (casNumber && draftByName.get(lower)) {
      const other = draftByName.get(lower)!;
      fail(
        row,
        'casNumber',
        casNumber,
        `row ${other.row} gives ${other.name} the CAS RN ${other.values.casNumber}; one chemical has one CAS RN`,
      );
      failed.add(row.row);
      continue;
    } else {
      const draft: NewChemicalDraft = {
        key: `new:${drafts.size + 1}`,
        row: row.row,
        name,
        stockUnit: row.container.dimension === 'volume' ? 'mL' : 'g',
        values: { ...row.chemical },
        from: Object.fromEntries(
          chemicalFields.filter((f) => row.chemical[f] !== null).map((f) => [f, row.row]),
        ),
      };
      drafts.set(draft.key, draft);
      draftByName.set(lower, draft);
      if (casNumber) draftByCas.set(casNumber, draft);
      key = draft.key;
    }
    chemicalOfRow.set(row.row, key);
  }

  // New chemicals, checked once more with the schema the API uses.
  const newChemicals = new Map<string, { row: number; input: ChemicalCreateParsed }>();
  for (const draft of drafts.values()) {
    const v = draft.values;
    const parsed = chemicalCreateSchema.safeParse({
      name: draft.name,
      casNumber: v.casNumber,
      formula: v.formula,
      physicalState: v.physicalState ?? (draft.stockUnit === 'mL' ? 'liquid' : 'solid'),
      density: v.density,
      storageGroup: v.storageGroup ?? 'low-hazard',
      ghsPictograms: v.ghsPictograms ?? [],
      hazardStatements: v.hazardStatements ?? [],
      peroxideClass: v.peroxideClass,
      stockUnit: draft.stockUnit,
    });
    if (parsed.success) newChemicals.set(draft.key, { row: draft.row, input: parsed.data });
    else {
      const issue = parsed.error.issues[0]!;
      const field = String(issue.path[0] ?? 'chemical') as ImportColumnKey;
      problems.push({
        row: draft.row,
        column: headerOf.get(field) ?? 'Chemical',
        field: headerOf.has(field) ? field : 'chemical',
        value: null,
        message: `${draft.name}: ${issue.message}`,
      });
      failed.add(draft.row);
    }
  }

  // Lots: one per chemical + supplier + lot number; without a lot number, one per distinct
  // supplier, dates, grade and purity. A lot number Lotwise has for the chemical is reused.
  const knownChemicalIds = [...knownChemicals.values()].map((c) => c.id);
  const knownLotRows = knownChemicalIds.length
    ? await source.lotsWithNumbers(knownChemicalIds)
    : [];
  const knownLotByKey = new Map(
    knownLotRows.map((lot) => [
      `db:${lot.chemicalId}|n|${(lot.supplierName ?? '').toLowerCase()}|${lot.supplierLotNumber.toLowerCase()}`,
      lot,
    ]),
  );
  const newLots = new Map<string, NewLot>();
  const lotByFileKey = new Map<string, string>();
  const knownLots = new Map<string, KnownLot>();
  const lotOfRow = new Map<number, string>();
  i = 0;
  for (const row of rows) {
    if (++i % yieldEvery === 0) await tick();
    const chemicalKey = chemicalOfRow.get(row.row);
    if (!chemicalKey) continue;
    const lot = row.lot;
    const supplier = (lot.supplierName ?? '').toLowerCase();
    const fileKey = lot.supplierLotNumber
      ? `${chemicalKey}|n|${supplier}|${lot.supplierLotNumber.toLowerCase()}`
      : `${chemicalKey}|a|${supplier}|${lot.receivedOn ?? ''}|${lot.expiresOn ?? ''}|${(lot.grade ?? '').toLowerCase()}|${lot.purityPercent ?? ''}`;
    const seen = lotByFileKey.get(fileKey);
    if (seen) {
      lotOfRow.set(row.row, seen);
      const planned = newLots.get(seen);
      if (planned && lot.supplierLotNumber) {
        const pairs: [ImportColumnKey, keyof NewLot, unknown][] = [
          ['receivedOn', 'receivedOn', lot.receivedOn],
          ['expiresOn', 'expiresOn', lot.expiresOn],
          ['grade', 'grade', lot.grade],
          ['purityPercent', 'purityPercent', lot.purityPercent],
        ];
        for (const [column, field, value] of pairs) {
          if (value === null) continue;
          const current = planned[field];
          if (current === null) (planned as unknown as Record<string, unknown>)[field] = value;
          else if (current !== value) {
            fail(
              row,
              column,
              value,
              `differs from row ${planned.row} (${shown(current)}) for lot ${lot.supplierLotNumber}: one lot has one ${headerOf.get(column)}`,
            );
            failed.add(row.row);
          }
        }
      } else if (!planned) {
        checkKnownLot(row, knownLots.get(seen)!);
      }
      continue;
    }
    const knownLot = lot.supplierLotNumber ? knownLotByKey.get(fileKey) : undefined;
    if (knownLot) {
      const key = `db:${knownLot.id}`;
      knownLots.set(key, knownLot);
      lotByFileKey.set(fileKey, key);
      lotOfRow.set(row.row, key);
      checkKnownLot(row, knownLot);
      continue;
    }
    const key = `new:${newLots.size + 1}`;
    newLots.set(key, {
      key,
      chemicalKey,
      row: row.row,
      supplierName: lot.supplierName,
      supplierLotNumber: lot.supplierLotNumber,
      grade: lot.grade,
      purityPercent: lot.purityPercent,
      receivedOn: lot.receivedOn ?? options.today,
      expiresOn: lot.expiresOn,
    });
    lotByFileKey.set(fileKey, key);
    lotOfRow.set(row.row, key);
  }
  function checkKnownLot(row: ImportRowValues, knownLot: KnownLot) {
    for (const [column, value, current] of [
      ['receivedOn', row.lot.receivedOn, knownLot.receivedOn],
      ['expiresOn', row.lot.expiresOn, knownLot.expiresOn],
    ] as const) {
      if (value !== null && value !== current) {
        fail(
          row,
          column,
          value,
          `lot ${knownLot.supplierLotNumber} of this chemical is already in Lotwise with ${headerOf.get(column)} ${current ?? 'empty'}; use that, or another lot number for another lot`,
        );
        failed.add(row.row);
      }
    }
  }

  // Places: every missing step of every path is created, parents first.
  const knownLocations = new Map(
    (await source.locations()).map((l) => [locationKey(l.path.split('›').map((p) => p.trim())), l]),
  );
  const newLocations: NewLocation[] = [];
  const plannedLocations = new Set<string>();
  const usedKnownLocations = new Set<string>();
  i = 0;
  for (const row of rows) {
    if (++i % yieldEvery === 0) await tick();
    let parentKey: string | null = null;
    for (let depth = 0; depth < row.location.length; depth++) {
      const parts = row.location.slice(0, depth + 1);
      const key = locationKey(parts);
      if (knownLocations.has(key)) usedKnownLocations.add(key);
      else if (!plannedLocations.has(key)) {
        plannedLocations.add(key);
        newLocations.push({
          key,
          parentKey,
          name: parts[depth]!,
          kind: kindByDepth[depth] ?? 'other',
          path: parts.join(' › '),
        });
      }
      parentKey = key;
    }
  }

  // Label codes: unique in the file, and not on a container Lotwise has.
  const labelRows = new Map<string, number>();
  let highestLabelNumber = 0;
  for (const row of rows) {
    const code = row.container.labelCode;
    if (!code) continue;
    highestLabelNumber = Math.max(highestLabelNumber, row.container.labelNumber ?? 0);
    const same = labelRows.get(code.toUpperCase());
    if (same !== undefined) {
      fail(
        row,
        'labelCode',
        code,
        `${code} is also on row ${same}: each container needs its own label code (leave it empty to get a new one)`,
      );
      failed.add(row.row);
    } else labelRows.set(code.toUpperCase(), row.row);
  }
  if (source.takenLabelCodes) {
    const codes = rows.flatMap((row) => (row.container.labelCode ? [row.container.labelCode] : []));
    const taken = codes.length ? await source.takenLabelCodes(codes) : new Set<string>();
    for (const row of rows) {
      const code = row.container.labelCode;
      if (code && taken.has(code)) {
        fail(
          row,
          'labelCode',
          code,
          `${code} is already the label of a container in Lotwise: give another code, or leave it empty to get a new one`,
        );
        failed.add(row.row);
      }
    }
  }

  // Quantities in the chemical's stock unit (through the density across mass and volume).
  const containers: PlannedContainer[] = [];
  i = 0;
  for (const row of rows) {
    if (++i % yieldEvery === 0) await tick();
    const chemicalKey = chemicalOfRow.get(row.row);
    const lotKey = lotOfRow.get(row.row);
    if (!chemicalKey || !lotKey || failed.has(row.row)) continue;
    const knownChemical = knownChemicals.get(chemicalKey);
    const draft = drafts.get(chemicalKey);
    const stockUnit = knownChemical?.stockUnit ?? draft!.stockUnit;
    // A solid crosses mass and volume only through its bulk density (never the crystal's).
    const density = measuringDensity(
      knownChemical ?? {
        physicalState:
          draft!.values.physicalState ?? (draft!.stockUnit === 'mL' ? 'liquid' : 'solid'),
        density: draft!.values.density,
      },
    );
    const solid = (knownChemical?.physicalState ?? draft!.values.physicalState) === 'solid';
    const chemicalName = knownChemical?.name ?? draft!.name;
    const c = row.container;
    let quantity: number;
    const stockDimension = stockUnit === 'g' ? 'mass' : 'volume';
    if (c.dimension === stockDimension) quantity = convert(c.quantity, c.unit, stockUnit);
    else if (density === null) {
      fail(
        row,
        'unit',
        c.unit,
        solid
          ? `${chemicalName} is a solid counted in ${stockUnit}, and a solid is converted between mass and volume only with its bulk (poured) density, which ${knownChemical ? 'is not recorded' : 'an import cannot give'}: give the quantity in ${stockUnit}${knownChemical ? ', or record the bulk density on the chemical first' : ''}`
          : knownChemical
            ? `${chemicalName} is counted in ${stockUnit} in Lotwise and has no density, so ${c.unit} cannot be converted: give the quantity in ${stockUnit}, or add the density to the chemical first`
            : `${chemicalName} is counted in ${stockUnit} (from row ${draft!.row}) and no density is given, so ${c.unit} cannot be converted: give Density (g/mL), or the quantity in ${stockUnit}`,
      );
      continue;
    } else {
      quantity =
        stockUnit === 'g'
          ? convert(c.quantity, c.unit, 'mL') * density
          : convert(c.quantity, c.unit, 'g') / density;
    }
    const outOfBounds = quantity === 0 ? null : amountProblem(quantity, 'positive', stockUnit);
    if (outOfBounds) {
      fail(
        row,
        'quantity',
        c.quantity,
        `${formatQuantity(c.quantity, c.unit)} is ${formatQuantity(quantity, stockUnit)} (${chemicalName} is counted in ${stockUnit}), which ${outOfBounds}`,
      );
      continue;
    }
    quantity = roundQuantity(quantity);
    let status: ContainerStatus = c.status ?? (c.openedOn ? 'open' : 'sealed');
    if (quantity <= 1e-6 && (status === 'sealed' || status === 'open')) status = 'empty';
    const receivedOn =
      newLots.get(lotKey)?.receivedOn ?? knownLots.get(lotKey)?.receivedOn ?? options.today;
    containers.push({
      row: row.row,
      chemicalKey,
      lotKey,
      locationKey: locationKey(row.location),
      labelCode: c.labelCode,
      labelNumber: c.labelNumber,
      quantity,
      unit: stockUnit,
      tareMass: c.tareMass,
      capacity: c.capacity,
      capacityUnit: c.capacityUnit,
      // Opened at an unknown date: counted from receipt, so peroxide dates err early.
      openedOn: c.openedOn ?? (status === 'sealed' ? null : receivedOn),
      status,
      notes: c.notes,
    });
  }

  const newChemicalNames = [...newChemicals.values()].map((c) => c.input.name);
  return {
    containers,
    newChemicals,
    knownChemicals,
    newLots,
    knownLots,
    newLocations,
    knownLocations,
    highestLabelNumber,
    problems: sortProblems(problems),
    summary: {
      rows: rows.length,
      blankRowsSkipped: options.blankRows,
      chemicals: { new: newChemicals.size, existing: knownChemicals.size },
      lots: { new: newLots.size, existing: knownLots.size },
      containers: {
        new: containers.length,
        generatedLabelCodes: containers.filter((c) => !c.labelCode).length,
      },
      locations: { new: newLocations.length, existing: usedKnownLocations.size },
      newChemicalNames: newChemicalNames.slice(0, 100),
      newLocationPaths: newLocations.slice(0, 100).map((l) => l.path),
    },
  };
}
