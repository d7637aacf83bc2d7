import type { Request, RequestHandler, Response } from 'express';
import { can, type Permission, type User } from '@lotwise/shared';
import { AppError } from './app-error';

/** Finds the signed-in, active user behind a request, or null. */
export type SessionResolver = (req: Request, res: Response) => Promise<User | null>;

/**
 * Requires a signed-in, active user and keeps it on `res.locals.user`. The user is read from
 * the database on every request, so deactivation and role changes apply at once.
 */
export function authenticate(resolve: SessionResolver): RequestHandler {
  return async (req, res, next) => {
    const user = await resolve(req, res);
    if (!user) throw AppError.unauthenticated();
    res.locals.user = user;
    next();
  };
}

/** Requires that the signed-in user's role holds `permission` (matrix in @lotwise/shared). */
export function authorize(permission: Permission): RequestHandler {
  return (_req, res, next) => {
    const user = currentUser(res);
    if (!user) throw AppError.unauthenticated();
    if (!can(user.role, permission)) {
      throw AppError.forbidden(`Your role (${user.role}) may not do this: it needs ${permission}.`);
    }
    next();
  };
}

/** The user `authenticate()` found, if any. */
export function currentUser(res: Response): User | null {
  return (res.locals.user as User | undefined) ?? null;
}
