import { isElementSymbol } from './elements';
import { ChemError, type ChemErrorCode, type Result, toResult } from './errors';

/** Element symbol -> number of atoms (fractional only after a multiplier such as 0.5H2O). */
export type Composition = Record<string, number>;

/** Physical-state labels that may end a formula and are ignored: "HCl (aq)". */
export type StateLabel = 's' | 'l' | 'g' | 'aq';

/** One dot-separated part of a formula: "5H2O" in "CuSO4·5H2O". */
export interface FormulaPart {
  /** Leading multiplier, 1 when none was written (5 for "5H2O", 0.5 for "0.5H2O"). */
  multiplier: number;
  /** The part as normalized, multiplier included: "5H2O". */
  text: string;
  /** Atoms of the whole part, multiplier applied. */
  composition: Composition;
  /** 1-based character position where the part starts in the input. */
  position: number;
}

/** What {@link parseFormula} returns. */
export interface ParsedFormula {
  /** The text as given. */
  input: string;
  /**
   * The formula without whitespace or state label, with ASCII digits, parts joined by "·":
   * "CuSO4 . 5H2O" -> "CuSO4·5H2O", "HCl (aq)" -> "HCl".
   */
  normalized: string;
  /** Atoms per formula unit over all parts, keys in Hill order (C, H, then A-Z). */
  elements: Composition;
  /** The dot-separated parts (one for a formula without hydrate or adduct). */
  parts: FormulaPart[];
  /** The trailing state label that was ignored, when there was one. */
  state?: StateLabel;
  /** 1-based position of the first occurrence of each symbol, for error messages. */
  firstPosition: Record<string, number>;
}

/** Characters accepted between the parts of a hydrate or adduct. */
export const PART_SEPARATORS = ['·', '.', '*', '•', '∙', '⋅'] as const;

const SEPARATORS = new Set<string>(PART_SEPARATORS);
const CLOSER_OF: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
const OPENERS = new Set(Object.keys(CLOSER_OF));
const CLOSERS = new Set(Object.values(CLOSER_OF));
const STATE_SUFFIX = /\((s|l|g|aq)\)\s*$/;

function digitValue(char: string | undefined): number {
  if (char === undefined) return -1;
  const code = char.charCodeAt(0);
  if (code >= 0x30 && code <= 0x39) return code - 0x30;
  if (code >= 0x2080 && code <= 0x2089) return code - 0x2080; // subscript digits: H₂O
  return -1;
}

const isUpper = (char: string | undefined) => char !== undefined && char >= 'A' && char <= 'Z';
const isLower = (char: string | undefined) => char !== undefined && char >= 'a' && char <= 'z';
const SPACES = new Set([' ', '\t', '\n', '\r', '\u00a0', '\u202f', '\u2009']);
const isSpace = (char: string | undefined) => char !== undefined && SPACES.has(char);

function addInto(target: Composition, source: Composition, times: number): void {
  for (const [symbol, count] of Object.entries(source)) {
    target[symbol] = tidy((target[symbol] ?? 0) + count * times);
  }
}

// Float noise from multipliers such as 0.3 would otherwise show up as 0.8999999999.
function tidy(value: number): number {
  return Number.isInteger(value) ? value : Number(value.toPrecision(12));
}

/**
 * Hill order of a formula's symbols: with carbon, C then H then the rest A-Z; without
 * carbon, all A-Z.
 */
export function hillOrder(symbols: Iterable<string>): string[] {
  const all = [...new Set(symbols)];
  const hasCarbon = all.includes('C');
  const rest = all
    .filter((symbol) => !(hasCarbon && (symbol === 'C' || symbol === 'H')))
    .sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  if (!hasCarbon) return rest;
  return ['C', ...(all.includes('H') ? ['H'] : []), ...rest];
}

/**
 * Write a composition as a Hill-order formula: { H: 2, O: 1 } -> "H2O",
 * { C: 2, H: 6, O: 1 } -> "C2H6O". Counts of 1 are left out.
 */
export function hillFormula(composition: Composition): string {
  return hillOrder(Object.keys(composition))
    .map((symbol) => {
      const count = composition[symbol] ?? 0;
      return count === 1 ? symbol : `${symbol}${count}`;
    })
    .join('');
}

class Parser {
  private i = 0;
  private readonly end: number;
  readonly firstPosition: Record<string, number> = {};

  constructor(private readonly s: string) {
    this.end = s.length;
  }

  private fail(code: ChemErrorCode, message: string, index: number): ChemError {
    return new ChemError(code, message, { position: index + 1 });
  }

  private skipSpace(): void {
    while (this.i < this.end && isSpace(this.s[this.i])) this.i++;
  }

  private readDigits(): string {
    let digits = '';
    while (this.i < this.end) {
      const value = digitValue(this.s[this.i]);
      if (value < 0) break;
      digits += String(value);
      this.i++;
    }
    return digits;
  }

  /** A count written right after a symbol or a closing bracket; 1 when none. */
  private readCount(after: string): { value: number; text: string } {
    const start = this.i;
    const digits = this.readDigits();
    if (digits === '') return { value: 1, text: '' };
    const value = Number(digits);
    if (value === 0) {
      throw this.fail(
        'zero_count',
        `count 0 after "${after}" at position ${start + 1}: leave the count out for 1, or give 1 or more`,
        start,
      );
    }
    if (!Number.isSafeInteger(value)) {
      throw this.fail(
        'invalid_count',
        `count ${digits} at position ${start + 1} is too large`,
        start,
      );
    }
    // "C1.5H3", "C2H4.5O", "CuSO4.5H2O": a dot between two digits is either a decimal count
    // or a hydrate dot, and the two readings give different substances. Neither is guessed.
    if (this.s[this.i] === '.' && digitValue(this.s[this.i + 1]) >= 0) {
      const dot = this.i;
      const before = this.s.slice(0, dot);
      const after = this.s.slice(dot + 1);
      throw this.fail(
        'decimal_count',
        `"." at position ${dot + 1} stands between two digits ("${digits}.${this.s[dot + 1] ?? ''}"), so it could be a decimal count or a hydrate dot: counts in a formula are whole numbers, and a hydrate or adduct part is joined with "·", " . " or "*", e.g. "${before}·${after}"`,
        dot,
      );
    }
    // A written count of 1 ("C1H4") is left out of the normalized text.
    return { value, text: value === 1 ? '' : String(value) };
  }

  /** An optional leading multiplier of a part: "5" in "5H2O", "0.5" in "0.5H2O". */
  private readMultiplier(): { value: number; text: string } | null {
    const start = this.i;
    let digits = this.readDigits();
    if (digits === '') return null;
    // A decimal point belongs to the multiplier only when a digit follows ("0.5H2O");
    // otherwise "." is a part separator.
    if (this.s[this.i] === '.' && digitValue(this.s[this.i + 1]) >= 0) {
      this.i++;
      digits += `.${this.readDigits()}`;
    }
    const value = Number(digits);
    if (value === 0) {
      throw this.fail(
        'zero_count',
        `multiplier ${digits} at position ${start + 1} is zero: leave the part out or give a number above 0`,
        start,
      );
    }
    if (!Number.isFinite(value) || value > Number.MAX_SAFE_INTEGER) {
      throw this.fail(
        'invalid_count',
        `multiplier ${digits} at position ${start + 1} is too large`,
        start,
      );
    }
    return { value, text: value === 1 ? '' : String(value) };
  }

  private readSymbol(): string {
    const start = this.i;
    const first = this.s[this.i] ?? '';
    const second = this.s[this.i + 1];
    const symbol = isLower(second) ? first + second : first;
    if (!isElementSymbol(symbol)) {
      throw this.fail(
        'unknown_element',
        `unknown element "${symbol}" at position ${start + 1}`,
        start,
      );
    }
    this.i += symbol.length;
    if (this.firstPosition[symbol] === undefined) this.firstPosition[symbol] = start + 1;
    return symbol;
  }

  parse(): { parts: FormulaPart[] } {
    const parts: FormulaPart[] = [];
    let multiplierWritten = false;
    this.skipSpace();
    if (this.i >= this.end)
      throw new ChemError('empty_formula', 'formula is empty: enter one such as H2O');
    for (;;) {
      this.skipSpace();
      const partStart = this.i;
      const multiplier = this.readMultiplier();
      if (parts.length === 0) multiplierWritten = multiplier !== null;
      this.skipSpace();
      const part = this.readPart(partStart, multiplier);
      parts.push(part);
      if (this.i >= this.end) break;
      const separator = this.s[this.i] ?? '';
      const separatorIndex = this.i;
      this.i++;
      this.skipSpace();
      if (this.i >= this.end) {
        throw this.fail(
          'empty_part',
          `nothing after "${separator}" at position ${separatorIndex + 1}: remove it or add the rest of the formula`,
          separatorIndex,
        );
      }
    }
    const only = parts[0];
    if (parts.length === 1 && only !== undefined && multiplierWritten) {
      const start = only.position - 1;
      const bare = only.text.replace(/^[\d.]+/, '');
      throw this.fail(
        'leading_multiplier',
        `the number at position ${only.position} multiplies the whole formula ("${this.s.slice(start).trim()}" is ${String(only.multiplier)} formula units): a chemical's formula is one formula unit, so write "${bare}"; a leading number is read only on a hydrate or adduct part, as in "CuSO4·5H2O"`,
        start,
      );
    }
    return { parts };
  }

  private readPart(
    partStart: number,
    multiplier: { value: number; text: string } | null,
  ): FormulaPart {
    const stack: { composition: Composition; opener: string; index: number }[] = [
      { composition: {}, opener: '', index: partStart },
    ];
    let text = '';
    while (this.i < this.end) {
      const char = this.s[this.i] ?? '';
      if (SEPARATORS.has(char)) break;
      if (isSpace(char)) {
        this.i++;
        continue;
      }
      const top = stack[stack.length - 1];
      if (top === undefined) break;
      if (isUpper(char)) {
        const symbol = this.readSymbol();
        const count = this.readCount(symbol);
        top.composition[symbol] = (top.composition[symbol] ?? 0) + count.value;
        text += symbol + count.text;
      } else if (isLower(char)) {
        throw this.fail(
          'lowercase_element',
          `element symbols start with a capital letter: "${char}" at position ${this.i + 1}`,
          this.i,
        );
      } else if (OPENERS.has(char)) {
        stack.push({ composition: {}, opener: char, index: this.i });
        text += char;
        this.i++;
      } else if (CLOSERS.has(char)) {
        if (stack.length === 1) {
          throw this.fail(
            'unbalanced_parenthesis',
            `"${char}" at position ${this.i + 1} has no matching opening bracket: remove it or add the opening one`,
            this.i,
          );
        }
        const expected = CLOSER_OF[top.opener] ?? '';
        if (char !== expected) {
          throw this.fail(
            'unbalanced_parenthesis',
            `"${char}" at position ${this.i + 1} does not close "${top.opener}" opened at position ${top.index + 1}: use "${expected}"`,
            this.i,
          );
        }
        if (Object.keys(top.composition).length === 0) {
          throw this.fail(
            'empty_group',
            `empty brackets "${top.opener}${char}" at position ${top.index + 1}: put the group's atoms inside or remove them`,
            top.index,
          );
        }
        stack.pop();
        this.i++;
        const count = this.readCount(char);
        const parent = stack[stack.length - 1];
        if (parent !== undefined) addInto(parent.composition, top.composition, count.value);
        text += char + count.text;
      } else if (digitValue(char) >= 0) {
        const digits = this.readDigits();
        throw this.fail(
          'unexpected_character',
          `number "${digits}" at position ${this.i - digits.length + 1} must follow an element or a closing bracket; a hydrate is written with a dot, e.g. CuSO4·5H2O`,
          this.i - digits.length,
        );
      } else {
        throw this.fail(
          'unexpected_character',
          `unexpected character "${char}" at position ${this.i + 1}: a formula has element symbols, counts, brackets and "·" between hydrate parts`,
          this.i,
        );
      }
    }
    const unclosed = stack[stack.length - 1];
    if (stack.length > 1 && unclosed !== undefined) {
      throw this.fail(
        'unbalanced_parenthesis',
        `"${unclosed.opener}" at position ${unclosed.index + 1} is never closed: add "${CLOSER_OF[unclosed.opener] ?? ')'}"`,
        unclosed.index,
      );
    }
    const own = stack[0]?.composition ?? {};
    if (Object.keys(own).length === 0) {
      if (multiplier !== null) {
        throw this.fail(
          'empty_part',
          `multiplier ${multiplier.text} at position ${partStart + 1} is not followed by a formula`,
          partStart,
        );
      }
      const char = this.s[this.i] ?? '';
      throw this.fail(
        'empty_part',
        `nothing before "${char}" at position ${this.i + 1}: remove it or write the part it joins`,
        this.i,
      );
    }
    const composition: Composition = {};
    addInto(composition, own, multiplier?.value ?? 1);
    return {
      multiplier: multiplier?.value ?? 1,
      text: (multiplier?.text ?? '') + text,
      composition,
      position: partStart + 1,
    };
  }
}

function parseStrict(formula: string): ParsedFormula {
  if (typeof formula !== 'string') {
    throw new ChemError('empty_formula', 'formula is empty: enter one such as H2O');
  }
  // The state label sits at the end, so cutting it keeps every earlier position valid.
  const stateMatch = STATE_SUFFIX.exec(formula);
  const body = stateMatch ? formula.slice(0, stateMatch.index) : formula;
  const parser = new Parser(body);
  const { parts } = parser.parse();
  const total: Composition = {};
  for (const part of parts) addInto(total, part.composition, 1);
  const elements: Composition = {};
  for (const symbol of hillOrder(Object.keys(total))) elements[symbol] = total[symbol] ?? 0;
  const parsed: ParsedFormula = {
    input: formula,
    normalized: parts.map((part) => part.text).join('·'),
    elements,
    parts,
    firstPosition: parser.firstPosition,
  };
  if (stateMatch?.[1] !== undefined) parsed.state = stateMatch[1] as StateLabel;
  return parsed;
}

// Cost of a symbol when guessing the capitals of "nacl": the elements of everyday
// chemistry first, so that "co2" reads as CO2 and "cuso4" as CuSO4.
const EVERYDAY = new Set(['H', 'C', 'N', 'O', 'S', 'P', 'F', 'I', 'K', 'B']);
const COMMON = new Set([
  'Na', 'Cl', 'Br', 'Mg', 'Ca', 'Fe', 'Cu', 'Zn', 'Al', 'Si', 'Mn', 'Co', 'Ni', 'Ag', 'Sn',
  'Ba', 'Pb', 'Li', 'Cr', 'Hg', 'Sr',
]); // prettier-ignore
function symbolCost(symbol: string): number {
  if (EVERYDAY.has(symbol)) return 1;
  return COMMON.has(symbol) ? 2 : 3;
}

/** Capitalize a run of letters into element symbols, cheapest reading first; null if none. */
function recaseRun(run: string): string | null {
  const lower = run.toLowerCase();
  type Best = { cost: number; symbols: number; text: string };
  const best: (Best | null)[] = [{ cost: 0, symbols: 0, text: '' }];
  for (let end = 1; end <= lower.length; end++) {
    let choice: Best | null = null;
    for (const length of [1, 2]) {
      const previous = best[end - length];
      if (end - length < 0 || !previous) continue;
      const piece = lower.slice(end - length, end);
      const symbol = piece.charAt(0).toUpperCase() + piece.slice(1);
      if (!isElementSymbol(symbol)) continue;
      const candidate = {
        cost: previous.cost + symbolCost(symbol),
        symbols: previous.symbols + 1,
        text: previous.text + symbol,
      };
      // On equal cost prefer more, shorter symbols: "co" -> "CO" rather than "Co".
      if (
        !choice ||
        candidate.cost < choice.cost ||
        (candidate.cost === choice.cost && candidate.symbols > choice.symbols)
      ) {
        choice = candidate;
      }
    }
    best[end] = choice;
  }
  return best[lower.length]?.text ?? null;
}

/** A re-capitalized formula that parses ("nacl" -> "NaCl"), or undefined. */
function suggestCapitals(formula: string): string | undefined {
  let failed = false;
  const recased = formula.replace(/[A-Za-z]+/g, (run) => {
    if (/^(aq|s|l|g)$/.test(run)) return run;
    const fixed = recaseRun(run);
    if (fixed === null) failed = true;
    return fixed ?? run;
  });
  if (failed || recased === formula) return undefined;
  try {
    return parseStrict(recased).normalized;
  } catch {
    return undefined;
  }
}

/**
 * Parse a chemical formula into its element composition.
 *
 * Accepts element symbols of the whole periodic table (and D for deuterium), counts,
 * nested (), [] and {} groups with counts, hydrate and adduct parts joined by "·", ".", "*",
 * "•" (e.g. "CuSO4·5H2O", "CuSO4 . 5H2O", "CaSO4·0.5H2O"), a leading multiplier on a
 * hydrate or adduct part, subscript digits (H₂O), whitespace between tokens, and a trailing
 * state label "(s)", "(l)", "(g)" or "(aq)", which is ignored. Two readings are refused
 * rather than guessed: a "." between two digits ("C1.5H3", "CuSO4.5H2O": a decimal count or
 * a hydrate dot?) and a leading number on a formula without other parts ("2H2O": a
 * chemical's formula is one formula unit).
 *
 * @throws ChemError with a 1-based `position`: `empty_formula`, `unknown_element`
 *   (`unknown element "Xx" at position 5`), `lowercase_element` (with a `suggestion`
 *   such as "NaCl" for "nacl"), `unbalanced_parenthesis`, `empty_group`, `empty_part`,
 *   `zero_count`, `invalid_count`, `decimal_count`, `leading_multiplier`,
 *   `unexpected_character`.
 */
export function parseFormula(formula: string): ParsedFormula {
  try {
    return parseStrict(formula);
  } catch (error) {
    if (
      error instanceof ChemError &&
      (error.code === 'lowercase_element' || error.code === 'unknown_element')
    ) {
      const suggestion = suggestCapitals(formula);
      if (suggestion !== undefined) {
        throw new ChemError(error.code, `${error.message}; did you mean "${suggestion}"?`, {
          ...(error.position !== undefined ? { position: error.position } : {}),
          suggestion,
        });
      }
    }
    throw error;
  }
}

/**
 * The one form a formula is stored in: ASCII digits, no spaces, counts of 1 left out, hydrate
 * and adduct parts joined by "·", and a trailing state label kept as "(aq)". "CuSO₄ . 5H₂O",
 * "CuSO4*5H2O" and "CuSO4 · 5 H2O" all become "CuSO4·5H2O"; "HCl (aq)" becomes "HCl(aq)".
 *
 * @throws ChemError as {@link parseFormula}
 */
export function canonicalFormula(formula: string): string {
  const parsed = parseFormula(formula);
  return parsed.state === undefined ? parsed.normalized : `${parsed.normalized}(${parsed.state})`;
}

/** {@link parseFormula} as a {@link Result} instead of a throw. */
export function tryParseFormula(formula: string): Result<ParsedFormula> {
  return toResult(() => parseFormula(formula));
}
