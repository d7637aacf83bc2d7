import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'server',
    environment: 'node',
    include: ['src/**/*.test.ts'],
    // Each test file gets its own temporary SQLite file, migrated (src/test/setup.ts).
    setupFiles: ['src/test/setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 30_000,
  },
  benchmark: {
    include: ['bench/**/*.bench.ts'],
  },
});
