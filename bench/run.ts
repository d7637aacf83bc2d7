import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { prepareFixtures, signIn } from './fixtures';
import { timeImport, stockCsv } from './import-time';
import { generateLab } from './lab/generate';
import { benchTechnician, benchUsers } from './lab/shape';
import { hammer, measure, type Measurement } from './measure';
import { benchQuestions, readsWhileWrites } from './questions';
import { dropOf, markdownTable, replaceMarked, reportRows, type QuestionResult } from './report';
import { serverBuildScript, startApi, startBaseline, type ChildServer } from './servers';
import { benchSettings, repoRoot } from './settings';
import { webWeights } from './web-size';

/**
 * `npm run bench`: generates a lab of 100,000 containers in a temporary SQLite file, starts
 * Lotwise and the hand-written SQL baseline on it, asks both every question through HTTP
 * with autocannon and writes the figures beside their targets (bench/results.json and a
 * marked section of docs/performance.md).
 */
const settings = benchSettings();
const log = (line: string) => console.log(`[bench] ${line}`);
const started = performance.now();
const loadAtStart = os.loadavg();

function machine() {
  const cpus = os.cpus();
  let commit = 'unknown';
  let dirty = false;
  try {
    commit = execFileSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: repoRoot })
      .toString()
      .trim();
    dirty =
      execFileSync('git', ['status', '--porcelain'], { cwd: repoRoot }).toString().trim() !== '';
  } catch {
    // not a git checkout
  }
  return {
    cpu: cpus[0]?.model ?? 'unknown',
    cores: cpus.length,
    memoryGb: Math.round(os.totalmem() / 1024 ** 3),
    node: process.version,
    os: `${os.type()} ${os.release()}`,
    loadAverageAtStart: loadAtStart.map((n) => Number(n.toFixed(2))),
    date: new Date().toISOString(),
    commit: dirty ? `${commit} (with uncommitted changes)` : commit,
  };
}

function errorShare(m: Measurement): number {
  return m.requests + m.errors > 0 ? (m.non2xx + m.errors) / (m.requests + m.errors) : 1;
}

const dir = mkdtempSync(path.join(os.tmpdir(), 'lotwise-bench-'));
const databasePath = path.join(dir, 'lab.sqlite');
const servers: ChildServer[] = [];
// The commit and the date of the start: files edited while the bench runs do not change them.
const host = machine();
let failed = false;
try {
  log(`generating the lab (scale ${settings.scale}) into ${databasePath}`);
  const lab = await generateLab(databasePath, {
    scale: settings.scale,
    log: (line) => log(`  ${line}`),
  });
  log(
    `lab generated and checked in ${(lab.milliseconds / 1000).toFixed(1)} s: ` +
      Object.entries(lab.counts)
        .map(([name, n]) => `${n.toLocaleString('en')} ${name}`)
        .join(', '),
  );

  log(
    settings.skipBuild
      ? 'weighing the existing web build'
      : 'building the web app and weighing its first pages',
  );
  const web = webWeights(settings.skipBuild);

  if (!settings.skipBuild && serverBuildScript()) {
    log('compiling the server (npm run build -w apps/server)');
    execFileSync('npm', ['run', 'build', '-w', 'apps/server'], { cwd: repoRoot, stdio: 'pipe' });
  }
  log('starting Lotwise and the baseline');
  // The first start on the generated file analyses it (a lab that ran Lotwise before has its
  // statistics); the cold start measured is the next one, a restart of the server.
  const firstStart = await startApi(databasePath);
  log(`first start on the never-analysed file: /api/health answered after ${firstStart.startMs} ms`);
  await new Promise((resolve) => setTimeout(resolve, 3000));
  await firstStart.stop();
  const api = await startApi(databasePath);
  servers.push(api);
  log(`Lotwise answered /api/health ${api.startMs} ms after spawn (${api.command})`);
  const technicianId = benchUsers.findIndex((user) => user.email === benchTechnician.email) + 1;
  const baseline = await startBaseline(databasePath, technicianId);
  servers.push(baseline);
  const session = await signIn(api.origin);
  const runsPerPool = Math.ceil((settings.seconds + settings.warmupSeconds) * 1000);
  const fixtures = await prepareFixtures(session, databasePath, lab.benchProcedureId, runsPerPool);

  const options = {
    seconds: settings.seconds,
    warmupSeconds: settings.warmupSeconds,
    connections: settings.connections,
  };
  const results: QuestionResult[] = [];
  for (const question of benchQuestions(fixtures)) {
    const apiFigures = await measure(api.origin, question.api, session.headers, options);
    const baselineFigures = await measure(baseline.origin, question.baseline, {}, options);
    results.push({
      id: question.id,
      title: question.title,
      kind: question.kind,
      api: apiFigures,
      baseline: baselineFigures,
    });
    log(
      `${question.title}: API p50 ${apiFigures.p50} ms, ${apiFigures.rps.toFixed(0)} req/s` +
        ` | baseline p50 ${baselineFigures.p50} ms, ${baselineFigures.rps.toFixed(0)} req/s` +
        (apiFigures.non2xx + apiFigures.errors > 0
          ? ` | API non-2xx ${apiFigures.non2xx} ${JSON.stringify(apiFigures.statuses)}, errors ${apiFigures.errors}`
          : ''),
    );
  }

  log('reads while writes run');
  const rwwQuestions = readsWhileWrites(fixtures);
  const rwwOf = async (
    server: ChildServer,
    which: 'api' | 'baseline',
    headers: Record<string, string>,
  ) => {
    const read = rwwQuestions.read[which];
    const write = rwwQuestions.write[which];
    await hammer(server.origin, read, headers, settings.warmupSeconds, settings.connections);
    const alone = await hammer(
      server.origin,
      read,
      headers,
      settings.seconds,
      settings.connections,
    );
    const [withWrites, writes] = await Promise.all([
      hammer(server.origin, read, headers, settings.seconds, settings.connections),
      hammer(server.origin, write, headers, settings.seconds, settings.writeConnections),
    ]);
    return { alone, withWrites, writes };
  };
  const rwwApi = await rwwOf(api, 'api', session.headers);
  const rwwBaseline = await rwwOf(baseline, 'baseline', {});
  log(
    `search alone ${rwwApi.alone.rps.toFixed(0)} req/s, while drawing ${rwwApi.withWrites.rps.toFixed(0)} req/s ` +
      `(drop ${(dropOf(rwwApi.alone.rps, rwwApi.withWrites.rps) * 100).toFixed(0)} %); baseline ` +
      `${rwwBaseline.alone.rps.toFixed(0)} → ${rwwBaseline.withWrites.rps.toFixed(0)} req/s`,
  );

  log(`timing a ${settings.importRows.toLocaleString('en')}-row CSV stock import`);
  const importTiming = await timeImport(
    session,
    stockCsv(databasePath, settings.importRows),
    settings.importRows,
  );
  log(
    `import: check ${importTiming.checkMs} ms, commit ${importTiming.commitMs} ms (${importTiming.status})`,
  );

  const rows = reportRows(results, {
    readsWhileWrites: {
      aloneRps: rwwApi.alone.rps,
      withWritesRps: rwwApi.withWrites.rps,
      baselineAloneRps: rwwBaseline.alone.rps,
      baselineWithWritesRps: rwwBaseline.withWrites.rps,
    },
    import: importTiming,
    web: {
      signInJsBytes: web.signIn.jsGzipBytes,
      signInCssBytes: web.signIn.cssGzipBytes,
      chemicalsListJsBytes: web.chemicalsList.jsGzipBytes,
      chemicalsListCssBytes: web.chemicalsList.cssGzipBytes,
    },
    coldStartMs: api.startMs,
  });
  const table = markdownTable(rows);

  // Every answer that was not 2xx is counted; a question the API answered with errors is void.
  const measured = [
    ...results.flatMap((r) => [
      { name: `${r.id} (API)`, m: r.api },
      { name: `${r.id} (baseline)`, m: r.baseline },
    ]),
    { name: 'reads while writes: search (API)', m: rwwApi.withWrites },
    { name: 'reads while writes: draws (API)', m: rwwApi.writes },
    { name: 'reads while writes: search (baseline)', m: rwwBaseline.withWrites },
    { name: 'reads while writes: draws (baseline)', m: rwwBaseline.writes },
  ];
  const erroneous = measured.filter(({ m }) => errorShare(m) > settings.maxErrorShare);
  const errors = measured
    .filter(({ m }) => m.non2xx + m.errors + (m.warmupFailures ?? 0) > 0)
    .map(({ name, m }) => ({
      question: name,
      non2xx: m.non2xx,
      errors: m.errors,
      statuses: m.statuses,
      requests: m.requests,
      warmupFailures: m.warmupFailures ?? 0,
    }));

  const report = {
    machine: host,
    settings,
    lab: { ...lab.counts, generationMs: lab.milliseconds },
    server: { command: api.command, coldStartMs: api.startMs, firstStartMs: firstStart.startMs },
    questions: results.map((r, i) => ({
      ...r,
      latencyRatio: rows[i]!.latencyRatio,
      throughputShare: rows[i]!.throughputShare,
      target: rows[i]!.target,
      met: rows[i]!.met,
    })),
    readsWhileWrites: {
      api: rwwApi,
      baseline: rwwBaseline,
      drop: dropOf(rwwApi.alone.rps, rwwApi.withWrites.rps),
    },
    import: importTiming,
    web,
    rows,
    errors,
    totalSeconds: Math.round((performance.now() - started) / 1000),
  };
  const resultsFile = path.join(
    repoRoot,
    settings.saveAs === 'before' ? 'bench/results-before.json' : 'bench/results.json',
  );
  writeFileSync(resultsFile, `${JSON.stringify(report, null, 2)}\n`);

  const note =
    `Run of ${host.date.slice(0, 16).replace('T', ' ')} UTC on commit ${host.commit}: ${host.cpu}, ${host.cores} cores, ` +
    `${host.memoryGb} GB, Node ${host.node}; load average ${host.loadAverageAtStart.join(' / ')} at the start ` +
    `(other work on the machine makes figures noisy). Lab: ${lab.counts.containers.toLocaleString('en')} containers, ` +
    `${lab.counts.chemicals.toLocaleString('en')} chemicals, ${lab.counts.ledgerEntries.toLocaleString('en')} ledger rows, ` +
    `${lab.counts.procedures} procedures, generated in ${(lab.milliseconds / 1000).toFixed(1)} s. ` +
    `${settings.connections} connections, ${settings.warmupSeconds} s warm-up, ${settings.seconds} s measured per question; ` +
    `server: ${api.command}. Non-2xx answers: ${errors.length === 0 ? 'none' : errors.map((e) => `${e.question} ${e.non2xx + e.errors} (+ ${e.warmupFailures} in the warm-up)`).join(', ')}.`;
  const docsPath = path.join(repoRoot, 'docs/performance.md');
  writeFileSync(
    docsPath,
    replaceMarked(readFileSync(docsPath, 'utf8'), settings.saveAs, `${note}\n\n${table}`),
  );
  // Written as Prettier writes them, so the repository stays formatted.
  execFileSync(
    path.join(repoRoot, 'node_modules/.bin/prettier'),
    ['--write', docsPath, resultsFile],
    {
      stdio: 'ignore',
    },
  );

  console.log(`\n${table}\n\n${note}\n`);
  log(
    `results written to ${path.relative(repoRoot, resultsFile)} and docs/performance.md (${report.totalSeconds} s in all)`,
  );
  if (erroneous.length > 0) {
    failed = true;
    console.error(
      `[bench] FAILED: more than ${(settings.maxErrorShare * 100).toFixed(0)} % of the answers were errors in: ` +
        erroneous
          .map(
            ({ name, m }) =>
              `${name} (${m.non2xx} non-2xx ${JSON.stringify(m.statuses)}, ${m.errors} errors of ${m.requests})`,
          )
          .join('; ') +
        '. Those figures measure failures, not the work.',
    );
  }
} catch (error) {
  failed = true;
  console.error('[bench] FAILED:', error);
} finally {
  for (const server of servers.reverse()) await server.stop();
  if (settings.keepDatabase) log(`database kept at ${databasePath}`);
  else rmSync(dir, { recursive: true, force: true });
}
process.exit(failed ? 1 : 0);
