import type { AuditEvent, AuditListQuery, Page } from '@lotwise/shared';
import type { Store } from '../../db/store';

export function auditService(store: Store) {
  const { audit, users } = store.repos;
  return {
    async list(query: AuditListQuery): Promise<Page<AuditEvent>> {
      const { rows, total } = await audit.list(query);
      const actorIds = [...new Set(rows.flatMap((row) => (row.actorId ? [row.actorId] : [])))];
      const actors = new Map((await users.findByIds(actorIds)).map((user) => [user.id, user]));
      const items = rows.map((row): AuditEvent => {
        const actor = row.actorId ? actors.get(row.actorId) : undefined;
        return {
          id: row.id,
          actor: actor
            ? { id: actor.id, displayName: actor.displayName, email: actor.email }
            : null,
          action: row.action,
          targetType: row.targetType,
          targetId: row.targetId,
          detail: row.detail,
          createdAt: row.createdAt,
        };
      });
      return { items, total, page: query.page, pageSize: query.pageSize };
    },
  };
}
export type AuditService = ReturnType<typeof auditService>;
