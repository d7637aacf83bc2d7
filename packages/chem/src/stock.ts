import { roundMassForDisplay, roundVolumeForDisplay } from './scaling';
import { requireFinite } from './validation';

/** A stock total for reading, e.g. { value: 2.5, unit: 'L', text: '2.5 L' }. */
export interface StockDisplay {
  value: number;
  unit: string;
  text: string;
}

function trimmed(value: number, figures: number): string {
  return String(Number(value.toPrecision(figures)));
}

/**
 * A stock total in g or mL in a unit a person reads at a glance: from 1000 g (mL) in kg (L)
 * to 3 significant figures, below 1 g (mL) in mg (µL) to 3 significant figures, otherwise by
 * the balance or glassware rule of `roundMassForDisplay` / `roundVolumeForDisplay`.
 * // common practice, no source
 */
export function stockDisplay(quantity: number, unit: 'g' | 'mL'): StockDisplay {
  requireFinite(quantity, 'quantity');
  const size = Math.abs(quantity);
  const big = unit === 'g' ? 'kg' : 'L';
  const small = unit === 'g' ? 'mg' : 'µL';
  if (size >= 1000) {
    const text = trimmed(quantity / 1000, 3);
    return { value: Number(text), unit: big, text: `${text} ${big}` };
  }
  if (size > 0 && size < 1) {
    const text = trimmed(quantity * 1000, 3);
    return { value: Number(text), unit: small, text: `${text} ${small}` };
  }
  const rounded = unit === 'g' ? roundMassForDisplay(quantity) : roundVolumeForDisplay(quantity);
  return { value: rounded.value, unit, text: rounded.text };
}

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
