import type { RequestPlan } from './measure';

/** Which target a question is held to (see report.ts). */
export type QuestionKind = 'read' | 'write';

/** One question, asked of Lotwise's API and of the baseline. */
export interface Question {
  id: string;
  title: string;
  kind: QuestionKind;
  api: RequestPlan;
  baseline: RequestPlan;
}

/** What the generated lab offers the questions, found after the servers started. */
export interface LabFixtures {
  /** A cabinet: its subtree holds a few thousand containers. */
  cabinetId: number;
  /** A plan of the bench procedure for 10 benches. */
  planId: number;
  /** Open containers with plenty left, and their unit, for single draws. */
  drawPool: { id: number; unit: string }[];
  /** Per drawn line of the bench procedure: open containers of that line's chemical. */
  runLines: { lineIndex: number; unit: string; containers: number[]; draws: number }[];
  /** Open runs of the bench procedure, one per recording, for the API and the baseline. */
  apiRuns: number[];
  baselineRuns: number[];
}

/** Search words: a name fragment (many matches) and a CAS RN prefix (ten matches). */
export const nameQuery = 'ethyl benzoate';
export const casPrefixQuery = '5012';
/** Drawn each time: small enough that no container runs dry in a bench. */
export const drawAmount = 0.001;

function rotating<T>(items: T[]): () => T {
  let next = 0;
  return () => {
    if (items.length === 0) throw new Error('Nothing to rotate through');
    const item = items[next % items.length]!;
    next++;
    return item;
  };
}

/** A run's record body: every drawn line of the procedure, ten draws in all. */
function runBody(lines: LabFixtures['runLines'], offset: number) {
  return {
    lines: lines.map((line) => ({
      lineIndex: line.lineIndex,
      draws: Array.from({ length: line.draws }, (_, j) => ({
        containerId: line.containers[(offset + j) % line.containers.length]!,
        amount: drawAmount,
        unit: line.unit,
      })),
    })),
  };
}

/** Every question the bench asks, in the order it asks them. */
export function benchQuestions(lab: LabFixtures): Question[] {
  const search = (q: string) => `?q=${encodeURIComponent(q)}`;
  const draw = (path: (id: number) => string): RequestPlan => {
    const next = rotating(lab.drawPool);
    let current = lab.drawPool[0]!;
    return {
      method: 'POST',
      path: () => {
        current = next();
        return path(current.id);
      },
      body: () => ({ amount: drawAmount, unit: current.unit }),
    };
  };
  const record = (runs: number[], path: (id: number) => string): RequestPlan => {
    const nextRun = rotating(runs);
    let offset = 0;
    return {
      method: 'POST',
      path: () => path(nextRun()),
      body: () => runBody(lab.runLines, offset++),
    };
  };
  return [
    {
      id: 'containers-list',
      title: 'containers list: cabinet subtree, open, by expiry, page of 50',
      kind: 'read',
      api: {
        method: 'GET',
        path: `/api/containers?locationId=${lab.cabinetId}&status=open&sort=expiresOn.asc&pageSize=50`,
      },
      baseline: {
        method: 'GET',
        path: `/containers?locationId=${lab.cabinetId}&status=open&pageSize=50`,
      },
    },
    {
      id: 'stock-overview',
      title: 'stock overview, page of 50',
      kind: 'read',
      api: { method: 'GET', path: '/api/stock?pageSize=50' },
      baseline: { method: 'GET', path: '/stock?pageSize=50' },
    },
    {
      id: 'search-name',
      title: `search by name ("${nameQuery}")`,
      kind: 'read',
      api: { method: 'GET', path: `/api/search${search(nameQuery)}` },
      baseline: { method: 'GET', path: `/search${search(nameQuery)}` },
    },
    {
      id: 'search-cas',
      title: `search by CAS RN prefix ("${casPrefixQuery}")`,
      kind: 'read',
      api: { method: 'GET', path: `/api/search${search(casPrefixQuery)}` },
      baseline: { method: 'GET', path: `/search${search(casPrefixQuery)}` },
    },
    {
      id: 'chemicals-list',
      title: 'chemicals list, page of 50',
      kind: 'read',
      api: { method: 'GET', path: '/api/chemicals?pageSize=50' },
      baseline: { method: 'GET', path: '/chemicals?pageSize=50' },
    },
    {
      id: 'plan-stock-check',
      title: 'plan stock check, 10 benches',
      kind: 'read',
      api: { method: 'GET', path: `/api/plans/${lab.planId}` },
      baseline: { method: 'GET', path: `/plans/${lab.planId}/stock-check` },
    },
    {
      id: 'auth-me',
      title: 'signed-in floor (/api/auth/me)',
      kind: 'read',
      api: { method: 'GET', path: '/api/auth/me' },
      baseline: { method: 'GET', path: '/me' },
    },
    {
      id: 'draw',
      title: 'one draw',
      kind: 'write',
      api: draw((id) => `/api/containers/${id}/draws`),
      baseline: draw((id) => `/containers/${id}/draws`),
    },
    {
      id: 'run-10-draws',
      title: 'record a run with 10 draws',
      kind: 'write',
      api: record(lab.apiRuns, (id) => `/api/runs/${id}/record`),
      baseline: record(lab.baselineRuns, (id) => `/runs/${id}/record`),
    },
  ];
}

/** The search alone, then with draws beside it: how much reads wait behind writes. */
export function readsWhileWrites(lab: LabFixtures) {
  const questions = benchQuestions(lab);
  const byId = (id: string) => questions.find((q) => q.id === id)!;
  return { read: byId('search-name'), write: byId('draw') };
}
