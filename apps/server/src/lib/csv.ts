import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';

/**
 * Characters that make a spreadsheet read a cell as a formula (or hide what follows): the
 * set csv-stringify's `escape_formulas` prefixes with `'`, full-width forms included.
 */
const formulaStart = /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;

/** Undoes the formula escaping of the writer on a cell read back from a file Lotwise wrote. */
export function unescapeFormula(cell: string): string {
  return cell.length > 1 && cell[0] === "'" && formulaStart.test(cell.slice(1))
    ? cell.slice(1)
    : cell;
}

export type CsvValue = string | number | boolean | null | undefined;

/**
 * RFC 4180 as spreadsheets read it: CRLF between records; fields holding a comma, a quote,
 * a line break or a semicolon (the list separator of many locales, where a spreadsheet would
 * split the cell) quoted with quotes doubled; a cell starting with `=`, `+`, `-`, `@`, a tab
 * or a carriage return gets a leading `'` so it is shown as text and never run (a negative
 * number stays a number).
 */
const writerOptions = {
  record_delimiter: '\r\n',
  // Also quote a lone CR or LF inside a field (an explicit record delimiter turns that off).
  quote_record_delimiter: true,
  quoted_match: /;/,
  escape_formulas: true,
  cast: { boolean: (value: boolean) => String(value) },
} as const;

/** CSV records, each ending in CRLF (csv-stringify). */
export function csvLines(records: readonly (readonly CsvValue[])[]): string {
  if (records.length === 0) return '';
  return stringify(records as CsvValue[][], writerOptions);
}

/** One CSV record ending in CRLF. */
export function csvLine(values: readonly CsvValue[]): string {
  return csvLines([values]);
}

/** Written first so spreadsheet programs read the file as UTF-8. */
export const utf8Bom = '\uFEFF';

/**
 * Text of an uploaded file: UTF-8 (with or without a byte-order mark), else Windows-1252,
 * which is what older spreadsheet programs save as "CSV".
 */
export function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

/** The delimiter of the header line: comma, semicolon or tab, whichever appears most outside quotes. */
export function detectDelimiter(text: string): ',' | ';' | '\t' {
  const counts = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const char of text) {
    if (char === '"') quoted = !quoted;
    else if (!quoted && (char === '\n' || char === '\r')) break;
    else if (!quoted && char in counts) counts[char as keyof typeof counts]++;
  }
  if (counts[';'] > counts[','] && counts[';'] >= counts['\t']) return ';';
  if (counts['\t'] > counts[',']) return '\t';
  return ',';
}

export interface ParsedCsv {
  delimiter: ',' | ';' | '\t';
  /** Every record, the header first; a blank line is a record of one empty field. */
  records: string[][];
}

/** Thrown when the text is not readable as CSV (e.g. an unclosed quote), with the line. */
export class CsvSyntaxError extends Error {
  override name = 'CsvSyntaxError';
  constructor(
    message: string,
    public readonly line: number | null,
  ) {
    super(message);
  }
}

/**
 * Parses CSV text with csv-parse. Blank lines are kept as records, so record `i` is row
 * `i + 1` of the spreadsheet; rows may have fewer or more fields than the header.
 */
export function parseCsv(text: string): ParsedCsv {
  const delimiter = detectDelimiter(text.replace(/^\uFEFF/, ''));
  try {
    const records = parse(text, {
      bom: true,
      delimiter,
      relax_column_count: true,
      skip_empty_lines: false,
    }) as string[][];
    return { delimiter, records };
  } catch (error) {
    const e = error as { message?: string; lines?: number };
    throw new CsvSyntaxError(
      e.message ?? 'The file could not be read as CSV.',
      typeof e.lines === 'number' ? e.lines : null,
    );
  }
}
