import type { EntityManager } from 'typeorm';
import { alertsRepository } from '../modules/alerts/alerts.repository';
import { ledgerNotesRepository } from '../modules/alerts/ledger-notes.repository';
import { scheduledRunsRepository } from '../modules/alerts/scheduled-runs.repository';
import { auditRepository } from '../modules/audit/audit.repository';
import { chemicalsRepository } from '../modules/chemicals/chemicals.repository';
import { containersRepository } from '../modules/containers/containers.repository';
import { importsRepository } from '../modules/imports/imports.repository';
import { labAreasRepository } from '../modules/lab-areas/lab-areas.repository';
import { locationsRepository } from '../modules/locations/locations.repository';
import { lotsRepository } from '../modules/lots/lots.repository';
import { metricsRepository } from '../modules/metrics/metrics.repository';
import { ordersRepository } from '../modules/orders/orders.repository';
import { paymentsRepository } from '../modules/payments/payments.repository';
import { plansRepository } from '../modules/plans/plans.repository';
import { proceduresRepository } from '../modules/procedures/procedures.repository';
import { receivingRepository } from '../modules/receiving/receiving.repository';
import { reorderRepository } from '../modules/reorder/reorder.repository';
import { requestsRepository } from '../modules/requests/requests.repository';
import { ruleSetsRepository } from '../modules/rule-sets/rule-sets.repository';
import { runTimelineRepository } from '../modules/run-timeline/run-timeline.repository';
import { runsRepository } from '../modules/runs/runs.repository';
import { segregationRepository } from '../modules/segregation/segregation.repository';
import { stockRepository } from '../modules/stock/stock.repository';
import { suppliersRepository } from '../modules/suppliers/suppliers.repository';
import { todayRepository } from '../modules/today/today.repository';
import { usersRepository } from '../modules/users/users.repository';
import { wasteRepository } from '../modules/waste/waste.repository';
import { createStore, type Store } from './store';
import type { DataSource } from 'typeorm';

/**
 * Every module's repository, by the name services reach it under (`repos.containers`). This is
 * the one place that knows them all: the store itself is generic and imports no module, so a
 * module may use the store without an import circle through the others.
 */
export const repositoryFactories = {
  users: usersRepository,
  audit: auditRepository,
  chemicals: chemicalsRepository,
  locations: locationsRepository,
  lots: lotsRepository,
  containers: containersRepository,
  segregation: segregationRepository,
  stock: stockRepository,
  imports: importsRepository,
  procedures: proceduresRepository,
  plans: plansRepository,
  runs: runsRepository,
  runTimeline: runTimelineRepository,
  alerts: alertsRepository,
  ledgerNotes: ledgerNotesRepository,
  scheduledRuns: scheduledRunsRepository,
  orders: ordersRepository,
  payments: paymentsRepository,
  suppliers: suppliersRepository,
  reorder: reorderRepository,
  requests: requestsRepository,
  receiving: receivingRepository,
  metrics: metricsRepository,
  today: todayRepository,
  ruleSets: ruleSetsRepository,
  labAreas: labAreasRepository,
  waste: wasteRepository,
} satisfies Record<string, (manager: EntityManager) => object>;

export type Repositories = {
  [K in keyof typeof repositoryFactories]: ReturnType<(typeof repositoryFactories)[K]>;
};

/** The store of the Lotwise database behind `dataSource`, with every module's repository. */
export function openStore(dataSource: DataSource): Store {
  return createStore(dataSource, repositoryFactories);
}
