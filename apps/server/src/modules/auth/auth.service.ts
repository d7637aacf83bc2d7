import type { AcceptInviteBody, LoginBody, User } from '@lotwise/shared';
import type { Config } from '../../config';
import type { Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { presentUser } from '../users/users.service';
import type { UserRow } from '../users/user.entity';
import { hashPassword, tokenHash, verifyPassword } from './passwords';

const wrongCredentials = 'The e-mail address or the password is not right.';
const invalidInvite =
  'This invitation link is not valid or has expired. Ask an admin for a new one.';

type AuthConfig = Pick<Config, 'bcryptCost'>;

export function authService(store: Store, config: AuthConfig) {
  const { users } = store.repos;
  // Compared against when the e-mail is unknown, so both failures take as long.
  let decoyHash: Promise<string> | null = null;
  const decoy = () => (decoyHash ??= hashPassword('lotwise-decoy-password', config.bcryptCost));

  async function pendingInvite(token: string): Promise<UserRow> {
    const row = await users.findByInviteTokenHash(tokenHash(token));
    if (!row || !row.active || !row.inviteExpiresAt || row.inviteExpiresAt <= nowIso()) {
      throw AppError.notFound(invalidInvite);
    }
    return row;
  }

  return {
    /** Checks the credentials; says whether the account is deactivated only to its owner. */
    async login({ email, password }: LoginBody): Promise<User> {
      const row = await users.findByEmail(email);
      const matches = await verifyPassword(password, row?.passwordHash ?? (await decoy()));
      if (!row || !row.passwordHash || !matches) throw AppError.unauthenticated(wrongCredentials);
      if (!row.active) {
        throw AppError.forbidden('This account has been deactivated. Ask an admin of your lab.');
      }
      return presentUser(await users.update(row.id, { lastLoginAt: nowIso() }));
    },

    /** Who an invitation is for, to greet them before they choose a password. */
    async invitation(token: string): Promise<{ email: string; displayName: string }> {
      const row = await pendingInvite(token);
      return { email: row.email, displayName: row.displayName };
    },

    /** Sets the password of an invited user; the link then stops working. */
    async acceptInvite({ token, password }: AcceptInviteBody): Promise<User> {
      const row = await pendingInvite(token);
      const passwordHash = await hashPassword(password, config.bcryptCost);
      const now = nowIso();
      return presentUser(
        await users.update(row.id, {
          passwordHash,
          inviteTokenHash: null,
          inviteExpiresAt: null,
          lastLoginAt: now,
          updatedAt: now,
        }),
      );
    },
  };
}
export type AuthService = ReturnType<typeof authService>;
