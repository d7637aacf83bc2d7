import express, { type Express } from 'express';
import type { ErrorBody } from '@lotwise/shared';
import type { LogLevel, Logger } from '../../lib/logger';
import { requestContext } from '../../lib/request-context';
import { requestLogger } from '../../lib/request-log';
import { version } from '../../version';
import { retryAfterSeconds } from './health.routes';

/**
 * What answers while the server checks and migrates its database, before the app is built:
 * liveness is ok, readiness and `/api/health` are 503 `starting`, and every other request is
 * 503 `service_unavailable` with Retry-After, so a proxy or a browser tries again shortly
 * instead of meeting a closed port.
 */
export function startingApp(logger: Logger, level: LogLevel): Express {
  const app = express();
  app.disable('x-powered-by');
  app.use(requestLogger(logger, level));
  app.use(requestContext());
  app.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    res.set('Retry-After', String(retryAfterSeconds));
    next();
  });
  app.get('/api/health/live', (_req, res) => {
    res.removeHeader('Retry-After');
    res.json({ status: 'ok', version });
  });
  for (const path of ['/api/health', '/api/health/ready']) {
    app.get(path, (_req, res) => {
      res.status(503).json({ status: 'starting', database: 'starting', version });
    });
  }
  app.use((_req, res) => {
    const body: ErrorBody = {
      error: {
        code: 'service_unavailable',
        message:
          'Lotwise is starting: it is checking and updating its database. Try again in a few seconds.',
      },
    };
    res.status(503).json(body);
  });
  return app;
}
