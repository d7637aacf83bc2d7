import { defineConfig } from '@playwright/test';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/**
 * `npm run docs:screenshots`: the compiled server on a fresh demo database of its own, and one
 * browser walking the everyday jobs to photograph them for the README and docs/user-guide.md.
 * DOCS_SCREENSHOTS_OUT sends the pictures elsewhere (CI writes them to a temporary folder).
 */
const port = Number(process.env.DOCS_SCREENSHOTS_PORT ?? 3290);
const baseURL = `http://127.0.0.1:${port}`;
const dataDir = mkdtempSync(path.join(tmpdir(), 'lotwise-docs-'));

export default defineConfig({
  testDir: '.',
  testMatch: 'take-screenshots.ts',
  outputDir: path.join(dataDir, 'results'),
  fullyParallel: false,
  workers: 1,
  timeout: 120_000,
  expect: { timeout: 15_000 },
  reporter: [['list']],
  use: {
    baseURL,
    locale: 'en-GB',
    timezoneId: 'UTC',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--font-render-hinting=none',
      ],
    },
  },
  webServer: {
    command: 'node apps/server/dist/main.js',
    cwd: path.resolve(import.meta.dirname, '../..'),
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    stdout: 'ignore',
    env: {
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_PATH: path.join(dataDir, 'lotwise.sqlite'),
      SEED_DEMO: 'true',
      PUBLIC_URL: baseURL,
      DEV_MAIL_SMTP_PORT: String(port + 1),
      DEV_MAIL_WEB_PORT: String(port + 2),
      STRIPE_API_URL: `http://127.0.0.1:${port + 3}`,
      ALERT_INTERVAL_SECONDS: '0',
      OUTBOX_INTERVAL_SECONDS: '1',
      LOGIN_RATE_LIMIT: '1000',
      LOGIN_RATE_LIMIT_IP: '1000',
    },
  },
});
