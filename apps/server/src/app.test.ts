import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createApp } from './app';
import { testContext } from './test/harness';
import { version } from './version';

describe('the app shell', () => {
  it('when the database answers, then /api/health says ok with the version', async () => {
    const response = await request(testContext().app).get('/api/health').expect(200);
    expect(response.body).toEqual({ status: 'ok', database: 'ok', version });
  });

  it('when the route is unknown, then it answers 404 in the error shape', async () => {
    for (const url of ['/api/nothing-here', '/api', '/not-api']) {
      const response = await request(testContext().app).get(url).expect(404);
      expect(response.body.error).toMatchObject({
        code: 'not_found',
        message: expect.stringContaining(url),
      });
    }
    await request(testContext().app).put('/api/chemicals').expect(404);
  });

  it('when a body is malformed JSON on any route, then it answers 400 and no stack trace', async () => {
    const response = await request(testContext().app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send('{"email":')
      .expect(400);
    expect(response.body).toEqual({
      error: { code: 'validation_failed', message: 'The request body is not valid JSON.' },
    });
  });

  it('when a body is too large, then it answers 413', async () => {
    const response = await request(testContext().app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@example.test', password: 'x'.repeat(1_100_000) }))
      .expect(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });

  it('when answering, then security headers are set and Express is not named', async () => {
    const response = await request(testContext().app).get('/api/health');
    expect(response.headers['x-powered-by']).toBeUndefined();
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-security-policy']).toContain("default-src 'self'");
    expect(response.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
  });

  it('when the web app is built, then its files are served and other pages fall back to index.html, but not /api', async () => {
    const { dataSource, config, dir } = testContext();
    const dist = path.join(dir, 'web-dist');
    mkdirSync(path.join(dist, 'assets'), { recursive: true });
    writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Lotwise</title>');
    writeFileSync(path.join(dist, 'assets', 'app.js'), 'console.log("lotwise")');
    const app = createApp({ dataSource, config: { ...config, webDist: dist } });

    const asset = await request(app).get('/assets/app.js').expect(200);
    expect(asset.text).toContain('lotwise');
    for (const page of ['/', '/stock/chemicals/3', '/invite/abc']) {
      const response = await request(app).get(page).expect(200);
      expect(response.text, page).toContain('<title>Lotwise</title>');
    }
    const api = await request(app).get('/api/unknown').expect(404);
    expect(api.body.error.code).toBe('not_found');
    await request(app).post('/somewhere').expect(404);
  });
});
