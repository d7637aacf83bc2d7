import path from 'node:path';
import { StartupError, loadConfig } from './config';
import { startDevMail, type DevMailServer } from './modules/alerts/dev-mail';
import { startServer } from './server';

let devMail: DevMailServer | null = null;
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
  const server = await startServer(config);
  if (devMail)
    console.log(`Development mail inbox (every e-mail Lotwise sends): ${devMail.inboxUrl}`);
  const stop = () => {
    void server.close().then(() => {
      devMail?.stop();
      process.exit(0);
    });
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
} catch (error) {
  console.error(error instanceof StartupError ? error.message : error);
  devMail?.stop();
  process.exit(1);
}
