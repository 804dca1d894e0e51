/** The progress display: shown only on a terminal, outside CI, without --quiet; cleared at the end. */
import { describe, expect, it } from 'vitest';
import { progressDisplay } from '../../src/cli/progress.js';
import { memoryIo } from './memoryIo.js';

const tty = (env: Record<string, string | undefined> = {}) => ({ ...memoryIo(env), stderrIsTTY: true });

describe('progressDisplay', () => {
  it('draws one line on a terminal, throttled to every 100 ms, and clears it', () => {
    const io = tty({ CI: undefined });
    let t = 0;
    const p = progressDisplay(io, false, () => t);
    t = 200;
    p.hooks.progress?.('reading', 1, 10);
    t = 250;
    p.hooks.progress?.('reading', 2, 10); // within 100 ms: skipped
    t = 400;
    p.hooks.progress?.('reading', 10, 10);
    p.done();
    expect(io.err()).toBe('\rseedsift: reading files 1/10\u001b[K\rseedsift: reading files 10/10\u001b[K\r\u001b[K');
  });

  it('is silent when stderr is not a terminal, in CI, or with --quiet', () => {
    for (const [io, quiet] of [[memoryIo({ CI: undefined }), false], [tty({ CI: 'true' }), false], [tty({ CI: undefined }), true]] as const) {
      const p = progressDisplay(io, quiet, () => 1000);
      p.hooks.progress?.('headers', 1, 2);
      p.done();
      expect(io.err()).toBe('');
    }
  });
});
