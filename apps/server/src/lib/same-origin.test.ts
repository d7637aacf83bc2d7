import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { signedIn } from '../test/factories';
import { testContext } from '../test/harness';

// The test configuration's PUBLIC_URL is http://lotwise.example.test.
const app = () => testContext().app;

describe('state-changing requests from other sites', () => {
  it('when a browser posts with a cross-site Origin, then it answers 403 and changes nothing', async () => {
    const { cookie } = await signedIn('manager');
    const response = await request(app())
      .post('/api/locations')
      .set('Cookie', cookie)
      .set('Origin', 'https://elsewhere.example.test')
      .send({ name: 'Planted shelf' })
      .expect(403);
    expect(response.body.error).toMatchObject({ code: 'forbidden' });
    expect(response.body.error.message).toMatch(/another website/);
    const list = await request(app()).get('/api/locations').set('Cookie', cookie).expect(200);
    expect(JSON.stringify(list.body)).not.toContain('Planted shelf');
  });

  it('when Sec-Fetch-Site says cross-site, then it answers 403 even without an Origin', async () => {
    const { cookie } = await signedIn('admin');
    for (const method of ['post', 'put', 'patch', 'delete'] as const) {
      const call = request(app())[method]('/api/users/1');
      await call.set('Cookie', cookie).set('Sec-Fetch-Site', 'cross-site').send({}).expect(403);
    }
  });

  it('when the Origin is PUBLIC_URL or the request host, or no such header is sent, then the request goes through', async () => {
    const { cookie } = await signedIn('manager');
    const post = (headers: Record<string, string>, name: string) => {
      const call = request(app()).post('/api/locations').set('Cookie', cookie);
      for (const [key, value] of Object.entries(headers)) call.set(key, value);
      return call.send({ name });
    };
    await post(
      { Origin: 'http://lotwise.example.test', 'Sec-Fetch-Site': 'same-origin' },
      'A',
    ).expect(201);
    await post(
      { Host: 'lab.example.test:8080', Origin: 'http://lab.example.test:8080' },
      'B',
    ).expect(201);
    await post({}, 'C').expect(201);
    await post({ Origin: 'null' }, 'D').expect(403);
  });

  it('when reading, then a foreign Origin does not matter', async () => {
    await request(app())
      .get('/api/health')
      .set('Origin', 'https://elsewhere.example.test')
      .set('Sec-Fetch-Site', 'cross-site')
      .expect(200);
  });
});

describe('caching of API answers', () => {
  it('when a signed-in request is answered, then it carries Cache-Control: no-store', async () => {
    const { cookie } = await signedIn('viewer');
    const me = await request(app()).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.headers['cache-control']).toBe('no-store');
    const chemicals = await request(app()).get('/api/chemicals').set('Cookie', cookie).expect(200);
    expect(chemicals.headers['cache-control']).toBe('no-store');
  });
});
