/** @type {import('jest').Config} */
module.exports = {
  displayName: 'node',
  testEnvironment: 'node',
  rootDir: __dirname,
  roots: ['<rootDir>/shared', '<rootDir>/server', '<rootDir>/workers', '<rootDir>/db', '<rootDir>/test/integration'],
  testMatch: ['**/*.spec.ts', '**/*.test.ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json', diagnostics: { warnOnly: false } }] },
  moduleNameMapper: { '^@shared/(.*)$': '<rootDir>/shared/$1' },
};
