import { describe, expect, it } from 'vitest';
import {
  chemicalSchema,
  importColumnForHeader,
  importCreateQuerySchema,
  importColumns,
  importSchema,
  lotSchema,
  normalizeHeader,
} from './index';

describe('stock import columns', () => {
  it('when headers are compared, then case, spaces and punctuation do not matter', () => {
    expect(normalizeHeader(' Tare (g) ')).toBe('tareg');
    expect(importColumnForHeader('cas rn')).toBe('casNumber');
    expect(importColumnForHeader('CAS-No.')).toBe('casNumber');
    expect(importColumnForHeader('PURITY %')).toBe('purityPercent');
    expect(importColumnForHeader('Supplier lot no.')).toBe('supplierLotNumber');
    expect(importColumnForHeader('label_code')).toBe('labelCode');
    expect(importColumnForHeader('Colour')).toBeNull();
  });

  it('when every header and alias is normalized, then no two columns share one', () => {
    const seen = new Map<string, string>();
    for (const column of importColumns) {
      for (const name of [column.header, column.key, ...column.aliases]) {
        const key = normalizeHeader(name);
        const other = seen.get(key);
        expect(other === undefined || other === column.key, `${name}: ${other}`).toBe(true);
        seen.set(key, column.key);
      }
    }
  });

  it('when the required columns are listed, then they are chemical, quantity, unit and location', () => {
    expect(importColumns.filter((c) => c.required).map((c) => c.key)).toEqual([
      'chemical',
      'quantity',
      'unit',
      'location',
    ]);
  });

  it('when an import is described, then a sample parses', () => {
    const sample = {
      id: 1,
      kind: 'stock',
      supplier: null,
      fileName: 'stock.csv',
      status: 'invalid',
      totalRows: 3,
      processedRows: 3,
      errorCount: 1,
      errors: [
        { row: 2, column: 'CAS', field: 'casNumber', value: '64-17-6', message: 'check digit' },
      ],
      errorsPage: 1,
      errorsPageSize: 100,
      warnings: [],
      summary: null,
      priceList: null,
      failure: null,
      createdBy: null,
      createdAt: '2026-01-01T00:00:00.000Z',
      updatedAt: '2026-01-01T00:00:00.000Z',
      committedAt: null,
    };
    expect(importSchema.parse(sample).errors[0]!.field).toBe('casNumber');
    const priceList = { ...sample, kind: 'price-list', supplier: { id: 3, name: 'Northfield' } };
    priceList.errors = [{ row: 2, column: 'price', field: 'price', value: '1.005', message: 'x' }];
    expect(importSchema.parse(priceList).errors[0]!.field).toBe('price');
  });

  it('when a price list is uploaded without its supplier, then the query names supplierId', () => {
    expect(importCreateQuerySchema.parse({})).toEqual({ kind: 'stock' });
    const result = importCreateQuerySchema.safeParse({ kind: 'price-list' });
    expect(result.error?.issues[0]?.path).toEqual(['supplierId']);
    expect(importCreateQuerySchema.parse({ kind: 'price-list', supplierId: '3' })).toEqual({
      kind: 'price-list',
      supplierId: 3,
    });
  });
});

describe('uploads in chemical and lot responses', () => {
  it('when sds and certificate are absent (older clients and fixtures), then the schemas still parse', () => {
    expect(chemicalSchema.shape.sds.safeParse(undefined).success).toBe(true);
    expect(chemicalSchema.shape.sds.safeParse(null).success).toBe(true);
    expect(lotSchema.shape.certificate.safeParse(undefined).success).toBe(true);
    expect(
      chemicalSchema.shape.sds.safeParse({
        fileName: 'sds.pdf',
        size: 10,
        contentType: 'application/pdf',
        uploadedAt: '2026-01-01T00:00:00.000Z',
      }).success,
    ).toBe(true);
  });
});
