import type { CookieOptions, Response } from 'express';
import jwt from 'jsonwebtoken';
import type { Config } from '../../config';
import type { SessionResolver } from '../../lib/auth-middleware';
import type { UsersRepository } from '../users/users.repository';
import { presentUser } from '../users/users.service';

export const sessionCookieName = 'lotwise_session';
export const sessionHours = 12;
const issuer = 'lotwise';

type SessionConfig = Pick<Config, 'jwtSecret' | 'cookieSecure'>;

/** Signed session cookies: a JWT with the user id, HttpOnly, SameSite=Lax, 12 hours. */
export function sessions(config: SessionConfig, users: UsersRepository) {
  const cookieOptions: CookieOptions = {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure,
    path: '/',
  };

  const resolve: SessionResolver = async (req) => {
    const token: unknown = req.cookies?.[sessionCookieName];
    if (typeof token !== 'string' || token === '') return null;
    let userId: number;
    try {
      const payload = jwt.verify(token, config.jwtSecret, { algorithms: ['HS256'], issuer });
      userId = Number(typeof payload === 'string' ? NaN : payload.sub);
    } catch {
      return null;
    }
    if (!Number.isInteger(userId)) return null;
    const row = await users.findById(userId);
    return row?.active ? presentUser(row) : null;
  };

  return {
    resolve,
    issue(res: Response, userId: number) {
      const token = jwt.sign({}, config.jwtSecret, {
        algorithm: 'HS256',
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
