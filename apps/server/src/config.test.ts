import { mkdtempSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig, repoRoot } from './config';

function tempEnv(env: NodeJS.ProcessEnv = {}) {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-config-'));
  return { dir, env: { DATABASE_PATH: path.join(dir, 'sub', 'lotwise.sqlite'), ...env } };
}

describe('configuration', () => {
  it('when nothing is set, then the documented defaults apply', () => {
    const { env } = tempEnv();
    const config = loadConfig(env);
    expect(config).toMatchObject({
      port: 3000,
      host: '127.0.0.1',
      seedDemo: true,
      cookieSecure: false,
      loginRateLimit: 10,
      publicUrl: 'http://localhost:3000',
      webDist: path.join(repoRoot, 'apps/web/dist'),
      bcryptCost: 11,
      logLevel: 'info',
    });
    expect(config.text.locale).toBe('en-GB');
  });

  it('when a text locale and time zone are given, then server-written dates use them', () => {
    const { env } = tempEnv();
    const config = loadConfig({ ...env, TEXT_LOCALE: 'de-DE', TEXT_TIME_ZONE: 'Europe/Berlin' });
    expect(config.text).toEqual({ locale: 'de-DE', timeZone: 'Europe/Berlin' });
  });

  it('when PORT is not a port number, then loading stops with a message naming PORT', () => {
    const { env } = tempEnv();
    for (const port of ['abc', '0', '70000', '30.5']) {
      expect(() => loadConfig({ ...env, PORT: port })).toThrow(ConfigError);
      expect(() => loadConfig({ ...env, PORT: port })).toThrow(/PORT/);
    }
  });

  it('when other values are bad, then the message names the variable', () => {
    const { env } = tempEnv();
    const bad: Record<string, string> = {
      SEED_DEMO: 'maybe',
      COOKIE_SECURE: 'on please',
      LOGIN_RATE_LIMIT: '-1',
      PUBLIC_URL: 'not a url',
      JWT_SECRET: 'short',
      BCRYPT_COST: '2',
      LOG_LEVEL: 'loud',
      TEXT_LOCALE: 'not a locale!',
      TEXT_TIME_ZONE: 'Mars/Olympus',
    };
    for (const [key, value] of Object.entries(bad)) {
      expect(() => loadConfig({ ...env, [key]: value }), key).toThrow(
        new RegExp(`^Invalid configuration: ${key} `),
      );
    }
  });

  it('when values are given, then they are used; PUBLIC_URL loses a trailing slash', () => {
    const { env } = tempEnv();
    const config = loadConfig({
      ...env,
      PORT: '8080',
      SEED_DEMO: 'false',
      COOKIE_SECURE: '1',
      PUBLIC_URL: 'https://lab.example.test/',
      JWT_SECRET: 's'.repeat(40),
    });
    expect(config).toMatchObject({
      port: 8080,
      seedDemo: false,
      cookieSecure: true,
      publicUrl: 'https://lab.example.test',
      jwtSecret: 's'.repeat(40),
    });
  });

  it('when JWT_SECRET is not set, then a secret is generated beside the database and reused next start', () => {
    const { dir, env } = tempEnv();
    const first = loadConfig(env);
    const file = path.join(dir, 'sub', 'jwt-secret');
    expect(first.jwtSecret.length).toBeGreaterThanOrEqual(32);
    expect(readFileSync(file, 'utf8').trim()).toBe(first.jwtSecret);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(loadConfig(env).jwtSecret).toBe(first.jwtSecret);
    const { env: otherEnv } = tempEnv();
    expect(loadConfig(otherEnv).jwtSecret).not.toBe(first.jwtSecret);
  });
});
