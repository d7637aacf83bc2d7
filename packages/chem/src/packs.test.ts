import { describe, expect, it } from 'vitest';
import { ChemError } from './errors';
import { type CataloguePack, choosePacks, type SupplierFees } from './packs';

// Prices are invented; every expected total and price per gram is worked by hand in the
// comment beside it (integer minor units, so the checks are exact). Preferring the lowest
// price per gram with fees, within an overbuy limit, is common practice, no source.

const pack = (
  id: number,
  supplierId: number,
  packSize: number,
  packUnit: string,
  priceMinor: number,
  hazardous = false,
): CataloguePack => ({ id, supplierId, packSize, packUnit, priceMinor, hazardous });

const fees = (
  supplierId: number,
  shippingFeeMinor: number,
  hazardousFeeMinor = 0,
  minimumOrderMinor = 0,
): SupplierFees => ({ supplierId, shippingFeeMinor, hazardousFeeMinor, minimumOrderMinor });

describe('choosePacks: price per gram with fees', () => {
  it('when 450 g is needed, then one 500 g pack at 10.4 per g beats smaller packs', () => {
    const choice = choosePacks({
      quantity: 450,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 1200), pack(2, 1, 250, 'g', 2200), pack(3, 1, 500, 'g', 4000)],
      suppliers: [fees(1, 1200)],
    });
    // 500 g: 4000 + 1200 = 5200 for 500 g = 10.4 per g
    // 2 × 250 g: 4400 + 1200 = 5600 for 500 g = 11.2; 5 × 100 g: 7200 for 500 g = 14.4
    expect(choice.chosen).toMatchObject({
      supplierId: 1,
      packs: [{ packId: 3, count: 1, amountPerPack: 500 }],
      packCount: 1,
      amount: 500,
      goodsMinor: 4000,
      shippingFeeMinor: 1200,
      hazardousFeeMinor: 0,
      totalMinor: 5200,
      pricePerUnitMinor: 10.4,
      withinOverbuyLimit: true,
      belowMinimumOrder: false,
    });
    expect(choice.alternatives).toHaveLength(1);
  });

  it('when a cheaper pack carries a heavy hazardous-goods fee, then the other supplier wins', () => {
    const choice = choosePacks({
      quantity: 100,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 1500, true), pack(2, 2, 100, 'g', 2500, true)],
      suppliers: [fees(1, 1200, 2500), fees(2, 900, 0)],
    });
    // supplier 1: 1500 + 1200 + 2500 = 5200 (52 per g); supplier 2: 2500 + 900 = 3400 (34 per g)
    expect(choice.chosen).toMatchObject({ supplierId: 2, totalMinor: 3400, pricePerUnitMinor: 34 });
    expect(choice.alternatives.map((a) => [a.supplierId, a.totalMinor])).toEqual([
      [2, 3400],
      [1, 5200],
    ]);
  });

  it('when several hazardous packs are bought, then the hazardous-goods fee counts once', () => {
    const choice = choosePacks({
      quantity: 200,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 1500, true)],
      suppliers: [fees(1, 1200, 2500)],
    });
    // 2 × 1500 + 1200 + 2500 = 6700 for 200 g = 33.5 per g
    expect(choice.chosen).toMatchObject({
      packCount: 2,
      hazardousFeeMinor: 2500,
      totalMinor: 6700,
      pricePerUnitMinor: 33.5,
    });
  });

  it('when no chosen pack is hazardous, then the hazardous-goods fee is not charged', () => {
    const choice = choosePacks({
      quantity: 100,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 1500, true), pack(2, 1, 100, 'g', 1600, false)],
      suppliers: [fees(1, 1000, 2500)],
    });
    // hazardous: 1500 + 1000 + 2500 = 5000; the other grade: 1600 + 1000 = 2600
    expect(choice.chosen).toMatchObject({
      packs: [{ packId: 2, count: 1 }],
      hazardousFeeMinor: 0,
      totalMinor: 2600,
    });
  });

  it('when many small packs are cheapest per gram, then they are chosen over bigger ones', () => {
    const choice = choosePacks({
      quantity: 700,
      unit: 'g',
      packs: [pack(1, 1, 500, 'g', 4500), pack(2, 1, 250, 'g', 2000), pack(3, 1, 100, 'g', 700)],
      suppliers: [fees(1, 1000)],
    });
    // 7 × 100 g: 4900 + 1000 = 5900 for 700 g = 8.4286 per g  <- lowest
    // 3 × 250 g: 6000 + 1000 = 7000 for 750 g = 9.3333; 500 + 2 × 100 g: 6900 for 700 g = 9.8571
    // 2 × 500 g: 9000 + 1000 = 10000 for 1000 g = 10
    expect(choice.chosen).toMatchObject({
      packs: [{ packId: 3, count: 7 }],
      totalMinor: 5900,
      amount: 700,
    });
    expect(choice.chosen?.pricePerUnitMinor).toBeCloseTo(8.428571, 6);
  });

  it('when the big pack twice over buys too much, then two sizes mixed cover the quantity best', () => {
    const input = {
      quantity: 700,
      unit: 'g' as const,
      packs: [pack(1, 1, 500, 'g', 3000), pack(2, 1, 250, 'g', 2500), pack(3, 1, 100, 'g', 800)],
      suppliers: [fees(1, 1000)],
    };
    // 2 × 500 g: 6000 + 1000 = 7000 for 1000 g = 7 per g: lowest, and within 2 × 700 g
    expect(choosePacks(input).chosen).toMatchObject({
      packs: [{ packId: 1, count: 2 }],
      totalMinor: 7000,
    });
    // With a limit of 1.2 × 700 = 840 g, 1000 g ranks last and the mix wins:
    // 500 + 2 × 100 g: 3000 + 1600 + 1000 = 5600 for 700 g = 8 per g
    // 500 + 250 g: 6500 for 750 g = 8.667; 7 × 100 g: 6600 for 700 g = 9.429
    const tight = choosePacks({ ...input, maxOverbuyFactor: 1.2 });
    expect(tight.chosen).toMatchObject({
      packs: [
        { packId: 1, count: 1 },
        { packId: 3, count: 2 },
      ],
      totalMinor: 5600,
      amount: 700,
      pricePerUnitMinor: 8,
      withinOverbuyLimit: true,
    });
  });

  it('when only one kind of pack may be taken, then the best single catalogue item wins', () => {
    const choice = choosePacks({
      quantity: 700,
      unit: 'g',
      packs: [pack(1, 1, 500, 'g', 3000), pack(2, 1, 250, 'g', 2500), pack(3, 1, 100, 'g', 800)],
      suppliers: [fees(1, 1000)],
      maxOverbuyFactor: 1.2,
      maxPackKinds: 1,
    });
    // 500 + 2 × 100 g is out (two kinds); 7 × 100 g: 5600 + 1000 = 6600 for 700 g = 9.43 per g;
    // 3 × 250 g: 7500 + 1000 = 8500 for 750 g = 11.33; 2 × 500 g buys more than 840 g
    expect(choice.chosen).toMatchObject({ packs: [{ packId: 3, count: 7 }], totalMinor: 6600 });
  });

  it('when a big pack is cheap per gram but far more than needed, then it ranks after the rest', () => {
    const input = {
      quantity: 450,
      unit: 'g' as const,
      packs: [pack(1, 1, 500, 'g', 4000), pack(2, 1, 1, 'kg', 5000)],
      suppliers: [fees(1, 1000)],
    };
    // 500 g: 5000 / 500 = 10 per g; 1 kg: 6000 / 1000 = 6 per g but 1000 > 2 × 450
    expect(choosePacks(input).chosen).toMatchObject({ packs: [{ packId: 1 }], totalMinor: 5000 });
    const loose = choosePacks({ ...input, maxOverbuyFactor: 3 });
    expect(loose.chosen).toMatchObject({
      packs: [{ packId: 2, amountPerPack: 1000 }],
      totalMinor: 6000,
      pricePerUnitMinor: 6,
    });
  });
});

describe('choosePacks: ties are broken the same way every time', () => {
  it('when two offers cost the same per gram, then the lower total wins', () => {
    const choice = choosePacks({
      quantity: 100,
      unit: 'g',
      packs: [pack(1, 1, 200, 'g', 2000), pack(2, 2, 100, 'g', 1000)],
      suppliers: [fees(1, 0), fees(2, 0)],
    });
    // both 10 per g; supplier 2 spends 1000 against 2000
    expect(choice.chosen).toMatchObject({ supplierId: 2, totalMinor: 1000 });
  });

  it('when price per gram and total tie, then fewer packs win, then the supplier listed first', () => {
    const fewer = choosePacks({
      quantity: 200,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 1000), pack(2, 1, 200, 'g', 2000)],
      suppliers: [fees(1, 0)],
    });
    expect(fewer.chosen?.packs).toEqual([expect.objectContaining({ packId: 2, count: 1 })]);
    const listed = choosePacks({
      quantity: 100,
      unit: 'g',
      packs: [pack(1, 7, 100, 'g', 1000), pack(2, 3, 100, 'g', 1000)],
      suppliers: [fees(7, 500), fees(3, 500)],
    });
    expect(listed.chosen?.supplierId).toBe(7);
    expect(listed.alternatives.map((a) => a.supplierId)).toEqual([7, 3]);
  });
});

describe('choosePacks: units, density and what cannot be used', () => {
  it('when a liquid counted in g is sold by the litre, then the density converts the pack', () => {
    // glacial acetic acid 1.049 g/mL at 20 °C // Merck Index (reference chemicals.tsv)
    const choice = choosePacks({
      quantity: 1000,
      unit: 'g',
      packs: [pack(1, 1, 1, 'L', 2000), pack(2, 1, 500, 'mL', 1100)],
      suppliers: [fees(1, 1000)],
      material: { physicalState: 'liquid', density: 1.049 },
    });
    // 1 L = 1049 g: 3000 / 1049 = 2.8599 per g; 2 × 500 mL = 1049 g for 3200: dearer
    expect(choice.chosen).toMatchObject({
      packs: [{ packId: 1, count: 1, amountPerPack: 1049 }],
      amount: 1049,
      totalMinor: 3000,
    });
    expect(choice.chosen?.pricePerUnitMinor).toBeCloseTo(2.859867, 6);
  });

  it('when a solid is sold by volume without a bulk density, then that pack is skipped with the reason', () => {
    const choice = choosePacks({
      quantity: 100,
      unit: 'g',
      packs: [pack(1, 1, 250, 'mL', 900), pack(2, 1, 100, 'g', 1500)],
      suppliers: [fees(1, 0)],
      material: { physicalState: 'solid', density: 2.165 },
    });
    expect(choice.chosen?.packs[0]?.packId).toBe(2);
    expect(choice.skipped).toEqual([
      expect.objectContaining({
        packId: 1,
        reason: expect.stringContaining('bulk density missing'),
      }),
    ]);
  });

  it('when a pack cannot be counted at all, then it is skipped and the rest still choose', () => {
    const choice = choosePacks({
      quantity: 100,
      unit: 'mL',
      packs: [
        pack(1, 1, 100, 'g', 900),
        pack(2, 1, 1, 'mol', 900),
        pack(3, 1, 100, 'bottle', 900),
        pack(4, 1, 0, 'mL', 900),
        pack(5, 1, 100, 'mL', 12.5),
        pack(6, 9, 100, 'mL', 100),
        pack(7, 1, 100, 'mL', 1000),
      ],
      suppliers: [fees(1, 0)],
    });
    expect(choice.chosen?.packs[0]?.packId).toBe(7);
    expect(choice.skipped.map((s) => [s.packId, s.reason])).toEqual([
      [1, expect.stringContaining('density missing')],
      [2, expect.stringContaining('amount of substance')],
      [3, expect.stringContaining('unknown unit "bottle"')],
      [4, 'pack size must be more than 0, got 0'],
      [5, expect.stringContaining('whole number of minor units')],
      [6, 'no fees known for supplier 9'],
    ]);
  });

  it('when the packs fall short of the minimum order, then it is reported, not hidden', () => {
    const choice = choosePacks({
      quantity: 100,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 2500)],
      suppliers: [fees(1, 900, 0, 5000)],
    });
    expect(choice.chosen).toMatchObject({
      minimumOrderMinor: 5000,
      belowMinimumOrder: true,
      minimumOrderShortMinor: 2500,
    });
  });

  it('when a supplier would need more packs than allowed, then it is listed as unable to cover', () => {
    const choice = choosePacks({
      quantity: 1000,
      unit: 'g',
      packs: [pack(1, 1, 100, 'g', 1000)],
      suppliers: [fees(1, 0)],
      maxPacks: 5,
    });
    expect(choice.chosen).toBeNull();
    expect(choice.uncovered).toEqual([
      { supplierId: 1, reason: 'the quantity needs more than 5 packs from this supplier' },
    ]);
  });

  it('when the quantity or a fee is bad, then a ChemError says which', () => {
    expect(() => choosePacks({ quantity: 0, unit: 'g', packs: [], suppliers: [] })).toThrow(
      'quantity to buy must be greater than 0',
    );
    try {
      choosePacks({ quantity: 1, unit: 'g', packs: [], suppliers: [fees(4, 12.5)] });
      throw new Error('expected a ChemError');
    } catch (error) {
      expect(error).toBeInstanceOf(ChemError);
      expect((error as ChemError).code).toBe('invalid_integer');
      expect((error as ChemError).message).toContain('supplier 4: shipping fee');
    }
  });
});
