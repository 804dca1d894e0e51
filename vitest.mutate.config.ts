// Vitest settings for mutation testing only (`npm run mutate`, see stryker.config.json and DEVELOPERS.md).
// Mutants live in src/stats and src/analysis; the tests that are meant to pin them are the unit tests
// mirrored under tests/stats and tests/analysis. The slow end-to-end folders (cli, ingest, report) are
// left out so that a full run fits in an hour on two cores. `npm test` does not read this file.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/stats/**/*.test.ts', 'tests/analysis/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
  },
});
