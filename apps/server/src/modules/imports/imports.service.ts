import {
  countOf,
  can,
  defaultTextLocale,
  formatDateTime,
  formatLabelCode,
  importRowLimit,
  importWaitRowLimit,
  todayIso,
  type Import,
  type ImportCreateQuery,
  type ImportListItem,
  type ImportListQuery,
  type ImportProblem,
  type ImportQuery,
  type ImportStatus,
  type ImportSummary,
  type Page,
  type PriceListSummary,
  type User,
} from '@lotwise/shared';
import type { TextConfig } from '../../config';
import { AppError } from '../../lib/app-error';
import { CsvSyntaxError, decodeText, parseCsv } from '../../lib/csv';
import type { Logger } from '../../lib/logger';
import { jobLocks } from '../../db/postgres';
import { noteLedgerChange, type Repositories, type Store } from '../../db/store';
import { isUniqueViolation, nowIso } from '../../db/sql';
import { newChemicalValues } from '../chemicals/chemicals.service';
import type { ContainerValues, LedgerEntryValues } from '../containers/containers.repository';
import { peroxideDueOf } from '../containers/peroxide-dates';
import type { LocationRow } from '../locations/location.entity';
import { planImport, sortProblems, type ImportPlan, type PlanSource } from './import-plan';
import {
  isBlankRecord,
  mapHeader,
  readRow,
  type HeaderMap,
  type ImportRowValues,
} from './import-rows';
import type { ImportHead } from './imports.repository';
import {
  mapPriceListHeader,
  planPriceList,
  readPriceListRow,
  sortPriceListProblems,
  writePriceList,
  type PriceListHeader,
  type PriceListRowValues,
} from './price-list-import';

/** Rows read or written between two turns of the event loop. */
const chunkSize = 500;
/** Problems kept per import (the count is always complete). */
const maxStoredProblems = 10_000;
const tick = () => new Promise<void>((resolve) => setImmediate(resolve));

/** What is stored for the commit: the rows as read, and how many blank ones were skipped. */
interface StoredRows<R = ImportRowValues> {
  blankRows: number;
  rows: R[];
}

/** A commit refused after it began: nothing was written. */
class CommitFailure extends Error {
  constructor(
    message: string,
    public readonly problems: ImportProblem[] = [],
  ) {
    super(message);
  }
}

function planSource(repos: Repositories, checkLabels: boolean): PlanSource {
  return {
    chemicals: () => repos.imports.knownChemicals(),
    locations: () => repos.imports.knownLocations(),
    lotsWithNumbers: (ids) => repos.imports.lotsWithNumbers(ids),
    takenLabelCodes: checkLabels ? (codes) => repos.imports.takenLabelCodes(codes) : null,
  };
}

function statusConflict(head: ImportHead, text: TextConfig): AppError {
  const messages: Record<ImportStatus, string> = {
    validating: `Import #${head.id} is still being checked; commit it once it is ready.`,
    ready: '',
    invalid: `Import #${head.id} has ${countOf(head.errorCount, 'problem')} and cannot be committed: correct the file and upload it again.`,
    committing: `Import #${head.id} is being committed already.`,
    committed: `Import #${head.id} was committed on ${formatDateTime(head.committedAt ?? head.updatedAt, { ...text, showZone: true })}; its stock is in Lotwise already.`,
    failed: `Import #${head.id} failed (${head.failure ?? 'see its details'}); upload the file again.`,
  };
  return AppError.conflict(messages[head.status]);
}

export function importsService(
  store: Store,
  logger: Logger,
  text: TextConfig = { locale: defaultTextLocale, timeZone: 'UTC' },
  /** The lab's currency: every price in a price list must be in it. */
  currency = 'EUR',
) {
  const { imports } = store.repos;
  /** Imports being validated or committed by this process: their progress lives here. */
  const running = new Map<number, { processed: number }>();

  const importJob = (id: number) => ({ kind: jobLocks.imports, id });

  /**
   * An import left validating/committing by a stopped server: nothing of it was written. One
   * that another app instance is working on (it holds the import's job) is left alone;
   * `heldHere`: this request holds it, so no other process does.
   */
  async function settleInterrupted(head: ImportHead, heldHere = false): Promise<ImportHead> {
    if (
      (head.status === 'validating' || head.status === 'committing') &&
      !running.has(head.id) &&
      (heldHere || (await store.jobIsFree(importJob(head.id))))
    ) {
      const failure =
        'The server stopped while this import was being processed; nothing was written. Upload the file again.';
      // The head may be stale: the check or commit can have finished since it was read.
      if (await imports.markInterrupted(head, failure, nowIso())) {
        return { ...head, status: 'failed', failure };
      }
      return (await imports.findHead(head.id)) ?? head;
    }
    return head;
  }

  function present(head: ImportHead, query: ImportQuery): Import {
    const start = (query.errorsPage - 1) * query.errorsPageSize;
    const priceList = head.kind === 'price-list';
    return {
      id: head.id,
      kind: head.kind,
      supplier:
        head.supplierId === null
          ? null
          : { id: head.supplierId, name: head.supplierName ?? `Supplier #${head.supplierId}` },
      fileName: head.fileName,
      status: head.status,
      totalRows: head.totalRows,
      processedRows: running.get(head.id)?.processed ?? head.processedRows,
      errorCount: head.errorCount,
      errors: head.errors.slice(start, start + query.errorsPageSize),
      errorsPage: query.errorsPage,
      errorsPageSize: query.errorsPageSize,
      warnings: head.warnings,
      summary: priceList ? null : ((head.summary as ImportSummary | null) ?? null),
      priceList: priceList ? ((head.summary as PriceListSummary | null) ?? null) : null,
      failure: head.failure,
      createdBy:
        head.userId === null ? null : { id: head.userId, displayName: head.createdByName ?? '' },
      createdAt: head.createdAt,
      updatedAt: head.updatedAt,
      committedAt: head.committedAt,
    };
  }

  async function load(id: number): Promise<ImportHead> {
    const head = await imports.findHead(id);
    if (!head) throw AppError.notFound(`There is no import #${id}.`);
    return settleInterrupted(head);
  }

  const firstPage: ImportQuery = { errorsPage: 1, errorsPageSize: 100 };

  /** How the rows of one kind of import are read, planned and their problems ordered. */
  interface RowReader<R> {
    read(record: string[], row: number): { values: R | null; problems: ImportProblem[] };
    plan(
      rows: R[],
      blankRows: number,
    ): Promise<{ problems: ImportProblem[]; summary: ImportSummary | PriceListSummary }>;
    sort(problems: ImportProblem[]): ImportProblem[];
  }

  function stockReader(header: HeaderMap, decimalComma: boolean): RowReader<ImportRowValues> {
    const today = todayIso();
    return {
      read: (record, row) => readRow(record, header, row, { decimalComma, today }),
      plan: (rows, blankRows) =>
        planImport(rows, planSource(store.repos, true), { today, header, blankRows }),
      sort: sortProblems,
    };
  }

  function priceListReader(
    header: PriceListHeader,
    decimalComma: boolean,
    supplier: { id: number; name: string },
  ): RowReader<PriceListRowValues> {
    return {
      read: (record, row) => readPriceListRow(record, header, row, { currency, decimalComma }),
      plan: (rows, blankRows) =>
        planPriceList(rows, store.repos, supplier, { currency, blankRows, header }),
      sort: sortPriceListProblems,
    };
  }

  /** Reads every row in chunks, then plans against what Lotwise holds. Writes only `imports`. */
  async function validate<R>(id: number, records: string[][], reader: RowReader<R>) {
    const progress = { processed: 0 };
    running.set(id, progress);
    // a new import's id: no other process can hold it
    const release = await store.holdJob(importJob(id));
    try {
      const rows: R[] = [];
      const problems: ImportProblem[] = [];
      let blankRows = 0;
      for (let start = 0; start < records.length; start += chunkSize) {
        const end = Math.min(records.length, start + chunkSize);
        for (let i = start; i < end; i++) {
          const record = records[i]!;
          if (isBlankRecord(record)) {
            blankRows++;
            continue;
          }
          // Record 0 is the header (row 1), so data record i is spreadsheet row i + 2.
          const read = reader.read(record, i + 2);
          problems.push(...read.problems);
          if (read.values) rows.push(read.values);
        }
        progress.processed = end;
        await tick();
      }
      const plan = await reader.plan(rows, blankRows);
      const all = reader.sort([...problems, ...plan.problems]);
      const stored: StoredRows<R> = { blankRows, rows };
      await imports.update(id, {
        status: all.length ? 'invalid' : 'ready',
        processedRows: records.length,
        errorCount: all.length,
        errors: all.slice(0, maxStoredProblems),
        summary: { ...plan.summary, rows: records.length - blankRows },
        rows: all.length ? null : JSON.stringify(stored),
        updatedAt: nowIso(),
      });
    } catch (error) {
      logger.error('Import validation failed', { importId: id, error: String(error) });
      await imports.update(id, {
        status: 'failed',
        failure: 'The file could not be checked because of an error on the server.',
        updatedAt: nowIso(),
      });
    } finally {
      running.delete(id);
      await release?.();
    }
  }

  /** Writes the plan: places, chemicals, lots, then containers with `received` entries. */
  async function write(
    repos: Repositories,
    id: number,
    fileName: string,
    plan: ImportPlan,
    actor: User,
    progress: { processed: number },
  ) {
    const now = nowIso();
    const locations = new Map<string, LocationRow>();
    for (const [key, known] of plan.knownLocations) {
      if (plan.newLocations.some((l) => l.parentKey === key)) {
        locations.set(key, (await repos.locations.findRow(known.id))!);
      }
    }
    for (const place of plan.newLocations) {
      const parent = place.parentKey ? (locations.get(place.parentKey) ?? null) : null;
      const row = await repos.locations.insert(
        {
          name: place.name,
          kind: place.kind,
          parentId: parent?.id ?? null,
          storageGroups: [],
          notes: `Created by import #${id}`,
          createdAt: now,
          updatedAt: now,
        },
        parent,
      );
      locations.set(place.key, row);
    }
    const locationId = (key: string) => locations.get(key)?.id ?? plan.knownLocations.get(key)!.id;

    const chemicals = new Map<
      string,
      { id: number; peroxideClass: string | null; stockUnit: string }
    >();
    for (const [key, known] of plan.knownChemicals) chemicals.set(key, known);
    for (const [key, { input }] of plan.newChemicals) {
      const created = await repos.chemicals.insert(newChemicalValues(input, now));
      chemicals.set(key, created);
    }

    const lots = new Map<string, { id: number; receivedOn: string; expiresOn: string | null }>();
    for (const [key, known] of plan.knownLots) lots.set(key, known);
    for (const [key, lot] of plan.newLots) {
      const lotId = await repos.lots.insert({
        chemicalId: chemicals.get(lot.chemicalKey)!.id,
        source: 'purchased',
        supplierName: lot.supplierName,
        supplierLotNumber: lot.supplierLotNumber,
        grade: lot.grade,
        purityPercent: lot.purityPercent,
        receivedOn: lot.receivedOn,
        expiresOn: lot.expiresOn,
        madeByRunId: null,
        certificateFileName: null,
        certificateStoredName: null,
        notes: `Imported from ${fileName} (import #${id})`,
        createdAt: now,
        updatedAt: now,
      });
      lots.set(key, { id: lotId, receivedOn: lot.receivedOn, expiresOn: lot.expiresOn });
    }

    let nextNumber = Math.max(
      await repos.containers.nextLabelNumber(),
      plan.highestLabelNumber + 1,
    );
    for (let start = 0; start < plan.containers.length; start += chunkSize) {
      const part = plan.containers.slice(start, start + chunkSize);
      const values: ContainerValues[] = part.map((c) => {
        const chemical = chemicals.get(c.chemicalKey)!;
        const lot = lots.get(c.lotKey)!;
        const labelNumber = c.labelCode ? c.labelNumber : nextNumber++;
        return {
          labelCode: c.labelCode ?? formatLabelCode(labelNumber!),
          labelNumber,
          lotId: lot.id,
          chemicalId: chemical.id,
          locationId: locationId(c.locationKey),
          status: c.status,
          quantity: c.quantity,
          unit: c.unit,
          tareMass: c.tareMass,
          capacity: c.capacity,
          capacityUnit: c.capacityUnit,
          openedOn: c.openedOn,
          expiresOn: lot.expiresOn,
          peroxideDueOn:
            peroxideDueOf(chemical.peroxideClass, c.openedOn, lot.receivedOn, lot.expiresOn)
              ?.dueOn ?? null,
          notes: c.notes,
          createdAt: now,
          updatedAt: now,
        };
      });
      let ids: Map<string, number>;
      try {
        ids = await repos.imports.insertContainers(values);
      } catch (error) {
        if (!isUniqueViolation(error)) throw error;
        // Someone labelled a container with one of these codes since the preview.
        const taken = await repos.imports.takenLabelCodes(values.map((v) => v.labelCode));
        const index = values.findIndex((v) => taken.has(v.labelCode));
        const row = part[Math.max(0, index)]!;
        const code = values[Math.max(0, index)]!.labelCode;
        throw new CommitFailure(
          `Row ${row.row}: the label code ${code} was given to another container after the preview. Nothing was imported; upload the file again to check it anew.`,
          [
            {
              row: row.row,
              column: 'Label code',
              field: 'labelCode',
              value: code,
              message: `${code} is already the label of a container in Lotwise: give another code, or leave it empty to get a new one`,
            },
          ],
        );
      }
      const entries: LedgerEntryValues[] = part.map((c, i) => ({
        containerId: ids.get(values[i]!.labelCode)!,
        reason: 'received',
        quantity: c.quantity,
        unit: c.unit,
        balanceAfter: c.quantity,
        note: `Imported from ${fileName} (import #${id}, row ${c.row})`,
        userId: actor.id,
        runId: null,
        orderId: null,
        stocktakeId: null,
        fromLocationId: null,
        toLocationId: values[i]!.locationId,
        relatedContainerId: null,
        createdAt: now,
      }));
      await repos.imports.insertEntries(entries);
      progress.processed = start + part.length;
      await tick();
    }
    for (const chemical of new Set(plan.containers.map((c) => chemicals.get(c.chemicalKey)!.id))) {
      noteLedgerChange(repos, chemical);
    }
  }

  /** Plans a price list again inside the commit's transaction and writes it. */
  async function commitPriceList(
    repos: Repositories,
    head: ImportHead,
    stored: StoredRows<PriceListRowValues>,
  ) {
    const supplier = head.supplierId ? await repos.suppliers.findSupplier(head.supplierId) : null;
    if (!supplier) {
      throw new CommitFailure(
        'The supplier of this price list was deleted after the preview. Nothing was imported.',
      );
    }
    const plan = await planPriceList(
      stored.rows,
      repos,
      { id: supplier.id, name: supplier.name },
      { currency, blankRows: stored.blankRows, header: null },
    );
    if (plan.problems.length > 0) {
      const first = plan.problems[0]!;
      throw new CommitFailure(
        `The catalogue or the chemicals changed since the preview: ${countOf(plan.problems.length, 'row problem')}, the first on row ${first.row} (${first.column}): ${first.message}. Nothing was imported; upload the file again.`,
        plan.problems,
      );
    }
    const now = nowIso();
    await writePriceList(repos, supplier.id, currency, plan, now);
    await repos.imports.update(head.id, {
      status: 'committed',
      processedRows: stored.rows.length,
      totalRows: stored.rows.length,
      summary: plan.summary,
      rows: null,
      committedAt: now,
      updatedAt: now,
    });
  }

  async function commit(head: ImportHead, actor: User, release: () => Promise<void>) {
    const { id, fileName } = head;
    const progress = { processed: 0 };
    running.set(id, progress);
    try {
      const text = await imports.findRows(id);
      if (!text)
        throw new CommitFailure(
          'The checked rows of this import are missing; upload the file again.',
        );
      if (head.kind === 'price-list') {
        const rows = JSON.parse(text) as StoredRows<PriceListRowValues>;
        await store.transaction((repos) => commitPriceList(repos, head, rows));
        return null;
      }
      const stored = JSON.parse(text) as StoredRows;
      await store.transaction(async (repos) => {
        // Plan again against the stock as it is now, inside the transaction; a label code
        // taken since the preview is left to the unique index (the insert fails, all rolls back).
        const plan = await planImport(stored.rows, planSource(repos, false), {
          today: todayIso(),
          header: null,
          blankRows: stored.blankRows,
        });
        if (plan.problems.length > 0) {
          const first = plan.problems[0]!;
          throw new CommitFailure(
            `The stock changed since the preview: ${countOf(plan.problems.length, 'row problem')}, the first on row ${first.row} (${first.column}): ${first.message}. Nothing was imported; upload the file again.`,
            plan.problems,
          );
        }
        await write(repos, id, fileName, plan, actor, progress);
        const now = nowIso();
        await repos.imports.update(id, {
          status: 'committed',
          processedRows: plan.containers.length,
          totalRows: plan.containers.length,
          summary: { ...plan.summary, rows: stored.rows.length },
          rows: null,
          committedAt: now,
          updatedAt: now,
        });
      });
      return null;
    } catch (error) {
      const known = error instanceof CommitFailure;
      if (!known) logger.error('Import commit failed', { importId: id, error: String(error) });
      const failure = known
        ? error.message
        : 'The import could not be written because of an error on the server; nothing was imported.';
      const problems = known ? error.problems : [];
      await imports.update(id, {
        status: 'failed',
        failure,
        ...(problems.length
          ? { errors: problems.slice(0, maxStoredProblems), errorCount: problems.length }
          : {}),
        rows: null,
        updatedAt: nowIso(),
      });
      return failure;
    } finally {
      running.delete(id);
      await release();
    }
  }

  return {
    async list(query: ImportListQuery): Promise<Page<ImportListItem>> {
      const { items, total } = await imports.list(query);
      const settled = await Promise.all(items.map((head) => settleInterrupted(head)));
      return {
        items: settled.map((head) => {
          const {
            errors: _e,
            errorsPage: _p,
            errorsPageSize: _s,
            warnings: _w,
            ...item
          } = present(head, firstPage);
          return item;
        }),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    async get(id: number, query: ImportQuery): Promise<Import> {
      return present(await load(id), query);
    },

    /**
     * Reads an uploaded CSV and checks every row; nothing but the `imports` row is written.
     * Answers `done: false` when the file is large and the check goes on in the background.
     */
    async create(
      file: { fileName: string; bytes?: Uint8Array; text?: string },
      actor: User,
      options: ImportCreateQuery = { kind: 'stock' },
    ): Promise<{ result: Import; done: boolean }> {
      const priceList = options.kind === 'price-list';
      let supplier: { id: number; name: string } | null = null;
      if (priceList) {
        if (!can(actor.role, 'orders.manage')) {
          throw AppError.forbidden('Your role does not allow changing suppliers’ price lists.');
        }
        const found = await store.repos.suppliers.findSupplier(options.supplierId ?? 0);
        if (!found) {
          throw AppError.validation(`There is no supplier #${options.supplierId}.`, {
            supplierId: `no supplier #${options.supplierId}`,
          });
        }
        supplier = { id: found.id, name: found.name };
      }
      const rowWord = priceList ? 'pack' : 'container';
      const now = nowIso();
      const base = {
        kind: options.kind,
        supplierId: supplier?.id ?? null,
        fileName: file.fileName,
        userId: actor.id,
        processedRows: 0,
        errors: [] as ImportProblem[],
        warnings: [] as string[],
        summary: null,
        rows: null,
        failure: null,
        createdAt: now,
        updatedAt: now,
        committedAt: null,
      };
      const refuse = async (message: string, totalRows = 0, warnings: string[] = []) => {
        const problems = [{ row: null, column: null, field: null, value: null, message }];
        const importId = await imports.insert({
          ...base,
          status: 'invalid',
          totalRows,
          errorCount: 1,
          errors: problems,
          warnings,
        });
        return { result: present((await imports.findHead(importId))!, firstPage), done: true };
      };

      const text = file.text ?? decodeText(file.bytes ?? new Uint8Array());
      let parsed;
      try {
        parsed = parseCsv(text);
      } catch (error) {
        if (!(error instanceof CsvSyntaxError)) throw error;
        return refuse(
          `The file is not readable as CSV${error.line ? ` (near line ${error.line})` : ''}: ${error.message}. Save it from the spreadsheet as "CSV (comma delimited)" and upload it again.`,
        );
      }
      const [headerRecord, ...records] = parsed.records;
      while (records.length && isBlankRecord(records[records.length - 1]!)) records.pop();
      if (!headerRecord || isBlankRecord(headerRecord)) {
        return refuse(
          `The file is empty: the first row must name the columns, one row per ${rowWord} below it.`,
        );
      }
      const header = priceList ? mapPriceListHeader(headerRecord) : mapHeader(headerRecord);
      if (header.problems.length) {
        const problems = header.problems;
        const importId = await imports.insert({
          ...base,
          status: 'invalid',
          totalRows: records.length,
          errorCount: problems.length,
          errors: problems,
          warnings: header.warnings,
        });
        return { result: present((await imports.findHead(importId))!, firstPage), done: true };
      }
      if (records.length === 0) {
        return refuse(
          `The file has a header row but no rows of ${priceList ? 'prices' : 'stock'} below it.`,
          0,
          header.warnings,
        );
      }
      if (records.length > importRowLimit) {
        return refuse(
          `The file has ${records.length} rows; at most ${importRowLimit} are imported at once. Split it into several files.`,
          records.length,
          header.warnings,
        );
      }
      const importId = await imports.insert({
        ...base,
        status: 'validating',
        totalRows: records.length,
        errorCount: 0,
        warnings: header.warnings,
      });
      const decimalComma = parsed.delimiter !== ',';
      const job = supplier
        ? validate(
            importId,
            records,
            priceListReader(header as PriceListHeader, decimalComma, supplier),
          )
        : validate(importId, records, stockReader(header as HeaderMap, decimalComma));
      const done = records.length <= importWaitRowLimit;
      if (done) await job;
      else
        job.catch((error) =>
          logger.error('Import validation stopped', { importId, error: String(error) }),
        );
      return { result: present((await imports.findHead(importId))!, firstPage), done };
    },

    /**
     * Writes every row of a ready import in one transaction (all or nothing). Small imports
     * answer when written (a failure is a 409 naming the row); large ones answer at once.
     */
    async commit(id: number, actor: User): Promise<{ result: Import; done: boolean }> {
      // Held from before the status check to the end of the commit: another app instance
      // neither commits it twice nor takes it for interrupted meanwhile.
      const release = await store.holdJob(importJob(id));
      if (!release) {
        const current = await imports.findHead(id);
        if (!current) throw AppError.notFound(`There is no import #${id}.`);
        throw statusConflict({ ...current, status: 'committing' }, text);
      }
      const head = await store
        .transaction(async (repos) => {
          const current = await repos.imports.findHead(id);
          if (!current) throw AppError.notFound(`There is no import #${id}.`);
          const settled = await settleInterrupted(current, true);
          if (settled.kind === 'price-list' && !can(actor.role, 'orders.manage')) {
            throw AppError.forbidden('Your role does not allow changing suppliers’ price lists.');
          }
          if (settled.status !== 'ready' || running.has(id)) throw statusConflict(settled, text);
          await repos.imports.update(id, {
            status: 'committing',
            processedRows: 0,
            updatedAt: nowIso(),
          });
          return settled;
        })
        .catch(async (error: unknown) => {
          await release();
          throw error;
        });
      const job = commit(head, actor, release);
      const done = head.totalRows <= importWaitRowLimit;
      if (done) {
        const failure = await job;
        if (failure) throw AppError.conflict(failure);
      } else {
        job.catch((error) =>
          logger.error('Import commit stopped', { importId: id, error: String(error) }),
        );
      }
      return { result: present((await imports.findHead(id))!, firstPage), done };
    },
  };
}
export type ImportsService = ReturnType<typeof importsService>;
