/**
 * A one-line progress display on stderr while files are read, metrics compared and charts drawn:
 * only when stderr is a terminal and not --quiet (so CI logs and pipes stay clean). Redrawn at
 * most every 100 ms; `done()` clears it.
 */
import type { IngestHooks } from '../ingest/ingest.js';
import type { ProgressStage } from '../progress.js';
import type { Io } from './io.js';

export interface Progress {
  readonly hooks: IngestHooks;
  done(): void;
}

const WORDS: Record<ProgressStage, string> = {
  headers: 'looking at files',
  reading: 'reading files',
  comparing: 'comparing metrics',
  drawing: 'drawing charts',
};

export function progressDisplay(io: Io, quiet: boolean, now: () => number = Date.now): Progress {
  if (quiet || !io.stderrIsTTY || io.env.CI !== undefined) return { hooks: {}, done: () => undefined };
  let last = 0;
  let shown = false;
  return {
    hooks: {
      progress: (stage, done, total) => {
        const t = now();
        if (t - last < 100 && done < total) return;
        last = t;
        shown = true;
        io.stderr(`\rseedsift: ${WORDS[stage]} ${done}/${total}\u001b[K`);
      },
    },
    done: () => {
      if (shown) io.stderr('\r\u001b[K');
    },
  };
}
