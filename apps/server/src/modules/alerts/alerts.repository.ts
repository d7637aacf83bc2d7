import {
  parseSort,
  type ContainerStatus,
  type GhsCode,
  type OutboxListQuery,
  type Role,
  type StockUnit,
} from '@lotwise/shared';
import { In, type EntityManager, type SelectQueryBuilder } from 'typeorm';
import { advisoryLocks, onPostgres, takeTurn } from '../../db/postgres';
import { fromMicro } from '../../db/quantities';
import {
  atOrBelowReorderPointCondition,
  usableSql,
  usableTotalMicroSql,
} from '../containers/containers.repository';
import { AlertPreferenceEntity, type AlertPreferenceRow } from './alert-preference.entity';
import { OutboxMessageEntity, type OutboxRow } from './outbox-message.entity';

export type OutboxValues = Omit<OutboxRow, 'id' | 'user'>;

/** An outbox row with the recipient's name, for the admin list. */
export interface OutboxListRow extends OutboxRow {
  displayName: string | null;
}

/** A chemical at or below its reorder point, with its usable total. */
export interface LowStockFacts {
  id: number;
  name: string;
  stockUnit: StockUnit;
  reorderPoint: number;
  reorderQuantity: number | null;
  ghsPictograms: GhsCode[];
  hazardStatements: string[];
  total: number;
}

/** A container as the alert rules and messages see it. */
export interface AlertContainerFacts {
  id: number;
  labelCode: string;
  chemicalId: number;
  chemicalName: string;
  ghsPictograms: GhsCode[];
  hazardStatements: string[];
  status: ContainerStatus;
  quantity: number;
  unit: StockUnit;
  expiresOn: string | null;
  peroxideDueOn: string | null;
  locationPath: string;
}

/** Someone who may receive alerts. */
export interface AlertRecipientRow {
  id: number;
  email: string;
  displayName: string;
  role: Role;
}

const sortColumns: Record<string, string> = {
  createdAt: 'o.created_at',
  status: 'o.status',
  attempts: 'o.attempts',
  nextAttemptAt: 'o.next_attempt_at',
};

export function parseJsonList<T>(text: unknown): T[] {
  return typeof text === 'string' && text ? (JSON.parse(text) as T[]) : [];
}

/** Data access for `outbox`, `alert_preferences` and the stock reads of the alert rules. */
export function alertsRepository(manager: EntityManager) {
  const outbox = manager.getRepository(OutboxMessageEntity);
  const preferences = manager.getRepository(AlertPreferenceEntity);

  function containerQuery(): SelectQueryBuilder<object> {
    return manager
      .createQueryBuilder()
      .select('c.id', 'id')
      .addSelect('c.label_code', 'labelCode')
      .addSelect('c.chemical_id', 'chemicalId')
      .addSelect('ch.name', 'chemicalName')
      .addSelect('ch.ghs_pictograms', 'ghsPictograms')
      .addSelect('ch.hazard_statements', 'hazardStatements')
      .addSelect('c.status', 'status')
      .addSelect('c.quantity_micro', 'quantity')
      .addSelect('c.unit', 'unit')
      .addSelect('c.expires_on', 'expiresOn')
      .addSelect('c.peroxide_due_on', 'peroxideDueOn')
      .addSelect('loc.path', 'locationPath')
      .from('containers', 'c')
      .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
      .innerJoin('locations', 'loc', 'loc.id = c.location_id');
  }

  const toContainer = (raw: Record<string, unknown>): AlertContainerFacts =>
    ({
      ...raw,
      id: Number(raw.id),
      chemicalId: Number(raw.chemicalId),
      quantity: fromMicro(raw.quantity),
      ghsPictograms: parseJsonList<GhsCode>(raw.ghsPictograms),
      hazardStatements: parseJsonList<string>(raw.hazardStatements),
    }) as AlertContainerFacts;

  return {
    // ---- outbox ----
    /**
     * On PostgreSQL, waits until no other transaction is evaluating the alert rules and holds
     * the turn until this one ends, so two app instances never queue the same e-mail twice
     * (each checks `mailedSince` after the other committed). Nothing on SQLite.
     */
    async takeRulesTurn(): Promise<void> {
      await takeTurn(manager, advisoryLocks.alertRules);
    },
    async insertMessage(values: OutboxValues): Promise<number> {
      const result = await outbox.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async findMessage(id: number): Promise<OutboxListRow | null> {
      const row = await outbox.findOneBy({ id });
      if (!row) return null;
      const [user] = row.userId
        ? await manager.query('SELECT display_name AS name FROM users WHERE id = ?', [row.userId])
        : [];
      return { ...row, displayName: (user as { name?: string } | undefined)?.name ?? null };
    },
    async updateMessages(ids: number[], changes: Partial<OutboxValues>): Promise<void> {
      if (ids.length > 0) await outbox.update({ id: In(ids) }, changes);
    },
    /** True when `email` got a message with `dedupKey` written at or after `since`. */
    async mailedSince(email: string, dedupKey: string, since: string): Promise<boolean> {
      const row = await outbox
        .createQueryBuilder('o')
        .select('o.id')
        .where('o.recipientEmail = :email AND o.dedupKey = :dedupKey AND o.createdAt >= :since', {
          email,
          dedupKey,
          since,
        })
        .limit(1)
        .getRawOne();
      return Boolean(row);
    },
    /**
     * Claims up to `limit` messages that are due for the sender `claimId`, until
     * `leaseUntil`: queued and due, or `sending` under a lease that ran out (its sender
     * stopped). The UPDATE repeats the due condition, so a message another sender claimed in
     * the meantime is not taken twice (on PostgreSQL the rows are chosen `FOR UPDATE SKIP
     * LOCKED`, in the same statement). Answers the claimed rows, oldest first.
     */
    async claimDue(
      claimId: string,
      now: string,
      leaseUntil: string,
      limit: number,
    ): Promise<OutboxRow[]> {
      const due =
        "((status = 'queued' AND next_attempt_at <= :now) OR (status = 'sending' AND (lease_until IS NULL OR lease_until <= :now)))";
      if (onPostgres(manager.connection)) {
        // One statement: rows another sender is claiming right now are skipped, not waited for,
        // so senders on several app instances share the due messages.
        await outbox
          .createQueryBuilder()
          .update()
          .set({ status: 'sending', claimedBy: claimId, leaseUntil, updatedAt: now })
          .where(
            `id IN (SELECT o.id FROM outbox o WHERE ${due.replace(/\b(status|next_attempt_at|lease_until)\b/g, 'o.$1')} ORDER BY o.id LIMIT :limit FOR UPDATE SKIP LOCKED)`,
            { now, limit },
          )
          .execute();
      } else {
        const candidates: { id: number }[] = await outbox
          .createQueryBuilder('o')
          .select('o.id', 'id')
          .where(due.replace(/\b(status|next_attempt_at|lease_until)\b/g, 'o.$1'), { now })
          .orderBy('o.id', 'ASC')
          .limit(limit)
          .getRawMany();
        if (candidates.length === 0) return [];
        await outbox
          .createQueryBuilder()
          .update()
          .set({ status: 'sending', claimedBy: claimId, leaseUntil, updatedAt: now })
          .where('id IN (:...ids)', { ids: candidates.map((c) => Number(c.id)) })
          .andWhere(due, { now })
          .execute();
      }
      const rows = await outbox.find({
        where: { claimedBy: claimId, status: 'sending' },
        order: { id: 'ASC' },
      });
      return rows.map((row) => ({ ...row }));
    },
    /**
     * Extends the lease of messages `claimId` still holds; answers how many it holds (fewer
     * than `ids` when another sender took some over after the lease ran out).
     */
    async renewClaim(ids: number[], claimId: string, leaseUntil: string): Promise<number> {
      if (ids.length === 0) return 0;
      const result = await outbox
        .createQueryBuilder()
        .update()
        .set({ leaseUntil })
        .where("id IN (:...ids) AND claimed_by = :claimId AND status = 'sending'", {
          ids,
          claimId,
        })
        .execute();
      return result.affected ?? 0;
    },
    /**
     * Records the outcome of a send and lets go of the claim, only if `claimId` still holds
     * the message; answers false when it does not (the outcome is then not written).
     */
    async finishClaim(
      id: number,
      claimId: string,
      changes: Partial<OutboxValues>,
    ): Promise<boolean> {
      const result = await outbox
        .createQueryBuilder()
        .update()
        .set({ ...changes, claimedBy: null, leaseUntil: null })
        .where("id = :id AND claimed_by = :claimId AND status = 'sending'", { id, claimId })
        .execute();
      return (result.affected ?? 0) > 0;
    },
    async listMessages(query: OutboxListQuery): Promise<{ rows: OutboxListRow[]; total: number }> {
      const qb = manager
        .createQueryBuilder()
        .select('o.id', 'id')
        .addSelect('o.user_id', 'userId')
        .addSelect('o.recipient_email', 'recipientEmail')
        .addSelect('u.display_name', 'displayName')
        .addSelect('o.kind', 'kind')
        .addSelect('o.subject', 'subject')
        .addSelect('o.link', 'link')
        .addSelect('o.dedup_key', 'dedupKey')
        .addSelect('o.delivery', 'delivery')
        .addSelect('o.status', 'status')
        .addSelect('o.attempts', 'attempts')
        .addSelect('o.last_error', 'lastError')
        .addSelect('o.next_attempt_at', 'nextAttemptAt')
        .addSelect('o.created_at', 'createdAt')
        .addSelect('o.updated_at', 'updatedAt')
        .addSelect('o.sent_at', 'sentAt')
        .from('outbox', 'o')
        .leftJoin('users', 'u', 'u.id = o.user_id')
        .where('1 = 1');
      const count = manager.createQueryBuilder().select('COUNT(*)', 'n').from('outbox', 'o');
      count.where('1 = 1');
      const filters: [string, Record<string, unknown>][] = [];
      if (query.status) filters.push(['o.status = :status', { status: query.status }]);
      if (query.kind) filters.push(['o.kind = :kind', { kind: query.kind }]);
      if (query.q) {
        filters.push([
          "(LOWER(o.recipient_email) LIKE :q ESCAPE '\\' OR LOWER(o.subject) LIKE :q ESCAPE '\\')",
          { q: `%${query.q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%` },
        ]);
      }
      for (const [sql, parameters] of filters) {
        qb.andWhere(sql, parameters);
        count.andWhere(sql, parameters);
      }
      const total = Number((await count.getRawOne<{ n: number }>())?.n ?? 0);
      const { field, direction } = parseSort(query.sort);
      const column = sortColumns[field] ?? sortColumns.createdAt!;
      const rows = await qb
        // Empty values last in both directions; an index on the column serves NULLS LAST.
        .orderBy(column, direction === 'desc' ? 'DESC' : 'ASC', 'NULLS LAST')
        .addOrderBy('o.id', direction === 'desc' ? 'DESC' : 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<OutboxListRow>();
      return {
        rows: rows.map((row) => ({
          ...row,
          id: Number(row.id),
          userId: row.userId === null ? null : Number(row.userId),
          attempts: Number(row.attempts),
          text: '',
          html: '',
        })),
        total,
      };
    },

    // ---- preferences ----
    async findPreferences(userIds: number[]): Promise<AlertPreferenceRow[]> {
      if (userIds.length === 0) return [];
      return (await preferences.findBy({ userId: In(userIds) })).map((row) => ({ ...row }));
    },
    async savePreference(row: AlertPreferenceRow): Promise<void> {
      await preferences.save({ ...row });
    },

    // ---- what the rules read ----
    /** Active people with a password (invitations not yet taken up get no mail). */
    async recipients(): Promise<AlertRecipientRow[]> {
      const rows: Record<string, unknown>[] = await manager
        .createQueryBuilder()
        .select('u.id', 'id')
        .addSelect('u.email', 'email')
        .addSelect('u.display_name', 'displayName')
        .addSelect('u.role', 'role')
        .from('users', 'u')
        .where('u.active = :active AND u.password_hash IS NOT NULL', { active: true })
        .orderBy('u.id', 'ASC')
        .getRawMany();
      return rows.map((row) => ({ ...row, id: Number(row.id) }) as AlertRecipientRow);
    },
    /**
     * Per user, which of `chemicalIds` they have ledger entries for (draws, receipts,
     * corrections). Read through the containers of those chemicals and the ledger's index by
     * container and person (the entries themselves are not read), never by scanning the ledger.
     */
    async usedChemicals(
      userIds: number[],
      chemicalIds: number[],
    ): Promise<Map<number, Set<number>>> {
      const used = new Map<number, Set<number>>();
      if (userIds.length === 0 || chemicalIds.length === 0) return used;
      const rows: { userId: number; chemicalId: number }[] = await manager
        .createQueryBuilder()
        .select('DISTINCT e.user_id', 'userId')
        .addSelect('c.chemical_id', 'chemicalId')
        .from('containers', 'c')
        .innerJoin('ledger_entries', 'e', 'e.container_id = c.id')
        .where('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere('e.user_id IN (:...userIds)', { userIds })
        .getRawMany();
      for (const row of rows) {
        const userId = Number(row.userId);
        if (!used.has(userId)) used.set(userId, new Set());
        used.get(userId)!.add(Number(row.chemicalId));
      }
      return used;
    },
    /** Chemicals whose usable total is at or below their reorder point. */
    async lowStock(today: string, chemicalIds?: number[]): Promise<LowStockFacts[]> {
      const totalSql = usableTotalMicroSql('ch');
      const qb = manager
        .createQueryBuilder()
        .select('ch.id', 'id')
        .addSelect('ch.name', 'name')
        .addSelect('ch.stock_unit', 'stockUnit')
        .addSelect('ch.reorder_point', 'reorderPoint')
        .addSelect('ch.reorder_quantity', 'reorderQuantity')
        .addSelect('ch.ghs_pictograms', 'ghsPictograms')
        .addSelect('ch.hazard_statements', 'hazardStatements')
        .addSelect(totalSql, 'total')
        .from('chemicals', 'ch')
        .where(atOrBelowReorderPointCondition('ch', totalSql))
        .setParameter('today', today);
      if (chemicalIds) {
        if (chemicalIds.length === 0) return [];
        qb.andWhere('ch.id IN (:...chemicalIds)', { chemicalIds });
      }
      const rows = await qb.orderBy('LOWER(ch.name)', 'ASC').getRawMany<Record<string, unknown>>();
      return rows.map(
        (row) =>
          ({
            ...row,
            id: Number(row.id),
            reorderPoint: Number(row.reorderPoint),
            reorderQuantity: row.reorderQuantity === null ? null : Number(row.reorderQuantity),
            total: fromMicro(row.total),
            ghsPictograms: parseJsonList<GhsCode>(row.ghsPictograms),
            hazardStatements: parseJsonList<string>(row.hazardStatements),
          }) as LowStockFacts,
      );
    },
    /** Usable containers (sealed or open, in date) of these chemicals. */
    async usableContainers(today: string, chemicalIds: number[]): Promise<AlertContainerFacts[]> {
      if (chemicalIds.length === 0) return [];
      const rows = await containerQuery()
        .where(usableSql('c'), { today })
        .andWhere('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .orderBy('loc.path', 'ASC')
        .addOrderBy('c.label_code', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map(toContainer);
    },
    /** Sealed or open containers that expire, or are due a peroxide test, on or before `until`. */
    async datedContainers(until: string, chemicalIds?: number[]): Promise<AlertContainerFacts[]> {
      const qb = containerQuery()
        .where("c.status IN ('sealed', 'open')")
        .andWhere('(c.expires_on <= :until OR c.peroxide_due_on <= :until)', { until });
      if (chemicalIds) {
        if (chemicalIds.length === 0) return [];
        qb.andWhere('c.chemical_id IN (:...chemicalIds)', { chemicalIds });
      }
      const rows = await qb
        .orderBy('LOWER(ch.name)', 'ASC')
        .addOrderBy('c.label_code', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map(toContainer);
    },
  };
}
export type AlertsRepository = ReturnType<typeof alertsRepository>;
