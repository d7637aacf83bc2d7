import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp, ledgerNotesOf } from './app';
import type { Config } from './config';
import { hasDemoAccounts, openDatabase } from './db/database-file';
import { startOptimizing } from './db/optimize';
import { openStore } from './db/repositories';
import { seedDemoOrders } from './db/seed/demo-orders';
import { demoAccounts, demoPassword } from './db/seed/demo-seed';
import { createLogger } from './lib/logger';
import { alertScheduler } from './modules/alerts/alerts-scheduler';
import { alertsService } from './modules/alerts/alerts.service';
import { createMailTransport } from './modules/alerts/mail-transport';
import { outboxWorker, type OutboxWorker } from './modules/alerts/outbox-worker';
import { backupScheduler } from './modules/backups/backup-scheduler';

export interface RunningServer {
  url: string;
  close(): Promise<void>;
}

/**
 * Opens, checks and migrates the database, seeds the demo lab when allowed (see
 * db/database-file.ts), and listens. A StartupError says why the database cannot be used.
 */
export async function startServer(config: Config): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  const { dataSource, applied, seeded } = await openDatabase(config, logger);
  if (applied.length) logger.info(`Applied migrations: ${applied.join(', ')}`);
  if (seeded) {
    await seedDemoOrders(dataSource, config, logger);
    logger.info('Seeded the demo lab');
  }

  let worker: OutboxWorker | null = null;
  const app = createApp({ dataSource, config, logger, onMailQueued: () => worker?.kick() });
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
  );
  scheduler.start();
  const ledgerNotes = ledgerNotesOf(app);
  ledgerNotes.start();
  // Scheduled backups of the SQLite file (BACKUP_INTERVAL_HOURS; 0 turns them off).
  const backups =
    dataSource.options.type === 'better-sqlite3' ? backupScheduler({ config, logger }) : null;
  backups?.start();
  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(config.port, config.host, () => resolve(listening));
    listening.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host === '0.0.0.0' ? 'localhost' : config.host}:${port}`;

  console.log(`Lotwise is running at ${url}`);
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
      optimizer.stop();
      await backups?.stop();
      await scheduler.stop();
      await ledgerNotes.stop();
      await worker?.stop();
      transport?.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await dataSource.destroy();
    },
  };
}
