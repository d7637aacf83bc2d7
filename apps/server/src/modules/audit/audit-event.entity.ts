import { EntitySchema } from 'typeorm';

/** A row of `audit_events`: who did what to which record, with detail as JSON. */
export interface AuditEventRow {
  id: number;
  actorId: number | null;
  /** Declared so the foreign key is part of the mapping; never loaded. */
  actor?: unknown;
  action: string;
  targetType: string;
  targetId: number | null;
  detail: Record<string, unknown>;
  createdAt: string;
}

export const AuditEventEntity = new EntitySchema<AuditEventRow>({
  name: 'AuditEvent',
  tableName: 'audit_events',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    actorId: { name: 'actor_id', type: 'integer', nullable: true },
    action: { type: 'varchar', length: 60 },
    targetType: { name: 'target_type', type: 'varchar', length: 40 },
    targetId: { name: 'target_id', type: 'integer', nullable: true },
    detail: { type: 'simple-json' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
  },
  relations: {
    actor: {
      type: 'many-to-one',
      target: 'User',
      joinColumn: { name: 'actor_id', foreignKeyConstraintName: 'audit_events_actor_fk' },
      onDelete: 'SET NULL',
      nullable: true,
    },
  },
  indices: [
    { name: 'audit_events_created_at_idx', columns: ['createdAt'] },
    { name: 'audit_events_action_idx', columns: ['action'] },
    { name: 'audit_events_target_idx', columns: ['targetType', 'targetId', 'createdAt'] },
  ],
});
