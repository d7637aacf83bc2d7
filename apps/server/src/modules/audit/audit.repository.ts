import { parseSort, type AuditListQuery } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { containsPattern } from '../../db/sql';
import { AuditEventEntity, type AuditEventRow } from './audit-event.entity';

/** Data access for `audit_events`; append-only. */
export function auditRepository(manager: EntityManager) {
  const repo = manager.getRepository(AuditEventEntity);
  return {
    async insert(event: Omit<AuditEventRow, 'id'>): Promise<void> {
      await repo.save({ ...event });
    },
    async list(query: AuditListQuery): Promise<{ rows: AuditEventRow[]; total: number }> {
      const qb = repo.createQueryBuilder('a');
      if (query.q) {
        qb.where("LOWER(a.action) LIKE :q ESCAPE '\\'", {
          q: containsPattern(query.q.toLowerCase()),
        });
      }
      if (query.targetType)
        qb.andWhere('a.targetType = :targetType', { targetType: query.targetType });
      if (query.targetId) qb.andWhere('a.targetId = :targetId', { targetId: query.targetId });
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const rows = await qb
        .orderBy(
          field === 'action' ? 'a.action' : 'a.createdAt',
          direction === 'desc' ? 'DESC' : 'ASC',
        )
        .addOrderBy('a.id', direction === 'desc' ? 'DESC' : 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getMany();
      return { rows: rows.map((row) => ({ ...row })), total };
    },
  };
}
export type AuditRepository = ReturnType<typeof auditRepository>;
