import { importSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { chemicalInput, signedIn, stockFactory } from '../test/factories';
import { testContext } from '../test/harness';
import { csvLine } from './csv';
import { forbiddenKeyPath } from './validate';

const app = () => testContext().app;
let admin = '';
let manager = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  admin = (await signedIn('admin')).cookie;
  manager = (await signedIn('manager')).cookie;
});

const NUL = '\u0000';
const RLO = '\u202E'; // right-to-left override
const LRI = '\u2066'; // left-to-right isolate

const post = (path: string, body: object, cookie = manager) =>
  request(app()).post(path).set('Cookie', cookie).send(body);

describe('names refuse control and text-direction characters', () => {
  it('when a chemical name holds NUL or a right-to-left override, then the answer is 400 naming the field', async () => {
    for (const name of [`Ethanol${NUL}`, `${RLO}lonahtE`]) {
      const response = await post('/api/chemicals', chemicalInput({ name })).expect(400);
      expect(response.body.error.code).toBe('validation_failed');
      expect(response.body.error.fields.name).toMatch(/control characters or text-direction/);
    }
    const synonym = await post(
      '/api/chemicals',
      chemicalInput({ synonyms: ['ok', `spirit${LRI}`] }),
    ).expect(400);
    expect(synonym.body.error.fields['synonyms.1']).toMatch(/U\+2066, at character 7/);
  });

  it('when a place, a person, a procedure or a supplier has such a name, then each is refused by field', async () => {
    const place = await post('/api/locations', { name: `Shelf${RLO} 2` }).expect(400);
    expect(place.body.error.fields.name).toMatch(/U\+202E/);

    const person = await post(
      '/api/users',
      { email: 'bidi.person@example.test', displayName: `Ada\u0007`, role: 'member' },
      admin,
    ).expect(400);
    expect(person.body.error.fields.displayName).toMatch(/a control character, U\+0007/);

    const procedure = await post('/api/procedures', { title: `Aspirin${NUL}` }).expect(400);
    expect(procedure.body.error.fields.title).toMatch(/U\+0000/);

    const chemical = await make.chemical();
    const lot = await post('/api/lots', {
      chemicalId: chemical.id,
      source: 'purchased',
      supplierName: `Fernwood${RLO} (fictional)`,
    }).expect(400);
    expect(lot.body.error.fields.supplierName).toMatch(/U\+202E/);
  });

  it('when an ordinary name has accents, dashes or arrows, then it is accepted', async () => {
    await post(
      '/api/chemicals',
      chemicalInput({ name: 'N,N′-Dicyclohexyl­carbodiimide (α→β)' }),
    ).expect(201);
  });

  it('when an imported row names a chemical with a text-direction override, then the row is a problem', async () => {
    const text =
      csvLine(['Chemical', 'Quantity', 'Unit', 'Location']) +
      csvLine([`${RLO}lonahte`, '100', 'g', 'Room 7 › Shelf 1']);
    const response = await post('/api/imports', { text, fileName: 'bidi.csv' }).expect(201);
    const checked = importSchema.parse(response.body);
    expect(checked.status).toBe('invalid');
    expect(checked.errors[0]).toMatchObject({ row: 2, column: 'Chemical' });
    expect(checked.errors[0]!.message).toMatch(/text-direction control, U\+202E/);
  });
});

describe('keys that reach the prototype', () => {
  it('when a body holds __proto__, constructor or prototype at any depth, then the answer is 400 naming the key', async () => {
    const cases: [string, string][] = [
      ['{"name":"x","__proto__":{"admin":true}}', '__proto__'],
      ['{"synonyms":[{"constructor":{"prototype":{"x":1}}}]}', 'synonyms.0.constructor'],
      ['{"a":{"b":{"prototype":1}}}', 'a.b.prototype'],
    ];
    for (const [body, path] of cases) {
      const response = await request(app())
        .post('/api/chemicals')
        .set('Cookie', manager)
        .set('Content-Type', 'application/json')
        .send(body)
        .expect(400);
      const key = path.split('.').at(-1)!;
      expect(response.body.error.message).toContain(`"${key}"`);
      expect(response.body.error.fields).toEqual({ [path]: `"${key}" is not an allowed key` });
    }
    expect(({} as Record<string, unknown>).admin).toBeUndefined();
  });

  it('when a route takes no body schema, then such a key is still refused', async () => {
    const response = await request(app())
      .post('/api/auth/logout')
      .set('Cookie', manager)
      .set('Content-Type', 'application/json')
      .send('{"__proto__":{"x":1}}')
      .expect(400);
    expect(response.body.error.fields).toEqual({
      ['__proto__']: '"__proto__" is not an allowed key',
    });
  });

  it('when a value is deeply nested or only mentions the words as values, then the walk answers without overflowing', () => {
    let deep: unknown = { ok: 'constructor' };
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(forbiddenKeyPath(deep)).toBeNull();
    expect(forbiddenKeyPath(JSON.parse('[{"x":[{"__proto__":1}]}]'))).toBe('0.x.0.__proto__');
  });

  it('when the body is raw bytes (a signed webhook), then its bytes are not walked as keys', () => {
    const raw = Buffer.from('{"__proto__":{"x":1}}');
    expect(forbiddenKeyPath(raw)).toBeNull();
    expect(forbiddenKeyPath({ body: new Uint8Array(70_000) })).toBeNull();
  });
});
