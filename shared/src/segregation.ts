import { z } from 'zod';
import { storageGroupSchema } from './hazards';

/**
 * Why a container's place deserves a second look. `incompatible_groups`: the place holds a
 * group that should be stored apart; `location_group_mismatch`: the place is meant for other
 * groups. A warning never blocks the write, and no warning is a safety approval.
 */
export const segregationWarningCodes = ['incompatible_groups', 'location_group_mismatch'] as const;
export type SegregationWarningCode = (typeof segregationWarningCodes)[number];

export const segregationWarningSchema = z.object({
  code: z.enum(segregationWarningCodes),
  /** One sentence for the person, naming the containers and the place. */
  message: z.string(),
  /** The rule's reason in plain words (from the compatibility table in @lotwise/chem). */
  reason: z.string(),
  /** Where the rule comes from, e.g. "Prudent Practices"; null for a place mismatch. */
  source: z.string().nullable(),
  /** The two groups involved (for a mismatch: the container's group and nothing else). */
  groups: z.array(storageGroupSchema),
  /** Label codes of the other containers involved. */
  labelCodes: z.array(z.string()),
});
export type SegregationWarning = z.infer<typeof segregationWarningSchema>;

const conflictContainerSchema = z.object({
  id: z.number().int(),
  labelCode: z.string(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  storageGroup: storageGroupSchema,
});
export type ConflictContainer = z.infer<typeof conflictContainerSchema>;

/** One rule broken at one place, with the containers on each side. */
export const locationConflictPairSchema = z.object({
  groups: z.tuple([storageGroupSchema, storageGroupSchema]),
  reason: z.string(),
  source: z.string(),
  first: z.array(conflictContainerSchema),
  second: z.array(conflictContainerSchema),
});
export type LocationConflictPair = z.infer<typeof locationConflictPairSchema>;

/** A place with at least one incompatible pair or a container it is not meant for. */
export const locationConflictSchema = z.object({
  location: z.object({ id: z.number().int(), name: z.string(), path: z.string() }),
  pairs: z.array(locationConflictPairSchema),
  /** Containers whose group is not among the place's intended groups. */
  mismatches: z.array(conflictContainerSchema),
});
export type LocationConflict = z.infer<typeof locationConflictSchema>;

/** `GET /api/segregation/conflicts`: every place with a conflict, by path. */
export const segregationConflictsResponseSchema = z.object({
  items: z.array(locationConflictSchema),
  total: z.number().int(),
  /** The line shown wherever this list appears. */
  notice: z.string(),
});
export type SegregationConflictsResponse = z.infer<typeof segregationConflictsResponseSchema>;
