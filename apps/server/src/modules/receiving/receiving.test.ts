import {
  containerDetailSchema,
  ledgerCheckResultSchema,
  ledgerEntrySchema,
  pageSchema,
  receivingViewSchema,
  type ReceiveOrder,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { makeOrder, payAll, recordPayment } from '../../test/orders-in-database';

const app = () => testContext().app;
let manager = '';
let admin = '';
let member = '';
let alice: { id: number; displayName: string };
let bruno: { id: number; displayName: string };
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  admin = (await signedIn('admin')).cookie;
  const a = await signedIn('member');
  member = a.cookie;
  alice = a.user;
  bruno = (await signedIn('member')).user;
});

const get = (path: string, cookie = manager) => request(app()).get(path).set('Cookie', cookie);
const post = (path: string, body: object, cookie = manager) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

async function ledgerOf(id: number) {
  const response = await get(`/api/containers/${id}/ledger?pageSize=200`).expect(200);
  return pageSchema(ledgerEntrySchema).parse(response.body).items.reverse();
}

async function container(id: number) {
  return containerDetailSchema.parse((await get(`/api/containers/${id}`).expect(200)).body);
}

/** A powder bought by the gram and a liquid counted in mL but sold by the litre. */
async function chemicals() {
  const powder = await make.chemical({ physicalState: 'solid', stockUnit: 'g' });
  const liquid = await make.chemical({
    physicalState: 'liquid',
    stockUnit: 'mL',
    density: 0.789,
    formula: 'C2H6O',
  });
  return { powder, liquid };
}

function body(
  record: Awaited<ReturnType<typeof makeOrder>>,
  locationId: number,
  extra: Partial<ReceiveOrder> = {},
): ReceiveOrder {
  return {
    receivedOn: '2026-03-10',
    locationId,
    lines: record.lines.map((line, index) => ({
      lineId: line.id,
      packsReceived: line.packs,
      supplierLotNumber: `B-${index + 1}`,
      expiresOn: '2028-03-31',
    })),
    ...extra,
  };
}

describe('receiving a shared order', () => {
  it('when a fully claimed order is received, then each share gets its own container with the right quantity, owner and ledger entries', async () => {
    const { powder, liquid } = await chemicals();
    const shelf = await make.location();
    const record = await makeOrder({
      lines: [
        {
          chemicalId: powder.id,
          packs: 1,
          packSize: 500,
          packUnit: 'g',
          unitPriceMinor: 4999,
          shares: [
            { userId: alice.id, quantity: 100 },
            { userId: bruno.id, quantity: 300 },
            { userId: null, quantity: 100 },
          ],
        },
        {
          chemicalId: liquid.id,
          packs: 2,
          packSize: 1,
          packUnit: 'L',
          unitPriceMinor: 1200,
          hazardous: true,
          splittable: false,
          shares: [
            { userId: alice.id, quantity: 1 },
            { userId: bruno.id, quantity: 1 },
          ],
        },
      ],
    });
    await payAll(record.order.id);

    const response = await post(`/api/orders/${record.order.id}/receive`, body(record, shelf.id));
    expect(response.status).toBe(200);
    const view = receivingViewSchema.parse(response.body);
    expect(view.status).toBe('received');
    expect(view.receivedAt).not.toBeNull();

    const [powderLine, liquidLine] = view.lines;
    const containers = view.lines.flatMap((line) => line.shares.map((s) => s.container!));
    expect(new Set(containers.map((c) => c.id)).size).toBe(5);
    expect(
      powderLine!.shares.map((s) => [s.holder, s.container!.quantity, s.container!.unit]),
    ).toEqual([
      [alice.displayName, 100, 'g'],
      [bruno.displayName, 300, 'g'],
      ['Lab', 100, 'g'],
    ]);
    // 1 L of a liquid counted in mL is 1000 mL.
    expect(liquidLine!.shares.map((s) => [s.container!.quantity, s.container!.unit])).toEqual([
      [1000, 'mL'],
      [1000, 'mL'],
    ]);

    // Owners: the members, and nobody for the lab's share.
    const owners = await Promise.all(
      powderLine!.shares.map(async (s) => (await container(s.container!.id)).owner),
    );
    expect(owners).toEqual([
      { id: alice.id, displayName: alice.displayName },
      { id: bruno.id, displayName: bruno.displayName },
      null,
    ]);

    // A lot per line, bought from the order's supplier, with the lot number and expiry given.
    const powderContainer = await container(powderLine!.shares[0]!.container!.id);
    const liquidContainer = await container(liquidLine!.shares[0]!.container!.id);
    expect(powderContainer.lot.id).not.toBe(liquidContainer.lot.id);
    expect(powderContainer.lot).toMatchObject({
      source: 'purchased',
      supplierLotNumber: 'B-1',
      expiresOn: '2028-03-31',
      receivedOn: '2026-03-10',
    });
    expect(powderContainer.lot.supplierName).toMatch(/Kestrel Fine Reagents/);
    expect(powderLine!.lot?.id).toBe(powderContainer.lot.id);
    expect(liquidLine!.lot?.id).toBe(liquidContainer.lot.id);

    // The pack was received whole into Bruno's (largest) portion, and the others poured off it.
    const pack = powderLine!.shares[1]!.container!;
    expect(
      (await ledgerOf(pack.id)).map((e) => [e.reason, e.quantity, e.balanceAfter, e.orderId]),
    ).toEqual([
      ['received', 500, 500, record.order.id],
      ['split', -100, 400, record.order.id],
      ['split', -100, 300, record.order.id],
    ]);
    expect(
      (await ledgerOf(powderLine!.shares[0]!.container!.id)).map((e) => [
        e.reason,
        e.quantity,
        e.relatedContainerId,
      ]),
    ).toEqual([['split', 100, pack.id]]);
    expect(
      (await ledgerOf(liquidLine!.shares[1]!.container!.id)).map((e) => [e.reason, e.quantity]),
    ).toEqual([['received', 1000]]);

    const check = ledgerCheckResultSchema.parse(
      (await get('/api/maintenance/ledger-check', admin).expect(200)).body,
    );
    expect(check.problems).toEqual([]);
    expect(check.ok).toBe(true);

    // The shares point at their containers.
    const shares = await testContext().store.repos.orders.sharesOf(record.order.id);
    expect(shares.every((s) => s.containerId !== null)).toBe(true);

    // Each member is told once where their portion is; the lab's share mails nobody.
    const mails: { user_id: number; subject: string; text: string }[] =
      await testContext().dataSource.query(
        `SELECT user_id, subject, text FROM outbox WHERE kind = 'order-portion-ready' AND user_id IN (?, ?)`,
        [alice.id, bruno.id],
      );
    expect(mails.map((m) => m.user_id).sort()).toEqual([alice.id, bruno.id].sort());
    const aliceMail = mails.find((m) => m.user_id === alice.id)!;
    expect(aliceMail.text).toContain(powderLine!.shares[0]!.container!.labelCode);
    expect(aliceMail.text).toContain(shelf.path);
    const brunoMail = mails.find((m) => m.user_id === bruno.id)!;
    expect(brunoMail.text).toContain(`300.00 g in container ${pack.labelCode}`);
  });

  it('when a share is sent to another place, then its portion goes there and the rest to the default place', async () => {
    const { powder } = await chemicals();
    const shelf = await make.location();
    const cupboard = await make.location();
    const record = await makeOrder({
      lines: [
        {
          chemicalId: powder.id,
          packs: 1,
          packSize: 250,
          packUnit: 'g',
          unitPriceMinor: 2500,
          shares: [
            { userId: alice.id, quantity: 50 },
            { userId: bruno.id, quantity: 200 },
          ],
        },
      ],
    });
    const aliceShare = record.shares.find((s) => s.userId === alice.id)!;
    const view = receivingViewSchema.parse(
      (
        await post(
          `/api/orders/${record.order.id}/receive`,
          body(record, shelf.id, { shares: [{ shareId: aliceShare.id, locationId: cupboard.id }] }),
        ).expect(200)
      ).body,
    );
    const [mine, theirs] = view.lines[0]!.shares;
    expect(mine!.container).toMatchObject({ locationId: cupboard.id, quantity: 50 });
    expect(theirs!.container).toMatchObject({ locationId: shelf.id, quantity: 200 });
  });

  it('when the order is not ordered, then receiving answers 409 and nothing is written', async () => {
    const { powder } = await chemicals();
    const shelf = await make.location();
    const record = await makeOrder({
      status: 'funded',
      lines: [
        {
          chemicalId: powder.id,
          packs: 1,
          packSize: 100,
          packUnit: 'g',
          unitPriceMinor: 1000,
          shares: [{ userId: alice.id, quantity: 100 }],
        },
      ],
    });
    const response = await post(`/api/orders/${record.order.id}/receive`, body(record, shelf.id));
    expect(response.status).toBe(409);
    expect(response.body.error.message).toMatch(/funded/);
    const after = (await testContext().store.repos.orders.load(record.order.id))!;
    expect(after.order.status).toBe('funded');
    expect(after.shares[0]!.containerId).toBeNull();
  });

  it('when fewer packs came than were ordered, then it answers 400 naming the line', async () => {
    const { powder } = await chemicals();
    const shelf = await make.location();
    const record = await makeOrder({
      lines: [
        {
          chemicalId: powder.id,
          packs: 2,
          packSize: 100,
          packUnit: 'g',
          unitPriceMinor: 1000,
          shares: [{ userId: alice.id, quantity: 200 }],
        },
      ],
    });
    const input = body(record, shelf.id);
    input.lines[0]!.packsReceived = 1;
    const response = await post(`/api/orders/${record.order.id}/receive`, input);
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toHaveProperty('lines.0.packsReceived');
  });

  it('when a container of a later line cannot be made, then the lots and containers made before it are rolled back', async () => {
    const { powder } = await chemicals();
    // Counted in g, sold in mL, and no density: its packs cannot be put in stock.
    const noDensity = await make.chemical({ physicalState: 'liquid', stockUnit: 'g' });
    const shelf = await make.location();
    const record = await makeOrder({
      lines: [
        {
          chemicalId: powder.id,
          packs: 1,
          packSize: 100,
          packUnit: 'g',
          unitPriceMinor: 1000,
          shares: [
            { userId: alice.id, quantity: 40 },
            { userId: bruno.id, quantity: 60 },
          ],
        },
        {
          chemicalId: noDensity.id,
          packs: 1,
          packSize: 500,
          packUnit: 'mL',
          unitPriceMinor: 900,
          shares: [{ userId: alice.id, quantity: 500 }],
        },
      ],
    });
    const { dataSource } = testContext();
    const count = async (table: string) =>
      Number((await dataSource.query(`SELECT COUNT(*) AS n FROM ${table}`))[0].n);
    const before = {
      lots: await count('lots'),
      containers: await count('containers'),
      entries: await count('ledger_entries'),
    };

    const response = await post(`/api/orders/${record.order.id}/receive`, body(record, shelf.id));
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/density/);
    expect({
      lots: await count('lots'),
      containers: await count('containers'),
      entries: await count('ledger_entries'),
    }).toEqual(before);
    const after = (await testContext().store.repos.orders.load(record.order.id))!;
    expect(after.order.status).toBe('ordered');
    expect(after.shares.every((s) => s.containerId === null)).toBe(true);
  });

  it('when a member without stock rights tries to receive, then it is refused', async () => {
    const response = await post(
      '/api/orders/1/receive',
      { receivedOn: '2026-03-10', locationId: 1, lines: [] },
      member,
    );
    expect(response.status).toBe(403);
  });
});

describe('closing a received order', () => {
  async function receivedOrder() {
    const { powder } = await chemicals();
    const shelf = await make.location();
    const record = await makeOrder({
      lines: [
        {
          chemicalId: powder.id,
          packs: 1,
          packSize: 100,
          packUnit: 'g',
          unitPriceMinor: 1000,
          shares: [
            { userId: alice.id, quantity: 30 },
            { userId: bruno.id, quantity: 70 },
          ],
        },
      ],
    });
    await post(`/api/orders/${record.order.id}/receive`, body(record, shelf.id)).expect(200);
    return record;
  }

  it('when a share is still unpaid, then closing answers 409 naming who still pays', async () => {
    const record = await receivedOrder();
    const bShare = record.shares.find((s) => s.userId === bruno.id)!;
    const aShare = record.shares.find((s) => s.userId === alice.id)!;
    await recordPayment(record.order.id, aShare.id, 'checkout', aShare.amountMinor!);
    const view = receivingViewSchema.parse(
      (await get(`/api/orders/${record.order.id}/receiving`).expect(200)).body,
    );
    expect(view.closable).toBe(false);
    const response = await post(`/api/orders/${record.order.id}/close`, {});
    expect(response.status).toBe(409);
    expect(response.body.error.message).toContain(bruno.displayName);
    await recordPayment(record.order.id, bShare.id, 'cash', bShare.amountMinor!);
    const closed = receivingViewSchema.parse(
      (await post(`/api/orders/${record.order.id}/close`, {}).expect(200)).body,
    );
    expect(closed.status).toBe('closed');
  });

  it('when a refund is still being processed, then the order cannot close', async () => {
    const record = await receivedOrder();
    await payAll(record.order.id);
    await recordPayment(record.order.id, record.shares[0]!.id, 'refund', 100, 'pending');
    const response = await post(`/api/orders/${record.order.id}/close`, {});
    expect(response.status).toBe(409);
    expect(response.body.error.message).toMatch(/refund/);
  });
});
