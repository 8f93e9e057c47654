/**
 * Lint: Expo's flat config, import cycles, and the layering of the server (DEVELOPERS.md):
 * Drizzle and the database schema/client only in server/repos (plus db/, seeds and tests), and
 * routes that never query: they call services, and only services call repos.
 */
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const prettierConfig = require('eslint-config-prettier');
const globals = require('globals');

/** Value imports of Drizzle or of the schema/client; `import type { Db }` stays allowed (services pass the handle on). */
const DRIZZLE_PATTERNS = [
  { group: ['drizzle-orm', 'drizzle-orm/*'], allowTypeImports: true, message: 'Queries live in server/repos: add a repo function and call it.' },
  { regex: '(^|/)db/(schema|client|migrate)$', allowTypeImports: true, message: 'Queries live in server/repos: add a repo function and call it.' },
];
const REPO_PATTERN = { regex: '(^|/)repos/', allowTypeImports: true, message: 'Routes call services; only services (and the job queue, storage sweep, auth) call repos.' };

module.exports = defineConfig([
  {
    ignores: ['node_modules/**', 'dist/**', 'data/**', '.expo/**', 'test-output/**', 'coverage/**', 'db/migrations/**', 'expo-env.d.ts'],
  },
  expoConfig,
  {
    settings: {
      'import/resolver': { typescript: { project: ['tsconfig.json', 'tsconfig.server.json'] }, node: true },
    },
    rules: {
      // A lazy `import()` (a web chunk loaded on demand) back into its importer is intended, not a cycle at load time.
      'import/no-cycle': ['error', { ignoreExternal: true, allowUnsafeDynamicCyclicDependency: true }],
      // Wrong for us: namespace-style default exports (fast-check's `fc`, express) are meant to be used as `fc.x`.
      'import/no-named-as-default-member': 'off',
      // React Compiler rules: the app does not use the compiler, and refs read in render are deliberate (autosave, pickers).
      'react-hooks/refs': 'off',
      'react-hooks/immutability': 'off',
      'react-hooks/set-state-in-effect': 'off',
    },
  },
  {
    files: ['**/*.ts', '**/*.tsx'],
    rules: {
      // Metro bundles fonts given to `require` (Expo's list lacks woff2).
      '@typescript-eslint/no-require-imports': ['error', { allow: ['\\.(woff2?|ttf|otf|png|jpg|svg|json)$'] }],
    },
  },
  {
    // Not React: a function named use… in server code is not a hook.
    files: ['server/**', 'calc/**', 'db/**', 'seeds/**'],
    rules: { 'react-hooks/rules-of-hooks': 'off' },
  },
  {
    // Node code: the server, its scripts, the database, seeds, tests and config files.
    files: ['server/**', 'db/**', 'seeds/**', 'calc/**', 'templates/**', 'tests/**', '*.config.*', '*.js', '*.mts'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    files: ['**/*.ts', '**/*.tsx'],
    ignores: ['server/repos/**', 'db/**', 'seeds/**', 'tests/**', 'server/start.ts', 'server/scripts/**', 'drizzle.config.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': ['error', { patterns: DRIZZLE_PATTERNS }],
    },
  },
  {
    files: ['server/routes/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': ['error', { patterns: [...DRIZZLE_PATTERNS, REPO_PATTERN] }],
    },
  },
  prettierConfig,
]);
