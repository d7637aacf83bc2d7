import 'reflect-metadata';
import path from 'node:path';
import { DataSource } from 'typeorm';
import { repoRoot } from '../config';
import { AlertPreferenceEntity } from '../modules/alerts/alert-preference.entity';
import { OutboxMessageEntity } from '../modules/alerts/outbox-message.entity';
import { AuditEventEntity } from '../modules/audit/audit-event.entity';
import { ChemicalEntity } from '../modules/chemicals/chemical.entity';
import { ContainerEntity } from '../modules/containers/container.entity';
import { LedgerEntryEntity } from '../modules/containers/ledger-entry.entity';
import { LocationEntity } from '../modules/locations/location.entity';
import { LotEntity } from '../modules/lots/lot.entity';
import { PlanEntity } from '../modules/plans/plan.entity';
import { ReservationEntity } from '../modules/plans/reservation.entity';
import { ProcedureLineEntity } from '../modules/procedures/procedure-line.entity';
import { ProcedureEntity } from '../modules/procedures/procedure.entity';
import { RunInputEntity } from '../modules/runs/run-input.entity';
import { RunProductEntity } from '../modules/runs/run-product.entity';
import { RunEntity } from '../modules/runs/run.entity';
import { ImportEntity } from '../modules/imports/import.entity';
import { StocktakeEntity } from '../modules/stock/stocktake.entity';
import { UserEntity } from '../modules/users/user.entity';
import { Initial1796160000000 } from './migrations/1796160000000-initial';
import { Stock1796250000000 } from './migrations/1796250000000-stock';
import { Preparations1796500000000 } from './migrations/1796500000000-preparations';
import { ImportsAndFiles1796340000000 } from './migrations/1796340000000-imports-and-files';
import { Alerts1796420000000 } from './migrations/1796420000000-alerts';
import { RunCrudeYieldFlag1796620000000 } from './migrations/1796620000000-run-crude-yield-flag';

export const entities = [
  UserEntity,
  AuditEventEntity,
  ChemicalEntity,
  LocationEntity,
  LotEntity,
  ContainerEntity,
  LedgerEntryEntity,
  StocktakeEntity,
  ProcedureEntity,
  ProcedureLineEntity,
  PlanEntity,
  ReservationEntity,
  RunEntity,
  RunInputEntity,
  RunProductEntity,
  OutboxMessageEntity,
  AlertPreferenceEntity,
  ImportEntity,
];

/** In order; listed by hand so tsx, vitest and the TypeORM CLI all load the same classes. */
export const migrations = [
  Initial1796160000000,
  Stock1796250000000,
  ImportsAndFiles1796340000000,
  Alerts1796420000000,
  Preparations1796500000000,
  RunCrudeYieldFlag1796620000000,
];

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
