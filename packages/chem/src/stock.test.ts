import { describe, expect, it } from 'vitest';
import { reorderState } from './stock';

describe('reorderState', () => {
  it('when there is no reorder point, then none; below, at and above follow the total', () => {
    expect(reorderState(10, null)).toBe('none');
    expect(reorderState(99.9, 100)).toBe('below');
    expect(reorderState(100.00000001, 100)).toBe('at'); // float sums: common practice, no source
    expect(reorderState(250, 100)).toBe('ok');
  });
});
