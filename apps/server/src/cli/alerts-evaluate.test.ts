import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../db/data-source';
import { seedDemo } from '../db/seed/demo-seed';
import { testConfig } from '../test/harness';
import { startSmtpSink } from '../test/smtp-sink';
import { runAlertsEvaluate } from './alerts-evaluate-command';

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-alerts-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function io() {
  const lines: string[] = [];
  return { lines, out: (l: string) => lines.push(l), err: (l: string) => lines.push(`ERR ${l}`) };
}

describe('npm run alerts:evaluate', () => {
  it('when run on the demo lab with --send, then it queues the demo alerts once and sends them', async () => {
    const sink = await startSmtpSink();
    const config = testConfig(dir, { SMTP_URL: `smtp://127.0.0.1:${sink.port}` });
    const dataSource = createDataSource(config.databasePath);
    await dataSource.initialize();
    await dataSource.runMigrations({ transaction: 'all' });
    await seedDemo(dataSource, 4);
    await dataSource.destroy();
    try {
      const first = io();
      expect(await runAlertsEvaluate(['--send'], config, first)).toBe(0);
      const queued = Number(/e-mails queued: (\d+)/.exec(first.lines.join('\n'))?.[1]);
      expect(queued).toBeGreaterThan(0);
      expect(first.lines.join('\n')).toMatch(new RegExp(`Sent: ${queued};`));
      expect(sink.messages).toHaveLength(queued);

      const second = io();
      expect(await runAlertsEvaluate([], config, second)).toBe(0);
      expect(second.lines.join('\n')).toMatch(/e-mails queued: 0;/);

      const bad = io();
      expect(await runAlertsEvaluate(['--nope'], config, bad)).toBe(1);
    } finally {
      await sink.close();
    }
  });

  it('when the server holds the write lock for a moment, then the command waits, tries again and succeeds', async () => {
    const config = testConfig(dir);
    const lock = new Database(config.databasePath);
    lock.exec('DELETE FROM outbox'); // so the evaluation has e-mails to write again
    lock.exec('BEGIN IMMEDIATE'); // the write lock a server's transaction holds
    const released = new Promise<void>((resolve) =>
      setTimeout(() => {
        lock.exec('COMMIT');
        resolve();
      }, 400),
    );
    const out = io();
    try {
      const code = await runAlertsEvaluate([], config, out, {
        busyTimeoutMs: 20,
        retryDelaysMs: [100, 200, 400, 800, 1600],
      });
      expect(out.lines.join('\n')).toMatch(/ERR The database is busy .* trying again in 0\.1 s/);
      expect(code).toBe(0);
      expect(out.lines.join('\n')).toMatch(/Conditions found: \d+/);
    } finally {
      await released;
      lock.close();
    }
  });

  it('when the lock is never released, then it gives up after a bounded number of tries with a clear message', async () => {
    const config = testConfig(dir);
    const lock = new Database(config.databasePath);
    lock.exec('DELETE FROM outbox'); // so the evaluation has e-mails to write again
    lock.exec('BEGIN IMMEDIATE');
    const out = io();
    try {
      const code = await runAlertsEvaluate([], config, out, {
        busyTimeoutMs: 10,
        retryDelaysMs: [20, 40],
      });
      expect(code).toBe(1);
      const errors = out.lines.filter((line) => line.startsWith('ERR'));
      expect(errors).toHaveLength(3); // two waits, then the message
      expect(errors.at(-1)).toMatch(/stayed busy .* nothing was changed/);
    } finally {
      lock.exec('ROLLBACK');
      lock.close();
    }
  });
});
