import { requireFinite } from './validation';

/** Where a total stands against a reorder point: below, at, ok, or none (no reorder point). */
export type ReorderState = 'below' | 'at' | 'ok' | 'none';

/**
 * Reorder status of a usable total. "at" is within a millionth of the reorder point (float
 * sums); a lab reorders at or below it.
 */
export function reorderState(total: number, reorderPoint: number | null): ReorderState {
  if (reorderPoint === null) return 'none';
  requireFinite(total, 'total');
  const tolerance = Math.max(1e-9, Math.abs(reorderPoint) * 1e-6);
  if (Math.abs(total - reorderPoint) <= tolerance) return 'at';
  return total < reorderPoint ? 'below' : 'ok';
}
