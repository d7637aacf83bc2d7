import { chmodSync, existsSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource, databaseFiles } from './data-source';

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-modes-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const mode = (file: string) => (statSync(file).mode & 0o777).toString(8);

describe('database file permissions', () => {
  it('when a new database is created and written, then it and its WAL and SHM files are 0600', async () => {
    const file = path.join(dir, 'new.sqlite');
    const dataSource = createDataSource(file);
    await dataSource.initialize();
    try {
      await dataSource.runMigrations({ transaction: 'all' });
      await dataSource.query('CREATE TABLE scratch (x integer)');
      await dataSource.query('INSERT INTO scratch VALUES (1)');
      for (const created of databaseFiles(file)) {
        expect(existsSync(created), created).toBe(true);
        expect(mode(created), created).toBe('600');
      }
    } finally {
      await dataSource.destroy();
    }
  });

  it('when a database file was left readable by others, then opening it makes it 0600', async () => {
    const file = path.join(dir, 'old.sqlite');
    writeFileSync(file, '');
    chmodSync(file, 0o644);
    const dataSource = createDataSource(file);
    await dataSource.initialize();
    try {
      await dataSource.query('CREATE TABLE scratch (x integer)');
      expect(mode(file)).toBe('600');
      expect(mode(`${file}-wal`)).toBe('600');
    } finally {
      await dataSource.destroy();
    }
  });
});
