import { describe, expect, it } from 'vitest';
import { describeTypes, detectContentType, safeFileName } from './uploads';

const bytes = (...values: number[]) => Uint8Array.from(values);
const ascii = (text: string) => new TextEncoder().encode(text);

describe('file type by content', () => {
  it('when the first bytes are a PDF, PNG or JPEG signature, then that type is detected', () => {
    expect(detectContentType(ascii('%PDF-1.7\n'))).toBe('application/pdf');
    expect(detectContentType(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0))).toBe(
      'image/png',
    );
    expect(detectContentType(bytes(0xff, 0xd8, 0xff, 0xe0))).toBe('image/jpeg');
  });

  it('when the file is a program, a zip or text, then nothing is detected', () => {
    expect(detectContentType(ascii('MZ\x90\x00'))).toBeNull();
    expect(detectContentType(bytes(0x50, 0x4b, 0x03, 0x04))).toBeNull();
    expect(detectContentType(ascii('%PD'))).toBeNull();
    expect(detectContentType(ascii(' %PDF-'))).toBeNull();
    expect(detectContentType(new Uint8Array())).toBeNull();
  });

  it('when accepted types are named, then the message reads naturally', () => {
    expect(describeTypes(['application/pdf'])).toBe('a PDF');
    expect(describeTypes(['application/pdf', 'image/png', 'image/jpeg'])).toBe(
      'a PDF, PNG or JPEG',
    );
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
