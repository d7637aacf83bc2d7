import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { connect } from 'node:net';
import path from 'node:path';
import { repoRoot } from '../../config';

export interface DevMailServer {
  inboxUrl: string;
  /**
   * Settles once the fake SMTP server accepts connections (or after `timeoutMs`, or when it
   * exits): start sending only then, so the first e-mails do not fail and wait for a retry.
   */
  ready: Promise<void>;
  stop(): void;
}

/** Resolves when something accepts TCP connections on 127.0.0.1:`port`, or after `timeoutMs`. */
export function portAnswers(port: number, timeoutMs = 10_000): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  return new Promise((resolve) => {
    const attempt = () => {
      const socket = connect({ host: '127.0.0.1', port });
      socket.once('connect', () => {
        socket.destroy();
        resolve(true);
      });
      socket.once('error', () => {
        socket.destroy();
        if (Date.now() >= until) resolve(false);
        else setTimeout(attempt, 100);
      });
    };
    attempt();
  });
}

/** Where the local fake mail server is installed (a development dependency of the workspace). */
export const devMailBin = path.join(repoRoot, 'node_modules/maildev/dist/bin/maildev.js');

/**
 * Starts the local fake mail server with its web inbox as a child process, bound to
 * 127.0.0.1 only, keeping its files in `<database folder>/dev-mail`. Answers null (and says
 * why) when it is not installed: e-mails then wait in the outbox until an SMTP server answers.
 */
export function startDevMail(
  settings: { port: number; webPort: number; dataDir: string },
  print: (line: string) => void = console.log,
): DevMailServer | null {
  if (!existsSync(devMailBin)) {
    print(
      `The local fake mail server is not installed (${path.relative(repoRoot, devMailBin)} is missing): e-mails stay queued in the outbox until an SMTP server answers on 127.0.0.1:${settings.port}. Set SMTP_URL to use a real one, or DEV_MAIL=false to silence this.`,
    );
    return null;
  }
  const tmp = path.join(settings.dataDir, 'dev-mail');
  mkdirSync(tmp, { recursive: true });
  const child: ChildProcess = spawn(
    process.execPath,
    [
      devMailBin,
      '--ip',
      '127.0.0.1',
      '--web-ip',
      '127.0.0.1',
      '-s',
      String(settings.port),
      '-w',
      String(settings.webPort),
    ],
    { env: { ...process.env, TMPDIR: tmp }, stdio: ['ignore', 'ignore', 'pipe'] },
  );
  child.stderr?.on('data', (chunk) => {
    const text = String(chunk).trim();
    if (text) print(`[dev mail] ${text}`);
  });
  child.once('exit', (code, signal) => {
    if (code !== 0 && signal === null) {
      print(
        `The local fake mail server stopped (exit code ${code}); e-mails wait in the outbox until it is back.`,
      );
    }
  });
  const stop = () => {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
  };
  // Never leave it running behind us, however the server stops.
  process.once('exit', stop);
  const exited = new Promise<boolean>((resolve) => child.once('exit', () => resolve(false)));
  const ready = Promise.race([portAnswers(settings.port), exited]).then(() => undefined);
  return { inboxUrl: `http://127.0.0.1:${settings.webPort}`, ready, stop };
}
