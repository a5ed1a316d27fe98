import { defineConfig } from 'vitest/config';

// Browser tests: build once, serve dist/ with `vite preview`, drive Debian's chromium with playwright-core.
export default defineConfig({
  test: {
    include: ['test/e2e/**/*.e2e.ts'],
    globalSetup: ['test/e2e/global-setup.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 180_000,
    fileParallelism: false,
  },
});
