import type { Store } from '../../db/store';
import { defineRoute } from '../../lib/route-table';
import type { Logger } from '../../lib/logger';
import { version } from '../../version';

/** Whether the server takes work: false from the moment it begins to stop. */
export interface Readiness {
  accepting: boolean;
}

/** Seconds a client is asked to wait (Retry-After) while Lotwise starts or stops. */
export const retryAfterSeconds = 5;

/**
 * `/api/health` (the database answers a read; kept for existing checks), `/api/health/live`
 * (the process answers HTTP at all: restart it when this fails) and `/api/health/ready` (send
 * it traffic: migrated, the database file is the one opened and answers, not stopping). While the server starts, the
 * starting app (starting-app.ts) answers these paths instead.
 */
export function healthRoutes(
  store: Store,
  logger: Logger,
  readiness: Readiness,
  fileProblem: () => string | null = () => null,
) {
  const databaseAnswers = async (): Promise<boolean> => {
    try {
      await store.ping();
      return true;
    } catch (error) {
      logger.error('Health check: the database does not answer', { error: String(error) });
      return false;
    }
  };
  const databaseUsable = async (): Promise<boolean> => {
    const problem = fileProblem();
    if (problem) {
      logger.error(`Readiness check: ${problem}`);
      return false;
    }
    return databaseAnswers();
  };
  return [
    defineRoute({
      method: 'get',
      path: '/api/health',
      access: 'public',
      handle: async ({ res }) => {
        if (await databaseAnswers()) res.json({ status: 'ok', database: 'ok', version });
        else res.status(503).json({ status: 'error', database: 'error', version });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/health/live',
      access: 'public',
      handle: ({ res }) => {
        res.json({ status: 'ok', version });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/health/ready',
      access: 'public',
      handle: async ({ res }) => {
        if (!readiness.accepting) {
          res.set('Retry-After', String(retryAfterSeconds));
          res.status(503).json({ status: 'stopping', database: 'ok', version });
        } else if (await databaseUsable()) {
          res.json({ status: 'ready', database: 'ok', version });
        } else {
          res.status(503).json({ status: 'error', database: 'error', version });
        }
      },
    }),
  ];
}
