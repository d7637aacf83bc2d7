import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { scratchFolder, type ReliabilityDatabase } from './database';
import { freePort } from './ports';

export const repoRoot = path.resolve(import.meta.dirname, '../..');
/** The compiled server, as `npm start` runs it (`npm run build` makes it). */
export const serverEntry = path.join(repoRoot, 'apps/server/dist/main.js');

export interface LaunchOptions {
  /** Names the server in messages and its scratch folder. */
  name: string;
  database: ReliabilityDatabase;
  /** Environment on top of the suite's defaults (see {@link baseEnv}); wins over them. */
  env?: Record<string, string>;
  /** Arguments after the entry file (e.g. `--init`). */
  args?: string[];
  /** Run as this user and group (the unreadable-file test runs as nobody when root). */
  uid?: number;
  gid?: number;
}

export interface Exit {
  code: number | null;
  signal: NodeJS.Signals | null;
}

/**
 * What every server of the suite gets: development mode on a fresh database (so the demo lab
 * and its accounts are there to sign in with), no development mail inbox or payments fake, no
 * background alert runs or outbox sends unless a test turns them on, quick password hashes,
 * sign-in limits out of the way, and a session secret kept for the server's restarts.
 */
function baseEnv(port: number, secret: string, uploads: string): Record<string, string> {
  const inherited = ['PATH', 'HOME', 'LANG', 'TZ', 'TMPDIR'].flatMap((key) =>
    process.env[key] === undefined ? [] : [[key, process.env[key]!]],
  );
  return {
    ...Object.fromEntries(inherited),
    NODE_ENV: 'development',
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    SEED_DEMO: 'true',
    DEV_MAIL: 'false',
    PAYMENTS_FAKE: 'false',
    LOG_LEVEL: 'warn',
    BCRYPT_COST: '4',
    LOGIN_RATE_LIMIT: '100000',
    LOGIN_RATE_LIMIT_IP: '100000',
    ALERT_INTERVAL_SECONDS: '0',
    OUTBOX_INTERVAL_SECONDS: '0',
    JWT_SECRET: secret,
    UPLOAD_DIR: uploads,
  };
}

function requireBuild() {
  if (!existsSync(serverEntry)) {
    throw new Error(
      `${serverEntry} is missing: run npm run build first (npm run test:reliability does).`,
    );
  }
}

/** The Lotwise server as a child process on 127.0.0.1, which a test can kill and start again. */
export class LotwiseServer {
  readonly origin: string;
  readonly env: Record<string, string>;
  private child: ChildProcess | null = null;
  private exit: Promise<Exit> | null = null;
  private log = '';
  /** How many times the process was started. */
  starts = 0;
  /** From spawn to the first good health answer of the latest start, ms. */
  startMs = 0;

  private constructor(
    readonly options: LaunchOptions,
    readonly port: number,
  ) {
    this.origin = `http://127.0.0.1:${port}`;
    this.env = {
      ...baseEnv(port, randomBytes(32).toString('base64url'), scratchFolder(`${options.name}-up`)),
      ...options.database.env,
      ...options.env,
    };
  }

  /** Starts a server on a free port of the range and waits until its health route answers. */
  static async start(options: LaunchOptions): Promise<LotwiseServer> {
    const server = new LotwiseServer(options, await freePort());
    await server.restart();
    return server;
  }

  /** A server set up but not started: for a start that is expected to fail (see {@link runToExit}). */
  static async prepare(options: LaunchOptions): Promise<LotwiseServer> {
    return new LotwiseServer(options, await freePort());
  }

  get running(): boolean {
    return this.child !== null && this.child.exitCode === null && this.child.signalCode === null;
  }

  get pid(): number | undefined {
    return this.child?.pid;
  }

  /** The last 40,000 characters the process wrote (stdout and stderr together). */
  output(): string {
    return this.log;
  }

  private spawn(): ChildProcess {
    requireBuild();
    if (this.running) throw new Error(`${this.options.name}: the server is running already`);
    const child = spawn(
      process.execPath,
      ['--enable-source-maps', serverEntry, ...(this.options.args ?? [])],
      {
        cwd: repoRoot,
        env: this.env,
        stdio: ['ignore', 'pipe', 'pipe'],
        ...(this.options.uid === undefined ? {} : { uid: this.options.uid }),
        ...(this.options.gid === undefined ? {} : { gid: this.options.gid }),
      },
    );
    const keep = (chunk: Buffer) => {
      this.log = (this.log + chunk.toString()).slice(-40_000);
    };
    child.stdout!.on('data', keep);
    child.stderr!.on('data', keep);
    this.exit = new Promise((resolve) =>
      child.once('exit', (code, signal) => resolve({ code, signal })),
    );
    this.child = child;
    this.starts++;
    return child;
  }

  /** Starts the process (again, on the same port and database) and waits for health. */
  async restart(timeoutMs = 60_000): Promise<void> {
    const started = performance.now();
    const child = this.spawn();
    const url = `${this.origin}/api/health`;
    while (performance.now() - started < timeoutMs) {
      if (child.exitCode !== null || child.signalCode !== null) {
        throw new Error(
          `${this.options.name}: the server exited (${child.exitCode ?? child.signalCode}) before answering:\n${this.log}`,
        );
      }
      try {
        const response = await fetch(url);
        if (response.ok) {
          this.startMs = Math.round(performance.now() - started);
          return;
        }
      } catch {
        // not listening yet
      }
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    throw new Error(`${this.options.name}: no healthy answer within ${timeoutMs} ms:\n${this.log}`);
  }

  /** Sends `signal` and waits for the process to end. */
  async kill(signal: NodeJS.Signals = 'SIGKILL'): Promise<Exit> {
    const child = this.child;
    if (!child || !this.exit) throw new Error(`${this.options.name}: never started`);
    if (this.running) child.kill(signal);
    return this.exit;
  }

  /** Stops the server as an operator would (SIGTERM), with SIGKILL after 15 s. */
  async stop(): Promise<Exit> {
    if (!this.child || !this.exit) return { code: null, signal: null };
    if (!this.running) return this.exit;
    const timer = setTimeout(() => this.child?.kill('SIGKILL'), 15_000);
    try {
      return await this.kill('SIGTERM');
    } finally {
      clearTimeout(timer);
    }
  }

  /** Starts the process and waits for it to end by itself (a start that must fail). */
  async runToExit(timeoutMs = 30_000): Promise<Exit & { output: string }> {
    this.spawn();
    const timer = setTimeout(() => this.child?.kill('SIGKILL'), timeoutMs);
    try {
      const exit = await this.exit!;
      return { ...exit, output: this.log };
    } finally {
      clearTimeout(timer);
    }
  }
}
