import type { Logger } from '../../lib/logger';
import { listBackups, removeStalePartials } from './backup-folder';
import { backupRunning, takeBackup, type BackupSettings } from './take-backup';

export interface BackupSchedulerOptions {
  config: BackupSettings;
  logger: Logger;
  /** How often the scheduler looks whether a backup is due. */
  checkEveryMs?: number;
  /** The first look, after start-up work has settled. */
  firstCheckMs?: number;
  now?: () => Date;
}

const hour = 3600 * 1000;

/**
 * Takes a scheduled backup whenever the newest scheduled one is older than
 * BACKUP_INTERVAL_HOURS, looking every few minutes: a restart neither skips a backup nor takes
 * an extra one, and a long interval needs no long timer. A failed backup is logged and tried
 * again after an hour (or the interval, when shorter); the server goes on either way.
 */
export function backupScheduler({
  config,
  logger,
  checkEveryMs = 10 * 60 * 1000,
  firstCheckMs = 60 * 1000,
  now = () => new Date(),
}: BackupSchedulerOptions) {
  const intervalMs = config.backup.intervalHours * hour;
  const retryMs = Math.min(intervalMs, hour);
  let timer: NodeJS.Timeout | null = null;
  let first: NodeJS.Timeout | null = null;
  let current: Promise<void> | null = null;
  let lastFailure: number | null = null;

  function due(): boolean {
    const at = now().getTime();
    if (lastFailure !== null && at - lastFailure < retryMs) return false;
    const newest = listBackups(config.backup.dir).find((backup) => backup.kind === 'scheduled');
    return !newest || at - new Date(newest.takenAt).getTime() >= intervalMs;
  }

  function failed(error: unknown) {
    lastFailure = now().getTime();
    logger.error('Scheduled backup failed; it is tried again later', {
      folder: config.backup.dir,
      error: error instanceof Error ? error.message : String(error),
    });
  }

  async function backUp(): Promise<void> {
    const started = performance.now();
    try {
      removeStalePartials(config.backup.dir, 24 * hour);
      const taken = await takeBackup(config, 'scheduled');
      lastFailure = null;
      logger.info('Scheduled backup taken', {
        file: taken.file,
        bytes: taken.bytes,
        ms: Math.round(performance.now() - started),
        deleted: taken.pruned,
      });
    } catch (error) {
      failed(error);
    }
  }

  /** Takes a backup when one is due; settles when it is done (or when none was due). */
  function check(): Promise<void> {
    if (current) return current;
    try {
      if (backupRunning(config.backup.dir) || !due()) return Promise.resolve();
    } catch (error) {
      failed(error);
      return Promise.resolve();
    }
    current = backUp().finally(() => {
      current = null;
    });
    return current;
  }

  return {
    check,
    start() {
      if (timer || intervalMs <= 0) return;
      first = setTimeout(() => void check(), firstCheckMs);
      first.unref();
      timer = setInterval(() => void check(), Math.min(checkEveryMs, intervalMs));
      timer.unref();
    },
    async stop() {
      if (first) clearTimeout(first);
      if (timer) clearInterval(timer);
      first = timer = null;
      await current;
    },
  };
}
export type BackupScheduler = ReturnType<typeof backupScheduler>;
