/** The part of autocannon 9's API the bench uses (the package ships no types). */
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  interface RequestSpec {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (request: RequestSpec, context: Record<string, unknown>) => RequestSpec;
  }
  interface Histogram {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    total: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
  }
  interface Result {
    latency: Histogram;
    requests: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    statusCodeStats: Record<string, { count: number }>;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    pipelining?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: RequestSpec[];
  }
  interface Instance extends EventEmitter, PromiseLike<Result> {
    stop(): void;
  }
  function autocannon(options: Options): Instance;
  export default autocannon;
}
