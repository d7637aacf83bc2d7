import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { catalogItemSchema, pageSchema, supplierSchema } from '@lotwise/shared';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../app';
import { createDataSource } from '../data-source';
import { testConfig } from '../../test/harness';
import { demoPassword, seedDemo } from './demo-seed';

describe('demo suppliers', () => {
  let dataSource: DataSource;
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-seed-suppliers-'));
  const config = testConfig(dir);

  beforeAll(async () => {
    dataSource = createDataSource(config.databasePath);
    await dataSource.initialize();
    await dataSource.runMigrations({ transaction: 'all' });
    await seedDemo(dataSource, 4, config.currency);
  });
  afterAll(async () => {
    await dataSource.destroy();
    rmSync(dir, { recursive: true, force: true });
  });

  it('when seeded, then two invented suppliers sell demo chemicals in small packs, with fees and one minimum order', async () => {
    const app = createApp({ dataSource, config });
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'member.one@example.test', password: demoPassword })
      .expect(200);
    const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;
    const get = (url: string) => request(app).get(url).set('Cookie', cookie).expect(200);

    const suppliers = pageSchema(supplierSchema).parse((await get('/api/suppliers')).body);
    expect(suppliers.items.map((s) => s.name)).toEqual([
      'Harbour Chemicals Co.',
      'Northfield Lab Supply',
    ]);
    for (const supplier of suppliers.items) {
      expect(supplier.email).toMatch(/@[a-z-]+\.example\.test$/);
      expect(supplier.website).toMatch(/\.example\.test$/);
      expect(supplier.catalogItemCount).toBeGreaterThanOrEqual(8);
      expect(supplier.hazardousFeeMinor).toBeGreaterThan(supplier.shippingFeeMinor);
    }
    const northfield = suppliers.items.find((s) => s.name === 'Northfield Lab Supply')!;
    expect(northfield).toMatchObject({
      shippingFeeMinor: 995,
      hazardousFeeMinor: 1800,
      minimumOrderMinor: 5000,
    });
    expect(suppliers.items.filter((s) => s.minimumOrderMinor > 0)).toHaveLength(1);

    const items = pageSchema(catalogItemSchema).parse(
      (await get('/api/catalog-items?pageSize=200')).body,
    ).items;
    expect(items.length).toBe(17);
    for (const item of items) {
      expect(item.currency).toBe('EUR');
      // Small teaching-lab packs at a few euros to a few tens of euros. // common practice, no source
      expect(item.priceMinor, item.sku).toBeGreaterThanOrEqual(500);
      expect(item.priceMinor, item.sku).toBeLessThanOrEqual(5000);
    }
    // Two suppliers sell salicylic acid, so the cheaper pack per gram can be chosen.
    const salicylic = items.filter((i) => i.chemical.name === 'Salicylic acid');
    expect(new Set(salicylic.map((i) => i.supplierId)).size).toBe(2);
    const acid = items.find((i) => i.sku === 'HC-20-050')!;
    expect(acid.chemical).toMatchObject({ casNumber: '7664-93-9' });
    expect(acid.chemical.ghsPictograms).toContain('GHS05');
    expect(acid.hazardous).toBe(true);
  });
});
