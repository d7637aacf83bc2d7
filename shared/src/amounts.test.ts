import { describe, expect, it } from 'vitest';
import { amountProblem, maxStockAmount, minStockAmount, quantityUnitSchema } from './amounts';
import { chemicalCreateBodySchema } from './chemicals';
import { adjustmentSchema, containerCreateSchema, drawSchema, splitSchema } from './containers';
import { reservationCreateSchema } from './plans';
import { procedureLineInputSchema, scaledQuerySchema } from './procedures';
import { runPortionSchema, runDrawSchema } from './runs';
import { stocktakeCountSchema } from './stocktakes';

const barcode = 4006381333931;

describe('amount bounds', () => {
  it('when an amount is 10^7 it is taken, and just above it is refused with the bound named', () => {
    expect(amountProblem(maxStockAmount, 'positive')).toBeNull();
    expect(amountProblem(-maxStockAmount, 'signed')).toBeNull();
    expect(amountProblem(10_000_000.000001, 'positive')).toMatch(/at most 10,000,000/);
    expect(amountProblem(-10_000_001, 'signed')).toMatch(/at most 10,000,000/);
  });

  it('when an amount is a millionth it is taken, and anything smaller than that (5e-324) is refused', () => {
    expect(amountProblem(minStockAmount, 'positive')).toBeNull();
    expect(amountProblem(-minStockAmount, 'signed')).toBeNull();
    expect(amountProblem(0.0000009, 'positive')).toMatch(/too small/);
    expect(amountProblem(5e-324, 'positive')).toMatch(/too small/);
    expect(amountProblem(5e-324, 'nonNegative')).toMatch(/too small/);
    expect(amountProblem(0, 'nonNegative')).toBeNull();
    expect(amountProblem(0, 'positive')).toMatch(/more than 0/);
    expect(amountProblem(0, 'signed')).toMatch(/cannot be 0/);
  });

  it('when an amount is not a finite number, then it is refused', () => {
    for (const value of [Infinity, -Infinity, NaN, '5', null]) {
      expect(amountProblem(value, 'signed')).toBe('must be a number');
    }
  });

  it('when a barcode, 2^63, 1e308 or Infinity is sent as any amount, then every schema refuses it on that field', () => {
    const huge = [barcode, 2 ** 63, -(2 ** 63), 1e308, 1e306, Infinity];
    for (const value of huge) {
      const cases: [
        { safeParse(input: unknown): { success: boolean; error?: unknown } },
        object,
        string,
      ][] = [
        [drawSchema, { amount: value, unit: 'g' }, 'amount'],
        [drawSchema, { grossMass: value, unit: 'g' }, 'grossMass'],
        [adjustmentSchema, { correction: value, unit: 'g', note: 'n' }, 'correction'],
        [adjustmentSchema, { countedQuantity: value, unit: 'g', note: 'n' }, 'countedQuantity'],
        [
          containerCreateSchema,
          { lotId: 1, locationId: 1, quantity: value, unit: 'g' },
          'quantity',
        ],
        [splitSchema, { quantity: value, unit: 'g', locationId: 1 }, 'quantity'],
        [
          stocktakeCountSchema,
          { containerId: 1, outcome: 'counted', countedQuantity: value, unit: 'g' },
          'countedQuantity',
        ],
        [
          reservationCreateSchema,
          { items: [{ containerId: 1, quantity: value }] },
          'items.0.quantity',
        ],
        [
          procedureLineInputSchema,
          { chemicalId: 1, role: 'reagent', quantity: value, unit: 'g' },
          'quantity',
        ],
        [runDrawSchema, { containerId: 1, amount: value, unit: 'g' }, 'amount'],
        [
          runPortionSchema,
          { label: 'crop', quantity: value, unit: 'g', locationId: 1 },
          'quantity',
        ],
        [
          chemicalCreateBodySchema,
          {
            name: 'x',
            physicalState: 'solid',
            storageGroup: 'inorganic-general',
            stockUnit: 'g',
            reorderPoint: value,
          },
          'reorderPoint',
        ],
      ];
      for (const [schema, input, field] of cases) {
        const result = schema.safeParse(input) as {
          success: boolean;
          error?: { issues: { path: PropertyKey[] }[] };
        };
        expect(result.success, `${field} = ${value}`).toBe(false);
        expect(result.error!.issues.map((issue) => issue.path.join('.'))).toContain(field);
      }
    }
  });

  it('when a negative correction is at the bound, then it is taken like a positive one', () => {
    expect(adjustmentSchema.safeParse({ correction: -1e7, unit: 'g', note: 'n' }).success).toBe(
      true,
    );
    expect(adjustmentSchema.safeParse({ correction: 1e7, unit: 'kg', note: 'n' }).success).toBe(
      true,
    );
  });

  it('when a scaled query gives a target mass in the query string, then the same bounds apply', () => {
    expect(scaledQuerySchema.safeParse({ targetLimitingMass: '2.5' }).success).toBe(true);
    expect(scaledQuerySchema.safeParse({ targetLimitingMass: '1e308' }).success).toBe(false);
    expect(scaledQuerySchema.safeParse({ targetProductMass: 'Infinity' }).success).toBe(false);
  });
});

describe('units', () => {
  it('when a unit has spaces around it, then they are dropped and the unit is taken', () => {
    expect(quantityUnitSchema.parse(' g')).toBe('g');
    expect(quantityUnitSchema.parse('mL ')).toBe('mL');
    expect(drawSchema.parse({ amount: 1, unit: 'g ' }).unit).toBe('g');
    expect(runDrawSchema.parse({ containerId: 1, amount: 1, unit: ' mL' }).unit).toBe('mL');
    expect(
      containerCreateSchema.parse({
        lotId: 1,
        locationId: 1,
        quantity: 1,
        unit: ' g',
        capacity: 5,
        capacityUnit: 'g ',
      }),
    ).toMatchObject({ unit: 'g', capacityUnit: 'g' });
  });

  it('when a unit is of amount of substance where a mass or volume is needed, then it is refused', () => {
    expect(quantityUnitSchema.safeParse('mmol').success).toBe(false);
    expect(quantityUnitSchema.safeParse(' ').success).toBe(false);
  });
});
