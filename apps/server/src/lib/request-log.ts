import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request, RequestHandler } from 'express';
import { pinoHttp } from 'pino-http';
import { createLogger, pinoOf, type LogLevel, type Logger } from './logger';
import { genRequestId } from './request-context';

/**
 * The route a request took, as declared (`/api/containers/:id`), never the raw URL: ids and
 * tokens (an invitation link, an unsubscribe link) stay out of logs and metric labels. The web
 * app's pages and files are `web app`; an API path no route has is `unmatched`.
 */
export function routeLabel(req: IncomingMessage): string {
  const request = req as Request;
  const declared = (request.route as { path?: unknown } | undefined)?.path;
  if (typeof declared === 'string') return `${request.baseUrl ?? ''}${declared}`;
  const path = (request.originalUrl ?? req.url ?? '').split('?')[0] ?? '';
  return path === '/api' || path.startsWith('/api/') ? 'unmatched' : 'web app';
}

/** Probes and scrapes come every few seconds: their answers are logged at debug level only. */
const quietRoutes = new Set([
  '/api/health',
  '/api/health/live',
  '/api/health/ready',
  '/api/metrics',
]);

function userIdOf(res: ServerResponse): number | undefined {
  const locals = (res as unknown as { locals?: { user?: { id?: number } } }).locals;
  return locals?.user?.id;
}

function requestLine(req: IncomingMessage, res: ServerResponse, ms: unknown) {
  return {
    method: req.method,
    route: routeLabel(req),
    status: res.statusCode,
    ms,
    userId: userIdOf(res),
    // the client went away before the whole answer was sent
    aborted: res.writableEnded ? undefined : true,
  };
}

/**
 * pino-http: gives each request its id (see request-context.ts) and writes one line when the
 * answer is sent: method, route, status, duration in ms and the signed-in user's id.
 */
export function requestLogger(logger: Logger, level: LogLevel): RequestHandler {
  return pinoHttp({
    logger: pinoOf(logger) ?? createLogger(level).pino,
    genReqId: genRequestId,
    quietReqLogger: true,
    quietResLogger: true,
    customAttributeKeys: { reqId: 'reqId', responseTime: 'ms' },
    customLogLevel: (req, res, error) => {
      // a probe's 503 is its answer, not a failure of the request (the check logs the cause)
      if (quietRoutes.has(routeLabel(req))) return 'debug';
      if (error || (res.statusCode >= 500 && res.statusCode !== 503)) return 'error';
      // 503: starting, stopping, or the payment provider away; the client is told to retry
      return res.statusCode === 503 ? 'warn' : 'info';
    },
    customSuccessMessage: () => 'request',
    customErrorMessage: () => 'request failed',
    customSuccessObject: (req, res, value) => requestLine(req, res, value.ms),
    customErrorObject: (req, res, _error, value) => requestLine(req, res, value.ms),
  }) as unknown as RequestHandler;
}
