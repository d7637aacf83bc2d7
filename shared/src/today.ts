import { z } from 'zod';
import { ghsCodeSchema } from './hazards';
import type { Permission } from './roles';

/**
 * The start page: what needs doing today, per role. Each section lists its first few items
 * and the total, with a link to the full list; a section the role may not see is left out
 * of the answer (absent, not empty).
 */

/** How many items each section lists; the rest is "and N more" with a link. */
export const todayItemsPerSection = 5;

/** The sections in the order the page shows them: the day's work first, then the stock. */
export const todaySectionKeys = [
  'plans',
  'myOpenRuns',
  'ordersWaiting',
  'belowReorderPoint',
  'expiry',
  'peroxideDue',
  'storageConflicts',
  'labAreaLimits',
  'failedEmails',
] as const;
export type TodaySectionKey = (typeof todaySectionKeys)[number];

/**
 * Who sees which section: the permission of the list the section comes from (the same rule
 * the rest of the app uses for that list).
 */
export const todaySectionPermissions: Record<TodaySectionKey, Permission> = {
  belowReorderPoint: 'alerts.read',
  expiry: 'alerts.read',
  peroxideDue: 'alerts.read',
  plans: 'procedures.read',
  myOpenRuns: 'runs.record',
  storageConflicts: 'stock.read',
  /** Lab areas over a flammable-liquid limit (critical) or at 90 % of one (warning). */
  labAreaLimits: 'stock.read',
  failedEmails: 'outbox.manage',
  ordersWaiting: 'orders.join',
};

export const todaySeverities = ['info', 'warning', 'critical'] as const;

/** A chemical an item names, with its pictograms (hazards travel with the name). */
export const todayChemicalSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  ghsPictograms: z.array(ghsCodeSchema),
});
export type TodayChemical = z.infer<typeof todayChemicalSchema>;

/** One thing to act on. */
export const todayItemSchema = z.object({
  /** Stable for the same thing, e.g. `plan:4` or `expired:container:7`. */
  key: z.string(),
  severity: z.enum(todaySeverities),
  /** The state in words, e.g. "Expired", "Short", "To pay" (never colour alone). */
  status: z.string(),
  title: z.string(),
  detail: z.string(),
  /** Further lines, e.g. a plan's shortfalls and what it holds. */
  notes: z.array(z.string()),
  /** Path in the web app where the person acts on it. */
  link: z.string(),
  chemicals: z.array(todayChemicalSchema),
  /** The date it is about (expiry, test, plan date), when it has one. */
  dueOn: z.string().nullable(),
});
export type TodayItem = z.infer<typeof todayItemSchema>;

export const todaySectionSchema = z.object({
  /** How many there are in all; `items` holds the first few. */
  total: z.number().int(),
  items: z.array(todayItemSchema),
  /** Path of the full list. */
  moreLink: z.string(),
});
export type TodaySection = z.infer<typeof todaySectionSchema>;

/** `GET /api/today`: the signed-in person's start page. */
export const todaySchema = z.object({
  /** Today (server date) and the last day counted as "this week". */
  date: z.string(),
  weekEnd: z.string(),
  /** Days ahead that count as "expiring" or "due". */
  expiryWindowDays: z.number().int(),
  sections: z.object(
    Object.fromEntries(todaySectionKeys.map((key) => [key, todaySectionSchema.optional()])) as {
      [K in TodaySectionKey]: z.ZodOptional<typeof todaySectionSchema>;
    },
  ),
  safetyDeferral: z.string(),
});
export type Today = z.infer<typeof todaySchema>;
