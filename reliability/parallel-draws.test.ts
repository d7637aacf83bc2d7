import { expect, it } from 'vitest';
import { ApiClient, demoUsers, ledgerCheck } from './lib/api';
import { onSqlite } from './lib/database';
import { reportFigure } from './lib/figures';
import { inspectDatabase } from './lib/inspect';
import { labMaker } from './lib/lab';
import { serverForThisFile } from './lib/suite';

const lotwise = serverForThisFile('draws');
const { database } = lotwise;

const draws = 200;
const amount = 0.15; // g per draw
const fits = 137; // the container holds exactly 137 draws
const micro = (grams: number) => Math.round(grams * 1_000_000);

it('when 200 draws from five people hit one container at once, then only what the balance allows is drawn, the rest is refused with 409 and the ledger adds up', async () => {
  const server = await lotwise.start();
  const origin = server.origin;
  const manager = await ApiClient.signIn(origin, demoUsers.manager);
  const people = [
    await ApiClient.signIn(origin, demoUsers.admin),
    manager,
    ...(await Promise.all(demoUsers.members.map((email) => ApiClient.signIn(origin, email)))),
  ];
  const lab = labMaker(manager);
  const shelf = await lab.shelf();
  const chemical = await lab.chemical('Draw test salt');
  const lot = await lab.lot(chemical.id);
  const container = await lab.container(lot.id, shelf.id, (fits * micro(amount)) / 1_000_000);

  const answers = await Promise.all(
    Array.from({ length: draws }, (_, i) =>
      people[i % people.length]!.send<{ entries?: { id: number; quantity: number }[] }>(
        'POST',
        `/api/containers/${container.id}/draws`,
        { amount, unit: 'g', note: `parallel draw ${i + 1}` },
      ),
    ),
  );
  const accepted = answers.filter((a) => a.status === 201);
  const refused = answers.filter((a) => a.status === 409);
  const serverErrors = answers.filter((a) => a.status >= 500 || a.status === 0);
  const other = answers.length - accepted.length - refused.length - serverErrors.length;

  const admin = people[0]!;
  const after = await admin.json<{ container: { quantity: number } } | { quantity: number }>(
    'GET',
    `/api/containers/${container.id}`,
  );
  const balance = 'container' in after ? after.container.quantity : after.quantity;
  const ledger = await admin.json<{ items: { quantity: number }[]; total: number }>(
    'GET',
    `/api/containers/${container.id}/ledger?pageSize=200`,
  );
  const entrySumMicro = ledger.items.reduce((sum, entry) => sum + micro(entry.quantity), 0);
  const check = await ledgerCheck(admin);
  await server.stop();
  const report = await inspectDatabase(database);

  reportFigure(
    'parallel-draws',
    `${draws} parallel draws of ${amount} g by ${people.length} people from a ${fits * amount} g container: ${accepted.length} accepted, ${refused.length} refused (409), ${serverErrors.length} 5xx or dropped, ${other} other; balance ${balance.toFixed(3)} g = sum of ${ledger.total} entries ${(entrySumMicro / 1e6).toFixed(3)} g; ledger check ${check.ok ? 'ok' : 'FAILED'}${onSqlite ? `, integrity ${report.integrityProblems.length === 0 ? 'ok' : 'FAILED'}` : ''}`,
    {
      draws,
      accepted: accepted.length,
      refused: refused.length,
      serverErrors: serverErrors.length,
      balanceG: balance,
      ledgerCheck: check.ok,
    },
  );

  expect(serverErrors.map((a) => a.error ?? a.status)).toEqual([]);
  expect(other).toBe(0);
  expect(accepted).toHaveLength(fits);
  expect(refused).toHaveLength(draws - fits);
  // Every accepted draw took exactly the amount; nothing else left the container.
  const drawnMicro = accepted.reduce(
    (sum, a) => sum + a.body.entries!.reduce((s, e) => s - micro(e.quantity), 0),
    0,
  );
  expect(drawnMicro).toBe(accepted.length * micro(amount));
  expect(micro(balance)).toBe(0);
  expect(micro(balance)).toBe(entrySumMicro);
  expect(check.ok).toBe(true);
  expect(report.balanceMismatches).toBe(0);
  expect(report.negativeBalances).toBe(0);
  expect(report.integrityProblems).toEqual([]);
  expect(report.foreignKeyProblems).toBe(0);
});
