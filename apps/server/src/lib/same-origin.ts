import type { RequestHandler } from 'express';
import { AppError } from './app-error';

const stateChanging = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

function hostOf(origin: string): string | null {
  try {
    return new URL(origin).host;
  } catch {
    return null;
  }
}

/**
 * Refuses (403) a state-changing request a browser sent from another site: one whose
 * Sec-Fetch-Site is `cross-site`, or whose Origin is neither PUBLIC_URL's origin nor the host
 * the request was sent to. Requests with neither header (command-line clients, mail clients'
 * one-click unsubscribe, tests) pass: only browsers send them, and a browser always does on a
 * cross-site POST. The SameSite=Lax cookie already keeps the session off most of these; this
 * also covers same-site sibling hosts and browsers that ignore SameSite.
 */
export function sameOriginWrites(publicUrl: string): RequestHandler {
  const publicOrigin = new URL(publicUrl).origin;
  const refuse = () =>
    AppError.forbidden(
      'This change was sent from another website, so Lotwise refused it. Open Lotwise at its own address and try again.',
    );
  return (req, _res, next) => {
    if (!stateChanging.has(req.method)) return next();
    if (req.get('sec-fetch-site') === 'cross-site') throw refuse();
    const origin = req.get('origin');
    if (origin === undefined || origin === publicOrigin) return next();
    const host = req.get('host');
    if (host !== undefined && hostOf(origin) === host) return next();
    throw refuse();
  };
}
