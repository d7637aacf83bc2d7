import { describe, expect, it } from 'vitest';
import { planCreateSchema } from './plans';

function messagesOf(body: Record<string, unknown>) {
  const result = planCreateSchema.safeParse({
    procedureId: 1,
    scaleFactor: '1',
    plannedOn: '2026-12-03',
    ...body,
  });
  return result.success
    ? {}
    : Object.fromEntries(result.error.issues.map((i) => [i.path[0], i.message]));
}

describe('number messages', () => {
  it('when 0 benches are asked for, then the message names the lower bound, not "a number"', () => {
    expect(messagesOf({ benches: 0 })).toEqual({ benches: 'must be at least 1' });
  });

  it('when a field is not a number, then it says so', () => {
    expect(messagesOf({ benches: 'two' })).toEqual({ benches: 'must be a number' });
  });

  it('when a number is too large or not whole, then the bound or the rule is named', () => {
    expect(messagesOf({ benches: 501, overagePercent: -1 })).toEqual({
      benches: 'must be at most 500',
      overagePercent: 'must be at least 0',
    });
    expect(messagesOf({ benches: 1.5 })).toEqual({ benches: 'must be a whole number' });
  });
});
