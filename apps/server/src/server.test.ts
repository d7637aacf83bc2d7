import Database from 'better-sqlite3';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { StartupError } from './config';
import { migrations } from './db/data-source';
import { startServer } from './server';
import { testConfig } from './test/harness';

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-server-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Migrations committed in `file` so far, read by a connection of its own. */
function committedMigrations(file: string): number {
  if (!existsSync(file)) return 0;
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const table = db
      .prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'migrations'")
      .get();
    if (!table) return 0;
    return (db.prepare('SELECT COUNT(*) AS n FROM migrations').get() as { n: number }).n;
  } finally {
    db.close();
  }
}

function config(port: number, file: string) {
  return testConfig(dir, {
    PORT: String(port),
    DATABASE_PATH: path.join(dir, file),
    NODE_ENV: 'test',
    SEED_DEMO: 'false',
  });
}

interface Answer {
  status: number;
  retryAfter: string | null;
  body: { status?: string; error?: { code?: string } };
  /** Migrations committed when the answer arrived. */
  migrated: number;
}

async function ask(url: string, file: string): Promise<Answer> {
  const response = await fetch(url);
  const body = (await response.json()) as Answer['body'];
  return {
    status: response.status,
    retryAfter: response.headers.get('retry-after'),
    body,
    migrated: committedMigrations(file),
  };
}

describe('start-up', { timeout: 60_000 }, () => {
  it('when the server migrates a new database, then it already listens: live 200, ready 503 starting, other routes 503 with Retry-After; then ready 200', async () => {
    const settings = config(4711, 'new.sqlite');
    const file = settings.databasePath;
    let during: Promise<Answer[]> | null = null;
    const server = await startServer(settings, {
      // asked as soon as it listens: the migrations, which take turns with requests, are running
      onListening: (url) => {
        during = Promise.all([
          ask(`${url}/api/health/ready`, file),
          ask(`${url}/api/health/live`, file),
          ask(`${url}/api/health`, file),
          ask(`${url}/api/chemicals`, file),
        ]);
      },
    });
    try {
      const [ready, live, health, chemicals] = (await during!) as [Answer, Answer, Answer, Answer];
      expect(ready).toMatchObject({ status: 503, body: { status: 'starting' } });
      expect(ready.migrated).toBeLessThan(migrations.length);
      expect(live).toMatchObject({ status: 200, body: { status: 'ok' } });
      expect(health).toMatchObject({ status: 503, body: { status: 'starting' } });
      expect(chemicals).toMatchObject({
        status: 503,
        retryAfter: '5',
        body: { error: { code: 'service_unavailable' } },
      });

      const after = await ask(`${server.url}/api/health/ready`, file);
      expect(after).toMatchObject({ status: 200, body: { status: 'ready' } });
      expect(after.migrated).toBe(migrations.length);
      const signedOut = await ask(`${server.url}/api/chemicals`, file);
      expect(signedOut.body.error?.code).toBe('unauthenticated');
    } finally {
      await server.close();
    }
  });

  it('when the database file is damaged, then start-up throws the StartupError and stops listening', async () => {
    const settings = config(4712, 'damaged.sqlite');
    writeFileSync(settings.databasePath, 'this is not an SQLite database, it only has the name');
    let listenedAt: string | null = null;
    const failed = await startServer(settings, {
      onListening: (url) => (listenedAt = url),
    }).catch((error: unknown) => error);
    expect(failed).toBeInstanceOf(StartupError);
    expect((failed as Error).message).toContain(settings.databasePath);
    expect(listenedAt).toBe('http://127.0.0.1:4712');
    await expect(fetch('http://127.0.0.1:4712/api/health/live')).rejects.toThrow();
  });
});
