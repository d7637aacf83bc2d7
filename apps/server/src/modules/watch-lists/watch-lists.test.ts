import { addDays, isValidCasNumber } from '@lotwise/chem';
import {
  chemicalSchema,
  meetsThreshold,
  orderDetailSchema,
  thresholdText,
  todayIso,
  watchListDetailSchema,
  watchListSchema,
  watchReportSchema,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { watchListPresets } from '../../db/migrations/1796990000000-watch-list-presets';
import { nowIso } from '../../db/sql';
import { signedIn, stockFactory, uniqueCasNumber } from '../../test/factories';
import { testContext } from '../../test/harness';
import { CatalogItemEntity } from '../suppliers/catalog-item.entity';
import { SupplierEntity } from '../suppliers/supplier.entity';
import { watchedHoldingsIn } from './watch-matching';

const app = () => testContext().app;
let admin = '';
let manager = '';
let member = '';
let managerName = '';
const stock = stockFactory(() => manager);
let sequence = 0;

beforeAll(async () => {
  admin = (await signedIn('admin')).cookie;
  const m = await signedIn('manager');
  manager = m.cookie;
  managerName = m.user.displayName;
  member = (await signedIn('member')).cookie;
});

const send = (method: 'post' | 'patch' | 'delete', path: string, body: object, cookie = admin) =>
  request(app())[method](path).set('Cookie', cookie).send(body);
const get = (path: string, cookie = admin) => request(app()).get(path).set('Cookie', cookie);

async function lists() {
  const response = await get('/api/watch-lists', member).expect(200);
  return watchListSchema.array().parse(response.body.items);
}

async function choosePreset(namePart: string, chosen = true) {
  const list = (await lists()).find((l) => l.name.includes(namePart))!;
  await send('patch', `/api/watch-lists/${list.id}`, { chosen }).expect(200);
  return list;
}

/** A lab's own list with one row for a fresh CAS RN. */
async function ownList(row: object) {
  const casNumber = uniqueCasNumber();
  const response = await send('post', '/api/watch-lists', {
    jurisdiction: 'Example county (fictional)',
    name: `Own list ${++sequence}`,
    source: 'County order 7 (fictional)',
    entries: [
      {
        substance: 'Test substance',
        casNumber,
        action: 'Tell the county office.',
        source: 'Paragraph 2',
        ...row,
      },
    ],
  }).expect(201);
  return { list: watchListDetailSchema.parse(response.body), casNumber };
}

async function chemical(overrides: object) {
  const response = await send(
    'post',
    '/api/chemicals',
    {
      name: `Reagent ${++sequence}`,
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 1.1,
      formula: null,
      ...overrides,
    },
    manager,
  ).expect(201);
  return chemicalSchema.parse(response.body);
}

describe('presets', () => {
  it('when the database is migrated, then the EU and US lists are there, none chosen, every CAS RN valid', async () => {
    const all = await lists();
    const builtIn = all.filter((l) => l.builtIn);
    expect(builtIn.map((l) => l.name)).toEqual(
      expect.arrayContaining([
        'EU explosives precursors, restricted (Annex I)',
        'EU explosives precursors, reportable (Annex II)',
        'DEA List I chemicals (examples)',
        'DEA List II chemicals',
      ]),
    );
    expect(builtIn.every((l) => !l.chosen)).toBe(true);
    for (const preset of watchListPresets) {
      for (const entry of preset.entries) {
        // CAS check digit: the weighted digit sum modulo 10 (CAS Registry, check digit rule)
        expect(isValidCasNumber(entry.casNumber), `${entry.substance} ${entry.casNumber}`).toBe(
          true,
        );
      }
    }
    const annexI = builtIn.find((l) => l.name.includes('Annex I)'))!;
    const detail = watchListDetailSchema.parse(
      (await get(`/api/watch-lists/${annexI.id}`, member).expect(200)).body,
    );
    const peroxide = detail.entries.find((e) => e.casNumber === '7722-84-1')!;
    // from memory: Regulation (EU) 2019/1148 Annex I, hydrogen peroxide limit value 12 % w/w
    expect(thresholdText(peroxide)).toBe('above 12 % w/w');
    const nitrate = detail.entries.find((e) => e.casNumber === '6484-52-2')!;
    // from memory: Regulation (EU) 2019/1148 Annex I, ammonium nitrate 16 % N by weight
    expect(thresholdText(nitrate)).toBe(
      'at or above 16 % nitrogen by weight (of ammonium nitrate)',
    );
  });

  it('when a built-in list is changed beyond chosen or deleted, then it is refused', async () => {
    const list = (await lists()).find((l) => l.builtIn)!;
    const changed = await send('patch', `/api/watch-lists/${list.id}`, { name: 'Mine' }).expect(
      409,
    );
    expect(changed.body.error.fields.name).toBe('built-in lists are read-only');
    await send('delete', `/api/watch-lists/${list.id}`, {}).expect(409);
  });

  it('when a manager or member tries to choose a list, then only the admin may', async () => {
    const list = (await lists())[0]!;
    await send('patch', `/api/watch-lists/${list.id}`, { chosen: true }, manager).expect(403);
    await send('patch', `/api/watch-lists/${list.id}`, { chosen: true }, member).expect(403);
  });
});

describe('matching', () => {
  it('when the threshold is "above", then a concentration below or at it is not watched and above it is', () => {
    const row = { thresholdPercent: 12, comparison: 'above' as const };
    // from memory: Regulation (EU) 2019/1148 Annex I, "above the limit value"
    expect(meetsThreshold(11.9, row)).toBe(false);
    expect(meetsThreshold(12, row)).toBe(false);
    expect(meetsThreshold(12.1, row)).toBe(true);
    // common practice, no source: an unknown concentration is read as the pure substance
    expect(meetsThreshold(null, row)).toBe(true);
    expect(meetsThreshold(16, { thresholdPercent: 16, comparison: 'at-or-above' })).toBe(true);
    expect(meetsThreshold(0.1, { thresholdPercent: null, comparison: 'above' })).toBe(true);
  });

  it('when a chosen list names the CAS RN, then the chemical JSON lists it only at a concentration that meets the threshold', async () => {
    const { list, casNumber } = await ownList({ thresholdPercent: 30, comparison: 'above' });
    const below = await chemical({ casNumber, defaultPurityPercent: 30 });
    expect(below.watchListings).toEqual([]);
    await send('patch', `/api/chemicals/${below.id}`, { defaultPurityPercent: 35 }, manager).expect(
      200,
    );
    const above = chemicalSchema.parse((await get(`/api/chemicals/${below.id}`, member)).body);
    expect(above.watchListings).toEqual([
      expect.objectContaining({
        listId: list.id,
        listName: list.name,
        jurisdiction: 'Example county (fictional)',
        threshold: 'above 30 % w/w',
        action: 'Tell the county office.',
        source: 'County order 7 (fictional); Paragraph 2',
      }),
    ]);
    const page = await get(`/api/chemicals?q=${encodeURIComponent(casNumber)}`, member).expect(200);
    expect(page.body.items[0].watchListings).toHaveLength(1);
    await send('patch', `/api/watch-lists/${list.id}`, { chosen: false }).expect(200);
    const unchosen = chemicalSchema.parse((await get(`/api/chemicals/${below.id}`, member)).body);
    expect(unchosen.watchListings).toEqual([]);
  });

  it('when EU Annex I is chosen, then hydrogen peroxide 30 % is watched and 3 % would not be', async () => {
    await choosePreset('restricted (Annex I)');
    const peroxide = await chemical({
      name: 'Hydrogen peroxide 30 %',
      casNumber: '7722-84-1',
      physicalState: 'solution',
      defaultPurityPercent: 30,
    });
    expect(peroxide.watchListings?.map((l) => l.listName)).toEqual([
      'EU explosives precursors, restricted (Annex I)',
    ]);
    await send(
      'patch',
      `/api/chemicals/${peroxide.id}`,
      { defaultPurityPercent: 3 },
      manager,
    ).expect(200);
    const weak = chemicalSchema.parse((await get(`/api/chemicals/${peroxide.id}`, member)).body);
    expect(weak.watchListings).toEqual([]);
    await send(
      'patch',
      `/api/chemicals/${peroxide.id}`,
      { defaultPurityPercent: 30 },
      manager,
    ).expect(200);
  });
});

describe('receiving and drawing', () => {
  it('when a watched chemical is received or drawn without a note, then it is refused with the list named; with one, who and why are on the ledger', async () => {
    const { list, casNumber } = await ownList({});
    const watched = await chemical({ name: 'Watched solvent', casNumber });
    const lot = await stock.lot(watched.id);
    const place = await stock.location();
    const refused = await send(
      'post',
      '/api/containers',
      {
        lotId: lot.id,
        locationId: place.id,
        quantity: 500,
        unit: 'mL',
      },
      manager,
    ).expect(400);
    expect(refused.body.error.fields.note).toBe(`say why: Watched solvent is on ${list.name}`);
    const container = await stock.container(lot.id, place.id, {
      unit: 'mL',
      note: 'Teaching stock for the spring practicals',
    });
    const draw = await send(
      'post',
      `/api/containers/${container.id}/draws`,
      { amount: 10, unit: 'mL' },
      member,
    ).expect(400);
    expect(draw.body.error.fields.note).toContain('say why: Watched solvent is on');
    await send(
      'post',
      `/api/containers/${container.id}/draws`,
      {
        amount: 10,
        unit: 'mL',
        note: 'Recrystallisation, bench 3',
      },
      member,
    ).expect(201);
    const ledger = await get(`/api/containers/${container.id}/ledger`, member).expect(200);
    const notes = ledger.body.items.map((e: { note: string }) => e.note);
    expect(notes).toEqual(
      expect.arrayContaining([
        `Received into ${place.path}: Teaching stock for the spring practicals`,
        'Recrystallisation, bench 3',
      ]),
    );
    const held = await watchedHoldingsIn(testContext().store.repos, [place.id]);
    expect(held).toEqual([
      expect.objectContaining({
        containerId: container.id,
        chemicalName: 'Watched solvent',
        lists: list.name,
        locationPath: place.path,
        quantity: 490,
        unit: 'mL',
      }),
    ]);
    expect(await watchedHoldingsIn(testContext().store.repos, [])).toEqual([]);

    const report = watchReportSchema.parse(
      (await get(`/api/watch-lists/report?from=${todayIso()}&to=${todayIso()}`).expect(200)).body,
    );
    expect(report.holdings.some((h) => h.containerId === container.id)).toBe(true);
    const moves = report.movements.filter((m) => m.containerId === container.id);
    expect(moves.map((m) => [m.reason, m.delta])).toEqual([
      ['received', 500],
      ['drawn', -10],
    ]);
    expect(moves[1]!.note).toBe('Recrystallisation, bench 3');
    expect(moves[1]!.userName).not.toBe('');
    const yesterday = addDays(todayIso(), -1);
    const earlier = watchReportSchema.parse(
      (await get(`/api/watch-lists/report?from=${yesterday}&to=${yesterday}`).expect(200)).body,
    );
    expect(earlier.movements.filter((m) => m.containerId === container.id)).toEqual([]);

    const csv = await get(`/api/watch-lists/report.csv?from=${todayIso()}&to=${todayIso()}`).expect(
      200,
    );
    expect(csv.headers['content-type']).toContain('text/csv');
    expect(csv.headers['content-disposition']).toContain('lotwise-watched-chemicals-');
    expect(csv.text).toContain('Container,Chemical,CAS RN,Lists,Location,Quantity,Unit');
    expect(csv.text).toContain(`${container.labelCode},Watched solvent,${casNumber}`);
    expect(csv.text).toContain('Recrystallisation, bench 3');
    await get(`/api/watch-lists/report?from=${todayIso()}&to=${todayIso()}`, manager).expect(403);
    await get(`/api/watch-lists/report?from=2026-02-02&to=2026-02-01`).expect(400);
  });
});

async function supplier() {
  const now = nowIso();
  const row = await testContext()
    .dataSource.getRepository(SupplierEntity)
    .save({
      name: `Fictional Precursors ${++sequence}`,
      contactName: 'Order desk',
      email: 'orders@supplier.example.test',
      phone: '',
      website: '',
      orderingNotes: '',
      minimumOrderMinor: 0,
      shippingFeeMinor: 500,
      hazardousFeeMinor: 0,
      archived: false,
      createdAt: now,
      updatedAt: now,
    });
  return row.id;
}

async function item(supplierId: number, chemicalId: number) {
  const now = nowIso();
  const row = await testContext()
    .dataSource.getRepository(CatalogItemEntity)
    .save({
      supplierId,
      sku: `SKU-W-${++sequence}`,
      chemicalId,
      packSize: 500,
      packUnit: 'mL',
      grade: 'reagent',
      purityPercent: 99,
      priceMinor: 1500,
      currency: 'EUR',
      hazardous: false,
      splittable: true,
      discontinued: false,
      createdAt: now,
      updatedAt: now,
    });
  return row.id;
}

describe('orders', () => {
  it('when an order holds a watched chemical, then it opens only after a manager approves it with a reason; a new watched line clears the approval', async () => {
    const { list, casNumber } = await ownList({});
    const watched = await chemical({ name: 'Listed solvent', casNumber });
    const plain = await chemical({ name: 'Plain solvent', casNumber: uniqueCasNumber() });
    const supplierId = await supplier();
    const created = await send(
      'post',
      '/api/orders',
      {
        supplierId,
        title: 'Term order',
        claimDeadline: addDays(todayIso(), 7),
        lines: [
          { catalogItemId: await item(supplierId, watched.id), packs: 1 },
          { catalogItemId: await item(supplierId, plain.id), packs: 1 },
        ],
      },
      manager,
    ).expect(201);
    const draft = orderDetailSchema.parse(created.body);
    expect(draft.watch).toMatchObject({ approvalNeeded: true, approval: null });
    expect(draft.watch?.chemicals.map((c) => c.name)).toEqual(['Listed solvent']);

    const refused = await send('post', `/api/orders/${draft.id}/open`, {}, manager).expect(409);
    expect(refused.body.error.message).toContain(`Listed solvent (on ${list.name})`);

    await send('post', `/api/orders/${draft.id}/watch-approval`, { reason: '' }, manager).expect(
      400,
    );
    await send(
      'post',
      `/api/orders/${draft.id}/watch-approval`,
      { reason: 'For the titration course' },
      member,
    ).expect(403);
    const approved = orderDetailSchema.parse(
      (
        await send(
          'post',
          `/api/orders/${draft.id}/watch-approval`,
          {
            reason: 'Spring practicals, 12 students, quantities checked',
          },
          manager,
        ).expect(200)
      ).body,
    );
    expect(approved.watch).toMatchObject({
      approvalNeeded: false,
      approval: {
        approvedByName: managerName,
        reason: 'Spring practicals, 12 students, quantities checked',
        chemicalIds: [watched.id],
      },
    });

    const restricted = await chemical({
      name: 'Restricted oxidiser',
      casNumber: uniqueCasNumber(),
      restricted: true,
    });
    const added = orderDetailSchema.parse(
      (
        await send(
          'post',
          `/api/orders/${draft.id}/lines`,
          {
            catalogItemId: await item(supplierId, restricted.id),
            packs: 1,
          },
          manager,
        ).expect(201)
      ).body,
    );
    expect(added.watch).toMatchObject({ approvalNeeded: true, approval: null });
    const again = await send('post', `/api/orders/${draft.id}/open`, {}, manager).expect(409);
    expect(again.body.error.message).toContain('Restricted oxidiser (marked restricted)');

    await send(
      'post',
      `/api/orders/${draft.id}/watch-approval`,
      { reason: 'Both checked with the head of department' },
      manager,
    ).expect(200);
    const opened = orderDetailSchema.parse(
      (await send('post', `/api/orders/${draft.id}/open`, {}, manager).expect(200)).body,
    );
    expect(opened.status).toBe('open');
    const audit = await get(`/api/audit?targetType=order&targetId=${draft.id}`).expect(200);
    const actions = audit.body.items.map((e: { action: string }) => e.action);
    expect(actions).toEqual(
      expect.arrayContaining([
        'order.watch_approved',
        'order.watch_approval_cleared',
        'order.opened',
      ]),
    );
  });

  it('when an order holds no watched chemical, then it opens as before and approval is refused', async () => {
    const plain = await chemical({ name: 'Ordinary salt', casNumber: uniqueCasNumber() });
    const supplierId = await supplier();
    const created = await send(
      'post',
      '/api/orders',
      {
        supplierId,
        title: 'Plain order',
        claimDeadline: addDays(todayIso(), 7),
        lines: [{ catalogItemId: await item(supplierId, plain.id), packs: 1 }],
      },
      manager,
    ).expect(201);
    await send(
      'post',
      `/api/orders/${created.body.id}/watch-approval`,
      { reason: 'Not needed here' },
      manager,
    ).expect(409);
    await send('post', `/api/orders/${created.body.id}/open`, {}, manager).expect(200);
  });
});
