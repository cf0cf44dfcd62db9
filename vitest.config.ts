import { defineConfig } from 'vitest/config'

// The import aliases (`@/…` web/src, `@shared/…` shared/) come from tsconfig.json's paths, as in
// vite.config.ts; every project reads them, since web code is imported by web, server and e2e tests.
const resolve = { tsconfigPaths: true }

// Kept apart from vite.config.ts: when this file exists vitest does not load that one.
// Projects: the pure library and domain tests need nothing running; the web tests run in
// jsdom with the API mocked; the API and browser tests share one throwaway PostgreSQL
// cluster started by the global setup.
export default defineConfig({
  test: {
    testTimeout: 60_000,
    hookTimeout: 60_000,
    projects: [
      {
        resolve,
        test: {
          name: 'shared',
          environment: 'node',
          include: ['tests/shared/**/*.test.ts'],
        },
      },
      {
        // The web app's components and helpers in a DOM (jsdom), with the API mocked at the
        // network layer (MSW) from the shared view schemas; nothing running needed.
        resolve,
        test: {
          name: 'web',
          environment: 'jsdom',
          include: ['tests/web/**/*.test.ts', 'tests/web/**/*.test.tsx'],
          setupFiles: ['tests/support/web-setup.ts'],
          // a whole form typed key by key in jsdom takes a few seconds on a busy machine
          testTimeout: 30_000,
        },
      },
      {
        resolve,
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
