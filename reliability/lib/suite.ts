import { afterAll } from 'vitest';
import { createDatabase, dropServerDatabases, freshDatabase, removeDatabases } from './database';
import { LotwiseServer } from './launcher';

/**
 * A test file's database and the server it starts on it; after the file the server is
 * stopped and the temporary folders are removed.
 */
export function serverForThisFile(name: string) {
  const database = freshDatabase(name);
  let server: LotwiseServer | null = null;
  afterAll(async () => {
    await server?.stop();
    removeDatabases();
    await dropServerDatabases();
  });
  return {
    database,
    /** Starts the server (suite defaults, then `env`) and waits for its health route. */
    async start(env: Record<string, string> = {}): Promise<LotwiseServer> {
      await createDatabase(database);
      server = await LotwiseServer.start({ name, database, env });
      return server;
    },
  };
}
