import { validate, compileErrors } from '@readme/openapi-parser';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { routeTable } from '../../app';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import {
  buildOpenApiDocument,
  derivedSummary,
  openApiPath,
  type OpenApiDocument,
} from './openapi-document';
import { documentedOperations, mountedOperations, undocumentedRoutes } from './route-coverage';

async function fetchDocument(): Promise<OpenApiDocument> {
  const response = await request(testContext().app).get('/api/openapi.json');
  expect(response.status).toBe(200);
  return response.body as OpenApiDocument;
}

/** The validator's findings, in words (it may resolve references in place: it gets a copy). */
async function problemsOf(document: unknown): Promise<string | null> {
  const result = await validate(structuredClone(document) as never);
  return result.valid ? null : compileErrors(result);
}

describe('the API document (GET /api/openapi.json)', () => {
  it('when asked without a session, then it answers a valid OpenAPI 3.1 document', async () => {
    const document = await fetchDocument();
    expect(document.openapi).toBe('3.1.0');
    expect(await problemsOf(document)).toBeNull();
  });

  it('when Express answers a route, then the document describes it (method and path)', async () => {
    const document = await fetchDocument();
    const app = testContext().app;
    expect(undocumentedRoutes(app, document)).toEqual([]);
    // …and the document describes nothing Express does not answer.
    expect(documentedOperations(document).sort()).toEqual(
      [...new Set(mountedOperations(app))].sort(),
    );
    expect(mountedOperations(app)).toContain('POST /api/webhooks/stripe');
    expect(mountedOperations(app)).toContain('POST /api/chemicals/{id}/sds');
    expect(mountedOperations(app)).toContain('GET /api/health');
    expect(mountedOperations(app)).toContain('GET /api/metrics');
  });

  it('when asked twice, then the same document is answered (built once)', async () => {
    const first = await fetchDocument();
    const second = await fetchDocument();
    expect(second).toEqual(first);
  });

  it('when a route is public, signed-in or needs a permission, then its operation says so', async () => {
    const document = await fetchDocument();
    const health = document.paths!['/api/health']!.get!;
    expect(health.security).toEqual([]);
    expect(health['x-lotwise-access']).toBe('public');
    const me = document.paths!['/api/auth/me']!.get!;
    expect(me.security).toEqual([{ session: [] }]);
    expect(me['x-lotwise-access']).toBe('signed-in');
    const draw = document.paths!['/api/containers/{id}/draws']!.post!;
    expect(draw['x-lotwise-access']).toBe('stock.draw');
    expect(draw.description).toContain('admin, manager, member');
    expect(Object.keys(draw.responses!)).toEqual(
      expect.arrayContaining(['400', '401', '403', '404', 'default']),
    );
    expect(document.components!.securitySchemes!.session).toMatchObject({
      type: 'apiKey',
      in: 'cookie',
    });
  });

  it('when a route has zod schemas, then its parameters and body come from them', async () => {
    const document = await fetchDocument();
    const list = document.paths!['/api/chemicals']!.get!;
    const names = (list.parameters as { name: string; in: string }[]).map(
      (p) => `${p.in}:${p.name}`,
    );
    expect(names).toEqual(expect.arrayContaining(['query:q', 'query:sort', 'query:page']));
    const create = document.paths!['/api/chemicals']!.post!;
    expect(create.requestBody).toMatchObject({ content: { 'application/json': {} } });
    const error = document.components!.responses!.Error as {
      content: Record<string, { schema: { properties: Record<string, unknown> } }>;
    };
    expect(error.content['application/json']!.schema.properties).toHaveProperty('error');
  });

  it('when the route table of a test app has a route the document lacks, then the check names it', () => {
    const app = express();
    const table = routeTable(testContext().app);
    const document = buildOpenApiDocument(table, '0.0.0');
    for (const route of table) app[route.method](route.path, (_req, res) => res.end());
    expect(undocumentedRoutes(app, document)).toEqual([]);
    app.get('/api/undescribed/:id', (_req, res) => res.end());
    const router = express.Router();
    router.post('/api/also-undescribed', (_req, res) => res.end());
    app.use(router);
    expect(undocumentedRoutes(app, document)).toEqual([
      'GET /api/undescribed/{id}',
      'POST /api/also-undescribed',
    ]);
  });

  it('when the document is broken, then the validator says so', async () => {
    const document = buildOpenApiDocument(routeTable(testContext().app), '0.0.0');
    expect(await problemsOf(document)).toBeNull();
    const broken = structuredClone(document) as unknown as {
      paths: Record<string, Record<string, { responses?: unknown }>>;
    };
    delete broken.paths['/api/health']!.get!.responses;
    broken.paths['/api/chemicals/{id}']!.get!.responses = 'none';
    expect(await problemsOf(broken)).toMatch(/responses/);
  });

  it('when a route declares its answer, then what it really answers fits that schema', async () => {
    const { cookie } = await signedIn('manager');
    const stock = stockFactory(() => cookie);
    const chemical = await stock.chemical();
    const location = await stock.location();
    const lot = await stock.lot(chemical.id);
    const container = await stock.container(lot.id, location.id);
    const app = testContext().app;
    const table = routeTable(app);
    const calls: [method: 'get' | 'post', template: string, path: string, body?: object][] = [
      ['get', '/api/auth/me', '/api/auth/me'],
      ['get', '/api/chemicals', '/api/chemicals'],
      ['get', '/api/chemicals/:id', `/api/chemicals/${chemical.id}`],
      ['get', '/api/containers', '/api/containers'],
      ['get', '/api/containers/:id', `/api/containers/${container.id}`],
      [
        'post',
        '/api/containers/:id/draws',
        `/api/containers/${container.id}/draws`,
        { amount: 1, unit: 'g' },
      ],
      ['get', '/api/containers/:id/ledger', `/api/containers/${container.id}/ledger`],
      ['get', '/api/plans', '/api/plans'],
      ['get', '/api/runs', '/api/runs'],
      ['get', '/api/orders', '/api/orders'],
      ['get', '/api/rule-sets', '/api/rule-sets'],
      ['get', '/api/lab-areas', '/api/lab-areas'],
    ];
    for (const [method, template, path, body] of calls) {
      const route = table.find((r) => r.method === method && r.path === template)!;
      const call = request(app)[method](path).set('Cookie', cookie);
      const response = await (body ? call.send(body) : call);
      expect(response.status, path).toBe(route.docs.response?.status ?? 200);
      const parsed = route.docs.response!.schema!.safeParse(response.body);
      expect(parsed.error?.issues ?? [], `${method} ${path}`).toEqual([]);
    }
  });

  it('when an Express path has a parameter, then the document writes it in braces', () => {
    expect(openApiPath('/api/orders/:id/shares/:shareId')).toBe(
      '/api/orders/{id}/shares/{shareId}',
    );
  });
});

describe('derived summaries', () => {
  it('when a route gives no summary, then one is made from its method and path', () => {
    expect(derivedSummary({ method: 'get', path: '/api/lots' })).toBe('List lots');
    expect(derivedSummary({ method: 'post', path: '/api/alerts/evaluate' })).toBe(
      'alerts › evaluate',
    );
    expect(derivedSummary({ method: 'patch', path: '/api/lots/:id' })).toBe('lots › one');
    expect(derivedSummary({ method: 'get', path: '/api/orders/money.csv' })).toBe('orders › money');
  });
});
