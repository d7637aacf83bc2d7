import { parseArgs } from 'node:util';
import { formatDecimal } from '@lotwise/shared';
import type { Config } from '../config';
import { createDataSource } from '../db/data-source';
import { isDatabaseBusy, retryWhenBusy } from '../db/busy-retry';
import { openStore } from '../db/repositories';
import { createLogger } from '../lib/logger';
import { alertsService } from '../modules/alerts/alerts.service';
import { createMailTransport } from '../modules/alerts/mail-transport';
import { outboxWorker } from '../modules/alerts/outbox-worker';

export interface Io {
  out(line: string): void;
  err(line: string): void;
}

const usage = `Usage: npm run alerts:evaluate [-- --send]

Runs every alert rule once and queues the e-mails in the outbox (the same as the scheduler
and the admin's "evaluate now"). With --send, also sends what is due in the outbox once.`;

/** How the command waits for a database the server is writing to (tests shorten it). */
export interface BusyOptions {
  /** SQLite's own wait for the lock per statement. */
  busyTimeoutMs?: number;
  /** Waits before each further attempt when the database stayed busy. */
  retryDelaysMs?: readonly number[];
}

function busyMessage(databasePath: string): string {
  return `The database ${databasePath} stayed busy (another process kept it locked); nothing was changed. Try again in a minute.`;
}

/**
 * `npm run alerts:evaluate`: answers the exit code. When the running server holds the
 * database's write lock, each step is tried again a few times with growing waits instead
 * of failing at once.
 */
export async function runAlertsEvaluate(
  argv: string[],
  config: Config,
  io: Io,
  { busyTimeoutMs, retryDelaysMs }: BusyOptions = {},
): Promise<number> {
  let send: boolean;
  try {
    const { values } = parseArgs({
      args: argv,
      options: { send: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } },
      strict: true,
    });
    if (values.help) {
      io.out(usage);
      return 0;
    }
    send = values.send ?? false;
  } catch (error) {
    io.err(`${error instanceof Error ? error.message : String(error)}\n\n${usage}`);
    return 1;
  }

  const whenBusy = <T>(work: () => Promise<T>) =>
    retryWhenBusy(work, {
      delaysMs: retryDelaysMs,
      onRetry: (attempt, waitMs) =>
        io.err(
          `The database is busy (the server is writing); trying again in ${formatDecimal(waitMs / 1000, 1)} s (attempt ${attempt + 1}).`,
        ),
    });
  const dataSource = createDataSource(config.databaseUrl ?? config.databasePath, { busyTimeoutMs });
  try {
    await dataSource.initialize();
    await whenBusy(() => dataSource.runMigrations({ transaction: 'all' }));
    const store = openStore(dataSource);
    const result = await whenBusy(() => alertsService(store, config).evaluateNow());
    io.out(
      `Conditions found: ${result.conditions}; e-mails queued: ${result.queued}; already sent within the window: ${result.duplicates}`,
    );
    if (send) {
      const transport = createMailTransport(config.mail.smtp);
      if (!transport) {
        io.err('No mail server is configured (SMTP_URL or SMTP_HOST): nothing was sent.');
        return 1;
      }
      try {
        const worker = outboxWorker({
          store,
          transport,
          config,
          logger: createLogger(config.logLevel),
        });
        // A claimed message carries a lease, so running again never sends it twice.
        const sent = await whenBusy(() => worker.drain());
        io.out(
          `Sent: ${sent.sent}; to retry later: ${sent.retrying}; given up (resend from the outbox page): ${sent.failed}`,
        );
      } finally {
        transport.close();
      }
    }
    return 0;
  } catch (error) {
    if (!isDatabaseBusy(error)) throw error;
    io.err(busyMessage(config.databasePath));
    return 1;
  } finally {
    if (dataSource.isInitialized) await dataSource.destroy();
  }
}
