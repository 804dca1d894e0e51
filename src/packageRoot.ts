/**
 * The folder of seedsift's package.json, found by walking up from this module. Works the same
 * from the TypeScript sources (src/) and from the compiled JavaScript (dist/src/), so templates and
 * the package version are found wherever the code runs from.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Throws when no package.json named seedsift is found above this module (a broken install). */
export function packageRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const manifest = join(dir, 'package.json');
    if (existsSync(manifest) && (JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string }).name === 'seedsift')
      return dir;
    const parent = dirname(dir);
    if (parent === dir)
      throw new Error(`seedsift: cannot find its own package.json above ${fileURLToPath(import.meta.url)}`);
    dir = parent;
  }
}
