import type { AlertDelivery, OutboxStatus } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/**
 * A row of `outbox`: one e-mail to one person, written in the same transaction as the event
 * that caused it and sent later by the outbox worker. Never deleted by Lotwise.
 */
export interface OutboxRow {
  id: number;
  /** The person it is for; null for an address that is no user (or a removed account). */
  userId: number | null;
  recipientEmail: string;
  kind: string;
  subject: string;
  /** Body without the footer; the footer (unsubscribe links) is added when sending. */
  text: string;
  html: string;
  /** Full address of the page the message is about. */
  link: string | null;
  /** The condition, e.g. `low-stock:chemical:12`; the same key mails a person once per window. */
  dedupKey: string | null;
  delivery: AlertDelivery;
  status: OutboxStatus;
  attempts: number;
  lastError: string | null;
  /** When the worker picks it up next; null once sent or failed. */
  nextAttemptAt: string | null;
  /** The claim of the sender that took it (`sending`); null when no sender holds it. */
  claimedBy: string | null;
  /** Until when that claim holds; after it, another sender may take the message again. */
  leaseUntil: string | null;
  createdAt: string;
  updatedAt: string;
  sentAt: string | null;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  user?: unknown;
}

export const OutboxMessageEntity = new EntitySchema<OutboxRow>({
  name: 'OutboxMessage',
  tableName: 'outbox',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    userId: { name: 'user_id', type: 'integer', nullable: true },
    recipientEmail: { name: 'recipient_email', type: 'varchar', length: 254 },
    kind: { type: 'varchar', length: 40 },
    subject: { type: 'varchar', length: 300 },
    text: { type: 'text' },
    html: { type: 'text' },
    link: { type: 'varchar', length: 500, nullable: true },
    dedupKey: { name: 'dedup_key', type: 'varchar', length: 200, nullable: true },
    delivery: { type: 'varchar', length: 10 },
    status: { type: 'varchar', length: 10 },
    attempts: { type: 'integer' },
    lastError: { name: 'last_error', type: 'text', nullable: true },
    nextAttemptAt: { name: 'next_attempt_at', type: 'varchar', length: 24, nullable: true },
    claimedBy: { name: 'claimed_by', type: 'varchar', length: 64, nullable: true },
    leaseUntil: { name: 'lease_until', type: 'varchar', length: 24, nullable: true },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
    sentAt: { name: 'sent_at', type: 'varchar', length: 24, nullable: true },
  },
  relations: {
    user: {
      type: 'many-to-one',
      target: 'User',
      joinColumn: { name: 'user_id', foreignKeyConstraintName: 'outbox_user_fk' },
      onDelete: 'SET NULL',
      nullable: true,
    },
  },
  indices: [
    { name: 'outbox_status_next_idx', columns: ['status', 'nextAttemptAt'] },
    { name: 'outbox_dedup_idx', columns: ['recipientEmail', 'dedupKey', 'createdAt'] },
    { name: 'outbox_created_at_idx', columns: ['createdAt'] },
    { name: 'outbox_status_lease_idx', columns: ['status', 'leaseUntil'] },
    { name: 'outbox_attempts_idx', columns: ['attempts'] },
    { name: 'outbox_kind_idx', columns: ['kind', 'createdAt'] },
    { name: 'outbox_next_attempt_idx', columns: ['nextAttemptAt'] },
    // the oldest queued message (metrics)
    { name: 'outbox_status_created_idx', columns: ['status', 'createdAt'] },
  ],
});
