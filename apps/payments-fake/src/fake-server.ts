import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import Stripe from 'stripe';
import { FakeApiError } from './api-error';
import { checkoutPage } from './checkout-page';
import type { EventContext } from './objects';
import { expandList, fingerprint, type Params } from './params';
import { fakeProvider, type FakeProvider, type TestCard } from './provider';
import { webhookSender, type Delivery } from './webhooks';

export interface PaymentsFakeOptions {
  /** TCP port; 0 picks a free one. */
  port?: number;
  /** Interface to bind; loopback unless told. */
  host?: string;
  /** The only API key the fake accepts (`Authorization: Bearer <key>`). */
  secretKey: string;
  /** Signing secret of the webhook endpoint. */
  webhookSecret: string;
  /** Where events are POSTed; none means events are recorded but not sent. */
  webhookUrl?: string | null;
  /** Wait before the first webhook retry, doubled after each failure (default 1 s). */
  retryBaseMs?: number;
  /** Longest wait between retries (default 60 s). */
  retryMaxMs?: number;
  /** Delivery attempts per event before giving up (default 10). */
  maxAttempts?: number;
  /** Lifetime of a Checkout Session without `expires_at`, in seconds (default 24 h). */
  sessionLifetimeSeconds?: number;
  /** Where the fake reports webhook failures; silent unless given. */
  log?: (line: string) => void;
}

export interface PaymentsFake {
  /** Base address, e.g. `http://127.0.0.1:4242`: the SDK's host, port and protocol. */
  url: string;
  port: number;
  setWebhookUrl(url: string | null): void;
  /** Every event sent so far with its delivery state, oldest first. */
  deliveries(): readonly Delivery[];
  /** Resolves once no event waits for another delivery attempt. */
  settled(): Promise<void>;
  /** Every Checkout Session created, oldest first. */
  sessions(): ReturnType<FakeProvider['sessions']>;
  stop(): Promise<void>;
}

function bearer(req: Request): string | null {
  const header = req.get('authorization') ?? '';
  const match = /^Bearer\s+(\S+)$/i.exec(header);
  return match?.[1] ?? null;
}

function masked(key: string): string {
  return key.length > 8 ? `${key.slice(0, 8)}${'*'.repeat(4)}${key.slice(-4)}` : '****';
}

interface StoredAnswer {
  fingerprint: string;
  status: number;
  body: unknown;
}

/**
 * Starts the payments stand-in: the provider's API for Checkout Sessions, PaymentIntents and
 * refunds under `/v1`, the hosted checkout page under `/pay/:sessionId`, and signed webhooks to
 * `webhookUrl`.
 */
export async function startPaymentsFake(options: PaymentsFakeOptions): Promise<PaymentsFake> {
  const log = options.log ?? (() => undefined);
  let webhookUrl = options.webhookUrl ?? null;
  let baseUrl = '';
  const sender = webhookSender({
    secret: options.webhookSecret,
    endpoint: () => webhookUrl,
    retryBaseMs: options.retryBaseMs ?? 1000,
    retryMaxMs: options.retryMaxMs ?? 60_000,
    maxAttempts: options.maxAttempts ?? 10,
    timeoutMs: 10_000,
    log,
  });
  const provider = fakeProvider({
    baseUrl: () => baseUrl,
    sender,
    sessionLifetimeSeconds: options.sessionLifetimeSeconds ?? 86_400,
  });
  /** Answers to idempotent requests, by API key and Idempotency-Key, stored before answering. */
  const answers = new Map<string, StoredAnswer>();

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended');
  app.use(express.urlencoded({ extended: true, limit: '256kb' }));

  const context = (req: Request): EventContext => ({
    apiVersion: req.get('stripe-version') ?? Stripe.API_VERSION,
    idempotencyKey: req.get('idempotency-key') ?? null,
  });
  const pageContext: EventContext = { apiVersion: Stripe.API_VERSION, idempotencyKey: null };

  app.get('/', (_req, res) => {
    res.json({ name: 'Lotwise payments fake', checkoutPages: `${baseUrl}/pay/:sessionId` });
  });

  app.use('/v1', (req, res, next) => {
    const key = bearer(req);
    if (key === null) {
      throw new FakeApiError(
        401,
        'invalid_request_error',
        'You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. "Authorization: Bearer YOUR_SECRET_KEY").',
      );
    }
    if (key !== options.secretKey) {
      throw new FakeApiError(
        401,
        'invalid_request_error',
        `Invalid API Key provided: ${masked(key)}`,
        'api_key_invalid',
      );
    }
    res.set('Request-Id', `req_${Math.random().toString(36).slice(2, 14)}`);
    next();
  });

  /**
   * A POST run at most once per Idempotency-Key: its answer is stored before it is sent, a
   * repeat with the same parameters gets the same answer, other parameters an idempotency error.
   * Requests refused while validating store nothing, as with the provider.
   */
  const idempotent = (work: (req: Request) => unknown) => (req: Request, res: Response) => {
    const key = req.get('idempotency-key');
    const print = fingerprint(req.method, req.path, req.body);
    const slot = key ? `${bearer(req)}\n${key}` : null;
    const stored = slot ? answers.get(slot) : undefined;
    if (stored) {
      if (stored.fingerprint !== print) {
        throw new FakeApiError(
          400,
          'idempotency_error',
          `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
        );
      }
      res.set('Idempotent-Replayed', 'true').status(stored.status).json(stored.body);
      return;
    }
    const body = work(req);
    if (slot) answers.set(slot, { fingerprint: print, status: 200, body });
    res.status(200).json(body);
  };

  const params = (req: Request): Params => (req.body ?? {}) as Params;
  const expand = (req: Request) => expandList(params(req).expand ?? req.query.expand);
  const withoutExpand = (body: Params): Params => {
    const { expand: _expand, ...rest } = body;
    return rest;
  };

  app.post(
    '/v1/checkout/sessions',
    idempotent((req) => provider.createSession(withoutExpand(params(req)), expand(req))),
  );
  app.get('/v1/checkout/sessions/:id', (req, res) => {
    res.json(provider.retrieveSession(req.params.id, expand(req)));
  });
  app.post(
    '/v1/checkout/sessions/:id/expire',
    idempotent((req) => provider.expireSession(String(req.params.id), context(req), expand(req))),
  );
  app.get('/v1/payment_intents/:id', (req, res) => {
    res.json(provider.retrievePaymentIntent(req.params.id));
  });
  app.post(
    '/v1/refunds',
    idempotent((req) => provider.createRefund(withoutExpand(params(req)), context(req))),
  );
  app.get('/v1/refunds/:id', (req, res) => {
    res.json(provider.retrieveRefund(req.params.id));
  });
  app.use('/v1', (req) => {
    throw new FakeApiError(
      404,
      'invalid_request_error',
      `Unrecognized request URL (${req.method}: ${req.originalUrl.split('?')[0]}).`,
    );
  });

  const showPage = (res: Response, id: string) => {
    const page = provider.page(id);
    if (!page) {
      res.status(404).type('text/plain').send('No such checkout.');
      return;
    }
    res.type('html').send(checkoutPage(page));
  };
  app.get('/pay/:id', (req, res) => showPage(res, req.params.id));
  const pay = (card: TestCard) => (req: Request, res: Response) => {
    const id = String(req.params.id);
    const { redirect } = provider.attempt(id, card, pageContext);
    // Post/Redirect/Get: reloading the page never presses a card again.
    if (redirect) res.redirect(303, redirect);
    else if (provider.page(id)) res.redirect(303, `/pay/${encodeURIComponent(id)}`);
    else showPage(res, id);
  };
  app.post('/pay/:id/succeed', pay('succeeds'));
  app.post('/pay/:id/decline', pay('declined'));

  app.use((error: unknown, _req: Request, res: Response, _next: NextFunction) => {
    if (error instanceof FakeApiError) {
      res.status(error.status).json(error.body());
      return;
    }
    const status =
      typeof error === 'object' && error && 'status' in error && typeof error.status === 'number'
        ? error.status
        : 500;
    const message = error instanceof Error ? error.message : String(error);
    if (status >= 500) log(`Internal error: ${message}`);
    res
      .status(status)
      .json(
        new FakeApiError(
          status,
          status >= 500 ? 'api_error' : 'invalid_request_error',
          status >= 500 ? 'An unexpected error occurred in the payments fake.' : message,
        ).body(),
      );
  });

  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(options.port ?? 0, options.host ?? '127.0.0.1', () =>
      resolve(listening),
    );
    listening.once('error', reject);
  });
  const address = server.address() as AddressInfo;
  const host = address.family === 'IPv6' ? `[${address.address}]` : address.address;
  baseUrl = `http://${host === '0.0.0.0' ? '127.0.0.1' : host}:${address.port}`;

  const sweep = setInterval(() => provider.expireDue(pageContext), 1000);
  sweep.unref();

  return {
    url: baseUrl,
    port: address.port,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    deliveries: () => sender.deliveries,
    settled: () => sender.settled(),
    sessions: () => provider.sessions(),
    async stop() {
      clearInterval(sweep);
      sender.stop();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
