import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  chmodSync,
  copyFileSync,
  existsSync,
  mkdirSync,
  openSync,
  readdirSync,
  readFileSync,
  statSync,
  writeFileSync,
  writeSync,
  closeSync,
} from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freshDatabase, onSqlite, removeDatabases, scratchFolder } from './lib/database';
import { reportFigure } from './lib/figures';
import { LotwiseServer, repoRoot, serverEntry, type Exit } from './lib/launcher';

const hashOf = (file: string) => createHash('sha256').update(readFileSync(file)).digest('hex');

/** Bytes of every file in a folder (and one level below), to show nothing was written. */
function snapshot(folder: string): Record<string, string> {
  const files: Record<string, string> = {};
  for (const name of readdirSync(folder)) {
    const file = path.join(folder, name);
    const stats = statSync(file);
    try {
      files[name] = stats.isFile() ? hashOf(file) : `folder ${readdirSync(file).join(',')}`;
    } catch (error) {
      files[name] = `unreadable (${(error as NodeJS.ErrnoException).code})`;
    }
  }
  return files;
}

/** Overwrites `length` bytes at `offset` with a pattern (the file keeps its size). */
function scribble(file: string, offset: number, length: number) {
  const fd = openSync(file, 'r+');
  writeSync(fd, Buffer.alloc(length, 0xa5), 0, length, offset);
  closeSync(fd);
}

const asRoot = process.getuid?.() === 0;
const nobodyUid = 65534;

/**
 * Whether the permission cases can run: as root they run as nobody, who must be able to read
 * the compiled server and the SQLite driver (a checkout in root's home may not allow that).
 */
function unprivilegedRunnable(): boolean {
  if (!asRoot) return true;
  const files = [serverEntry, path.join(repoRoot, 'node_modules/better-sqlite3/package.json')];
  const probe = spawnSync(
    process.execPath,
    ['-e', `for (const f of ${JSON.stringify(files)}) require('fs').accessSync(f, 4)`],
    { uid: nobodyUid, gid: nobodyUid, cwd: '/' },
  );
  return probe.status === 0;
}
/** Where the first page of the ledger table starts in the good file (read in beforeAll). */
let ledgerRootOffset = 0;

interface Case {
  name: string;
  /** Sets up the folder and answers the DATABASE_PATH to start with. */
  prepare(folder: string, good: string): string;
  env?: Record<string, string>;
  /** What the message must say besides the path. */
  says: RegExp;
  /** Runs as nobody when the suite runs as root (permissions do not stop root). */
  unprivileged?: boolean;
}

const cases: Case[] = [
  {
    name: 'damaged header',
    prepare(folder, good) {
      const file = path.join(folder, 'lotwise.sqlite');
      copyFileSync(good, file);
      scribble(file, 0, 100);
      return file;
    },
    says: /cannot be used: .*not a database/i,
  },
  {
    name: 'damaged table page (DATABASE_CHECK=full)',
    prepare(folder, good) {
      const file = path.join(folder, 'lotwise.sqlite');
      copyFileSync(good, file);
      scribble(file, ledgerRootOffset, 64);
      return file;
    },
    env: { DATABASE_CHECK: 'full' },
    says: /cannot be used: /i,
  },
  {
    name: 'unreadable file',
    prepare(folder, good) {
      const file = path.join(folder, 'lotwise.sqlite');
      copyFileSync(good, file);
      chmodSync(folder, 0o755);
      chmodSync(file, 0o000);
      return file;
    },
    says: /cannot be read: permission denied \(EACCES\)/,
    unprivileged: true,
  },
  {
    name: 'folder that cannot be entered',
    prepare(folder, good) {
      const inner = path.join(folder, 'locked');
      mkdirSync(inner);
      const file = path.join(inner, 'lotwise.sqlite');
      copyFileSync(good, file);
      chmodSync(folder, 0o755);
      chmodSync(inner, 0o000);
      return file;
    },
    says: /cannot be read: permission denied \(EACCES\)/,
    unprivileged: true,
  },
  {
    name: 'path that is a folder',
    prepare(folder) {
      const file = path.join(folder, 'lotwise.sqlite');
      mkdirSync(file);
      return file;
    },
    says: /is not a file/i,
  },
  {
    name: 'missing file',
    prepare(folder) {
      return path.join(folder, 'lotwise.sqlite');
    },
    says: /There is no database file at/,
  },
  {
    name: 'empty file',
    prepare(folder) {
      const file = path.join(folder, 'lotwise.sqlite');
      writeFileSync(file, '');
      return file;
    },
    says: /The database file is empty/,
  },
];

describe.skipIf(!onSqlite)('database files in production', () => {
  let good = '';

  beforeAll(async () => {
    // A real Lotwise database: made by the server (migrated, demo lab), closed cleanly.
    const database = freshDatabase('file-good');
    const server = await LotwiseServer.start({ name: 'file-good', database });
    await server.stop();
    if (database.kind !== 'sqlite') throw new Error('SQLite only');
    expect(existsSync(`${database.path}-wal`)).toBe(false);
    good = database.path;
    const db = new Database(good, { readonly: true });
    const { rootpage } = db
      .prepare("SELECT rootpage FROM sqlite_master WHERE name = 'ledger_entries'")
      .get() as { rootpage: number };
    ledgerRootOffset = (rootpage - 1) * (db.pragma('page_size', { simple: true }) as number);
    db.close();
  });

  afterAll(() => {
    removeDatabases();
  });

  it('when the database file is damaged, unreadable or missing in production, then the start stops with a message naming the file, a non-zero exit and nothing written', async () => {
    const results: { name: string; exit: Exit; named: boolean; said: boolean; same: boolean }[] =
      [];
    const failures: string[] = [];
    const skipped: string[] = [];
    const canDropRights = unprivilegedRunnable();
    for (const test of cases) {
      if (test.unprivileged && !canDropRights) {
        skipped.push(test.name);
        continue;
      }
      const folder = scratchFolder('file');
      const file = test.prepare(folder, good);
      const before = snapshot(folder);
      const server = await LotwiseServer.prepare({
        name: `file-${test.name}`,
        database: { kind: 'sqlite', path: file, folder, env: { DATABASE_PATH: file } },
        env: { NODE_ENV: 'production', SEED_DEMO: '', ...test.env },
        ...(asRoot && test.unprivileged ? { uid: nobodyUid, gid: nobodyUid } : {}),
      });
      const exit = await server.runToExit(30_000);
      const after = snapshot(folder);
      if (test.unprivileged) {
        // Readable again, so the comparison below and the clean-up can look inside.
        chmodSync(path.dirname(file), 0o755);
        chmodSync(file, 0o644);
      }
      // An unreadable copy of the good file must still be that file, byte for byte.
      const bytesKept = !test.unprivileged || hashOf(file) === hashOf(good);
      const result = {
        name: test.name,
        exit,
        named: exit.output.includes(file),
        said: test.says.test(exit.output),
        same: JSON.stringify(after) === JSON.stringify(before) && bytesKept,
      };
      results.push(result);
      if (exit.code === 0 || exit.code === null || !result.named || !result.said || !result.same) {
        failures.push(
          `${test.name}: exit ${exit.code ?? exit.signal}\n${exit.output.slice(0, 800)}${result.same ? '' : `\nbefore ${JSON.stringify(before)}\nafter ${JSON.stringify(after)}`}`,
        );
      }
    }

    reportFigure(
      'database-file',
      `production start on ${results.length} bad database files: ${results
        .map(
          (r) =>
            `${r.name} -> exit ${r.exit.code ?? r.exit.signal}${r.named ? ', file named' : ', FILE NOT NAMED'}${r.same ? ', unchanged' : ', CHANGED'}`,
        )
        .join(
          '; ',
        )}${skipped.length ? `; skipped (nobody cannot read the server's files): ${skipped.join(', ')}` : ''}`,
      {
        cases: results.length,
        skipped: skipped.length,
        clear: results.filter((r) => r.exit.code !== 0 && r.named && r.said && r.same).length,
      },
    );
    expect(failures).toEqual([]);
  });
});
