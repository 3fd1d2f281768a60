/** Server, shared engine, migrations and API tests: Node environment, ts-jest without type-checking (tsc runs separately). */
module.exports = {
  displayName: 'server',
  testEnvironment: 'node',
  rootDir: __dirname,
  roots: ['<rootDir>/server', '<rootDir>/shared', '<rootDir>/seeds', '<rootDir>/tests/api'],
  testMatch: ['**/*.spec.ts', '**/*.test.ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json', diagnostics: false }],
  },
  moduleFileExtensions: ['ts', 'js', 'json'],
};
