import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';

// The client's pure helpers are unit-tested too, so the unit project resolves its aliases.
const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@server': fileURLToPath(new URL('./server', import.meta.url)),
};

// Three projects: pure unit tests, API tests against a real PostgreSQL, and browser tests
// driving Debian's Chromium through the real sign-in pages.
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: [
            'tests/unit/**/*.test.ts',
            'tests/calc/**/*.test.ts',
            'server/**/*.test.ts',
            'idp/**/*.test.ts',
          ],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-database.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          // Texts, webhooks and jobs cross processes and queues: under a full run's load on two
          // cores a second is not always enough for them to arrive.
          expect: { poll: { timeout: 10_000 } },
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-database.ts', 'tests/setup/global-stack.ts'],
          // One browser at a time: the machine has two cores and the stack shares them.
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // Pages load lazily and share two cores with the stack: give a page ten seconds to
          // reach what a test waits for before calling it wrong.
          expect: { poll: { timeout: 10_000 } },
        },
      },
    ],
  },
});
