import { randomBytes } from 'node:crypto';

/** A new object id with the provider's prefix, e.g. `cs_test_…`, `pi_…`, `evt_…`. */
export function newId(prefix: string): string {
  return `${prefix}_${randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;
}

/** Seconds since the epoch, as every timestamp in the provider's objects. */
export function unixNow(): number {
  return Math.floor(Date.now() / 1000);
}
