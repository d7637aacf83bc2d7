import { can, roles, type Role } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { routeTable } from './app';
import type { ApiRoute } from './lib/route-table';
import { signedIn } from './test/factories';
import { testContext } from './test/harness';

/** Values for path parameters: ids nobody has, so allowed calls end in 400/404, not in damage. */
const sampleParams: Record<string, string> = {
  id: '999999',
  shareId: '999999',
  token: 'no-such-invitation',
  labelCode: 'LW-99999',
  lineId: '999999',
  photoId: '999999',
  locationId: '999999',
  name: 'lotwise-20000101T000000Z-manual.sqlite',
};

function samplePath(path: string): string {
  return path.replace(/:(\w+)/g, (_match, name: string) => {
    const value = sampleParams[name];
    if (!value) throw new Error(`Add a sample value for :${name} to the permission walk`);
    return value;
  });
}

function call(route: ApiRoute, cookie: string | null) {
  const app = testContext().app;
  const test = request(app)[route.method](samplePath(route.path));
  if (cookie) test.set('Cookie', cookie);
  return ['post', 'patch', 'put'].includes(route.method) ? test.send({}) : test;
}

/** The routes Express really has, read from the app's router stack. */
function mountedRoutes(): string[] {
  const stack = (
    testContext().app.router as unknown as {
      stack: { route?: { path: string; methods: Record<string, boolean> } }[];
    }
  ).stack;
  return stack.flatMap((layer) =>
    layer.route
      ? Object.keys(layer.route.methods)
          .filter((method) => method !== '_all')
          .map((method) => `${method.toUpperCase()} ${layer.route!.path}`)
      : [],
  );
}

describe('permission walk: every route with every role', () => {
  const cookies = {} as Record<Role, string>;
  // Signing out ends every session of the user, so the walk signs out last.
  const routes = () =>
    [...routeTable(testContext().app)].sort(
      (a, b) => Number(a.path === '/api/auth/logout') - Number(b.path === '/api/auth/logout'),
    );

  beforeAll(async () => {
    for (const role of roles) cookies[role] = (await signedIn(role)).cookie;
  });

  it('when Express has a route, then the walk table lists it, and the other way round', () => {
    const table = routes().map((route) => `${route.method.toUpperCase()} ${route.path}`);
    expect(mountedRoutes().sort()).toEqual([...table].sort());
    expect(table.length).toBeGreaterThanOrEqual(17);
  });

  it('when nobody is signed in, then every route except the public ones answers 401', async () => {
    for (const route of routes()) {
      const response = await call(route, null);
      const label = `${route.method.toUpperCase()} ${route.path}`;
      if (route.access === 'public') expect([401, 403], label).not.toContain(response.status);
      else expect(response.status, label).toBe(401);
    }
  });

  for (const role of roles) {
    it(`when signed in as ${role}, then routes answer 403 exactly where the matrix says no`, async () => {
      for (const route of routes()) {
        const response = await call(route, cookies[role]);
        const label = `${role} ${route.method.toUpperCase()} ${route.path} -> ${response.status}`;
        const allowed =
          route.access === 'public' || route.access === 'signed-in' || can(role, route.access);
        if (allowed) expect([401, 403], label).not.toContain(response.status);
        else {
          expect(response.status, label).toBe(403);
          expect(response.body.error.code, label).toBe('forbidden');
        }
      }
    });
  }
});
