import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';
import { repoRoot } from './settings';

/** A child process serving HTTP on 127.0.0.1:port. */
export interface ChildServer {
  name: string;
  origin: string;
  /** How the server was started, for the report. */
  command: string;
  /** From spawn to the first good answer of its health route, ms. */
  startMs: number;
  stop(): Promise<void>;
}

/** A port nobody listens on now. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

function serverScripts(): Record<string, string> {
  const file = path.join(repoRoot, 'apps/server/package.json');
  return (
    (JSON.parse(readFileSync(file, 'utf8')) as { scripts?: Record<string, string> }).scripts ?? {}
  );
}

/** True when apps/server compiles ahead (`build` script): the bench builds it as `npm start` would. */
export function serverBuildScript(): boolean {
  return Boolean(serverScripts().build);
}

/**
 * How `npm start` runs the server: the start script of apps/server. A `node <file>` start of a
 * file that exists (the server compiled ahead) is used as it is; otherwise the sources run
 * through tsx, as `tsx src/main.ts` does, without the extra tsx launcher process.
 */
export function serverCommand(): { args: string[]; cwd: string; label: string } {
  const cwd = path.join(repoRoot, 'apps/server');
  const start = serverScripts().start ?? '';
  const compiled = /(?:^|&&|;)\s*node\s+(?:--[\w-]+(?:=\S+)?\s+)*(\S+\.[cm]?js)\b/.exec(start);
  if (compiled && existsSync(path.join(cwd, compiled[1]!))) {
    return { args: [compiled[1]!], cwd, label: `node ${compiled[1]} (compiled ahead)` };
  }
  return {
    args: ['--import', 'tsx', 'src/main.ts'],
    cwd,
    label: 'tsx src/main.ts (transpiled at start)',
  };
}

async function waitForHealth(
  url: string,
  child: ChildProcess,
  output: () => string,
  timeoutMs = 60_000,
) {
  const started = performance.now();
  while (performance.now() - started < timeoutMs) {
    if (child.exitCode !== null) {
      throw new Error(
        `The server exited with code ${child.exitCode} before answering:\n${output()}`,
      );
    }
    try {
      const response = await fetch(url);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  throw new Error(`No answer from ${url} within ${timeoutMs} ms:\n${output()}`);
}

function spawnServer(
  name: string,
  args: string[],
  cwd: string,
  env: NodeJS.ProcessEnv,
  origin: string,
  healthPath: string,
  label: string,
): Promise<ChildServer> {
  const started = performance.now();
  const child = spawn(process.execPath, args, { cwd, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let log = '';
  const keep = (chunk: Buffer) => {
    log = (log + chunk.toString()).slice(-20_000);
  };
  child.stdout.on('data', keep);
  child.stderr.on('data', keep);
  return waitForHealth(`${origin}${healthPath}`, child, () => log).then(() => ({
    name,
    origin,
    command: label,
    startMs: Math.round(performance.now() - started),
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
        child.once('exit', () => {
          clearTimeout(timer);
          resolve();
        });
        child.kill('SIGTERM');
      }),
  }));
}

/**
 * Lotwise as a lab runs it: NODE_ENV=production (no demo data, no development mail or
 * payments fakes), on the generated file. The alert scheduler is off so its periodic pass
 * does not land inside one question's ten seconds; the alert work a draw does is measured.
 */
export async function startApi(databasePath: string): Promise<ChildServer> {
  const port = await freePort();
  const origin = `http://127.0.0.1:${port}`;
  const command = serverCommand();
  return spawnServer(
    'api',
    command.args,
    command.cwd,
    {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      PUBLIC_URL: origin,
      DATABASE_PATH: databasePath,
      JWT_SECRET: randomBytes(32).toString('base64url'),
      LOG_LEVEL: 'warn',
      ALERT_INTERVAL_SECONDS: '0',
      // a scheduled backup of the generated lab would land in the middle of the timings
      BACKUP_INTERVAL_HOURS: '0',
    },
    origin,
    '/api/health',
    command.label,
  );
}

/** The bare Express + better-sqlite3 baseline on the same file. */
export async function startBaseline(databasePath: string, userId: number): Promise<ChildServer> {
  const port = await freePort();
  const origin = `http://127.0.0.1:${port}`;
  return spawnServer(
    'baseline',
    ['--import', 'tsx', 'bench/baseline/server.ts'],
    repoRoot,
    {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      DATABASE_PATH: databasePath,
      BENCH_USER_ID: String(userId),
    },
    origin,
    '/health',
    'bench/baseline/server.ts',
  );
}
