import { defineConfig } from 'vitest/config'

// Kept apart from vite.config.ts: when this file exists vitest does not load that one.
// Two projects: the pure library and domain tests need nothing running; the API and
// browser tests share one throwaway PostgreSQL cluster started by the global setup.
export default defineConfig({
  test: {
    testTimeout: 60_000,
    hookTimeout: 60_000,
    projects: [
      {
        test: {
          name: 'shared',
          environment: 'node',
          include: ['tests/shared/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'app',
          environment: 'node',
          include: ['tests/server/**/*.test.ts', 'tests/e2e/**/*.test.ts', 'tests/ops/**/*.test.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
})
