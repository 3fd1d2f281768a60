/** Angular client tests: jsdom, zoneless, only the specs under projects/turnwise/src. */
const { createCjsPreset } = require('jest-preset-angular/presets');

const preset = createCjsPreset({
  tsconfig: '<rootDir>/projects/turnwise/tsconfig.spec.json',
  testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
});

module.exports = {
  ...preset,
  displayName: 'client',
  rootDir: require('node:path').resolve(__dirname, '../..'),
  roots: ['<rootDir>/projects/turnwise/src'],
  testMatch: ['**/*.spec.ts'],
  setupFilesAfterEnv: ['<rootDir>/projects/turnwise/jest-setup.ts'],
  moduleNameMapper: { '^@shared/(.*)$': '<rootDir>/shared/$1' },
  // The icon SVGs live in node_modules; let the preset turn them into strings like the build's text loader.
  transformIgnorePatterns: ['node_modules/(?!(.*\\.mjs$|@angular/common/locales/.*\\.js$|@material-design-icons/svg/))'],
  moduleFileExtensions: [...preset.moduleFileExtensions, 'svg'],
};
