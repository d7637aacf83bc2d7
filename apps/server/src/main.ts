import { ConfigError, loadConfig } from './config';
import { startServer } from './server';

try {
  const server = await startServer(loadConfig());
  const stop = () => {
    void server.close().then(() => process.exit(0));
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
} catch (error) {
  console.error(error instanceof ConfigError ? error.message : error);
  process.exit(1);
}
