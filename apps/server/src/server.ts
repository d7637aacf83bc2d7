import { createServer, type RequestListener, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { DataSource } from 'typeorm';
import { createApp, ledgerNotesOf, metricsOf, readinessOf } from './app';
import { latestBackup } from './modules/backups/backup-folder';
import type { Config } from './config';
import { hasDemoAccounts, openDatabase } from './db/database-file';
import { startOptimizing } from './db/optimize';
import { openStore } from './db/repositories';
import { seedDemoOrders } from './db/seed/demo-orders';
import { demoAccounts, demoPassword } from './db/seed/demo-seed';
import { createLogger } from './lib/logger';
import { outsideRequest } from './lib/request-context';
import { alertScheduler } from './modules/alerts/alerts-scheduler';
import { alertsService } from './modules/alerts/alerts.service';
import { createMailTransport } from './modules/alerts/mail-transport';
import { outboxWorker, type OutboxWorker } from './modules/alerts/outbox-worker';
import { startingApp } from './modules/health/starting-app';
import { backupScheduler } from './modules/backups/backup-scheduler';

export interface RunningServer {
  url: string;
  close(): Promise<void>;
}

export interface StartOptions {
  /** Called once the server listens, while it still checks and migrates the database. */
  onListening?(url: string): void;
}

function closeServer(server: Server): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    server.closeIdleConnections();
  });
}

/**
 * Listens at once, answering only the health checks (503 `starting` for readiness) while it
 * opens, checks and migrates the database and seeds the demo lab when allowed (see
 * db/database-file.ts); then the app takes over. A StartupError says why the database cannot
 * be used; the server stops listening before it is thrown.
 */
export async function startServer(
  config: Config,
  options: StartOptions = {},
): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  let handler: RequestListener = startingApp(logger, config.logLevel);
  const server: Server = createServer((req, res) => handler(req, res));
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.port, config.host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host === '0.0.0.0' ? 'localhost' : config.host}:${port}`;
  options.onListening?.(url);

  let dataSource: DataSource;
  try {
    const opened = await openDatabase(config, logger);
    dataSource = opened.dataSource;
    if (opened.applied.length) logger.info(`Applied migrations: ${opened.applied.join(', ')}`);
    if (opened.seeded) {
      await seedDemoOrders(dataSource, config, logger).catch(async (error: unknown) => {
        await dataSource.destroy();
        throw error;
      });
      logger.info('Seeded the demo lab');
    }
  } catch (error) {
    await closeServer(server);
    throw error;
  }

  let worker: OutboxWorker | null = null;
  const app = createApp({
    dataSource,
    config,
    logger,
    onMailQueued: () => outsideRequest(() => worker?.kick()),
  });
  // Alerts: a scheduler evaluates the rules, a worker sends what the outbox holds.
  const transport = createMailTransport(config.mail.smtp);
  const store = openStore(dataSource);
  const optimizer = startOptimizing(dataSource, store, logger);
  if (transport && config.alerts.outboxIntervalSeconds > 0) {
    worker = outboxWorker({ store, transport, config, logger });
    worker.start();
  } else {
    logger.warn('No mail server is configured: alert e-mails stay queued in the outbox');
  }
  const scheduler = alertScheduler(
    alertsService(store, config, { onQueued: () => worker?.kick() }),
    config.alerts.intervalSeconds,
    logger,
    store.repos.scheduledRuns,
  );
  scheduler.start();
  const ledgerNotes = ledgerNotesOf(app);
  ledgerNotes.start();
  // Scheduled backups of the SQLite file (BACKUP_INTERVAL_HOURS; 0 turns them off).
  const backups =
    dataSource.options.type === 'better-sqlite3' ? backupScheduler({ config, logger }) : null;
  backups?.start();
  if (backups) metricsOf(app).setLatestBackupProvider(() => latestBackup(config));
  handler = app;

  // a person reads development's console; production's stdout is JSON lines for a collector
  if (config.production) logger.info(`Lotwise is running at ${url}`, { url });
  else console.log(`Lotwise is running at ${url}`);
  if (config.production && (await hasDemoAccounts(dataSource))) {
    logger.warn(
      `This database holds the demo accounts, whose password "${demoPassword}" is published: deactivate them or change their passwords.`,
    );
  } else if (await hasDemoAccounts(dataSource)) {
    console.log(`Demo sign-in accounts (password "${demoPassword}" unless changed):`);
    for (const account of demoAccounts) {
      console.log(`  ${account.role.padEnd(8)} ${account.email}`);
    }
  }

  return {
    url,
    async close() {
      readinessOf(app).accepting = false;
      optimizer.stop();
      await backups?.stop();
      await scheduler.stop();
      await ledgerNotes.stop();
      await worker?.stop();
      transport?.close();
      await closeServer(server);
      await dataSource.destroy();
    },
  };
}
