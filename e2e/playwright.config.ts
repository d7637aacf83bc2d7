import { defineConfig } from '@playwright/test';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const port = Number(process.env.E2E_PORT ?? 3199);
const baseURL = `http://127.0.0.1:${port}`;
// A fresh database per run: the server migrates it and seeds the demo lab.
const dataDir = mkdtempSync(path.join(tmpdir(), 'lotwise-e2e-'));

export default defineConfig({
  testDir: '.',
  testMatch: '**/*.spec.ts',
  outputDir: './.artifacts/results',
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 30_000,
  expect: { timeout: 7_000 },
  reporter: process.env.CI ? [['list']] : [['list']],
  use: {
    baseURL,
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  webServer: {
    command: 'node --enable-source-maps apps/server/dist/main.js',
    cwd: path.resolve(import.meta.dirname, '..'),
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    stdout: 'pipe',
    env: {
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_PATH: path.join(dataDir, 'lotwise.sqlite'),
      SEED_DEMO: 'true',
      LOGIN_RATE_LIMIT: '1000',
      LOGIN_RATE_LIMIT_IP: '1000',
      PUBLIC_URL: baseURL,
      // the dev inbox on ports of its own, so a developer's running Lotwise does not clash
      DEV_MAIL_SMTP_PORT: String(port + 1),
      DEV_MAIL_WEB_PORT: String(port + 2),
      // the local payments fake (hosted checkout page, signed webhooks) on the port after those
      STRIPE_API_URL: `http://127.0.0.1:${port + 3}`,
      ALERT_INTERVAL_SECONDS: '0',
      OUTBOX_INTERVAL_SECONDS: '1',
    },
  },
});
