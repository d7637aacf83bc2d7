import { defineConfig } from 'vitest/config';

// One `vitest run` at the root runs every workspace's own config.
export default defineConfig({
  test: {
    projects: ['packages/chem', 'shared', 'apps/payments-fake', 'apps/server', 'apps/web', 'bench'],
  },
});
