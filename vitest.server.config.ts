import { defineConfig } from 'vitest/config';

/** The team register's tests, against a throwaway PostgreSQL cluster (test/server/pg-global-setup.ts). */
export default defineConfig({
  test: {
    include: ['test/server/**/*.test.ts'],
    environment: 'node',
    globalSetup: ['test/server/pg-global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    maxWorkers: 2,
  },
});
