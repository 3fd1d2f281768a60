/**
 * Runs every jest suite: the server/shared project and the Angular client project. The test
 * timeout is set here too: run through `projects`, jest reads it from this root config only,
 * and a busy 2-core CI machine can take longer than the 5 s default for one API test.
 */
module.exports = {
  projects: ['<rootDir>/jest.server.config.js', '<rootDir>/projects/turnwise/jest.config.js'],
  testTimeout: 30_000,
};
