import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const alias = { '@shared': r('./shared'), '@': r('./src') };

// Three projects: pure unit tests beside the code, acceptance tests (supertest on createApp
// against a fresh MariaDB database per run) and browser tests (Debian chromium via playwright-core).
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'src/**/*.test.ts'], testTimeout: 60_000 },
      },
      {
        resolve: { alias },
        test: {
          name: 'acceptance',
          include: ['tests/acceptance/**/*.test.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
