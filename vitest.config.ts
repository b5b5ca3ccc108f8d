import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const contracts = fileURLToPath(new URL('./backend/src/contracts', import.meta.url));

// One config, four suites. `npm test` runs them all; `npx vitest --project api` runs one.
export default defineConfig({
  resolve: { alias: { '@contracts': contracts } },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts', 'backend/src/**/*.test.ts', 'frontend/src/**/*.test.{ts,tsx}'],
          environment: 'node',
          setupFiles: ['tests/helpers/fail-on-console-error.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/helpers/fail-on-console-error.ts'],
          testTimeout: 20_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'reference',
          include: ['tests/reference/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/e2e/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // One browser at a time: the CI machine has two cores.
          fileParallelism: false,
        },
      },
    ],
  },
});
