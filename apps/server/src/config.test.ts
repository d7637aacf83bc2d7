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

describe('the development mail inbox', () => {
  it('when no SMTP server is set in development, then the local fake mail server is used', () => {
    const { env } = tempEnv();
    for (const nodeEnv of [undefined, '', 'development']) {
      expect(loadConfig({ ...env, NODE_ENV: nodeEnv }).mail.smtp).toEqual({
        kind: 'dev',
        host: '127.0.0.1',
        port: 1025,
        webPort: 1080,
      });
    }
  });

  it('when SMTP_URL or SMTP_HOST is set, then the dev inbox is off, even in development', () => {
    const { env } = tempEnv();
    const url = loadConfig({ ...env, SMTP_URL: 'smtp://mail.example.test:587', DEV_MAIL: 'true' });
    expect(url.mail.smtp).toEqual({ kind: 'url', url: 'smtp://mail.example.test:587' });
    const host = loadConfig({ ...env, SMTP_HOST: 'mail.example.test', DEV_MAIL: 'true' });
    expect(host.mail.smtp).toMatchObject({ kind: 'host', host: 'mail.example.test', port: 587 });
  });

  it('when NODE_ENV is production (or test), then the dev inbox is off and e-mails wait in the outbox', () => {
    const { env } = tempEnv();
    for (const nodeEnv of ['production', 'test']) {
      const config = loadConfig({ ...env, NODE_ENV: nodeEnv, DEV_MAIL: 'true' });
      expect(config.mail.smtp).toEqual({ kind: 'none' });
      expect(config.nodeEnv).toBe(nodeEnv);
    }
  });

  it('when DEV_MAIL is false, then there is no dev inbox in development either', () => {
    const { env } = tempEnv();
    expect(loadConfig({ ...env, DEV_MAIL: 'false' }).mail.smtp).toEqual({ kind: 'none' });
  });
});
