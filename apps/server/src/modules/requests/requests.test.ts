import { memberRequestSchema, pageSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { OrderLineEntity } from '../orders/order-line.entity';
import { OrderShareEntity } from '../orders/order-share.entity';
import { OrderEntity } from '../orders/order.entity';
import { catalogueFactory } from '../reorder/test-catalogue';

const app = () => testContext().app;
let manager = '';
let member: Awaited<ReturnType<typeof signedIn>>;
let otherMember = '';
let viewer = '';
const make = stockFactory(() => manager);
const catalogue = catalogueFactory();

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  member = await signedIn('member');
  otherMember = (await signedIn('member')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const post = (path: string, body: object, cookie: string) =>
  request(app()).post(path).set('Cookie', cookie).send(body);
const get = (path: string, cookie: string) => request(app()).get(path).set('Cookie', cookie);

const nextYear = `${new Date().getUTCFullYear() + 1}-03-01`;

async function ask(chemicalId: number, quantity = 50, cookie = member.cookie) {
  const response = await post(
    '/api/requests',
    { chemicalId, quantity, unit: 'g', neededBy: nextYear, note: 'for the club’s crystal evening' },
    cookie,
  ).expect(201);
  return memberRequestSchema.parse(response.body);
}

describe('member requests', () => {
  it('when a member asks for 50 g by March, then the request is open and theirs alone', async () => {
    const chemical = await make.chemical({ ghsPictograms: ['GHS07'], hazardStatements: ['H319'] });
    const asked = await ask(chemical.id);
    expect(asked).toMatchObject({
      chemical: { id: chemical.id, ghsPictograms: ['GHS07'], hazardStatements: ['H319'] },
      requester: { id: member.user.id },
      quantity: 50,
      unit: 'g',
      neededBy: nextYear,
      status: 'open',
      orderId: null,
    });
    const own = pageSchema(memberRequestSchema).parse(
      (await get('/api/requests', member.cookie).expect(200)).body,
    );
    expect(own.items.map((r) => r.id)).toContain(asked.id);
    const others = pageSchema(memberRequestSchema).parse(
      (await get('/api/requests', otherMember).expect(200)).body,
    );
    expect(others.items.map((r) => r.id)).not.toContain(asked.id);
    await get(`/api/requests/${asked.id}`, otherMember).expect(404);
    const all = pageSchema(memberRequestSchema).parse(
      (await get('/api/requests?status=open', manager).expect(200)).body,
    );
    expect(all.items.map((r) => r.id)).toContain(asked.id);
    await post('/api/requests', { chemicalId: chemical.id, quantity: 1, unit: 'g' }, viewer).expect(
      403,
    );
  });

  it('when the unit or the date is wrong, then the field is named and nothing is stored', async () => {
    const chemical = await make.chemical();
    const wrongUnit = await post(
      '/api/requests',
      { chemicalId: chemical.id, quantity: 5, unit: 'mL' },
      member.cookie,
    ).expect(400);
    expect(wrongUnit.body.error.fields.unit).toContain('must be g');
    const past = await post(
      '/api/requests',
      { chemicalId: chemical.id, quantity: 5, unit: 'g', neededBy: '2020-01-01' },
      member.cookie,
    ).expect(400);
    expect(past.body.error.fields.neededBy).toBe('must be today or later');
    const zero = await post(
      '/api/requests',
      { chemicalId: chemical.id, quantity: 0, unit: 'g' },
      member.cookie,
    ).expect(400);
    expect(zero.body.error.fields.quantity).toContain('must be more than 0');
  });

  it('when a member withdraws their open request, then it is withdrawn and cannot be withdrawn again', async () => {
    const chemical = await make.chemical();
    const asked = await ask(chemical.id);
    await post(`/api/requests/${asked.id}/withdraw`, {}, otherMember).expect(404);
    const withdrawn = memberRequestSchema.parse(
      (await post(`/api/requests/${asked.id}/withdraw`, {}, member.cookie).expect(200)).body,
    );
    expect(withdrawn.status).toBe('withdrawn');
    await post(`/api/requests/${asked.id}/withdraw`, {}, member.cookie).expect(409);
    await post(`/api/requests/${asked.id}/fold`, {}, manager).expect(409);
  });
});

describe('folding a request into an order', () => {
  it('when the coordinator folds it, then the member has a share on a new draft order line', async () => {
    const chemical = await make.chemical();
    const supplier = await catalogue.supplier({ shippingFeeMinor: 800 });
    const item = await catalogue.item(supplier.id, chemical.id, {
      packSize: 250,
      priceMinor: 2000,
      splittable: true,
    });
    const asked = await ask(chemical.id, 50);
    await post(`/api/requests/${asked.id}/fold`, {}, member.cookie).expect(403);
    const folded = memberRequestSchema.parse(
      (await post(`/api/requests/${asked.id}/fold`, {}, manager).expect(200)).body,
    );
    expect(folded.status).toBe('folded');
    expect(folded.orderId).not.toBeNull();
    const { dataSource } = testContext();
    const order = await dataSource
      .getRepository(OrderEntity)
      .findOneByOrFail({ id: folded.orderId! });
    expect(order).toMatchObject({ status: 'draft', supplierId: supplier.id });
    const lines = await dataSource.getRepository(OrderLineEntity).findBy({ orderId: order.id });
    expect(lines.map((l) => [l.catalogItemId, l.packs])).toEqual([[item.id, 1]]);
    const share = await dataSource
      .getRepository(OrderShareEntity)
      .findOneByOrFail({ id: folded.shareId! });
    expect(share).toMatchObject({
      orderId: order.id,
      lineId: lines[0]!.id,
      userId: member.user.id,
      forLab: false,
      quantity: 50,
      requestId: asked.id,
      paymentStatus: 'unpaid',
    });
  });

  it('when a line has no room left, then it gets another pack; an unsplittable pack is claimed whole', async () => {
    const chemical = await make.chemical();
    const supplier = await catalogue.supplier();
    const item = await catalogue.item(supplier.id, chemical.id, { packSize: 100, priceMinor: 900 });
    const first = await ask(chemical.id, 60);
    const firstFolded = memberRequestSchema.parse(
      (await post(`/api/requests/${first.id}/fold`, {}, manager).expect(200)).body,
    );
    const second = await ask(chemical.id, 30, otherMember);
    const secondFolded = memberRequestSchema.parse(
      (
        await post(
          `/api/requests/${second.id}/fold`,
          { orderId: firstFolded.orderId! },
          manager,
        ).expect(200)
      ).body,
    );
    expect(secondFolded.orderId).toBe(firstFolded.orderId);
    const { dataSource } = testContext();
    const lines = await dataSource
      .getRepository(OrderLineEntity)
      .findBy({ orderId: firstFolded.orderId! });
    // 60 g and 30 g of 100 g packs that cannot be split: one whole pack each, two packs on the line
    expect(lines.map((l) => [l.catalogItemId, l.packs])).toEqual([[item.id, 2]]);
    const shares = await dataSource
      .getRepository(OrderShareEntity)
      .findBy({ orderId: firstFolded.orderId! });
    expect(shares.map((s) => s.quantity)).toEqual([100, 100]);
  });

  it('when the order named has closed its claims or sells no such pack, then nothing changes', async () => {
    const chemical = await make.chemical();
    const other = await make.chemical();
    const supplier = await catalogue.supplier();
    await catalogue.item(supplier.id, other.id, { packSize: 100, priceMinor: 900 });
    const otherRequest = await ask(other.id, 20);
    const { orderId } = memberRequestSchema.parse(
      (await post(`/api/requests/${otherRequest.id}/fold`, {}, manager).expect(200)).body,
    );
    const asked = await ask(chemical.id, 20);
    const noPack = await post(`/api/requests/${asked.id}/fold`, { orderId }, manager).expect(409);
    expect(noPack.body.error.message).toContain('sells no pack');
    await testContext()
      .dataSource.getRepository(OrderEntity)
      .update({ id: orderId! }, { status: 'open', claimsClosedAt: new Date().toISOString() });
    await post(`/api/requests/${asked.id}/fold`, { orderId }, manager).expect(409);
    const still = memberRequestSchema.parse(
      (await get(`/api/requests/${asked.id}`, member.cookie).expect(200)).body,
    );
    expect(still).toMatchObject({ status: 'open', orderId: null, shareId: null });
  });
});
