import Database from 'better-sqlite3';
import { addDays } from '@lotwise/chem';
import { todayIso } from '@lotwise/shared';
import { benchPassword, benchTechnician } from './lab/shape';
import type { LabFixtures } from './questions';

/** A signed-in client of the API: the session cookie and the Origin the server expects. */
export interface ApiSession {
  origin: string;
  headers: Record<string, string>;
  request<T>(method: string, path: string, body?: unknown): Promise<T>;
}

/** Signs the bench technician in through POST /api/auth/login. */
export async function signIn(origin: string): Promise<ApiSession> {
  const response = await fetch(`${origin}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin },
    body: JSON.stringify({ email: benchTechnician.email, password: benchPassword }),
  });
  if (!response.ok) throw new Error(`Sign-in failed: ${response.status} ${await response.text()}`);
  const cookie = response.headers
    .getSetCookie()
    .map((line) => line.split(';')[0]!)
    .join('; ');
  const headers = { cookie, origin };
  return {
    origin,
    headers,
    async request<T>(method: string, path: string, body?: unknown): Promise<T> {
      const answer = await fetch(`${origin}${path}`, {
        method,
        headers: {
          ...headers,
          ...(body === undefined ? {} : { 'content-type': 'application/json' }),
        },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await answer.text();
      if (!answer.ok)
        throw new Error(`${method} ${path} answered ${answer.status}: ${text.slice(0, 500)}`);
      return (text ? JSON.parse(text) : null) as T;
    },
  };
}

/**
 * What the questions need: a plan of the bench procedure for 10 benches and an open run made
 * through the API (so their rows are the API's own), copied in SQL into pools of open runs —
 * one run per recording — and open containers with plenty left to draw from.
 */
export async function prepareFixtures(
  session: ApiSession,
  databasePath: string,
  procedureId: number,
  runsPerPool: number,
): Promise<LabFixtures> {
  const plan = await session.request<{ id: number }>('POST', '/api/plans', {
    procedureId,
    scaleFactor: 1,
    benches: 10,
    plannedOn: addDays(todayIso(), 7),
  });
  const run = await session.request<{ id: number }>('POST', '/api/runs', { procedureId });

  const db = new Database(databasePath);
  db.pragma('busy_timeout = 10000');
  try {
    const columns = (db.prepare('PRAGMA table_info(runs)').all() as { name: string }[])
      .map((c) => c.name)
      .filter((name) => name !== 'id')
      .map((name) => `"${name}"`)
      .join(', ');
    const copy = db.prepare(
      `INSERT INTO runs (${columns}) SELECT ${columns} FROM runs WHERE id = ?`,
    );
    const copies: number[] = [];
    db.transaction(() => {
      for (let i = 0; i < runsPerPool * 2; i++)
        copies.push(Number(copy.run(run.id).lastInsertRowid));
    })();
    const lines = db
      .prepare(
        `SELECT pl.position AS lineIndex, pl.chemical_id AS chemicalId, ch.stock_unit AS unit
         FROM procedure_lines pl JOIN chemicals ch ON ch.id = pl.chemical_id
         WHERE pl.procedure_id = ? AND pl.role <> 'product' AND pl.optional = 0 ORDER BY pl.position`,
      )
      .all(procedureId) as { lineIndex: number; chemicalId: number; unit: string }[];
    const openOf = db.prepare(
      `SELECT id FROM containers WHERE chemical_id = ? AND status = 'open'
       AND quantity_micro >= 100000000 ORDER BY id`,
    );
    const drawsPerLine = [4, 3, 3];
    const runLines = lines.map((line, index) => ({
      lineIndex: line.lineIndex,
      unit: line.unit,
      containers: (openOf.all(line.chemicalId) as { id: number }[]).map((row) => row.id),
      draws: drawsPerLine[index] ?? 1,
    }));
    const drawn = runLines.reduce((sum, line) => sum + line.draws, 0);
    if (drawn !== 10 || runLines.some((line) => line.containers.length < line.draws)) {
      throw new Error(`The bench procedure cannot take a 10-draw run: ${JSON.stringify(runLines)}`);
    }
    const runChemicals = lines.map((line) => line.chemicalId);
    const drawPool = db
      .prepare(
        `SELECT id, unit FROM containers WHERE status = 'open' AND quantity_micro >= 100000000
         AND chemical_id NOT IN (${runChemicals.map(() => '?').join(', ')})
         ORDER BY (id * 7919) % 100003 LIMIT 2000`,
      )
      .all(...runChemicals) as { id: number; unit: string }[];
    const cabinet = db
      .prepare("SELECT id FROM locations WHERE kind = 'cabinet' ORDER BY id LIMIT 1")
      .get() as { id: number };
    return {
      cabinetId: cabinet.id,
      planId: plan.id,
      drawPool,
      runLines,
      apiRuns: copies.slice(0, runsPerPool),
      baselineRuns: copies.slice(runsPerPool),
    };
  } finally {
    db.close();
  }
}
