import { copyFileSync, renameSync, rmSync, truncateSync } from 'node:fs';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { readinessOf } from '../../app';
import { closeTestContext, onPostgres, openTestContext, testContext } from '../../test/harness';

describe('health check', () => {
  it('when the database answers, then health is ok', async () => {
    const response = await request(testContext().app).get('/api/health').expect(200);
    expect(response.body).toMatchObject({ status: 'ok', database: 'ok' });
  });

  it('when a table it reads is gone, then health answers 503 instead of ok', async () => {
    const { app, dataSource } = testContext();
    await dataSource.query('ALTER TABLE users RENAME TO users_moved_away');
    try {
      const response = await request(app).get('/api/health').expect(503);
      expect(response.body).toMatchObject({ status: 'error', database: 'error' });
    } finally {
      await dataSource.query('ALTER TABLE users_moved_away RENAME TO users');
    }
    await request(app).get('/api/health').expect(200);
  });
});

describe('liveness and readiness', () => {
  it('when the app is up and the database answers, then live and ready are 200', async () => {
    const { app } = testContext();
    expect((await request(app).get('/api/health/live').expect(200)).body).toMatchObject({
      status: 'ok',
    });
    expect((await request(app).get('/api/health/ready').expect(200)).body).toMatchObject({
      status: 'ready',
      database: 'ok',
    });
  });

  it('when the database is closed under the app, then ready is 503 and live stays 200', async () => {
    const context = await openTestContext();
    try {
      await request(context.app).get('/api/health/ready').expect(200);
      await context.dataSource.destroy();
      const ready = await request(context.app).get('/api/health/ready').expect(503);
      expect(ready.body).toMatchObject({ status: 'error', database: 'error' });
      await request(context.app).get('/api/health/live').expect(200);
    } finally {
      await closeTestContext(context);
    }
  });

  // the file check is SQLite's; PostgreSQL's readiness is the database answering
  it.skipIf(onPostgres)(
    'when the database file is emptied, removed or swapped under the open connections, then ready is 503',
    async () => {
      const context = await openTestContext();
      const file = context.config.databasePath;
      const ready = () => request(context.app).get('/api/health/ready');
      try {
        await ready().expect(200);
        // the open connections still answer from their cache: only the file check notices
        copyFileSync(file, `${file}.copy`);
        truncateSync(file, 0);
        expect((await ready().expect(503)).body).toMatchObject({ database: 'error' });
        rmSync(file);
        await ready().expect(503);
        renameSync(`${file}.copy`, file);
        await ready().expect(503);
      } finally {
        await closeTestContext(context);
      }
    },
  );

  it('when the server begins to stop, then ready is 503 with Retry-After', async () => {
    const context = await openTestContext();
    try {
      readinessOf(context.app).accepting = false;
      const ready = await request(context.app).get('/api/health/ready').expect(503);
      expect(ready.body).toMatchObject({ status: 'stopping' });
      expect(ready.headers['retry-after']).toBe('5');
    } finally {
      await closeTestContext(context);
    }
  });
});
