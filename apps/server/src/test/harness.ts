import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { randomBytes } from 'node:crypto';
import { DataSource } from 'typeorm';
import { createApp, ledgerNotesOf } from '../app';
import { loadConfig, type Config } from '../config';
import { createDataSource } from '../db/data-source';
import { type Store } from '../db/store';
import { redactedUrl } from '../db/postgres';
import { openStore } from '../db/repositories';
import { withPlaceholders } from '../db/sql';

/**
 * The admin URL of a PostgreSQL server to run the tests on (`npm run test:postgres`); unset,
 * they run on SQLite files. Each test file then gets a database of its own, dropped at the end.
 */
export const testPostgresUrl = process.env.LOTWISE_TEST_POSTGRES_URL || null;

/** True when this run's tests use PostgreSQL: `describe.skipIf(onPostgres)` for SQLite-only ones. */
export const onPostgres = testPostgresUrl !== null;

export interface TestContext {
  dir: string;
  /** The PostgreSQL database of this context (dropped on close), or null on SQLite. */
  postgresDatabase?: string | null;
  config: Config;
  dataSource: DataSource;
  store: Store;
  app: Express;
}

let current: TestContext | null = null;

/** Configuration for tests: a temporary folder, cheap bcrypt, quiet logs. */
export function testConfig(dir: string, env: NodeJS.ProcessEnv = {}): Config {
  return loadConfig({
    DATABASE_PATH: path.join(dir, 'lotwise.sqlite'),
    BCRYPT_COST: '4',
    LOG_LEVEL: process.env.LOTWISE_TEST_LOG_LEVEL ?? 'silent',
    LOGIN_RATE_LIMIT: '1000',
    LOGIN_RATE_LIMIT_IP: '1000',
    PUBLIC_URL: 'http://lotwise.example.test',
    WEB_DIST: path.join(dir, 'no-web-build'),
    ...env,
  });
}

async function onAdminDatabase<T>(work: (admin: DataSource) => Promise<T>): Promise<T> {
  const admin = new DataSource({ type: 'postgres', url: testPostgresUrl!, poolSize: 1 });
  try {
    await admin.initialize();
  } catch (error) {
    throw new Error(
      `The PostgreSQL server of LOTWISE_TEST_POSTGRES_URL (${redactedUrl(testPostgresUrl!)}) cannot be reached: ${String(error)}. Start a throwaway one with scripts/test-postgres.sh start.`,
      { cause: error },
    );
  }
  try {
    return await work(admin);
  } finally {
    await admin.destroy();
  }
}

/** A new, empty PostgreSQL database on the test server; answers its name and URL. */
export async function createTestPostgresDatabase(): Promise<{ name: string; url: string }> {
  const name = `lotwise_test_${process.pid}_${randomBytes(4).toString('hex')}`;
  await onAdminDatabase((admin) => admin.query(`CREATE DATABASE "${name}"`));
  const url = new URL(testPostgresUrl!);
  url.pathname = `/${name}`;
  return { name, url: url.toString() };
}

/** Drops a database made by createTestPostgresDatabase, closing what still uses it. */
export async function dropTestPostgresDatabase(name: string): Promise<void> {
  await onAdminDatabase((admin) => admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`));
}

/** A fresh temporary database with every migration applied, and an app on it. */
export async function openTestContext(): Promise<TestContext> {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-test-'));
  const postgres = testPostgresUrl ? await createTestPostgresDatabase() : null;
  const config = testConfig(dir, postgres ? { DATABASE_URL: postgres.url } : {});
  const dataSource = createDataSource(config.databaseUrl ?? config.databasePath);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'all' });
  if (postgres) acceptQuestionMarks(dataSource);
  return {
    dir,
    postgresDatabase: postgres?.name ?? null,
    config,
    dataSource,
    store: openStore(dataSource),
    app: createApp({ dataSource, config }),
  };
}

/**
 * Tests set up and inspect rows with raw SQL written with `?` placeholders; on PostgreSQL the
 * test context's DataSource numbers them. Only raw `dataSource.query` calls are affected: the
 * app itself goes through the query builder.
 */
function acceptQuestionMarks(dataSource: DataSource) {
  const query = dataSource.query.bind(dataSource);
  dataSource.query = ((sql: string, parameters?: unknown[], queryRunner?: never) =>
    query(withPlaceholders(dataSource, sql), parameters, queryRunner)) as typeof dataSource.query;
}

/** Waits until the alert rules ran for every ledger change made so far. */
export async function alertRulesSettled(context: TestContext = testContext()): Promise<void> {
  await ledgerNotesOf(context.app).idle();
}

export async function closeTestContext(context: TestContext) {
  await ledgerNotesOf(context.app).stop();
  if (context.dataSource.isInitialized) await context.dataSource.destroy();
  if (context.postgresDatabase) await dropTestPostgresDatabase(context.postgresDatabase);
  rmSync(context.dir, { recursive: true, force: true });
}

/** The context the setup file opened for the running test file. */
export function testContext(): TestContext {
  if (!current) throw new Error('The test database is not open (is src/test/setup.ts loaded?)');
  return current;
}

export function setTestContext(context: TestContext | null) {
  current = context;
}
