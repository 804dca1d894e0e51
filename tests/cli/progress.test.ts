/** The progress display: shown only on a terminal, outside CI, without --quiet; cleared at the end. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/program.js';
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

  it('names each stage: files looked at and read, metrics compared, charts drawn', () => {
    const io = tty({ CI: undefined });
    let t = 0;
    const p = progressDisplay(io, false, () => (t += 1000));
    p.hooks.progress?.('headers', 1, 4);
    p.hooks.progress?.('comparing', 2, 3);
    p.hooks.progress?.('drawing', 5, 19);
    expect(io.err()).toBe(
      '\rseedsift: looking at files 1/4\u001b[K\rseedsift: comparing metrics 2/3\u001b[K\rseedsift: drawing ' +
        'charts 5/19\u001b[K',
    );
  });

  it(
    'a report on a terminal goes through every stage in ' + 'order and ends each at its total, then clears the line',
    async () => {
      const io = tty({ CI: undefined });
      const dir = mkdtempSync(join(tmpdir(), 'seedsift-progress-'));
      try {
        expect(
          await run(['report', 'sample-runs', '--baseline', 'ticks=8,memory=4', '-o', join(dir, 'report.html')], io),
        ).toBe(0);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
      const lines = io
        .err()
        .split('\r')
        .filter((l) => l !== '');
      const stages = [...new Set(lines.map((l) => /^seedsift: (\D+) \d/.exec(l)?.[1]).filter((s) => s !== undefined))];
      expect(stages).toEqual(['looking at files', 'reading files', 'comparing metrics', 'drawing charts']);
      for (const stage of stages) {
        const last = lines.filter((l) => l.startsWith(`seedsift: ${stage} `)).at(-1) ?? '';
        const [done, total] = (/ (\d+)\/(\d+)/.exec(last) ?? []).slice(1).map(Number);
        expect(done, stage).toBe(total);
      }
      expect(io.err().endsWith('\r\u001b[K')).toBe(true);
    },
  );

  it('is silent when stderr is not a terminal, in CI, or with --quiet', () => {
    for (const [io, quiet] of [
      [memoryIo({ CI: undefined }), false],
      [tty({ CI: 'true' }), false],
      [tty({ CI: undefined }), true],
    ] as const) {
      const p = progressDisplay(io, quiet, () => 1000);
      p.hooks.progress?.('headers', 1, 2);
      p.done();
      expect(io.err()).toBe('');
    }
  });
});
