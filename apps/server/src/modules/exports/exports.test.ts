import { importColumns, importSchema } from '@lotwise/shared';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../lib/csv';
import { signedIn, signIn, stockFactory, testPassword, uniqueEmail } from '../../test/factories';
import {
  closeTestContext,
  openTestContext,
  testContext,
  type TestContext,
} from '../../test/harness';
import { usersService } from '../users/users.service';

const app = () => testContext().app;
let manager = '';
let viewer = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

function download(path: string, cookie = viewer, target: Express = app()) {
  return request(target).get(path).set('Cookie', cookie).buffer(true).parse(textParser);
}
/** Keeps the body as text exactly as sent (supertest does not parse text/csv by default). */
function textParser(
  res: { on(event: string, listener: (chunk: Buffer) => void): unknown },
  done: (error: Error | null, body: string) => void,
) {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks).toString('utf8')));
}

describe('exports escape formulas', () => {
  it('when cells start with = + - @, then the chemicals CSV prefixes them with an apostrophe', async () => {
    await make.chemical({
      name: '=HYPERLINK("http://evil.example.test","open me")',
      synonyms: ['+1', '-2', '@SUM(A1:A9)'],
      notes: '=1+2',
      casNumber: null,
    });
    const response = await download('/api/exports/chemicals.csv?q=HYPERLINK').expect(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toMatch(
      /^attachment; filename="?lotwise-chemicals-\d{4}-\d{2}-\d{2}\.csv"?$/,
    );
    const text = response.body as string;
    expect(text.startsWith('\uFEFFChemical,Synonyms,CAS RN')).toBe(true);
    expect(text).toContain(`"'=HYPERLINK(""http://evil.example.test"",""open me"")"`);
    expect(text).toContain(`'=1+2`);
    const { records } = parseCsv(text);
    expect(records[1]![0]).toBe(`'=HYPERLINK("http://evil.example.test","open me")`);
    expect(records[1]![1]).toBe(`'+1, -2, @SUM(A1:A9)`);
    // No cell of any record may start with a formula character.
    for (const cell of records.flat()) expect(cell).not.toMatch(/^[=+\-@\t\r]/);
  });

  it('when a container note starts with @ or -, then the containers CSV escapes it too', async () => {
    const chemical = await make.chemical({ name: 'Escape test salt' });
    const lot = await make.lot(chemical.id, { supplierLotNumber: '-2 batch' });
    const shelf = await make.location();
    await make.container(lot.id, shelf.id, { notes: '@SUM(A1:A2)' });
    const response = await download(`/api/exports/containers.csv?locationId=${shelf.id}`).expect(
      200,
    );
    const { records } = parseCsv(response.body as string);
    expect(records[0]).toEqual(importColumns.map((c) => c.header));
    expect(records).toHaveLength(2);
    const notes = importColumns.findIndex((c) => c.key === 'notes');
    const lotNumber = importColumns.findIndex((c) => c.key === 'supplierLotNumber');
    expect(records[1]![notes]).toBe("'@SUM(A1:A2)");
    expect(records[1]![lotNumber]).toBe("'-2 batch");
  });
});

describe('chemicals export carries the fire data', () => {
  it('when a liquid has figures, then the CSV has them with their sources, the class and the category; a negative flash point stays a number', async () => {
    await make.chemical({
      name: 'Fire export acetone',
      physicalState: 'liquid',
      stockUnit: 'mL',
      formula: 'C3H6O',
      flashPointC: -17.8,
      flashPointSource: 'NIOSH Pocket Guide',
      boilingPointC: 56.1,
      boilingPointSource: 'Merck Index',
    });
    const response = await download('/api/exports/chemicals.csv?q=Fire%20export').expect(200);
    const { records } = parseCsv(response.body as string);
    const header = records[0]!;
    const row = records[1]!;
    const cell = (name: string) => row[header.indexOf(name)];
    expect(cell('Flash point (°C)')).toBe('-17.8');
    expect(cell('Flash point source')).toBe('NIOSH Pocket Guide');
    expect(cell('Boiling point (°C)')).toBe('56.1');
    expect(cell('Boiling point source')).toBe('Merck Index');
    // NFPA 30 (2024) §4.3.1: below 22.8 °C, boiling 37.8 °C or above → IB; GHS Rev. 10 Table 2.6.1 → 2
    expect(cell('NFPA 30 class')).toBe('IB');
    expect(cell('GHS flammable category')).toBe('2');
  });
});

describe('export, then import elsewhere', () => {
  let other: TestContext;
  let otherManager = '';

  beforeAll(async () => {
    other = await openTestContext();
    const email = uniqueEmail('manager');
    await usersService(other.store, other.config).create(
      { email, displayName: 'Other lab manager', role: 'manager', password: testPassword },
      null,
    );
    otherManager = await signIn(other.app, email);
  });
  afterAll(async () => {
    await closeTestContext(other);
  });

  it('when the containers of a room are exported, then the file imports into another Lotwise without a problem', async () => {
    const room = await make.location({ name: `Export room ${Date.now()}`, kind: 'room' });
    const cabinet = await make.location({ name: 'Cabinet / A', parentId: room.id });
    const shelf = await make.location({ name: 'Shelf 1', parentId: cabinet.id });
    const salt = await make.chemical({
      name: 'Round-trip salt',
      formula: 'CuSO4·5H2O',
      ghsPictograms: ['GHS07', 'GHS09'],
      hazardStatements: ['H302', 'H410'],
    });
    const ether = await make.chemical({
      name: '-Round-trip ether, "stabilized"',
      formula: 'C4H10O',
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.713,
      storageGroup: 'flammable',
      peroxideClass: 'B',
    });
    const saltLot = await make.lot(salt.id, {
      supplierLotNumber: 'RT-1',
      grade: 'ACS reagent',
      purityPercent: 99.5,
      expiresOn: '2029-01-31',
    });
    const etherLot = await make.lot(ether.id, { receivedOn: '2025-06-01' });
    await make.container(saltLot.id, shelf.id, { quantity: 250, tareMass: 181.5 });
    await make.container(saltLot.id, cabinet.id, {
      quantity: 0.5,
      unit: 'kg',
      capacity: 1,
      capacityUnit: 'kg',
      notes: 'Working bottle, "left"\nsecond line',
    });
    const opened = await make.container(etherLot.id, shelf.id, {
      quantity: 500,
      unit: 'mL',
      openedOn: '2025-07-01',
    });
    await request(app())
      .post(`/api/containers/${opened.id}/draws`)
      .set('Cookie', manager)
      .send({ amount: 500, unit: 'mL' })
      .expect(201);

    const exported = await download(`/api/exports/containers.csv?locationId=${room.id}`).expect(
      200,
    );
    const text = exported.body as string;
    expect(parseCsv(text).records).toHaveLength(4);

    const preview = await request(other.app)
      .post('/api/imports')
      .set('Cookie', otherManager)
      .attach('file', Buffer.from(text, 'utf8'), 'export.csv')
      .expect(201);
    const checked = importSchema.parse(preview.body);
    expect(checked.errors).toEqual([]);
    expect(checked.status).toBe('ready');
    expect(checked.summary).toMatchObject({
      chemicals: { new: 2, existing: 0 },
      lots: { new: 2 },
      containers: { new: 3, generatedLabelCodes: 0 },
      locations: { new: 3 },
    });

    await request(other.app)
      .post(`/api/imports/${checked.id}/commit`)
      .set('Cookie', otherManager)
      .expect(200);
    const again = await download('/api/exports/containers.csv', otherManager, other.app).expect(
      200,
    );
    // Same rows, cell for cell (the location path, label codes and lots included).
    const rows = (csv: string) => parseCsv(csv).records.slice(1).map(String).sort();
    expect(rows(again.body as string)).toEqual(rows(text));
  });

  it('when exports are filtered by status, then only those containers are written', async () => {
    const shelf = await make.location();
    const lot = await make.lot((await make.chemical()).id);
    const sealed = await make.container(lot.id, shelf.id);
    await make.container(lot.id, shelf.id, { status: 'open' });
    const response = await download(
      `/api/exports/containers.csv?locationId=${shelf.id}&status=sealed`,
    ).expect(200);
    const { records } = parseCsv(response.body as string);
    expect(
      records.slice(1).map((r) => r[importColumns.findIndex((c) => c.key === 'labelCode')]),
    ).toEqual([sealed.labelCode]);
  });

  it('when the import template is asked for, then it is the header row alone', async () => {
    const response = await download('/api/exports/stock-import-template.csv').expect(200);
    expect(parseCsv(response.body as string).records).toEqual([importColumns.map((c) => c.header)]);
  });
});
