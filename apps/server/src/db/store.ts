import { AsyncLocalStorage } from 'node:async_hooks';
import { type DataSource, type EntityManager } from 'typeorm';
import type { Repositories } from './repositories';
import { isTransactionConflict, onPostgres } from './postgres';
import { readConnection } from './read-connection';

export type { Repositories } from './repositories';

/** How the store builds each module's repository on a connection or a transaction. */
export type RepositoryFactories = {
  [K in keyof Repositories]: (manager: EntityManager) => Repositories[K];
};

/** What services get: repositories, and a way to run several writes in one transaction. */
export interface Store {
  /**
   * Repositories for work outside a transaction. On SQLite, reads go to a read-only
   * connection of their own, so they never wait behind a write; a method that writes waits its
   * turn in the write queue (or joins the open transaction). On PostgreSQL each call takes a
   * pool connection (or joins the open transaction).
   */
  repos: Repositories;
  /**
   * Runs `work` in one transaction; called inside an open one, it joins it. On SQLite
   * transactions take turns; on PostgreSQL they run side by side (READ COMMITTED), protect
   * their invariants with row locks, and run again when rolled back by a deadlock.
   */
  transaction<T>(work: (repos: Repositories) => Promise<T>): Promise<T>;
  /** Throws when the database does not answer a read of the users table. */
  ping(): Promise<void>;
  /**
   * Marks `job` as being worked on by this process until the returned release is called or
   * the process ends (on PostgreSQL a session advisory lock on a connection of its own, which
   * the database drops with a dead process's connection). Nothing to do on SQLite, where one
   * process owns the file. Null when another process holds it already.
   */
  holdJob(job: JobKey): Promise<(() => Promise<void>) | null>;
  /** False while another process holds `job` (see holdJob); always true on SQLite. */
  jobIsFree(job: JobKey): Promise<boolean>;
  /**
   * Runs `listener` at the end of every transaction of this store that appended ledger
   * entries, before it commits, with the chemicals concerned: what it writes commits or
   * rolls back together with the entries (the alert rules note the chemicals this way).
   */
  onLedgerChange(listener: LedgerChangeListener): void;
  /** Runs `listener` after such a transaction committed (not when it rolled back). */
  afterLedgerCommit(listener: (chemicalIds: number[]) => void): void;
}

/** A job that one process works on at a time: its kind's advisory lock and its row id. */
export interface JobKey {
  kind: number;
  id: number;
}

export type LedgerChangeListener = (repos: Repositories, chemicalIds: number[]) => Promise<void>;

/** The chemicals whose ledger changed, per open transaction (keyed by its repositories). */
const ledgerChanges = new WeakMap<Repositories, Set<number>>();

/** Notes that a ledger entry of `chemicalId` was appended in the transaction of `repos`. */
export function noteLedgerChange(repos: Repositories, chemicalId: number) {
  ledgerChanges.get(repos)?.add(chemicalId);
}

/**
 * The tail of the write queue per database. better-sqlite3 has one connection and TypeORM one
 * query runner for it, so anything that runs on it while a transaction awaits would land inside
 * that transaction: two transactions would share one BEGIN…COMMIT, and a lone write made during
 * a long import would be rolled back with it. Every transaction and every write outside one
 * therefore waits its turn; code already inside a transaction runs at once, in it. Reads
 * outside a transaction do not queue: they run on the read-only connection.
 */
const queues = new WeakMap<DataSource, Promise<unknown>>();
const openTransaction = new AsyncLocalStorage<Repositories>();

function serialized<T>(dataSource: DataSource, work: () => Promise<T>): Promise<T> {
  // PostgreSQL gives each transaction a pool connection of its own: nothing to queue for.
  if (onPostgres(dataSource)) return work();
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const run = previous.then(work, work);
  queues.set(
    dataSource,
    run.catch(() => undefined),
  );
  return run;
}

/**
 * Repository methods that write, by name. Everything else is a read and runs on the read-only
 * connection; a read-named method that writes all the same fails there before it changed
 * anything (SQLITE_READONLY) and runs again in the write queue.
 */
export const writingMethod =
  /^(insert|update|delete|save|replace|set|claim|renew|finish|release|end|create|mark|append|record|remove|add|touch|note|clear|take|drain|defer)/;

/** True for SQLite's "this connection may not write" answer. */
export function isReadOnlyRefusal(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && code.startsWith('SQLITE_READONLY')) return true;
    e = (e as { driverError?: unknown }).driverError;
  }
  return false;
}

type AnyMethod = (...args: unknown[]) => Promise<unknown>;

function buildRepositories(factories: RepositoryFactories, manager: EntityManager): Repositories {
  const built = {} as Record<string, unknown>;
  for (const [name, factory] of Object.entries(factories)) {
    built[name] = (factory as (m: EntityManager) => unknown)(manager);
  }
  return built as Repositories;
}

/**
 * Repositories for calls made outside a transaction: inside an open transaction a call joins
 * it; a write waits its turn in the queue; a read runs on the read-only connection when there
 * is one (a file database), else in the queue.
 */
function routedRepositories(dataSource: DataSource, factories: RepositoryFactories): Repositories {
  const onWriter = buildRepositories(factories, dataSource.manager);
  if (onPostgres(dataSource)) return joiningRepositories(onWriter);
  let onReader: Promise<Repositories | null> | null = null;
  const reader = () =>
    (onReader ??= readConnection(dataSource).then((connection) =>
      connection ? buildRepositories(factories, connection.manager) : null,
    ));
  const routed = {} as Record<string, Record<string, AnyMethod>>;
  for (const [name, repository] of Object.entries(onWriter) as [
    string,
    Record<string, unknown>,
  ][]) {
    routed[name] = {};
    for (const [key, method] of Object.entries(repository)) {
      if (typeof method !== 'function') continue;
      const onWriterCall = (args: unknown[]) => () => (method as AnyMethod).apply(repository, args);
      routed[name][key] = async (...args: unknown[]) => {
        const open = openTransaction.getStore();
        if (open) {
          const inTransaction = (open as unknown as Record<string, Record<string, AnyMethod>>)[
            name
          ]![key]!;
          return inTransaction(...args);
        }
        if (writingMethod.test(key)) return serialized(dataSource, onWriterCall(args));
        const readers = await reader();
        if (!readers) return serialized(dataSource, onWriterCall(args));
        const readRepository = (readers as unknown as Record<string, Record<string, AnyMethod>>)[
          name
        ]!;
        try {
          return await readRepository[key]!(...args);
        } catch (error) {
          if (!isReadOnlyRefusal(error)) throw error;
          return serialized(dataSource, onWriterCall(args));
        }
      };
    }
  }
  return routed as unknown as Repositories;
}

/**
 * PostgreSQL: every call outside a transaction runs on a pool connection of its own; inside an
 * open transaction it joins it.
 */
function joiningRepositories(onPool: Repositories): Repositories {
  const joined = {} as Record<string, Record<string, AnyMethod>>;
  for (const [name, repository] of Object.entries(onPool) as [string, Record<string, unknown>][]) {
    joined[name] = {};
    for (const [key, method] of Object.entries(repository)) {
      if (typeof method !== 'function') continue;
      joined[name][key] = (...args: unknown[]) => {
        const open = openTransaction.getStore() as unknown as
          Record<string, Record<string, AnyMethod>> | undefined;
        return open ? open[name]![key]!(...args) : (method as AnyMethod).apply(repository, args);
      };
    }
  }
  return joined as unknown as Repositories;
}

/**
 * How often a PostgreSQL transaction that was rolled back because it ran into another one
 * (deadlock, serialization failure) runs again: it changed nothing, and the other one has
 * finished or holds what it waited for.
 */
export const conflictRetries = 4;

async function retryOnConflict<T>(dataSource: DataSource, attempt: () => Promise<T>): Promise<T> {
  if (!onPostgres(dataSource)) return attempt();
  for (let tries = 1; ; tries++) {
    try {
      return await attempt();
    } catch (error) {
      if (tries > conflictRetries || !isTransactionConflict(error)) throw error;
      await new Promise((resolve) => setTimeout(resolve, Math.random() * 20 * tries));
    }
  }
}

export function createStore(dataSource: DataSource, factories: RepositoryFactories): Store {
  const listeners: LedgerChangeListener[] = [];
  const committed: ((chemicalIds: number[]) => void)[] = [];
  const transaction = <T>(work: (repos: Repositories) => Promise<T>): Promise<T> => {
    // a transaction opened inside another one joins it instead of waiting for itself
    const open = openTransaction.getStore();
    if (open) return work(open);
    const changed = new Set<number>();
    const done = serialized(dataSource, () =>
      retryOnConflict(dataSource, () => {
        changed.clear();
        return dataSource.transaction(async (manager) => {
          const repos = buildRepositories(factories, manager);
          ledgerChanges.set(repos, changed);
          const result = await openTransaction.run(repos, () => work(repos));
          if (changed.size > 0) {
            for (const listener of listeners) {
              await openTransaction.run(repos, () => listener(repos, [...changed]));
            }
          }
          return result;
        });
      }),
    );
    return done.then((result) => {
      if (changed.size > 0) for (const listener of committed) listener([...changed]);
      return result;
    });
  };
  const repos = routedRepositories(dataSource, factories);
  return {
    repos,
    transaction,
    onLedgerChange(listener) {
      listeners.push(listener);
    },
    afterLedgerCommit(listener) {
      committed.push(listener);
    },
    async holdJob(job) {
      if (!onPostgres(dataSource)) return async () => undefined;
      const runner = dataSource.createQueryRunner();
      await runner.connect();
      let held = false;
      try {
        const [row] = (await runner.query('SELECT pg_try_advisory_lock($1, $2) AS held', [
          job.kind,
          job.id,
        ])) as { held: boolean }[];
        held = row?.held === true;
      } finally {
        if (!held) await runner.release();
      }
      if (!held) return null;
      return async () => {
        try {
          await runner.query('SELECT pg_advisory_unlock($1, $2)', [job.kind, job.id]);
        } finally {
          await runner.release();
        }
      };
    },
    async jobIsFree(job) {
      if (!onPostgres(dataSource)) return true;
      const runner = dataSource.createQueryRunner();
      await runner.connect();
      try {
        const [row] = (await runner.query('SELECT pg_try_advisory_lock($1, $2) AS free', [
          job.kind,
          job.id,
        ])) as { free: boolean }[];
        if (row?.free) await runner.query('SELECT pg_advisory_unlock($1, $2)', [job.kind, job.id]);
        return row?.free === true;
      } finally {
        await runner.release();
      }
    },
    async ping() {
      // A real table, so a database that lost its tables (or was swapped) does not look healthy.
      // On the read connection when there is one: a long import does not make the server look down.
      const sql = 'SELECT id FROM users LIMIT 1';
      if (onPostgres(dataSource)) {
        await dataSource.query(sql);
        return;
      }
      const reader = await readConnection(dataSource);
      if (reader) await reader.query(sql);
      else await serialized(dataSource, () => dataSource.query(sql));
    },
  };
}
