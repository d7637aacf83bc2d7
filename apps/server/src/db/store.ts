import type { DataSource, EntityManager } from 'typeorm';
import { auditRepository } from '../modules/audit/audit.repository';
import { chemicalsRepository } from '../modules/chemicals/chemicals.repository';
import { containersRepository } from '../modules/containers/containers.repository';
import { locationsRepository } from '../modules/locations/locations.repository';
import { lotsRepository } from '../modules/lots/lots.repository';
import { segregationRepository } from '../modules/segregation/segregation.repository';
import { stockRepository } from '../modules/stock/stock.repository';
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
  };
}
export type Repositories = ReturnType<typeof repositoriesFor>;

/** What services get: repositories, and a way to run several writes in one transaction. */
export interface Store {
  repos: Repositories;
  transaction<T>(work: (repos: Repositories) => Promise<T>): Promise<T>;
  /** Throws when the database does not answer. */
  ping(): Promise<void>;
}

/**
 * The tail of the transaction queue per database. better-sqlite3 has one connection and
 * TypeORM one query runner for it, so two transactions whose awaits interleave would share
 * one BEGIN…COMMIT. Queuing them makes each read-check-write (e.g. a draw) run alone.
 */
const queues = new WeakMap<DataSource, Promise<unknown>>();

function serialized<T>(dataSource: DataSource, work: () => Promise<T>): Promise<T> {
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const run = previous.then(work, work);
  queues.set(
    dataSource,
    run.catch(() => undefined),
  );
  return run;
}

export function createStore(dataSource: DataSource): Store {
  return {
    repos: repositoriesFor(dataSource.manager),
    transaction: (work) =>
      serialized(dataSource, () =>
        dataSource.transaction((manager) => work(repositoriesFor(manager))),
      ),
    async ping() {
      await dataSource.query('SELECT 1');
    },
  };
}
