import {
  containerDetailSchema,
  containerSchema,
  importSchema,
  ledgerCheckResultSchema,
  pageSchema,
  type Import,
} from '@lotwise/shared';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { repoRoot } from '../../config';
import { beforeAll, describe, expect, it } from 'vitest';
import { csvLine } from '../../lib/csv';
import { signedIn, stockFactory, uniqueCasNumber } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let member = '';
let admin = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = (await signedIn('member')).cookie;
  admin = (await signedIn('admin')).cookie;
});

const columns = [
  'Chemical',
  'CAS RN',
  'Formula',
  'Physical state',
  'Density (g/mL)',
  'Storage group',
  'GHS pictograms',
  'H-statements',
  'Peroxide class',
  'Supplier',
  'Supplier lot no.',
  'Received on',
  'Expires on',
  'Label code',
  'Quantity',
  'Unit',
  'Tare (g)',
  'Opened on',
  'Status',
  'Location',
] as const;
type Row = Partial<Record<(typeof columns)[number] | string, string>>;

/** A CSV of `rows`; `header` may write other names for the columns (same order). */
function csv(rows: Row[], header: readonly string[] = columns): string {
  const keys = header.length === columns.length ? columns : header;
  return csvLine(header) + rows.map((row) => csvLine(keys.map((h) => row[h] ?? ''))).join('');
}

let sequence = 0;
/** A unique room name, so each test's places are its own. */
const room = (label = 'Room') => `${label} ${++sequence}-${Date.now().toString(36)}`;

function row(overrides: Row = {}): Row {
  return {
    Chemical: `Import reagent ${++sequence}`,
    'CAS RN': uniqueCasNumber(),
    Formula: 'KCl',
    'Physical state': 'solid',
    'Storage group': 'low-hazard',
    Supplier: 'Fernwood Chemicals (fictional)',
    'Supplier lot no.': `FW-${sequence}`,
    'Received on': '2025-09-01',
    'Expires on': '2028-09-01',
    Quantity: '500',
    Unit: 'g',
    Location: `${room()} › Cabinet A › Shelf 1`,
    ...overrides,
  };
}

function upload(text: string, cookie = manager, fileName = 'stock.csv') {
  return request(app())
    .post('/api/imports')
    .set('Cookie', cookie)
    .attach('file', Buffer.from(text, 'utf8'), fileName);
}
const get = (path: string, cookie = manager) => request(app()).get(path).set('Cookie', cookie);
const commit = (id: number, cookie = manager) =>
  request(app()).post(`/api/imports/${id}/commit`).set('Cookie', cookie).send();

async function preview(text: string): Promise<Import> {
  const response = await upload(text).expect(201);
  return importSchema.parse(response.body);
}

async function totals() {
  const total = async (path: string) =>
    (await get(`${path}?pageSize=1`).expect(200)).body.total as number;
  return {
    containers: await total('/api/containers'),
    locations: await total('/api/locations'),
    chemicals: await total('/api/chemicals'),
    lots: await total('/api/lots'),
  };
}

async function waitFor(id: number, statuses: string[], seen: number[] = []): Promise<Import> {
  for (let i = 0; i < 600; i++) {
    const current = importSchema.parse((await get(`/api/imports/${id}`).expect(200)).body);
    seen.push(current.processedRows);
    if (statuses.includes(current.status)) return current;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  throw new Error(`Import ${id} never reached ${statuses.join('/')}`);
}

describe('importing a good file', () => {
  it('when a file previews, then nothing is written; when committed, then containers, lots, places and received entries exist', async () => {
    const known = await make.chemical({ name: 'Known salt', formula: 'NaCl' });
    const knownCas = (await get(`/api/chemicals/${known.id}`).expect(200)).body.casNumber;
    const lab = room('Lab');
    const before = await totals();
    const text = csv(
      [
        // Matched by CAS RN (the name differs), placed with "/" separators.
        row({
          Chemical: 'known salt (old name)',
          'CAS RN': knownCas,
          Location: `${lab}/Cabinet A/Shelf 1`,
        }),
        // A hydrate; a given label code in lower case; ">" separators.
        row({
          Chemical: 'Copper(II) sulfate pentahydrate (test)',
          Formula: 'CuSO4·5H2O',
          'Label code': 'lw-90001',
          Location: `${lab} > Cabinet A > Shelf 2`,
          Quantity: '1.5',
          Unit: 'kg',
          'Tare (g)': '210',
        }),
        // A solution counted by volume.
        row({
          Chemical: 'Sodium hydroxide solution 1 M (test)',
          'CAS RN': '',
          Formula: '',
          'Physical state': 'solution',
          'Storage group': 'Bases',
          'GHS pictograms': 'GHS05',
          'H-statements': 'H290, H314',
          Quantity: '1',
          Unit: 'L',
          'Density (g/mL)': '1.04',
          Location: `${lab} › Cabinet B`,
        }),
        // Same solution, same lot, by mass: converted through the density.
        row({
          Chemical: 'sodium hydroxide solution 1 m (TEST)',
          'CAS RN': '',
          Formula: '',
          'Supplier lot no.': '',
          'Physical state': '',
          'Storage group': '',
          Quantity: '104',
          Unit: 'g',
          Location: `${lab} › Cabinet B`,
        }),
        // A peroxide former, opened.
        row({
          Chemical: 'Tetrahydrofuran (test)',
          Formula: 'C4H8O',
          'Physical state': 'liquid',
          'Density (g/mL)': '0.889',
          'Storage group': 'flammable',
          'GHS pictograms': 'GHS02 GHS07 GHS08',
          'H-statements': 'H225+H319 H335 H351',
          'Peroxide class': 'B',
          Quantity: '750',
          Unit: 'mL',
          'Opened on': '2025-10-03',
          Location: `${lab} › Flammables cabinet`,
        }),
      ],
      // Headers as people write them: other case, aliases.
      columns.map((h) => (h === 'CAS RN' ? 'cas' : h === 'Quantity' ? 'QTY' : h.toLowerCase())),
    );
    const checked = await preview(text);
    expect(checked.errors).toEqual([]);
    expect(checked.status).toBe('ready');
    expect(checked.totalRows).toBe(5);
    expect(checked.processedRows).toBe(5);
    expect(checked.summary).toMatchObject({
      rows: 5,
      chemicals: { new: 3, existing: 1 },
      lots: { new: 5, existing: 0 },
      containers: { new: 5, generatedLabelCodes: 4 },
      locations: { new: 6, existing: 0 },
    });
    expect(checked.summary!.newLocationPaths).toContain(`${lab} › Cabinet A › Shelf 2`);
    expect(await totals()).toEqual(before);

    const committed = importSchema.parse((await commit(checked.id).expect(200)).body);
    expect(committed.status).toBe('committed');
    expect(committed.committedAt).not.toBeNull();
    const after = await totals();
    expect(after.containers - before.containers).toBe(5);
    expect(after.chemicals - before.chemicals).toBe(3);
    expect(after.lots - before.lots).toBe(5);
    expect(after.locations - before.locations).toBe(6);

    const listed = pageSchema(containerSchema).parse(
      (await get(`/api/containers?q=${encodeURIComponent('Copper(II)')}`).expect(200)).body,
    );
    const copper = listed.items.find((c) => c.labelCode === 'LW-90001')!;
    expect(copper).toMatchObject({ quantity: 1500, unit: 'g', tareMass: 210, status: 'sealed' });
    expect(copper.location.path).toBe(`${lab} › Cabinet A › Shelf 2`);
    const ledger = (await get(`/api/containers/${copper.id}/ledger`).expect(200)).body;
    expect(ledger.items).toHaveLength(1);
    expect(ledger.items[0]).toMatchObject({
      reason: 'received',
      quantity: 1500,
      balanceAfter: 1500,
    });
    expect(ledger.items[0].note).toContain(`import #${checked.id}`);

    const naoh = pageSchema(containerSchema).parse(
      (await get(`/api/containers?q=${encodeURIComponent('hydroxide solution 1')}`).expect(200))
        .body,
    );
    expect(naoh.items.map((c) => [c.quantity, c.unit]).sort()).toEqual([
      [100, 'mL'],
      [1000, 'mL'],
    ]);
    expect(naoh.items[0]!.chemical).toMatchObject({
      storageGroup: 'base',
      ghsPictograms: ['GHS05'],
    });

    const thf = pageSchema(containerSchema).parse(
      (await get(`/api/containers?q=Tetrahydrofuran`).expect(200)).body,
    ).items[0]!;
    expect(thf).toMatchObject({ status: 'open', openedOn: '2025-10-03', unit: 'mL' });
    expect(thf.peroxide).not.toBeNull();
    expect(thf.chemical).toMatchObject({ peroxideClass: 'B', storageGroup: 'flammable' });
    expect(thf.chemical.hazardStatements).toEqual(['H225', 'H319', 'H335', 'H351']);

    // The known chemical gained a container and was not renamed.
    const knownNow = (await get(`/api/chemicals/${known.id}`).expect(200)).body;
    expect(knownNow.name).toBe('Known salt');

    const check = ledgerCheckResultSchema.parse(
      (await get('/api/maintenance/ledger-check', admin).expect(200)).body,
    );
    expect(check.ok).toBe(true);
  });

  it('when the same file is committed twice, then the second commit answers 409', async () => {
    const checked = await preview(csv([row()]));
    await commit(checked.id).expect(200);
    const again = await commit(checked.id).expect(409);
    expect(again.body.error.code).toBe('conflict');
    expect(again.body.error.message).toMatch(/already/);
  });

  it('when the CSV is sent as JSON text, then it is checked the same way', async () => {
    const response = await request(app())
      .post('/api/imports')
      .set('Cookie', manager)
      .send({ fileName: 'pasted.csv', text: csv([row()]) })
      .expect(201);
    expect(importSchema.parse(response.body)).toMatchObject({
      status: 'ready',
      fileName: 'pasted.csv',
    });
  });

  it('when a semicolon-separated file uses decimal commas, then the numbers read right', async () => {
    const text =
      'Chemical;Quantity;Unit;Location;Density (g/mL)\r\nDemo oil;12,5;mL;' + room() + ';0,91\r\n';
    const checked = await preview(text);
    expect(checked.errors).toEqual([]);
    expect(checked.status).toBe('ready');
  });
});

describe('the example file in docs/', () => {
  it('when docs/examples/stock-import.csv is imported, then it has no problems and commits', async () => {
    const text = readFileSync(path.join(repoRoot, 'docs/examples/stock-import.csv'), 'utf8');
    // Its places are the demo rooms; make them this test's own.
    const checked = await preview(
      text.replace(/Room 10(\d)/g, (_m, n) => `Example room ${n}-${Date.now()}`),
    );
    expect(checked.errors).toEqual([]);
    expect(checked.summary).toMatchObject({ rows: 15, containers: { new: 15 } });
    const committed = importSchema.parse((await commit(checked.id).expect(200)).body);
    expect(committed.status).toBe('committed');
  });
});

describe('problems in the file', () => {
  it('when required columns are missing, then one file-level problem names them all and nothing is read', async () => {
    const checked = await preview(csv([row()], ['Chemical', 'CAS RN', 'Location']));
    expect(checked.status).toBe('invalid');
    expect(checked.errors).toHaveLength(1);
    expect(checked.errors[0]).toMatchObject({ row: null, column: null });
    expect(checked.errors[0]!.message).toMatch(/no columns for Quantity, Unit/);
    await commit(checked.id).expect(409);
  });

  it('when a CAS RN has a wrong check digit, then the row and the column as written are named', async () => {
    const checked = await preview(
      csv(
        [row(), row({ 'CAS RN': '64-17-6' })],
        columns.map((h) => (h === 'CAS RN' ? 'CAS No' : h)),
      ),
    );
    expect(checked.status).toBe('invalid');
    expect(checked.errors).toEqual([
      {
        row: 3,
        column: 'CAS No',
        field: 'casNumber',
        value: '64-17-6',
        message: '"64-17-6" is not a valid CAS RN: check digit should be 5',
      },
    ]);
  });

  it('when a unit is unknown, then the message lists the valid units', async () => {
    const checked = await preview(csv([row({ Unit: 'bottles' })]));
    expect(checked.errors[0]).toMatchObject({ row: 2, column: 'Unit', field: 'unit' });
    expect(checked.errors[0]!.message).toMatch(
      /"bottles" is not a unit Lotwise knows: use one of µg, mg, g, kg, µL, mL, L/,
    );
  });

  it('when cells are bad in several ways, then each gets its own problem with a fix', async () => {
    const checked = await preview(
      csv([
        row({ Quantity: '-3' }),
        row({ 'Storage group': 'explosives' }),
        row({ 'Received on': '03/01/2026' }),
        row({ 'GHS pictograms': 'GHS02, skull' }),
        row({ Quantity: '', Location: '' }),
        row({ 'Expires on': '2020-01-01' }),
        row({ Unit: 'mol' }),
      ]),
    );
    const byRow = new Map(checked.errors.map((e) => [`${e.row} ${e.field}`, e.message]));
    expect(byRow.get('2 quantity')).toMatch(/cannot be negative/);
    expect(byRow.get('3 storageGroup')).toMatch(/use one of: flammable, .*low-hazard/);
    expect(byRow.get('4 receivedOn')).toMatch(/YYYY-MM-DD/);
    expect(byRow.get('5 ghsPictograms')).toMatch(/"skull" is not a GHS pictogram code/);
    expect(byRow.get('6 quantity')).toMatch(/is required/);
    expect(byRow.get('6 location')).toMatch(/is required/);
    expect(byRow.get('7 expiresOn')).toMatch(/before the received date 2025-09-01/);
    expect(byRow.get('8 unit')).toMatch(/mass or volume/);
    expect(checked.errorCount).toBe(checked.errors.length);
  });

  it('when a quantity is a barcode, too large once converted, or below a millionth, then the row is refused on Quantity and nothing is written', async () => {
    const checked = await preview(
      csv([
        row({ Quantity: '4006381333931' }),
        row({ Quantity: '1e308' }),
        row({ Quantity: '10001', Unit: 'kg' }),
        row({ Quantity: '0.0000001' }),
        row({ Quantity: '10000', Unit: 'kg' }),
        row({ 'Tare (g)': '9007199254740993' }),
      ]),
    );
    const byRow = new Map(checked.errors.map((e) => [`${e.row} ${e.field}`, e.message]));
    expect(byRow.get('2 quantity')).toMatch(/at most 10,000,000/);
    expect(byRow.get('3 quantity')).toMatch(/at most 10,000,000/);
    expect(byRow.get('4 quantity')).toMatch(
      /10,001.000 kg is 10,001,000.00 g .* at most 10,000,000 g/,
    );
    expect(byRow.get('5 quantity')).toMatch(/too small/);
    expect(byRow.has('6 quantity')).toBe(false);
    expect(byRow.get('7 tareMass')).toMatch(/at most 10,000,000/);
    expect(checked.status).toBe('invalid');
  });

  it('when label codes repeat in the file or are already in Lotwise, then those rows are named', async () => {
    const shelf = await make.location();
    const lot = await make.lot((await make.chemical()).id);
    const existing = await make.container(lot.id, shelf.id);
    const checked = await preview(
      csv([
        row({ 'Label code': 'SHELF-7' }),
        row({ 'Label code': 'shelf-7' }),
        row({ 'Label code': existing.labelCode.toLowerCase() }),
        row({ 'Label code': 'LW-7777' }),
        row({ 'Label code': 'lw-07777' }),
      ]),
    );
    expect(checked.errors.map((e) => [e.row, e.field])).toEqual([
      [3, 'labelCode'],
      [4, 'labelCode'],
      [6, 'labelCode'],
    ]);
    expect(checked.errors[0]!.message).toMatch(/also on row 2/);
    expect(checked.errors[1]!.message).toMatch(
      new RegExp(`${existing.labelCode} is already the label of a container in Lotwise`),
    );
    expect(checked.errors[2]!.message).toMatch(/LW-07777 is also on row 5/);
  });

  it('when a file keeps a supplier’s code as the label, then scanning that code opens the container', async () => {
    const code = `FW-${Date.now().toString(36)}/7`;
    const checked = await preview(csv([row({ 'Label code': code })]));
    expect(checked.errors).toEqual([]);
    await commit(checked.id).expect(200);
    const found = containerDetailSchema.parse(
      (await get(`/api/containers/by-label/${encodeURIComponent(code)}`).expect(200)).body,
    );
    expect(found.labelCode).toBe(code);
    expect(found.quantity).toBe(500);
  });

  it('when one chemical gets two storage groups, then the later row is named', async () => {
    const checked = await preview(
      csv([
        row({ Chemical: 'Demo acid X', 'CAS RN': '', 'Storage group': 'inorganic-acid' }),
        row({ Chemical: 'demo acid x', 'CAS RN': '', 'Storage group': 'base' }),
      ]),
    );
    expect(checked.errors).toHaveLength(1);
    expect(checked.errors[0]).toMatchObject({ row: 3, field: 'storageGroup' });
    expect(checked.errors[0]!.message).toMatch(/differs from row 2 \(inorganic-acid\)/);
  });

  it('when the upload is a workbook or nothing at all, then it is refused clearly', async () => {
    const workbook = Buffer.from([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]);
    const refused = await request(app())
      .post('/api/imports')
      .set('Cookie', manager)
      .attach('file', workbook, 'stock.xlsx')
      .expect(415);
    expect(refused.body.error.message).toMatch(/save it from the spreadsheet as "CSV/);
    await request(app()).post('/api/imports').set('Cookie', manager).send({}).expect(400);
    const empty = await preview('\r\n\r\n');
    expect(empty.status).toBe('invalid');
    expect(empty.errors[0]!.message).toMatch(/empty/);
  });

  it('when a member tries to import, then it is forbidden', async () => {
    await upload(csv([row()]), member).expect(403);
  });
});

describe('all or nothing', () => {
  it('when a label code is taken between preview and commit, then the commit fails with 409 and nothing is written', async () => {
    const code = 'LW-77001';
    const lab = room('Rollback lab');
    const rows = [
      row({ Chemical: 'Rollback reagent A', Location: `${lab} › Cabinet 1` }),
      row({ Chemical: 'Rollback reagent B', Location: `${lab} › Cabinet 2` }),
      ...Array.from({ length: 30 }, () => row({ Location: `${lab} › Cabinet 3` })),
      row({ Chemical: 'Rollback reagent C', 'Label code': code, Location: `${lab} › Cabinet 4` }),
    ];
    const first = await preview(csv(rows));
    expect(first.status).toBe('ready');

    // Someone else imports a container with that code in the meantime.
    const other = await preview(csv([row({ 'Label code': code })]));
    await commit(other.id).expect(200);

    const before = await totals();
    const failed = await commit(first.id).expect(409);
    expect(failed.body.error.message).toMatch(
      /Row 34: the label code LW-77001 was given to another container/,
    );
    expect(failed.body.error.message).toMatch(/Nothing was imported/);
    expect(await totals()).toEqual(before);
    const names = (await get(`/api/chemicals?q=Rollback reagent`).expect(200)).body;
    expect(names.total).toBe(0);
    const places = (await get(`/api/locations?q=${encodeURIComponent(lab)}`).expect(200)).body;
    expect(places.total).toBe(0);

    const after = importSchema.parse((await get(`/api/imports/${first.id}`).expect(200)).body);
    expect(after.status).toBe('failed');
    expect(after.failure).toMatch(/LW-77001/);
    expect(after.errors[0]).toMatchObject({ row: 34, field: 'labelCode' });
    await commit(first.id).expect(409);
  });
});

describe('imports left behind by a stopped server', () => {
  it('when an import was read as still being checked but has finished since, then it is not marked failed', async () => {
    const checked = await preview(csv([row()]));
    expect(checked.status).toBe('ready');
    const { imports } = testContext().store.repos;
    const head = (await imports.findHead(checked.id))!;
    const stale = { id: head.id, status: 'validating' as const, updatedAt: head.updatedAt };
    expect(await imports.markInterrupted(stale, 'stopped', new Date().toISOString())).toBe(false);
    expect((await imports.findHead(checked.id))!.status).toBe('ready');
    expect((await get(`/api/imports/${checked.id}`).expect(200)).body.status).toBe('ready');
  });
});

describe('large files', () => {
  it('when a file has 10,000 rows, then the POST answers 202 and progress reaches every row, through validation and commit', async () => {
    const chemicalsInFile = Array.from({ length: 40 }, (_, i) => ({
      name: `Bulk reagent ${i}-${Date.now().toString(36)}`,
      cas: uniqueCasNumber(),
    }));
    const lab = room('Bulk store');
    const header = [
      'Chemical',
      'CAS RN',
      'Supplier',
      'Supplier lot no.',
      'Quantity',
      'Unit',
      'Location',
    ];
    let text = csvLine(header);
    for (let i = 0; i < 10_000; i++) {
      const chemical = chemicalsInFile[i % chemicalsInFile.length]!;
      text += csvLine([
        chemical.name,
        chemical.cas,
        'Fernwood Chemicals (fictional)',
        `BULK-${i % 200}`,
        String(100 + (i % 50)),
        'g',
        `${lab} › Cabinet ${i % 8} › Shelf ${i % 4}`,
      ]);
    }
    const before = await totals();
    const started = await upload(text, manager, 'bulk.csv').expect(202);
    expect(started.body.status).toBe('validating');
    expect(started.body.totalRows).toBe(10_000);

    const seenValidating: number[] = [];
    const ready = await waitFor(started.body.id, ['ready', 'invalid', 'failed'], seenValidating);
    expect(ready.errors).toEqual([]);
    expect(ready.status).toBe('ready');
    expect(ready.processedRows).toBe(ready.totalRows);
    expect(ready.summary).toMatchObject({
      chemicals: { new: 40 },
      containers: { new: 10_000, generatedLabelCodes: 10_000 },
      locations: { new: 1 + 8 + 8 },
    });
    expect(seenValidating.every((n, i) => i === 0 || n >= seenValidating[i - 1]!)).toBe(true);

    const committing = await commit(ready.id).expect(202);
    expect(committing.body.status).toBe('committing');
    const seenCommitting: number[] = [];
    const done = await waitFor(ready.id, ['committed', 'failed'], seenCommitting);
    expect(done.failure).toBeNull();
    expect(done.status).toBe('committed');
    expect(done.processedRows).toBe(10_000);
    expect((await totals()).containers - before.containers).toBe(10_000);

    const check = ledgerCheckResultSchema.parse(
      (await get('/api/maintenance/ledger-check', admin).expect(200)).body,
    );
    expect(check.ok).toBe(true);
    const listed = (await get('/api/imports?pageSize=200').expect(200)).body;
    expect(listed.items.some((item: { id: number }) => item.id === ready.id)).toBe(true);
  }, 120_000);
});
