import jwt from 'jsonwebtoken';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { signIn, signedIn, testPassword } from '../../test/factories';
import { testContext } from '../../test/harness';
import { readsOf, recordStatements } from '../../test/statements';
import { sessionCookieName } from './session';

const app = () => testContext().app;

const me = (cookie: string) => request(app()).get('/api/auth/me').set('Cookie', cookie);

function cookieOf(response: request.Response): string {
  return ([response.headers['set-cookie']].flat()[0] ?? '').split(';')[0] ?? '';
}

/** Two sessions of one new user, as if signed in from two browsers. */
async function twoSessions(role: 'member' | 'manager' | 'admin' = 'member') {
  const first = await signedIn(role);
  const second = await signIn(app(), first.email, first.password);
  return { ...first, second };
}

describe('sessions end when they should', () => {
  it('when a user signs out, then every session of theirs answers 401', async () => {
    const { cookie, second } = await twoSessions();
    await me(second).expect(200);
    await request(app()).post('/api/auth/logout').set('Cookie', cookie).expect(204);
    await me(cookie).expect(401);
    await me(second).expect(401);
  });

  it('when a user changes their own password, then old cookies answer 401 and this browser continues', async () => {
    const { cookie, second } = await twoSessions();
    const changed = await request(app())
      .post('/api/auth/password')
      .set('Cookie', cookie)
      .send({ currentPassword: testPassword, newPassword: 'a-brand-new-password' })
      .expect(200);
    const fresh = cookieOf(changed);
    expect(fresh).toMatch(new RegExp(`^${sessionCookieName}=.+`));
    await me(cookie).expect(401);
    await me(second).expect(401);
    await me(fresh).expect(200);
  });

  it('when the current password is wrong, then the change answers 400 naming currentPassword and sessions stay', async () => {
    const { cookie, email } = await signedIn('member');
    const response = await request(app())
      .post('/api/auth/password')
      .set('Cookie', cookie)
      .send({ currentPassword: 'not-the-password', newPassword: 'a-brand-new-password' })
      .expect(400);
    expect(response.body.error.fields).toEqual({ currentPassword: 'is not right' });
    await me(cookie).expect(200);
    await signIn(app(), email, testPassword);
  });

  it('when an admin sets a user password, then the user old cookie answers 401', async () => {
    const admin = await signedIn('admin');
    const { cookie, user } = await signedIn('member');
    await request(app())
      .patch(`/api/users/${user.id}`)
      .set('Cookie', admin.cookie)
      .send({ password: 'set-by-the-admin' })
      .expect(200);
    await me(cookie).expect(401);
    await me(admin.cookie).expect(200);
  });

  it('when an admin changes a role, deactivates or re-issues an invitation, then the old cookie answers 401', async () => {
    const admin = await signedIn('admin');
    const change = async (body: object | 'invite') => {
      const { cookie, user } = await signedIn('manager');
      await me(cookie).expect(200);
      const call =
        body === 'invite'
          ? request(app()).post(`/api/users/${user.id}/invite`)
          : request(app()).patch(`/api/users/${user.id}`).send(body);
      await call.set('Cookie', admin.cookie).expect(200);
      return { cookie, user };
    };
    await me((await change({ role: 'member' })).cookie).expect(401);
    await me((await change('invite')).cookie).expect(401);
    const deactivated = await change({ active: false });
    await request(app())
      .patch(`/api/users/${deactivated.user.id}`)
      .set('Cookie', admin.cookie)
      .send({ active: true })
      .expect(200);
    // Reactivating does not bring the old session back.
    await me(deactivated.cookie).expect(401);
    // Renaming is not a reason to sign anyone out.
    const renamed = await change({ displayName: 'Renamed Person' });
    await me(renamed.cookie).expect(200);
  });

  it('when an admin changes their own password, then this browser stays signed in and others end', async () => {
    const { cookie, second, user } = await twoSessions('admin');
    const response = await request(app())
      .patch(`/api/users/${user.id}`)
      .set('Cookie', cookie)
      .send({ password: 'my-own-new-password' })
      .expect(200);
    await me(cookieOf(response)).expect(200);
    await me(second).expect(401);
  });

  it('when a token carries no expiry or a lifetime beyond 12 hours, then it answers 401 even though it is signed', async () => {
    const { config } = testContext();
    const { user } = await signedIn('member');
    const sign = (options: jwt.SignOptions) =>
      `${sessionCookieName}=${jwt.sign({ sv: 0 }, config.jwtSecret, {
        algorithm: 'HS256',
        issuer: 'lotwise',
        subject: String(user.id),
        ...options,
      })}`;
    await me(sign({ expiresIn: '1h' })).expect(200);
    await me(sign({})).expect(401);
    await me(sign({ expiresIn: '30d' })).expect(401);
    await me(sign({ expiresIn: '1h', noTimestamp: true })).expect(401);
  });
});

describe('the signed-in user is read once for a few seconds, and again at once after a change', () => {
  it('when a signed-in person asks twice, then the second request reads no user row', async () => {
    const { cookie } = await signedIn('member');
    await me(cookie).expect(200);
    const recording = await recordStatements(testContext().dataSource);
    await me(cookie).expect(200);
    expect(readsOf(recording.stop(), 'users')).toEqual([]);
  });

  it('when an admin renames a user, then the next request of that user shows the new name', async () => {
    const admin = await signedIn('admin');
    const { cookie, user } = await signedIn('member');
    await me(cookie).expect(200);
    await request(app())
      .patch(`/api/users/${user.id}`)
      .set('Cookie', admin.cookie)
      .send({ displayName: 'Newly Named Person' })
      .expect(200);
    expect((await me(cookie).expect(200)).body.user.displayName).toBe('Newly Named Person');
  });

  it('when a user row is deactivated through the users repository, then the next request answers 401', async () => {
    const { cookie, user } = await signedIn('member');
    await me(cookie).expect(200);
    await testContext().store.repos.users.update(user.id, { active: false });
    await me(cookie).expect(401);
  });

  it('when a change to a user is rolled back, then requests see the row as stored, before and after', async () => {
    const { cookie, user } = await signedIn('member');
    const { store } = testContext();
    await me(cookie).expect(200);
    await expect(
      store.transaction(async (repos) => {
        await repos.users.update(user.id, { displayName: 'Never Stored' });
        await repos.users.endSessions(user.id);
        throw new Error('changed my mind');
      }),
    ).rejects.toThrow('changed my mind');
    const answer = await me(cookie).expect(200);
    expect(answer.body.user.displayName).toBe(user.displayName);
  });
});
