const levels = ['debug', 'info', 'warn', 'error'] as const;
export type LogLevel = (typeof levels)[number] | 'silent';

export interface Logger {
  debug(message: string, detail?: Record<string, unknown>): void;
  info(message: string, detail?: Record<string, unknown>): void;
  warn(message: string, detail?: Record<string, unknown>): void;
  error(message: string, detail?: Record<string, unknown>): void;
}

/** One line per event: time, level, message and optional detail as JSON. */
export function createLogger(minimum: LogLevel): Logger {
  const threshold = minimum === 'silent' ? levels.length : levels.indexOf(minimum);
  const write =
    (level: (typeof levels)[number]) => (message: string, detail?: Record<string, unknown>) => {
      if (levels.indexOf(level) < threshold) return;
      const line = `${new Date().toISOString()} ${level.toUpperCase()} ${message}${
        detail ? ` ${JSON.stringify(detail)}` : ''
      }`;
      if (level === 'error' || level === 'warn') console.error(line);
      else console.log(line);
    };
  return { debug: write('debug'), info: write('info'), warn: write('warn'), error: write('error') };
}
