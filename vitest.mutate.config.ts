// Vitest settings for mutation testing only (`npm run mutate`, see stryker.config.json and DEVELOPERS.md,
// "Mutation testing"). `npm test` does not read this file.
//
// Mutants live in src/stats and src/analysis; the tests meant to pin them are the unit tests under
// tests/stats and tests/analysis. Left out, because every mutant they cover would run them again:
// the slow end-to-end folders (cli, ingest, report); the live scipy check (a Python process per run)
// and the coverage simulation (tests/stats/calibration.test.ts), whose values the scipy fixture and
// the unit tests pin as well; and analyze.test.ts's 1,000-experiment Monte Carlo block, which skips
// itself, saying so, when SEEDSIFT_MUTATION_RUN is set.
import { configDefaults, defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/stats/**/*.test.ts', 'tests/analysis/**/*.test.ts'],
    exclude: [...configDefaults.exclude, 'tests/stats/scipyLive.test.ts', 'tests/stats/calibration.test.ts'],
    env: { SEEDSIFT_MUTATION_RUN: '1' },
    testTimeout: 120_000,
    hookTimeout: 120_000,
  },
});
