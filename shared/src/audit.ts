import { z } from 'zod';
import { listQuerySchema } from './list';

/** What the audit trail records (admin actions on users and backups, discarded runs). */
export const auditActions = [
  'user.created',
  'user.role_changed',
  'user.deactivated',
  'user.reactivated',
  'user.renamed',
  'user.password_set',
  'user.invite_issued',
  'backup.created',
  'backup.downloaded',
  'run.discarded',
] as const;
export type AuditAction = (typeof auditActions)[number];

export const auditEventSchema = z.object({
  id: z.number().int(),
  /** Who did it; null when done from the command line or the account was removed. */
  actor: z.object({ id: z.number().int(), displayName: z.string(), email: z.string() }).nullable(),
  action: z.string(),
  /** Kind of record acted on, e.g. `user`. */
  targetType: z.string(),
  targetId: z.number().int().nullable(),
  /** What changed, e.g. `{ from: 'member', to: 'manager' }`. */
  detail: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditListQuerySchema = listQuerySchema(
  ['createdAt', 'action'],
  'createdAt.desc',
).extend({
  targetType: z.string().trim().max(40).optional(),
  targetId: z.coerce.number().int().positive().optional(),
});
export type AuditListQuery = z.infer<typeof auditListQuerySchema>;
