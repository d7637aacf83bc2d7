// Temporary stub: replaced by the real implementation.
export class ChemError extends Error {
  constructor(
    public readonly code: string,
    message: string,
    public readonly position?: number,
  ) {
    super(message);
  }
}
export type Result<T> = { ok: true; value: T } | { ok: false; error: ChemError };
export function tryMolarMass(formula: string): Result<number> {
  return formula.length ? { ok: true, value: 1 } : { ok: false, error: new ChemError('empty_formula', 'formula is empty') };
}
export function validateCasNumber(cas: string): { valid: true } | { valid: false; reason: string } {
  return /^\d{2,7}-\d{2}-\d$/.test(cas) ? { valid: true } : { valid: false, reason: 'bad' };
}
