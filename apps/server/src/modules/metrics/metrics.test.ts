import type { OutboxStatus } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createApp, metricsOf } from '../../app';
import { signedIn } from '../../test/factories';
import { testContext } from '../../test/harness';
import { version } from '../../version';

/** The value of one sample line of the Prometheus text, e.g. `name{label="x"}`. */
function sample(text: string, series: string): number | null {
  for (const line of text.split('\n')) {
    if (line.startsWith(`${series} `)) {
      const value = line.slice(series.length + 1);
      return value === '+Inf' ? Infinity : value === 'Nan' ? NaN : Number(value);
    }
  }
  return null;
}

async function scrape(app = testContext().app): Promise<string> {
  const response = await request(app).get('/api/metrics').expect(200);
  expect(response.headers['content-type']).toMatch(/^text\/plain; version=0\.0\.4/);
  return response.text;
}

async function queueMessage(status: OutboxStatus, createdAt: string) {
  await testContext().store.repos.alerts.insertMessage({
    userId: null,
    recipientEmail: 'metrics.reader@example.test',
    kind: 'low-stock',
    subject: 'Low stock',
    text: 'text',
    html: '<p>text</p>',
    link: null,
    dedupKey: null,
    delivery: 'immediate',
    status,
    attempts: 0,
    lastError: null,
    nextAttemptAt: status === 'queued' ? createdAt : null,
    claimedBy: null,
    leaseUntil: null,
    createdAt,
    updatedAt: createdAt,
    sentAt: null,
  });
}

const minutesAgo = (minutes: number) => new Date(Date.now() - minutes * 60_000).toISOString();

describe('metrics', () => {
  it('when requests were answered, then latency is counted by route pattern and status class, never by raw URL', async () => {
    const { app } = testContext();
    await request(app).get('/api/containers/31337').expect(401);
    await request(app).get('/api/no-such-thing/31337').expect(404);
    await request(app).get('/api/health').expect(200);
    const text = await scrape();
    expect(
      sample(
        text,
        'lotwise_http_request_duration_seconds_count{method="GET",route="/api/containers/:id",status_class="4xx"}',
      ),
    ).toBe(1);
    expect(
      sample(
        text,
        'lotwise_http_request_duration_seconds_count{method="GET",route="unmatched",status_class="4xx"}',
      ),
    ).toBe(1);
    expect(
      sample(
        text,
        'lotwise_http_request_duration_seconds_bucket{le="+Inf",method="GET",route="/api/health",status_class="2xx"}',
      ),
    ).toBe(1);
    expect(text).not.toContain('31337');
  });

  it('when the process runs, then its default metrics and the running version are there too', async () => {
    const text = await scrape();
    expect(sample(text, `lotwise_build_info{version="${version}"}`)).toBe(1);
    expect(text).toContain('process_cpu_user_seconds_total');
    expect(text).toContain('nodejs_eventloop_lag_seconds');
    expect(text).toContain('process_resident_memory_bytes');
  });

  it('when e-mails wait in the outbox, then its depth by status and the oldest queued age are reported', async () => {
    let text = await scrape();
    expect(sample(text, 'lotwise_outbox_messages{status="queued"}')).toBe(0);
    expect(sample(text, 'lotwise_outbox_oldest_queued_age_seconds')).toBe(0);

    await queueMessage('queued', minutesAgo(30));
    await queueMessage('queued', minutesAgo(2));
    await queueMessage('failed', minutesAgo(90));
    await queueMessage('sent', minutesAgo(120));
    text = await scrape();
    expect(sample(text, 'lotwise_outbox_messages{status="queued"}')).toBe(2);
    expect(sample(text, 'lotwise_outbox_messages{status="sending"}')).toBe(0);
    expect(sample(text, 'lotwise_outbox_messages{status="failed"}')).toBe(1);
    const age = sample(text, 'lotwise_outbox_oldest_queued_age_seconds')!;
    // the 30-minute-old message, not the failed or the sent one
    expect(age).toBeGreaterThanOrEqual(30 * 60);
    expect(age).toBeLessThan(31 * 60);
  });

  it('when ledger changes wait for the alert rules, then the count and the age of the oldest are reported', async () => {
    const { store } = testContext();
    let text = await scrape();
    expect(sample(text, 'lotwise_alert_notes_pending')).toBe(0);
    expect(sample(text, 'lotwise_alert_lag_seconds')).toBe(0);

    await store.repos.ledgerNotes.noteChanges([1, 2], minutesAgo(10));
    await store.repos.ledgerNotes.noteChanges([3], minutesAgo(1));
    text = await scrape();
    expect(sample(text, 'lotwise_alert_notes_pending')).toBe(3);
    const lag = sample(text, 'lotwise_alert_lag_seconds')!;
    expect(lag).toBeGreaterThanOrEqual(10 * 60);
    expect(lag).toBeLessThan(11 * 60);
  });

  it('when the backups give their latest time, then the backup age follows it: NaN unset, +Inf without any backup', async () => {
    const { app } = testContext();
    expect(sample(await scrape(), 'lotwise_backup_age_seconds')).toBeNaN();

    metricsOf(app).setLatestBackupProvider(() => null);
    expect(sample(await scrape(), 'lotwise_backup_age_seconds')).toBe(Infinity);

    metricsOf(app).setLatestBackupProvider(async () => new Date(Date.now() - 3600_000));
    const age = sample(await scrape(), 'lotwise_backup_age_seconds')!;
    expect(age).toBeGreaterThanOrEqual(3600);
    expect(age).toBeLessThan(3660);
    metricsOf(app).setLatestBackupProvider(null);
  });
});

describe('who may read the metrics', () => {
  const cookies: Record<'admin' | 'manager', string> = { admin: '', manager: '' };
  beforeAll(async () => {
    cookies.admin = (await signedIn('admin')).cookie;
    cookies.manager = (await signedIn('manager')).cookie;
  });

  /** The app behind one trusted reverse proxy on this machine. */
  function behindProxy(trustProxy: false | string[]) {
    const { dataSource, config } = testContext();
    return createApp({ dataSource, config: { ...config, trustProxy } });
  }

  it('when a client of this machine asks, then it gets the metrics without signing in', async () => {
    await scrape();
  });

  it('when a trusted proxy forwards another client, then only a signed-in admin gets them (401, 403 else)', async () => {
    const app = behindProxy(['loopback']);
    const remote = (test: request.Test) => test.set('X-Forwarded-For', '203.0.113.7');
    const anonymous = await remote(request(app).get('/api/metrics')).expect(401);
    expect(anonymous.body.error.code).toBe('unauthenticated');
    await remote(request(app).get('/api/metrics').set('Cookie', cookies.manager)).expect(403);
    const admin = await remote(request(app).get('/api/metrics').set('Cookie', cookies.admin));
    expect(admin.status).toBe(200);
    expect(admin.text).toContain('lotwise_outbox_messages');
    // a client that claims to be loopback itself is still the address the proxy saw
    await request(app)
      .get('/api/metrics')
      .set('X-Forwarded-For', '127.0.0.1, 203.0.113.7')
      .expect(401);
  });

  it('when TRUST_PROXY is off and a proxy on this machine forwards a request, then it does not count as local', async () => {
    const app = behindProxy(false);
    await request(app).get('/api/metrics').set('X-Forwarded-For', '203.0.113.7').expect(401);
    await request(app).get('/api/metrics').set('Forwarded', 'for=203.0.113.7').expect(401);
    await request(app).get('/api/metrics').set('X-Real-IP', '203.0.113.7').expect(401);
    await request(app).get('/api/metrics').expect(200);
  });
});
