import { errorBodySchema, permissionMatrix, roles, type Permission } from '@lotwise/shared';
import { z } from 'zod';
import {
  createDocument,
  type ZodOpenApiOperationObject,
  type ZodOpenApiPathsObject,
} from 'zod-openapi';
import type { oas31 } from 'zod-openapi';
import type { ApiRoute, RouteAccess } from '../../lib/route-table';
import { sessionCookieName } from '../auth/session';

export type OpenApiDocument = oas31.OpenAPIObject;

/** The document's extension on each operation: who may call it, for the help page's list. */
export const accessExtension = 'x-lotwise-access';

/** `/api/containers/:id/draws` → `/api/containers/{id}/draws`. */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:(\w+)/g, '{$1}');
}

function pathParamNames(expressPath: string): string[] {
  return [...expressPath.matchAll(/:(\w+)/g)].map((match) => match[1]!);
}

/** The tag of an operation: the first part of its path after `/api` (`chemicals`, `orders`). */
export function tagOf(expressPath: string): string {
  return (expressPath.split('/')[2] ?? 'other').replace(/\.\w+$/, '');
}

const collectionVerbs: Record<ApiRoute['method'], string> = {
  get: 'List',
  post: 'Add to',
  patch: 'Change',
  put: 'Replace',
  delete: 'Delete',
};

/**
 * A plain one-liner for a route that gives none: `GET /api/lots` → "List lots",
 * `POST /api/alerts/evaluate` → "alerts › evaluate", `GET /api/lots/:id` → "lots › one".
 */
export function derivedSummary(route: Pick<ApiRoute, 'method' | 'path'>): string {
  const parts = route.path.split('/').slice(2);
  const words = parts
    .filter((part) => !part.startsWith(':'))
    .map((part) => part.replace(/-/g, ' ').replace(/\.\w+$/, ''));
  if (parts.length === 1) return `${collectionVerbs[route.method]} ${words[0]}`;
  return `${words.join(' › ')}${parts.at(-1)!.startsWith(':') ? ' › one' : ''}`;
}

function rolesHolding(permission: Permission): string[] {
  return roles.filter((role) => permissionMatrix[role].includes(permission));
}

/** Who may call a route, in words. */
export function accessText(access: RouteAccess): string {
  if (access === 'public') return 'Public: no sign-in needed.';
  if (access === 'signed-in') return 'Any signed-in person.';
  return `Needs the permission \`${access}\` (roles: ${rolesHolding(access).join(', ')}).`;
}

const errorResponse = {
  description: 'The one error answer of the API: a closed code, a message, fields at fault.',
  content: { 'application/json': { schema: errorBodySchema } },
};

const errorRef = { $ref: '#/components/responses/Error' };

function successResponses(route: ApiRoute): ZodOpenApiOperationObject['responses'] {
  const response = route.docs.response;
  if (!response) {
    return { '2XX': { description: 'Done. (The shape of this answer is not described here.)' } };
  }
  const status = String(response.status ?? 200);
  const description = response.description ?? (status === '204' ? 'Done, no body.' : 'Done.');
  if (response.schema) {
    return {
      [status]: { description, content: { 'application/json': { schema: response.schema } } },
    };
  }
  if (response.contentType) {
    return {
      [status]: {
        description,
        content: { [response.contentType]: { schema: { type: 'string' as const } } },
      },
    };
  }
  return { [status]: { description } };
}

/** Path parameters the route's schema does not name (e.g. a route without a params schema). */
function undeclaredPathParams(route: ApiRoute): oas31.ParameterObject[] {
  const declared =
    route.docs.params instanceof z.ZodObject ? Object.keys(route.docs.params.shape) : [];
  return pathParamNames(route.path)
    .filter((name) => !declared.includes(name))
    .map((name) => ({ name, in: 'path', required: true, schema: { type: 'string' } }));
}

function operation(route: ApiRoute): ZodOpenApiOperationObject {
  const { docs, access } = route;
  const signedIn = access !== 'public';
  const requestParams: NonNullable<ZodOpenApiOperationObject['requestParams']> = {};
  if (docs.params instanceof z.ZodObject) requestParams.path = docs.params;
  if (docs.query instanceof z.ZodObject) requestParams.query = docs.query;
  const responses: ZodOpenApiOperationObject['responses'] = {
    ...successResponses(route),
    ...(docs.body || docs.query || docs.params ? { '400': errorRef } : {}),
    ...(signedIn ? { '401': errorRef } : {}),
    ...(signedIn && access !== 'signed-in' ? { '403': errorRef } : {}),
    ...(pathParamNames(route.path).length > 0 ? { '404': errorRef } : {}),
    default: errorRef,
  };
  return {
    operationId: `${route.method}${route.path.replace(/[^A-Za-z0-9]+(\w)?/g, (_m, c: string = '') => c.toUpperCase())}`,
    summary: docs.summary ?? derivedSummary(route),
    description: accessText(access),
    tags: [tagOf(route.path)],
    [accessExtension]: access,
    security: signedIn ? [{ session: [] }] : [],
    ...(Object.keys(requestParams).length > 0 ? { requestParams } : {}),
    ...(undeclaredPathParams(route).length > 0 ? { parameters: undeclaredPathParams(route) } : {}),
    ...(docs.body
      ? {
          requestBody: {
            required: true,
            content: { 'application/json': { schema: docs.body } },
          },
        }
      : {}),
    responses,
  };
}

/**
 * The OpenAPI 3.1 document of the API, generated from the route table: each route's zod
 * schemas (from `shared/`) become its parameters, body and answer, its access the security
 * and the `x-lotwise-access` extension.
 */
export function buildOpenApiDocument(routes: ApiRoute[], version: string): OpenApiDocument {
  const paths: ZodOpenApiPathsObject = {};
  for (const route of routes) {
    const item = (paths[openApiPath(route.path)] ??= {});
    item[route.method] = operation(route);
  }
  return createDocument(
    {
      openapi: '3.1.0',
      info: {
        title: 'Lotwise API',
        version,
        description:
          'The JSON API of a Lotwise stockroom. Sign in with `POST /api/auth/login`; the ' +
          'session travels in an httpOnly cookie. Writes from another site are refused. ' +
          'Lists take `q`, `sort=field.asc`, `page` and `pageSize` and answer ' +
          '`{ items, total, page, pageSize }`. Nothing the API answers is safety approval: ' +
          'the SDS, local regulations and licensed practice take precedence.',
      },
      tags: [...new Set(routes.map((route) => tagOf(route.path)))].sort().map((name) => ({ name })),
      paths,
      components: {
        securitySchemes: {
          session: {
            type: 'apiKey',
            in: 'cookie',
            name: sessionCookieName,
            description: 'Set by `POST /api/auth/login`, ended by `POST /api/auth/logout`.',
          },
        },
        responses: { Error: errorResponse },
      },
    },
    { allowEmptySchema: { custom: true } },
  );
}
