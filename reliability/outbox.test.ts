import { afterAll, expect, it } from 'vitest';
import { ApiClient, demoUsers } from './lib/api';
import { reportFigure } from './lib/figures';
import { labMaker } from './lib/lab';
import { serverForThisFile } from './lib/suite';
import { freePort } from './lib/ports';
import { SmtpSink } from './lib/smtp-sink';

const lotwise = serverForThisFile('outbox');
let sink: SmtpSink | null = null;

afterAll(async () => {
  await sink?.close();
});

const chemicals = 30;
/** The sender is killed when this message's data has arrived, before the sink accepts it. */
const killBeforeAcceptAt = 20;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

interface OutboxItem {
  id: number;
  status: string;
  attempts: number;
  delivery: string;
  subject: string;
}

async function waitFor<T>(
  what: string,
  read: () => Promise<T>,
  done: (value: T) => boolean,
  timeoutMs: number,
): Promise<T> {
  const started = performance.now();
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (performance.now() - started > timeoutMs) {
      throw new Error(
        `${what}: not within ${timeoutMs} ms (${JSON.stringify(value).slice(0, 400)})`,
      );
    }
    await sleep(250);
  }
}

/** The outbox row id a Lotwise Message-ID names (`<lotwise.outbox.ID.CREATED@HOST>`). */
const rowOf = (messageId: string) => Number(/^<lotwise\.outbox\.(\d+)\./.exec(messageId)?.[1]);

it('when the mail server is down, then up, and the sender is killed mid-batch, then every e-mail is delivered exactly once (counted per Message-ID)', async () => {
  const smtpPort = await freePort(); // nobody listens there yet: the mail server is down
  const server = await lotwise.start({
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    OUTBOX_INTERVAL_SECONDS: '1',
    OUTBOX_LEASE_SECONDS: '5',
  });
  const admin = await ApiClient.signIn(server.origin, demoUsers.admin);
  const manager = await ApiClient.signIn(server.origin, demoUsers.manager);
  const outbox = async () =>
    (
      await admin.json<{ items: OutboxItem[] }>(
        'GET',
        '/api/outbox?pageSize=200&sort=createdAt.asc',
      )
    ).items.filter((item) => item.delivery === 'immediate');

  // Low stock of each new chemical: an e-mail to the admin and to the manager.
  const lab = labMaker(manager);
  const shelf = await lab.shelf('Outbox shelf');
  for (let i = 0; i < chemicals; i++) {
    const chemical = await lab.chemical(`Low stock reagent ${i + 1}`, {
      reorderPoint: 100,
      reorderQuantity: 500,
    });
    await lab.container((await lab.lot(chemical.id)).id, shelf.id, 10);
  }
  let stable = 0;
  const queued = await waitFor(
    'every e-mail queued and tried once while the mail server is down',
    outbox,
    (items) => {
      stable = items.length === stable ? stable : items.length;
      return (
        items.length >= chemicals * 2 &&
        items.every((item) => item.status === 'queued' && item.attempts >= 1)
      );
    },
    60_000,
  );
  const messages = queued.length;

  // The mail server comes back; the retry (30 s after the first attempt) sends the batch. The
  // sender is killed when the 20th e-mail's data has arrived, before the sink answers.
  sink = await SmtpSink.start(smtpPort);
  let killedAt = 0;
  sink.hooks.before = async (n) => {
    if (n !== killBeforeAcceptAt) return true;
    await server.kill('SIGKILL');
    killedAt = n;
    return false;
  };
  await waitFor(
    'the kill before acceptance',
    async () => killedAt,
    (n) => n > 0,
    90_000,
  );
  const deliveredBeforeKill = sink.deliveries.length;
  sink.hooks.before = undefined;

  // Started again: what the dead sender had claimed goes out once its lease (5 s) runs out.
  // The sender is killed a second time right after the sink accepted an e-mail: the window
  // between the mail server's 250 and the database commit.
  let windowKillAt = 0;
  const windowFrom = sink.received + 5;
  sink.hooks.after = (n) => {
    if (n !== windowFrom) return;
    windowKillAt = n;
    void server.kill('SIGKILL');
  };
  await server.restart();
  await waitFor(
    'the kill after acceptance',
    async () => windowKillAt,
    (n) => n > 0,
    60_000,
  );
  await server.kill('SIGKILL');
  sink.hooks.after = undefined;
  const windowMessageId = sink.deliveries.at(-1)?.messageId ?? '';
  await server.restart();
  await admin.signIn(demoUsers.admin);

  const final = await waitFor(
    'every e-mail sent',
    outbox,
    (items) => items.every((item) => item.status === 'sent'),
    90_000,
  );
  await sleep(1500); // one more send interval: nothing else goes out
  await server.stop();

  const counts = sink.countsById();
  const perRow = new Map<number, number>();
  for (const [messageId, n] of counts) perRow.set(rowOf(messageId), n);
  const missing = final.filter((item) => !perRow.has(item.id)).map((item) => item.id);
  const twice = [...counts].filter(([, n]) => n > 1);
  const windowCopies = counts.get(windowMessageId) ?? 0;
  const elsewhereTwice = twice.filter(([id]) => id !== windowMessageId);
  const foreign = [...counts.keys()].filter((id) => !final.some((item) => item.id === rowOf(id)));

  reportFigure(
    'outbox',
    `${messages} e-mails queued while the mail server was down (all tried, all kept); it came back and the sender was SIGKILLed at e-mail ${killBeforeAcceptAt} before acceptance (${deliveredBeforeKill} delivered by then) and again just after the 250 of e-mail ${windowKillAt}: ${final.length} sent, ${counts.size} Message-IDs delivered, ${missing.length} missing, ${elsewhereTwice.length} delivered twice outside the window; the e-mail killed in the window was delivered ${windowCopies}x with one Message-ID`,
    {
      messages,
      sent: final.length,
      messageIds: counts.size,
      missing: missing.length,
      duplicatesOutsideWindow: elsewhereTwice.length,
      windowCopies,
    },
  );

  expect(missing).toEqual([]);
  expect(foreign).toEqual([]);
  expect(elsewhereTwice).toEqual([]);
  // The remaining window: a copy sent again carries the same Message-ID, never a third.
  expect(windowCopies).toBeGreaterThanOrEqual(1);
  expect(windowCopies).toBeLessThanOrEqual(2);
  expect(counts.size).toBe(final.length);
});
