import 'reflect-metadata';
import { chmodSync, existsSync } from 'node:fs';
import path from 'node:path';
import { DataSource } from 'typeorm';
import { repoRoot } from '../config';
import { bindNumbersAsParameters } from './bound-parameters';
import { isPostgresUrl, lotwiseTypes } from './postgres';
import { AlertPreferenceEntity } from '../modules/alerts/alert-preference.entity';
import { LedgerChangeNoteEntity } from '../modules/alerts/ledger-change-note.entity';
import { ScheduledRunEntity } from '../modules/alerts/scheduled-run.entity';
import { OutboxMessageEntity } from '../modules/alerts/outbox-message.entity';
import { AuditEventEntity } from '../modules/audit/audit-event.entity';
import { ChemicalEntity } from '../modules/chemicals/chemical.entity';
import { ContainerEntity } from '../modules/containers/container.entity';
import { LedgerEntryEntity } from '../modules/containers/ledger-entry.entity';
import { LocationEntity } from '../modules/locations/location.entity';
import { LabAreaEntity } from '../modules/lab-areas/lab-area.entity';
import { RuleSetEntity } from '../modules/rule-sets/rule-set.entity';
import { LotEntity } from '../modules/lots/lot.entity';
import { PlanEntity } from '../modules/plans/plan.entity';
import { ReservationEntity } from '../modules/plans/reservation.entity';
import { ProcedureLineEntity } from '../modules/procedures/procedure-line.entity';
import { ProcedureEntity } from '../modules/procedures/procedure.entity';
import { RunInputEntity } from '../modules/runs/run-input.entity';
import { RunProductEntity } from '../modules/runs/run-product.entity';
import { RunEntity } from '../modules/runs/run.entity';
import { RunPhotoEntity } from '../modules/run-timeline/run-photo.entity';
import { RunTimelineEntryEntity } from '../modules/run-timeline/run-timeline-entry.entity';
import { ImportEntity } from '../modules/imports/import.entity';
import { StocktakeEntity } from '../modules/stock/stocktake.entity';
import { UserEntity } from '../modules/users/user.entity';
import { SupplierEntity } from '../modules/suppliers/supplier.entity';
import { CatalogItemEntity } from '../modules/suppliers/catalog-item.entity';
import { PurchaseRequestEntity } from '../modules/requests/purchase-request.entity';
import { OrderEntity } from '../modules/orders/order.entity';
import { OrderLineEntity } from '../modules/orders/order-line.entity';
import { OrderShareEntity } from '../modules/orders/order-share.entity';
import { PaymentEntity } from '../modules/payments/payment.entity';
import { PaymentEventEntity } from '../modules/payments/payment-event.entity';
import { Initial1796160000000 } from './migrations/1796160000000-initial';
import { Stock1796250000000 } from './migrations/1796250000000-stock';
import { Preparations1796500000000 } from './migrations/1796500000000-preparations';
import { ImportsAndFiles1796340000000 } from './migrations/1796340000000-imports-and-files';
import { Alerts1796420000000 } from './migrations/1796420000000-alerts';
import { ExactQuantities1796600000000 } from './migrations/1796600000000-exact-quantities';
import { SessionVersion1796650000000 } from './migrations/1796650000000-session-version';
import { OutboxLeases1796660000000 } from './migrations/1796660000000-outbox-leases';
import { Purchasing1796700000000 } from './migrations/1796700000000-purchasing';
import { ImportKinds1796730000000 } from './migrations/1796730000000-import-kinds';
import { ListIndexes1796800000000 } from './migrations/1796800000000-list-indexes';
import { LedgerChangeNotes1796810000000 } from './migrations/1796810000000-ledger-change-notes';
import { OutboxQueuedAge1796900000000 } from './migrations/1796900000000-outbox-queued-age';
import { ScheduledRuns1796910000000 } from './migrations/1796910000000-scheduled-runs';
import { ProcedureSteps1796950000000 } from './migrations/1796950000000-procedure-steps';
import { RunTimeline1796960000000 } from './migrations/1796960000000-run-timeline';
import { ChemicalFireData1796970000000 } from './migrations/1796970000000-chemical-fire-data';
import { LabAreas1796980000000 } from './migrations/1796980000000-lab-areas';
import { ChemicalMeasures1796630000000 } from './migrations/1796630000000-chemical-measures';
import { Waste1797000000000 } from './migrations/1797000000000-waste';
import { wasteEntities } from '../modules/waste/waste.entity';
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
  SupplierEntity,
  CatalogItemEntity,
  PurchaseRequestEntity,
  OrderEntity,
  OrderLineEntity,
  OrderShareEntity,
  PaymentEntity,
  PaymentEventEntity,
  LedgerChangeNoteEntity,
  ScheduledRunEntity,
  RunPhotoEntity,
  RunTimelineEntryEntity,
  RuleSetEntity,
  LabAreaEntity,
  ...wasteEntities,
];

/** In order; listed by hand so tsx, vitest and the TypeORM CLI all load the same classes. */
export const migrations = [
  Initial1796160000000,
  Stock1796250000000,
  ImportsAndFiles1796340000000,
  Alerts1796420000000,
  Preparations1796500000000,
  ExactQuantities1796600000000,
  RunCrudeYieldFlag1796620000000,
  ChemicalMeasures1796630000000,
  SessionVersion1796650000000,
  OutboxLeases1796660000000,
  Purchasing1796700000000,
  ImportKinds1796730000000,
  ListIndexes1796800000000,
  LedgerChangeNotes1796810000000,
  OutboxQueuedAge1796900000000,
  ScheduledRuns1796910000000,
  ProcedureSteps1796950000000,
  RunTimeline1796960000000,
  ChemicalFireData1796970000000,
  LabAreas1796980000000,
  Waste1797000000000,
];

/** How many prepared statements each connection keeps (the API has a few hundred queries). */
export const statementCacheSize = 1000;

/**
 * Page cache and memory-mapped reads of a connection. SQLite's default cache (2 MB) holds a
 * sliver of a lab with years of history, so a read of the few hundred containers on a shelf,
 * scattered over the file, went back to the operating system page by page (10 ms instead of
 * 1 ms). Both are upper bounds: a small database uses what it needs.
 */
export function tuneConnection(db: { pragma(sql: string): unknown }) {
  db.pragma('cache_size = -65536'); // 64 MiB
  db.pragma('mmap_size = 268435456'); // 256 MiB
}

/** The database file and the WAL and shared-memory files SQLite keeps beside it. */
export function databaseFiles(databasePath: string): string[] {
  return [databasePath, `${databasePath}-wal`, `${databasePath}-shm`];
}

/**
 * Makes the database and its WAL/SHM files readable by this user only (0600). Called right
 * after SQLite opened the file and before WAL mode creates the other two, which SQLite then
 * creates with the database file's mode; files left by an older version are tightened too.
 */
function restrictDatabaseFiles(databasePath: string) {
  if (databasePath === ':memory:' || databasePath === '') return;
  for (const file of databaseFiles(databasePath)) {
    if (existsSync(file)) chmodSync(file, 0o600);
  }
}

/** Connections each app instance keeps open to PostgreSQL. */
export const postgresPoolSize = 10;

/**
 * A DataSource (not yet initialized) on `location`: a `postgres://` URL (DATABASE_URL) or the
 * path of an SQLite file. Never `synchronize`: the schema only changes through migrations.
 */
export function createDataSource(
  location: string,
  options: { busyTimeoutMs?: number } = {},
): DataSource {
  return isPostgresUrl(location)
    ? createPostgresDataSource(location)
    : createSqliteDataSource(location, options);
}

/**
 * PostgreSQL: a pool of connections on which transactions run side by side; what SQLite's
 * single writer guaranteed, row locks guarantee here (docs/decisions.md). bigint and numeric
 * values come back as exact numbers (db/postgres.ts).
 */
function createPostgresDataSource(url: string): DataSource {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    poolSize: postgresPoolSize,
    applicationName: 'lotwise',
    extra: { types: lotwiseTypes },
  });
}

/**
 * SQLite: WAL journal, foreign keys enforced, files mode 0600.
 */
function createSqliteDataSource(
  databasePath: string,
  /** How long a statement waits for another connection's write lock before SQLITE_BUSY. */
  { busyTimeoutMs = 5000 }: { busyTimeoutMs?: number } = {},
): DataSource {
  const dataSource = new DataSource({
    type: 'better-sqlite3',
    database: databasePath,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    enableWAL: true,
    prepareDatabase: (db: { pragma(sql: string): unknown }) => {
      restrictDatabaseFiles(databasePath);
      db.pragma('journal_mode = WAL');
      db.pragma('foreign_keys = ON');
      db.pragma(`busy_timeout = ${Math.max(0, Math.round(busyTimeoutMs))}`);
      tuneConnection(db);
    },
    // Prepared statements are kept by their SQL text; numbers are bound, not written into it.
    statementCacheSize: statementCacheSize,
  });
  bindNumbersAsParameters(dataSource);
  return dataSource;
}

/** For the TypeORM CLI (`npm run migration:run -w apps/server`): DATABASE_URL, else the file. */
export default createDataSource(
  process.env.DATABASE_URL ||
    path.resolve(repoRoot, process.env.DATABASE_PATH || 'data/lotwise.sqlite'),
);
