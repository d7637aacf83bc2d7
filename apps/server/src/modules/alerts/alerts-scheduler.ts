import type { Logger } from '../../lib/logger';
import type { AlertsService } from './alerts.service';
import type { scheduledRunsRepository } from './scheduled-runs.repository';

/** The name of the scheduled evaluation in `scheduled_runs`. */
export const alertRulesJob = 'alert-rules';

/**
 * Evaluates the alert rules every `intervalSeconds` (and once soon after start). With `turns`,
 * a tick first claims the turn in the database and skips when another app instance started
 * the evaluation less than an interval ago (less 10 %, for timers that fire a little early),
 * so several instances on one database evaluate once per interval between them.
 */
export function alertScheduler(
  alerts: AlertsService,
  intervalSeconds: number,
  logger: Logger,
  turns?: Pick<ReturnType<typeof scheduledRunsRepository>, 'claimTurn'>,
) {
  let timer: NodeJS.Timeout | null = null;
  let first: NodeJS.Timeout | null = null;
  let running: Promise<unknown> | null = null;

  function tick() {
    if (running) return;
    const now = Date.now();
    const claimed = turns
      ? turns.claimTurn(
          alertRulesJob,
          new Date(now).toISOString(),
          new Date(now - intervalSeconds * 900).toISOString(),
        )
      : Promise.resolve(true);
    running = claimed
      .then((mine) => (mine ? alerts.evaluateNow() : null))
      .then((result) => {
        if (!result) return;
        if (result.queued > 0) logger.info('Alerts queued', result);
      })
      .catch((error: unknown) =>
        logger.error('Alert evaluation failed', {
          error: error instanceof Error ? error.message : String(error),
        }),
      )
      .finally(() => {
        running = null;
      });
  }

  return {
    start() {
      if (timer || intervalSeconds <= 0) return;
      timer = setInterval(tick, intervalSeconds * 1000);
      timer.unref();
      first = setTimeout(tick, 2000);
      first.unref();
    },
    async stop() {
      if (timer) clearInterval(timer);
      if (first) clearTimeout(first);
      timer = null;
      await running;
    },
  };
}
