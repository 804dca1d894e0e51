// The whole suite (`npm test`, and `npx vitest run tests/<folder>` as DEVELOPERS.md suggests).
// - Timeouts as `npm test` sets them: on a shared 2-core machine DuckDB-backed tests take 5-10 s each,
//   over vitest's 5 s default, so `npx vitest run tests/ingest` failed where `npm test` passed.
// - The mutation testing sandbox (`.stryker-tmp/`, a copy of the repository while `npm run mutate`
//   runs) and its reports are not test folders.
import { configDefaults, defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    testTimeout: 120_000,
    hookTimeout: 120_000,
    exclude: [...configDefaults.exclude, '.stryker-tmp*/**', 'reports/**'],
  },
});
