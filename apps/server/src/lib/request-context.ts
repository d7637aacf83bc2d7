import { AsyncLocalStorage } from 'node:async_hooks';
import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request, RequestHandler, Response } from 'express';

/** What every log line written while a request is handled carries. */
export interface RequestContext {
  reqId: string;
  /** The signed-in user, once the session was read (null before, and for nobody). */
  userId(): number | null;
}

const contexts = new AsyncLocalStorage<RequestContext>();
const contextKey = Symbol('lotwiseRequestContext');

/** The request being handled by the code that calls this, if any. */
export function currentRequestContext(): RequestContext | undefined {
  return contexts.getStore();
}

/**
 * A request id sent by a client or a proxy is kept when it is short and plain (letters,
 * digits, `.`, `_`, `:`, `-`), so it can neither break a log line nor carry much; anything else
 * gets an id of our own.
 */
const safeRequestId = /^[A-Za-z0-9._:-]{1,128}$/;

export function requestIdFor(req: IncomingMessage): string {
  const sent = req.headers['x-request-id'];
  return typeof sent === 'string' && safeRequestId.test(sent) ? sent : randomUUID();
}

/** The request id given to `req` (by the request logger), or a new one. */
export function requestIdOf(req: IncomingMessage & { id?: unknown }): string {
  if (typeof req.id === 'string') return req.id;
  const id = requestIdFor(req);
  req.id = id;
  return id;
}

function contextOf(req: Request, res: Response): RequestContext {
  const held = (res as unknown as Record<symbol, RequestContext | undefined>)[contextKey];
  if (held) return held;
  const context: RequestContext = {
    reqId: requestIdOf(req),
    userId: () => (res.locals.user as { id?: number } | undefined)?.id ?? null,
  };
  (res as unknown as Record<symbol, RequestContext>)[contextKey] = context;
  return context;
}

/**
 * Echoes the request id in `X-Request-Id` and runs the rest of the request inside its context.
 * Stream events (a body being read, an upload) resume in the context of the socket, not of the
 * request, so the route runner and the error middleware enter it again (`inRequestContext`).
 */
export function requestContext(): RequestHandler {
  return (req, res, next) => {
    const context = contextOf(req, res);
    res.setHeader('X-Request-Id', context.reqId);
    contexts.run(context, next);
  };
}

/** Runs `work` inside the context of the request `res` answers. */
export function inRequestContext<T>(req: Request, res: Response, work: () => T): T {
  return contexts.run(contextOf(req, res), work);
}

/**
 * Runs `work` outside any request's context: a worker woken by a request goes on to work for
 * others, and its lines must not carry that one request's id.
 */
export function outsideRequest<T>(work: () => T): T {
  return contexts.exit(work);
}

/** For the request logger: the id as `req.id` carries it (node's types know no such field). */
export function genRequestId(req: IncomingMessage, _res: ServerResponse): string {
  return requestIdOf(req);
}
