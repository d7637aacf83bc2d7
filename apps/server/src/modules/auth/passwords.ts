import { createHash, randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** True when the hash was made at another cost than the configured one (rehash at sign-in). */
export function needsRehash(hash: string, cost: number): boolean {
  try {
    return bcrypt.getRounds(hash) !== cost;
  } catch {
    return false;
  }
}

/** A random token for a link (256 bits, URL-safe). */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Tokens are stored only as this hash, so a copy of the database cannot be used to sign in. */
export function tokenHash(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A strong password for accounts created without one (shown once). */
export function generatePassword(): string {
  return randomBytes(18).toString('base64url');
}
