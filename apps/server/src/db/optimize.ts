import type { DataSource } from 'typeorm';
import type { Logger } from '../lib/logger';
import type { Store } from './store';

/** How often the running server refreshes SQLite's table statistics. */
export const optimizeIntervalHours = 6;

/**
 * Keeps SQLite's statistics (sqlite_stat1) current, so its planner knows, for example, that a
 * cabinet holds a few hundred containers while "open" matches a quarter of them, and picks the
 * location index. At start (after migrations), `PRAGMA optimize=0x10002` looks at every table
 * and analyses those never analysed or much grown (a fresh or long-unanalysed file is analysed
 * once; a few hundred ms on 100,000 containers), then `PRAGMA optimize` runs every
 * `intervalHours`, as the SQLite documentation advises for long-lived connections. Each run
 * is bounded by SQLite's own analysis limit. The periodic run goes through `store.transaction`
 * so it never lands inside another transaction on the shared connection.
 */
export async function startOptimizing(
  dataSource: DataSource,
  store: Store,
  logger: Logger,
  intervalHours = optimizeIntervalHours,
): Promise<{ stop(): void }> {
  await dataSource.query('PRAGMA optimize=0x10002');
  const timer = setInterval(
    () => {
      store
        .transaction(() => dataSource.query('PRAGMA optimize'))
        .catch((error: unknown) =>
          logger.warn('Refreshing the database statistics failed', { error: String(error) }),
        );
    },
    intervalHours * 3600 * 1000,
  );
  timer.unref();
  return {
    stop() {
      clearInterval(timer);
    },
  };
}
