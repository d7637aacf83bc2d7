import { z } from 'zod';
import { flammableStorageKindSchema } from './flammability';
import { storageGroupSchema } from './hazards';
import { listQuerySchema, maxPageSize } from './list';
import { nameSchema } from './names';
import { segregationWarningSchema } from './segregation';

/** What kind of place a location is; any depth is allowed (room > cabinet > shelf > box…). */
export const locationKinds = ['room', 'cabinet', 'shelf', 'fridge', 'other'] as const;
export const locationKindSchema = z.enum(locationKinds, {
  message: `must be one of: ${locationKinds.join(', ')}`,
});
export type LocationKind = (typeof locationKinds)[number];

/** Joins location names into a path: "Room 101 › Cabinet A › Shelf 2". */
export const locationPathSeparator = ' › ';

const locationFields = {
  name: nameSchema(120).refine(
    (name) => !name.includes('›'),
    'cannot contain › (it separates path parts)',
  ),
  kind: locationKindSchema,
  /** The place this one sits in; null for a top-level place (a room). */
  parentId: z.number({ message: 'must be a location id' }).int().positive().nullable(),
  /** Storage groups this place is meant for; empty means "not said". */
  storageGroups: z
    .array(storageGroupSchema)
    .max(9)
    .refine((list) => new Set(list).size === list.length, 'lists a storage group twice'),
  notes: z.string().max(2000, 'is at most 2000 characters'),
  /** An approved flammable-storage cabinet or safety-can place; null: neither. */
  flammableStorage: flammableStorageKindSchema.nullable(),
};

export const locationCreateSchema = z
  .object({
    ...locationFields,
    kind: locationFields.kind.default('other'),
    parentId: locationFields.parentId.default(null),
    storageGroups: locationFields.storageGroups.default([]),
    notes: locationFields.notes.default(''),
    flammableStorage: locationFields.flammableStorage.default(null),
  })
  .strict();
export type LocationCreate = z.input<typeof locationCreateSchema>;
export type LocationCreateParsed = z.output<typeof locationCreateSchema>;

/** Rename, re-purpose or move (`parentId`) a place. Moving under itself is refused (409). */
export const locationPatchSchema = z.object(locationFields).partial().strict();
export type LocationPatch = z.infer<typeof locationPatchSchema>;

export const locationSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  kind: locationKindSchema,
  parentId: z.number().int().nullable(),
  /** Names from the room down, joined by {@link locationPathSeparator}. */
  path: z.string(),
  /** 0 for a room, 1 for what sits in it, … */
  depth: z.number().int(),
  storageGroups: z.array(storageGroupSchema),
  notes: z.string(),
  flammableStorage: flammableStorageKindSchema.nullable(),
  /** Containers (not disposed) placed directly here. */
  containerCount: z.number().int(),
  childCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Location = z.infer<typeof locationSchema>;

/** `GET /api/locations/:id`: the place, its ancestors, children and segregation warnings. */
export const locationDetailSchema = locationSchema.extend({
  ancestors: z.array(z.object({ id: z.number().int(), name: z.string() })),
  children: z.array(locationSchema),
  /** Containers (not disposed) here and in every place below. */
  subtreeContainerCount: z.number().int(),
  warnings: z.array(segregationWarningSchema),
});
export type LocationDetail = z.infer<typeof locationDetailSchema>;

export const locationSortFields = ['path', 'name', 'updatedAt'] as const;

/**
 * `GET /api/locations`: all places by path (a lab has few, so the default page is the
 * largest). `parentId=0` lists rooms only.
 */
export const locationListQuerySchema = listQuerySchema(locationSortFields, 'path.asc').extend({
  pageSize: z.coerce
    .number()
    .int()
    .min(1)
    .max(maxPageSize, `pageSize is at most ${maxPageSize}`)
    .optional()
    .default(maxPageSize),
  parentId: z.coerce.number().int().min(0).optional(),
  storageGroup: storageGroupSchema.optional(),
});
export type LocationListQuery = z.infer<typeof locationListQuerySchema>;
