import { parseArgs } from 'node:util';
import type { Config } from '../config';
import { createDataSource } from '../db/data-source';
import { createStore } from '../db/store';
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

/** `npm run alerts:evaluate`: answers the exit code. */
export async function runAlertsEvaluate(argv: string[], config: Config, io: Io): Promise<number> {
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

  const dataSource = createDataSource(config.databasePath);
  await dataSource.initialize();
  try {
    await dataSource.runMigrations({ transaction: 'all' });
    const store = createStore(dataSource);
    const result = await alertsService(store, config).evaluateNow();
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
        const sent = await outboxWorker({
          store,
          transport,
          config,
          logger: createLogger(config.logLevel),
        }).drain();
        io.out(
          `Sent: ${sent.sent}; to retry later: ${sent.retrying}; given up (resend from the outbox page): ${sent.failed}`,
        );
      } finally {
        transport.close();
      }
    }
    return 0;
  } finally {
    await dataSource.destroy();
  }
}
