import { defineConfig } from 'vitest/config';

// End-to-end tests: the production web build served exactly as `npm start` serves it, driven
// in Debian's Chromium by playwright-core. One file at a time: they share one server and browser.
export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    fileParallelism: false,
    // A whole walk through the wizard; the shared 2-core machine can make one take minutes.
    testTimeout: 240_000,
    hookTimeout: 240_000,
  },
});
