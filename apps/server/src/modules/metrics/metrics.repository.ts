import type { OutboxStatus } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { LedgerChangeNoteEntity } from '../alerts/ledger-change-note.entity';
import { OutboxMessageEntity } from '../alerts/outbox-message.entity';

/** E-mails waiting in the outbox, by status, and when the oldest queued one was written. */
export interface OutboxDepth {
  counts: Partial<Record<OutboxStatus, number>>;
  oldestQueuedAt: string | null;
}

/** Ledger changes the alert rules have not run for yet. */
export interface PendingLedgerNotes {
  count: number;
  oldestNotedAt: string | null;
}

/**
 * The reads behind the gauges, made on every scrape: each one is served by an index
 * (`outbox_status_next_idx` for the outbox; `ledger_change_notes` holds only the notes not
 * evaluated yet, a handful, since each is deleted once the rules ran for it).
 */
export function metricsRepository(manager: EntityManager) {
  const outbox = manager.getRepository(OutboxMessageEntity);
  const notes = manager.getRepository(LedgerChangeNoteEntity);
  return {
    async outboxDepth(): Promise<OutboxDepth> {
      const rows = await outbox
        .createQueryBuilder('o')
        .select('o.status', 'status')
        .addSelect('COUNT(*)', 'count')
        .where('o.status IN (:...statuses)', { statuses: ['queued', 'sending', 'failed'] })
        .groupBy('o.status')
        .getRawMany<{ status: OutboxStatus; count: number | string }>();
      const oldest = await outbox
        .createQueryBuilder('o')
        .select('MIN(o.createdAt)', 'at')
        .where('o.status = :status', { status: 'queued' })
        .getRawOne<{ at: string | null }>();
      return {
        counts: Object.fromEntries(rows.map((row) => [row.status, Number(row.count)])),
        oldestQueuedAt: oldest?.at ?? null,
      };
    },
    async pendingLedgerNotes(): Promise<PendingLedgerNotes> {
      const row = await notes
        .createQueryBuilder('n')
        .select('COUNT(*)', 'count')
        .addSelect('MIN(n.notedAt)', 'at')
        .getRawOne<{ count: number | string; at: string | null }>();
      return { count: Number(row?.count ?? 0), oldestNotedAt: row?.at ?? null };
    },
  };
}
export type MetricsRepository = ReturnType<typeof metricsRepository>;
