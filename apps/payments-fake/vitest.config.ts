import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'payments-fake',
    environment: 'node',
    include: ['src/**/*.test.ts'],
    testTimeout: 30_000,
  },
});
