/** Three projects: node (shared, server, e2e through ts-jest), native components, web components. */
const tsJest = ['ts-jest', { tsconfig: 'tsconfig.server.json', diagnostics: { warnOnly: false } }];
module.exports = {
  testTimeout: 120000,
  // A leaked handle must never hang CI for its whole budget; Jest still prints its summary first.
  forceExit: true,
  projects: [
    {
      displayName: 'node',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/shared', '<rootDir>/tests/server'],
      transform: { '^.+\\.ts$': tsJest },
      moduleFileExtensions: ['ts', 'js', 'json'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.e2e.test.ts'],
      transform: { '^.+\\.ts$': tsJest },
      moduleFileExtensions: ['ts', 'js', 'json'],
    },
    {
      displayName: 'app',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/app'],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
  ],
};
