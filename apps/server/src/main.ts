import path from 'node:path';
import { StartupError, loadConfig } from './config';
import { startDevMail, type DevMailServer } from './modules/alerts/dev-mail';
import {
  startDevPayments,
  webhookEndpoint,
  type DevPaymentsServer,
} from './modules/payments/dev-payments';

let devMail: DevMailServer | null = null;
let devPayments: DevPaymentsServer | null = null;
try {
  // `--init` lets a production start create a new, empty database (like DATABASE_INIT=true).
  const config = loadConfig(
    process.argv.includes('--init') ? { ...process.env, DATABASE_INIT: 'true' } : process.env,
  );
  // Without a real SMTP server, a local fake one with a web inbox catches every e-mail.
  if (config.mail.smtp.kind === 'dev') {
    devMail = startDevMail({
      port: config.mail.smtp.port,
      webPort: config.mail.smtp.webPort,
      dataDir: path.dirname(config.databasePath),
    });
  }
  // Without real payment keys, a local payments fake takes the card payments (development only).
  if (config.payments?.startFake) {
    devPayments = await startDevPayments(
      config.payments,
      webhookEndpoint(config.host, config.port),
    );
  }
  // The server's code (the app, TypeORM, every module) loads while the inbox starts up in its
  // own process; the demo seed queues e-mails at once, so nothing is sent before it answers.
  const { startServer } = await import('./server');
  await devMail?.ready;
  const server = await startServer(config);
  if (devMail)
    console.log(`Development mail inbox (every e-mail Lotwise sends): ${devMail.inboxUrl}`);
  if (devPayments)
    console.log(`Local payments fake (test cards, no real money): ${devPayments.url}`);
  const stop = () => {
    void server
      .close()
      .then(() => devPayments?.stop())
      .then(() => {
        devMail?.stop();
        process.exit(0);
      });
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
} catch (error) {
  console.error(error instanceof StartupError ? error.message : error);
  devMail?.stop();
  await devPayments?.stop();
  process.exit(1);
}
