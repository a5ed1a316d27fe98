import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts', 'test/**/*.test.tsx'],
    exclude: ['test/e2e/**', 'test/server/**', 'node_modules/**'],
    environment: 'node',
    testTimeout: 30_000,
  },
});
