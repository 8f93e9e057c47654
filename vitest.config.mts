import { defineConfig } from 'vitest/config';

// Unit, calc and API tests (Node). Component tests run under jest-expo, browser tests under
// vitest.e2e.config.mts.
export default defineConfig({
  test: {
    include: ['tests/calc/**/*.test.ts', 'tests/server/**/*.test.ts', 'tests/unit/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    testTimeout: 20_000,
    // Seeding hashes passwords (scrypt, about 0.5 s each); on a busy machine that takes a while.
    hookTimeout: 60_000,
  },
});
