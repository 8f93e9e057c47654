import { defineConfig } from 'vitest/config';

// End-to-end tests: the production web build served exactly as `npm start` serves it, driven
// in Debian's Chromium by playwright-core. One file at a time: they share one server and browser.
export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    fileParallelism: false,
    testTimeout: 90_000,
    hookTimeout: 240_000,
  },
});
