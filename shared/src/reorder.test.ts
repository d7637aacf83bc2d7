import { describe, expect, it } from 'vitest';
import { draftFromSuggestionsSchema, formatPricePerUnit } from './reorder';
import { requestCreateSchema } from './requests';

describe('formatPricePerUnit', () => {
  it('when a price per gram is a fraction of a cent, then two more decimals show it', () => {
    // 5200 cents for 500 g = 10.4 cents per g = €0.104 per g
    expect(formatPricePerUnit(10.4, 'EUR', 'g', 'en-GB')).toBe('€0.104/g');
    expect(formatPricePerUnit(2.859866, 'EUR', 'g', 'en-GB')).toBe('€0.0286/g');
    expect(formatPricePerUnit(1200, 'EUR', 'mL', 'en-GB')).toBe('€12.00/mL');
    // yen have no minor unit: 7.7 yen per mL
    expect(formatPricePerUnit(7.7, 'JPY', 'mL', 'en-GB')).toBe('JP¥7.7/mL');
  });
});

describe('request and draft contracts', () => {
  it('when a request leaves out the date and note, then they default to none', () => {
    expect(requestCreateSchema.parse({ chemicalId: 3, quantity: 50, unit: 'g' })).toEqual({
      chemicalId: 3,
      quantity: 50,
      unit: 'g',
      neededBy: null,
      note: '',
    });
  });

  it('when a request has a bad date, quantity or an unknown field, then it is refused', () => {
    expect(
      requestCreateSchema.safeParse({
        chemicalId: 3,
        quantity: 50,
        unit: 'g',
        neededBy: '2027-02-30',
      }).success,
    ).toBe(false);
    expect(requestCreateSchema.safeParse({ chemicalId: 3, quantity: -1, unit: 'g' }).success).toBe(
      false,
    );
    expect(
      requestCreateSchema.safeParse({ chemicalId: 3, quantity: 1, unit: 'g', priceMinor: 5 })
        .success,
    ).toBe(false);
  });

  it('when a draft names a chemical twice or none, then it is refused', () => {
    expect(draftFromSuggestionsSchema.safeParse({ items: [] }).success).toBe(false);
    expect(
      draftFromSuggestionsSchema.safeParse({ items: [{ chemicalId: 1 }, { chemicalId: 1 }] })
        .success,
    ).toBe(false);
  });
});
