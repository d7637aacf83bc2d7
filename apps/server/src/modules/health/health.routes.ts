import type { Store } from '../../db/store';
import { defineRoute } from '../../lib/route-table';
import type { Logger } from '../../lib/logger';
import { version } from '../../version';

export function healthRoutes(store: Store, logger: Logger) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/health',
      access: 'public',
      handle: async ({ res }) => {
        try {
          await store.ping();
          res.json({ status: 'ok', database: 'ok', version });
        } catch (error) {
          logger.error('Health check: the database does not answer', { error: String(error) });
          res.status(503).json({ status: 'error', database: 'error', version });
        }
      },
    }),
  ];
}
