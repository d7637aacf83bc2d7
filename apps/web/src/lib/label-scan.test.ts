import { describe, expect, it } from 'vitest';
import { labelCodeFromScan, labelQrContent } from './label-scan';

describe('labelCodeFromScan', () => {
  it('when a label code is typed in any form, then it is read as the canonical code', () => {
    expect(labelCodeFromScan('lw-42')).toBe('LW-00042');
    expect(labelCodeFromScan(' LW-00042 ')).toBe('LW-00042');
  });

  it('when the address a label QR holds is scanned, then its label code is read', () => {
    const scanned = labelQrContent('LW-00042', 'https://lab.example.test');
    expect(scanned).toBe('https://lab.example.test/stock/c/LW-00042');
    expect(labelCodeFromScan(scanned)).toBe('LW-00042');
  });

  it('when the text is neither, then nothing is read', () => {
    expect(labelCodeFromScan('acetone')).toBeNull();
    expect(labelCodeFromScan('https://lab.example.test/stock/containers/42')).toBeNull();
  });
});
