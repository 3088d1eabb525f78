// One jest run, three projects: node-side units and integration (real PostgreSQL, S3 fake, SMTP fake),
// Angular component tests (jsdom), and end-to-end tests in headless Chromium.
// scripts/test.sh starts the services and passes their addresses in the environment.
/** @type {import('jest').Config} */
module.exports = {
  projects: ['<rootDir>/jest.node.config.js', '<rootDir>/src/jest.config.js', '<rootDir>/test/e2e/jest.config.js'],
  testTimeout: 30000,
};
