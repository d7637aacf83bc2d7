import { ChemError } from './errors';

/** Peroxide-former classes (university EHS guidance). */
export type PeroxideFormerClass = 'A' | 'B' | 'C' | 'D';

/** Months after opening before an opened container must be tested or discarded, by class. */
export const PEROXIDE_OPENED_MONTHS: Readonly<Record<PeroxideFormerClass, number>> = {
  A: 3, // EHS peroxide-former guidance: class A, 3 months after opening
  B: 12, // EHS peroxide-former guidance: class B, 12 months
  C: 12, // EHS peroxide-former guidance: class C inhibited, 12 months (uninhibited: 24 hours)
  D: 12, // EHS peroxide-former guidance: class D, 12 months
};

/** Months an unopened container may be kept, unless the maker's expiry comes first. */
export const PEROXIDE_UNOPENED_MONTHS = 18; // EHS peroxide-former guidance: unopened, 18 months

/** What the test-or-discard date is counted from. */
export type PeroxideBasis = 'opened' | 'unopened' | 'expiry';

export interface PeroxideDue {
  /** ISO date (YYYY-MM-DD) by which the container is tested or discarded. */
  dueOn: string;
  basis: PeroxideBasis;
  /** One sentence saying how the date was found. */
  rule: string;
}

export interface PeroxideInput {
  peroxideClass: PeroxideFormerClass;
  /** ISO date the container was first opened; null while sealed. */
  openedOn: string | null;
  /** ISO date the lot was received. */
  receivedOn: string;
  /** The maker's expiry date, if any. */
  expiresOn?: string | null;
  /** Class C only: false for an uninhibited monomer (24 hours after opening). Default true. */
  inhibited?: boolean;
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function parseDate(text: string, what: string): Date {
  const match = ISO_DATE.exec(typeof text === 'string' ? text.slice(0, 10) : '');
  const date = match ? new Date(Date.UTC(+match[1]!, +match[2]! - 1, +match[3]!)) : null;
  if (!date || Number.isNaN(date.getTime()) || date.getUTCDate() !== +match![3]!) {
    throw new ChemError(
      'invalid_date',
      `${what} "${String(text)}" is not a date; use a form such as 2025-03-01`,
    );
  }
  return date;
}

function isoDate(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/**
 * An ISO date `months` later; a day that does not exist in the target month becomes that
 * month's last day (2025-08-31 + 6 months = 2026-02-28).
 *
 * @throws ChemError `invalid_date`
 */
export function addMonths(date: string, months: number): string {
  const start = parseDate(date, 'date');
  const year = start.getUTCFullYear();
  const month = start.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  return isoDate(new Date(Date.UTC(year, month, Math.min(start.getUTCDate(), lastDay))));
}

/** An ISO date `days` later (negative for earlier). @throws ChemError `invalid_date` */
export function addDays(date: string, days: number): string {
  const start = parseDate(date, 'date');
  return isoDate(new Date(start.getTime() + days * 86_400_000));
}

/**
 * The date by which a peroxide-forming container is tested for peroxides or discarded.
 * Opened: class A 3 months, B and D 12 months, C 12 months when inhibited (1 day when not)
 * after opening. Unopened: 18 months after receipt, or the maker's expiry when that is
 * earlier. Guidance only: local rules and the SDS decide.
 *
 * @throws ChemError `invalid_date`
 */
export function peroxideTestDue(input: PeroxideInput): PeroxideDue {
  if (input.openedOn) {
    if (input.peroxideClass === 'C' && input.inhibited === false) {
      return {
        dueOn: addDays(input.openedOn, 1),
        basis: 'opened',
        rule: 'Class C, uninhibited: use or discard within 24 hours of opening.',
      };
    }
    const months = PEROXIDE_OPENED_MONTHS[input.peroxideClass];
    return {
      dueOn: addMonths(input.openedOn, months),
      basis: 'opened',
      rule: `Class ${input.peroxideClass}: test or discard ${months} months after opening.`,
    };
  }
  const unopened = addMonths(input.receivedOn, PEROXIDE_UNOPENED_MONTHS);
  if (input.expiresOn) {
    const expiry = isoDate(parseDate(input.expiresOn, 'expiry date'));
    if (expiry < unopened) {
      return {
        dueOn: expiry,
        basis: 'expiry',
        rule: "Unopened: the maker's expiry date comes first.",
      };
    }
  }
  return {
    dueOn: unopened,
    basis: 'unopened',
    rule: `Unopened: test or discard ${PEROXIDE_UNOPENED_MONTHS} months after receipt.`,
  };
}
