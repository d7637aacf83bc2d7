/**
 * A number typed by a person: spaces ignored, a decimal comma accepted. Empty text is `null`;
 * anything else that is not a finite number is `NaN`, so the form can say so.
 */
export function parseDecimal(text: string | null | undefined): number | null {
  const trimmed = (text ?? '').replace(/\s+/g, '');
  if (trimmed === '') return null;
  const normalized = /^-?\d+,\d+$/.test(trimmed) ? trimmed.replace(',', '.') : trimmed;
  const value = Number(normalized);
  return Number.isFinite(value) ? value : Number.NaN;
}
