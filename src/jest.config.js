// Angular component tests: jest-preset-angular in jsdom, zoneless like the app.
// rootDir is the repository root so tsconfig.spec.json and the @shared alias resolve as in the build.
const path = require('node:path');
const { createCjsPreset } = require('jest-preset-angular/presets');

const preset = createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' });

/** @type {import('jest').Config} */
module.exports = {
  ...preset,
  displayName: 'client',
  rootDir: path.resolve(__dirname, '..'),
  roots: ['<rootDir>/src'],
  testMatch: ['<rootDir>/src/**/*.spec.ts'],
  setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
  moduleNameMapper: { '^@shared/(.*)$': '<rootDir>/shared/$1' },
  // d3 (under ngx-charts) ships ESM only; Angular's .mjs bundles must be transformed too.
  transformIgnorePatterns: [
    'node_modules/(?!(.*\\.mjs$|d3-|internmap|delaunator|robust-predicates|gradient-path|@swimlane))',
  ],
};
