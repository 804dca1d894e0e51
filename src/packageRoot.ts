/**
 * The folder of seedsift's package.json, found by walking up from this module. Works the same
 * from the TypeScript sources (src/) and from the compiled JavaScript (dist/src/), so templates and
 * the package version are found wherever the code runs from.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | null = null;

export function packageRoot(): string {
  if (cached !== null) return cached;
  let dir = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const manifest = join(dir, 'package.json');
    if (existsSync(manifest) && (JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string }).name === 'seedsift')
      return (cached = dir);
    const parent = dirname(dir);
    if (parent === dir)
      throw new Error(`seedsift: cannot find its own package.json above ${fileURLToPath(import.meta.url)}`);
    dir = parent;
  }
}
