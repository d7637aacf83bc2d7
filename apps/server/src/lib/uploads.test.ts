import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { exeBytes, jpegBytes, tinyPdf, tinyPng } from '../test/sample-files';
import { describeTypes, detectFileType, safeFileName, withExtension } from './uploads';

const bytes = (...values: number[]) => Uint8Array.from(values);
const ascii = (text: string) => new TextEncoder().encode(text);

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-file-type-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
let n = 0;
/** The type detected for a file holding `content`. */
async function typeOf(content: Uint8Array) {
  const file = path.join(dir, `f${n++}`);
  writeFileSync(file, content);
  return detectFileType(file);
}

describe('file type by content', () => {
  it('when the first bytes are a PDF, PNG or JPEG signature, then that type is detected', async () => {
    expect(await typeOf(tinyPdf())).toEqual({ mime: 'application/pdf', ext: 'pdf' });
    expect(await typeOf(tinyPng())).toEqual({ mime: 'image/png', ext: 'png' });
    expect(await typeOf(jpegBytes())).toEqual({ mime: 'image/jpeg', ext: 'jpg' });
  });

  it('when the file is a program, a zip or text, then it is not taken for a document', async () => {
    expect((await typeOf(exeBytes()))?.mime ?? null).not.toMatch(/pdf|image/);
    const zip = await typeOf(bytes(0x50, 0x4b, 0x03, 0x04, ...new Array<number>(60).fill(0)));
    expect(zip?.mime ?? null).not.toMatch(/pdf|image/);
    expect(await typeOf(ascii('%PD'))).toBeNull();
    expect(await typeOf(ascii(' %PDF-'))).toBeNull();
    expect(await typeOf(new Uint8Array())).toBeNull();
  });

  it('when accepted types are named, then the message reads naturally', () => {
    expect(describeTypes(['application/pdf'])).toBe('a PDF');
    expect(describeTypes(['application/pdf', 'image/png', 'image/jpeg'])).toBe(
      'a PDF, PNG or JPEG',
    );
  });
});

describe('extensions follow the detected type', () => {
  it('when the name already ends in the type (any case, jpeg for jpg), then it is kept', () => {
    expect(withExtension('CoA lot 7.png', 'png')).toBe('CoA lot 7.png');
    expect(withExtension('scan.JPEG', 'jpg')).toBe('scan.JPEG');
    expect(withExtension('SDS.PDF', 'pdf')).toBe('SDS.PDF');
  });

  it('when the name ends in another type, then that extension is replaced; with none, one is added', () => {
    expect(withExtension('coa.pdf', 'png')).toBe('coa.png');
    expect(withExtension('certificate', 'pdf')).toBe('certificate.pdf');
    expect(withExtension('.pdf', 'png')).toBe('.pdf.png');
  });
});

describe('file names for storing and Content-Disposition', () => {
  it('when a name holds folders, control characters or quotes, then they are removed or replaced', () => {
    expect(safeFileName('../../etc/passwd', 'x.pdf')).toBe('passwd');
    expect(safeFileName('C:\\Users\\lab\\SDS ethanol.pdf', 'x.pdf')).toBe('SDS ethanol.pdf');
    expect(safeFileName('a"b\r\nc.pdf', 'x.pdf')).toBe('a_b__c.pdf');
    expect(safeFileName('  .hidden.pdf. ', 'x.pdf')).toBe('hidden.pdf');
    expect(safeFileName('', 'sds.pdf')).toBe('sds.pdf');
    expect(safeFileName(undefined, 'sds.pdf')).toBe('sds.pdf');
  });

  it('when a name is non-ASCII or very long, then letters stay and the extension survives', () => {
    expect(safeFileName('Sicherheitsdatenblatt Äthanol.pdf', 'x.pdf')).toBe(
      'Sicherheitsdatenblatt Äthanol.pdf',
    );
    const long = safeFileName(`${'a'.repeat(300)}.pdf`, 'x.pdf');
    expect(long).toHaveLength(200);
    expect(long.endsWith('.pdf')).toBe(true);
  });
});
