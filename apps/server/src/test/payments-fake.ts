import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { startPaymentsFake, type PaymentsFake } from '@lotwise/payments-fake';
import type { Express } from 'express';
import { createApp } from '../app';
import type { Config } from '../config';
import type { Logger } from '../lib/logger';
import { testConfig, testContext } from './harness';

export const testStripeKey = 'sk_test_lotwise_api_tests';
export const testWebhookSecret = 'whsec_lotwise_api_tests';

export interface PaymentsTestbed {
  fake: PaymentsFake;
  /** The app under test, configured for the fake (use it with supertest). */
  app: Express;
  config: Config;
  /** Where the app listens, so the fake's webhooks reach it. */
  appUrl: string;
  close(): Promise<void>;
}

/**
 * The payments fake on a free port and an app on the test file's database that talks to it
 * and listens on a free port of its own, so the fake's signed webhooks reach
 * `/api/webhooks/stripe`. Webhook retries are quick (50 ms doubling) to keep tests short.
 */
export async function startPaymentsTestbed(
  env: NodeJS.ProcessEnv = {},
  logger?: Logger,
): Promise<PaymentsTestbed> {
  const { dir, dataSource } = testContext();
  const fake = await startPaymentsFake({
    port: 0,
    secretKey: testStripeKey,
    webhookSecret: testWebhookSecret,
    retryBaseMs: 50,
    retryMaxMs: 400,
    maxAttempts: 6,
  });
  const config = testConfig(dir, {
    STRIPE_API_URL: fake.url,
    STRIPE_SECRET_KEY: testStripeKey,
    STRIPE_WEBHOOK_SECRET: testWebhookSecret,
    ...env,
  });
  const app = createApp({ dataSource, config, ...(logger ? { logger } : {}) });
  const server: Server = await new Promise((resolve) => {
    const listening = app.listen(0, '127.0.0.1', () => resolve(listening));
  });
  const appUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.setWebhookUrl(`${appUrl}/api/webhooks/stripe`);
  return {
    fake,
    app,
    config,
    appUrl,
    async close() {
      await fake.stop();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
