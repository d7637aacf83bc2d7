import { z } from 'zod';
import { labAreaKindSchema, labUnitClassSchema, floorAreaUnitSchema } from './flammability';
import {
  labAreaClassTotalSchema,
  labAreaContainerSizeBreachSchema,
  labAreaLimitSchema,
  labAreaNotCountedSchema,
  labAreaRuleSetRefSchema,
  labAreaStatuses,
} from './lab-areas';
import { locationConflictSchema } from './segregation';
import { wasteAreaSchema, wasteContainerSchema } from './waste';
import { watchedHoldingSchema } from './watch-lists';

/**
 * `GET /api/lab-areas/:id/inspection`: a one-page summary of a lab area for an inspection,
 * assembled from what the lab-area, watch-list, waste and segregation services already work
 * out (never recomputed here). Every section names the rule sets or lists it was measured
 * against, with their source; the whole carries `roomRulesReminder`.
 */

/** A watch list the lab chose, as the summary cites it. */
export const inspectionWatchListSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  jurisdiction: z.string(),
  /** The regulation, with its article or annex. */
  source: z.string(),
  edition: z.string(),
});
export type InspectionWatchList = z.infer<typeof inspectionWatchListSchema>;

export const inspectionSummarySchema = z.object({
  area: z.object({
    id: z.number().int(),
    locationId: z.number().int(),
    name: z.string(),
    path: z.string(),
    kind: labAreaKindSchema,
    unitClass: labUnitClassSchema,
    floorArea: z.number(),
    floorAreaUnit: floorAreaUnitSchema,
    storey: z.number().int(),
    instructional: z.boolean(),
  }),
  /** The day the summary is for (the server's today, YYYY-MM-DD) and when it was made. */
  date: z.string(),
  generatedAt: z.string(),
  /** Flammable and combustible liquids against the area's limits (the lab-area detail's). */
  flammable: z.object({
    ruleSets: z.array(labAreaRuleSetRefSchema),
    status: z.enum(labAreaStatuses),
    byClass: z.array(labAreaClassTotalSchema),
    limits: z.array(labAreaLimitSchema),
    notCounted: z.array(labAreaNotCountedSchema),
    containerSizeBreaches: z.array(labAreaContainerSizeBreachSchema),
  }),
  /** Containers of chemicals on a chosen watch list, anywhere inside the area. */
  watched: z.object({
    lists: z.array(inspectionWatchListSchema),
    holdings: z.array(watchedHoldingSchema),
  }),
  /** Open and full waste containers inside the area, and the accumulation areas among its places. */
  waste: z.object({
    containers: z.array(wasteContainerSchema),
    /** Approximate litres of all of it. */
    litres: z.number(),
    /** Litres of ignitable waste by NFPA 30 class (they count toward the flammable limits). */
    ignitableLitresByClass: z.record(z.string(), z.number()),
    accumulationAreas: z.array(wasteAreaSchema),
  }),
  /** Places inside the area holding groups that should be stored apart. */
  storageConflicts: z.object({
    items: z.array(locationConflictSchema),
    /** Where the rules come from ("Prudent Practices …"), each once. */
    sources: z.array(z.string()),
    notice: z.string(),
  }),
  /** The reminder every room-rule answer carries (`roomRulesReminder`). */
  reminder: z.string(),
});
export type InspectionSummary = z.infer<typeof inspectionSummarySchema>;
