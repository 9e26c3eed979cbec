import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// One runner for every kind of test. Unit and reference tests need nothing; API and browser tests
// use the throwaway PostgreSQL cluster that scripts/test.sh starts (TEST_DATABASE_URL).
export default defineConfig({
  resolve: { alias: { '@contracts': fileURLToPath(new URL('./server/contracts', import.meta.url)) } },
  test: {
    include: ['tests/**/*.test.ts'],
    globalSetup: ['tests/setup/global-setup.ts'],
    // A hang guard, not a speed check: browser tests render maps in software WebGL.
    testTimeout: 120_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    pool: 'forks',
  },
});
