import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createUser, signIn, signedIn, uniqueEmail } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let adminCookie = '';
let adminId = 0;
let adminEmail = '';

beforeAll(async () => {
  const admin = await signedIn('admin');
  adminCookie = admin.cookie;
  adminId = admin.user.id;
  adminEmail = admin.email;
});

const asAdmin = {
  get: (path: string) => request(app()).get(path).set('Cookie', adminCookie),
  post: (path: string, body: object = {}) =>
    request(app()).post(path).set('Cookie', adminCookie).send(body),
  patch: (path: string, body: object) =>
    request(app()).patch(path).set('Cookie', adminCookie).send(body),
};

describe('creating users', () => {
  it('when a password is given, then the user can sign in at once and no invite link is made', async () => {
    const email = uniqueEmail('ready');
    const response = await asAdmin
      .post('/api/users', {
        email,
        displayName: 'Ready User',
        role: 'viewer',
        password: 'long-enough-pw',
      })
      .expect(201);
    expect(response.body).toMatchObject({
      user: { email, role: 'viewer', active: true, invitePending: false },
      inviteUrl: null,
    });
    await signIn(app(), email, 'long-enough-pw');
  });

  it('when no password is given, then the answer carries a 7-day invitation link', async () => {
    const response = await asAdmin
      .post('/api/users', { email: uniqueEmail('invited'), displayName: 'Invited', role: 'member' })
      .expect(201);
    expect(response.body.user.invitePending).toBe(true);
    expect(response.body.inviteUrl).toMatch(
      /^http:\/\/lotwise\.example\.test\/invite\/[\w-]{40,}$/,
    );
    const row = await testContext().store.repos.users.findById(response.body.user.id);
    const days = (Date.parse(row!.inviteExpiresAt!) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.9);
    expect(days).toBeLessThanOrEqual(7);
  });

  it('when the e-mail is taken (in any letter case), then it answers 409 naming email', async () => {
    const { email } = await createUser();
    const response = await asAdmin
      .post('/api/users', { email: email.toUpperCase(), displayName: 'Twin', role: 'member' })
      .expect(409);
    expect(response.body.error).toMatchObject({
      code: 'conflict',
      fields: { email: expect.any(String) },
    });
  });

  it('when fields are bad or unknown, then it answers 400 naming each', async () => {
    const response = await asAdmin
      .post('/api/users', { email: 'not-an-address', displayName: '', role: 'owner', extra: 1 })
      .expect(400);
    expect(Object.keys(response.body.error.fields).sort()).toEqual([
      'displayName',
      'email',
      'extra',
      'role',
    ]);
  });
});

describe('listing and reading users', () => {
  it('when searching, sorting and paging, then totals and order follow the query', async () => {
    const tag = `zz${Date.now().toString(36)}`;
    for (const name of ['Carla', 'alma', 'Bert']) {
      await asAdmin
        .post('/api/users', {
          email: uniqueEmail(tag),
          displayName: `${name} ${tag}`,
          role: 'member',
        })
        .expect(201);
    }
    const page1 = await asAdmin
      .get(`/api/users?q=${tag}&sort=displayName.asc&pageSize=2`)
      .expect(200);
    expect(page1.body).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(
      page1.body.items.map((u: { displayName: string }) => u.displayName.split(' ')[0]),
    ).toEqual(['alma', 'Bert']);
    const page2 = await asAdmin
      .get(`/api/users?q=${tag}&sort=displayName.asc&pageSize=2&page=2`)
      .expect(200);
    expect(page2.body.items).toHaveLength(1);
    await asAdmin.get('/api/users?sort=password.asc').expect(400);
  });

  it('when reading one user, then it answers it, or 404 for an unknown id and 400 for a bad one', async () => {
    const { user } = await createUser();
    const response = await asAdmin.get(`/api/users/${user.id}`).expect(200);
    expect(response.body).toMatchObject({ id: user.id, email: user.email });
    expect(response.body).not.toHaveProperty('passwordHash');
    await asAdmin.get('/api/users/987654').expect(404);
    await asAdmin.get('/api/users/abc').expect(400);
  });
});

describe('changing users', () => {
  it('when an admin changes role and name, then the user and the audit trail show it', async () => {
    const { user } = await createUser({ role: 'member' });
    const response = await asAdmin
      .patch(`/api/users/${user.id}`, { role: 'manager', displayName: 'Promoted Person' })
      .expect(200);
    expect(response.body).toMatchObject({ role: 'manager', displayName: 'Promoted Person' });

    const audit = await asAdmin.get(`/api/audit?targetType=user&targetId=${user.id}`).expect(200);
    const actions = audit.body.items.map((e: { action: string }) => e.action);
    expect(actions).toEqual(
      expect.arrayContaining(['user.created', 'user.role_changed', 'user.renamed']),
    );
    const roleChange = audit.body.items.find(
      (e: { action: string }) => e.action === 'user.role_changed',
    );
    expect(roleChange).toMatchObject({
      actor: { id: adminId },
      targetType: 'user',
      targetId: user.id,
      detail: { from: 'member', to: 'manager' },
    });
  });

  it('when an admin deactivates a user, then the user cannot sign in and the audit records it', async () => {
    const { user, email, password } = await createUser();
    await asAdmin.patch(`/api/users/${user.id}`, { active: false }).expect(200);
    await request(app()).post('/api/auth/login').send({ email, password }).expect(403);
    const audit = await asAdmin.get(`/api/audit?targetId=${user.id}&q=deactivated`).expect(200);
    expect(audit.body.total).toBe(1);
  });

  it('when an admin sets a password, then the user signs in with it', async () => {
    const { user, email } = await createUser({ password: null });
    await asAdmin.patch(`/api/users/${user.id}`, { password: 'set-by-the-admin' }).expect(200);
    await signIn(app(), email, 'set-by-the-admin');
  });

  it('when an admin tries to deactivate themself, then it answers 409', async () => {
    const response = await asAdmin.patch(`/api/users/${adminId}`, { active: false }).expect(409);
    expect(response.body.error.fields).toHaveProperty('active');
  });

  it('when the change would leave no active admin, then it answers 409; with a second admin it is allowed', async () => {
    const { store } = testContext();
    // Leave exactly one active admin: the one signed in for this file.
    const { rows } = await store.repos.users.list({
      q: '',
      sort: 'email.asc',
      page: 1,
      pageSize: 200,
    });
    for (const row of rows) {
      if (row.role === 'admin' && row.id !== adminId)
        await store.repos.users.update(row.id, { active: false });
    }
    const demoted = await asAdmin.patch(`/api/users/${adminId}`, { role: 'manager' }).expect(409);
    expect(demoted.body.error.fields).toHaveProperty('role');

    const second = await createUser({ role: 'admin' });
    const secondCookie = await signIn(app(), second.email, second.password);
    await request(app())
      .patch(`/api/users/${adminId}`)
      .set('Cookie', secondCookie)
      .send({ active: false })
      .expect(200);
    const lastOne = await request(app())
      .patch(`/api/users/${second.user.id}`)
      .set('Cookie', secondCookie)
      .send({ role: 'member' })
      .expect(409);
    expect(lastOne.body.error.message).toMatch(/at least one active admin/);
    // Restore the file's admin for the other tests; deactivating ended their session.
    await store.repos.users.update(adminId, { active: true });
    adminCookie = await signIn(app(), adminEmail);
  });

  it('when the patch has an unknown field, then it answers 400 naming it', async () => {
    const { user } = await createUser();
    const response = await asAdmin
      .patch(`/api/users/${user.id}`, { email: 'x@example.test' })
      .expect(400);
    expect(response.body.error.fields).toEqual({ email: 'is not a known field' });
  });
});
