import type { Express, Request, RequestHandler, Response } from 'express';
import type { Permission, User } from '@lotwise/shared';
import type { z } from 'zod';
import { AppError } from './app-error';
import { authenticate, authorize, currentUser, type SessionResolver } from './auth-middleware';
import { inRequestContext } from './request-context';
import { parsedInput, validate } from './validate';

export type HttpMethod = 'get' | 'post' | 'patch' | 'put' | 'delete';

/** Who may call a route: anyone, any signed-in user, or a role holding the permission. */
export type RouteAccess = 'public' | 'signed-in' | Permission;

type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

export interface RouteContext<B, Q, P> {
  body: B;
  query: Q;
  params: P;
  req: Request;
  res: Response;
  /** The signed-in user; throws 401 on a public route (they do not read the session). */
  actor(): User;
}

interface RouteDefinition<B, Q, P> {
  method: HttpMethod;
  /** Full path, e.g. `/api/chemicals/:id`. */
  path: string;
  access: RouteAccess;
  body?: B;
  query?: Q;
  params?: P;
  /** Extra middleware run before validation (e.g. a rate limiter). */
  before?: RequestHandler[];
  /** One line for the API document (`GET /api/openapi.json`); derived from the path if absent. */
  summary?: string;
  /** The success answer, for the API document (the handler still writes it). */
  response?: RouteResponse;
  handle(ctx: RouteContext<Parsed<B>, Parsed<Q>, Parsed<P>>): unknown;
}

/** A route's success answer as the API document describes it. */
export interface RouteResponse {
  /** 200 unless given. */
  status?: 200 | 201 | 202 | 204;
  /** The JSON body (from the shared contract); none for 204 or a file. */
  schema?: z.ZodType;
  /** What the body is when it is not JSON, e.g. `text/csv`. */
  contentType?: string;
  description?: string;
}

/** What the API document says of a route, besides its method, path and access. */
export interface RouteDocs {
  summary?: string;
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
  response?: RouteResponse;
}

/**
 * One row of the route table: the routers are built from it, the permission walk and the API
 * document read it.
 */
export interface ApiRoute {
  method: HttpMethod;
  path: string;
  access: RouteAccess;
  docs: RouteDocs;
  handlers(resolveSession: SessionResolver): RequestHandler[];
}

/** Declares a route; the schemas type the handler's parsed body, query and params. */
export function defineRoute<
  B extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  P extends z.ZodType | undefined = undefined,
>(definition: RouteDefinition<B, Q, P>): ApiRoute {
  return {
    method: definition.method,
    path: definition.path,
    access: definition.access,
    docs: {
      summary: definition.summary,
      body: definition.body,
      query: definition.query,
      params: definition.params,
      response: definition.response,
    },
    handlers(resolveSession) {
      const guard: RequestHandler[] =
        definition.access === 'public'
          ? []
          : definition.access === 'signed-in'
            ? [authenticate(resolveSession)]
            : [authenticate(resolveSession), authorize(definition.access)];
      // In the request's context again: a body or an upload read before resumes outside it.
      const run: RequestHandler = (req, res) => inRequestContext(req, res, () => handle(req, res));
      const handle = async (req: Request, res: Response) => {
        const input = parsedInput(res);
        await definition.handle({
          body: input.body as Parsed<B>,
          query: input.query as Parsed<Q>,
          params: input.params as Parsed<P>,
          req,
          res,
          actor() {
            const user = currentUser(res);
            if (!user) throw AppError.unauthenticated();
            return user;
          },
        });
      };
      return [
        ...guard,
        ...(definition.before ?? []),
        validate({ body: definition.body, query: definition.query, params: definition.params }),
        run,
      ];
    },
  };
}

/** Registers every route directly on the app, so `app.router.stack` lists them all. */
export function mountRoutes(app: Express, routes: ApiRoute[], resolveSession: SessionResolver) {
  const seen = new Set<string>();
  for (const route of routes) {
    const key = `${route.method.toUpperCase()} ${route.path}`;
    if (seen.has(key)) throw new Error(`Route ${key} is declared twice`);
    seen.add(key);
    app[route.method](route.path, ...route.handlers(resolveSession));
  }
}
