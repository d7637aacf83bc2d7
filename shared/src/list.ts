import { z } from 'zod';

export const maxPageSize = 200;

/**
 * Builds the query schema of a list endpoint: `?q=&sort=field.asc&page=&pageSize=`.
 * `sortFields` is the closed list of fields the endpoint can sort by.
 */
export function listQuerySchema<const F extends readonly [string, ...string[]]>(
  sortFields: F,
  defaultSort: `${F[number]}.${'asc' | 'desc'}`,
) {
  const sortValues = sortFields.flatMap((f) => [`${f}.asc`, `${f}.desc`]) as [string, ...string[]];
  return z.object({
    q: z.string().trim().max(200).optional().default(''),
    sort: z
      .enum(sortValues, { message: `sort must be one of: ${sortValues.join(', ')}` })
      .optional()
      .default(defaultSort),
    page: z.coerce.number().int().min(1, 'page starts at 1').optional().default(1),
    pageSize: z.coerce
      .number()
      .int()
      .min(1)
      .max(maxPageSize, `pageSize is at most ${maxPageSize}`)
      .optional()
      .default(25),
  });
}

/** Splits `field.dir` into its parts. */
export function parseSort(sort: string): { field: string; direction: 'asc' | 'desc' } {
  const dot = sort.lastIndexOf('.');
  return { field: sort.slice(0, dot), direction: sort.slice(dot + 1) === 'desc' ? 'desc' : 'asc' };
}

/** Shape of every list response. */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({
    items: z.array(item),
    total: z.number().int(),
    page: z.number().int(),
    pageSize: z.number().int(),
  });
}
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** A yes/no query parameter: `true`/`false` (also `1`/`0`). */
export const queryFlagSchema = z
  .enum(['true', 'false', '1', '0'], { message: 'must be true or false' })
  .transform((value) => value === 'true' || value === '1');
