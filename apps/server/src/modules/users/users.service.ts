import type {
  AuditAction,
  Page,
  User,
  UserCreate,
  UserListQuery,
  UserPatch,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import { hashPassword, newToken, tokenHash } from '../auth/passwords';
import type { UserRow } from './user.entity';

/** How long an invitation link works. */
export const inviteDays = 7;

/** The API view of a user row: no hashes. */
export function presentUser(row: UserRow): User {
  return {
    id: row.id,
    email: row.email,
    displayName: row.displayName,
    role: row.role,
    active: row.active,
    invitePending: row.passwordHash === null,
    lastLoginAt: row.lastLoginAt,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

function notFound(id: number) {
  return AppError.notFound(`There is no user #${id}.`);
}

function audit(
  repos: Repositories,
  actorId: number | null,
  action: AuditAction,
  targetId: number,
  detail: Record<string, unknown>,
) {
  return repos.audit.insert({
    actorId,
    action,
    targetType: 'user',
    targetId,
    detail,
    createdAt: nowIso(),
  });
}

type UsersConfig = Pick<Config, 'bcryptCost' | 'publicUrl'>;

export function usersService(store: Store, config: UsersConfig) {
  const { users } = store.repos;

  function invitation() {
    const token = newToken();
    const expires = new Date(Date.now() + inviteDays * 24 * 3600 * 1000).toISOString();
    return {
      url: `${config.publicUrl}/invite/${token}`,
      columns: { inviteTokenHash: tokenHash(token), inviteExpiresAt: expires },
    };
  }

  return {
    async list(query: UserListQuery): Promise<Page<User>> {
      const { rows, total } = await users.list(query);
      return { items: rows.map(presentUser), total, page: query.page, pageSize: query.pageSize };
    },

    async get(id: number): Promise<User> {
      const row = await users.findById(id);
      if (!row) throw notFound(id);
      return presentUser(row);
    },

    /** Creates a user; without a password the answer carries an invitation link. */
    async create(
      input: UserCreate,
      actorId: number | null,
    ): Promise<{ user: User; inviteUrl: string | null }> {
      const passwordHash = input.password
        ? await hashPassword(input.password, config.bcryptCost)
        : null;
      const invite = passwordHash ? null : invitation();
      return store.transaction(async (repos) => {
        if (await repos.users.findByEmail(input.email)) {
          throw AppError.conflict('A user with this e-mail address already exists.', {
            email: 'is already used by another account',
          });
        }
        const now = nowIso();
        const row = await repos.users.insert({
          email: input.email,
          displayName: input.displayName,
          role: input.role,
          active: true,
          passwordHash,
          inviteTokenHash: invite?.columns.inviteTokenHash ?? null,
          inviteExpiresAt: invite?.columns.inviteExpiresAt ?? null,
          lastLoginAt: null,
          createdAt: now,
          updatedAt: now,
        });
        await audit(repos, actorId, 'user.created', row.id, {
          email: row.email,
          role: row.role,
          invited: invite !== null,
        });
        return { user: presentUser(row), inviteUrl: invite?.url ?? null };
      });
    },

    /**
     * Changes role, name, active flag or password. Lotwise always keeps one active admin, and
     * an admin cannot lock themself out.
     */
    async update(id: number, patch: UserPatch, actorId: number): Promise<User> {
      const passwordHash =
        patch.password !== undefined ? await hashPassword(patch.password, config.bcryptCost) : null;
      return store.transaction(async (repos) => {
        const current = await repos.users.findById(id);
        if (!current) throw notFound(id);
        const role = patch.role ?? current.role;
        const active = patch.active ?? current.active;
        if (id === actorId && !active) {
          throw AppError.conflict('You cannot deactivate your own account.', {
            active: 'cannot be turned off for yourself',
          });
        }
        const losesAdmin =
          current.role === 'admin' && current.active && (role !== 'admin' || !active);
        if (losesAdmin && (await repos.users.countActiveAdmins()) <= 1) {
          throw AppError.conflict(
            'Lotwise needs at least one active admin: make another user admin first.',
            patch.role !== undefined && role !== 'admin'
              ? { role: 'would leave the lab without an admin' }
              : { active: 'would leave the lab without an admin' },
          );
        }
        const changes: Partial<UserRow> = { updatedAt: nowIso() };
        if (patch.displayName !== undefined && patch.displayName !== current.displayName) {
          changes.displayName = patch.displayName;
          await audit(repos, actorId, 'user.renamed', id, {
            from: current.displayName,
            to: patch.displayName,
          });
        }
        if (role !== current.role) {
          changes.role = role;
          await audit(repos, actorId, 'user.role_changed', id, { from: current.role, to: role });
        }
        if (active !== current.active) {
          changes.active = active;
          await audit(repos, actorId, active ? 'user.reactivated' : 'user.deactivated', id, {});
        }
        if (passwordHash) {
          Object.assign(changes, { passwordHash, inviteTokenHash: null, inviteExpiresAt: null });
          await audit(repos, actorId, 'user.password_set', id, {});
        }
        // A new password, role or active flag ends every session the user had open.
        if (passwordHash || changes.role !== undefined || changes.active !== undefined) {
          changes.sessionVersion = current.sessionVersion + 1;
        }
        return presentUser(await repos.users.update(id, changes));
      });
    },

    /**
     * A fresh invitation link (the old one stops working); also serves as a password reset, so
     * it ends the user's sessions.
     */
    async reissueInvite(id: number, actorId: number): Promise<{ user: User; inviteUrl: string }> {
      return store.transaction(async (repos) => {
        const current = await repos.users.findById(id);
        if (!current) throw notFound(id);
        if (!current.active) {
          throw AppError.conflict('This account is deactivated; reactivate it before inviting.');
        }
        const invite = invitation();
        // A reset: whoever holds a session of this account now must sign in again.
        const row = await repos.users.update(id, {
          ...invite.columns,
          sessionVersion: current.sessionVersion + 1,
          updatedAt: nowIso(),
        });
        await audit(repos, actorId, 'user.invite_issued', id, {});
        return { user: presentUser(row), inviteUrl: invite.url };
      });
    },
  };
}
export type UsersService = ReturnType<typeof usersService>;
