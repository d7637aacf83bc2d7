import { AsyncLocalStorage } from 'node:async_hooks';
import type { DataSource, EntityManager } from 'typeorm';
import { alertsRepository } from '../modules/alerts/alerts.repository';
import { auditRepository } from '../modules/audit/audit.repository';
import { chemicalsRepository } from '../modules/chemicals/chemicals.repository';
import { importsRepository } from '../modules/imports/imports.repository';
import { containersRepository } from '../modules/containers/containers.repository';
import { locationsRepository } from '../modules/locations/locations.repository';
import { lotsRepository } from '../modules/lots/lots.repository';
import { ordersRepository } from '../modules/orders/orders.repository';
import { paymentsRepository } from '../modules/payments/payments.repository';
import { plansRepository } from '../modules/plans/plans.repository';
import { reorderRepository } from '../modules/reorder/reorder.repository';
import { requestsRepository } from '../modules/requests/requests.repository';
import { receivingRepository } from '../modules/receiving/receiving.repository';
import { proceduresRepository } from '../modules/procedures/procedures.repository';
import { runsRepository } from '../modules/runs/runs.repository';
import { segregationRepository } from '../modules/segregation/segregation.repository';
import { stockRepository } from '../modules/stock/stock.repository';
import { suppliersRepository } from '../modules/suppliers/suppliers.repository';
import { usersRepository } from '../modules/users/users.repository';

function repositoriesFor(manager: EntityManager) {
  return {
    users: usersRepository(manager),
    audit: auditRepository(manager),
    chemicals: chemicalsRepository(manager),
    locations: locationsRepository(manager),
    lots: lotsRepository(manager),
    containers: containersRepository(manager),
    segregation: segregationRepository(manager),
    stock: stockRepository(manager),
    imports: importsRepository(manager),
    procedures: proceduresRepository(manager),
    plans: plansRepository(manager),
    runs: runsRepository(manager),
    alerts: alertsRepository(manager),
    orders: ordersRepository(manager),
    payments: paymentsRepository(manager),
    suppliers: suppliersRepository(manager),
    reorder: reorderRepository(manager),
    requests: requestsRepository(manager),
    receiving: receivingRepository(manager),
  };
}
export type Repositories = ReturnType<typeof repositoriesFor>;

/** What services get: repositories, and a way to run several writes in one transaction. */
export interface Store {
  repos: Repositories;
  transaction<T>(work: (repos: Repositories) => Promise<T>): Promise<T>;
  /** Throws when the database does not answer a read of the users table. */
  ping(): Promise<void>;
  /**
   * Runs `listener` at the end of every transaction of this store that appended ledger
   * entries, before it commits, with the chemicals concerned: what it writes commits or
   * rolls back together with the entries (the alert rules queue their e-mails this way).
   */
  onLedgerChange(listener: LedgerChangeListener): void;
}

export type LedgerChangeListener = (repos: Repositories, chemicalIds: number[]) => Promise<void>;

/** The chemicals whose ledger changed, per open transaction (keyed by its repositories). */
const ledgerChanges = new WeakMap<Repositories, Set<number>>();

/** Notes that a ledger entry of `chemicalId` was appended in the transaction of `repos`. */
export function noteLedgerChange(repos: Repositories, chemicalId: number) {
  ledgerChanges.get(repos)?.add(chemicalId);
}

/**
 * The tail of the queue per database. better-sqlite3 has one connection and TypeORM one query
 * runner for it, so anything that runs while a transaction awaits would land inside that
 * transaction: two transactions would share one BEGIN…COMMIT, and a lone write made during a
 * long import would be rolled back with it. Every transaction and every call on `store.repos`
 * therefore waits its turn; code already inside a transaction runs at once, in it.
 */
const queues = new WeakMap<DataSource, Promise<unknown>>();
const openTransaction = new AsyncLocalStorage<Repositories>();

function serialized<T>(dataSource: DataSource, work: () => Promise<T>): Promise<T> {
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const run = previous.then(work, work);
  queues.set(
    dataSource,
    run.catch(() => undefined),
  );
  return run;
}

type AsyncMethods<R> = {
  [K in keyof R]: R[K] extends (...args: infer _A) => Promise<unknown> ? R[K] : never;
};

/** Repositories whose every call waits its turn in the queue (or joins the open transaction). */
function queuedRepositories(dataSource: DataSource): Repositories {
  const direct = repositoriesFor(dataSource.manager);
  const queued = {} as Record<string, Record<string, unknown>>;
  for (const [name, repository] of Object.entries(direct)) {
    // every repository method answers a promise, so each can wait in the queue
    const methods: AsyncMethods<typeof repository> = repository;
    queued[name] = Object.fromEntries(
      Object.entries(methods).map(([key, method]) => [
        key,
        (...args: unknown[]) => {
          const call = () =>
            (method as (...a: unknown[]) => Promise<unknown>).apply(repository, args);
          return openTransaction.getStore() ? call() : serialized(dataSource, call);
        },
      ]),
    );
  }
  return queued as unknown as Repositories;
}

export function createStore(dataSource: DataSource): Store {
  const listeners: LedgerChangeListener[] = [];
  const transaction = <T>(work: (repos: Repositories) => Promise<T>): Promise<T> => {
    // a transaction opened inside another one joins it instead of waiting for itself
    const open = openTransaction.getStore();
    if (open) return work(open);
    return serialized(dataSource, () =>
      dataSource.transaction(async (manager) => {
        const repos = repositoriesFor(manager);
        const changed = new Set<number>();
        ledgerChanges.set(repos, changed);
        const result = await openTransaction.run(repos, () => work(repos));
        if (changed.size > 0) {
          for (const listener of listeners) {
            await openTransaction.run(repos, () => listener(repos, [...changed]));
          }
        }
        return result;
      }),
    );
  };
  return {
    repos: queuedRepositories(dataSource),
    transaction,
    onLedgerChange(listener) {
      listeners.push(listener);
    },
    async ping() {
      // A real table, so a database that lost its tables (or was swapped) does not look healthy.
      await serialized(dataSource, () => dataSource.query('SELECT id FROM users LIMIT 1'));
    },
  };
}
