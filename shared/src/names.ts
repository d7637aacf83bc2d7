import { z } from 'zod';

/**
 * Characters a name may not hold: C0 and C1 control characters (NUL, tab, line breaks,
 * escape…) and the bidirectional embedding, override and isolate controls (U+202A–U+202E,
 * U+2066–U+2069), which make a name display as something other than what it stores
 * ("‮lonahte" reads "ethanol").
 */
// eslint-disable-next-line no-control-regex
const forbiddenInNames = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/u;

/**
 * What is wrong with a name's characters, or null when nothing is: names the first
 * forbidden character by its code point and position (1-based), since it is invisible.
 */
export function nameCharacterProblem(text: string): string | null {
  const match = forbiddenInNames.exec(text);
  if (!match) return null;
  const code = match[0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0');
  const kind = /[\u202a-\u202e\u2066-\u2069]/.test(match[0])
    ? 'a text-direction control'
    : 'a control character';
  return `cannot contain control characters or text-direction controls (found ${kind}, U+${code}, at character ${match.index + 1})`;
}

/** Refines a string schema so it refuses the characters of {@link nameCharacterProblem}. */
export function refuseControlCharacters<S extends z.ZodType<string | null>>(schema: S) {
  return schema.superRefine((value, ctx) => {
    const problem = typeof value === 'string' ? nameCharacterProblem(value) : null;
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
}

/**
 * The one schema for a name or title a person types (chemicals, synonyms, places, people,
 * procedures, portions…): trimmed, required, at most `max` characters, and free of control
 * and text-direction characters.
 */
export function nameSchema(max: number, required = 'is required') {
  return refuseControlCharacters(
    z.string().trim().min(1, required).max(max, `is at most ${max} characters`),
  );
}
