import { DataSource } from 'typeorm';
import { bindNumbersAsParameters } from './bound-parameters';
import { tuneConnection } from './data-source';

/**
 * A read-only connection per database file, opened beside the writing one. SQLite in WAL mode
 * lets it read the last committed state while the writer is inside a long transaction (an
 * import, a run with many draws), so reads outside a transaction never queue behind writes.
 * better-sqlite3 runs each statement synchronously: one reader is enough in one process.
 */
const readers = new WeakMap<DataSource, Promise<DataSource | null>>();

function fileOf(dataSource: DataSource): string | null {
  const options = dataSource.options as { type: string; database?: unknown };
  if (options.type !== 'better-sqlite3') return null;
  const file = typeof options.database === 'string' ? options.database : '';
  return file === '' || file === ':memory:' ? null : file;
}

async function open(dataSource: DataSource): Promise<DataSource | null> {
  const file = fileOf(dataSource);
  if (!file || !dataSource.isInitialized) return null;
  const reader = new DataSource({
    ...(dataSource.options as object),
    type: 'better-sqlite3',
    database: file,
    readonly: true,
    fileMustExist: true,
    enableWAL: false,
    migrations: [],
    migrationsRun: false,
    synchronize: false,
    prepareDatabase: (db: { pragma(sql: string): unknown }) => {
      db.pragma('busy_timeout = 5000');
      tuneConnection(db);
    },
  } as ConstructorParameters<typeof DataSource>[0]);
  bindNumbersAsParameters(reader);
  await reader.initialize();
  // The writer's destroy closes its reader too (tests, restarts, shutdown).
  const destroy = dataSource.destroy.bind(dataSource);
  dataSource.destroy = async () => {
    readers.delete(dataSource);
    if (reader.isInitialized) await reader.destroy();
    await destroy();
  };
  return reader;
}

/**
 * The read-only connection of `dataSource`'s file, opened on first use; null for an in-memory
 * database or another driver (reads then share the writer's connection and queue).
 */
export function readConnection(dataSource: DataSource): Promise<DataSource | null> {
  let reader = readers.get(dataSource);
  if (!reader) {
    reader = open(dataSource).catch(() => null);
    readers.set(dataSource, reader);
  }
  return reader;
}
