import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

/** The repository root; relative paths in the environment are resolved against it. */
export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

const flag = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'], { message: 'must be true or false' })
  .transform((value) => value === 'true' || value === '1' || value === 'yes');

const wholeNumber = (min: number, max: number) =>
  z
    .string()
    .regex(/^\d+$/, `must be a whole number from ${min} to ${max}`)
    .transform(Number)
    .pipe(
      z
        .number()
        .min(min, `must be a whole number from ${min} to ${max}`)
        .max(max, `must be a whole number from ${min} to ${max}`),
    );

/** Every key the server reads from the environment, with its default and a one-line doc. */
const envSchema = z.object({
  /** TCP port the HTTP server listens on. */
  PORT: wholeNumber(1, 65535).default(3000),
  /** Interface to bind; 127.0.0.1 keeps Lotwise on this machine, 0.0.0.0 opens it to the network. */
  HOST: z.string().min(1).default('127.0.0.1'),
  /** SQLite database file; its folder is created when missing. */
  DATABASE_PATH: z.string().min(1).default('data/lotwise.sqlite'),
  /** Secret that signs session tokens (32+ characters); generated and kept beside the database when unset. */
  JWT_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  /** Fill an empty database with the demo lab on start-up. */
  SEED_DEMO: flag.default(true),
  /** Mark the session cookie Secure (turn on when Lotwise is served over HTTPS). */
  COOKIE_SECURE: flag.default(false),
  /** Failed sign-in attempts allowed per IP address and e-mail in 15 minutes. */
  LOGIN_RATE_LIMIT: wholeNumber(1, 100000).default(10),
  /** Address people open Lotwise at, used in invitation links; defaults to http://localhost:PORT. */
  PUBLIC_URL: z.url({ message: 'must be a URL such as https://lab.example.test' }).optional(),
  /** Folder of the built web app served beside the API. */
  WEB_DIST: z.string().min(1).default('apps/web/dist'),
  /** bcrypt cost for password hashes; 10 to 12 in use, tests go as low as 4. */
  BCRYPT_COST: wholeNumber(4, 15).default(11),
  /** Least severe log lines printed. */
  LOG_LEVEL: z
    .enum(['debug', 'info', 'warn', 'error', 'silent'], {
      message: 'must be debug, info, warn, error or silent',
    })
    .default('info'),
});

export interface Config {
  port: number;
  host: string;
  databasePath: string;
  jwtSecret: string;
  seedDemo: boolean;
  cookieSecure: boolean;
  loginRateLimit: number;
  publicUrl: string;
  webDist: string;
  bcryptCost: number;
  logLevel: 'debug' | 'info' | 'warn' | 'error' | 'silent';
}

/** A setting in the environment is not usable; the message names the variable. */
export class ConfigError extends Error {
  override name = 'ConfigError';
}

function resolveFromRoot(value: string): string {
  return path.isAbsolute(value) ? value : path.resolve(repoRoot, value);
}

/**
 * Reads the session secret from `jwt-secret` beside the database, creating it with a random
 * value on first start so sessions survive restarts without a secret in the code.
 */
function storedJwtSecret(databasePath: string): string {
  const file = path.join(path.dirname(databasePath), 'jwt-secret');
  if (existsSync(file)) {
    const secret = readFileSync(file, 'utf8').trim();
    if (secret.length >= 32) return secret;
  }
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  chmodSync(file, 0o600);
  return secret;
}

/**
 * Parses the environment once. Empty strings count as unset. Throws ConfigError naming the
 * first variable that is not usable.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const present = Object.fromEntries(
    Object.keys(envSchema.shape)
      .filter((key) => env[key] !== undefined && env[key] !== '')
      .map((key) => [key, env[key]]),
  );
  const parsed = envSchema.safeParse(present);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const key = String(issue?.path[0] ?? 'environment');
    throw new ConfigError(
      `Invalid configuration: ${key} ${issue?.message ?? 'is not valid'} (got ${JSON.stringify(env[key])})`,
    );
  }
  const values = parsed.data;
  const databasePath = resolveFromRoot(values.DATABASE_PATH);
  mkdirSync(path.dirname(databasePath), { recursive: true });
  return {
    port: values.PORT,
    host: values.HOST,
    databasePath,
    jwtSecret: values.JWT_SECRET ?? storedJwtSecret(databasePath),
    seedDemo: values.SEED_DEMO,
    cookieSecure: values.COOKIE_SECURE,
    loginRateLimit: values.LOGIN_RATE_LIMIT,
    publicUrl: (values.PUBLIC_URL ?? `http://localhost:${values.PORT}`).replace(/\/+$/, ''),
    webDist: resolveFromRoot(values.WEB_DIST),
    bcryptCost: values.BCRYPT_COST,
    logLevel: values.LOG_LEVEL,
  };
}
