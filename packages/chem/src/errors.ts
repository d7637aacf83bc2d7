/**
 * Codes of every error packages/chem raises. Snake case, stable: the server maps them to
 * its own error codes and the web page may branch on them.
 */
export const CHEM_ERROR_CODES = [
  'empty_formula',
  'empty_part',
  'empty_group',
  'unknown_element',
  'lowercase_element',
  'unbalanced_parenthesis',
  'unexpected_character',
  'zero_count',
  'invalid_count',
  'decimal_count',
  'leading_multiplier',
  'no_standard_atomic_weight',
  'unknown_unit',
  'incompatible_units',
  'not_a_number',
  'negative_quantity',
  'not_positive',
  'out_of_range',
  'density_missing',
  'bulk_density_missing',
  'molar_mass_missing',
  'quantity_missing',
  'conflicting_inputs',
  'invalid_factor',
  'factor_too_small',
  'impossible_dilution',
  'no_limiting_reagent',
  'invalid_weights',
  'invalid_integer',
  'invalid_date',
] as const;

/** One of {@link CHEM_ERROR_CODES}. */
export type ChemErrorCode = (typeof CHEM_ERROR_CODES)[number];

/** Extra facts about an error, for a caller that wants to point at the problem. */
export interface ChemErrorDetails {
  /** 1-based character position in the formula (or other text) that was parsed. */
  position?: number;
  /** A corrected input the person probably meant, e.g. "NaCl" for "nacl". */
  suggestion?: string;
  /** 0-based index of the procedure line the error is about. */
  lineIndex?: number;
}

/**
 * The one error type of packages/chem: a domain error whose message a person can act on
 * (it names the problem and, where possible, the fix), with a stable {@link ChemErrorCode}.
 */
export class ChemError extends Error {
  /** Stable machine-readable code. */
  readonly code: ChemErrorCode;
  /** 1-based character position of the problem in a parsed text, when there is one. */
  readonly position?: number;
  /** A corrected input the person probably meant, when one can be guessed. */
  readonly suggestion?: string;
  /** 0-based index of the procedure line concerned, for stoichiometry and scaling. */
  readonly lineIndex?: number;

  /**
   * @param code stable code, one of {@link CHEM_ERROR_CODES}
   * @param message sentence a person can act on, e.g. `unknown element "Xx" at position 5`
   * @param details position, suggestion, line index
   */
  constructor(code: ChemErrorCode, message: string, details: ChemErrorDetails = {}) {
    super(message);
    this.name = 'ChemError';
    this.code = code;
    if (details.position !== undefined) this.position = details.position;
    if (details.suggestion !== undefined) this.suggestion = details.suggestion;
    if (details.lineIndex !== undefined) this.lineIndex = details.lineIndex;
  }
}

/** Outcome of a `try…` function: a value, or the {@link ChemError} that a throwing twin would raise. */
export type Result<T> = { ok: true; value: T } | { ok: false; error: ChemError };

/**
 * Run `fn` and wrap its outcome in a {@link Result}. Only a {@link ChemError} becomes
 * `{ ok: false }`; any other exception is a bug and is re-thrown.
 */
export function toResult<T>(fn: () => T): Result<T> {
  try {
    return { ok: true, value: fn() };
  } catch (error) {
    if (error instanceof ChemError) return { ok: false, error };
    throw error;
  }
}
