import type { AcceptInviteBody, ChangePasswordBody, LoginBody, User } from '@lotwise/shared';
import type { Config } from '../../config';
import type { Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { presentUser } from '../users/users.service';
import type { UserRow } from '../users/user.entity';
import { hashPassword, needsRehash, tokenHash, verifyPassword } from './passwords';

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
      // A hash made at another cost is replaced, so every sign-in costs what BCRYPT_COST says.
      const rehashed = needsRehash(row.passwordHash, config.bcryptCost)
        ? { passwordHash: await hashPassword(password, config.bcryptCost) }
        : {};
      return presentUser(await users.update(row.id, { ...rehashed, lastLoginAt: nowIso() }));
    },

    /** Signs the user out everywhere: every session token they hold stops working. */
    async endSessions(userId: number): Promise<void> {
      await users.endSessions(userId);
    },

    /**
     * Changes the signed-in user's own password after checking the current one, and ends
     * every session they hold (the caller starts a fresh one for this browser).
     */
    async changePassword(userId: number, body: ChangePasswordBody): Promise<User> {
      const row = await users.findById(userId);
      if (!row?.passwordHash || !(await verifyPassword(body.currentPassword, row.passwordHash))) {
        throw AppError.validation('The current password is not right.', {
          currentPassword: 'is not right',
        });
      }
      const passwordHash = await hashPassword(body.newPassword, config.bcryptCost);
      return store.transaction(async (repos) => {
        const now = nowIso();
        // read again, locked: a change made meanwhile (a role, a reset) has raised it already
        const current = (await repos.users.findById(userId)) ?? row;
        const updated = await repos.users.update(userId, {
          passwordHash,
          sessionVersion: current.sessionVersion + 1,
          updatedAt: now,
        });
        await repos.audit.insert({
          actorId: userId,
          action: 'user.password_set',
          targetType: 'user',
          targetId: userId,
          detail: { by: 'self' },
          createdAt: now,
        });
        return presentUser(updated);
      });
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
          sessionVersion: row.sessionVersion + 1,
          lastLoginAt: now,
          updatedAt: now,
        }),
      );
    },
  };
}
export type AuthService = ReturnType<typeof authService>;
