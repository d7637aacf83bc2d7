import type { RequestHandler } from 'express';
import { Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';
import type { Store } from '../../db/store';
import { routeLabel } from '../../lib/request-log';
import { version } from '../../version';
import type { OutboxDepth, PendingLedgerNotes } from './metrics.repository';

/** When the newest backup was taken; null when there is none yet. */
export type LatestBackupProvider = () => Promise<Date | null> | Date | null;

export interface Metrics {
  /** Times every answer by route pattern, method and status class. */
  middleware: RequestHandler;
  /** Prometheus text for one scrape (the gauges read the database now). */
  scrape(): Promise<{ contentType: string; text: string }>;
  /**
   * The hook for the backups module: `lotwise_backup_age_seconds` asks `provider` on each
   * scrape. Without a provider the gauge reads NaN (unknown); with one that finds no backup,
   * +Inf, so an alert on the age fires for a lab that never took one.
   */
  setLatestBackupProvider(provider: LatestBackupProvider | null): void;
}

let processRegistry: Registry | null = null;

/**
 * The process's own metrics (CPU, memory, event loop lag, GC, handles), collected once per
 * process: a test file builds several apps, and each collector holds timers of its own.
 */
function processMetrics(): Registry {
  if (!processRegistry) {
    processRegistry = new Registry();
    collectDefaultMetrics({ register: processRegistry });
  }
  return processRegistry;
}

/** A read a gauge awaits later: its failure fails the scrape, never the process. */
function settledLater<T>(read: Promise<T>): Promise<T> {
  read.catch(() => undefined);
  return read;
}

const secondsSince = (iso: string | null, now: number) =>
  iso === null ? 0 : Math.max(0, (now - Date.parse(iso)) / 1000);

/** The server's Prometheus metrics (see docs/monitoring.md for each one's meaning). */
export function createMetrics(store: Store): Metrics {
  const registry = new Registry();
  let latestBackup: LatestBackupProvider | null = null;
  // One read of each kind per scrape, shared by the gauges that report it.
  let reads: { outbox: Promise<OutboxDepth>; notes: Promise<PendingLedgerNotes> } | null = null;
  const current = () =>
    (reads ??= {
      outbox: settledLater(store.repos.metrics.outboxDepth()),
      notes: settledLater(store.repos.metrics.pendingLedgerNotes()),
    });

  const requestDuration = new Histogram({
    name: 'lotwise_http_request_duration_seconds',
    help: 'Time from request to the end of the answer, by route pattern, method and status class',
    labelNames: ['method', 'route', 'status_class'] as const,
    buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
    registers: [registry],
  });

  new Gauge({
    name: 'lotwise_build_info',
    help: 'Always 1; the version label names the running Lotwise',
    labelNames: ['version'] as const,
    registers: [registry],
  }).set({ version }, 1);
  new Gauge({
    name: 'lotwise_outbox_messages',
    help: 'E-mails in the outbox by status: queued (waiting), sending (taken by a sender), failed (given up)',
    labelNames: ['status'] as const,
    registers: [registry],
    async collect() {
      const { counts } = await current().outbox;
      for (const status of ['queued', 'sending', 'failed'] as const) {
        this.set({ status }, counts[status] ?? 0);
      }
    },
  });
  new Gauge({
    name: 'lotwise_outbox_oldest_queued_age_seconds',
    help: 'Age of the oldest e-mail still queued in the outbox (0 when none is queued)',
    registers: [registry],
    async collect() {
      const { oldestQueuedAt } = await current().outbox;
      this.set(secondsSince(oldestQueuedAt, Date.now()));
    },
  });
  new Gauge({
    name: 'lotwise_alert_notes_pending',
    help: 'Ledger changes the alert rules have not run for yet',
    registers: [registry],
    async collect() {
      this.set((await current().notes).count);
    },
  });
  new Gauge({
    name: 'lotwise_alert_lag_seconds',
    help: 'Age of the oldest ledger change the alert rules have not run for yet (0 when none waits)',
    registers: [registry],
    async collect() {
      const { oldestNotedAt } = await current().notes;
      this.set(secondsSince(oldestNotedAt, Date.now()));
    },
  });
  new Gauge({
    name: 'lotwise_backup_age_seconds',
    help: 'Age of the newest backup (+Inf when there is none, NaN when backups are not set up)',
    registers: [registry],
    async collect() {
      if (!latestBackup) return this.set(Number.NaN);
      const at = await latestBackup();
      this.set(at === null ? Number.POSITIVE_INFINITY : secondsSince(at.toISOString(), Date.now()));
    },
  });

  return {
    middleware(req, res, next) {
      const started = process.hrtime.bigint();
      res.once('finish', () => {
        const seconds = Number(process.hrtime.bigint() - started) / 1e9;
        requestDuration.observe(
          {
            method: req.method,
            route: routeLabel(req),
            status_class: `${Math.floor(res.statusCode / 100)}xx`,
          },
          seconds,
        );
      });
      next();
    },
    async scrape() {
      const merged = Registry.merge([processMetrics(), registry]);
      reads = null;
      try {
        return { contentType: merged.contentType, text: await merged.metrics() };
      } finally {
        reads = null;
      }
    },
    setLatestBackupProvider(provider) {
      latestBackup = provider;
    },
  };
}
