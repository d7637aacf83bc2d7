/** True for SQLite's "another connection holds the lock" answers (SQLITE_BUSY, SQLITE_LOCKED and their variants). */
export function isDatabaseBusy(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 4; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && /^SQLITE_(BUSY|LOCKED)/.test(code)) return true;
    // TypeORM's QueryFailedError keeps the driver's error here.
    e = (e as { driverError?: unknown }).driverError;
  }
  return false;
}

/** Waits between attempts: 0.5 s, 1 s, 2 s, 4 s, 8 s (with the busy timeout, under a minute). */
export const defaultBusyRetryDelaysMs = [500, 1000, 2000, 4000, 8000] as const;

/**
 * Runs `work`, and again after each delay while it fails because the database is busy (the
 * server holds the write lock); any other error, or the last busy one, is thrown. `work`
 * must be safe to repeat: a transaction that failed was rolled back.
 */
export async function retryWhenBusy<T>(
  work: () => Promise<T>,
  {
    delaysMs = defaultBusyRetryDelaysMs,
    onRetry,
  }: { delaysMs?: readonly number[]; onRetry?: (attempt: number, waitMs: number) => void } = {},
): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      const wait = delaysMs[attempt - 1];
      if (wait === undefined || !isDatabaseBusy(error)) throw error;
      onRetry?.(attempt, wait);
      await new Promise((resolve) => setTimeout(resolve, wait));
    }
  }
}
