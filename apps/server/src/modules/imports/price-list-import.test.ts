import { catalogItemSchema, importSchema, pageSchema, type Import } from '@lotwise/shared';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { repoRoot } from '../../config';
import { chemicalInput, signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let member = '';
let sequence = 0;

const header =
  'sku,chemical,pack_size,pack_unit,price,currency,grade,purity_percent,hazardous,splittable\n';

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
});

async function makeSupplier() {
  const response = await request(app())
    .post('/api/suppliers')
    .set('Cookie', manager)
    .send({ name: `Price list supplier ${++sequence}` })
    .expect(201);
  return response.body as { id: number; name: string };
}

async function makeChemical(name: string) {
  const response = await request(app())
    .post('/api/chemicals')
    .set('Cookie', manager)
    .send(chemicalInput({ name, ghsPictograms: ['GHS07'] }))
    .expect(201);
  return response.body as { id: number; name: string; casNumber: string };
}

async function upload(supplierId: number, text: string, cookie = manager) {
  return request(app())
    .post(`/api/imports?kind=price-list&supplierId=${supplierId}`)
    .set('Cookie', cookie)
    .send({ fileName: 'prices.csv', text });
}

async function preview(supplierId: number, text: string): Promise<Import> {
  const response = await upload(supplierId, text);
  expect(response.status).toBe(201);
  return importSchema.parse(response.body);
}

async function catalogue(supplierId: number) {
  const response = await request(app())
    .get(`/api/catalog-items?supplierId=${supplierId}&sort=sku.asc`)
    .set('Cookie', member)
    .expect(200);
  return pageSchema(catalogItemSchema).parse(response.body).items;
}

describe('price-list import', () => {
  it('when rows have problems, then the preview names each row and column and nothing is written', async () => {
    const supplier = await makeSupplier();
    const salt = await makeChemical(`List salt ${sequence}`);
    const result = await preview(
      supplier.id,
      header +
        `A-1,${salt.name},500,g,12.50,EUR,,,no,yes\n` +
        `A-2,No such chemical,500,g,12.50,,,,,\n` +
        `A-3,${salt.casNumber},500,lb,12.505,,,,maybe,\n` +
        `A-4,${salt.name},1,kg,9.90,USD,,120,,\n` +
        `A-1,${salt.name},1,kg,20,,,,,\n`,
    );
    expect(result).toMatchObject({
      kind: 'price-list',
      supplier: { id: supplier.id, name: supplier.name },
      status: 'invalid',
      summary: null,
    });
    const problems = result.errors.map((e) => `${e.row} ${e.column}: ${e.message}`);
    expect(problems).toEqual([
      expect.stringMatching(/^3 chemical: Lotwise has no chemical called No such chemical/),
      expect.stringMatching(/^4 pack_unit: must be one of: g, kg, mg, mL, L/),
      expect.stringMatching(/^4 price: has 3 decimals; EUR has 2/),
      expect.stringMatching(/^4 hazardous: must be yes or no/),
      expect.stringMatching(/^5 currency: is USD, but this lab keeps every price in EUR/),
      expect.stringMatching(/^5 purity_percent: must be more than 0 and at most 100/),
      expect.stringMatching(/^6 sku: A-1 is also on row 2/),
    ]);
    await request(app())
      .post(`/api/imports/${result.id}/commit`)
      .set('Cookie', manager)
      .expect(409);
    expect(await catalogue(supplier.id)).toEqual([]);
  });

  it('when a file has one bad row, then committing writes nothing at all', async () => {
    const supplier = await makeSupplier();
    const salt = await makeChemical(`All or nothing salt ${sequence}`);
    const result = await preview(
      supplier.id,
      header +
        `B-1,${salt.name},100,g,4.20,,,,,\n` +
        `B-2,${salt.name},500,g,11.00,,,,,\n` +
        `B-3,${salt.name},1,kg,abc,,,,,\n`,
    );
    expect(result.errorCount).toBe(1);
    expect(result.errors[0]).toMatchObject({ row: 4, field: 'price' });
    const commit = await request(app())
      .post(`/api/imports/${result.id}/commit`)
      .set('Cookie', manager)
      .expect(409);
    expect(commit.body.error.message).toMatch(/problem/);
    expect(await catalogue(supplier.id)).toEqual([]);
  });

  it('when a row goes bad between preview and commit, then the commit writes no row at all', async () => {
    const supplier = await makeSupplier();
    const kept = await makeChemical(`Kept salt ${sequence}`);
    const gone = await makeChemical(`Gone salt ${sequence}`);
    const result = await preview(
      supplier.id,
      header + `D-1,${kept.name},100,g,4.20,,,,,\n` + `D-2,${gone.name},100,g,5.10,,,,,\n`,
    );
    expect(result.status).toBe('ready');
    await request(app()).delete(`/api/chemicals/${gone.id}`).set('Cookie', manager).expect(204);
    const commit = await request(app())
      .post(`/api/imports/${result.id}/commit`)
      .set('Cookie', manager)
      .expect(409);
    expect(commit.body.error.message).toMatch(/row 3 \(chemical\).*Nothing was imported/);
    expect(await catalogue(supplier.id)).toEqual([]);
  });

  it('when a price list is imported again, then known SKUs are updated (preview says so) and new ones added', async () => {
    const supplier = await makeSupplier();
    const salt = await makeChemical(`Reimport salt ${sequence}`);
    const first = await preview(
      supplier.id,
      header +
        `C-1,${salt.name},250,g,14.90,EUR,Reagent,99.5,no,yes\n` +
        `C-2,${salt.casNumber},1,kg,"39,50",,Reagent,,yes,no\n`,
    );
    expect(first.status).toBe('ready');
    expect(first.priceList?.items).toEqual({ new: 2, updated: 0, unchanged: 0 });
    await request(app()).post(`/api/imports/${first.id}/commit`).set('Cookie', manager).expect(200);
    const before = await catalogue(supplier.id);
    expect(before.map((i) => [i.sku, i.priceMinor, i.hazardous, i.splittable])).toEqual([
      ['C-1', 1490, false, true],
      ['C-2', 3950, true, false],
    ]);
    expect(before[0]!.chemical).toMatchObject({ name: salt.name, ghsPictograms: ['GHS07'] });

    const second = await preview(
      supplier.id,
      header +
        `c-1,${salt.name},250,g,15.40,EUR,Reagent,99.5,no,yes\n` +
        `C-2,${salt.casNumber},1,kg,39.50,,Reagent,,yes,no\n` +
        `C-3,${salt.name},5,kg,120,,Technical,,no,yes\n`,
    );
    expect(second.status).toBe('ready');
    expect(second.priceList?.items).toEqual({ new: 1, updated: 1, unchanged: 1 });
    expect(
      second.priceList?.changes.map((c) => [c.sku, c.action, c.previousPriceMinor, c.priceMinor]),
    ).toEqual([
      ['C-1', 'update', 1490, 1540],
      ['C-2', 'unchanged', 3950, 3950],
      ['C-3', 'create', null, 12000],
    ]);
    const committed = importSchema.parse(
      (
        await request(app())
          .post(`/api/imports/${second.id}/commit`)
          .set('Cookie', manager)
          .expect(200)
      ).body,
    );
    expect(committed.status).toBe('committed');
    const after = await catalogue(supplier.id);
    expect(after.map((i) => [i.sku, i.priceMinor])).toEqual([
      ['C-1', 1540],
      ['C-2', 3950],
      ['C-3', 12000],
    ]);
    expect(after[0]!.id).toBe(before[0]!.id);
  });

  it('when a member uploads a price list, or no supplier is named, then it is refused', async () => {
    const supplier = await makeSupplier();
    const refused = await upload(supplier.id, header + 'X,Y,1,g,1,,,,,\n', member);
    expect(refused.status).toBe(403);
    const missing = await request(app())
      .post('/api/imports?kind=price-list')
      .set('Cookie', manager)
      .send({ text: header });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.supplierId).toMatch(/required/);
    const unknown = await upload(987654, header + 'X,Y,1,g,1,,,,,\n');
    expect(unknown.status).toBe(400);
  });

  it('when the header lacks a required column, then the file is refused as a whole', async () => {
    const supplier = await makeSupplier();
    const result = await preview(supplier.id, 'sku,chemical,price\nA,B,1\n');
    expect(result.status).toBe('invalid');
    expect(result.errors[0]!.message).toMatch(/no columns for pack_size, pack_unit/);
  });

  it('when docs/examples/price-list-import.csv is previewed against the demo chemicals, then every row is read', async () => {
    const text = readFileSync(path.join(repoRoot, 'docs/examples/price-list-import.csv'), 'utf8');
    const supplier = await makeSupplier();
    const names = [
      'Salicylic acid',
      'Acetic anhydride',
      'Acetanilide',
      'Sodium bicarbonate',
      'Acetone',
    ];
    for (const name of names) {
      await request(app())
        .post('/api/chemicals')
        .set('Cookie', manager)
        .send(chemicalInput({ name, casNumber: name === 'Salicylic acid' ? '69-72-7' : undefined }))
        .expect(201);
    }
    const result = await preview(supplier.id, text);
    expect(result.errors).toEqual([]);
    expect(result.priceList?.items.new).toBe(6);
  });
});
