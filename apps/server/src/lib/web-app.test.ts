import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createApp } from '../app';
import { createUser, signedIn } from '../test/factories';
import { testContext } from '../test/harness';

/** A built web app in the test's folder: index.html, a hashed asset and a plain file. */
function builtWebApp() {
  const { dataSource, config, dir } = testContext();
  const dist = path.join(dir, 'web-dist-delivery');
  mkdirSync(path.join(dist, 'assets'), { recursive: true });
  writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Lotwise</title>');
  writeFileSync(
    path.join(dist, 'assets', 'index-Dx1a2b3c.js'),
    'export const app = 1;\n'.repeat(200),
  );
  writeFileSync(path.join(dist, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
  return createApp({ dataSource, config: { ...config, webDist: dist } });
}

describe('web delivery', () => {
  it('when a JSON answer is asked for with Accept-Encoding gzip, then it comes back gzip-encoded', async () => {
    const admin = await signedIn('admin');
    for (let i = 0; i < 8; i++) await createUser({ role: 'member' });
    const response = await request(testContext().app)
      .get('/api/users')
      .set('Cookie', admin.cookie)
      .set('Accept-Encoding', 'gzip')
      .expect(200);
    expect(response.headers['content-encoding']).toBe('gzip');
    expect(response.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(response.headers['cache-control']).toBe('no-store');
    expect(response.body.items.length).toBeGreaterThanOrEqual(9);
  });

  it('when the browser takes brotli, then a JSON answer comes back brotli-encoded', async () => {
    const admin = await signedIn('admin');
    for (let i = 0; i < 8; i++) await createUser({ role: 'member' });
    const response = await request(testContext().app)
      .get('/api/users')
      .set('Cookie', admin.cookie)
      .set('Accept-Encoding', 'br')
      .expect(200);
    expect(response.headers['content-encoding']).toBe('br');
    // supertest decodes the answer as a browser does
    expect(response.body.items.length).toBeGreaterThanOrEqual(9);
  });

  it('when a hashed asset is served, then it is compressed and kept by the browser for a year', async () => {
    const response = await request(builtWebApp())
      .get('/assets/index-Dx1a2b3c.js')
      .set('Accept-Encoding', 'gzip')
      .expect(200);
    expect(response.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(response.headers['content-encoding']).toBe('gzip');
  });

  it('when index.html is served, under its own name or for a page address, then the browser revalidates it', async () => {
    const app = builtWebApp();
    for (const page of ['/', '/index.html', '/chemicals/3']) {
      const response = await request(app).get(page).expect(200);
      expect(response.headers['cache-control'], page).toBe('no-cache');
      expect(response.text, page).toContain('<title>Lotwise</title>');
    }
  });

  it('when a file outside assets/ is served, then it is not marked immutable', async () => {
    const response = await request(builtWebApp()).get('/favicon.svg').expect(200);
    expect(response.headers['cache-control']).toBe('public, max-age=3600');
  });
});
