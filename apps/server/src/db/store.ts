import type { DataSource, EntityManager } from 'typeorm';
import { auditRepository } from '../modules/audit/audit.repository';
import { chemicalsRepository } from '../modules/chemicals/chemicals.repository';
import { usersRepository } from '../modules/users/users.repository';

function repositoriesFor(manager: EntityManager) {
  return {
    users: usersRepository(manager),
    audit: auditRepository(manager),
    chemicals: chemicalsRepository(manager),
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

export function createStore(dataSource: DataSource): Store {
  return {
    repos: repositoriesFor(dataSource.manager),
    transaction: (work) => dataSource.transaction((manager) => work(repositoriesFor(manager))),
    async ping() {
      await dataSource.query('SELECT 1');
    },
  };
}
