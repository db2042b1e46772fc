import { defineConfig } from 'vitest/config';

// Three projects: pure unit/property tests, integration tests against the real
// MariaDB test instance, and end-to-end tests in Chromium against the built app.
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
    ],
  },
});
