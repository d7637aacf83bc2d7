/** Label codes read `LW-` and at least five digits: LW-00042. */
export const labelCodePrefix = 'LW-';
const labelCodeDigits = 5;

/** The label code of label number `n`: 42 -> "LW-00042". */
export function formatLabelCode(n: number): string {
  return `${labelCodePrefix}${String(Math.trunc(n)).padStart(labelCodeDigits, '0')}`;
}

/**
 * The label number in what a person typed or a scanner read: "LW-00042", "lw-42", "LW 42"
 * -> 42; null when it is not a label code.
 */
export function parseLabelCode(text: string): number | null {
  const match = /^\s*lw[-\s]?(\d{1,12})\s*$/i.exec(text);
  if (!match) return null;
  const n = Number(match[1]);
  return n > 0 ? n : null;
}

/** "lw-42" -> "LW-00042"; null when it is not a label code. */
export function normalizeLabelCode(text: string): string | null {
  const n = parseLabelCode(text);
  return n === null ? null : formatLabelCode(n);
}

/**
 * A label code that is not an `LW-` code: one an import kept as written (the supplier's code or
 * the lab's own earlier one), up to 20 letters, digits and `- . _ /`.
 */
export const otherLabelCodePattern = /^[A-Za-z0-9][A-Za-z0-9._/-]{0,19}$/;

/**
 * The code to look a container up by: an `LW-` code in its canonical form ("lw-42" ->
 * "LW-00042"), another label code as written (trimmed), null for anything else.
 */
export function labelCodeToLookUp(text: string): string | null {
  const lotwise = normalizeLabelCode(text);
  if (lotwise) return lotwise;
  const other = text.trim();
  return otherLabelCodePattern.test(other) ? other : null;
}
