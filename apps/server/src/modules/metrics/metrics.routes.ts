import type { Request } from 'express';
import type { TrustProxy } from '../../config';
import { AppError } from '../../lib/app-error';
import type { SessionResolver } from '../../lib/auth-middleware';
import { defineRoute } from '../../lib/route-table';
import type { Metrics } from './metrics';

const forwardingHeaders = ['forwarded', 'x-forwarded-for', 'x-real-ip'];

function isLoopbackAddress(address: string | undefined): boolean {
  if (!address) return false;
  const plain = address.startsWith('::ffff:') ? address.slice('::ffff:'.length) : address;
  return plain === '::1' || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(plain);
}

/**
 * True when the request comes from this machine itself. `req.ip` follows TRUST_PROXY: with
 * trusted proxies it is the client they report. With TRUST_PROXY off, a reverse proxy on this
 * machine makes every client look like loopback, so a request that carries forwarding headers
 * is not counted as local (a proxy that sets none must not pass /api/metrics on: see
 * docs/monitoring.md).
 */
export function fromLoopback(req: Request, trustProxy: TrustProxy): boolean {
  if (!isLoopbackAddress(req.ip)) return false;
  if (trustProxy === false && forwardingHeaders.some((name) => req.headers[name] !== undefined)) {
    return false;
  }
  return true;
}

/**
 * `GET /api/metrics`: Prometheus text for a scraper on this machine (loopback) or a signed-in
 * admin; 401 for anyone else not signed in, 403 for other roles.
 */
export function metricsRoutes(
  metrics: Metrics,
  resolveSession: SessionResolver,
  trustProxy: TrustProxy,
) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/metrics',
      access: 'public',
      handle: async ({ req, res }) => {
        if (!fromLoopback(req, trustProxy)) {
          const user = await resolveSession(req, res);
          if (!user) throw AppError.unauthenticated();
          res.locals.user = user;
          if (user.role !== 'admin') {
            throw AppError.forbidden(
              'Only an admin, or a scraper on this machine, may read the metrics.',
            );
          }
        }
        const { contentType, text } = await metrics.scrape();
        res.type(contentType).send(text);
      },
    }),
  ];
}
