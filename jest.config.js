// Four projects: pure unit specs (shared/ and server/), Angular component specs (src/),
// API tests against a real MariaDB (tests/api), and end-to-end tests in Chromium (tests/e2e).
// `faults` runs the app against MariaDB servers of its own (restarts, two instances).
// The API and end-to-end projects need the environment that scripts/run-tests.ts sets up.
const { createCjsPreset } = require('jest-preset-angular/presets');

const tsJest = {
  '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }],
};

module.exports = {
  // Global (Jest applies testTimeout only at the top level): browser and database tests need more than 5 s.
  testTimeout: 60000,
  projects: [
    {
      displayName: 'unit',
      testEnvironment: 'node',
      roots: ['<rootDir>/shared', '<rootDir>/server'],
      testMatch: ['**/*.spec.ts'],
      transform: tsJest,
    },
    {
      displayName: 'web',
      ...createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' }),
      roots: ['<rootDir>/src'],
      testMatch: ['**/*.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/api', '<rootDir>/tests/security'],
      testMatch: ['**/*.test.ts'],
      transform: tsJest,
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.e2e.ts'],
      transform: tsJest,
    },
    {
      displayName: 'faults',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/faults'],
      testMatch: ['**/*.test.ts'],
      transform: tsJest,
    },
  ],
};
