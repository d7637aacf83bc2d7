/**
 * Runs the payments stand-in on its own:
 *   npm start -w apps/payments-fake -- --port 4242 --webhook-url http://127.0.0.1:3000/api/webhooks/stripe
 * Keys come from STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET (the development defaults when unset).
 */
import { parseArgs } from 'node:util';
import { startPaymentsFake } from './fake-server';
import { devSecretKey, devWebhookSecret } from './dev-keys';

const { values } = parseArgs({
  options: {
    port: { type: 'string', default: process.env.PAYMENTS_FAKE_PORT ?? '4242' },
    host: { type: 'string', default: '127.0.0.1' },
    'webhook-url': { type: 'string', default: process.env.PAYMENTS_FAKE_WEBHOOK_URL },
  },
});

const port = Number(values.port);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`--port must be a whole number from 0 to 65535 (got ${values.port})`);
  process.exit(1);
}

const fake = await startPaymentsFake({
  port,
  host: values.host,
  secretKey: process.env.STRIPE_SECRET_KEY || devSecretKey,
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET || devWebhookSecret,
  webhookUrl: values['webhook-url'] ?? null,
  log: (line) => console.log(`[payments fake] ${line}`),
});
console.log(`Payments fake listening at ${fake.url}`);
console.log(
  values['webhook-url']
    ? `Webhooks go to ${values['webhook-url']}`
    : 'No --webhook-url given: events are recorded but not sent',
);
const stop = () => void fake.stop().then(() => process.exit(0));
process.once('SIGINT', stop);
process.once('SIGTERM', stop);
