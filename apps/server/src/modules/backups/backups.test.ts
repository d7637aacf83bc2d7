import { mkdirSync, readFileSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { backupListSchema, backupTakenSchema } from '@lotwise/shared';
import Database from 'better-sqlite3';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Logger } from '../../lib/logger';
import { signedIn } from '../../test/factories';
import { onPostgres, testContext } from '../../test/harness';
import {
  backupFile,
  latestBackup,
  listBackups,
  pruneScheduledBackups,
  removeStalePartials,
} from './backup-folder';
import { backupScheduler } from './backup-scheduler';
import { countRows, countRowsInSteps } from './database-copy';

let admin = '';
let manager = '';
beforeAll(async () => {
  admin = (await signedIn('admin')).cookie;
  manager = (await signedIn('manager')).cookie;
});

const app = () => testContext().app;

/** A logger that keeps what it was told. */
function recordingLogger() {
  const lines: { level: string; message: string; detail?: Record<string, unknown> }[] = [];
  const at =
    (level: string) =>
    (message: string, detail?: Record<string, unknown>): void => {
      lines.push({ level, message, detail });
    };
  const logger: Logger = {
    debug: at('debug'),
    info: at('info'),
    warn: at('warn'),
    error: at('error'),
  };
  return { logger, lines };
}

// backups copy the SQLite file; PostgreSQL is backed up with pg_dump (docs/operations.md)
describe.skipIf(onPostgres)('backups on the admin pages', () => {
  it('when an admin takes a backup now, then it is listed, downloads byte for byte and both are in the audit trail', async () => {
    const { config, dataSource } = testContext();
    const empty = backupListSchema.parse(
      (await request(app()).get('/api/backups').set('Cookie', admin).expect(200)).body,
    );
    expect(empty).toMatchObject({
      items: [],
      running: false,
      schedule: { intervalHours: 24, keep: 14, folder: config.backup.dir },
    });

    const taken = backupTakenSchema.parse(
      (await request(app()).post('/api/backups').set('Cookie', admin).send({}).expect(201)).body,
    );
    expect(taken.name).toMatch(/^lotwise-\d{8}T\d{6}Z-manual\.sqlite$/);
    expect(taken.rowCounts.users).toBeGreaterThanOrEqual(2);
    const file = path.join(config.backup.dir, taken.name);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(statSync(config.backup.dir).mode & 0o777).toBe(0o700);

    const list = backupListSchema.parse(
      (await request(app()).get('/api/backups').set('Cookie', admin).expect(200)).body,
    );
    expect(list.items).toEqual([
      { name: taken.name, kind: 'manual', takenAt: taken.takenAt, bytes: statSync(file).size },
    ]);
    expect(latestBackup(config)?.toISOString()).toBe(taken.takenAt);

    const download = await request(app())
      .get(`/api/backups/${taken.name}/download`)
      .set('Cookie', admin)
      .buffer(true)
      .parse((response, done) => {
        const chunks: Buffer[] = [];
        response.on('data', (chunk: Buffer) => chunks.push(chunk));
        response.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(download.headers['content-disposition']).toBe(`attachment; filename=${taken.name}`);
    expect(download.headers['content-type']).toBe('application/vnd.sqlite3');
    expect(Buffer.compare(download.body as Buffer, readFileSync(file))).toBe(0);

    const audit: { action: string; detail: string }[] = await dataSource.query(
      "SELECT action, detail FROM audit_events WHERE target_type = 'backup' ORDER BY id",
    );
    expect(audit.map((row) => [row.action, JSON.parse(row.detail).name])).toEqual([
      ['backup.created', taken.name],
      ['backup.downloaded', taken.name],
    ]);
  });

  it('when a name reaches outside the folder or names no backup, then the download is refused', async () => {
    const { config } = testContext();
    mkdirSync(config.backup.dir, { recursive: true });
    writeFileSync(path.join(config.backup.dir, 'notes.txt'), 'not a backup');
    for (const name of [
      '..%2Flotwise.sqlite',
      '..%2F..%2Fetc%2Fpasswd',
      'notes.txt',
      'jwt-secret',
    ]) {
      await request(app()).get(`/api/backups/${name}/download`).set('Cookie', admin).expect(400);
    }
    await request(app())
      .get('/api/backups/lotwise-20000101T000000Z-manual.sqlite/download')
      .set('Cookie', admin)
      .expect(404);
    expect(backupFile(config.backup.dir, '../lotwise.sqlite')).toBeNull();
    expect(backupFile(config.backup.dir, 'notes.txt')).toBeNull();
  });

  it('when a manager asks, then the backups are out of reach', async () => {
    await request(app()).get('/api/backups').set('Cookie', manager).expect(403);
    await request(app()).post('/api/backups').set('Cookie', manager).send({}).expect(403);
    await request(app())
      .get('/api/backups/lotwise-20000101T000000Z-manual.sqlite/download')
      .set('Cookie', manager)
      .expect(403);
  });
});

describe('the backups folder', () => {
  it('when there are more scheduled backups than kept, then the oldest scheduled ones go and manual ones stay', () => {
    const dir = path.join(testContext().dir, 'prune');
    mkdirSync(dir);
    const names = [
      'lotwise-20260101T000000Z-scheduled.sqlite',
      'lotwise-20260102T000000Z-scheduled.sqlite',
      'lotwise-20260103T000000Z-scheduled.sqlite',
      'lotwise-20260101T120000Z-manual.sqlite',
      'lotwise-20260103T000000Z-scheduled-2.sqlite',
    ];
    for (const name of names) writeFileSync(path.join(dir, name), 'x');
    expect(pruneScheduledBackups(dir, 2)).toEqual([
      'lotwise-20260102T000000Z-scheduled.sqlite',
      'lotwise-20260101T000000Z-scheduled.sqlite',
    ]);
    expect(listBackups(dir).map((backup) => backup.name)).toEqual([
      'lotwise-20260103T000000Z-scheduled-2.sqlite',
      'lotwise-20260103T000000Z-scheduled.sqlite',
      'lotwise-20260101T120000Z-manual.sqlite',
    ]);
  });

  it('when a half-written backup is a day old, then it is removed, and a fresh one is left alone', () => {
    const dir = path.join(testContext().dir, 'partials');
    mkdirSync(dir);
    const old = path.join(dir, 'lotwise-20260101T000000Z-scheduled.sqlite.partial');
    const fresh = path.join(dir, 'lotwise-20260102T000000Z-manual.sqlite.partial');
    writeFileSync(old, 'x');
    writeFileSync(fresh, 'x');
    const twoDaysAgo = (Date.now() - 48 * 3600 * 1000) / 1000;
    utimesSync(old, twoDaysAgo, twoDaysAgo);
    expect(removeStalePartials(dir, 24 * 3600 * 1000)).toEqual([path.basename(old)]);
  });
});

describe.runIf(onPostgres)('backups on PostgreSQL', () => {
  it('when an admin asks for a backup now, then the answer is 409 pointing at pg_dump', async () => {
    const { cookie } = await signedIn('admin');
    const refused = await request(testContext().app)
      .post('/api/backups')
      .set('Cookie', cookie)
      .expect(409);
    expect(refused.body.error.message).toMatch(/pg_dump/);
  });
});

describe.skipIf(onPostgres)('scheduled backups', () => {
  it('when none is due, then none is taken; when the newest is older than the interval, then one is, and the oldest beyond BACKUP_KEEP goes', async () => {
    const { config } = testContext();
    const dir = path.join(testContext().dir, 'scheduled');
    const settings = { ...config, backup: { dir, intervalHours: 24, keep: 2 } };
    let now = new Date();
    const { logger, lines } = recordingLogger();
    const scheduler = backupScheduler({ config: settings, logger, now: () => now });

    await scheduler.check();
    expect(listBackups(dir).map((backup) => backup.kind)).toEqual(['scheduled']);
    expect(lines.at(-1)).toMatchObject({ level: 'info', message: 'Scheduled backup taken' });
    const copy = new Database(path.join(dir, listBackups(dir)[0]!.name), { readonly: true });
    expect(copy.pragma('journal_mode', { simple: true })).toBe('delete');
    expect(copy.pragma('quick_check', { simple: true })).toBe('ok');
    copy.close();

    await scheduler.check();
    expect(listBackups(dir)).toHaveLength(1);

    // Two older ones, as if taken on earlier days; a day later the next one is due.
    writeFileSync(path.join(dir, 'lotwise-20200101T000000Z-scheduled.sqlite'), 'old');
    writeFileSync(path.join(dir, 'lotwise-20200102T000000Z-scheduled.sqlite'), 'old');
    now = new Date(Date.now() + 25 * 3600 * 1000);
    await scheduler.check();
    const kept = listBackups(dir);
    expect(kept).toHaveLength(2);
    expect(kept.every((backup) => !backup.name.startsWith('lotwise-2020'))).toBe(true);
    expect(lines.at(-1)?.detail?.deleted).toEqual([
      'lotwise-20200102T000000Z-scheduled.sqlite',
      'lotwise-20200101T000000Z-scheduled.sqlite',
    ]);
  });

  it('when a backup fails, then it is logged, the scheduler goes on, and it tries again an hour later', async () => {
    const { config } = testContext();
    const blocked = path.join(testContext().dir, 'a-file-not-a-folder');
    writeFileSync(blocked, 'x');
    let now = new Date();
    const { logger, lines } = recordingLogger();
    const scheduler = backupScheduler({
      config: { ...config, backup: { dir: blocked, intervalHours: 24, keep: 14 } },
      logger,
      now: () => now,
    });
    await scheduler.check();
    expect(lines).toMatchObject([
      { level: 'error', message: 'Scheduled backup failed; it is tried again later' },
    ]);
    expect(String(lines[0]!.detail?.error)).toMatch(/not a directory/);

    await scheduler.check();
    expect(lines).toHaveLength(1);
    now = new Date(now.getTime() + 61 * 60 * 1000);
    await scheduler.check();
    expect(lines).toHaveLength(2);
    await scheduler.stop();
  });
});

describe('counting rows a range at a time', () => {
  it('when row ids have gaps and a table has none, then the counts equal COUNT(*)', async () => {
    const db = new Database(':memory:');
    db.exec('CREATE TABLE entries (id INTEGER PRIMARY KEY, note TEXT)');
    db.exec('CREATE TABLE empty_one (id INTEGER PRIMARY KEY)');
    db.exec('CREATE TABLE keyed (code TEXT PRIMARY KEY, n INTEGER) WITHOUT ROWID');
    const insert = db.prepare('INSERT INTO entries (id, note) VALUES (?, ?)');
    for (let id = 1; id <= 25_000; id++) if (id % 7 !== 0) insert.run(id * 3, 'drawn');
    db.prepare("INSERT INTO keyed VALUES ('LW-00001', 1), ('LW-00002', 2)").run();
    const expected = countRows(db);
    expect(expected).toMatchObject({ entries: 21_429, empty_one: 0, keyed: 2 });
    expect(await countRowsInSteps(db, 1000)).toEqual(expected);
    db.close();
  });
});
