import { casCheckDigit } from '@lotwise/chem';
import type { ChemicalCreate, Role, User } from '@lotwise/shared';
import type { Express } from 'express';
import request from 'supertest';
import { usersService } from '../modules/users/users.service';
import { testContext } from './harness';

let sequence = 0;
const next = () => ++sequence;

export const testPassword = 'correct-horse-battery';

export function uniqueEmail(prefix = 'person'): string {
  return `${prefix}.${next()}.${Date.now().toString(36)}@example.test`;
}

/** A valid CAS RN nobody else in this test file has (made-up numbers with a right check digit). */
export function uniqueCasNumber(): string {
  const digits = String(5000000 + next() * 7);
  const first = digits.slice(0, -2);
  const second = digits.slice(-2);
  return `${first}-${second}-${casCheckDigit(first + second)}`;
}

/** Creates a user straight through the service (no HTTP), optionally deactivated. */
export async function createUser(
  options: { role?: Role; email?: string; password?: string | null; active?: boolean } = {},
): Promise<{ user: User; email: string; password: string }> {
  const { store, config } = testContext();
  const service = usersService(store, config);
  const email = options.email ?? uniqueEmail(options.role ?? 'member');
  const password = options.password === undefined ? testPassword : options.password;
  const { user } = await service.create(
    {
      email,
      displayName: `Test ${options.role ?? 'member'} ${next()}`,
      role: options.role ?? 'member',
      ...(password ? { password } : {}),
    },
    null,
  );
  if (options.active === false) {
    await store.repos.users.update(user.id, { active: false });
  }
  return { user, email, password: password ?? '' };
}

/** Signs in over HTTP and answers the session cookie to send as the `Cookie` header. */
export async function signIn(
  app: Express,
  email: string,
  password = testPassword,
): Promise<string> {
  const response = await request(app).post('/api/auth/login').send({ email, password }).expect(200);
  const cookie = [response.headers['set-cookie'] ?? []].flat()[0];
  if (!cookie) throw new Error('The login answered no cookie');
  return cookie.split(';')[0] as string;
}

/** A new user of `role`, signed in: answers the user and its cookie. */
export async function signedIn(role: Role, app: Express = testContext().app) {
  const created = await createUser({ role });
  return { ...created, cookie: await signIn(app, created.email, created.password) };
}

/** A complete, valid chemical; override what a test cares about. */
export function chemicalInput(overrides: Partial<ChemicalCreate> = {}): ChemicalCreate {
  return {
    name: `Test reagent ${next()}`,
    casNumber: uniqueCasNumber(),
    formula: 'NaCl',
    physicalState: 'solid',
    stockUnit: 'g',
    ...overrides,
  };
}

/** Stock set-up over HTTP as a manager: a chemical, a lot of it, places and containers. */
export function stockFactory(cookie: () => string) {
  const post = (path: string, body: object) =>
    request(testContext().app).post(path).set('Cookie', cookie()).send(body);
  return {
    async chemical(overrides: Partial<ChemicalCreate> & { extraHazardGroups?: string[] } = {}) {
      const response = await post('/api/chemicals', chemicalInput(overrides)).expect(201);
      return response.body as { id: number; name: string; stockUnit: 'g' | 'mL' };
    },
    async location(
      body: {
        name?: string;
        parentId?: number | null;
        storageGroups?: string[];
        kind?: string;
      } = {},
    ) {
      const response = await post('/api/locations', { name: `Place ${next()}`, ...body }).expect(
        201,
      );
      return response.body as { id: number; name: string; path: string };
    },
    async lot(chemicalId: number, body: object = {}) {
      const response = await post('/api/lots', {
        chemicalId,
        supplierName: 'Northgate Lab Supply (fictional)',
        receivedOn: '2026-01-10',
        ...body,
      }).expect(201);
      return response.body as { id: number };
    },
    async container(lotId: number, locationId: number, body: object = {}) {
      const response = await post('/api/containers', {
        lotId,
        locationId,
        quantity: 500,
        unit: 'g',
        ...body,
      }).expect(201);
      return response.body.container as {
        id: number;
        labelCode: string;
        quantity: number;
        unit: string;
        status: string;
      };
    },
  };
}
