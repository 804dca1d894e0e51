// The whole suite (`npm test`, `npx vitest run ...`): vitest's defaults, except that the mutation
// testing sandbox (`.stryker-tmp/`, a copy of the repository while `npm run mutate` runs) and its
// reports are not test folders.
import { configDefaults, defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    exclude: [...configDefaults.exclude, '.stryker-tmp/**', 'reports/**'],
  },
});
