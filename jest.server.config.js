/** Server, shared engine, migrations and API tests: Node environment, ts-jest without type-checking (tsc runs separately). */
module.exports = {
  displayName: 'server',
  testEnvironment: 'node',
  rootDir: __dirname,
  roots: ['<rootDir>/server', '<rootDir>/shared', '<rootDir>/seeds', '<rootDir>/tests/api', '<rootDir>/tests/support'],
  testMatch: ['**/*.spec.ts', '**/*.test.ts'],
  // an unhandled rejection fails the test that caused it, not the whole run
  setupFilesAfterEnv: ['<rootDir>/tests/support/jest-setup.ts'],
  // for tests and hooks alike: a suite that migrates a database can take seconds on a busy 2-core machine
  testTimeout: 30_000,
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json', diagnostics: false }],
  },
  moduleFileExtensions: ['ts', 'js', 'json'],
};
