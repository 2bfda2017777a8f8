import { defineConfig } from 'vitest/config';

/**
 * One run, five projects. `ops/test.sh` prepares PostgreSQL and Chromium first and passes
 * SHADOWLOOP_TEST_PG_URL (an admin URL of the throwaway test cluster) to the suites that need it.
 */
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          environment: 'node',
          include: ['simulator/src/**/*.test.ts', 'api/src/**/*.test.ts', 'ops/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'web',
          environment: 'happy-dom',
          include: ['web/src/**/*.test.tsx', 'web/src/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'reference',
          environment: 'node',
          include: ['tests/reference/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'integration',
          environment: 'node',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/helpers/stack-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          fileParallelism: false,
        },
      },
      {
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/helpers/stack-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 90_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
