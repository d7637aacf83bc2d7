import { addDays, reorderState } from '@lotwise/chem';
import {
  normalizeLabelCode,
  todayIso,
  type GhsCode,
  type Page,
  type SearchResult,
  type StockHistory,
  type StockItem,
  type StockListQuery,
  type Stocktake,
  type StocktakeExpected,
  type StocktakeListQuery,
  type User,
  type stocktakeCreateSchema,
  formatQuantity,
} from '@lotwise/shared';
import type { z } from 'zod';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import {
  recordAdjustment,
  recordDisposal,
  roundQuantity,
  toStockUnit,
} from '../containers/containers.service';
import { requireLocation } from '../locations/locations.service';
import type { StocktakeRow, StocktakeSummary } from './stocktake.entity';

type StocktakeCreateParsed = z.output<typeof stocktakeCreateSchema>;

export function stockService(store: Store) {
  const { stock } = store.repos;

  async function presentStocktake(repos: Repositories, row: StocktakeRow): Promise<Stocktake> {
    const location = await repos.locations.findRow(row.locationId);
    const [user] = row.userId ? await repos.users.findByIds([row.userId]) : [];
    return {
      id: row.id,
      location: { id: row.locationId, name: location?.name ?? '', path: location?.path ?? '' },
      includeSublocations: row.includeSublocations,
      user: user ? { id: user.id, displayName: user.displayName } : null,
      note: row.note,
      summary: row.summary,
      createdAt: row.createdAt,
    };
  }

  return {
    async overview(query: StockListQuery): Promise<Page<StockItem>> {
      const today = todayIso();
      let locationIdPath: string | undefined;
      if (query.locationId) {
        const location = await store.repos.locations.findRow(query.locationId);
        if (!location) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
        locationIdPath = location.idPath;
      }
      const { rows, total } = await stock.overview(query, {
        today,
        locationIdPath,
        expiringBefore:
          query.expiringWithinDays === undefined
            ? undefined
            : addDays(today, query.expiringWithinDays),
      });
      const items = rows.map((row): StockItem => ({
        chemical: {
          id: row.id,
          name: row.name,
          formula: row.formula,
          casNumber: row.casNumber,
          storageGroup: row.storageGroup,
          ghsPictograms: JSON.parse(row.ghsPictograms) as GhsCode[],
          hazardStatements: JSON.parse(row.hazardStatements) as string[],
        },
        total: roundQuantity(row.total),
        unit: row.stockUnit,
        display: {
          value: roundQuantity(row.total),
          unit: row.stockUnit,
          text: formatQuantity(row.total, row.stockUnit),
        },
        usableContainerCount: row.usableContainerCount,
        containerCount: row.containerCount,
        expiredContainerCount: row.expiredContainerCount,
        nextExpiresOn: row.nextExpiresOn,
        reorderPoint: row.reorderPoint,
        reorderQuantity: row.reorderQuantity,
        reorderStatus: reorderState(row.total, row.reorderPoint),
      }));
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async history(chemicalId: number, days: number): Promise<StockHistory> {
      const chemical = await store.repos.chemicals.findById(chemicalId);
      if (!chemical) throw AppError.notFound(`There is no chemical #${chemicalId}.`);
      const since = addDays(todayIso(), -days);
      const { before, days: changes } = await stock.history(chemicalId, `${since}T00:00:00.000Z`);
      let running = before;
      const points = [{ date: since, total: roundQuantity(before) }];
      for (const day of changes) {
        running += day.change;
        points.push({ date: day.date, total: roundQuantity(running) });
      }
      return { chemicalId, unit: chemical.stockUnit, points };
    },

    async search(q: string, limit: number): Promise<SearchResult> {
      const exact = normalizeLabelCode(q);
      const labelPrefix = q.trim().toUpperCase();
      const containers = await store.repos.containers.searchLabels(exact, labelPrefix, limit);
      const chemicals = await stock.searchChemicals(q, limit);
      const needle = q.toLowerCase();
      return {
        containers: containers.map((c) => ({ ...c, exact: c.labelCode === exact })),
        chemicals: chemicals.map((c) => {
          const synonyms = JSON.parse(c.synonyms) as string[];
          return {
            id: c.id,
            name: c.name,
            casNumber: c.casNumber,
            formula: c.formula,
            matchedSynonym: c.name.toLowerCase().includes(needle)
              ? null
              : (synonyms.find((s) => s.toLowerCase().includes(needle)) ?? null),
          };
        }),
      };
    },

    async expected(locationId: number, includeSublocations: boolean): Promise<StocktakeExpected> {
      const location = await store.repos.locations.findRow(locationId);
      if (!location) throw AppError.notFound(`There is no location #${locationId}.`);
      const views = await store.repos.containers.viewsAt(location.idPath, [
        'sealed',
        'open',
        'empty',
      ]);
      return {
        location: { id: location.id, name: location.name, path: location.path },
        includeSublocations,
        containers: views
          .filter((v) => includeSublocations || v.locationId === location.id)
          .map((v) => ({
            id: v.id,
            labelCode: v.labelCode,
            chemicalName: v.chemicalName,
            quantity: Number(v.quantity),
            unit: v.unit,
            status: v.status,
            tareMass: v.tareMass,
            locationPath: v.locationPath,
          })),
      };
    },

    /** Writes every count of a stocktake, or nothing. */
    async recordStocktake(input: StocktakeCreateParsed, actor: User): Promise<Stocktake> {
      return store.transaction(async (repos) => {
        const location = await requireLocation(repos, input.locationId);
        const views = await repos.containers.viewsAt(location.idPath, ['sealed', 'open', 'empty']);
        const expected = views.filter(
          (v) => input.includeSublocations || v.locationId === location.id,
        );
        const expectedIds = new Set(expected.map((v) => v.id));
        const fields: Record<string, string> = {};
        input.counts.forEach((count, index) => {
          if (!expectedIds.has(count.containerId)) {
            fields[`counts.${index}.containerId`] =
              `container #${count.containerId} is not expected at ${location.path}`;
          }
        });
        if (Object.keys(fields).length > 0) {
          throw AppError.validation(
            'Some counted containers are not expected at this place.',
            fields,
          );
        }
        const now = nowIso();
        const summary: StocktakeSummary = {
          expected: expected.length,
          confirmed: 0,
          corrected: 0,
          missing: 0,
          notCounted: expected.length - input.counts.length,
        };
        const id = await repos.stock.insertStocktake({
          locationId: location.id,
          includeSublocations: input.includeSublocations,
          userId: actor.id,
          note: input.note,
          summary,
          createdAt: now,
        });
        for (const [index, count] of input.counts.entries()) {
          const container = (await repos.containers.findRow(count.containerId))!;
          const chemical = (await repos.chemicals.findRow(container.chemicalId))!;
          if (count.outcome === 'missing') {
            await recordDisposal(repos, container, `Missing at stocktake #${id}`, actor, id);
            summary.missing++;
          } else if (count.outcome === 'counted') {
            const counted = toStockUnit(
              count.countedQuantity!,
              count.unit!,
              chemical,
              `counts.${index}.countedQuantity`,
            );
            const delta = roundQuantity(counted - container.quantity);
            if (delta === 0) summary.confirmed++;
            else {
              await recordAdjustment(
                repos,
                container,
                delta,
                `Counted at stocktake #${id}`,
                actor,
                id,
              );
              summary.corrected++;
            }
          } else {
            summary.confirmed++;
          }
        }
        await repos.stock.updateStocktake(id, { summary });
        return presentStocktake(repos, (await repos.stock.findStocktake(id))!);
      });
    },

    async getStocktake(id: number): Promise<Stocktake> {
      const row = await stock.findStocktake(id);
      if (!row) throw AppError.notFound(`There is no stocktake #${id}.`);
      return presentStocktake(store.repos, row);
    },

    async listStocktakes(query: StocktakeListQuery): Promise<Page<Stocktake>> {
      const { rows, total } = await stock.listStocktakes(
        query.locationId,
        query.page,
        query.pageSize,
        query.sort.endsWith('.asc') ? 'ASC' : 'DESC',
      );
      const items = [];
      for (const row of rows) items.push(await presentStocktake(store.repos, row));
      return { items, total, page: query.page, pageSize: query.pageSize };
    },
  };
}
export type StockService = ReturnType<typeof stockService>;
