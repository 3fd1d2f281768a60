/** Runs every jest suite: the server/shared project and the Angular client project. */
module.exports = {
  projects: ['<rootDir>/jest.server.config.js', '<rootDir>/projects/turnwise/jest.config.js'],
};
