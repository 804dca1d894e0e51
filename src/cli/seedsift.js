#!/usr/bin/env node
// The installed `seedsift` command. It runs the compiled JavaScript in dist/ (built by `npm run
// build`, which `npm ci` runs through `prepare`) when that is at least as new as every source file,
// so it starts in about 0.15 s; otherwise, or with SEEDSIFT_FROM_SOURCE=1, it runs the TypeScript
// sources through tsx (about 1 s more at start).
import { existsSync, readdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const compiled = new URL('../../dist/src/cli/main.js', import.meta.url);

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
