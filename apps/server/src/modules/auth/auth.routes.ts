import {
  acceptInviteBodySchema,
  changePasswordBodySchema,
  loginBodySchema,
  meResponseSchema,
} from '@lotwise/shared';
import type { Request, RequestHandler } from 'express';
import type { Config } from '../../config';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { z } from 'zod';
import { AppError } from '../../lib/app-error';
import { defineRoute } from '../../lib/route-table';
import type { AuthService } from './auth.service';
import type { Sessions } from './session';

const windowMinutes = 15;
const windowMs = windowMinutes * 60 * 1000;

function normalisedEmail(body: unknown): string {
  const email: unknown = (body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

/** Counts failed sign-ins under `key` in 15-minute windows; successes do not count. */
function failedSignInLimiter(
  limit: number,
  key: (req: Request) => string,
  message: string,
): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: key,
    handler: (_req, _res, next) => {
      next(new AppError('rate_limited', message));
    },
  });
}

type LoginLimits = Pick<Config, 'loginRateLimit' | 'loginRateLimitPerAddress'>;

/**
 * Two limits on failed sign-ins: per network address across every e-mail (one password tried
 * on many accounts), and per address and e-mail (many passwords on one account).
 */
function loginLimiters(limits: LoginLimits): RequestHandler[] {
  const address = (req: Request) => ipKeyGenerator(req.ip ?? '');
  return [
    failedSignInLimiter(
      limits.loginRateLimitPerAddress,
      address,
      `Too many failed sign-ins from this network address. Wait ${windowMinutes} minutes and try again.`,
    ),
    failedSignInLimiter(
      limits.loginRateLimit,
      (req) => `${address(req)}|${normalisedEmail(req.body)}`,
      `Too many sign-in attempts. Wait ${windowMinutes} minutes and try again.`,
    ),
  ];
}

export function authRoutes(auth: AuthService, session: Sessions, limits: LoginLimits) {
  return [
    defineRoute({
      method: 'post',
      path: '/api/auth/login',
      access: 'public',
      summary: 'Sign in (sets the session cookie)',
      before: loginLimiters(limits),
      body: loginBodySchema,
      handle: async ({ body, res }) => {
        const user = await auth.login(body);
        await session.issue(res, user.id);
        res.json({ user });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/auth/logout',
      access: 'public',
      summary: 'Sign out (ends every session of the person)',
      // Signing out ends every session of the user, not only this browser's cookie.
      handle: async ({ req, res }) => {
        const user = await session.resolve(req, res);
        if (user) await auth.endSessions(user.id);
        session.clear(res);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/auth/password',
      access: 'signed-in',
      summary: 'Change one’s own password',
      body: changePasswordBodySchema,
      handle: async ({ body, res, actor }) => {
        const user = await auth.changePassword(actor().id, body);
        // Other browsers are signed out; this one continues on a fresh session.
        await session.issue(res, user.id);
        res.json({ user });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/auth/me',
      access: 'signed-in',
      summary: 'Who is signed in',
      response: { schema: meResponseSchema },
      handle: ({ res, actor }) => {
        res.json({ user: actor() });
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/auth/invite/:token',
      access: 'public',
      summary: 'Read an invitation',
      params: z.object({ token: z.string().min(1).max(200) }),
      handle: async ({ params, res }) => {
        res.json(await auth.invitation(params.token));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/auth/accept-invite',
      access: 'public',
      summary: 'Accept an invitation and set a password',
      body: acceptInviteBodySchema,
      handle: async ({ body, res }) => {
        const user = await auth.acceptInvite(body);
        await session.issue(res, user.id);
        res.json({ user });
      },
    }),
  ];
}
