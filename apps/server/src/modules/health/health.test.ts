import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { testContext } from '../../test/harness';

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
