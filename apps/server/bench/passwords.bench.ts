import { bench, describe } from 'vitest';
import { hashPassword, verifyPassword } from '../src/modules/auth/passwords';

// One sign-in checks one bcrypt hash: the time per check at each cost is the sign-in's floor.
// The figures chosen from are in docs/decisions.md (BCRYPT_COST).
const password = 'correct-horse-battery';
const hashes = await Promise.all(
  [8, 9, 10, 11].map(async (cost) => ({ cost, hash: await hashPassword(password, cost) })),
);

describe('checking a password (one sign-in)', () => {
  for (const { cost, hash } of hashes) {
    bench(
      `bcrypt cost ${cost}`,
      async () => {
        await verifyPassword(password, hash);
      },
      { iterations: 8, warmupIterations: 1 },
    );
  }
});
