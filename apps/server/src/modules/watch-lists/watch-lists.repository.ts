import { In, type EntityManager } from 'typeorm';
import { fromMicro } from '../../db/quantities';
import { isUniqueViolation } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import {
  OrderWatchApprovalEntity,
  WatchListEntity,
  WatchListEntryEntity,
  type OrderWatchApprovalRow,
  type WatchListEntryRow,
  type WatchListRow,
} from './watch-list.entity';

export type WatchListValues = Omit<WatchListRow, 'id'>;
export type WatchListEntryValues = Omit<WatchListEntryRow, 'id' | 'listId' | 'list'>;

/** A chosen list's row, with its list's names: what a chemical is matched against. */
export interface ChosenEntry extends WatchListEntryRow {
  listName: string;
  jurisdiction: string;
  listSource: string;
}

/** A container of a chemical, with its place: what holdings and the report read. */
export interface HeldContainer {
  containerId: number;
  labelCode: string;
  chemicalId: number;
  locationId: number;
  locationPath: string;
  quantity: number;
  unit: string;
}

export interface MovementRow {
  entryId: number;
  at: string;
  userName: string;
  reason: string;
  containerId: number;
  labelCode: string;
  chemicalId: number;
  quantity: number;
  unit: string;
  note: string;
}

function duplicateName(): AppError {
  return AppError.conflict('Another watch list already has this name.', {
    name: 'is already used by another list',
  });
}

/** Data access for `watch_lists`, `watch_list_entries` and `order_watch_approvals`. */
export function watchListsRepository(manager: EntityManager) {
  const lists = manager.getRepository(WatchListEntity);
  const entries = manager.getRepository(WatchListEntryEntity);
  const approvals = manager.getRepository(OrderWatchApprovalEntity);

  return {
    async listAll(): Promise<(WatchListRow & { entryCount: number })[]> {
      const rows = await lists
        .createQueryBuilder('w')
        .orderBy('w.builtIn', 'DESC')
        .addOrderBy('w.jurisdiction', 'ASC')
        // Presets in the order they were entered (Annex I before Annex II).
        .addOrderBy('w.id', 'ASC')
        .getMany();
      const counts: { id: number; n: number }[] = await entries
        .createQueryBuilder('e')
        .select('e.listId', 'id')
        .addSelect('COUNT(*)', 'n')
        .groupBy('e.listId')
        .getRawMany();
      const byList = new Map(counts.map((c) => [Number(c.id), Number(c.n)]));
      return rows.map((row) => ({ ...row, entryCount: byList.get(row.id) ?? 0 }));
    },
    findList(id: number): Promise<WatchListRow | null> {
      return lists.findOneBy({ id });
    },
    entriesOf(listId: number): Promise<WatchListEntryRow[]> {
      return entries.find({ where: { listId }, order: { substance: 'ASC', id: 'ASC' } });
    },
    async insertList(values: WatchListValues): Promise<number> {
      try {
        const result = await lists.insert(values);
        return Number(result.identifiers[0]?.id);
      } catch (error) {
        if (isUniqueViolation(error)) throw duplicateName();
        throw error;
      }
    },
    async updateList(id: number, changes: Partial<WatchListValues>): Promise<void> {
      try {
        await lists.update({ id }, changes);
      } catch (error) {
        if (isUniqueViolation(error)) throw duplicateName();
        throw error;
      }
    },
    /** Marks the built-in lists of `presetKeys` chosen (the demo lab's choice). */
    async choosePresets(presetKeys: string[]): Promise<void> {
      if (presetKeys.length === 0) return;
      await lists.update({ presetKey: In(presetKeys) }, { chosen: true });
    },
    async deleteList(id: number): Promise<void> {
      await entries.delete({ listId: id });
      await lists.delete({ id });
    },
    async replaceEntries(listId: number, values: WatchListEntryValues[]): Promise<void> {
      await entries.delete({ listId });
      if (values.length > 0) await entries.insert(values.map((v) => ({ ...v, listId })));
    },
    /** Rows of chosen lists naming any of `casNumbers`, in one statement. */
    async chosenEntriesFor(casNumbers: string[]): Promise<ChosenEntry[]> {
      const wanted = [...new Set(casNumbers)];
      if (wanted.length === 0) return [];
      const raw: Record<string, unknown>[] = await entries
        .createQueryBuilder('e')
        .innerJoin('watch_lists', 'w', 'w.id = e.list_id')
        .select('e.id', 'id')
        .addSelect('e.listId', 'listId')
        .addSelect('e.substance', 'substance')
        .addSelect('e.casNumber', 'casNumber')
        .addSelect('e.thresholdPercent', 'thresholdPercent')
        .addSelect('e.thresholdBasis', 'thresholdBasis')
        .addSelect('e.comparison', 'comparison')
        .addSelect('e.action', 'action')
        .addSelect('e.source', 'source')
        .addSelect('w.name', 'listName')
        .addSelect('w.jurisdiction', 'jurisdiction')
        .addSelect('w.source', 'listSource')
        .where('w.chosen = :yes', { yes: true })
        .andWhere('e.casNumber IN (:...wanted)', { wanted })
        .orderBy('w.name', 'ASC')
        .addOrderBy('e.id', 'ASC')
        .getRawMany();
      return raw.map((r) => ({
        id: Number(r.id),
        listId: Number(r.listId),
        substance: String(r.substance),
        casNumber: String(r.casNumber),
        thresholdPercent: r.thresholdPercent === null ? null : Number(r.thresholdPercent),
        thresholdBasis: String(r.thresholdBasis),
        comparison: r.comparison as ChosenEntry['comparison'],
        action: String(r.action),
        source: String(r.source),
        listName: String(r.listName),
        jurisdiction: String(r.jurisdiction),
        listSource: String(r.listSource),
      }));
    },
    /** CAS RNs on any chosen list (a small set: what the report and holdings start from). */
    async chosenCasNumbers(): Promise<string[]> {
      const raw: { cas: string }[] = await entries
        .createQueryBuilder('e')
        .innerJoin('watch_lists', 'w', 'w.id = e.list_id')
        .select('DISTINCT e.casNumber', 'cas')
        .where('w.chosen = :yes', { yes: true })
        .getRawMany();
      return raw.map((r) => String(r.cas));
    },
    /** Containers holding stock of `chemicalIds`, optionally only in `locationIds`. */
    async heldContainers(chemicalIds: number[], locationIds?: number[]): Promise<HeldContainer[]> {
      if (chemicalIds.length === 0 || (locationIds && locationIds.length === 0)) return [];
      const qb = manager
        .createQueryBuilder()
        .from('containers', 'c')
        .innerJoin('locations', 'l', 'l.id = c.location_id')
        .select('c.id', 'containerId')
        .addSelect('c.label_code', 'labelCode')
        .addSelect('c.chemical_id', 'chemicalId')
        .addSelect('c.location_id', 'locationId')
        .addSelect('l.path', 'locationPath')
        .addSelect('c.quantity_micro', 'quantity')
        .addSelect('c.unit', 'unit')
        .where('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere("c.status NOT IN ('empty', 'disposed')")
        .andWhere('c.quantity_micro > 0');
      if (locationIds) qb.andWhere('c.location_id IN (:...locationIds)', { locationIds });
      const raw: Record<string, unknown>[] = await qb
        .orderBy('l.path', 'ASC')
        .addOrderBy('c.label_code', 'ASC')
        .getRawMany();
      return raw.map((r) => ({
        containerId: Number(r.containerId),
        labelCode: String(r.labelCode),
        chemicalId: Number(r.chemicalId),
        locationId: Number(r.locationId),
        locationPath: String(r.locationPath),
        quantity: fromMicro(r.quantity),
        unit: String(r.unit),
      }));
    },
    /** Ledger entries of `chemicalIds` written in [fromIso, toIso). */
    async movements(chemicalIds: number[], fromIso: string, toIso: string): Promise<MovementRow[]> {
      if (chemicalIds.length === 0) return [];
      const raw: Record<string, unknown>[] = await manager
        .createQueryBuilder()
        .from('ledger_entries', 'e')
        .innerJoin('containers', 'c', 'c.id = e.container_id')
        .leftJoin('users', 'u', 'u.id = e.user_id')
        .select('e.id', 'entryId')
        .addSelect('e.created_at', 'at')
        .addSelect('u.display_name', 'userName')
        .addSelect('e.reason', 'reason')
        .addSelect('c.id', 'containerId')
        .addSelect('c.label_code', 'labelCode')
        .addSelect('c.chemical_id', 'chemicalId')
        .addSelect('e.quantity_micro', 'quantity')
        .addSelect('e.unit', 'unit')
        .addSelect('e.note', 'note')
        .where('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere('e.created_at >= :fromIso AND e.created_at < :toIso', { fromIso, toIso })
        .orderBy('e.created_at', 'ASC')
        .addOrderBy('e.id', 'ASC')
        .getRawMany();
      return raw.map((r) => ({
        entryId: Number(r.entryId),
        at: String(r.at),
        userName: r.userName === null || r.userName === undefined ? '' : String(r.userName),
        reason: String(r.reason),
        containerId: Number(r.containerId),
        labelCode: String(r.labelCode),
        chemicalId: Number(r.chemicalId),
        quantity: fromMicro(r.quantity),
        unit: String(r.unit),
        note: String(r.note ?? ''),
      }));
    },
    approvalOf(orderId: number): Promise<OrderWatchApprovalRow | null> {
      return approvals.findOneBy({ orderId });
    },
    async saveApproval(
      values: Omit<OrderWatchApprovalRow, 'id' | 'order' | 'approvedBy'>,
    ): Promise<void> {
      await approvals.delete({ orderId: values.orderId });
      await approvals.insert(values);
    },
    async clearApproval(orderId: number): Promise<boolean> {
      const result = await approvals.delete({ orderId });
      return (result.affected ?? 0) > 0;
    },
    async userNames(ids: number[]): Promise<Map<number, string>> {
      if (ids.length === 0) return new Map();
      const raw: { id: number; name: string }[] = await manager
        .createQueryBuilder()
        .from('users', 'u')
        .select('u.id', 'id')
        .addSelect('u.display_name', 'name')
        .where('u.id IN (:...ids)', { ids: [...new Set(ids)] })
        .getRawMany();
      return new Map(raw.map((r) => [Number(r.id), String(r.name)]));
    },
    /** Chemicals (id, name, CAS RN, default purity, restricted) of `ids` or of `casNumbers`. */
    async chemicalsFor(where: { ids?: number[]; casNumbers?: string[] }) {
      const qb = manager
        .createQueryBuilder()
        .from('chemicals', 'ch')
        .select('ch.id', 'id')
        .addSelect('ch.name', 'name')
        .addSelect('ch.cas_number', 'casNumber')
        .addSelect('ch.default_purity_percent', 'defaultPurityPercent')
        .addSelect('ch.restricted', 'restricted')
        .addSelect('ch.stock_unit', 'stockUnit');
      if (where.ids) {
        if (where.ids.length === 0) return [];
        qb.where('ch.id IN (:...ids)', { ids: [...new Set(where.ids)] });
      } else {
        if (!where.casNumbers || where.casNumbers.length === 0) return [];
        qb.where('ch.cas_number IN (:...cas)', { cas: [...new Set(where.casNumbers)] });
      }
      const raw: Record<string, unknown>[] = await qb.orderBy('ch.name', 'ASC').getRawMany();
      return raw.map((r) => ({
        id: Number(r.id),
        name: String(r.name),
        casNumber: r.casNumber === null ? null : String(r.casNumber),
        defaultPurityPercent: Number(r.defaultPurityPercent),
        restricted: r.restricted === true || Number(r.restricted) === 1,
        stockUnit: String(r.stockUnit),
      }));
    },
  };
}
export type WatchListsRepository = ReturnType<typeof watchListsRepository>;
