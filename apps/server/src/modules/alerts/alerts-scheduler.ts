import type { Logger } from '../../lib/logger';
import type { AlertsService } from './alerts.service';

/** Evaluates the alert rules every `intervalSeconds` (and once soon after start). */
export function alertScheduler(alerts: AlertsService, intervalSeconds: number, logger: Logger) {
  let timer: NodeJS.Timeout | null = null;
  let first: NodeJS.Timeout | null = null;
  let running: Promise<unknown> | null = null;

  function tick() {
    if (running) return;
    running = alerts
      .evaluateNow()
      .then((result) => {
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
