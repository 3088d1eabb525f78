// End-to-end tests: the real API and built client on a random port, driven in Debian's headless
// Chromium through playwright-core. `npm test` builds the client and starts the services first.
/** @type {import('jest').Config} */
module.exports = {
  displayName: 'e2e',
  testEnvironment: 'node',
  rootDir: __dirname + '/../..',
  roots: ['<rootDir>/test/e2e'],
  testMatch: ['**/*.e2e.ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json' }] },
  moduleNameMapper: { '^@shared/(.*)$': '<rootDir>/shared/$1' },
  setupFilesAfterEnv: ['<rootDir>/test/e2e/setup-timeout.ts'],
};
