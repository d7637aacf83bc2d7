import { pino, type DestinationStream, type Logger as PinoLogger } from 'pino';
import { currentRequestContext } from './request-context';

export type LogLevel = 'debug' | 'info' | 'warn' | 'error' | 'silent';

/** What the code logs through: a message and optional detail, one JSON line per event. */
export interface Logger {
  debug(message: string, detail?: Record<string, unknown>): void;
  info(message: string, detail?: Record<string, unknown>): void;
  warn(message: string, detail?: Record<string, unknown>): void;
  error(message: string, detail?: Record<string, unknown>): void;
}

/** The server's logger: our interface over a pino logger, which the request logger shares. */
export interface AppLogger extends Logger {
  readonly pino: PinoLogger;
}

/**
 * Secrets never reach a log line, whatever detail a caller passes: passwords, session tokens,
 * cookies and Authorization headers, at the top of the detail and one level down.
 */
const secretKeys = [
  'password',
  'currentPassword',
  'newPassword',
  'passwordHash',
  'token',
  'sessionToken',
  'cookie',
  'cookies',
  'authorization',
  'set-cookie',
];
export const redactedPaths = [
  ...secretKeys.map((key) => `["${key}"]`),
  ...secretKeys.map((key) => `*["${key}"]`),
  'req.headers.authorization',
  'req.headers.cookie',
  'res.headers["set-cookie"]',
];

/**
 * JSON lines on stdout (or `destination`): ISO time, level by name, message as `msg`, and
 * while a request is handled its `reqId` and the signed-in `userId`.
 */
export function createLogger(level: LogLevel, destination?: DestinationStream): AppLogger {
  const base = pino(
    {
      level,
      timestamp: pino.stdTimeFunctions.isoTime,
      formatters: { level: (label) => ({ level: label }) },
      redact: { paths: redactedPaths, censor: '[redacted]' },
    },
    destination,
  );
  const write =
    (method: 'debug' | 'info' | 'warn' | 'error') =>
    (message: string, detail?: Record<string, unknown>) => {
      if (!base.isLevelEnabled(method)) return;
      const context = currentRequestContext();
      const userId = context?.userId() ?? undefined;
      const fields = context ? { reqId: context.reqId, userId, ...detail } : (detail ?? {});
      base[method](fields, message);
    };
  return {
    pino: base,
    debug: write('debug'),
    info: write('info'),
    warn: write('warn'),
    error: write('error'),
  };
}

/** The pino logger behind `logger` when it is the server's; null for a stand-in (tests). */
export function pinoOf(logger: Logger): PinoLogger | null {
  return 'pino' in logger ? (logger as AppLogger).pino : null;
}
