import { z } from 'zod';
import { stockUnitSchema } from './chemicals';
import { maxPageSize } from './list';

/** Why a container's quantity changed. Entries are append-only: a mistake is corrected by a new entry. */
export const ledgerReasons = [
  'received',
  'drawn',
  'adjusted',
  'transferred',
  'disposed',
  'split',
] as const;
export const ledgerReasonSchema = z.enum(ledgerReasons);
export type LedgerReason = (typeof ledgerReasons)[number];

export const ledgerEntrySchema = z.object({
  id: z.number().int(),
  containerId: z.number().int(),
  reason: ledgerReasonSchema,
  /** Signed change in the container's unit: negative out, positive in, 0 for a move. */
  quantity: z.number(),
  unit: stockUnitSchema,
  /** The container's balance after this entry. */
  balanceAfter: z.number(),
  note: z.string(),
  user: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  /** The run a draw belongs to (filled in by runs). */
  runId: z.number().int().nullable(),
  /** The order a receipt belongs to (filled in by ordering). */
  orderId: z.number().int().nullable(),
  stocktakeId: z.number().int().nullable(),
  /** For a transfer (and a split's new container): where it was and where it went. */
  fromLocationId: z.number().int().nullable(),
  toLocationId: z.number().int().nullable(),
  /** For a split: the container on the other side. */
  relatedContainerId: z.number().int().nullable(),
  createdAt: z.string(),
});
export type LedgerEntry = z.infer<typeof ledgerEntrySchema>;

/** `GET /api/containers/:id/ledger`: newest first. */
export const ledgerListQuerySchema = z.object({
  page: z.coerce.number().int().min(1, 'page starts at 1').optional().default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1)
    .max(maxPageSize, `pageSize is at most ${maxPageSize}`)
    .optional()
    .default(50),
});
export type LedgerListQuery = z.infer<typeof ledgerListQuerySchema>;

export const ledgerProblemKinds = ['balance_mismatch', 'chain_broken', 'negative_balance'] as const;

/** `GET /api/maintenance/ledger-check`: every container's balance against its entries. */
export const ledgerCheckResultSchema = z.object({
  ok: z.boolean(),
  containersChecked: z.number().int(),
  entriesChecked: z.number().int(),
  problems: z.array(
    z.object({
      containerId: z.number().int(),
      labelCode: z.string(),
      kind: z.enum(ledgerProblemKinds),
      message: z.string(),
    }),
  ),
  checkedAt: z.string(),
});
export type LedgerCheckResult = z.infer<typeof ledgerCheckResultSchema>;
