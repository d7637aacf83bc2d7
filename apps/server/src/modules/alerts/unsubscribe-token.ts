import { createHmac, timingSafeEqual } from 'node:crypto';
import { alertKinds, type AlertKind } from '@lotwise/shared';

/** What an unsubscribe link stands for: one person, one kind of alert or all of them. */
export interface UnsubscribeClaim {
  userId: number;
  kind: AlertKind | 'all';
}

function signature(secret: string, payload: string): Buffer {
  return createHmac('sha256', secret).update(`lotwise-unsubscribe.${payload}`).digest();
}

/**
 * A token for an unsubscribe link that works without signing in: the claim in base64url,
 * a dot, and its HMAC-SHA256. It does not expire, so a link in an old e-mail still works.
 */
export function unsubscribeToken(secret: string, claim: UnsubscribeClaim): string {
  const payload = Buffer.from(JSON.stringify({ u: claim.userId, k: claim.kind })).toString(
    'base64url',
  );
  return `${payload}.${signature(secret, payload).toString('base64url')}`;
}

/** The claim of a token signed with `secret`, or null when it was altered or is malformed. */
export function readUnsubscribeToken(secret: string, token: string): UnsubscribeClaim | null {
  const match = /^([A-Za-z0-9_-]{1,200})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!match) return null;
  const [, payload, sent] = match as unknown as [string, string, string];
  const expected = signature(secret, payload);
  const given = Buffer.from(sent, 'base64url');
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  try {
    const claim = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as {
      u?: unknown;
      k?: unknown;
    };
    const kind = claim.k;
    if (typeof claim.u !== 'number' || !Number.isInteger(claim.u) || claim.u < 1) return null;
    if (kind !== 'all' && !alertKinds.includes(kind as AlertKind)) return null;
    return { userId: claim.u, kind: kind as AlertKind | 'all' };
  } catch {
    return null;
  }
}
