import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { DataSource } from 'typeorm';
import { createApp, ledgerNotesOf } from '../app';
import { loadConfig, type Config } from '../config';
import { createDataSource } from '../db/data-source';
import { type Store } from '../db/store';
import { openStore } from '../db/repositories';

export interface TestContext {
  dir: string;
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
    LOG_LEVEL: 'silent',
    LOGIN_RATE_LIMIT: '1000',
    LOGIN_RATE_LIMIT_IP: '1000',
    PUBLIC_URL: 'http://lotwise.example.test',
    WEB_DIST: path.join(dir, 'no-web-build'),
    ...env,
  });
}

/** A fresh temporary database with every migration applied, and an app on it. */
export async function openTestContext(): Promise<TestContext> {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-test-'));
  const config = testConfig(dir);
  const dataSource = createDataSource(config.databasePath);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'all' });
  return {
    dir,
    config,
    dataSource,
    store: openStore(dataSource),
    app: createApp({ dataSource, config }),
  };
}

/** Waits until the alert rules ran for every ledger change made so far. */
export async function alertRulesSettled(context: TestContext = testContext()): Promise<void> {
  await ledgerNotesOf(context.app).idle();
}

export async function closeTestContext(context: TestContext) {
  await ledgerNotesOf(context.app).stop();
  if (context.dataSource.isInitialized) await context.dataSource.destroy();
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
