import autocannon from 'autocannon';

/** One HTTP request of a question; `next()` gives the next one (rotating ids for writes). */
export interface RequestPlan {
  method: 'GET' | 'POST';
  /** Path with query string, or a function giving a new one for each request. */
  path: string | (() => string);
  body?: () => unknown;
}

/** What one measurement found. */
export interface Measurement {
  p50: number;
  p975: number;
  p99: number;
  /** Answered requests per second over the measured time. */
  rps: number;
  requests: number;
  non2xx: number;
  /** Connection errors and timeouts. */
  errors: number;
  /** Non-2xx status codes seen, with counts. */
  statuses: Record<string, number>;
  /** Non-2xx answers and errors during the warm-up before it (not in the figures above). */
  warmupFailures?: number;
}

/** Sends `plan` over `connections` for `seconds` with autocannon. */
export async function hammer(
  origin: string,
  plan: RequestPlan,
  headers: Record<string, string>,
  seconds: number,
  connections: number,
): Promise<Measurement> {
  const statuses: Record<string, number> = {};
  let answered = 0;
  const instance = autocannon({
    url: origin,
    connections,
    duration: seconds,
    timeout: 30,
    requests: [
      {
        method: plan.method,
        setupRequest: (request) => ({
          ...request,
          method: plan.method,
          path: typeof plan.path === 'function' ? plan.path() : plan.path,
          headers: { ...headers, ...(plan.body ? { 'content-type': 'application/json' } : {}) },
          ...(plan.body ? { body: JSON.stringify(plan.body()) } : {}),
        }),
      },
    ],
  });
  const started = performance.now();
  instance.on('response', (_client: unknown, statusCode: number) => {
    answered++;
    if (statusCode < 200 || statusCode >= 300) {
      statuses[statusCode] = (statuses[statusCode] ?? 0) + 1;
    }
  });
  const result = await instance;
  const elapsed = (performance.now() - started) / 1000;
  return {
    p50: result.latency.p50,
    p975: result.latency.p97_5,
    p99: result.latency.p99,
    rps: answered / Math.max(elapsed, result.duration, 0.001),
    requests: answered,
    non2xx: result.non2xx,
    errors: result.errors,
    statuses,
  };
}

/** Warm-up (not counted), then the measured run. */
export async function measure(
  origin: string,
  plan: RequestPlan,
  headers: Record<string, string>,
  options: { seconds: number; warmupSeconds: number; connections: number },
): Promise<Measurement> {
  const warmup = await hammer(origin, plan, headers, options.warmupSeconds, options.connections);
  const measured = await hammer(origin, plan, headers, options.seconds, options.connections);
  return { ...measured, warmupFailures: warmup.non2xx + warmup.errors };
}
