/**
 * Checks that the runs are what they claim to be, before anything is compared; each finding is a
 * problem with a code (README's problem table):
 *
 * - `series-identical`: two runs whose logged series are identical, every step and value of
 *   every scalar metric (within one config or across configs): one run's files copied for
 *   another. Each run's series are hashed (FNV-1a, 32 bits, over the steps' and values' bytes and
 *   the metric names; Fowler, Noll and Vo), and runs with equal hashes are compared exactly.
 *   Runs with fewer than three points in all are not judged (too little to tell a copy).
 * - `run-single-step`: a run whose metrics were logged at one step only.
 * - `config-all-failed`: a config none of whose runs is usable (diverged, short, rejected or a
 *   single logged step).
 *
 * Score tables (one value per run by design) get the config check only. Pure; cost O(points).
 */
import type { Run, RunSet } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';

/** FNV-1a over bytes, continuing from `hash`. */
function fnv1a(bytes: Uint8Array, hash: number): number {
  let h = hash;
  for (let i = 0; i < bytes.length; i++) {
    h ^= bytes[i] as number;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}

const ENCODER = new TextEncoder();

/** The hash of a run's scalar series (metric names in sorted order), and its number of points. */
function seriesHash(run: Run): { hash: number; points: number } {
  let hash = 0x811c9dc5;
  let points = 0;
  for (const name of Object.keys(run.metrics).sort()) {
    const s = run.metrics[name];
    if (s === undefined) continue;
    hash = fnv1a(ENCODER.encode(name), hash);
    hash = fnv1a(new Uint8Array(s.steps.buffer, s.steps.byteOffset, s.steps.byteLength), hash);
    hash = fnv1a(new Uint8Array(s.values.buffer, s.values.byteOffset, s.values.byteLength), hash);
    points += s.values.length;
  }
  return { hash, points };
}

function sameSeries(a: Run, b: Run): boolean {
  const names = Object.keys(a.metrics).sort();
  if (names.join('\u0000') !== Object.keys(b.metrics).sort().join('\u0000')) return false;
  return names.every((name) => {
    const x = a.metrics[name];
    const y = b.metrics[name];
    if (x === undefined || y === undefined || x.values.length !== y.values.length) return false;
    for (let i = 0; i < x.values.length; i++)
      if (!Object.is(x.values[i], y.values[i]) || x.steps[i] !== y.steps[i]) return false;
    return true;
  });
}

/** The distinct steps at which a run logged any scalar metric (up to 2: enough to tell one from many). */
function loggedSteps(run: Run): number {
  const steps = new Set<number>();
  for (const s of Object.values(run.metrics)) {
    for (const step of s.steps) {
      steps.add(step);
      if (steps.size > 1) return steps.size;
    }
  }
  return steps.size;
}

/**
 * The problems of the checks above, in run order.
 * Example: two runs with identical val_acc series give one `series-identical` warning naming both.
 */
export function sanityChecks(runSet: RunSet): Problem[] {
  const problems: Problem[] = [];
  const logs = runSet.mode === 'logs';
  if (logs) {
    const byHash = new Map<number, Run[]>();
    for (const run of runSet.runs) {
      const { hash, points } = seriesHash(run);
      if (points < 3) continue;
      const earlier = (byHash.get(hash) ?? []).find((r) => sameSeries(r, run));
      if (earlier !== undefined) {
        const where = earlier.config === run.config ? `within config ${run.config || '(none)'}` : 'across configs';
        problems.push(
          problem(
            'series-identical',
            `${run.id} logged exactly the series of ${earlier.id} (${where}; files ${run.files.join(', ')} ` +
              `and ${earlier.files.join(', ')}): most likely a copy; comparisons that use it are not evidence`,
            run.files.length === 1 ? { run: run.id, file: run.files[0] as string } : { run: run.id },
          ),
        );
      }
      byHash.set(hash, [...(byHash.get(hash) ?? []), run]);
    }
  }
  const single = new Set<string>();
  if (logs)
    for (const run of runSet.runs)
      if (run.status !== 'rejected' && loggedSteps(run) === 1) {
        single.add(run.id);
        problems.push(
          problem(
            'run-single-step',
            `${run.id} logged a single step (step ${run.lastStep}): a crash at start, or an evaluation-only file`,
            {
              run: run.id,
            },
          ),
        );
      }
  const byConfig = new Map<string, Run[]>();
  for (const run of runSet.runs) byConfig.set(run.config, [...(byConfig.get(run.config) ?? []), run]);
  for (const [config, runs] of byConfig)
    if (runs.every((r) => r.status !== 'ok' || single.has(r.id)))
      problems.push(
        problem(
          'config-all-failed',
          `every run of ${config || '(no config keys)'} failed ` +
            `(${runs.map((r) => `${r.id}: ${single.has(r.id) ? 'single step' : r.status}`).join('; ')}); it has ` +
            `no usable value`,
        ),
      );
  return problems;
}
