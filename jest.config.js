// Component tests only (tests/app). Calc and API tests run under vitest; browser tests under
// vitest.e2e.config.mts. The jest-expo (native) preset is the one @testing-library/react-native
// targets: under jest-expo/web, testIDs become data-testid and presses do not dispatch.
const preset = require('jest-expo/jest-preset');

// d3-scale and d3-shape ship ES modules only; let Babel transform them as it does Expo's packages.
const [expoPackages, ...otherIgnores] = preset.transformIgnorePatterns;

module.exports = {
  preset: 'jest-expo',
  roots: ['<rootDir>/tests/app'],
  testMatch: ['**/*.test.tsx', '**/*.test.ts'],
  // Their package exports resolve to .mjs files, which jest does not transform: use the UMD builds.
  moduleNameMapper: { '^(d3-[a-z-]+)$': '<rootDir>/node_modules/$1/dist/$1.js' },
  transformIgnorePatterns: [expoPackages.replace('standard-navigation', 'standard-navigation|react-native-svg|d3-[a-z-]+|internmap'), ...otherIgnores],
};
