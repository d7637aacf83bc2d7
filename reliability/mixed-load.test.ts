import { existsSync } from 'node:fs';
import { expect, it } from 'vitest';
import { ApiClient, demoUsers, ledgerCheck, type Answer } from './lib/api';
import { onSqlite } from './lib/database';
import { reportFigure } from './lib/figures';
import { inspectDatabase } from './lib/inspect';
import { labMaker } from './lib/lab';
import { serverForThisFile } from './lib/suite';

const lotwise = serverForThisFile('load');
const { database } = lotwise;

const clients = 50;
const seconds = Number(process.env.RELIABILITY_LOAD_SECONDS ?? 20);

/** The p-th percentile (0-100) of sorted values, nearest rank. */
function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return 0;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

type Kind = 'read' | 'draw' | 'run-open' | 'run-record';

it('when 50 clients read and write at once for a bounded time, then no answer is a server error and the ledger adds up', async () => {
  const server = await lotwise.start();
  const origin = server.origin;
  const manager = await ApiClient.signIn(origin, demoUsers.manager);
  const admin = await ApiClient.signIn(origin, demoUsers.admin);
  const members = await Promise.all(demoUsers.members.map((e) => ApiClient.signIn(origin, e)));
  const people = [manager, ...members];
  const lab = labMaker(manager);
  const shelf = await lab.shelf('Load shelf');
  const reagent = await lab.chemical('Benzoic acid, load stock', { formula: 'C7H6O2' });
  const product = await lab.chemical('Load test product', { formula: 'C7H6O2' });
  const procedure = await lab.procedure(reagent.id, product.id, 0.5);
  const lot = await lab.lot(reagent.id);
  const pool: { id: number }[] = [];
  for (let i = 0; i < 10; i++) pool.push(await lab.container(lot.id, shelf.id, 10_000));
  const demoContainers = (
    await admin.json<{ items: { id: number }[] }>('GET', '/api/containers?pageSize=50')
  ).items;

  const reads = (i: number, c: number): string => {
    const container = demoContainers[(i + c) % demoContainers.length]!;
    const paths = [
      '/api/containers?page=1&pageSize=50&sort=labelCode.asc',
      `/api/containers/${container.id}`,
      `/api/containers/${container.id}/ledger`,
      '/api/chemicals?q=acid',
      '/api/runs?pageSize=20',
      '/api/stock',
      `/api/search?q=${encodeURIComponent('acid')}`,
      `/api/procedures/${procedure.id}`,
    ];
    return paths[(i * 3 + c) % paths.length]!;
  };

  const answers: { kind: Kind; answer: Answer }[] = [];
  const deadline = performance.now() + seconds * 1000;
  const started = performance.now();

  async function client(c: number) {
    const person = people[c % people.length]!;
    let openRun: number | null = null;
    for (let i = 0; performance.now() < deadline; i++) {
      const slot = (i + c) % 10;
      let kind: Kind;
      let answer: Answer;
      if (slot < 7) {
        kind = 'read';
        answer = await person.send('GET', reads(i, c));
      } else if (slot < 9) {
        kind = 'draw';
        const container = pool[(i + c) % pool.length]!;
        answer = await person.send('POST', `/api/containers/${container.id}/draws`, {
          amount: 0.01,
          unit: 'g',
          note: `load client ${c}`,
        });
      } else if (openRun === null) {
        kind = 'run-open';
        answer = await person.send<{ id: number }>('POST', '/api/runs', {
          procedureId: procedure.id,
        });
        if (answer.status === 201) openRun = (answer.body as { id: number }).id;
      } else {
        kind = 'run-record';
        const container = pool[c % pool.length]!;
        answer = await person.send('POST', `/api/runs/${openRun}/record`, {
          lines: [{ lineIndex: 0, draws: [{ containerId: container.id, amount: 0.5, unit: 'g' }] }],
          products: [
            {
              portions: [{ label: 'crop', quantity: 0.4, unit: 'g', locationId: shelf.id }],
            },
          ],
        });
        openRun = null;
      }
      answers.push({ kind, answer });
    }
  }

  await Promise.all(Array.from({ length: clients }, (_, c) => client(c)));
  const elapsed = (performance.now() - started) / 1000;
  const check = await ledgerCheck(admin);
  const stopped = await server.stop();
  const walLeft = database.kind === 'sqlite' && existsSync(`${database.path}-wal`);
  const report = await inspectDatabase(database);

  const count = (test: (a: { kind: Kind; answer: Answer }) => boolean) =>
    answers.filter(test).length;
  const serverErrors = answers.filter((a) => a.answer.status >= 500 || a.answer.status === 0);
  const refused = count((a) => a.answer.status >= 400 && a.answer.status < 500);
  const writes = count((a) => a.kind !== 'read');
  const ms = (kind?: 'read' | 'write') =>
    answers
      .filter((a) => !kind || (kind === 'read') === (a.kind === 'read'))
      .map((a) => a.answer.ms)
      .sort((x, y) => x - y);
  const all = ms();
  const readMs = ms('read');
  const writeMs = ms('write');
  const round = (value: number) => Math.round(value);

  reportFigure(
    'mixed-load',
    `${clients} clients for ${seconds} s, ${Math.round((100 * (answers.length - writes)) / answers.length)} % reads / ${Math.round((100 * writes) / answers.length)} % writes: ${answers.length} requests (${Math.round(answers.length / elapsed)}/s; ${count((a) => a.kind === 'draw')} draws, ${count((a) => a.kind === 'run-record')} runs recorded), ${serverErrors.length} 5xx or dropped, ${refused} 4xx; p50 ${round(percentile(all, 50))} ms, p99 ${round(percentile(all, 99))} ms (reads p99 ${round(percentile(readMs, 99))} ms, writes p99 ${round(percentile(writeMs, 99))} ms); ledger check ${check.ok ? 'ok' : 'FAILED'}${onSqlite ? `, integrity ${report.integrityProblems.length ? 'FAILED' : 'ok'}` : ''}; SIGTERM: exit ${stopped.code ?? stopped.signal}${onSqlite ? (walLeft ? ', write-ahead log LEFT' : ', file closed cleanly') : ''}`,
    {
      clients,
      seconds,
      requests: answers.length,
      writes,
      serverErrors: serverErrors.length,
      refused,
      p50Ms: round(percentile(all, 50)),
      p99Ms: round(percentile(all, 99)),
      ledgerCheck: check.ok,
    },
  );

  expect(
    serverErrors.slice(0, 5).map((a) => [a.kind, a.answer.status, a.answer.error, a.answer.body]),
  ).toEqual([]);
  expect(
    answers
      .filter((a) => a.answer.status >= 400)
      .slice(0, 5)
      .map((a) => [a.kind, a.answer.status, a.answer.body]),
  ).toEqual([]);
  expect(check.ok).toBe(true);
  expect(stopped).toEqual({ code: 0, signal: null });
  expect(walLeft).toBe(false);
  expect(report.integrityProblems).toEqual([]);
  expect(report.foreignKeyProblems).toBe(0);
  expect(report.balanceMismatches).toBe(0);
});
