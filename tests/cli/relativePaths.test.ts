/** relativePaths: POSIX path rules (Node's path.relative), stated in the module comment. */
import { describe, expect, it } from 'vitest';
import { relativePaths } from '../../src/cli/relativePaths.js';

describe('relativePaths', () => {
  it('makes absolute paths inside the current folder relative, and leaves the others as given', () => {
    expect(
      relativePaths(['/w/s/runs', '/w/s', '/w/s/a/b.csv', '/tmp/x', '/w/sibling', 'rel/x', '../up'], '/w/s'),
    ).toEqual(['runs', '.', 'a/b.csv', '/tmp/x', '/w/sibling', 'rel/x', '../up']);
  });
});
