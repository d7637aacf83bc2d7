import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import type { Config } from './config';
import { createDataSource } from './db/data-source';
import { createStore } from './db/store';
import { demoAccounts, demoPassword, seedDemo } from './db/seed/demo-seed';
import { createLogger } from './lib/logger';

export interface RunningServer {
  url: string;
  close(): Promise<void>;
}

/** Opens and migrates the database, seeds the demo lab when allowed, and listens. */
export async function startServer(config: Config): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  const dataSource = createDataSource(config.databasePath);
  await dataSource.initialize();
  const applied = await dataSource.runMigrations({ transaction: 'all' });
  if (applied.length) logger.info(`Applied migrations: ${applied.map((m) => m.name).join(', ')}`);

  const seeded = config.seedDemo ? await seedDemo(dataSource, config.bcryptCost) : false;
  if (seeded) logger.info('Seeded the demo lab');

  const app = createApp({ dataSource, config, logger });
  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(config.port, config.host, () => resolve(listening));
    listening.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host === '0.0.0.0' ? 'localhost' : config.host}:${port}`;

  console.log(`Lotwise is running at ${url}`);
  if (config.seedDemo) {
    const demoAdmin = await createStore(dataSource).repos.users.findByEmail(
      demoAccounts[0]?.email ?? '',
    );
    if (demoAdmin) {
      console.log(`Demo sign-in accounts (password "${demoPassword}" unless changed):`);
      for (const account of demoAccounts) {
        console.log(`  ${account.role.padEnd(8)} ${account.email}`);
      }
    }
  }

  return {
    url,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await dataSource.destroy();
    },
  };
}
