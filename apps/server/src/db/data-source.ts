import 'reflect-metadata';
import path from 'node:path';
import { DataSource } from 'typeorm';
import { repoRoot } from '../config';
import { AuditEventEntity } from '../modules/audit/audit-event.entity';
import { ChemicalEntity } from '../modules/chemicals/chemical.entity';
import { ContainerEntity } from '../modules/containers/container.entity';
import { LedgerEntryEntity } from '../modules/containers/ledger-entry.entity';
import { LocationEntity } from '../modules/locations/location.entity';
import { LotEntity } from '../modules/lots/lot.entity';
import { StocktakeEntity } from '../modules/stock/stocktake.entity';
import { UserEntity } from '../modules/users/user.entity';
import { Initial1796160000000 } from './migrations/1796160000000-initial';
import { Stock1796250000000 } from './migrations/1796250000000-stock';

export const entities = [
  UserEntity,
  AuditEventEntity,
  ChemicalEntity,
  LocationEntity,
  LotEntity,
  ContainerEntity,
  LedgerEntryEntity,
  StocktakeEntity,
];

/** In order; listed by hand so tsx, vitest and the TypeORM CLI all load the same classes. */
export const migrations = [Initial1796160000000, Stock1796250000000];

/**
 * A DataSource on the SQLite file at `databasePath` (not yet initialized): WAL journal,
 * foreign keys enforced, never `synchronize` — the schema only changes through migrations.
 */
export function createDataSource(databasePath: string): DataSource {
  return new DataSource({
    type: 'better-sqlite3',
    database: databasePath,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    enableWAL: true,
    prepareDatabase: (db: { pragma(sql: string): unknown }) => {
      db.pragma('journal_mode = WAL');
      db.pragma('foreign_keys = ON');
      db.pragma('busy_timeout = 5000');
    },
  });
}

/** For the TypeORM CLI (`npm run migration:run -w apps/server`). */
export default createDataSource(
  path.resolve(repoRoot, process.env.DATABASE_PATH || 'data/lotwise.sqlite'),
);
