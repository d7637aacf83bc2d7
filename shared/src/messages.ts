import { z } from 'zod';

/** The parts of a zod issue the wording reads. */
interface NumberIssue {
  code?: string;
  expected?: string;
  origin?: string;
  minimum?: unknown;
  maximum?: unknown;
  inclusive?: boolean;
  divisor?: unknown;
}

/**
 * The one wording of a problem with a number, for every schema in Lotwise: "must be a
 * number", "must be at least 1", "must be more than 0", "must be at most 500", "must be a
 * whole number". Undefined for anything else, so zod's own message (or a check's own) stays.
 *
 * A message given to `z.number({ message })` would stand for every problem of that number,
 * a range too ("0" benches read "must be a number"); {@link numberSchema} gives its message
 * to a missing or non-numeric value only.
 */
export function numberIssueMessage(issue: NumberIssue, notANumber = 'must be a number') {
  if (issue.code === 'invalid_type') {
    if (issue.expected === 'number') return notANumber;
    if (issue.expected === 'int') return 'must be a whole number';
    return undefined;
  }
  if (issue.origin !== 'number') return undefined;
  if (issue.code === 'too_small') {
    return issue.inclusive
      ? `must be at least ${String(issue.minimum)}`
      : `must be more than ${String(issue.minimum)}`;
  }
  if (issue.code === 'too_big') {
    return issue.inclusive
      ? `must be at most ${String(issue.maximum)}`
      : `must be less than ${String(issue.maximum)}`;
  }
  if (issue.code === 'not_multiple_of') return `must be a multiple of ${String(issue.divisor)}`;
  return undefined;
}

/**
 * A number field: `notANumber` when the value is missing or not a number, and the words of
 * {@link numberIssueMessage} for a range it is outside of (a check's own message wins).
 */
export function numberSchema(notANumber = 'must be a number') {
  return z.number({ error: (issue) => numberIssueMessage(issue, notANumber) });
}

// Numbers without a schema of their own (query strings, ids) get the same words.
z.config({ customError: (issue) => numberIssueMessage(issue) });
