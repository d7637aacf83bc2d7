import { validateCasNumber } from '@lotwise/chem';
import { z } from 'zod';
import { isoDateSchema } from './dates';

/**
 * Watch lists: substances a regulator restricts or asks to be reported (explosives precursors,
 * drug precursors), kept as data with the legal source of every row. Built-in lists are
 * presets the lab chooses from; a lab may add its own list for its own regulator.
 * `GET /api/watch-lists`, `GET/PATCH/DELETE /api/watch-lists/:id`, `POST /api/watch-lists`,
 * `POST /api/orders/:id/watch-approval`, `GET /api/watch-lists/report[.csv]?from=&to=`.
 * Lotwise output is a reminder: the regulation's current text and the authority decide.
 */

export const thresholdComparisons = ['above', 'at-or-above'] as const;
export type ThresholdComparison = (typeof thresholdComparisons)[number];
export const thresholdComparisonSchema = z.enum(thresholdComparisons, {
  message: 'must be above or at-or-above',
});
export const thresholdComparisonLabels: Record<ThresholdComparison, string> = {
  above: 'above',
  'at-or-above': 'at or above',
};

/** The basis a threshold is read on when none is given. */
export const defaultThresholdBasis = '% w/w';

const casNumberSchema = z
  .string()
  .trim()
  .superRefine((value, ctx) => {
    const check = validateCasNumber(value);
    if (!check.valid) ctx.addIssue({ code: 'custom', message: check.reason });
  });

const text = (max: number) => z.string().trim().max(max, `is at most ${max} characters`);
const required = (max: number, what: string) => text(max).min(1, `say ${what}`);

/** One substance on a list, as a person enters it. */
export const watchListEntryInputSchema = z
  .object({
    substance: required(200, 'which substance'),
    casNumber: casNumberSchema,
    /** Concentration from which the row applies, in `thresholdBasis` units; null: always. */
    thresholdPercent: z
      .number()
      .min(0, 'cannot be below 0 %')
      .max(100, 'cannot be above 100 %')
      .nullable()
      .default(null),
    thresholdBasis: text(60).default(defaultThresholdBasis),
    comparison: thresholdComparisonSchema.default('above'),
    action: required(1000, 'what must be done'),
    /** The article, annex or paragraph of the row. */
    source: required(300, 'the legal source'),
  })
  .strict();
export type WatchListEntryInput = z.input<typeof watchListEntryInputSchema>;

export const watchListEntrySchema = z.object({
  id: z.number().int(),
  listId: z.number().int(),
  substance: z.string(),
  casNumber: z.string(),
  thresholdPercent: z.number().nullable(),
  thresholdBasis: z.string(),
  comparison: thresholdComparisonSchema,
  action: z.string(),
  source: z.string(),
});
export type WatchListEntry = z.infer<typeof watchListEntrySchema>;

export const watchListSchema = z.object({
  id: z.number().int(),
  jurisdiction: z.string(),
  name: z.string(),
  /** The regulation, with its article or annex. */
  source: z.string(),
  /** Edition or date of the text the rows were taken from. */
  edition: z.string(),
  notes: z.string(),
  builtIn: z.boolean(),
  /** The lab chose it: its substances are watched. */
  chosen: z.boolean(),
  entryCount: z.number().int(),
});
export type WatchList = z.infer<typeof watchListSchema>;

export const watchListDetailSchema = watchListSchema.extend({
  entries: z.array(watchListEntrySchema),
});
export type WatchListDetail = z.infer<typeof watchListDetailSchema>;

export const watchListCreateSchema = z
  .object({
    jurisdiction: required(120, 'whose rules these are'),
    name: required(200, 'the list’s name'),
    source: required(300, 'the regulation'),
    edition: text(120).default(''),
    notes: text(2000).default(''),
    chosen: z.boolean().default(true),
    entries: z.array(watchListEntryInputSchema).max(500).default([]),
  })
  .strict();
export type WatchListCreate = z.input<typeof watchListCreateSchema>;
export type WatchListCreateParsed = z.output<typeof watchListCreateSchema>;

/** A built-in list takes only `chosen`; a lab's own list takes every field (entries replace). */
export const watchListPatchSchema = z
  .object({
    chosen: z.boolean(),
    jurisdiction: required(120, 'whose rules these are'),
    name: required(200, 'the list’s name'),
    source: required(300, 'the regulation'),
    edition: text(120),
    notes: text(2000),
    entries: z.array(watchListEntryInputSchema).max(500),
  })
  .partial()
  .strict();
export type WatchListPatch = z.infer<typeof watchListPatchSchema>;

/** Why a chemical is watched: one row of a chosen list it meets. */
export const watchListingSchema = z.object({
  listId: z.number().int(),
  listName: z.string(),
  jurisdiction: z.string(),
  substance: z.string(),
  /** "above 12 % w/w", or "any concentration". */
  threshold: z.string(),
  action: z.string(),
  /** The list's regulation and the row's article or annex. */
  source: z.string(),
});
export type WatchListing = z.infer<typeof watchListingSchema>;

/** The words of a row's threshold: "above 12 % w/w", "at or above 16 % nitrogen by weight". */
export function thresholdText(
  entry: Pick<WatchListEntry, 'thresholdPercent' | 'thresholdBasis' | 'comparison'>,
): string {
  if (entry.thresholdPercent === null) return 'any concentration';
  const basis = entry.thresholdBasis.trim() || defaultThresholdBasis;
  const figure = basis.startsWith('%')
    ? `${entry.thresholdPercent} ${basis}`
    : `${entry.thresholdPercent} % ${basis}`;
  return `${thresholdComparisonLabels[entry.comparison]} ${figure}`;
}

/**
 * Whether a concentration (in %) meets a row's threshold. Without a threshold the row applies
 * at any concentration; an unknown concentration is read as the pure substance.
 */
export function meetsThreshold(
  concentrationPercent: number | null,
  entry: Pick<WatchListEntry, 'thresholdPercent' | 'comparison'>,
): boolean {
  if (entry.thresholdPercent === null) return true;
  const percent = concentrationPercent ?? 100;
  return entry.comparison === 'above'
    ? percent > entry.thresholdPercent
    : percent >= entry.thresholdPercent;
}

/** The badge's words and its description: "EU 2019/1148 Annex I: not to be sold …". */
export function watchListingText(listing: WatchListing): string {
  return `${listing.listName} (${listing.jurisdiction}), ${listing.threshold}: ${listing.action} Source: ${listing.source}.`;
}

/** `POST /api/orders/:id/watch-approval`: a manager's recorded reason. */
export const watchApprovalSchema = z
  .object({ reason: required(1000, 'why the order is approved').min(5, 'say why, in a few words') })
  .strict();
export type WatchApprovalBody = z.infer<typeof watchApprovalSchema>;

/** A watched chemical on an order's lines, and why. */
export const watchedOrderChemicalSchema = z.object({
  chemicalId: z.number().int(),
  name: z.string(),
  casNumber: z.string().nullable(),
  /** Marked restricted on the chemical itself (needs approval whether or not a list names it). */
  restricted: z.boolean(),
  listings: z.array(watchListingSchema),
});
export type WatchedOrderChemical = z.infer<typeof watchedOrderChemicalSchema>;

/** An order's approval for its watched chemicals: who, when, why. */
export const watchApprovalRecordSchema = z.object({
  approvedAt: z.string(),
  approvedById: z.number().int().nullable(),
  approvedByName: z.string(),
  reason: z.string(),
  /** The chemicals the approval covered. */
  chemicalIds: z.array(z.number().int()),
});
export type WatchApprovalRecord = z.infer<typeof watchApprovalRecordSchema>;

/** What an order page shows of watched chemicals. */
export const orderWatchSchema = z.object({
  chemicals: z.array(watchedOrderChemicalSchema),
  approval: watchApprovalRecordSchema.nullable(),
  /** Watched chemicals are on the lines and the approval does not cover them all. */
  approvalNeeded: z.boolean(),
});
export type OrderWatch = z.infer<typeof orderWatchSchema>;

export const watchReportQuerySchema = z
  .object({ from: isoDateSchema, to: isoDateSchema })
  .strict()
  .refine((query) => query.from <= query.to, {
    message: 'must be on or after from',
    path: ['to'],
  });
export type WatchReportQuery = z.infer<typeof watchReportQuerySchema>;

export const watchedHoldingSchema = z.object({
  containerId: z.number().int(),
  labelCode: z.string(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  casNumber: z.string().nullable(),
  /** List names, joined. */
  lists: z.string(),
  locationId: z.number().int(),
  locationPath: z.string(),
  quantity: z.number(),
  unit: z.string(),
});
export type WatchedHolding = z.infer<typeof watchedHoldingSchema>;

export const watchedMovementSchema = z.object({
  entryId: z.number().int(),
  at: z.string(),
  userName: z.string(),
  reason: z.string(),
  containerId: z.number().int(),
  labelCode: z.string(),
  chemicalName: z.string(),
  lists: z.string(),
  delta: z.number(),
  unit: z.string(),
  note: z.string(),
});
export type WatchedMovement = z.infer<typeof watchedMovementSchema>;

export const watchReportSchema = z.object({
  from: z.string(),
  to: z.string(),
  generatedAt: z.string(),
  holdings: z.array(watchedHoldingSchema),
  movements: z.array(watchedMovementSchema),
  reminder: z.string(),
});
export type WatchReport = z.infer<typeof watchReportSchema>;

/** The sentence every watch-list page and answer carries. */
export const watchListReminder =
  'Watch lists are reminders taken from the regulations named beside each row: the current legal text, your authority, local regulations and the SDS decide. Lotwise output is never legal or safety approval.';
