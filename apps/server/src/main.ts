import path from 'node:path';
import { ConfigError, loadConfig } from './config';
import { startDevMail, type DevMailServer } from './modules/alerts/dev-mail';
import { startServer } from './server';

let devMail: DevMailServer | null = null;
try {
  const config = loadConfig();
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
  console.error(error instanceof ConfigError ? error.message : error);
  devMail?.stop();
  process.exit(1);
}
