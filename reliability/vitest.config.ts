import { defineConfig } from 'vitest/config';

// The reliability suite: the compiled server as a real process, killed and started again on
// real databases. Not one of the root projects (`npm test` does not run it): run it with
// `npm run test:reliability`, which builds first. One file at a time: the tests load the
// machine on purpose and share the port range 4500-4599.
export default defineConfig({
  test: {
    name: 'reliability',
    root: import.meta.dirname,
    include: ['**/*.test.ts'],
    environment: 'node',
    globalSetup: ['./lib/global-setup.ts'],
    fileParallelism: false,
    testTimeout: 240_000,
    hookTimeout: 90_000,
  },
});
