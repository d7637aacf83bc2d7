import { countOf } from '@lotwise/shared';
import type { Lot, LotCreateParsed, LotListQuery, LotPatch, Page } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { peroxideDueOf } from '../containers/peroxide-dates';
import type { LotRow } from './lot.entity';

function notFound(id: number) {
  return AppError.notFound(`There is no lot #${id}.`);
}

/** The lot a write names in its body: 400 naming the field when it does not exist. */
export async function requireLot(
  repos: Repositories,
  id: number,
  field = 'lotId',
): Promise<LotRow> {
  const row = await repos.lots.findRow(id);
  if (!row) throw AppError.validation(`There is no lot #${id}.`, { [field]: `no lot #${id}` });
  return row;
}

/** Where a deleted lot's certificate file goes (the app's file store). */
interface StoredFiles {
  remove(storedName: string | null): Promise<void>;
}

export function lotsService(store: Store, files?: StoredFiles) {
  return {
    async list(query: LotListQuery): Promise<Page<Lot>> {
      const { items, total } = await store.repos.lots.list(query);
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async get(id: number): Promise<Lot> {
      const lot = await store.repos.lots.findById(id);
      if (!lot) throw notFound(id);
      return lot;
    },

    async create(input: LotCreateParsed): Promise<Lot> {
      return store.transaction(async (repos) => {
        const chemical = await repos.chemicals.findById(input.chemicalId);
        if (!chemical) {
          throw AppError.validation(`There is no chemical #${input.chemicalId}.`, {
            chemicalId: `no chemical #${input.chemicalId}`,
          });
        }
        const now = nowIso();
        const id = await repos.lots.insert({
          ...input,
          madeByRunId: null,
          certificateFileName: null,
          certificateStoredName: null,
          createdAt: now,
          updatedAt: now,
        });
        return (await repos.lots.findById(id))!;
      });
    },

    async update(id: number, patch: LotPatch): Promise<Lot> {
      return store.transaction(async (repos) => {
        const current = await repos.lots.findRow(id);
        if (!current) throw notFound(id);
        const next = { ...current, ...patch };
        if (next.expiresOn && next.expiresOn < next.receivedOn) {
          throw AppError.validation('The expiry date is before the received date.', {
            expiresOn: 'cannot be before the received date',
          });
        }
        await repos.lots.update(id, { ...patch, updatedAt: nowIso() });
        if (patch.expiresOn !== undefined || patch.receivedOn !== undefined) {
          await repos.containers.setLotExpiry(id, next.expiresOn);
          const chemical = await repos.chemicals.findRow(current.chemicalId);
          for (const container of await repos.containers.rowsForLot(id)) {
            const due = peroxideDueOf(
              chemical?.peroxideClass ?? null,
              container.openedOn,
              next.receivedOn,
              next.expiresOn,
            );
            await repos.containers.update(container.id, { peroxideDueOn: due?.dueOn ?? null });
          }
        }
        return (await repos.lots.findById(id))!;
      });
    },

    async remove(id: number): Promise<void> {
      const certificate = await store.transaction(async (repos) => {
        const row = await repos.lots.findRow(id);
        if (!row) throw notFound(id);
        const held = await repos.containers.countForLot(id);
        if (held > 0) {
          throw AppError.conflict(
            `Lot #${id} has ${countOf(held, 'container')} with ledger history and cannot be deleted.`,
          );
        }
        await repos.lots.delete(id);
        return row.certificateStoredName;
      });
      await files?.remove(certificate);
    },
  };
}
export type LotsService = ReturnType<typeof lotsService>;
