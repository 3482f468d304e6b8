// Linting: Expo's shared config (React, hooks, import and TypeScript rules) over the whole tree.
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');

module.exports = defineConfig([
  expoConfig,
  {
    ignores: ['dist/*', 'node_modules/*', 'data/*', '.expo/*', 'coverage/*', 'tests/e2e/artifacts/*'],
  },
  {
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
]);
