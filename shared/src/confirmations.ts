import { z } from 'zod';
import { stockUnitSchema } from './chemicals';
import { storageGroupSchema } from './hazards';
import { segregationWarningCodes } from './segregation';

/**
 * A write that needs a person's confirmation is answered 409 `confirmation_required` with
 * what needs confirming in `error.warnings`; the client shows them and sends the same request
 * again with `confirm: true`. Nothing is written before that.
 */
export const confirmFieldSchema = z
  .boolean({ message: 'must be true or false' })
  .optional()
  .default(false);

/** A draw would leave a plan less than it holds in a container. */
export const holdWarningSchema = z.object({
  kind: z.literal('hold'),
  /** One sentence naming the plan, the container and what the plan loses. */
  message: z.string(),
  planId: z.number().int(),
  planTitle: z.string(),
  plannedOn: z.string(),
  /** The hold lasts to the end of this day. */
  until: z.string(),
  containerId: z.number().int(),
  labelCode: z.string(),
  /** Held for the plan now, and what would be left of it after the write (container's unit). */
  heldBefore: z.number(),
  heldAfter: z.number(),
  /** heldBefore − heldAfter. */
  loses: z.number(),
  unit: stockUnitSchema,
});
export type HoldWarning = z.infer<typeof holdWarningSchema>;

/** Putting a container in a place breaks a storage rule (incompatible groups, or not meant for it). */
export const storageConflictWarningSchema = z.object({
  kind: z.literal('storage_conflict'),
  /** One sentence: "Acetic acid (organic acid) and sodium hydroxide (base) must be kept apart: …". */
  message: z.string(),
  code: z.enum(segregationWarningCodes),
  /** The rule's reason in plain words. */
  reason: z.string(),
  source: z.string().nullable(),
  groups: z.array(storageGroupSchema),
  locationId: z.number().int(),
  locationPath: z.string(),
  /** Label codes of the containers already there that conflict. */
  labelCodes: z.array(z.string()),
});
export type StorageConflictWarning = z.infer<typeof storageConflictWarningSchema>;

/**
 * Receiving, moving or splitting a container would take a lab area over one of its
 * flammable-liquid limits (or further over it).
 */
export const flammableLimitWarningSchema = z.object({
  kind: z.literal('flammable_limit'),
  /** One sentence: "Room 101 would hold 41.2 L of Class I liquids; its limit is 37.9 L (…)". */
  message: z.string(),
  labAreaId: z.number().int(),
  labAreaName: z.string(),
  /** Which limit, in words: "Class I liquids, cabinets and safety cans included". */
  limit: z.string(),
  heldLitres: z.number(),
  afterLitres: z.number(),
  limitLitres: z.number(),
  /** The rule set's name, edition and table, e.g. "NFPA 45 (2024), Table 9.1.1". */
  source: z.string(),
});
export type FlammableLimitWarning = z.infer<typeof flammableLimitWarningSchema>;

/** A flammable or combustible liquid in a container larger than its class and material allow. */
export const containerSizeWarningSchema = z.object({
  kind: z.literal('container_size'),
  message: z.string(),
  liquidClass: z.string(),
  material: z.string(),
  capacityLitres: z.number(),
  limitLitres: z.number(),
  source: z.string(),
});
export type ContainerSizeWarning = z.infer<typeof containerSizeWarningSchema>;

export const confirmationWarningSchema = z.discriminatedUnion('kind', [
  holdWarningSchema,
  storageConflictWarningSchema,
  flammableLimitWarningSchema,
  containerSizeWarningSchema,
]);
export type ConfirmationWarning = z.infer<typeof confirmationWarningSchema>;

/** A hold on a container: part of it reserved for a plan until a date. */
export const containerHoldSchema = z.object({
  reservationId: z.number().int(),
  planId: z.number().int(),
  planTitle: z.string(),
  plannedOn: z.string(),
  until: z.string(),
  /** What the hold protects now: never more than is left of it in the container. */
  quantity: z.number(),
  /** What was reserved; more than `quantity` when the container was drawn down since. */
  reservedQuantity: z.number(),
  unit: stockUnitSchema,
});
export type ContainerHold = z.infer<typeof containerHoldSchema>;

/** A reservation as the hold rule needs it. */
export interface HoldClaim {
  id: number;
  quantity: number;
}

/**
 * What each reservation on a container holds when the container has `quantity` left:
 * reservations keep their amount in the order they were made (lowest id first), so the
 * newest gives way first when stock runs below what was reserved, and together they never
 * hold more than the container has.
 */
export function allocateHolds(quantity: number, claims: readonly HoldClaim[]): Map<number, number> {
  const held = new Map<number, number>();
  let left = Math.max(0, quantity);
  for (const claim of [...claims].sort((a, b) => a.id - b.id)) {
    const amount = Math.min(claim.quantity, left);
    held.set(claim.id, amount);
    left -= amount;
  }
  return held;
}

/**
 * What a draw of `drawn` from a container holding `quantity` takes from each reservation:
 * reservation id -> [held before, held after], only those that lose something.
 */
export function holdsTakenBy(
  quantity: number,
  drawn: number,
  claims: readonly HoldClaim[],
  tolerance = 1e-6,
): Map<number, [number, number]> {
  const before = allocateHolds(quantity, claims);
  const after = allocateHolds(quantity - drawn, claims);
  const taken = new Map<number, [number, number]>();
  for (const [id, was] of before) {
    const now = after.get(id) ?? 0;
    if (was - now > tolerance) taken.set(id, [was, now]);
  }
  return taken;
}
