import { describe, expect, it } from 'vitest';
import {
  csvField,
  csvLine,
  decodeText,
  detectDelimiter,
  escapeFormula,
  parseCsv,
  unescapeFormula,
} from './csv';

describe('formula escaping', () => {
  it('when a cell starts with = + - @, a tab or a carriage return, then it gets a leading apostrophe', () => {
    expect(escapeFormula('=HYPERLINK("http://x.example.test","click")')).toBe(
      `'=HYPERLINK("http://x.example.test","click")`,
    );
    expect(escapeFormula('+1')).toBe("'+1");
    expect(escapeFormula('-2')).toBe("'-2");
    expect(escapeFormula('@SUM(A1:A9)')).toBe("'@SUM(A1:A9)");
    expect(escapeFormula('\t=1')).toBe("'\t=1");
    expect(escapeFormula('\r=1')).toBe("'\r=1");
  });

  it('when a cell starts otherwise, then it is left alone', () => {
    for (const cell of ['', 'Ethanol', '2-Propanol', 'H300+H310', '(-)-Menthol', ' =1', "'=1"]) {
      expect(escapeFormula(cell)).toBe(cell);
    }
  });

  it('when an escaped cell is read back, then the apostrophe goes and nothing else changes', () => {
    for (const cell of ['=1+2', '+1', '-2', '@SUM(A1)', 'Ethanol', "'quoted", "'"]) {
      expect(unescapeFormula(escapeFormula(cell))).toBe(cell);
    }
  });
});

describe('RFC 4180 fields', () => {
  it('when a value holds a comma, a quote or a line break, then it is quoted with quotes doubled', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('cr\rhere')).toBe('"cr\rhere"');
    expect(csvField('plain')).toBe('plain');
    expect(csvField(null)).toBe('');
    expect(csvField(0.5)).toBe('0.5');
    expect(csvField(true)).toBe('true');
  });

  it('when a formula also needs quoting, then it is escaped first and quoted after', () => {
    expect(csvField('=HYPERLINK("x","y")')).toBe(`"'=HYPERLINK(""x"",""y"")"`);
    expect(csvLine(['-2', 'a,b', null])).toBe(`'-2,"a,b",\r\n`);
  });

  it('when lines are written and parsed again, then every value comes back', () => {
    const values = ['a,b', 'say "hi"', 'two\r\nlines', '', 'µL', 'Ü'];
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
