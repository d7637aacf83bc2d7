import { randomBytes } from 'node:crypto';
import { afterAll, expect, it } from 'vitest';
import { ApiClient, demoUsers, ledgerCheck } from './lib/api';
import { createDatabase, dropServerDatabases, freshDatabase, onSqlite } from './lib/database';
import { reportFigure } from './lib/figures';
import { inspectDatabase } from './lib/inspect';
import { labMaker } from './lib/lab';
import { LotwiseServer } from './lib/launcher';
import { freePort } from './lib/ports';
import { SmtpSink } from './lib/smtp-sink';

// Two app processes on one database: only a database server can be shared that way.
const database = freshDatabase('two-instances');
const servers: LotwiseServer[] = [];
let sink: SmtpSink | null = null;
afterAll(async () => {
  for (const server of servers) await server.stop();
  await sink?.close();
  await dropServerDatabases();
});

const draws = 240;
const amount = 0.25; // g per draw
const fits = 150; // the container holds exactly 150 draws
const lowStockChemicals = 20;
const micro = (grams: number) => Math.round(grams * 1_000_000);
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

it.skipIf(onSqlite)(
  'when two app instances on one database are hammered at once, then nothing is overdrawn, each e-mail goes out once and the ledger adds up',
  async () => {
    sink = await SmtpSink.start(await freePort());
    await createDatabase(database);
    // one session secret for both, as behind one address: a session works on either instance
    const env = {
      JWT_SECRET: randomBytes(32).toString('base64url'),
      SMTP_URL: `smtp://127.0.0.1:${sink.port}`,
      OUTBOX_INTERVAL_SECONDS: '1',
    };
    servers.push(await LotwiseServer.start({ name: 'instance-a', database, env }));
    servers.push(await LotwiseServer.start({ name: 'instance-b', database, env }));
    const [a, b] = servers as [LotwiseServer, LotwiseServer];

    const managerOnA = await ApiClient.signIn(a.origin, demoUsers.manager);
    const adminOnB = await ApiClient.signIn(b.origin, demoUsers.admin);
    const people = [
      managerOnA,
      adminOnB,
      ...(await Promise.all(
        demoUsers.members.map((email, i) => ApiClient.signIn((i % 2 ? a : b).origin, email)),
      )),
    ];
    // each person's session, sent to the other instance too
    const clients = people.flatMap((person) => [
      person,
      person.at(person.origin === a.origin ? b.origin : a.origin),
    ]);

    const lab = labMaker(managerOnA);
    const shelf = await lab.shelf('Two-instance shelf');
    const salt = await lab.chemical('Two-instance salt');
    const container = await lab.container(
      (await lab.lot(salt.id)).id,
      shelf.id,
      (fits * micro(amount)) / 1_000_000,
    );
    // low stock of each of these: e-mails queued by whichever instance notes it first
    for (let i = 0; i < lowStockChemicals; i++) {
      const chemical = await lab.chemical(`Two-instance reagent ${i + 1}`, {
        reorderPoint: 100,
        reorderQuantity: 500,
      });
      await lab.container((await lab.lot(chemical.id)).id, shelf.id, 10);
    }

    const started = performance.now();
    const answers = await Promise.all(
      Array.from({ length: draws }, (_, i) =>
        clients[i % clients.length]!.send<{ entries?: { quantity: number }[] }>(
          'POST',
          `/api/containers/${container.id}/draws`,
          { amount, unit: 'g', note: `two-instance draw ${i + 1}` },
        ),
      ),
    );
    const drawSeconds = (performance.now() - started) / 1000;
    const accepted = answers.filter((answer) => answer.status === 201);
    const refused = answers.filter((answer) => answer.status === 409);
    const serverErrors = answers.filter((answer) => answer.status >= 500 || answer.status === 0);

    // Both senders share the outbox until nothing is left to send.
    const outbox = async () =>
      (
        await adminOnB.json<{ items: { status: string; delivery: string }[] }>(
          'GET',
          '/api/outbox?pageSize=200',
        )
      ).items.filter((item) => item.delivery === 'immediate');
    const waitStarted = performance.now();
    let items = await outbox();
    while (
      (items.length < lowStockChemicals * 2 ||
        items.some((item) => item.status === 'queued' || item.status === 'sending')) &&
      performance.now() - waitStarted < 90_000
    ) {
      await sleep(500);
      items = await outbox();
    }
    const perMessageId = new Map<string, number>();
    for (const delivery of sink.deliveries) {
      perMessageId.set(delivery.messageId, (perMessageId.get(delivery.messageId) ?? 0) + 1);
    }
    const twice = [...perMessageId.values()].filter((count) => count > 1).length;
    const sent = items.filter((item) => item.status === 'sent').length;

    const balance = await managerOnA.json<
      { container: { quantity: number } } | { quantity: number }
    >('GET', `/api/containers/${container.id}`);
    const quantity = 'container' in balance ? balance.container.quantity : balance.quantity;
    const check = await ledgerCheck(adminOnB);
    for (const server of servers) await server.stop();
    const report = await inspectDatabase(database);

    reportFigure(
      'two-instances',
      `2 app processes on one PostgreSQL database, ${clients.length} sessions each used on both: ${draws} draws of ${amount} g from a ${fits * amount} g container in ${drawSeconds.toFixed(1)} s: ${accepted.length} accepted, ${refused.length} refused (409), ${serverErrors.length} 5xx; balance ${quantity.toFixed(3)} g; ${items.length} e-mails queued, ${sent} sent, ${perMessageId.size} Message-IDs delivered, ${twice} delivered twice; ledger check ${check.ok ? 'ok' : 'FAILED'}`,
      {
        draws,
        accepted: accepted.length,
        refused: refused.length,
        serverErrors: serverErrors.length,
        emails: items.length,
        deliveredTwice: twice,
        ledgerCheck: check.ok,
      },
    );

    expect(serverErrors.map((answer) => answer.error ?? answer.status)).toEqual([]);
    expect(accepted).toHaveLength(fits);
    expect(refused).toHaveLength(draws - fits);
    expect(micro(quantity)).toBe(0);
    expect(items.length).toBeGreaterThanOrEqual(lowStockChemicals * 2);
    expect(sent).toBe(items.length);
    expect(perMessageId.size).toBe(items.length);
    expect(twice).toBe(0);
    expect(sink.deliveries).toHaveLength(items.length);
    expect(check.ok).toBe(true);
    expect(report.balanceMismatches).toBe(0);
    expect(report.negativeBalances).toBe(0);
    expect(report.foreignKeyProblems).toBe(0);
  },
  240_000,
);
