import {
  alertListSchema,
  containerSchema,
  formatQuantity,
  importColumns,
  pageSchema,
  stockItemSchema,
} from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../lib/csv';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
});

const get = (path: string, cookie = manager) => request(app()).get(path).set('Cookie', cookie);

function csvText(path: string) {
  return get(path)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks).toString('utf8')));
    })
    .expect(200);
}

describe('one writing of an amount', () => {
  it('when 0.852 mL is left, then the overview, the container, the alert, the e-mail and the CSV all say 0.852 mL', async () => {
    const chemical = await make.chemical({
      name: `Amount text ether ${Date.now()}`,
      physicalState: 'liquid',
      stockUnit: 'mL',
      density: 0.713,
      reorderPoint: 1,
    });
    const shelf = await make.location();
    const lot = await make.lot(chemical.id);
    const container = await make.container(lot.id, shelf.id, { quantity: 2, unit: 'mL' });
    await request(app())
      .post(`/api/containers/${container.id}/draws`)
      .set('Cookie', manager)
      .send({ amount: 1.148, unit: 'mL' })
      .expect(201);
    const shown = '0.852 mL';

    const overview = pageSchema(stockItemSchema).parse(
      (await get(`/api/stock?pageSize=200&q=${encodeURIComponent(chemical.name)}`).expect(200))
        .body,
    );
    const item = overview.items.find((i) => i.chemical.id === chemical.id)!;
    expect(item.display.text).toBe(shown);

    // The container page and table write the amount with the same function.
    const detail = containerSchema.parse(
      (await get(`/api/containers/${container.id}`).expect(200)).body,
    );
    expect(formatQuantity(detail.quantity, detail.unit)).toBe(shown);

    const alerts = alertListSchema.parse((await get('/api/alerts').expect(200)).body);
    const alert = alerts.items.find(
      (a) => a.kind === 'low-stock' && a.chemical?.id === chemical.id,
    )!;
    expect(alert.message).toContain(`${shown} usable`);

    const [mail] = (await testContext().dataSource.query(
      'SELECT subject, text, html FROM outbox WHERE dedup_key LIKE ? LIMIT 1',
      [`low-stock:chemical:${chemical.id}:%`],
    )) as { subject: string; text: string; html: string }[];
    expect(mail!.subject).toContain(`${shown} left`);
    expect(mail!.text).toContain(`Usable stock: ${shown}`);
    expect(mail!.text).toContain(`${container.labelCode} · ${shown} ·`);
    expect(mail!.html).toContain(shown);

    // The CSV keeps a plain number beside its unit, so it imports again: the same digits.
    const { records } = parseCsv(
      (await csvText(`/api/exports/containers.csv?locationId=${shelf.id}`)).body as string,
    );
    const quantity = importColumns.findIndex((c) => c.key === 'quantity');
    const unit = importColumns.findIndex((c) => c.key === 'unit');
    expect(`${records[1]![quantity]} ${records[1]![unit]}`).toBe(shown);
  });
});
