import { createSecretKey } from 'node:crypto';
import type { CookieOptions, Response } from 'express';
import jwt from 'jsonwebtoken';
import type { Config } from '../../config';
import type { SessionResolver } from '../../lib/auth-middleware';
import type { UserCache } from '../users/user-cache';
import type { UsersRepository } from '../users/users.repository';
import { presentUser } from '../users/users.service';

export const sessionCookieName = 'lotwise_session';
export const sessionHours = 12;
const issuer = 'lotwise';
const algorithm = 'HS256';

type SessionConfig = Pick<Config, 'jwtSecret' | 'cookieSecure'>;

/** What a session token says once its signature, issuer and expiry have been checked. */
interface SessionClaims {
  userId: number;
  sessionVersion: number;
}

function readClaims(payload: string | jwt.JwtPayload): SessionClaims | null {
  if (typeof payload === 'string') return null;
  // A token without an expiry would be a session for ever: refuse it even if signed by us.
  if (typeof payload.exp !== 'number' || typeof payload.iat !== 'number') return null;
  if (payload.exp - payload.iat > sessionHours * 3600) return null;
  const userId = Number(payload.sub);
  const sessionVersion: unknown = payload.sv;
  if (!Number.isInteger(userId) || !Number.isInteger(sessionVersion)) return null;
  return { userId, sessionVersion: sessionVersion as number };
}

/**
 * Signed session cookies: a JWT with the user id and the user's session version, HttpOnly,
 * SameSite=Lax, 12 hours. The user row comes from the user cache (a few seconds, dropped on
 * every write to the user); a token whose session version is not the user's current one is
 * refused, so raising the version (users.repository `endSessions`) signs that user out
 * everywhere at once.
 */
export function sessions(config: SessionConfig, users: UsersRepository, cache: UserCache) {
  // Prepared once: jsonwebtoken would otherwise turn the string into a key on every request.
  const key = createSecretKey(Buffer.from(config.jwtSecret, 'utf8'));
  const cookieOptions: CookieOptions = {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure,
    path: '/',
  };

  function claimsOf(token: unknown): SessionClaims | null {
    if (typeof token !== 'string' || token === '') return null;
    try {
      return readClaims(jwt.verify(token, key, { algorithms: [algorithm], issuer }));
    } catch {
      return null;
    }
  }

  const resolve: SessionResolver = async (req) => {
    const claims = claimsOf(req.cookies?.[sessionCookieName]);
    if (!claims) return null;
    const row = await cache.get(claims.userId, () => users.findById(claims.userId));
    if (!row?.active || row.sessionVersion !== claims.sessionVersion) return null;
    return presentUser(row);
  };

  return {
    resolve,
    /** Starts a session for the user at their current session version. */
    async issue(res: Response, userId: number) {
      const row = await users.findById(userId);
      if (!row) throw new Error(`No user #${userId} to start a session for`);
      const token = jwt.sign({ sv: row.sessionVersion }, key, {
        algorithm,
        issuer,
        subject: String(userId),
        expiresIn: `${sessionHours}h`,
      });
      res.cookie(sessionCookieName, token, {
        ...cookieOptions,
        maxAge: sessionHours * 3600 * 1000,
      });
    },
    clear(res: Response) {
      res.clearCookie(sessionCookieName, cookieOptions);
    },
  };
}
export type Sessions = ReturnType<typeof sessions>;
