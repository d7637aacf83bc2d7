import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import { openStore } from './db/repositories';
import { errorMiddleware, notFoundMiddleware } from './lib/error-middleware';
import { createLogger, type Logger } from './lib/logger';
import { outsideRequest, requestContext } from './lib/request-context';
import { requestLogger } from './lib/request-log';
import { mountRoutes, type ApiRoute } from './lib/route-table';
import { sameOriginWrites } from './lib/same-origin';
import { fileStore } from './lib/uploads';
import { compressAnswers, serveWebApp } from './lib/web-app';
import { alertRoutes } from './modules/alerts/alerts.routes';
import { alertsService } from './modules/alerts/alerts.service';
import {
  ledgerNotesWorker,
  noteLedgerChanges,
  type LedgerNotesWorker,
} from './modules/alerts/ledger-notes-worker';
import { auditRoutes } from './modules/audit/audit.routes';
import { auditService } from './modules/audit/audit.service';
import { backupRoutes } from './modules/backups/backups.routes';
import { backupsService } from './modules/backups/backups.service';
import { authRoutes } from './modules/auth/auth.routes';
import { authService } from './modules/auth/auth.service';
import { sessions } from './modules/auth/session';
import { chemicalRoutes } from './modules/chemicals/chemicals.routes';
import { chemicalsService } from './modules/chemicals/chemicals.service';
import { containerRoutes } from './modules/containers/containers.routes';
import { containersService } from './modules/containers/containers.service';
import { exportRoutes } from './modules/exports/exports.routes';
import { exportsService } from './modules/exports/exports.service';
import { databaseFileCheck } from './modules/health/database-file-check';
import { healthRoutes, type Readiness } from './modules/health/health.routes';
import { importRoutes } from './modules/imports/imports.routes';
import { importsService } from './modules/imports/imports.service';
import { inspectionRoutes } from './modules/inspection/inspection.routes';
import { inspectionService } from './modules/inspection/inspection.service';
import { labAreaRoutes } from './modules/lab-areas/lab-areas.routes';
import { labAreasService } from './modules/lab-areas/lab-areas.service';
import { locationRoutes } from './modules/locations/locations.routes';
import { locationsService } from './modules/locations/locations.service';
import { lotRoutes } from './modules/lots/lots.routes';
import { lotsService } from './modules/lots/lots.service';
import { maintenanceRoutes } from './modules/maintenance/maintenance.routes';
import { createMetrics, type Metrics } from './modules/metrics/metrics';
import { metricsRoutes } from './modules/metrics/metrics.routes';
import { openApiRoutes } from './modules/openapi/openapi.routes';
import { paymentRoutes, paymentWebhookPath } from './modules/payments/payments.routes';
import { paymentsService } from './modules/payments/payments.service';
import { claimingStatuses } from './modules/orders/order-lifecycle';
import { orderRoutes } from './modules/orders/orders.routes';
import { ordersService, type OrderCancellation } from './modules/orders/orders.service';
import { planRoutes } from './modules/plans/plans.routes';
import { plansService } from './modules/plans/plans.service';
import { reorderRoutes } from './modules/reorder/reorder.routes';
import { reorderService } from './modules/reorder/reorder.service';
import { requestRoutes } from './modules/requests/requests.routes';
import { requestsService } from './modules/requests/requests.service';
import { procedureRoutes } from './modules/procedures/procedures.routes';
import { proceduresService } from './modules/procedures/procedures.service';
import { purchaseRoutes } from './modules/receiving/purchases.routes';
import { purchasesService } from './modules/receiving/purchases.service';
import { receivingRoutes } from './modules/receiving/receiving.routes';
import { receivingService } from './modules/receiving/receiving.service';
import { ruleSetRoutes } from './modules/rule-sets/rule-sets.routes';
import { ruleSetsService } from './modules/rule-sets/rule-sets.service';
import { runPhotosService } from './modules/run-timeline/run-photos.service';
import { runTimelineRoutes } from './modules/run-timeline/run-timeline.routes';
import { runTimelineService } from './modules/run-timeline/run-timeline.service';
import { runRoutes } from './modules/runs/runs.routes';
import { runsService } from './modules/runs/runs.service';
import { segregationRoutes } from './modules/segregation/segregation.routes';
import { settingsRoutes } from './modules/settings/settings.routes';
import { stockRoutes } from './modules/stock/stock.routes';
import { stockService } from './modules/stock/stock.service';
import { supplierRoutes } from './modules/suppliers/suppliers.routes';
import { suppliersService } from './modules/suppliers/suppliers.service';
import { todayRoutes } from './modules/today/today.routes';
import { todayService } from './modules/today/today.service';
import { uploadRoutes } from './modules/uploads/uploads.routes';
import { uploadsService } from './modules/uploads/uploads.service';
import { userCacheOf } from './modules/users/user-cache';
import { userRoutes } from './modules/users/users.routes';
import { wasteRoutes } from './modules/waste/waste.routes';
import { wasteAlertMessages } from './modules/waste/waste-alerts';
import { wasteService } from './modules/waste/waste.service';
import { usersService } from './modules/users/users.service';
import { watchListRoutes } from './modules/watch-lists/watch-lists.routes';
import { watchListsService } from './modules/watch-lists/watch-lists.service';

export interface AppOptions {
  dataSource: DataSource;
  config: Config;
  logger?: Logger;
  /** Called when e-mails were queued (the server's outbox worker sends them promptly). */
  onMailQueued?: () => void;
  /** Refunds the paid shares of a cancelled order (the payments module). */
  orderCancellation?: OrderCancellation;
}

const routeTableKey = 'lotwiseRoutes';
const ledgerNotesKey = 'lotwiseLedgerNotes';
const metricsKey = 'lotwiseMetrics';
const readinessKey = 'lotwiseReadiness';

/** The route table the app was built from (the permission walk test reads it). */
export function routeTable(app: Express): ApiRoute[] {
  return app.locals[routeTableKey] as ApiRoute[];
}

/** The worker that runs the alert rules after ledger changes (the server starts and stops it). */
export function ledgerNotesOf(app: Express): LedgerNotesWorker {
  return app.locals[ledgerNotesKey] as LedgerNotesWorker;
}

/** The app's Prometheus metrics (the server gives it the backups' provider). */
export function metricsOf(app: Express): Metrics {
  return app.locals[metricsKey] as Metrics;
}

/** Whether the app takes work (the server sets `accepting` to false when it begins to stop). */
export function readinessOf(app: Express): Readiness {
  return app.locals[readinessKey] as Readiness;
}

/** Builds the Express app on an initialized, migrated DataSource; does not listen. */
export function createApp({
  dataSource,
  config,
  logger = createLogger(config.logLevel),
  onMailQueued,
  orderCancellation,
}: AppOptions) {
  const app = express();
  app.disable('x-powered-by');
  const store = openStore(dataSource);
  const metrics = createMetrics(store);
  const readiness: Readiness = { accepting: true };
  app.locals[metricsKey] = metrics;
  app.locals[readinessKey] = readiness;
  // First, so every answer is logged (with its request id) and timed, even one helmet ends.
  app.use(requestLogger(logger, config.logLevel));
  app.use(requestContext());
  app.use(metrics.middleware);
  // Behind a reverse proxy, req.ip (and so the sign-in limits) comes from X-Forwarded-For.
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      // Over plain HTTP (localhost, a lab's LAN) upgrading requests would break the page.
      contentSecurityPolicy: {
        directives: { upgradeInsecureRequests: config.cookieSecure ? [] : null },
      },
      strictTransportSecurity: config.cookieSecure,
    }),
  );
  app.use(compressAnswers([paymentWebhookPath]));
  // The payment provider's webhooks are verified over their exact bytes: the raw body is kept
  // (express.json below then leaves it alone), and no browser sends them.
  app.use(paymentWebhookPath, express.raw({ type: 'application/json', limit: '1mb' }));
  const sameOrigin = sameOriginWrites(config.publicUrl);
  app.use((req, res, next) =>
    req.path === paymentWebhookPath ? next() : sameOrigin(req, res, next),
  );
  // API answers carry people's data and sessions: no browser or proxy cache keeps them.
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use(express.json({ limit: '1mb' }));
  app.use(cookieParser());

  const session = sessions(config, store.repos.users, userCacheOf(dataSource));
  const files = fileStore({
    dir: config.uploadDir,
    maxBytes: config.uploadMaxBytes,
    maxMb: config.uploadMaxMb,
  });
  const alerts = alertsService(store, config, {
    onQueued: onMailQueued,
    claims: {
      // Members hear about the chemicals they claimed in a shared order as about those they use.
      claimedChemicals: (userIds) => store.repos.orders.claimedChemicals(userIds, claimingStatuses),
    },
    extraMessages: wasteAlertMessages,
  });
  // A transaction that changed the ledger notes the chemicals before it commits; the alert
  // rules run for them after the commit, outside the write.
  store.onLedgerChange(noteLedgerChanges);
  const ledgerNotes = ledgerNotesWorker({ store, alerts, logger });
  store.afterLedgerCommit(() => outsideRequest(() => ledgerNotes.kick()));
  app.locals[ledgerNotesKey] = ledgerNotes;
  // Card payments; the orders module calls payments.refundPaidShares when an order is cancelled.
  const payments = paymentsService(store, config, { alerts, logger });
  const waste = wasteService(store, { alerts });
  const routes: ApiRoute[] = [
    ...healthRoutes(store, logger, readiness, databaseFileCheck(dataSource)),
    ...settingsRoutes(config),
    ...metricsRoutes(metrics, session.resolve, config.trustProxy),
    ...authRoutes(authService(store, config), session, config),
    ...userRoutes(usersService(store, config), session),
    ...auditRoutes(auditService(store)),
    ...chemicalRoutes(chemicalsService(store, files)),
    ...watchListRoutes(watchListsService(store)),
    ...locationRoutes(locationsService(store)),
    ...ruleSetRoutes(ruleSetsService(store)),
    ...labAreaRoutes(labAreasService(store)),
    ...inspectionRoutes(inspectionService(store)),
    ...lotRoutes(lotsService(store, files)),
    ...containerRoutes(containersService(store), waste),
    ...wasteRoutes(waste),
    ...stockRoutes(stockService(store)),
    ...segregationRoutes(store),
    ...maintenanceRoutes(store),
    ...procedureRoutes(proceduresService(store), runsService(store, files)),
    ...planRoutes(plansService(store, config.text)),
    ...runRoutes(runsService(store, files)),
    ...runTimelineRoutes(runTimelineService(store), runPhotosService(store, files), files),
    ...importRoutes(importsService(store, logger, config.text, config.currency), files),
    ...exportRoutes(exportsService(store)),
    ...uploadRoutes(uploadsService(store, files), files),
    ...alertRoutes(alerts),
    ...paymentRoutes(payments),
    ...supplierRoutes(suppliersService(store, config.currency)),
    // Before the orders routes: `/api/orders/money.csv` must not be read as an order id.
    ...purchaseRoutes(purchasesService(store, config)),
    ...orderRoutes(
      ordersService(store, config, { alerts, cancellation: orderCancellation ?? payments }),
    ),
    ...reorderRoutes(reorderService(store, config)),
    ...requestRoutes(requestsService(store, config)),
    ...receivingRoutes(receivingService(store, alerts, config)),
    ...backupRoutes(backupsService(store, config)),
    ...todayRoutes(todayService(store, config, { alerts })),
    ...openApiRoutes(() => routes),
  ];
  mountRoutes(app, routes, session.resolve);
  app.locals[routeTableKey] = routes;

  app.use('/api', notFoundMiddleware);
  serveWebApp(app, config.webDist);
  app.use(notFoundMiddleware);
  app.use(errorMiddleware(logger));
  return app;
}
