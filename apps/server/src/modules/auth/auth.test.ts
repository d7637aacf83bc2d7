import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createApp } from '../../app';
import { hashPassword, tokenHash } from './passwords';
import { createUser, signIn, signedIn, testPassword, uniqueEmail } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;

describe('sign-in', () => {
  it('when the password is right, then it answers the user and sets an HttpOnly, SameSite=Lax session cookie', async () => {
    const { email, user } = await createUser({ role: 'manager' });
    const response = await request(app())
      .post('/api/auth/login')
      .send({ email: email.toUpperCase(), password: testPassword })
      .expect(200);
    expect(response.body.user).toMatchObject({ id: user.id, email, role: 'manager' });
    expect(response.body.user.passwordHash).toBeUndefined();
    expect(response.body.user.lastLoginAt).toEqual(expect.any(String));
    const cookie = [response.headers['set-cookie']].flat()[0] ?? '';
    expect(cookie).toMatch(/^lotwise_session=[^;]+/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Path=\//);
    expect(cookie).toMatch(/Max-Age=43200/);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('when COOKIE_SECURE is on, then the cookie is Secure', async () => {
    const { dataSource, config } = testContext();
    const secureApp = createApp({ dataSource, config: { ...config, cookieSecure: true } });
    const { email } = await createUser();
    const response = await request(secureApp)
      .post('/api/auth/login')
      .send({ email, password: testPassword })
      .expect(200);
    expect([response.headers['set-cookie']].flat()[0]).toMatch(/; Secure/i);
  });

  it('when the password or the e-mail is wrong, then both answer the same 401', async () => {
    const { email } = await createUser();
    const wrongPassword = await request(app())
      .post('/api/auth/login')
      .send({ email, password: 'not-the-password' })
      .expect(401);
    const unknownEmail = await request(app())
      .post('/api/auth/login')
      .send({ email: uniqueEmail('nobody'), password: testPassword })
      .expect(401);
    expect(wrongPassword.body.error.code).toBe('unauthenticated');
    expect(wrongPassword.body.error.message).toBe(unknownEmail.body.error.message);
    expect(wrongPassword.headers['set-cookie']).toBeUndefined();
  });

  it('when the account is deactivated, then sign-in is refused with a clear message', async () => {
    const { email } = await createUser({ active: false });
    const response = await request(app())
      .post('/api/auth/login')
      .send({ email, password: testPassword })
      .expect(403);
    expect(response.body.error.message).toMatch(/deactivated/);
  });

  it('when an invited user has no password yet, then sign-in fails like a wrong password', async () => {
    const { email } = await createUser({ password: null });
    await request(app())
      .post('/api/auth/login')
      .send({ email, password: 'anything-at-all' })
      .expect(401);
  });

  it('when the body is incomplete, then it answers 400 naming the fields', async () => {
    const response = await request(app()).post('/api/auth/login').send({}).expect(400);
    expect(Object.keys(response.body.error.fields).sort()).toEqual(['email', 'password']);
  });

  it('when sign-in fails LOGIN_RATE_LIMIT times, then the next attempt answers 429 rate_limited', async () => {
    const { dataSource, config } = testContext();
    const limitedApp = createApp({ dataSource, config: { ...config, loginRateLimit: 3 } });
    const { email } = await createUser();
    for (let attempt = 0; attempt < 3; attempt++) {
      await request(limitedApp)
        .post('/api/auth/login')
        .send({ email, password: 'wrong-guess' })
        .expect(401);
    }
    const blocked = await request(limitedApp)
      .post('/api/auth/login')
      .send({ email, password: testPassword })
      .expect(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    // Another account from the same address is counted separately.
    const other = await createUser();
    await request(limitedApp)
      .post('/api/auth/login')
      .send({ email: other.email, password: testPassword })
      .expect(200);
  });

  it('when one address tries 11 e-mails, then the per-address limit answers 429 (password spraying)', async () => {
    const { dataSource, config } = testContext();
    const limitedApp = createApp({
      dataSource,
      config: { ...config, loginRateLimit: 10, loginRateLimitPerAddress: 10 },
    });
    for (let attempt = 0; attempt < 10; attempt++) {
      await request(limitedApp)
        .post('/api/auth/login')
        .send({ email: uniqueEmail('sprayed'), password: 'Summer2026!' })
        .expect(401);
    }
    const blocked = await request(limitedApp)
      .post('/api/auth/login')
      .send({ email: uniqueEmail('sprayed'), password: 'Summer2026!' })
      .expect(429);
    expect(blocked.body.error).toMatchObject({ code: 'rate_limited' });
    expect(blocked.body.error.message).toMatch(/from this network address/);
    // Without a trusted proxy, a made-up X-Forwarded-For does not give a fresh address.
    await request(limitedApp)
      .post('/api/auth/login')
      .set('X-Forwarded-For', '203.0.113.7')
      .send({ email: uniqueEmail('sprayed'), password: 'Summer2026!' })
      .expect(429);
  });

  it('when TRUST_PROXY names the proxy, then each forwarded client address has its own limit', async () => {
    const { dataSource, config } = testContext();
    const proxiedApp = createApp({
      dataSource,
      config: { ...config, loginRateLimitPerAddress: 2, trustProxy: ['loopback'] },
    });
    const attempt = (client: string) =>
      request(proxiedApp)
        .post('/api/auth/login')
        .set('X-Forwarded-For', client)
        .send({ email: uniqueEmail('proxied'), password: 'wrong-guess' });
    await attempt('198.51.100.1').expect(401);
    await attempt('198.51.100.1').expect(401);
    await attempt('198.51.100.1').expect(429);
    await attempt('198.51.100.2').expect(401);
  });

  it('when a stored hash was made at another bcrypt cost, then signing in replaces it at BCRYPT_COST', async () => {
    const { store, config } = testContext();
    const { email, user } = await createUser();
    await store.repos.users.update(user.id, { passwordHash: await hashPassword(testPassword, 5) });
    await signIn(app(), email);
    const row = await store.repos.users.findById(user.id);
    expect(row?.passwordHash).toMatch(new RegExp(`^\\$2[ab]\\$0${config.bcryptCost}\\$`));
    await signIn(app(), email);
  });

  it('when sign-ins succeed, then they do not count against the limit', async () => {
    const { dataSource, config } = testContext();
    const limitedApp = createApp({ dataSource, config: { ...config, loginRateLimit: 2 } });
    const { email } = await createUser();
    for (let attempt = 0; attempt < 4; attempt++) {
      await request(limitedApp)
        .post('/api/auth/login')
        .send({ email, password: testPassword })
        .expect(200);
    }
  });
});

describe('session', () => {
  it('when signed in, then /me answers the user; when not, 401', async () => {
    const { cookie, user } = await signedIn('viewer');
    const me = await request(app()).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.user).toMatchObject({ id: user.id, role: 'viewer' });
    const anonymous = await request(app()).get('/api/auth/me').expect(401);
    expect(anonymous.body.error.code).toBe('unauthenticated');
  });

  it('when the cookie is forged or signed with another secret, then it answers 401', async () => {
    await request(app())
      .get('/api/auth/me')
      .set('Cookie', 'lotwise_session=abc.def.ghi')
      .expect(401);
    const { dataSource, config } = testContext();
    const otherApp = createApp({ dataSource, config: { ...config, jwtSecret: 'x'.repeat(40) } });
    const { cookie } = await signedIn('admin', otherApp);
    await request(app()).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  it('when logging out, then the cookie is cleared with 204', async () => {
    const { cookie } = await signedIn('member');
    const response = await request(app())
      .post('/api/auth/logout')
      .set('Cookie', cookie)
      .expect(204);
    const cleared = [response.headers['set-cookie']].flat()[0] ?? '';
    expect(cleared).toMatch(/^lotwise_session=;/);
    expect(cleared).toMatch(/Expires=Thu, 01 Jan 1970/);
  });

  it('when a signed-in user is deactivated or demoted, then the next request sees it at once', async () => {
    const { cookie, user } = await signedIn('manager');
    const { store } = testContext();
    await request(app()).post('/api/chemicals').set('Cookie', cookie).send({}).expect(400);
    await store.repos.users.update(user.id, { role: 'viewer' });
    await request(app()).post('/api/chemicals').set('Cookie', cookie).send({}).expect(403);
    await store.repos.users.update(user.id, { active: false });
    await request(app()).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });
});

describe('invitations', () => {
  async function invite() {
    const admin = await signedIn('admin');
    const email = uniqueEmail('invitee');
    const response = await request(app())
      .post('/api/users')
      .set('Cookie', admin.cookie)
      .send({ email, displayName: 'New Club Member', role: 'member' })
      .expect(201);
    const token = String(response.body.inviteUrl).split('/invite/')[1] ?? '';
    return { email, token, admin, user: response.body.user };
  }

  it('when the link is fresh, then it greets the person and accepting signs them in', async () => {
    const { email, token } = await invite();
    const greeting = await request(app()).get(`/api/auth/invite/${token}`).expect(200);
    expect(greeting.body).toEqual({ email, displayName: 'New Club Member' });

    const accepted = await request(app())
      .post('/api/auth/accept-invite')
      .send({ token, password: 'a-new-long-password' })
      .expect(200);
    expect(accepted.body.user).toMatchObject({ email, invitePending: false });
    const cookie = ([accepted.headers['set-cookie']].flat()[0] ?? '').split(';')[0] ?? '';
    await request(app()).get('/api/auth/me').set('Cookie', cookie).expect(200);
    await signIn(app(), email, 'a-new-long-password');

    // The link works once.
    await request(app()).get(`/api/auth/invite/${token}`).expect(404);
    await request(app())
      .post('/api/auth/accept-invite')
      .send({ token, password: 'another-long-password' })
      .expect(404);
  });

  it('when the link has expired or is unknown, then it answers 404', async () => {
    const { token, user } = await invite();
    await testContext().store.repos.users.update(user.id, {
      inviteExpiresAt: new Date(Date.now() - 1000).toISOString(),
    });
    await request(app()).get(`/api/auth/invite/${token}`).expect(404);
    await request(app()).get('/api/auth/invite/not-a-token').expect(404);
  });

  it('when the password is too short, then accepting answers 400 naming password', async () => {
    const { token } = await invite();
    const response = await request(app())
      .post('/api/auth/accept-invite')
      .send({ token, password: 'short' })
      .expect(400);
    expect(response.body.error.fields.password).toMatch(/at least 10/);
  });

  it('when an invitation is made, then only the hash of its token is stored', async () => {
    const { token, user } = await invite();
    const row = await testContext().store.repos.users.findById(user.id);
    expect(row?.inviteTokenHash).toBe(tokenHash(token));
    expect(row?.inviteTokenHash).not.toContain(token);
  });

  it('when an admin re-issues an invitation, then the old link stops working', async () => {
    const { token, user, admin } = await invite();
    const reissued = await request(app())
      .post(`/api/users/${user.id}/invite`)
      .set('Cookie', admin.cookie)
      .expect(200);
    expect(reissued.body.inviteUrl).toMatch(/^http:\/\/lotwise\.example\.test\/invite\//);
    await request(app()).get(`/api/auth/invite/${token}`).expect(404);
    const fresh = String(reissued.body.inviteUrl).split('/invite/')[1];
    await request(app()).get(`/api/auth/invite/${fresh}`).expect(200);
  });
});
