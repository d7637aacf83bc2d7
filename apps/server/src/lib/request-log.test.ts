import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../app';
import { createUser, signIn, testPassword } from '../test/factories';
import { createDataSource } from '../db/data-source';
import { testContext } from '../test/harness';
import { createLogger } from './logger';
import { inRequestContext, outsideRequest } from './request-context';

interface LogLine {
  level: string;
  time: string;
  msg: string;
  reqId?: string;
  userId?: number;
  method?: string;
  route?: string;
  status?: number;
  ms?: number;
  [key: string]: unknown;
}

/** An app whose log lines (level info and up) are kept in `lines`, as stdout would get them. */
function loggedApp() {
  const raw: string[] = [];
  const logger = createLogger('info', { write: (line: string) => void raw.push(line) });
  const { dataSource, config } = testContext();
  const app = createApp({ dataSource, config: { ...config, logLevel: 'info' }, logger });
  const lines = () => raw.map((line) => JSON.parse(line) as LogLine);
  return { app, logger, raw, lines };
}

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

describe('request logs', () => {
  let logged: ReturnType<typeof loggedApp>;
  beforeAll(() => {
    logged = loggedApp();
  });

  it('when a request comes without an id, then it gets one, echoed in X-Request-Id and on its log line', async () => {
    const response = await request(logged.app).get('/api/containers/424242').expect(401);
    const id = response.headers['x-request-id'];
    expect(id).toMatch(uuid);
    const line = logged.lines().find((entry) => entry.reqId === id && entry.msg === 'request');
    expect(line).toMatchObject({
      level: 'info',
      method: 'GET',
      route: '/api/containers/:id',
      status: 401,
    });
    expect(typeof line?.ms).toBe('number');
    // the route pattern, never the URL with its id
    expect(JSON.stringify(line)).not.toContain('424242');
  });

  it('when a plain X-Request-Id is sent, then it is kept; a long or odd one is replaced', async () => {
    const kept = await request(logged.app)
      .get('/api/auth/me')
      .set('X-Request-Id', 'proxy-7f3a.42:1')
      .expect(401);
    expect(kept.headers['x-request-id']).toBe('proxy-7f3a.42:1');
    expect(logged.lines().some((entry) => entry.reqId === 'proxy-7f3a.42:1')).toBe(true);

    for (const odd of ['a'.repeat(129), 'two words', '{"reqId":"x"}', 'ünïcode']) {
      const replaced = await request(logged.app).get('/api/auth/me').set('X-Request-Id', odd);
      expect(replaced.headers['x-request-id']).toMatch(uuid);
    }
  });

  it('when signed in, then the line carries the user id, and neither password nor session cookie appears in any line', async () => {
    const { user, email } = await createUser({ role: 'member' });
    logged.raw.length = 0;
    const cookie = await signIn(logged.app, email);
    const me = await request(logged.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
    const line = logged
      .lines()
      .find((entry) => entry.reqId === me.headers['x-request-id'] && entry.msg === 'request');
    expect(line).toMatchObject({ route: '/api/auth/me', status: 200, userId: user.id });
    const everything = logged.raw.join('\n');
    expect(everything).not.toContain(testPassword);
    expect(everything).not.toContain(cookie.split('=')[1]!);
  });

  it('when a service logs deep inside a request (after its body was read), then that line carries the request id', async () => {
    const response = await request(logged.app)
      .post('/api/webhooks/stripe')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', 't=1,v1=forged')
      .send('{"id":"evt_forged","object":"event"}')
      .expect(400);
    const id = response.headers['x-request-id'];
    const warning = logged
      .lines()
      .find((entry) => entry.msg.startsWith('Refused a payment webhook'));
    expect(warning).toMatchObject({ level: 'warn', reqId: id });
  });

  it('when a request fails on an unexpected error, then the error line with its stack and the request line share the request id', async () => {
    const raw: string[] = [];
    const logger = createLogger('info', { write: (line: string) => void raw.push(line) });
    // a second connection to the test database, closed under its app
    const { config } = testContext();
    const dataSource = createDataSource(config.databaseUrl ?? config.databasePath);
    await dataSource.initialize();
    try {
      const app = createApp({ dataSource, config, logger });
      const { email } = await createUser({ role: 'viewer' });
      const cookie = await signIn(app, email);
      await dataSource.destroy();
      const failed = await request(app).get('/api/chemicals').set('Cookie', cookie).expect(500);
      const id = failed.headers['x-request-id'];
      const lines = raw.map((line) => JSON.parse(line) as LogLine);
      expect(lines.find((line) => line.msg === 'Unhandled error')).toMatchObject({
        level: 'error',
        reqId: id,
        route: '/api/chemicals',
      });
      expect(lines.find((line) => line.msg === 'request failed')).toMatchObject({
        level: 'error',
        reqId: id,
        status: 500,
      });
    } finally {
      if (dataSource.isInitialized) await dataSource.destroy();
    }
  });

  it('when a detail holds a password, a token, a cookie or an Authorization header, then the line shows [redacted]', () => {
    logged.raw.length = 0;
    logged.logger.warn('Something sensitive', {
      password: 'hunter2-secret',
      token: 'tok-secret',
      detail: { cookie: 'lotwise_session=abc-secret', authorization: 'Bearer xyz-secret' },
      req: { headers: { authorization: 'Bearer q-secret', cookie: 'c-secret' } },
    });
    const text = logged.raw.join('\n');
    expect(text).not.toMatch(/secret/);
    expect(text).toContain('[redacted]');
  });

  it('when code runs in a request context, then the logger adds reqId and userId to its lines', () => {
    logged.raw.length = 0;
    const req = { headers: { 'x-request-id': 'ctx-1' } } as never;
    const res = { locals: { user: { id: 77 } } } as never;
    inRequestContext(req, res, () => logged.logger.info('inside'));
    expect(logged.lines()[0]).toMatchObject({ msg: 'inside', reqId: 'ctx-1', userId: 77 });
  });

  it("when a request wakes a worker, then the worker's later lines carry no request id", async () => {
    logged.raw.length = 0;
    const req = { headers: { 'x-request-id': 'ctx-2' } } as never;
    const res = { locals: {} } as never;
    let worker: Promise<void> = Promise.resolve();
    inRequestContext(req, res, () => {
      worker = outsideRequest(async () => {
        await new Promise((resolve) => setImmediate(resolve));
        logged.logger.info('worker batch');
      });
    });
    await worker;
    expect(logged.lines()[0]).toMatchObject({ msg: 'worker batch' });
    expect(logged.lines()[0]).not.toHaveProperty('reqId');
  });
});
