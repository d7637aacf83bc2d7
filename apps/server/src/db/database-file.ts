import { accessSync, constants, existsSync, statSync } from 'node:fs';
import type { DataSource } from 'typeorm';
import { StartupError, databaseFileSize, unreachableDatabaseMessage, type Config } from '../config';
import type { Logger } from '../lib/logger';
import { createDataSource } from './data-source';
import { advisoryLocks, onPostgres, redactedUrl } from './postgres';
import { withPlaceholders } from './sql';
import { runMigrationsAnswering } from './migrate';
import { demoAccounts, seedDemo } from './seed/demo-seed';

/** What was at the database path before this start opened it. */
export type DatabaseFileState = 'missing' | 'empty' | 'present';

export interface OpenedDatabase {
  dataSource: DataSource;
  /** The file as this start found it. */
  found: DatabaseFileState;
  /** Migrations this start applied, by name. */
  applied: string[];
  /** True when this start loaded the demo lab. */
  seeded: boolean;
}

type DatabaseConfig = Pick<
  Config,
  | 'databasePath'
  | 'databaseUrl'
  | 'databaseInit'
  | 'databaseFullCheck'
  | 'production'
  | 'seedDemo'
  | 'bcryptCost'
> &
  Partial<Pick<Config, 'currency'>>;

const restoreAdvice =
  'Stop here and restore the file from your latest backup (or point DATABASE_PATH at the right file), then start Lotwise again.';

function fileState(databasePath: string): DatabaseFileState {
  if (databaseFileSize(databasePath) === null) return 'missing';
  const stats = statSync(databasePath);
  if (!stats.isFile()) {
    throw new StartupError(
      `The database path ${databasePath} is not a file. Point DATABASE_PATH at the Lotwise database file.`,
    );
  }
  try {
    accessSync(databasePath, constants.R_OK | constants.W_OK);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'an error';
    throw new StartupError(unreachableDatabaseMessage(databasePath, code));
  }
  return stats.size === 0 ? 'empty' : 'present';
}

async function tableNames(dataSource: DataSource): Promise<string[]> {
  if (onPostgres(dataSource)) {
    const tables: { name: string }[] = await dataSource.query(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = current_schema() AND table_type = 'BASE TABLE'",
    );
    return tables.map((row) => row.name);
  }
  const rows: { name: string }[] = await dataSource.query(
    "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'",
  );
  return rows.map((row) => row.name);
}

/**
 * True when the last process using the file did not close it: SQLite removes the write-ahead
 * log when the last connection closes cleanly, so a non-empty one left beside the file means a
 * crash, a kill or a power cut.
 */
function leftUnclosed(databasePath: string): boolean {
  const wal = `${databasePath}-wal`;
  return existsSync(wal) && statSync(wal).size > 0;
}

/**
 * Opens the file and checks it; a damaged file stops start-up. The schema is always read (a
 * file that is no database, or a damaged first page, fails there); SQLite's quick integrity
 * check, which reads the whole file (half a second for a lab of 100,000 containers), runs when
 * the file was not closed cleanly, or on every start with DATABASE_CHECK=full.
 */
async function openChecked(databasePath: string, fullCheck: boolean): Promise<DataSource> {
  const unclosed = leftUnclosed(databasePath);
  const dataSource = createDataSource(databasePath);
  try {
    await dataSource.initialize();
    await dataSource.query('SELECT COUNT(*) FROM sqlite_master');
    if (!fullCheck && !unclosed) return dataSource;
    const rows: { quick_check: string }[] = await dataSource.query('PRAGMA quick_check');
    const problems = rows.map((row) => row.quick_check).filter((line) => line !== 'ok');
    if (problems.length > 0) {
      throw new Error(`the integrity check found: ${problems.slice(0, 5).join('; ')}`);
    }
    return dataSource;
  } catch (error) {
    if (dataSource.isInitialized) await dataSource.destroy().catch(() => undefined);
    const reason = error instanceof Error ? error.message : String(error);
    throw new StartupError(
      `The database file ${databasePath} cannot be used: ${reason}.\n${restoreAdvice}`,
    );
  }
}

/**
 * Opens the database for the server: checks the file (quick_check), refuses a file that is
 * not Lotwise's, applies migrations and loads the demo lab only when the configuration allows
 * it for what was found. Production never seeds, and creates a file only when told to (the
 * missing-file case is refused earlier, in loadConfig, before anything is written).
 */
export async function openDatabase(
  config: DatabaseConfig,
  logger: Logger,
): Promise<OpenedDatabase> {
  if (config.databaseUrl !== null) return openPostgres(config, config.databaseUrl, logger);
  const found = fileState(config.databasePath);
  if (found !== 'present' && !config.databaseInit) {
    throw new StartupError(
      `The database file ${config.databasePath} is missing or empty. ${restoreAdvice}`,
    );
  }
  const dataSource = await openChecked(config.databasePath, config.databaseFullCheck);
  try {
    const tables = await tableNames(dataSource);
    if (tables.length > 0 && !tables.includes('migrations')) {
      throw new StartupError(
        `The file ${config.databasePath} is an SQLite database but not a Lotwise one (it has no migrations table). Point DATABASE_PATH at the Lotwise database file.`,
      );
    }
    if (tables.length === 0 && !config.databaseInit) {
      throw new StartupError(
        `The database file ${config.databasePath} holds no tables. ${restoreAdvice} For a new installation start once with --init (or DATABASE_INIT=true).`,
      );
    }
    const applied = await runMigrationsAnswering(dataSource);
    const seeded = await seedIfAllowed(dataSource, config, found);
    if (!seeded && (await dataSource.query('SELECT id FROM users LIMIT 1')).length === 0) {
      logger.warn(
        `The database ${config.databasePath} has no users yet: create the first admin with npm run user:create -- --email <address> --role admin` +
          (config.production || found === 'missing'
            ? ''
            : ' (or start once with SEED_DEMO=true to fill it with the demo lab)'),
      );
    }
    return { dataSource, found, applied, seeded };
  } catch (error) {
    await dataSource.destroy().catch(() => undefined);
    throw error;
  }
}

/**
 * PostgreSQL: connects, refuses a database that holds tables but is not Lotwise's, applies
 * migrations under an advisory lock (two instances starting at once migrate once) and seeds
 * as for a file: a database without tables counts as a new one. Its integrity is PostgreSQL's
 * own business (checksums, WAL), so there is no file check.
 */
async function openPostgres(
  config: DatabaseConfig,
  url: string,
  logger: Logger,
): Promise<OpenedDatabase> {
  const where = `The PostgreSQL database ${redactedUrl(url)}`;
  const dataSource = createDataSource(url);
  try {
    await dataSource.initialize();
  } catch (error) {
    throw new StartupError(
      `${where} cannot be reached: ${error instanceof Error ? error.message : String(error)}. Check DATABASE_URL and that the server is running.`,
    );
  }
  try {
    const tables = await tableNames(dataSource);
    if (tables.length > 0 && !tables.includes('migrations')) {
      throw new StartupError(
        `${where} holds tables but is not a Lotwise database (it has no migrations table). Point DATABASE_URL at an empty database or at Lotwise's.`,
      );
    }
    if (tables.length === 0 && !config.databaseInit) {
      throw new StartupError(
        `${where} holds no tables. Restore it from your latest backup (or point DATABASE_URL at the right database), or for a new installation start once with --init (or DATABASE_INIT=true).`,
      );
    }
    const found: DatabaseFileState = tables.length === 0 ? 'missing' : 'present';
    const lock = dataSource.createQueryRunner();
    let applied: string[];
    try {
      await lock.query('SELECT pg_advisory_lock($1)', [advisoryLocks.migrations]);
      applied = (await dataSource.runMigrations({ transaction: 'all' })).map((m) => m.name);
    } finally {
      await lock
        .query('SELECT pg_advisory_unlock($1)', [advisoryLocks.migrations])
        .catch(() => undefined);
      await lock.release();
    }
    const seeded = await seedIfAllowed(dataSource, config, found);
    if (!seeded && (await dataSource.query('SELECT id FROM users LIMIT 1')).length === 0) {
      logger.warn(
        `${where} has no users yet: create the first admin with npm run user:create -- --email <address> --role admin`,
      );
    }
    return { dataSource, found, applied, seeded };
  } catch (error) {
    await dataSource.destroy().catch(() => undefined);
    throw error;
  }
}

function seedIfAllowed(
  dataSource: DataSource,
  config: DatabaseConfig,
  found: DatabaseFileState,
): Promise<boolean> {
  if (config.production) return Promise.resolve(false);
  switch (config.seedDemo) {
    case 'never':
      return Promise.resolve(false);
    case 'new-file':
      return found === 'missing'
        ? seedDemo(dataSource, config.bcryptCost, config.currency)
        : Promise.resolve(false);
    case 'empty-database':
      return seedDemo(dataSource, config.bcryptCost, config.currency);
  }
}

/** True when the demo admin exists, so the start-up banner may list the demo accounts. */
export async function hasDemoAccounts(dataSource: DataSource): Promise<boolean> {
  const email = demoAccounts[0]?.email ?? '';
  const sql = withPlaceholders(dataSource, 'SELECT id FROM users WHERE email = ?');
  return (await dataSource.query(sql, [email])).length > 0;
}
