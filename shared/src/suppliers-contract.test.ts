import { describe, expect, it } from 'vitest';
import {
  catalogItemCreateSchema,
  catalogItemListQuerySchema,
  catalogItemPatchSchema,
  supplierCreateSchema,
  supplierPatchSchema,
} from './suppliers';

describe('supplier schemas', () => {
  it('when only a name is given, then contact fields are empty and every fee is 0 cents', () => {
    expect(supplierCreateSchema.parse({ name: ' Northfield Lab Supply ' })).toMatchObject({
      name: 'Northfield Lab Supply',
      email: '',
      minimumOrderMinor: 0,
      shippingFeeMinor: 0,
      hazardousFeeMinor: 0,
    });
  });

  it('when a fee is a decimal or negative, then the error names the field', () => {
    const result = supplierCreateSchema.safeParse({
      name: 'X',
      shippingFeeMinor: 9.95,
      hazardousFeeMinor: -1,
    });
    expect(result.success).toBe(false);
    const paths = result.error!.issues.map((issue) => issue.path.join('.'));
    expect(paths).toEqual(['shippingFeeMinor', 'hazardousFeeMinor']);
  });

  it('when an e-mail is malformed, then it is refused; empty is allowed', () => {
    expect(supplierCreateSchema.safeParse({ name: 'X', email: 'not-mail' }).success).toBe(false);
    expect(supplierCreateSchema.parse({ name: 'X', email: '' }).email).toBe('');
  });

  it('when a patch archives, then only that field is set; unknown fields are refused', () => {
    expect(supplierPatchSchema.parse({ archived: true })).toEqual({ archived: true });
    expect(supplierPatchSchema.safeParse({ colour: 'red' }).success).toBe(false);
  });
});

describe('catalogue item schemas', () => {
  const base = {
    supplierId: 1,
    chemicalId: 2,
    sku: 'NF-1',
    packSize: 500,
    packUnit: 'g',
    priceMinor: 2450,
  };

  it('when flags and grade are left out, then they default and the currency is left to the server', () => {
    const parsed = catalogItemCreateSchema.parse(base);
    expect(parsed).toMatchObject({
      hazardous: false,
      splittable: false,
      grade: null,
      purityPercent: null,
    });
    expect(parsed.currency).toBeUndefined();
  });

  it('when the pack unit, purity or currency is wrong, then each names its field', () => {
    const result = catalogItemCreateSchema.safeParse({
      ...base,
      packUnit: 'lb',
      purityPercent: 101,
      currency: 'eur',
    });
    const paths = result.error!.issues.map((issue) => issue.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['packUnit', 'purityPercent', 'currency']));
  });

  it('when a patch names the supplier, then it is refused (an item stays with its supplier)', () => {
    expect(catalogItemPatchSchema.safeParse({ supplierId: 3 }).success).toBe(false);
    expect(catalogItemPatchSchema.parse({ discontinued: true })).toEqual({ discontinued: true });
  });

  it('when the list query names a supplier and asks for current items, then it is parsed', () => {
    expect(
      catalogItemListQuerySchema.parse({
        supplierId: '4',
        discontinued: 'false',
        sort: 'price.asc',
      }),
    ).toMatchObject({ supplierId: 4, discontinued: false, sort: 'price.asc', page: 1 });
  });
});
