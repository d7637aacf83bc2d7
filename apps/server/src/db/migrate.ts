import { setImmediate as nextTurn } from 'node:timers/promises';
import { MigrationExecutor, type DataSource } from 'typeorm';

/**
 * Applies the pending migrations in one transaction, like `dataSource.runMigrations({
 * transaction: 'all' })`, but lets the event loop take a turn before every statement.
 * better-sqlite3 runs statements synchronously, so without the turns a whole migration would
 * run in one go and the server, which listens while it migrates, could not answer its health
 * checks (`/api/health/ready` says 503 `starting` meanwhile). Returns the names applied.
 */
export async function runMigrationsAnswering(dataSource: DataSource): Promise<string[]> {
  // SQLite's driver hands out one shared query runner: the turns are taken off it afterwards.
  const queryRunner = dataSource.createQueryRunner();
  const hadOwnQuery = Object.prototype.hasOwnProperty.call(queryRunner, 'query');
  const original = queryRunner.query;
  const query = original.bind(queryRunner);
  queryRunner.query = (async (...args: Parameters<typeof query>) => {
    await nextTurn();
    return query(...args);
  }) as typeof queryRunner.query;
  try {
    const executor = new MigrationExecutor(dataSource, queryRunner);
    executor.transaction = 'all';
    return (await executor.executePendingMigrations()).map((migration) => migration.name);
  } finally {
    if (hadOwnQuery) queryRunner.query = original;
    else delete (queryRunner as Partial<typeof queryRunner>).query;
    await queryRunner.release();
  }
}
