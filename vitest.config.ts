import { defineConfig } from 'vitest/config';

// Three projects: pure unit/property tests; integration tests (supertest) against the real MariaDB
// test instance; end-to-end tests in Chromium against the built app. `npm test` runs all three.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/shared/**/*.test.ts', 'tests/client/**/*.test.{ts,tsx}', 'tests/lint/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'integration',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/integration-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/e2e/support/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
