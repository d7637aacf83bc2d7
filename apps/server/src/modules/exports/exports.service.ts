import {
  chemicalExportHeaders,
  importColumns,
  plainNumber,
  todayIso,
  type Chemical,
  type ChemicalListQuery,
  type Container,
  type ContainerListQuery,
  type ImportColumnKey,
} from '@lotwise/shared';
import type { Response } from 'express';
import { csvLine, utf8Bom } from '../../lib/csv';
import type { Store } from '../../db/store';
import { chemicalsService } from '../chemicals/chemicals.service';
import { containersService } from '../containers/containers.service';

/** Rows read from the database per query while a CSV streams out. */
const pageSize = 1000;

type Cell = string | number | boolean | null;

function list(values: readonly string[]): string {
  return values.join(', ');
}

/**
 * A container as a row of the import's columns, so an export imports again. Amounts are a
 * plain number (decimal point, no grouping) beside their unit: a spreadsheet reads them as
 * numbers and nothing recorded is lost to display rounding.
 */
export function containerCells(container: Container, chemical: Chemical | undefined) {
  const cells: Record<ImportColumnKey, Cell> = {
    chemical: container.chemical.name,
    casNumber: container.chemical.casNumber,
    formula: container.chemical.formula,
    physicalState: chemical?.physicalState ?? null,
    density: container.chemical.density,
    storageGroup: container.chemical.storageGroup,
    ghsPictograms: list(container.chemical.ghsPictograms),
    hazardStatements: list(container.chemical.hazardStatements),
    peroxideClass: container.chemical.peroxideClass,
    supplier: container.lot.supplierName,
    supplierLotNumber: container.lot.supplierLotNumber,
    grade: container.lot.grade,
    purityPercent: container.lot.purityPercent,
    receivedOn: container.lot.receivedOn,
    expiresOn: container.lot.expiresOn,
    labelCode: container.labelCode,
    quantity: plainNumber(container.quantity),
    unit: container.unit,
    tareMass: container.tareMass === null ? null : plainNumber(container.tareMass),
    capacity: container.capacity === null ? null : plainNumber(container.capacity),
    capacityUnit: container.capacityUnit,
    openedOn: container.openedOn,
    status: container.status,
    location: container.location.path,
    notes: container.notes,
  };
  return importColumns.map((column) => cells[column.key]);
}

function chemicalCells(chemical: Chemical): Cell[] {
  return [
    chemical.name,
    list(chemical.synonyms),
    chemical.casNumber,
    chemical.formula,
    chemical.molarMass === null ? null : Math.round(chemical.molarMass * 1e4) / 1e4,
    chemical.physicalState,
    chemical.density,
    chemical.defaultPurityPercent,
    list(chemical.ghsPictograms),
    list(chemical.hazardStatements),
    chemical.storageGroup,
    list(chemical.extraHazardGroups ?? []),
    chemical.peroxideClass,
    chemical.stockUnit,
    chemical.reorderPoint,
    chemical.reorderQuantity,
    chemical.restricted ? 'yes' : 'no',
    chemical.flashPointC ?? null,
    chemical.flashPointSource ?? '',
    chemical.boilingPointC ?? null,
    chemical.boilingPointSource ?? '',
    chemical.liquidClass ?? null,
    chemical.ghsFlammableCategory ?? null,
    chemical.notes,
  ];
}

/** Starts a CSV download: type, file name, UTF-8 mark, header row. */
function startCsv(res: Response, fileName: string, header: readonly string[]) {
  res.status(200);
  res.attachment(fileName);
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Cache-Control', 'private, no-store');
  res.write(utf8Bom + csvLine(header));
}

/** Pages through a list and writes each page as it comes, so memory stays flat. */
async function stream<T>(
  res: Response,
  fetch: (page: number) => Promise<T[]>,
  write: (items: T[]) => Promise<string>,
) {
  try {
    for (let page = 1; ; page++) {
      const items = await fetch(page);
      if (items.length) res.write(await write(items));
      if (items.length < pageSize) break;
    }
    res.end();
  } catch (error) {
    // Headers are gone: the client sees a cut-off download rather than a hanging one.
    res.destroy(error instanceof Error ? error : new Error(String(error)));
  }
}

export function exportsService(store: Store) {
  const containers = containersService(store);
  const chemicals = chemicalsService(store);

  return {
    /** `Content-Disposition` file names carry the date: lotwise-containers-2026-03-01.csv. */
    async containersCsv(query: ContainerListQuery, res: Response) {
      startCsv(
        res,
        `lotwise-containers-${todayIso()}.csv`,
        importColumns.map((column) => column.header),
      );
      const known = new Map<number, Chemical>();
      await stream(
        res,
        async (page) => (await containers.list({ ...query, page, pageSize })).items,
        async (items) => {
          for (const id of new Set(items.map((c) => c.chemical.id))) {
            if (!known.has(id)) {
              const chemical = await store.repos.chemicals.findById(id);
              if (chemical) known.set(id, chemical);
            }
          }
          return items.map((c) => csvLine(containerCells(c, known.get(c.chemical.id)))).join('');
        },
      );
    },

    async chemicalsCsv(query: ChemicalListQuery, res: Response) {
      startCsv(res, `lotwise-chemicals-${todayIso()}.csv`, chemicalExportHeaders);
      await stream(
        res,
        async (page) => (await chemicals.list({ ...query, page, pageSize })).items,
        async (items) => items.map((c) => csvLine(chemicalCells(c))).join(''),
      );
    },

    /** The import's header row alone: a file to fill in. */
    templateCsv(res: Response) {
      res.attachment('lotwise-stock-import-template.csv');
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.send(utf8Bom + csvLine(importColumns.map((column) => column.header)));
    },
  };
}
export type ExportsService = ReturnType<typeof exportsService>;
