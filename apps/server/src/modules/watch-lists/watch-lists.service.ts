import {
  todayIso,
  watchListReminder,
  type User,
  type WatchList,
  type WatchListCreateParsed,
  type WatchListDetail,
  type WatchListPatch,
  type WatchReport,
  type WatchReportQuery,
} from '@lotwise/shared';
import type { Response } from 'express';
import type { Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { csvLine, csvLines, utf8Bom } from '../../lib/csv';
import type { WatchListRow } from './watch-list.entity';
import { listNames, watchedChemicals, watchedHoldingsIn } from './watch-matching';

type EntryInput = WatchListCreateParsed['entries'][number];

function notFound(id: number) {
  return AppError.notFound(`There is no watch list #${id}.`);
}

function present(row: WatchListRow, entryCount: number): WatchList {
  const { presetKey: _key, createdAt: _c, updatedAt: _u, ...list } = row;
  return { ...list, entryCount };
}

/** The day after an ISO date (the report's `to` is inclusive). */
function dayAfter(date: string): string {
  const next = new Date(`${date}T00:00:00.000Z`);
  next.setUTCDate(next.getUTCDate() + 1);
  return next.toISOString();
}

export const holdingsCsvHeader = [
  'Container',
  'Chemical',
  'CAS RN',
  'Lists',
  'Location',
  'Quantity',
  'Unit',
];
export const movementsCsvHeader = [
  'When (UTC)',
  'Who',
  'What',
  'Container',
  'Chemical',
  'Lists',
  'Amount',
  'Unit',
  'Why',
];

export function watchListsService(store: Store) {
  async function detail(id: number): Promise<WatchListDetail> {
    const row = await store.repos.watchLists.findList(id);
    if (!row) throw notFound(id);
    const entries = await store.repos.watchLists.entriesOf(id);
    return {
      ...present(row, entries.length),
      entries: entries.map(({ list: _l, ...entry }) => entry),
    };
  }

  async function audit(
    actor: User,
    action: string,
    listId: number,
    detailOf: Record<string, unknown>,
  ) {
    await store.repos.audit.insert({
      actorId: actor.id,
      action,
      targetType: 'watch_list',
      targetId: listId,
      detail: detailOf,
      createdAt: nowIso(),
    });
  }

  return {
    async list(): Promise<WatchList[]> {
      const rows = await store.repos.watchLists.listAll();
      return rows.map((row) => present(row, row.entryCount));
    },

    get: detail,

    async create(body: WatchListCreateParsed, actor: User): Promise<WatchListDetail> {
      const id = await store.transaction(async (repos) => {
        const now = nowIso();
        const { entries, ...list } = body;
        const listId = await repos.watchLists.insertList({
          ...list,
          presetKey: null,
          builtIn: false,
          createdAt: now,
          updatedAt: now,
        });
        await repos.watchLists.replaceEntries(listId, entries);
        return listId;
      });
      await audit(actor, 'watch_list.created', id, { name: body.name, chosen: body.chosen });
      return detail(id);
    },

    async update(id: number, patch: WatchListPatch, actor: User): Promise<WatchListDetail> {
      await store.transaction(async (repos) => {
        const row = await repos.watchLists.findList(id);
        if (!row) throw notFound(id);
        const { entries, ...fields } = patch;
        const others = Object.keys(fields).filter((key) => key !== 'chosen');
        if (row.builtIn && (others.length > 0 || entries !== undefined)) {
          throw AppError.conflict(
            `${row.name} is built in: only whether the lab follows it can change. Make a list of your own to change its rows.`,
            Object.fromEntries(
              [...others, ...(entries ? ['entries'] : [])].map((key) => [
                key,
                'built-in lists are read-only',
              ]),
            ),
          );
        }
        await repos.watchLists.updateList(id, { ...fields, updatedAt: nowIso() });
        if (entries) await repos.watchLists.replaceEntries(id, entries as EntryInput[]);
      });
      await audit(actor, 'watch_list.changed', id, {
        ...patch,
        entries: patch.entries ? patch.entries.length : undefined,
      });
      return detail(id);
    },

    async remove(id: number, actor: User): Promise<void> {
      await store.transaction(async (repos) => {
        const row = await repos.watchLists.findList(id);
        if (!row) throw notFound(id);
        if (row.builtIn) {
          throw AppError.conflict(
            `${row.name} is built in and cannot be deleted; untick it instead.`,
          );
        }
        await repos.watchLists.deleteList(id);
      });
      await audit(actor, 'watch_list.deleted', id, {});
    },

    /** Holdings now and the ledger of watched chemicals from `from` to `to` (whole days, UTC). */
    async report(query: WatchReportQuery): Promise<WatchReport> {
      const watched = await watchedChemicals(store.repos);
      const byId = new Map(watched.map((c) => [c.id, c]));
      const holdings = await watchedHoldingsIn(store.repos);
      const rows = await store.repos.watchLists.movements(
        watched.map((c) => c.id),
        `${query.from}T00:00:00.000Z`,
        dayAfter(query.to),
      );
      return {
        from: query.from,
        to: query.to,
        generatedAt: nowIso(),
        holdings,
        movements: rows.map(({ chemicalId, quantity, ...row }) => ({
          ...row,
          delta: quantity,
          chemicalName: byId.get(chemicalId)?.name ?? '',
          lists: listNames(byId.get(chemicalId)?.listings ?? []),
        })),
        reminder: watchListReminder,
      };
    },

    /** The report as one CSV: the holdings table, a blank line, the movements table. */
    async reportCsv(query: WatchReportQuery, res: Response): Promise<void> {
      const report = await this.report(query);
      res.status(200);
      res.attachment(`lotwise-watched-chemicals-${query.from}-to-${query.to}.csv`);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Cache-Control', 'private, no-store');
      res.send(
        utf8Bom +
          csvLine([`Watched chemicals held on ${todayIso()}`]) +
          csvLine(holdingsCsvHeader) +
          csvLines(
            report.holdings.map((h) => [
              h.labelCode,
              h.chemicalName,
              h.casNumber,
              h.lists,
              h.locationPath,
              h.quantity,
              h.unit,
            ]),
          ) +
          '\r\n' +
          csvLine([`Movements from ${query.from} to ${query.to}`]) +
          csvLine(movementsCsvHeader) +
          csvLines(
            report.movements.map((m) => [
              m.at,
              m.userName,
              m.reason,
              m.labelCode,
              m.chemicalName,
              m.lists,
              m.delta,
              m.unit,
              m.note,
            ]),
          ) +
          '\r\n' +
          csvLine([watchListReminder]),
      );
    },
  };
}
export type WatchListsService = ReturnType<typeof watchListsService>;
