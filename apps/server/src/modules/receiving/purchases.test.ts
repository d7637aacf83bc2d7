import {
  minorToDecimalText,
  orderMoneySchema,
  purchaseListSchema,
  receiptSchema,
} from '@lotwise/shared';
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { makeOrder, recordPayment } from '../../test/orders-in-database';

const app = () => testContext().app;
let manager = '';
let aliceCookie = '';
let brunoCookie = '';
let alice: { id: number; displayName: string };
let bruno: { id: number; displayName: string };
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  const a = await signedIn('member');
  aliceCookie = a.cookie;
  alice = a.user;
  const b = await signedIn('member');
  brunoCookie = b.cookie;
  bruno = b.user;
});

const get = (path: string, cookie = manager) => request(app()).get(path).set('Cookie', cookie);

/**
 * 500 g at €49.99 shared 100 / 300 / 100 (lab) and two 1 L bottles at €12.00, one each, with
 * €9.95 shipping and a €15.00 hazardous-goods fee split by value: €98.94 in all.
 */
async function sharedOrder(supplierInvoiceMinor: number | null = 9900) {
  const powder = await make.chemical({ physicalState: 'solid', stockUnit: 'g' });
  const liquid = await make.chemical({
    physicalState: 'liquid',
    stockUnit: 'mL',
    density: 0.789,
  });
  const record = await makeOrder({
    supplierInvoiceMinor,
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
  const share = (userId: number | null, lineIndex: number) =>
    record.shares.find((s) => s.userId === userId && s.lineId === record.lines[lineIndex]!.id)!;
  return { record, share };
}

const sum = (values: number[]) => values.reduce((total, value) => total + value, 0);

describe('money of a shared order', () => {
  it('when some shares are paid, one refunded and one unpaid, then collected, refunded and owed add up to the cent', async () => {
    const { record, share } = await sharedOrder();
    const orderId = record.order.id;
    expect(record.cost.totalMinor).toBe(4999 + 2400 + 995 + 1500);
    // Alice pays both her shares online; Bruno pays his powder in cash and owes the bottle;
    // the lab pays from its funds and gets €1.00 back.
    await recordPayment(
      orderId,
      share(alice.id, 0).id,
      'checkout',
      share(alice.id, 0).amountMinor!,
    );
    await recordPayment(
      orderId,
      share(alice.id, 1).id,
      'checkout',
      share(alice.id, 1).amountMinor!,
    );
    await recordPayment(orderId, share(bruno.id, 0).id, 'cash', share(bruno.id, 0).amountMinor!);
    await recordPayment(orderId, share(null, 0).id, 'lab_funds', share(null, 0).amountMinor!);
    await recordPayment(orderId, share(null, 0).id, 'refund', 100);
    // A declined attempt and one still open count for nothing.
    await recordPayment(
      orderId,
      share(bruno.id, 1).id,
      'checkout',
      share(bruno.id, 1).amountMinor!,
      'failed',
    );
    await recordPayment(
      orderId,
      share(bruno.id, 1).id,
      'checkout',
      share(bruno.id, 1).amountMinor!,
      'pending',
    );

    const money = orderMoneySchema.parse(
      (await get(`/api/orders/${orderId}/money`).expect(200)).body,
    );
    const amounts = record.shares.map((s) => s.amountMinor!);
    expect(sum(amounts)).toBe(record.cost.totalMinor);
    expect(money.totalMinor).toBe(9894);
    expect(money.collectedMinor).toBe(9894 - share(bruno.id, 1).amountMinor!);
    expect(money.refundedMinor).toBe(100);
    expect(money.owedMinor).toBe(share(bruno.id, 1).amountMinor!);
    expect(money.collectedMinor + money.owedMinor).toBe(money.totalMinor);
    expect(money.netCollectedMinor).toBe(money.collectedMinor - 100);
    expect(money.supplierInvoiceMinor).toBe(9900);
    expect(money.invoiceDifferenceMinor).toBe(6);
    // Per share: goods + fees = amount, and the rows add up to the totals.
    for (const row of money.shares) expect(row.goodsMinor + row.feesMinor).toBe(row.amountMinor);
    expect(sum(money.shares.map((r) => r.amountMinor!))).toBe(money.totalMinor);
    expect(sum(money.shares.map((r) => r.goodsMinor))).toBe(money.goodsMinor);
    expect(sum(money.shares.map((r) => r.feesMinor))).toBe(money.feesMinor);
    expect(sum(money.shares.map((r) => r.collectedMinor))).toBe(money.collectedMinor);
    expect(sum(money.shares.map((r) => r.owedMinor))).toBe(money.owedMinor);
    expect(money.shares.find((r) => r.forLab)?.holder).toBe('Lab');
    expect(money.movements).toHaveLength(5);

    // The CSV carries the same figures as plain decimals with one currency column.
    const csv = await get(`/api/orders/${orderId}/money.csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment/);
    const rows = parse(csv.text, { bom: true, columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(5);
    const cents = (column: string) =>
      sum(rows.map((row) => Math.round(Number(row[column]!.replace('.', '')))));
    expect(rows.every((row) => /^\d+\.\d{2}$/.test(row.amount!) && row.currency === 'EUR')).toBe(
      true,
    );
    expect(cents('amount')).toBe(money.totalMinor);
    expect(cents('goods') + cents('fees')).toBe(money.totalMinor);
    expect(cents('collected')).toBe(money.collectedMinor);
    expect(cents('refunded')).toBe(100);
    expect(cents('owed')).toBe(money.owedMinor);

    // The file of all orders has this order's line with the same sums.
    const all = await get('/api/orders/money.csv').expect(200);
    const orders = parse(all.text, { bom: true, columns: true }) as Record<string, string>[];
    expect(orders.find((row) => row.order_id === String(orderId))).toMatchObject({
      total: '98.94',
      refunded: '1.00',
      owed: minorToDecimalText(money.owedMinor, 'EUR'),
      supplier_invoice: '99.00',
      invoice_difference: '0.06',
      currency: 'EUR',
    });
  });

  it('when a member opens their purchases, then each order shows what they owe, paid and got back', async () => {
    const { record, share } = await sharedOrder(null);
    const orderId = record.order.id;
    await recordPayment(
      orderId,
      share(bruno.id, 0).id,
      'checkout',
      share(bruno.id, 0).amountMinor!,
    );
    await recordPayment(orderId, share(bruno.id, 0).id, 'refund', 250);
    const list = purchaseListSchema.parse(
      (await get('/api/purchases', brunoCookie).expect(200)).body,
    );
    const item = list.items.find((i) => i.orderId === orderId)!;
    expect(item.amountMinor).toBe(
      share(bruno.id, 0).amountMinor! + share(bruno.id, 1).amountMinor!,
    );
    expect(item.collectedMinor).toBe(share(bruno.id, 0).amountMinor);
    expect(item.refundedMinor).toBe(250);
    expect(item.owedMinor).toBe(share(bruno.id, 1).amountMinor);
    expect(item.shareCount).toBe(2);
    expect(list.totals.owedMinor).toBe(sum(list.items.map((i) => i.owedMinor)));
  });

  it('when an order is cancelled, then nothing is owed on it any more', async () => {
    const { record } = await sharedOrder();
    await testContext().store.repos.orders.updateOrder(record.order.id, { status: 'cancelled' });
    const money = orderMoneySchema.parse(
      (await get(`/api/orders/${record.order.id}/money`).expect(200)).body,
    );
    expect(money.owedMinor).toBe(0);
  });

  it('when a member asks for the receipt, then it lists their lines with goods and fees, their payments and totals', async () => {
    const { record, share } = await sharedOrder();
    const orderId = record.order.id;
    await recordPayment(
      orderId,
      share(alice.id, 0).id,
      'checkout',
      share(alice.id, 0).amountMinor!,
    );
    await recordPayment(orderId, share(alice.id, 1).id, 'cash', share(alice.id, 1).amountMinor!);
    const receipt = receiptSchema.parse(
      (await get(`/api/orders/${orderId}/receipt`, aliceCookie).expect(200)).body,
    );
    expect(receipt.labName).toBe(testContext().config.labName);
    expect(receipt.member.id).toBe(alice.id);
    expect(receipt.supplier.name).toMatch(/Kestrel Fine Reagents/);
    expect(receipt.lines.map((l) => [l.quantity, l.unit])).toEqual([
      [100, 'g'],
      [1, 'L'],
    ]);
    const mine = share(alice.id, 0).amountMinor! + share(alice.id, 1).amountMinor!;
    expect(receipt.totals.amountMinor).toBe(mine);
    expect(receipt.totals.goodsMinor + receipt.totals.feesMinor).toBe(mine);
    for (const line of receipt.lines)
      expect(line.goodsMinor + line.feesMinor).toBe(line.amountMinor);
    expect(receipt.payments.map((p) => p.kind)).toEqual(['checkout', 'cash']);
    expect(receipt.totals.collectedMinor).toBe(mine);
    expect(receipt.totals.owedMinor).toBe(0);
    expect(receipt.totals.netPaidMinor).toBe(mine);
    // Someone else's payments never show on it.
    expect(
      receipt.payments.every(
        (p) => p.shareId === share(alice.id, 0).id || p.shareId === share(alice.id, 1).id,
      ),
    ).toBe(true);
  });

  it('when a member has no share in the order, then there is no receipt for them', async () => {
    const outsider = await signedIn('member');
    const { record } = await sharedOrder();
    await get(`/api/orders/${record.order.id}/receipt`, outsider.cookie).expect(404);
  });

  it('when a member asks for the coordinator views, then they are refused', async () => {
    const { record } = await sharedOrder();
    await get(`/api/orders/${record.order.id}/money`, aliceCookie).expect(403);
    await get(`/api/orders/${record.order.id}/money.csv`, aliceCookie).expect(403);
    await get('/api/orders/money.csv', aliceCookie).expect(403);
  });
});
