// Component tests only (tests/app). Calc and API tests run under vitest; browser tests under
// vitest.e2e.config.mts.
module.exports = {
  preset: 'jest-expo/web',
  roots: ['<rootDir>/tests/app'],
  testMatch: ['**/*.test.tsx', '**/*.test.ts'],
};
