import { z } from 'zod';
import { listQuerySchema } from './list';

/**
 * What Lotwise can tell people about. The stock kinds come from rules evaluated on the stock;
 * the order kinds are sent by the shared-order features through the general message API.
 */
export const alertKinds = [
  'low-stock',
  'expiring',
  'expired',
  'peroxide-due',
  'reservation-lapsing',
  'order-opened',
  'order-deadline',
  'order-funded',
  'order-cancelled',
  'order-portion-ready',
  'order-payment',
  'waste-near-limit',
  'waste-time',
] as const;
export const alertKindSchema = z.enum(alertKinds, {
  message: `must be one of: ${alertKinds.join(', ')}`,
});
export type AlertKind = (typeof alertKinds)[number];

export const alertKindLabels: Record<AlertKind, string> = {
  'low-stock': 'Stock at or below its reorder point',
  expiring: 'Containers expiring soon',
  expired: 'Expired containers',
  'peroxide-due': 'Peroxide test or discard due',
  'reservation-lapsing': 'Reservations about to lapse',
  'order-opened': 'A shared order opened',
  'order-deadline': 'A shared order’s deadline is near',
  'order-funded': 'A shared order is funded',
  'order-cancelled': 'A shared order was cancelled or refunded',
  'order-portion-ready': 'Your portion of an order is ready',
  'order-payment': 'A payment for your share was recorded',
  'waste-near-limit': 'Waste near or over its limit',
  'waste-time': 'Waste near or past its accumulation time',
};

export const alertSeverities = ['info', 'warning', 'critical'] as const;
export const alertSeveritySchema = z.enum(alertSeverities);
export type AlertSeverity = (typeof alertSeverities)[number];

/** One current condition, worked out live from the stock (not from the outbox). */
export const alertSchema = z.object({
  /** Stable for the same condition, e.g. `low-stock:chemical:12`. */
  key: z.string(),
  kind: alertKindSchema,
  severity: alertSeveritySchema,
  title: z.string(),
  message: z.string(),
  chemical: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  container: z
    .object({ id: z.number().int(), labelCode: z.string(), locationPath: z.string() })
    .nullable(),
  /** The date the condition is about (expiry, peroxide test), when it has one. */
  dueOn: z.string().nullable(),
  /** Path in the web app, e.g. `/stock/chemicals/12`. */
  link: z.string(),
});
export type Alert = z.infer<typeof alertSchema>;

/** `GET /api/alerts?kind=`: current conditions, most severe first. */
export const alertListQuerySchema = z.object({ kind: alertKindSchema.optional() });
export type AlertListQuery = z.infer<typeof alertListQuerySchema>;
export const alertListSchema = z.object({
  items: z.array(alertSchema),
  evaluatedAt: z.string(),
  /** Days ahead that count as "expiring" or "due". */
  expiryWindowDays: z.number().int(),
});
export type AlertList = z.infer<typeof alertListSchema>;

/** `POST /api/alerts/evaluate`: what one evaluation found and queued. */
export const alertEvaluationSchema = z.object({
  conditions: z.number().int(),
  queued: z.number().int(),
  /** Messages not queued because the same person got the same condition within the window. */
  duplicates: z.number().int(),
});
export type AlertEvaluation = z.infer<typeof alertEvaluationSchema>;

export const alertDeliveries = ['immediate', 'digest'] as const;
export const alertDeliverySchema = z.enum(alertDeliveries, {
  message: 'must be immediate or digest',
});
export type AlertDelivery = (typeof alertDeliveries)[number];

/** `PUT /api/alerts/preferences`. */
export const alertPreferencesBodySchema = z.object({
  delivery: alertDeliverySchema,
  /** The kinds this person wants by e-mail; an empty list turns e-mail alerts off. */
  kinds: z.array(alertKindSchema).max(alertKinds.length),
});
export type AlertPreferencesBody = z.infer<typeof alertPreferencesBodySchema>;

/** `GET /api/alerts/preferences`. */
export const alertPreferencesSchema = alertPreferencesBodySchema.extend({
  /** Hour of the day (server time, 0-23) the daily digest goes out. */
  digestHour: z.number().int(),
  /** Whose stock alerts this person gets: every chemical, or those they used or claimed. */
  scope: z.enum(['all', 'mine']),
  /** True while nothing was saved and the role's defaults apply. */
  isDefault: z.boolean(),
});
export type AlertPreferences = z.infer<typeof alertPreferencesSchema>;

export const outboxStatuses = ['queued', 'sending', 'sent', 'failed'] as const;
export const outboxStatusSchema = z.enum(outboxStatuses, {
  message: `must be one of: ${outboxStatuses.join(', ')}`,
});
export type OutboxStatus = (typeof outboxStatuses)[number];

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  recipient: z.object({
    userId: z.number().int().nullable(),
    email: z.string(),
    displayName: z.string().nullable(),
  }),
  kind: z.string(),
  subject: z.string(),
  delivery: alertDeliverySchema,
  status: outboxStatusSchema,
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string().nullable(),
  dedupKey: z.string().nullable(),
  link: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

/** `GET /api/outbox/:id`: the message with its bodies. */
export const outboxMessageDetailSchema = outboxMessageSchema.extend({
  text: z.string(),
  html: z.string(),
});
export type OutboxMessageDetail = z.infer<typeof outboxMessageDetailSchema>;

export const outboxListQuerySchema = listQuerySchema(
  ['createdAt', 'status', 'attempts', 'nextAttemptAt'],
  'createdAt.desc',
).extend({
  status: outboxStatusSchema.optional(),
  kind: z.string().trim().max(40).optional(),
});
export type OutboxListQuery = z.infer<typeof outboxListQuerySchema>;
