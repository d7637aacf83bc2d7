import { describe, expect, it } from 'vitest';
import { onPostgres, testContext } from '../test/harness';
import { recordStatements } from '../test/statements';
import { startOptimizing } from './optimize';

const quiet = () => undefined;
const logger = { debug: quiet, info: quiet, warn: quiet, error: quiet };

// SQLite's statistics; PostgreSQL's autovacuum keeps its own.
describe.skipIf(onPostgres)('database statistics', () => {
  it('when the server starts, then the tables are analysed once, and again every interval', async () => {
    const { dataSource, store } = testContext();
    const recording = await recordStatements(dataSource);
    // 0.2 s instead of hours
    const optimizer = startOptimizing(dataSource, store, logger, 0.2 / 3600);
    await optimizer.ready;
    await new Promise((resolve) => setTimeout(resolve, 500));
    optimizer.stop();
    const pragmas = recording
      .stop()
      .map((s) => s.query)
      .filter((query) => query.startsWith('PRAGMA optimize'));
    expect(pragmas[0]).toBe('PRAGMA optimize=0x10002');
    expect(pragmas.slice(1).length).toBeGreaterThanOrEqual(1);
    expect(new Set(pragmas.slice(1))).toEqual(new Set(['PRAGMA optimize']));
    const [stats] = await dataSource.query(
      "SELECT COUNT(*) AS n FROM sqlite_master WHERE name = 'sqlite_stat1'",
    );
    expect(stats.n).toBe(1);
  });
});
