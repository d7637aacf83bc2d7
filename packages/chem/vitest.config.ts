import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'chem',
    include: ['src/**/*.test.ts'],
    environment: 'node',
    benchmark: { include: ['bench/**/*.bench.ts'] },
  },
});
