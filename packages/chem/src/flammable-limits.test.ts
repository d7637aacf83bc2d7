import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import {
  flammableLimitsFor,
  flammableTotals,
  instructionalProblem,
  limitsCrossed,
  type FlammableLimitsInput,
  type LabAreaInput,
} from './flammable-limits';

/**
 * NFPA 45 (2024) Table 9.1.1 as quoted in public summaries of the standard (docs/room-rules.md
 * "NFPA 45 arithmetic" works each example below by hand).
 */
const nfpa45: FlammableLimitsInput = {
  unit: 'gal',
  perFloorArea: { value: 100, unit: 'ft2' },
  byUnitClass: [
    {
      unitClass: 'A',
      perArea: { classI: 20, classesIToIIIA: 40 },
      maxPerUnit: { classI: 480, classesIToIIIA: 1600 },
    },
    {
      unitClass: 'B',
      perArea: { classI: 10, classesIToIIIA: 20 },
      maxPerUnit: { classI: 480, classesIToIIIA: 800 },
    },
    {
      unitClass: 'C',
      perArea: { classI: 4, classesIToIIIA: 8 },
      maxPerUnit: { classI: 300, classesIToIIIA: 400 },
    },
    {
      unitClass: 'D',
      perArea: { classI: 2, classesIToIIIA: 2 },
      maxPerUnit: { classI: 150, classesIToIIIA: 150 },
    },
  ],
  outsideStorageFactor: 0.5,
  instructional: { allowedUnitClasses: ['C', 'D'], limitedToUnitClass: 'C', factor: 0.5 },
  storeyReductions: [
    { unitClasses: ['B'], fromStorey: 4, toStorey: null, factor: 0.5 },
    { unitClasses: ['C', 'D'], fromStorey: 4, toStorey: 6, factor: 0.75 },
    { unitClasses: ['C', 'D'], fromStorey: 7, toStorey: null, factor: 0.5 },
  ],
  countsIgnitableWaste: true,
  perCabinet: null,
};

function litres(area: Partial<LabAreaInput> & Pick<LabAreaInput, 'unitClass' | 'floorArea'>) {
  const limits = flammableLimitsFor(nfpa45, {
    floorAreaUnit: 'ft2',
    storey: 1,
    instructional: false,
    ...area,
  });
  return Object.fromEntries(limits.map((l) => [l.key, l.litres]));
}

describe('NFPA 45 limits of a lab area', () => {
  it('when a Class A unit is 3,000 ft², then Class I is capped at the unit maximum', () => {
    const l = litres({ unitClass: 'A', floorArea: 3000 });
    expect(l['class-i']).toBeCloseTo(1816.998, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): A, 20 gal/100 ft², max 480 gal
    expect(l['classes-i-to-iiia']).toBeCloseTo(4542.494, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): A, 40 gal/100 ft² → 1,200 gal
    expect(l['class-i-outside-storage']).toBeCloseTo(908.499, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): half outside cabinets, 240 gal
    expect(l['classes-i-to-iiia-outside-storage']).toBeCloseTo(2271.247, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): 600 gal
  });

  it('when a Class B unit is 500 ft² on storey 2, then 50 gal of Class I and 100 gal in all', () => {
    const l = litres({ unitClass: 'B', floorArea: 500, storey: 2 });
    expect(l['class-i']).toBeCloseTo(189.271, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): B, 10 gal/100 ft²
    expect(l['classes-i-to-iiia']).toBeCloseTo(378.541, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): B, 20 gal/100 ft²
    expect(l['class-i-outside-storage']).toBeCloseTo(94.635, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): half, 25 gal
  });

  it('when a Class C unit is 800 ft², then 32 gal of Class I and 64 gal in all', () => {
    const l = litres({ unitClass: 'C', floorArea: 800 });
    expect(l['class-i']).toBeCloseTo(121.133, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): C, 4 gal/100 ft²
    expect(l['classes-i-to-iiia']).toBeCloseTo(242.266, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): C, 8 gal/100 ft²
    expect(l['classes-i-to-iiia-outside-storage']).toBeCloseTo(121.133, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): half, 32 gal
  });

  it('when a Class D unit is 400 ft² on storey 3, then 8 gal of either', () => {
    const l = litres({ unitClass: 'D', floorArea: 400, storey: 3 });
    expect(l['class-i']).toBeCloseTo(30.283, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): D, 2 gal/100 ft²
    expect(l['classes-i-to-iiia']).toBeCloseTo(30.283, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): D, 2 gal/100 ft²
    expect(l['class-i-outside-storage']).toBeCloseTo(15.142, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): half, 4 gal
  });

  it('when an instructional Class C lab is 1,200 ft², then half of Class C applies', () => {
    const l = litres({ unitClass: 'C', floorArea: 1200, storey: 2, instructional: true });
    expect(l['class-i']).toBeCloseTo(90.85, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): instructional 50 % of C, 24 gal
    expect(l['classes-i-to-iiia']).toBeCloseTo(181.7, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): 48 gal
    expect(l['class-i-outside-storage']).toBeCloseTo(45.425, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): half again, 12 gal
  });

  it('when a unit is on storey 5, then Class B is halved and Class C loses a quarter', () => {
    const b = litres({ unitClass: 'B', floorArea: 500, storey: 5 });
    expect(b['class-i']).toBeCloseTo(94.635, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): B above storey 3 × 50 %, 25 gal
    expect(b['classes-i-to-iiia']).toBeCloseTo(189.271, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): 50 gal
    const c = litres({ unitClass: 'C', floorArea: 800, storey: 5 });
    expect(c['class-i']).toBeCloseTo(90.85, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): C storeys 4–6 × 75 %, 24 gal
    expect(c['classes-i-to-iiia']).toBeCloseTo(181.7, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): 48 gal
  });

  it('when a Class D unit is on storey 8, then its figures are halved', () => {
    const l = litres({ unitClass: 'D', floorArea: 400, storey: 8 });
    expect(l['class-i']).toBeCloseTo(15.142, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): C, D above storey 6 × 50 %, 4 gal
    expect(l['class-i-outside-storage']).toBeCloseTo(7.571, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): half again, 2 gal
  });

  it('when the floor area is 60 m², then it counts as 645.83 ft²', () => {
    const l = litres({ unitClass: 'B', floorArea: 60, floorAreaUnit: 'm2' });
    expect(l['class-i']).toBeCloseTo(244.475, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): B 10 gal/100 ft²; NIST SP 811 ft² and gal
    expect(l['classes-i-to-iiia']).toBeCloseTo(488.95, 2); // NFPA 45 (2024) Table 9.1.1 (public summary): B 20 gal/100 ft²
  });

  it('when the area doubles below the cap, then the limit doubles (linear in area)', () => {
    const one = litres({ unitClass: 'C', floorArea: 300 });
    const two = litres({ unitClass: 'C', floorArea: 600 });
    expect(two['class-i']).toBeCloseTo(2 * one['class-i']!, 9); // common practice, no source
  });

  it('when a limit is worked out, then each step is said in words and ends at the figure', () => {
    const [classI] = flammableLimitsFor(nfpa45, {
      unitClass: 'B',
      floorArea: 500,
      floorAreaUnit: 'ft2',
      storey: 5,
      instructional: false,
    });
    const texts = classI!.working.map((s) => s.text);
    expect(texts[0]).toBe(
      'Class B, Class I liquids: 10 gal per 100 ft² × 500 ft² ÷ 100 ft² = 50 gal (189.27 L)',
    );
    expect(texts).toContain(
      'Within the lab unit maximum of 480 gal (1,817 L): stays 50 gal (189.27 L)',
    );
    expect(texts.at(-1)).toBe(
      'Storey 5 (Class B figures, storey 4 and above): × 0.5 = 25 gal (94.64 L)',
    );
    expect(classI!.working.at(-1)!.litres).toBeCloseTo(classI!.litres, 9);
  });

  it('when an instructional lab is Class A, then the set says which classes it may be', () => {
    expect(instructionalProblem(nfpa45, { unitClass: 'A', instructional: true })).toBe(
      'an instructional lab must be Class C or D under this rule set',
    );
    expect(instructionalProblem(nfpa45, { unitClass: 'D', instructional: true })).toBeNull();
  });

  it('when a custom per-room set gives one figure, then it applies whatever the size and class', () => {
    const room: FlammableLimitsInput = {
      ...nfpa45,
      unit: 'L',
      perFloorArea: null,
      byUnitClass: [
        { unitClass: 'C', perArea: { classI: 50, classesIToIIIA: 100 }, maxPerUnit: null },
      ],
      storeyReductions: [],
    };
    const limits = flammableLimitsFor(room, {
      unitClass: 'B',
      floorArea: 999,
      floorAreaUnit: 'm2',
      storey: 9,
      instructional: false,
    });
    expect(limits.map((l) => l.litres)).toEqual([50, 100, 25, 50]); // common practice, no source
  });

  it('when a set has no figures for the class, then a ChemError names the classes it has', () => {
    const two = { ...nfpa45, byUnitClass: nfpa45.byUnitClass.slice(0, 2) };
    expect(() =>
      flammableLimitsFor(two, {
        unitClass: 'D',
        floorArea: 1,
        floorAreaUnit: 'ft2',
        storey: 1,
        instructional: false,
      }),
    ).toThrow(ChemError);
  });
});

describe('what a lab area holds against its limits', () => {
  const limits = flammableLimitsFor(nfpa45, {
    unitClass: 'B',
    floorArea: 500,
    floorAreaUnit: 'ft2',
    storey: 2,
    instructional: false,
  });

  it('when liquids sit in and out of a cabinet, then each limit counts its own classes and places', () => {
    const totals = flammableTotals(
      [
        { liquidClass: 'IB', litres: 100, inStorage: true },
        { liquidClass: 'IB', litres: 60, inStorage: false },
        { liquidClass: 'II', litres: 20, inStorage: false },
        { liquidClass: 'IIIB', litres: 500, inStorage: false },
      ],
      limits,
    );
    const held = Object.fromEntries(totals.limits.map((l) => [l.key, l.heldLitres]));
    expect(held).toEqual({
      'class-i': 160,
      'classes-i-to-iiia': 180,
      'class-i-outside-storage': 60,
      'classes-i-to-iiia-outside-storage': 80,
    }); // NFPA 45 (2024) Table 9.1.1 (public summary): IIIB not counted; cabinets count in the totals
    const classI = totals.limits[0]!;
    expect(classI.marginLitres).toBeCloseTo(189.2706 - 160, 3); // common practice, no source
    expect(classI.fractionUsed).toBeCloseTo(160 / 189.2706, 4); // common practice, no source
    expect(classI.status).toBe('within');
    expect(totals.limits[2]!.status).toBe('within'); // 60 of 94.6 L
    expect(totals.byClass.map((c) => c.liquidClass)).toEqual(['IB', 'II', 'IIIB']);
    expect(totals.byClass[0]).toMatchObject({
      inStorageLitres: 100,
      outsideStorageLitres: 60,
      totalLitres: 160,
    });
  });

  it('when a limit is at 90 % or more, then it is near; past it, over', () => {
    const near = flammableTotals([{ liquidClass: 'IA', litres: 180, inStorage: true }], limits);
    expect(near.limits[0]!.status).toBe('near'); // 180 of 189.27 L is 95 %
    expect(near.status).toBe('near');
    const over = flammableTotals([{ liquidClass: 'IA', litres: 190, inStorage: true }], limits);
    expect(over.limits[0]!.status).toBe('over');
    expect(over.limits[0]!.marginLitres).toBeLessThan(0);
    expect(limitsCrossed(near.limits, over.limits).map((c) => c.after.key)).toEqual(['class-i']);
    expect(limitsCrossed(over.limits, over.limits)).toEqual([]);
  });
});
