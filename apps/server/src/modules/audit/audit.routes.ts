import { auditListQuerySchema } from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import type { AuditService } from './audit.service';

export function auditRoutes(audit: AuditService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/audit',
      access: 'users.manage',
      query: auditListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await audit.list(query));
      },
    }),
  ];
}
