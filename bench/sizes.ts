/**
 * The data sets of `npm run bench`: each is one call of bench/peer/make_runs.py
 * (runs = configs x seeds). The peer (bench/peer/reference_pipeline.py) runs an exact
 * permutation test over all C(2n, n) splits, so it is only run where n <= 10 seeds per config.
 */

/** Arguments of make_runs.py for one data set. */
export interface RunsSpec {
  readonly configs: number;
  readonly seeds: number;
  readonly steps: number;
  readonly metrics: number;
  readonly ticks: number;
}

/** One data set to time, and what to run on it. */
export interface BenchSize {
  /** Folder name under bench/.data/ and the row label. */
  readonly name: string;
  /** Which `--sizes` group it belongs to. */
  readonly group: SizeGroup;
  readonly spec: RunsSpec;
  /** Whether the pandas/scipy peer is run too (null) or why not. */
  readonly peerSkipped: string | null;
  /** Whether seedsift is also run once with the HTML report. */
  readonly html: boolean;
}

export const SIZE_GROUPS = ['small', 'medium', 'scaling', 'large'] as const;
export type SizeGroup = (typeof SIZE_GROUPS)[number];

const STEPS = 20_000;

/**
 * Every data set, in the order they run. The scaling series grows the number of configs (2, 4, 8)
 * at 10 seeds each, so every run and every comparison is the same kind of work at 1x, 2x and 4x and
 * the peer can run at every step (growing seeds to 20 instead would make its exact permutation
 * test C(40, 20) = 1.4e11 splits). Comparisons grow 1, 3, 7 per metric (6, 18, 42 in all).
 */
export const BENCH_SIZES: readonly BenchSize[] = [
  {
    name: 'small',
    group: 'small',
    spec: { configs: 4, seeds: 5, steps: 2_000, metrics: 6, ticks: 0 },
    peerSkipped: null,
    html: true,
  },
  {
    name: 'medium',
    group: 'medium',
    spec: { configs: 4, seeds: 10, steps: STEPS, metrics: 6, ticks: 8 },
    peerSkipped: null,
    html: true,
  },
  {
    name: 'scaling-1x',
    group: 'scaling',
    spec: { configs: 2, seeds: 10, steps: STEPS, metrics: 6, ticks: 0 },
    peerSkipped: null,
    html: false,
  },
  {
    name: 'scaling-2x',
    group: 'scaling',
    spec: { configs: 4, seeds: 10, steps: STEPS, metrics: 6, ticks: 0 },
    peerSkipped: null,
    html: false,
  },
  {
    name: 'scaling-4x',
    group: 'scaling',
    spec: { configs: 8, seeds: 10, steps: STEPS, metrics: 6, ticks: 0 },
    peerSkipped: null,
    html: false,
  },
  {
    name: 'large',
    group: 'large',
    spec: { configs: 10, seeds: 40, steps: STEPS, metrics: 6, ticks: 0 },
    peerSkipped: 'its exact permutation test of 40 v 40 seeds would enumerate C(80, 40) = 1.1e23 splits',
    html: true,
  },
];

/** Runs in a data set. */
export function runCount(spec: RunsSpec): number {
  return spec.configs * spec.seeds;
}

/**
 * The peer's baseline: the first config name in sorted order (Python's `sorted` on ASCII strings,
 * the same order as JavaScript's default sort). `configs` are names like 'ticks=8,memory=4'.
 * Example: peerBaseline(['ticks=8,memory=4', 'ticks=16,memory=12']) → 'ticks=16,memory=12'.
 */
export function peerBaseline(configs: readonly string[]): string {
  const first = [...configs].sort()[0];
  if (first === undefined) throw new RangeError('peerBaseline: a data set needs at least one config');
  return first;
}
