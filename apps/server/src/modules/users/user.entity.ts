import type { Role } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/** A row of `users`. Times are ISO-8601 UTC strings (see docs/decisions.md). */
export interface UserRow {
  id: number;
  email: string;
  displayName: string;
  passwordHash: string | null;
  role: Role;
  active: boolean;
  /** SHA-256 (hex) of the invitation token; the token itself is only ever in the link. */
  inviteTokenHash: string | null;
  inviteExpiresAt: string | null;
  lastLoginAt: string | null;
  /** Carried by every session token; raising it ends all of this user's sessions. */
  sessionVersion: number;
  createdAt: string;
  updatedAt: string;
}

export const UserEntity = new EntitySchema<UserRow>({
  name: 'User',
  tableName: 'users',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    email: { type: 'varchar', length: 254 },
    displayName: { name: 'display_name', type: 'varchar', length: 120 },
    passwordHash: { name: 'password_hash', type: 'varchar', length: 100, nullable: true },
    role: { type: 'varchar', length: 20 },
    active: { type: 'boolean' },
    inviteTokenHash: { name: 'invite_token_hash', type: 'varchar', length: 64, nullable: true },
    inviteExpiresAt: { name: 'invite_expires_at', type: 'varchar', length: 24, nullable: true },
    lastLoginAt: { name: 'last_login_at', type: 'varchar', length: 24, nullable: true },
    sessionVersion: { name: 'session_version', type: 'integer', default: 0 },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  checks: [
    { name: 'users_role_check', expression: `role IN ('admin', 'manager', 'member', 'viewer')` },
  ],
  indices: [
    { name: 'users_email_unique', columns: ['email'], unique: true },
    { name: 'users_invite_token_hash_idx', columns: ['inviteTokenHash'] },
  ],
});
