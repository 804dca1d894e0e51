/** The package version, read once from package.json. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { packageRoot } from '../packageRoot.js';

let cached: string | null = null;

export function version(): string {
  cached ??= (JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version: string }).version;
  return cached;
}
