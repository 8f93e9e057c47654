import { defineConfig } from 'vitest/config';

// Unit, calc and API tests (Node). Component tests run under jest-expo, browser tests under
// vitest.e2e.config.mts.
export default defineConfig({
  test: {
    include: ['tests/calc/**/*.test.ts', 'tests/server/**/*.test.ts', 'tests/unit/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    // A ceiling, not a wait: on the shared 2-core machine an API test can pass 20 s.
    testTimeout: 60_000,
    // Seeding hashes passwords (scrypt, about 0.5 s each); on a busy machine that takes a while.
    hookTimeout: 60_000,
  },
});
