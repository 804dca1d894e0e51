#!/usr/bin/env node
// The installed `seedsift` command. It runs the bundled JavaScript in dist/ (built by `npm run
// build` with esbuild, which `npm ci` runs through `prepare`) when that is at least as new as every
// source file: one bundle starts about 0.5 s sooner than the same code as hundreds of modules
// (@stdlib and DuckDB's API alone are 600 small files). Otherwise, or with SEEDSIFT_FROM_SOURCE=1,
// it runs the TypeScript sources through tsx (about 1 s more at start).
import { existsSync, readdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const compiled = new URL('../../dist/main.js', import.meta.url);

function newestSource(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = `${dir}/${entry.name}`;
    newest = Math.max(newest, entry.isDirectory() ? newestSource(path) : statSync(path).mtimeMs);
  }
  return newest;
}

function compiledIsFresh() {
  if (process.env.SEEDSIFT_FROM_SOURCE === '1' || !existsSync(compiled)) return false;
  return statSync(compiled).mtimeMs >= newestSource(fileURLToPath(new URL('..', import.meta.url)));
}

if (compiledIsFresh()) {
  await import(compiled.href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  await import('./main.ts');
}
