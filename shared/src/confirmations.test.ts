import { describe, expect, it } from 'vitest';
import { allocateHolds, errorBodySchema, holdsTakenBy } from './index';

describe('holds on a container', () => {
  it('when stock runs below what is reserved, then the newest reservation gives way first', () => {
    const claims = [
      { id: 7, quantity: 30 },
      { id: 3, quantity: 50 },
    ];
    expect(allocateHolds(100, claims)).toEqual(
      new Map([
        [3, 50],
        [7, 30],
      ]),
    );
    expect(allocateHolds(60, claims)).toEqual(
      new Map([
        [3, 50],
        [7, 10],
      ]),
    );
    expect(allocateHolds(-1, claims).get(3)).toBe(0);
  });

  it('when a draw stays within what is free, then no hold loses; beyond it, each loser is named with before and after', () => {
    const claims = [{ id: 1, quantity: 65 }];
    expect(holdsTakenBy(100, 35, claims).size).toBe(0);
    expect(holdsTakenBy(70, 55, claims)).toEqual(new Map([[1, [65, 15]]]));
  });
});

describe('confirmation errors', () => {
  it('when a 409 asks for confirmation, then the body carries typed warnings', () => {
    const body = errorBodySchema.parse({
      error: {
        code: 'confirmation_required',
        message: 'Confirm.',
        warnings: [
          {
            kind: 'storage_conflict',
            message: 'A and b must be kept apart: reason',
            code: 'incompatible_groups',
            reason: 'reason',
            source: 'Prudent Practices',
            groups: ['oxidizer', 'flammable'],
            locationId: 1,
            locationPath: 'Room > Shelf',
            labelCodes: ['LW-00001'],
          },
        ],
      },
    });
    expect(body.error.warnings?.[0]?.kind).toBe('storage_conflict');
  });
});
