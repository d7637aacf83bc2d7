import { afterAll, beforeAll } from 'vitest';
import { signedIn } from '../../test/factories';
import { testConfig, testContext } from '../../test/harness';
import { startSmtpSink, type SmtpSink } from '../../test/smtp-sink';
import { alertsService } from './alerts.service';
import { createMailTransport } from './mail-transport';
import { outboxWorker } from './outbox-worker';

export type Person = Awaited<ReturnType<typeof signedIn>>;

/**
 * What the outbox tests share: an SMTP sink, an admin and a manager (made before the file's
 * tests, the sink closed after them), and workers and rows on the test database.
 */
export function outboxTestKit() {
  const kit = {
    sink: undefined as unknown as SmtpSink,
    admin: undefined as unknown as Person,
    manager: undefined as unknown as Person,
    workerAt,
    row,
    notices,
    notifyOne,
  };
  beforeAll(async () => {
    kit.sink = await startSmtpSink();
    kit.admin = await signedIn('admin');
    kit.manager = await signedIn('manager');
  });
  afterAll(async () => {
    await kit.sink.close();
  });

  /** A worker on the test database sending to the sink, on a clock the test moves. */
  function workerAt(start: Date, env: NodeJS.ProcessEnv = {}, port = kit.sink.port) {
    let now = start;
    const config = { ...testContext().config, ...pickAlerts(env) };
    const transport = createMailTransport({ kind: 'url', url: `smtp://127.0.0.1:${port}` })!;
    const worker = outboxWorker({
      store: testContext().store,
      transport,
      config,
      clock: () => now,
    });
    return {
      worker,
      advance(seconds: number) {
        now = new Date(now.getTime() + seconds * 1000);
      },
      now: () => now,
      close: () => transport.close(),
    };
  }

  function pickAlerts(env: NodeJS.ProcessEnv) {
    const config = testConfig(testContext().dir, env);
    return { alerts: config.alerts };
  }

  async function row(id: number) {
    const [found] = await testContext().dataSource.query('SELECT * FROM outbox WHERE id = ?', [id]);
    return found as {
      status: string;
      attempts: number;
      last_error: string | null;
      next_attempt_at: string | null;
      sent_at: string | null;
      claimed_by: string | null;
      lease_until: string | null;
    };
  }

  /** The failure notices written about outbox message `id`. */
  async function notices(id: number) {
    return (await testContext().dataSource.query(
      'SELECT recipient_email, kind, status FROM outbox WHERE dedup_key = ? ORDER BY id',
      [`outbox-failed:${id}`],
    )) as { recipient_email: string; kind: string; status: string }[];
  }

  /** Queues one message to `person` through the general message API, as an order would. */
  async function notifyOne(person: Person, at: Date, subject = 'Shared order #7 is open') {
    const { store, config, dataSource } = testContext();
    const alerts = alertsService(store, config);
    await store.transaction((repos) =>
      alerts.notify(
        repos,
        {
          kind: 'order-opened',
          recipients: [person.user.id],
          subject,
          text: 'Claim your share of the sodium chloride by Friday.',
          link: '/orders/7',
          dedupKey: `order-opened:7:${subject}`,
        },
        at,
      ),
    );
    const [last] = await dataSource.query('SELECT MAX(id) AS id FROM outbox');
    return Number(last.id);
  }

  return kit;
}
