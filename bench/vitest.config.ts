import { defineConfig } from 'vitest/config';

// Only the bench's cheap parts are tested here (a tiny generated lab, the report); the bench
// itself runs with `npm run bench`.
export default defineConfig({
  test: {
    name: 'bench',
    environment: 'node',
    include: ['**/*.test.ts'],
    testTimeout: 30_000,
  },
});
