// Linting: Expo's shared config (React, hooks, import and TypeScript rules) over the whole tree.
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const globals = require('globals');

module.exports = defineConfig([
  expoConfig,
  {
    ignores: ['dist/*', 'node_modules/*', 'data/*', '.expo/*', 'coverage/*', 'tests/e2e/artifacts/*'],
  },
  {
    // Plain Node scripts (the reference ray tracer runs in a child Node process).
    files: ['**/*.mjs', '**/*.cjs'],
    languageOptions: { globals: globals.node },
  },
  {
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
]);
