/**
 * A small, complete `Results` for report tests. The numbers are arbitrary shapes for drawing
 * (they are not statistics of anything and no test checks a statistic against them); what the
 * chart tests check is external: the Vega-Lite JSON schema and the structure of Vega's SVG.
 *
 * Deliberate holes: config index 2 has a null mean (and band) at step 200, one of its seeds a null
 * value at step 300; one run has no summary value (diverged) and one value is not used in tests;
 * one comparison has no interval (the three verdicts all occur); reliability bins with no samples have null accuracy.
 */
import { fixtureSettings } from './fixtureSettings.js';
import type {
  CalibrationCurve,
  Comparison,
  ConfigRecord,
  Curve,
  HaltingCurve,
  MetricRecord,
  Results,
  RunRecord,
  RunValue,
  TickCurve,
  Verdict,
} from '../../src/analysis/results.js';

export interface FixtureNames {
  /** Exactly three config ids; the first is the baseline. */
  readonly configs: readonly [string, string, string];
  readonly metric: string;
  readonly tickMetric: string;
  readonly summary: string;
}

export const DEFAULT_NAMES: FixtureNames = {
  configs: ['memory=4', 'memory=8', 'memory=12'],
  metric: 'val_acc',
  tickMetric: 'tick_acc',
  summary: 'last:10%',
};

const SEEDS = ['1', '2', '3'] as const;
const STEPS = [0, 100, 200, 300, 400] as const;

function curve(metric: string, config: string, k: number): Curve {
  const base = [0.3, 0.5, 0.62, 0.7, 0.74].map((v) => v + 0.02 * k);
  const hole = k === 2;
  const mean = base.map((v, i) => (hole && i === 2 ? null : v));
  return {
    metric,
    config,
    steps: [...STEPS],
    mean,
    low: mean.map((v) => (v === null ? null : v - 0.03)),
    high: mean.map((v) => (v === null ? null : v + 0.03)),
    n: mean.map((v) => (v === null ? 1 : 3)),
    band: 't',
    level: 0.95,
    runs: SEEDS.map((seed, s) => ({
      run: `${config},seed=${seed}`,
      seed,
      values: base.map((v, i) => (hole && s === 0 && i === 3 ? null : v + 0.01 * (s - 1))),
    })),
  };
}

function comparison(
  names: FixtureNames,
  baseline: string,
  candidate: string,
  estimate: number,
  verdict: Verdict,
  interval: boolean,
): Comparison {
  return {
    metric: names.metric,
    goal: 'max',
    summary: names.summary,
    task: null,
    baseline,
    candidate,
    step: 400,
    n: { baseline: 3, candidate: 3 },
    mean: { baseline: 0.74, candidate: 0.74 + estimate },
    sd: { baseline: 0.01, candidate: 0.01 },
    diverged: { baseline: 0, candidate: 0 },
    failures: {
      baseline: { runs: 3, diverged: 0, short: 0 },
      candidate: { runs: 3, diverged: 0, short: 0 },
      fisherP: null,
    },
    difference: {
      estimate,
      low: interval ? estimate - 0.025 : null,
      high: interval ? estimate + 0.025 : null,
      level: 0.95,
      method: interval ? 'welch-t' : 'none',
      simultaneous: interval ? { low: estimate - 0.03, high: estimate + 0.03, level: 0.975 } : null,
      bca: null,
    },
    tests: {
      welch: { statistic: 2.1, df: 3.9, p: 0.03 },
      permutation: { p: 0.1, exact: true },
      mannWhitney: { u: 9, p: 0.1, exact: true },
    },
    primary: 'welch',
    p: 0.03,
    pAdjusted: 0.06,
    family: { scope: 'study', correction: 'holm', size: 2 },
    verdict,
    nonInferiority: { margin: 0.01, test: 'welch', p: 0.02, holds: true },
    effect: {
      hedgesG: 1.2,
      hedgesGLow: 0.1,
      hedgesGHigh: 2.3,
      probabilityOfImprovement: 0.9,
      cliffsDelta: 0.8,
      cliffsDeltaLow: 0.1,
      cliffsDeltaHigh: 0.95,
    },
    timeToEvent: null,
    detectable: { sd: 0.01, minimumEffect: 0.03 },
    runs: [],
    cautions: [],
    cautionKinds: [],
  };
}

function tickCurve(names: FixtureNames, config: string, k: number): TickCurve {
  const mean = [0.4, 0.55, 0.63, 0.66].map((v) => v + 0.02 * k);
  return {
    metric: names.tickMetric,
    config,
    step: 400,
    ticks: [0, 1, 2, 3],
    mean,
    low: mean.map((v) => v - 0.02),
    high: mean.map((v) => v + 0.02),
    n: [3, 3, 3, 3],
    band: 't',
    exampleHalfWidth: k === 1 ? mean.map((v) => Math.sqrt((v * (1 - v)) / 500)) : null,
    earliestGood: { tick: 2, low: 2, high: 3, tolerance: 0.01 },
    versusBaseline:
      k === 0
        ? null
        : [0, 1, 2, 3].map((tick) => ({
            tick,
            difference: 0.02 * k,
            pAdjusted: 0.2,
            verdict: 'inconclusive' as const,
          })),
  };
}

function halting(config: string, k: number): HaltingCurve {
  const thresholds = [0.5, 0.7, 0.9];
  return {
    config,
    thresholds,
    accuracy: thresholds.map((t) => ({
      mean: 0.5 + 0.2 * t + 0.01 * k,
      low: 0.48 + 0.2 * t + 0.01 * k,
      high: 0.52 + 0.2 * t + 0.01 * k,
    })),
    exitTick: thresholds.map((t) => ({
      mean: 3 * t + 0.1 * k,
      low: 3 * t + 0.1 * k - 0.2,
      high: 3 * t + 0.1 * k + 0.2,
    })),
    seeds: 3,
    samples: 200,
    ticks: 4,
    exitHistogram: { threshold: 0.7, counts: [120, 260, 150, 70] },
  };
}

function calibration(config: string, k: number): CalibrationCurve {
  return {
    config,
    bins: 5,
    ece: [0, 1, 2, 3].map((tick) => ({
      tick,
      mean: 0.12 - 0.02 * tick + 0.005 * k,
      low: 0.1 - 0.02 * tick + 0.005 * k,
      high: 0.14 - 0.02 * tick + 0.005 * k,
    })),
    reliability: [0, 1, 2, 3, 4].map((b) => ({
      low: b / 5,
      high: (b + 1) / 5,
      confidence: b === 0 ? null : b / 5 + 0.1,
      accuracy: b === 0 ? null : b / 5 + 0.07,
      count: b === 0 ? 0 : 40 * b,
    })),
  };
}

/** Build the fixture, optionally with other (e.g. hostile) config and metric names. */
export function makeResults(names: FixtureNames = DEFAULT_NAMES): Results {
  const configs: ConfigRecord[] = names.configs.map((id, k) => ({
    id,
    params: { memory: String(4 * (k + 1)) },
    seeds: [...SEEDS],
    runs: 3,
    diverged: k === 1 ? 1 : 0,
    short: 0,
  }));
  const metrics: MetricRecord[] = [
    {
      name: names.metric,
      goal: 'max',
      goalSource: 'inferred',
      kind: 'scalar',
      ticks: 0,
      horizon: 400,
      firstStep: 0,
      lastStep: 400,
    },
    {
      name: names.tickMetric,
      goal: 'max',
      goalSource: 'inferred',
      kind: 'tick',
      ticks: 4,
      horizon: 400,
      firstStep: 0,
      lastStep: 400,
    },
  ];
  const runs: RunRecord[] = [];
  const values: RunValue[] = [];
  names.configs.forEach((config, k) => {
    SEEDS.forEach((seed, s) => {
      const id = `${config},seed=${seed}`;
      const diverged = k === 1 && s === 2;
      runs.push({
        id,
        config,
        seed,
        params: { memory: String(4 * (k + 1)) },
        info: {},
        files: [`runs/${id}/log.csv`],
        identity: 'hive',
        status: diverged ? 'diverged' : 'ok',
        lastStep: 400,
        divergedAt: diverged ? 300 : null,
        problems: [],
      });
      const unused = k === 2 && s === 1;
      values.push({
        metric: names.metric,
        summary: names.summary,
        run: id,
        config,
        seed,
        value: diverged ? null : 0.74 + 0.02 * k + 0.01 * (s - 1),
        step: 400,
        loggedAt: diverged ? null : 400,
        note: diverged ? 'diverged: excluded' : unused ? 'short run: not used in tests' : null,
        usedInTests: !diverged && !unused,
      });
    });
  });
  return {
    format: 'seedsift-results',
    version: 1,
    tool: { name: 'seedsift', version: '0.1.0' },
    generated: '2026-01-01T00:00:00.000Z',
    settings: fixtureSettings({ summary: names.summary, margin: 0.01 }),
    inputs: { paths: ['runs'], mode: 'logs', files: 9, filesRead: 9 },
    configs,
    metrics,
    setAside: [],
    runs,
    values,
    // Mean across seeds and interval per config, as analysis/configValues.ts would give them.
    configValues: names.configs.map((config, k) => ({
      metric: names.metric,
      summary: names.summary,
      config,
      n: k === 1 ? 2 : 3,
      missing: k === 1 ? 1 : 0,
      mean: 0.74 + 0.03 * k,
      low: 0.72 + 0.03 * k,
      high: 0.76 + 0.03 * k,
      level: 0.95,
      method: 't' as const,
    })),
    comparisons: [
      comparison(names, names.configs[0], names.configs[1], 0.03, 'better', true),
      comparison(names, names.configs[0], names.configs[2], -0.04, 'worse', true),
      comparison(names, names.configs[1], names.configs[2], 0.005, 'inconclusive', false),
    ],
    curves: names.configs.map((c, k) => curve(names.metric, c, k)),
    tasks: [],
    ticks: names.configs.map((c, k) => tickCurve(names, c, k)),
    halting: names.configs.map((c, k) => halting(c, k)),
    calibration: names.configs.map((c, k) => calibration(c, k)),
    problems: [],
  };
}
