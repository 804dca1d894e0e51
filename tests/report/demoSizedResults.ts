/**
 * A `Results` the size of the demo report's (`seedsift report sample-runs --baseline
 * ticks=8,memory=4`), for the page-size test: 6 configs x 5 seeds (one run diverged), three
 * scalar metrics (train_loss on a 200-bin step grid, val_loss and val_acc on 20 bins) with curves,
 * per-run values and 15 comparisons, two per-tick metrics with 8, 16 and 32 ticks, halting over 20
 * thresholds and calibration with 15 bins for two configs, and 43 problems. The numbers are
 * invented shapes with full double precision (as analysis writes them: 17 significant digits);
 * no test checks a statistic against them. Everything not tied to size comes from `sampleResults`.
 */
import type {
  CalibrationCurve,
  Comparison,
  ConfigRecord,
  ConfigValue,
  Curve,
  HaltingCurve,
  MetricRecord,
  Results,
  RunRecord,
  RunValue,
  TickCurve,
} from '../../src/analysis/results.js';
import type { Problem } from '../../src/problems.js';
import { sampleResults } from './sampleResults.js';

const TICKS = [8, 16, 32] as const;
const MEMORY = [4, 12] as const;
export const DEMO_CONFIGS: readonly string[] = TICKS.flatMap((t) => MEMORY.map((m) => `ticks=${t},memory=${m}`));
const SEEDS = ['0', '1', '2', '3', '4'] as const;
/** The diverged run (left out of values, curves keep its early part). */
const DIVERGED = { config: 'ticks=32,memory=12', seed: '4' } as const;

/** Deterministic noise in [-1, 1] with a full-precision fraction (no randomness needed). */
function wiggle(...k: number[]): number {
  const x = Math.sin(k.reduce((a, b, i) => a + b * (12.9898 + 7.233 * i), 0.5)) * 43758.5453;
  return 2 * (x - Math.floor(x)) - 1;
}

function grid(bins: number, first: number, last: number): number[] {
  const width = (last - first) / bins;
  return Array.from({ length: bins }, (_, i) => first + (i + 0.5) * width);
}

function curve(
  metric: string,
  config: string,
  k: number,
  steps: readonly number[],
  level: (step: number) => number,
): Curve {
  const runs = SEEDS.map((seed, s) => ({
    run: `${config},seed=${seed}`,
    seed,
    values: steps.map((step, i) =>
      config === DIVERGED.config && seed === DIVERGED.seed && step > 1400
        ? null
        : level(step) * (1 + 0.02 * k) + 0.01 * wiggle(k, s, i),
    ),
  }));
  const mean = steps.map((_, i) => {
    const xs = runs.map((r) => r.values[i]).filter((v): v is number => v !== null && v !== undefined);
    return xs.reduce((a, b) => a + b, 0) / xs.length;
  });
  return {
    metric,
    config,
    steps: [...steps],
    mean,
    low: mean.map((m, i) => m - 0.012 - 0.002 * Math.abs(wiggle(k, i))),
    high: mean.map((m, i) => m + 0.012 + 0.002 * Math.abs(wiggle(i, k))),
    n: steps.map((step) => (config === DIVERGED.config && step > 1400 ? 4 : 5)),
    band: 't',
    bandByBin: steps.map(() => 't'),
    level: 0.95,
    runs,
  };
}

function comparison(
  template: Comparison,
  metric: string,
  goal: 'max' | 'min',
  candidate: string,
  j: number,
): Comparison {
  const estimate = 0.01 * (j + 1) * wiggle(j, 3) + 1e-9 / 3;
  const half = 0.02 + 0.001 * j + 1e-9 / 7;
  return {
    ...template,
    metric,
    goal,
    summary: 'final',
    baseline: DEMO_CONFIGS[0] ?? '',
    candidate,
    n: { baseline: 5, candidate: candidate === DIVERGED.config ? 4 : 5 },
    diverged: { baseline: 0, candidate: candidate === DIVERGED.config ? 1 : 0 },
    difference: {
      estimate,
      low: estimate - half,
      high: estimate + half,
      level: 0.95,
      method: 'welch-t',
      simultaneous: null,
      bca: null,
    },
  };
}

function tickCurve(metric: string, config: string, k: number): TickCurve {
  const ticks = TICKS[Math.floor(k / 2)] ?? 8;
  const mean = Array.from(
    { length: ticks },
    (_, t) => 0.2 + 0.6 * (1 - Math.exp(-(t + 1) / (ticks / 4))) + 0.004 * wiggle(k, t),
  );
  return {
    metric,
    config,
    step: 2000,
    ticks: mean.map((_, t) => t),
    mean,
    low: mean.map((m, t) => m - 0.01 - 0.003 * Math.abs(wiggle(t, k))),
    high: mean.map((m, t) => m + 0.01 + 0.003 * Math.abs(wiggle(k, t))),
    n: mean.map(() => (config === DIVERGED.config ? 4 : 5)),
    band: 't',
    exampleHalfWidth: null,
    earliestGood: { tick: ticks - 2, low: ticks - 2.7, high: ticks - 1.1, tolerance: 0.005 + 1e-9 / 3 },
    versusBaseline:
      k === 0
        ? null
        : mean.map((m, t) => ({
            tick: t,
            difference: m - 0.5,
            pAdjusted: t < 8 ? 0.0001 : null,
            verdict: t < 8 ? ('worse' as const) : ('inconclusive' as const),
          })),
    diverged: config === DIVERGED.config ? 1 : 0,
  };
}

function halting(config: string, ticks: number): HaltingCurve {
  const thresholds = Array.from({ length: 20 }, (_, i) => (i + 1) / 20);
  return {
    config,
    thresholds,
    accuracy: thresholds.map((th, i) => {
      const m = 0.3 + 0.5 * (1 - Math.exp(-6 * th)) + 0.003 * wiggle(ticks, i);
      return { mean: m, low: m - 0.03 - 0.01 * wiggle(i, ticks), high: m + 0.03 + 0.01 * wiggle(ticks, i, 1) };
    }),
    exitTick: thresholds.map((th, i) => {
      const m = (ticks - 1) * th ** 1.5 + 0.001 * wiggle(i);
      return { mean: m, low: m - 0.1 - 0.01 * wiggle(i, 2), high: m + 0.1 + 0.01 * wiggle(i, 3) };
    }),
    seeds: 5,
    samples: 300,
    ticks,
    exitHistogram: {
      threshold: 0.8,
      counts: Array.from({ length: ticks }, (_, t) => (t === ticks - 1 ? 800 : 20 + ((t * 37) % 60))),
    },
  };
}

function calibration(config: string, ticks: number): CalibrationCurve {
  return {
    config,
    bins: 15,
    seeds: 5,
    ece: Array.from({ length: ticks }, (_, t) => {
      const m = 0.04 + 0.15 * Math.exp(-t / 3) + 0.005 * wiggle(ticks, t);
      return {
        tick: t,
        mean: m,
        low: Math.max(0, m - 0.02 - 0.005 * wiggle(t)),
        high: m + 0.02 + 0.005 * wiggle(t, 1),
      };
    }),
    reliability: Array.from({ length: 15 }, (_, b) => {
      const low = b / 15;
      const high = (b + 1) / 15;
      if (b < 8) return { low, high, confidence: null, accuracy: null, count: 0 };
      const mid = (low + high) / 2 + 0.003 * wiggle(b);
      return {
        low,
        high,
        confidence: mid,
        accuracy: Math.min(1, mid - 0.03 + 0.02 * wiggle(b, ticks)),
        count: 40 + 17 * b,
      };
    }),
  };
}

/** The demo-sized `Results` (see the module comment). */
export function demoSizedResults(): Results {
  const sample = sampleResults();
  const template = sample.comparisons[0] as Comparison;
  const trainSteps = grid(200, 10, 2000);
  const evalSteps = grid(20, 100, 2000);
  const scalar: readonly { name: string; goal: 'max' | 'min'; steps: number[]; level: (s: number) => number }[] = [
    { name: 'train_loss', goal: 'min', steps: trainSteps, level: (s) => 0.3 + 2.2 * Math.exp(-s / 450) },
    { name: 'val_loss', goal: 'min', steps: evalSteps, level: (s) => 0.45 + 1.9 * Math.exp(-s / 500) },
    { name: 'val_acc', goal: 'max', steps: evalSteps, level: (s) => 0.75 - 0.55 * Math.exp(-s / 450) },
  ];
  const configs: ConfigRecord[] = DEMO_CONFIGS.map((id, k) => ({
    id,
    params: { ticks: String(TICKS[Math.floor(k / 2)]), memory: String(MEMORY[k % 2]) },
    seeds: [...SEEDS],
    runs: 5,
    diverged: id === DIVERGED.config ? 1 : 0,
    short: 0,
  }));
  const metrics: MetricRecord[] = [
    ...scalar.map(
      (m): MetricRecord => ({
        name: m.name,
        goal: m.goal,
        goalSource: 'inferred',
        kind: 'scalar',
        ticks: 0,
        horizon: 1300,
        firstStep: 10,
        lastStep: 2000,
      }),
    ),
    ...['val_acc', 'certainty'].map(
      (name): MetricRecord => ({
        name,
        goal: 'max',
        goalSource: 'inferred',
        kind: 'tick',
        ticks: 32,
        horizon: null,
        firstStep: 100,
        lastStep: 2000,
      }),
    ),
  ];
  const runs: RunRecord[] = DEMO_CONFIGS.flatMap((config) =>
    SEEDS.map((seed): RunRecord => {
      const diverged = config === DIVERGED.config && seed === DIVERGED.seed;
      return {
        id: `${config},seed=${seed}`,
        config,
        seed,
        params: {},
        info: {},
        files: [`sample-runs/${config.replace(',', '/')}/seed=${seed}/metrics.csv`],
        identity: 'hive',
        status: diverged ? 'diverged' : 'ok',
        lastStep: diverged ? 1400 : 2000,
        divergedAt: diverged ? 1400 : null,
        problems: [
          'cells treated as missing: val_loss 180 (180 empty); val_acc 180 (180 empty); val_acc@* 1440 ' +
            '(1440 empty); certainty@* 1440 (1440 empty)',
        ],
      };
    }),
  );
  const values: RunValue[] = scalar.flatMap((m) =>
    runs.map((r, i): RunValue => {
      const diverged = r.status === 'diverged';
      return {
        metric: m.name,
        summary: 'final',
        run: r.id,
        config: r.config,
        seed: r.seed,
        value: diverged ? null : m.level(1300) + 0.02 * wiggle(i, m.name.length),
        step: 1300,
        loggedAt: diverged ? null : 1300,
        note: diverged ? 'diverged at step 1400: left out of the tests' : null,
        usedInTests: !diverged,
      };
    }),
  );
  const configValues: ConfigValue[] = scalar.flatMap((m) =>
    DEMO_CONFIGS.map((config, k): ConfigValue => {
      const mean = m.level(1300) + 0.01 * wiggle(k, 9);
      return {
        metric: m.name,
        summary: 'final',
        config,
        n: 5,
        missing: 0,
        mean,
        low: mean - 0.02 - 1e-9 / 3,
        high: mean + 0.02 + 1e-9 / 7,
        level: 0.95,
        method: 't',
      };
    }),
  );
  const problems: Problem[] = [
    ...runs.map(
      (r): Problem => ({
        severity: 'note',
        code: 'cells-missing',
        message: r.problems[0] ?? '',
        file: r.files[0] ?? '',
        run: r.id,
      }),
    ),
    ...Array.from(
      { length: 13 },
      (_, i): Problem => ({
        severity: 'warning',
        code: 'row-malformed',
        message: `expected 12 fields, got 11 (row ${i})`,
        file: 'sample-runs/ticks=8/memory=4/seed=0/metrics.csv',
        line: 100 + i,
      }),
    ),
  ];
  return {
    ...sample,
    settings: { ...sample.settings, baseline: DEMO_CONFIGS[0] ?? null },
    configs,
    metrics,
    runs,
    values,
    configValues,
    comparisons: scalar.flatMap((m) =>
      DEMO_CONFIGS.slice(1).map((candidate, j) => comparison(template, m.name, m.goal, candidate, j)),
    ),
    curves: scalar.flatMap((m) => DEMO_CONFIGS.map((config, k) => curve(m.name, config, k, m.steps, m.level))),
    ticks: ['val_acc', 'certainty'].flatMap((metric) => DEMO_CONFIGS.map((config, k) => tickCurve(metric, config, k))),
    halting: [halting('ticks=32,memory=4', 32), halting('ticks=8,memory=4', 8)],
    calibration: [calibration('ticks=32,memory=4', 32), calibration('ticks=8,memory=4', 8)],
    problems,
  };
}
