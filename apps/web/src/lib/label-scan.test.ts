import { describe, expect, it } from 'vitest';
import { labelCodeFromScan, labelQrContent, readScannedLabel } from './label-scan';

const lab = ['https://lab.example.test', 'http://localhost:3000'];

describe('labelQrContent', () => {
  it('when a label is printed, then its QR holds the lab’s public address, whatever the printing browser’s', () => {
    expect(labelQrContent('LW-00042', 'https://lab.example.test')).toBe(
      'https://lab.example.test/stock/c/LW-00042',
    );
    expect(labelQrContent('LW-00042', 'https://lab.example.test/')).toBe(
      'https://lab.example.test/stock/c/LW-00042',
    );
  });

  it('when an imported code holds a slash, then the address keeps it as one part', () => {
    expect(labelQrContent('FW/B-117', 'https://lab.example.test')).toBe(
      'https://lab.example.test/stock/c/FW%2FB-117',
    );
  });
});

describe('readScannedLabel', () => {
  it('when this lab’s label is scanned, then its code is read', () => {
    expect(readScannedLabel('https://lab.example.test/stock/c/LW-00042', lab)).toEqual({
      kind: 'label',
      code: 'LW-00042',
    });
    expect(readScannedLabel('http://localhost:3000/stock/c/lw-42/', lab)).toEqual({
      kind: 'label',
      code: 'LW-00042',
    });
  });

  it('when a bare code is read, then an LW- code is made canonical and another code kept', () => {
    expect(readScannedLabel(' lw-42 ', lab)).toEqual({ kind: 'label', code: 'LW-00042' });
    expect(readScannedLabel('FW/B-117', lab)).toEqual({ kind: 'label', code: 'FW/B-117' });
  });

  it('when an imported code’s label is scanned, then the code is decoded', () => {
    const scanned = labelQrContent('FW/B-117', 'https://lab.example.test');
    expect(readScannedLabel(scanned, lab)).toEqual({ kind: 'label', code: 'FW/B-117' });
  });

  it('when another lab’s Lotwise label is scanned, then it says whose', () => {
    expect(readScannedLabel('https://other-lab.example.test/stock/c/LW-00042', lab)).toEqual({
      kind: 'other-lab',
      code: 'LW-00042',
      origin: 'https://other-lab.example.test',
    });
    // Another port is another address.
    expect(readScannedLabel('https://lab.example.test:8443/stock/c/LW-00042', lab).kind).toBe(
      'other-lab',
    );
  });

  it('when the text is neither a code nor a label’s address, then it is unknown', () => {
    for (const text of [
      'Some words on a poster',
      'https://lab.example.test/stock/containers/42',
      'https://example.test/',
      'WIFI:S:lab;T:WPA;P:x;;',
    ]) {
      expect(readScannedLabel(text, lab)).toEqual({ kind: 'unknown', text });
    }
  });
});

describe('labelCodeFromScan', () => {
  it('when a label code is typed in any form, then it is read as the canonical code', () => {
    expect(labelCodeFromScan('lw-42')).toBe('LW-00042');
    expect(labelCodeFromScan(' LW-00042 ')).toBe('LW-00042');
  });

  it('when the address a label QR holds is scanned, then its label code is read', () => {
    const scanned = labelQrContent('LW-00042', 'https://lab.example.test');
    expect(labelCodeFromScan(scanned)).toBe('LW-00042');
    expect(labelCodeFromScan(`${scanned}?from=camera`)).toBe('LW-00042');
  });

  it('when the text is neither, then nothing is read (it is searched for)', () => {
    expect(labelCodeFromScan('acetone')).toBeNull();
    expect(labelCodeFromScan('https://lab.example.test/stock/containers/42')).toBeNull();
  });
});
