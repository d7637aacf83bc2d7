import { expect, it } from 'vitest';
import { ApiClient, demoUsers, ledgerCheck, type Answer } from './lib/api';
import { onSqlite } from './lib/database';
import { reportFigure } from './lib/figures';
import { inspectDatabase, openProbe, type DatabaseReport } from './lib/inspect';
import { labMaker } from './lib/lab';
import { serverForThisFile } from './lib/suite';

const lotwise = serverForThisFile('kills');
const { database } = lotwise;

const rounds = 5;
const clients = 6;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** What the clients were told: only a 2xx answer counts as acknowledged. */
interface Acknowledged {
  runsOpened: Set<number>;
  runsRecorded: Set<number>;
  /** Record requests that got no answer (the server died under them). */
  recordsInFlight: Set<number>;
  drawEntries: Set<number>;
  drawsInFlight: number;
}

/** How a run looks in the database: every part it writes when recorded, counted. */
interface RunParts {
  id: number;
  status: string;
  inputs: number;
  drawnEntries: number;
  products: number;
  lots: number;
  containers: number;
  receivedEntries: number;
}

async function runParts(procedureId: number): Promise<RunParts[]> {
  const probe = await openProbe(database);
  try {
    const count = (from: string) => `COALESCE((SELECT COUNT(*) ${from}), 0)`;
    return (
      await probe.all<Record<string, unknown>>(
        `SELECT r.id AS id, r.status AS status,
           ${count('FROM run_inputs i WHERE i.run_id = r.id')} AS inputs,
           ${count("FROM ledger_entries e WHERE e.run_id = r.id AND e.reason = 'drawn'")} AS drawnEntries,
           ${count('FROM run_products p WHERE p.run_id = r.id')} AS products,
           ${count('FROM lots l WHERE l.made_by_run_id = r.id')} AS lots,
           ${count('FROM containers c JOIN lots l ON l.id = c.lot_id WHERE l.made_by_run_id = r.id')} AS containers,
           ${count("FROM ledger_entries e WHERE e.run_id = r.id AND e.reason = 'received'")} AS receivedEntries
         FROM runs r WHERE r.procedure_id = ? ORDER BY r.id`,
        [procedureId],
      )
    ).map((row) => ({
      id: Number(row.id),
      status: String(row.status),
      inputs: Number(row.inputs),
      drawnEntries: Number(row.drawnEntries ?? row.drawnentries),
      products: Number(row.products),
      lots: Number(row.lots),
      containers: Number(row.containers),
      receivedEntries: Number(row.receivedEntries ?? row.receivedentries),
    }));
  } finally {
    await probe.close();
  }
}

async function existingEntries(ids: number[]): Promise<number> {
  if (ids.length === 0) return 0;
  const probe = await openProbe(database);
  try {
    let found = 0;
    for (let start = 0; start < ids.length; start += 500) {
      const part = ids.slice(start, start + 500);
      const [row] = await probe.all<{ n: unknown }>(
        `SELECT COUNT(*) AS n FROM ledger_entries WHERE id IN (${part.map(() => '?').join(', ')})`,
        part,
      );
      found += Number(row?.n ?? 0);
    }
    return found;
  } finally {
    await probe.close();
  }
}

/** A whole run: two draws, one product lot in one container, three ledger entries. */
const whole = (run: RunParts) =>
  run.inputs === 2 &&
  run.drawnEntries === 2 &&
  run.products === 1 &&
  run.lots === 1 &&
  run.containers === 1 &&
  run.receivedEntries === 1;
const absent = (run: RunParts) =>
  run.inputs + run.drawnEntries + run.products + run.lots + run.containers + run.receivedEntries ===
  0;

it('when the server is killed with SIGKILL five times while runs and draws are recorded, then every run is whole or absent and nothing acknowledged is lost', async () => {
  const server = await lotwise.start();
  const origin = server.origin;
  const manager = await ApiClient.signIn(origin, demoUsers.manager);
  const admin = await ApiClient.signIn(origin, demoUsers.admin);
  const people = [
    manager,
    ...(await Promise.all(demoUsers.members.map((email) => ApiClient.signIn(origin, email)))),
  ];
  const lab = labMaker(manager);
  const shelf = await lab.shelf();
  const reagent = await lab.chemical('Salicylic acid, reliability stock', {
    formula: 'C7H6O3',
    ghsPictograms: ['GHS05', 'GHS07'],
    hazardStatements: ['H302', 'H318'],
  });
  const product = await lab.chemical('Acetylsalicylic acid, reliability product', {
    formula: 'C9H8O4',
  });
  const procedure = await lab.procedure(reagent.id, product.id, 1.0);
  const lot = await lab.lot(reagent.id);
  const runStock = [
    await lab.container(lot.id, shelf.id, 5000),
    await lab.container(lot.id, shelf.id, 5000),
  ];
  const drawStock = [
    await lab.container(lot.id, shelf.id, 5000),
    await lab.container(lot.id, shelf.id, 5000),
  ];

  const told: Acknowledged = {
    runsOpened: new Set(),
    runsRecorded: new Set(),
    recordsInFlight: new Set(),
    drawEntries: new Set(),
    drawsInFlight: 0,
  };
  const reports: DatabaseReport[] = [];
  const ledgerChecks: boolean[] = [];
  const restartMs: number[] = [];
  const killedAfterMs: number[] = [];
  const partialRuns: RunParts[] = [];
  let serverErrors: Answer[] = [];

  async function client(person: ApiClient, index: number, stopped: () => boolean) {
    for (let i = 0; !stopped(); i++) {
      if ((i + index) % 3 === 2) {
        const container = drawStock[(i + index) % drawStock.length]!;
        const answer = await person.send<{ entries: { id: number }[] }>(
          'POST',
          `/api/containers/${container.id}/draws`,
          { amount: 0.25, unit: 'g', note: 'reliability draw' },
        );
        if (answer.status === 201) for (const e of answer.body.entries) told.drawEntries.add(e.id);
        else if (answer.status === 0) told.drawsInFlight++;
        else if (answer.status >= 500) serverErrors.push(answer);
        continue;
      }
      const opened = await person.send<{ id: number }>('POST', '/api/runs', {
        procedureId: procedure.id,
      });
      if (opened.status >= 500) serverErrors.push(opened);
      if (opened.status !== 201) continue;
      const runId = opened.body.id;
      told.runsOpened.add(runId);
      const recorded = await person.send('POST', `/api/runs/${runId}/record`, {
        lines: [
          {
            lineIndex: 0,
            draws: [
              { containerId: runStock[0]!.id, amount: 0.6, unit: 'g' },
              { containerId: runStock[1]!.id, amount: 0.4, unit: 'g' },
            ],
          },
        ],
        products: [
          {
            crudeMassG: 1.2,
            portions: [{ label: 'first crop', quantity: 1.1, unit: 'g', locationId: shelf.id }],
          },
        ],
        observations: { appearance: 'white needles' },
      });
      if (recorded.status === 200) told.runsRecorded.add(runId);
      else if (recorded.status === 0) told.recordsInFlight.add(runId);
      else if (recorded.status >= 500) serverErrors.push(recorded);
    }
  }

  for (let round = 1; round <= rounds; round++) {
    let stopped = false;
    const load = Array.from({ length: clients }, (_, c) =>
      client(people[c % people.length]!, c, () => stopped),
    );
    const delay = 400 + Math.floor(Math.random() * 1600);
    await sleep(delay);
    killedAfterMs.push(delay);
    await server.kill('SIGKILL');
    stopped = true;
    await Promise.all(load);

    // The file as the killed process left it, read-only.
    reports.push(await inspectDatabase(database));
    const parts = await runParts(procedure.id);
    partialRuns.push(...parts.filter((run) => !(whole(run) || absent(run))));
    for (const run of parts) {
      // recorded <=> whole, open <=> absent
      if ((run.status === 'recorded') !== whole(run)) partialRuns.push(run);
    }

    await server.restart();
    restartMs.push(server.startMs);
    ledgerChecks.push((await ledgerCheck(admin)).ok);
  }
  await server.stop();

  const parts = await runParts(procedure.id);
  const byId = new Map(parts.map((run) => [run.id, run]));
  const lostOpened = [...told.runsOpened].filter((id) => !byId.has(id));
  const lostRecorded = [...told.runsRecorded].filter((id) => byId.get(id)?.status !== 'recorded');
  const inFlightWhole = [...told.recordsInFlight].filter(
    (id) => byId.get(id)?.status === 'recorded',
  ).length;
  const foundDraws = await existingEntries([...told.drawEntries]);
  const recordedRuns = parts.filter((run) => run.status === 'recorded').length;
  const sortedRestarts = [...restartMs].sort((a, b) => a - b);
  const dirty = reports.filter(
    (r) => r.integrityProblems.length || r.foreignKeyProblems || r.balanceMismatches,
  ).length;

  reportFigure(
    'kill-during-runs',
    `${rounds} SIGKILLs (after ${killedAfterMs.map((ms) => `${(ms / 1000).toFixed(1)}`).join('/')} s) while ${clients} clients recorded runs and draws: ${recordedRuns} runs recorded whole, ${told.runsRecorded.size} acknowledged, ${lostRecorded.length} lost; ${told.recordsInFlight.size} in flight at a kill: ${inFlightWhole} whole, ${told.recordsInFlight.size - inFlightWhole} absent, ${partialRuns.length} partial; ${told.drawEntries.size} draws acknowledged, ${told.drawEntries.size - foundDraws} lost; ledger check ok ${ledgerChecks.filter(Boolean).length}/${rounds}; ${onSqlite ? `integrity_check and foreign_key_check clean ${rounds - dirty}/${rounds}` : `foreign keys and balances clean ${rounds - dirty}/${rounds}`}; restart median ${sortedRestarts[Math.floor(rounds / 2)]} ms`,
    {
      rounds,
      runsRecorded: recordedRuns,
      runsAcknowledged: told.runsRecorded.size,
      runsLost: lostRecorded.length + lostOpened.length,
      inFlight: told.recordsInFlight.size,
      partialRuns: partialRuns.length,
      drawsAcknowledged: told.drawEntries.size,
      drawsLost: told.drawEntries.size - foundDraws,
      restartMedianMs: sortedRestarts[Math.floor(rounds / 2)]!,
    },
  );

  serverErrors = serverErrors.slice(0, 5);
  expect(serverErrors.map((a) => [a.status, a.body])).toEqual([]);
  expect(told.runsRecorded.size).toBeGreaterThan(0);
  expect(partialRuns).toEqual([]);
  expect(lostOpened).toEqual([]);
  expect(lostRecorded).toEqual([]);
  expect(foundDraws).toBe(told.drawEntries.size);
  expect(ledgerChecks).toEqual(Array(rounds).fill(true));
  for (const report of reports) {
    expect(report.integrityProblems).toEqual([]);
    expect(report.foreignKeyProblems).toBe(0);
    expect(report.balanceMismatches).toBe(0);
    expect(report.negativeBalances).toBe(0);
  }
});
