import { nowIso } from '../../db/sql';
import type { Repositories, Store } from '../../db/store';
import type { Logger } from '../../lib/logger';
import type { AlertsService } from './alerts.service';

export interface LedgerNotesWorkerOptions {
  store: Store;
  alerts: Pick<AlertsService, 'evaluate'>;
  logger: Logger;
  /** Notes evaluated together in one transaction. */
  batchSize?: number;
  /** How often a started worker looks for notes left by a failure or a crash. */
  sweepMs?: number;
  /** Wait after the first failure; doubled after each further one, up to `retryMaxMs`. */
  retryBaseMs?: number;
  retryMaxMs?: number;
}

export interface LedgerNotesWorker {
  /** Evaluates the notes due now, soon; called after every commit that changed the ledger. */
  kick(): void;
  /** Takes what an earlier run left, then sweeps every `sweepMs`. */
  start(): void;
  stop(): Promise<void>;
  /** Resolves when nothing is being evaluated (tests wait for it before reading the outbox). */
  idle(): Promise<void>;
}

/** Writes the notes for a transaction that appended ledger entries (before it commits). */
export function noteLedgerChanges(repos: Repositories, chemicalIds: number[]): Promise<void> {
  return repos.ledgerNotes.noteChanges(chemicalIds, nowIso());
}

/**
 * Runs the alert rules for the chemicals whose ledger changed, after the change committed: a
 * draw or a run only writes a small note beside its entries and does not wait for the rules.
 * Each batch of notes is evaluated and deleted in one transaction with the e-mails it queues,
 * so a change is evaluated once; a batch whose evaluation fails stays, and is tried again
 * after a growing wait (the error is kept on the notes).
 */
export function ledgerNotesWorker({
  store,
  alerts,
  logger,
  batchSize = 200,
  sweepMs = 30_000,
  retryBaseMs = 5_000,
  retryMaxMs = 15 * 60_000,
}: LedgerNotesWorkerOptions): LedgerNotesWorker {
  let running: Promise<void> | null = null;
  let again = false;
  let stopped = false;
  let sweep: NodeJS.Timeout | null = null;

  async function evaluateDue(): Promise<void> {
    for (;;) {
      const now = new Date();
      const due = await store.repos.ledgerNotes.dueNotes(now.toISOString(), batchSize);
      if (due.length === 0 || stopped) return;
      const ids = due.map((note) => note.id);
      const chemicalIds = [...new Set(due.map((note) => note.chemicalId))];
      try {
        await store.transaction(async (repos) => {
          await alerts.evaluate(repos, { now, chemicalIds });
          await repos.ledgerNotes.deleteNotes(ids);
        });
      } catch (error) {
        const message = error instanceof Error ? error.message : String(error);
        const failures = Math.max(...due.map((note) => note.attempts)) + 1;
        const waitMs = Math.min(retryBaseMs * 2 ** (failures - 1), retryMaxMs);
        logger.error('Alert rules failed after a ledger change; trying again later', {
          chemicalIds,
          failures,
          retryInSeconds: Math.round(waitMs / 1000),
          error: message,
        });
        await store.repos.ledgerNotes.deferNotes(
          ids,
          new Date(now.getTime() + waitMs).toISOString(),
          message,
        );
      }
      // A short batch was all that was due; notes written since then kick the worker again.
      if (due.length < batchSize) return;
    }
  }

  function kick() {
    if (stopped) return;
    if (running) {
      again = true;
      return;
    }
    running = (async () => {
      do {
        again = false;
        await evaluateDue().catch((error: unknown) =>
          logger.error('The ledger notes worker stopped short', {
            error: error instanceof Error ? error.message : String(error),
          }),
        );
      } while (again && !stopped);
    })().finally(() => {
      running = null;
    });
  }

  return {
    kick,
    start() {
      stopped = false;
      kick();
      sweep ??= setInterval(kick, sweepMs);
      sweep.unref();
    },
    async stop() {
      stopped = true;
      if (sweep) clearInterval(sweep);
      sweep = null;
      await running;
    },
    async idle() {
      while (running) await running;
    },
  };
}
