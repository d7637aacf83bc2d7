import { describe, expect, it } from 'vitest';
import { csvLine, csvLines, decodeText, detectDelimiter, parseCsv, unescapeFormula } from './csv';

/** The one field of a one-field record, as written (without the CRLF). */
const field = (value: string | number | boolean | null) => csvLine([value]).replace(/\r\n$/, '');

describe('formula escaping', () => {
  it('when a cell starts with = + - @, a tab or a carriage return, then it gets a leading apostrophe', () => {
    expect(field('=HYPERLINK("http://x.example.test","click")')).toBe(
      `"'=HYPERLINK(""http://x.example.test"",""click"")"`,
    );
    expect(field('+1')).toBe("'+1");
    expect(field('-2')).toBe("'-2");
    expect(field('@SUM(A1:A9)')).toBe("'@SUM(A1:A9)");
    expect(field('\t=1')).toBe("'\t=1");
    expect(field('\r=1')).toBe(`"'\r=1"`);
    expect(field('\uFF1D1+1')).toBe("'\uFF1D1+1"); // full-width equals sign
  });

  it('when a cell starts otherwise, or is a negative number, then it is left alone', () => {
    for (const cell of ['Ethanol', '2-Propanol', 'H300+H310', '(-)-Menthol', ' =1', "'=1"]) {
      expect(field(cell)).toBe(cell);
    }
    expect(field(-2.5)).toBe('-2.5');
  });

  it('when an escaped cell is read back, then the apostrophe goes and nothing else changes', () => {
    for (const cell of ['=1+2', '+1', '-2', '@SUM(A1)', 'Ethanol', "'quoted", "'", '\uFF20x']) {
      const written = parseCsv(csvLine([cell])).records[0]![0]!;
      expect(unescapeFormula(written)).toBe(cell);
    }
  });
});

describe('RFC 4180 fields', () => {
  it('when a value holds a comma, a quote or a line break, then it is quoted with quotes doubled', () => {
    expect(field('a,b')).toBe('"a,b"');
    expect(field('say "hi"')).toBe('"say ""hi"""');
    expect(field('two\nlines')).toBe('"two\nlines"');
    expect(field('cr\rhere')).toBe('"cr\rhere"');
    expect(field('plain')).toBe('plain');
    expect(field(null)).toBe('');
    expect(field(0.5)).toBe('0.5');
    expect(field(true)).toBe('true');
  });

  it('when a value holds a semicolon, then it is quoted (spreadsheets set to ";" keep it in one cell)', () => {
    expect(field('Shelf A; top')).toBe('"Shelf A; top"');
    expect(csvLine(['a;b', 'c'])).toBe('"a;b",c\r\n');
  });

  it('when a formula also needs quoting, then it is escaped first and quoted after', () => {
    expect(field('=HYPERLINK("x","y")')).toBe(`"'=HYPERLINK(""x"",""y"")"`);
    expect(csvLine(['-2', 'a,b', null])).toBe(`'-2,"a,b",\r\n`);
  });

  it('when several records are written, then each ends in CRLF', () => {
    expect(
      csvLines([
        ['a', 1],
        ['b', 2],
      ]),
    ).toBe('a,1\r\nb,2\r\n');
    expect(csvLines([])).toBe('');
  });

  it('when lines are written and parsed again, then every value comes back', () => {
    const values = ['a,b', 'say "hi"', 'two\r\nlines', '', 'µL', 'Ü', 'x;y'];
    const { records } = parseCsv(csvLine(values) + csvLine(['x']));
    expect(records[0]).toEqual(values);
    expect(records[1]).toEqual(['x']);
  });
});

describe('reading files', () => {
  it('when the header is separated by semicolons or tabs, then that is the delimiter', () => {
    expect(detectDelimiter('a;b;c\n1,5;2;3')).toBe(';');
    expect(detectDelimiter('a\tb\tc')).toBe('\t');
    expect(detectDelimiter('"x;y",b,c')).toBe(',');
  });

  it('when the bytes are UTF-8 with a mark, or Windows-1252, then the text is right', () => {
    const utf8 = new TextEncoder().encode('\uFEFFName\nµL');
    expect(parseCsv(decodeText(utf8)).records[0]).toEqual(['Name']);
    const cp1252 = Uint8Array.from([0x4e, 0xe4, 0x0a]); // "Nä\n"
    expect(decodeText(cp1252)).toBe('Nä\n');
  });

  it('when blank lines sit between rows, then they stay as records so row numbers match the sheet', () => {
    const { records } = parseCsv('h1,h2\r\n\r\na,b\r\n');
    expect(records).toEqual([['h1', 'h2'], [''], ['a', 'b']]);
  });
});
