import { defineConfig, mergeConfig } from 'vitest/config';
import viteConfig from './vite.config.ts';

// Four projects: pure unit tests (model, signals, shared code), API tests against the real
// PostgreSQL test cluster, client component tests in happy-dom, and browser tests in Chromium.
// `npm test` (scripts/test.sh) prepares the cluster, the mail catcher and the client build first.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/unit/**/*.test.ts', 'tests/model/**/*.test.ts', 'tests/signals/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'api',
          environment: 'node',
          include: ['tests/api/**/*.test.ts'],
          setupFiles: ['tests/support/api-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      mergeConfig(viteConfig, {
        test: {
          name: 'client',
          environment: 'happy-dom',
          // Screens render slower on a loaded machine; waits end as soon as the screen is there.
          testTimeout: 30_000,
          include: ['tests/client/**/*.test.tsx'],
          setupFiles: ['tests/client/support/setup.ts'],
        },
      }),
      {
        test: {
          name: 'browser',
          environment: 'node',
          include: ['tests/browser/**/*.test.ts'],
          setupFiles: ['tests/support/api-setup.ts'],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
