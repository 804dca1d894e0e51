/**
 * A complete `Results` for the report tests: three configs of a memory-length study, two scalar
 * metrics (one to maximise, one to minimise), a per-tick metric, halting and calibration, problems.
 *
 * Where the numbers come from:
 * - val_acc, memory=8 vs memory=4: the per-run values are METHODS.md's samples A (5 seeds) and
 *   B (7 seeds), and every statistic of that comparison is METHODS.md's check value (scipy 1.10.1).
 * - The other comparisons (val_acc memory=12 vs memory=4; train_loss) were computed with scipy
 *   1.10.1 (Debian python3-scipy: `ttest_ind(equal_var=False)`, `mannwhitneyu(method='exact')`,
 *   exact permutation over all splits, `nct` root finding for the Hedges' g interval, Cliff's delta
 *   with its consistent variance and the Feng & Cliff interval, noncentral-t power) from the
 *   per-run values written here. Holm adjustments by hand from those p-values.
 * - Per-config means and their t-intervals (`configValues`) are computed here from the per-run
 *   values; they and the curve bands use the t quantiles 2.446912 (df 6), 2.776445 (df 4) and
 *   3.182446 (df 3) (40-digit mpmath roots rounded to 6 decimals: tests/reference/t_family_reference.py).
 * - Curves, tick curves, halting and calibration are invented shapes for drawing (no test checks a
 *   statistic against them).
 *
 * `sampleResults(names)` lets the hostile-data tests put any text in config, metric and seed names
 * and problem messages.
 */
import { fixtureSettings } from './fixtureSettings.js';
import type {
  CalibrationCurve,
  CautionKind,
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

export interface SampleNames {
  /** Config ids: baseline first (7 seeds), then two candidates (5 seeds each; the last has one diverged run). */
  readonly configs: readonly [string, string, string];
  /** The parameter key the configs vary (`memory`). */
  readonly key: string;
  /** Parameter values of the three configs. */
  readonly values: readonly [string, string, string];
  readonly acc: string;
  readonly loss: string;
  readonly tick: string;
  /** Appended to every problem message (hostile text goes here). */
  readonly problemText: string;
  readonly path: string;
}

export const SAMPLE_NAMES: SampleNames = {
  configs: ['memory=4', 'memory=8', 'memory=12'],
  key: 'memory',
  values: ['4', '8', '12'],
  acc: 'val_acc',
  loss: 'train_loss',
  tick: 'tick_acc',
  problemText: '',
  path: 'runs',
};

/** Per-run final values by config index (METHODS.md B, A; then ours), seeds 1.. in order. */
const ACC: readonly (readonly number[])[] = [
  [68.9, 70.1, 69.5, 71.0, 67.8, 70.6, 69.2],
  [71.2, 69.8, 73.1, 70.4, 72.0],
  [69.9, 70.8, 68.7, 70.2],
];
const LOSS: readonly (readonly number[])[] = [
  [0.412, 0.398, 0.405, 0.421, 0.409, 0.402, 0.415],
  [0.371, 0.365, 0.38, 0.362, 0.375],
  [0.418, 0.431, 0.425, 0.422],
];
/** Seeds per config (memory=12 seed 5 diverged at step 6000). */
const SEEDS: readonly (readonly string[])[] = [
  ['1', '2', '3', '4', '5', '6', '7'],
  ['1', '2', '3', '4', '5'],
  ['1', '2', '3', '4', '5'],
];
const DIVERGED_AT = 6000;
const STEPS = Array.from({ length: 21 }, (_, i) => i * 500);
/** t quantiles 0.975 by df (mpmath roots to 6 decimals, tests/reference/t_family_reference.py). */
const T975: Readonly<Record<number, number>> = { 3: 3.182446, 4: 2.776445, 6: 2.446912 };

const runId = (config: string, seed: string): string => `${config},seed=${seed}`;

function meanOf(x: readonly number[]): number {
  return x.reduce((a, b) => a + b, 0) / x.length;
}
function sdOf(x: readonly number[]): number {
  const m = meanOf(x);
  return Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1));
}

/** Invented learning-curve shape ending at the run's final value. */
function shape(metric: 'acc' | 'loss', final: number, step: number, seed: number): number {
  const wiggle = Math.sin(seed * 1.7 + step / 900) * (metric === 'acc' ? 0.4 : 0.004) * Math.exp(-step / 6000);
  return metric === 'acc'
    ? final - 40 * Math.exp(-step / 1800) + wiggle
    : final + 1.6 * Math.exp(-step / 1500) + wiggle;
}

function curve(names: SampleNames, metric: 'acc' | 'loss', k: number): Curve {
  const config = names.configs[k] ?? '';
  const finals = (metric === 'acc' ? ACC : LOSS)[k] ?? [];
  const seeds = SEEDS[k] ?? [];
  const runs = seeds.map((seed, s) => {
    const diverged = k === 2 && seed === '5';
    return {
      run: runId(config, seed),
      seed,
      values: STEPS.map((step): number | null => {
        if (diverged)
          return step >= DIVERGED_AT
            ? null
            : shape(metric, (finals[0] ?? 0) + (metric === 'acc' ? -1.5 : 0.05), step, s + 1);
        return shape(metric, finals[s] ?? 0, step, s + 1);
      }),
    };
  });
  const mean: (number | null)[] = [];
  const low: (number | null)[] = [];
  const high: (number | null)[] = [];
  const n: number[] = [];
  STEPS.forEach((_, i) => {
    const xs = runs.map((r) => r.values[i]).filter((v): v is number => v !== null && v !== undefined);
    const m = meanOf(xs);
    const half = ((T975[xs.length - 1] ?? 2.446912) * sdOf(xs)) / Math.sqrt(xs.length);
    mean.push(m);
    low.push(m - half);
    high.push(m + half);
    n.push(xs.length);
  });
  return {
    metric: metric === 'acc' ? names.acc : names.loss,
    config,
    steps: STEPS,
    mean,
    low,
    high,
    n,
    band: 't',
    level: 0.95,
    runs,
  };
}

interface Stats {
  readonly k: number;
  readonly p: number;
  readonly pAdjusted: number;
  readonly verdict: Comparison['verdict'];
  readonly t: number;
  readonly df: number;
  readonly low: number;
  readonly high: number;
  readonly u: number;
  readonly mwp: number;
  readonly perm: number;
  readonly g: readonly [number, number, number];
  readonly poi: number;
  readonly cliff: readonly [number, number | null, number | null];
  readonly sd: number;
  readonly mde: number;
  readonly seeds: number;
  readonly cautions: readonly string[];
  readonly cautionKinds: readonly CautionKind[];
}

function comparison(names: SampleNames, metric: 'acc' | 'loss', s: Stats): Comparison {
  const base = (metric === 'acc' ? ACC : LOSS)[0] ?? [];
  const cand = (metric === 'acc' ? ACC : LOSS)[s.k] ?? [];
  return {
    metric: metric === 'acc' ? names.acc : names.loss,
    goal: metric === 'acc' ? 'max' : 'min',
    summary: 'final',
    task: null,
    baseline: names.configs[0],
    candidate: names.configs[s.k] ?? '',
    step: 1000,
    n: { baseline: base.length, candidate: cand.length },
    mean: { baseline: meanOf(base), candidate: meanOf(cand) },
    sd: { baseline: sdOf(base), candidate: sdOf(cand) },
    diverged: { baseline: 0, candidate: s.k === 2 ? 1 : 0 },
    failures: {
      baseline: { runs: base.length, diverged: 0, short: 0 },
      candidate: { runs: cand.length + (s.k === 2 ? 1 : 0), diverged: s.k === 2 ? 1 : 0, short: 0 },
      // scipy.stats.fisher_exact([[0, 7], [1, 5]]).pvalue (7 baseline runs, 1 of 6 candidate runs diverged)
      fisherP: s.k === 2 ? 0.46153846153846156 : null,
    },
    difference: {
      estimate: meanOf(cand) - meanOf(base),
      low: s.low,
      high: s.high,
      level: 0.95,
      method: 'welch-t',
      simultaneous: null,
      bca: null,
    },
    tests: {
      welch: { statistic: s.t, df: s.df, p: s.p },
      permutation: { p: s.perm, exact: true },
      mannWhitney: { u: s.u, p: s.mwp, exact: true },
    },
    primary: 'welch',
    p: s.p,
    pAdjusted: s.pAdjusted,
    family: { scope: 'study', correction: 'holm', size: 2 },
    verdict: s.verdict,
    nonInferiority: null,
    effect: {
      hedgesG: s.g[0],
      hedgesGLow: s.g[1],
      hedgesGHigh: s.g[2],
      probabilityOfImprovement: s.poi,
      cliffsDelta: s.cliff[0],
      cliffsDeltaLow: s.cliff[1],
      cliffsDeltaHigh: s.cliff[2],
    },
    timeToEvent: null,
    detectable: { sd: s.sd, minimumEffect: s.mde },
    runs: [],
    cautions: s.cautions,
    cautionKinds: s.cautionKinds,
  };
}

function comparisons(names: SampleNames): Comparison[] {
  return [
    // METHODS.md check values (scipy 1.10.1); Holm over [0.04418, 0.61736] gives 0.08836.
    comparison(names, 'acc', {
      k: 1,
      p: 0.04418107272139468,
      pAdjusted: 0.08836214544278936,
      verdict: 'inconclusive',
      t: 2.4022431408862186,
      df: 7.701328923514923,
      low: 0.057502837562101,
      high: 3.371068591009343,
      u: 30,
      mwp: 0.04797979797979798,
      perm: 0.03409090909090909,
      g: [1.341293840469836, 0.922745608053087 * 0.11761377366, 0.922745608053087 * 2.73461003886],
      poi: 0.857142857,
      cliff: [0.714285714, 0.00061319297, 0.94588140903],
      sd: 1.1793460657742232,
      mde: 2.1476019914742936,
      seeds: 9,
      cautions: [
        'Unequal seeds: 7 v 5.',
        'The raw Welch p (0.044) is below alpha, but not after Holm adjustment across 2 comparisons.',
      ],
      cautionKinds: ['unequal-seeds', 'fragile'],
    }),
    // scipy 1.10.1 on ACC[2] vs ACC[0].
    comparison(names, 'acc', {
      k: 2,
      p: 0.6173640209017746,
      pAdjusted: 0.6173640209017746,
      verdict: 'inconclusive',
      t: 0.5207434868189361,
      df: 7.603678822404129,
      low: -1.0901916020789266,
      high: 1.71876303065036,
      u: 16,
      mwp: 0.7878787878787878,
      perm: 0.6545454545454545,
      g: [0.2803170833383496, -0.8571454896173195, 1.402649580012194],
      poi: 0.5714285714285714,
      cliff: [0.14285714285714285, -0.5642702806923995, 0.7290789562510095],
      sd: 1.024617621281845,
      mde: 2.022735440761849,
      seeds: 168,
      cautions: [
        '1 diverged run in the candidate was excluded.',
        'Only 4 runs in the candidate: a verdict at this size is fragile.',
      ],
      cautionKinds: ['failed-runs', 'few-seeds'],
    }),
    // scipy 1.10.1 on LOSS[1] vs LOSS[0]; Holm over [1.027e-5, 0.00523].
    comparison(names, 'loss', {
      k: 1,
      p: 1.0272110054866625e-5,
      pAdjusted: 2.054422010973325e-5,
      verdict: 'better',
      t: -8.644678755465566,
      df: 9.201768650110091,
      low: -0.04823498746988066,
      high: -0.028279298244404984,
      u: 0,
      mwp: 0.0025252525252525255,
      perm: 0.0012626262626262627,
      g: [-4.60346403662327, -6.830701776512876, -2.3294193450973006],
      poi: 1,
      cliff: [-1, null, null],
      sd: 0.0076684883963995245,
      mde: 0.01396440063663041,
      seeds: 3,
      cautions: ['The goal of train_loss (lower is better) was guessed from its name.'],
      cautionKinds: ['goal-guessed'],
    }),
    comparison(names, 'loss', {
      k: 2,
      p: 0.0052297150629260535,
      pAdjusted: 0.0052297150629260535,
      verdict: 'worse',
      t: 3.7363959077952074,
      df: 8.423857994851824,
      low: 0.0058783119137788865,
      high: 0.024407402371935363,
      u: 27,
      mwp: 0.012121212121212121,
      perm: 0.012121212121212121,
      g: [1.9255556348845646, 0.46925443097242914, 3.317211790070218],
      poi: 0.0357142857142857,
      cliff: [0.9285714285714286, 0.2928319649748324, 0.9949969577656822],
      sd: 0.007186848659238169,
      mde: 0.014187823036115885,
      seeds: 5,
      cautions: ['1 diverged run in the candidate was excluded.'],
      cautionKinds: ['failed-runs'],
    }),
  ];
}

function runs(names: SampleNames): RunRecord[] {
  return names.configs.flatMap((config, k) =>
    (SEEDS[k] ?? []).map((seed): RunRecord => {
      const diverged = k === 2 && seed === '5';
      const file = `${names.path}/${config}/seed=${seed}/log.csv`;
      return {
        id: runId(config, seed),
        config,
        seed,
        params: { [names.key]: names.values[k] ?? '' },
        info: {},
        files: [file],
        identity: 'hive',
        status: diverged ? 'diverged' : 'ok',
        lastStep: diverged ? 5500 : 10000,
        divergedAt: diverged ? DIVERGED_AT : null,
        problems: diverged
          ? [`train_loss went non-finite at step ${DIVERGED_AT} and stayed so${names.problemText}`]
          : [],
      };
    }),
  );
}

function values(names: SampleNames): RunValue[] {
  const out: RunValue[] = [];
  for (const [metric, table] of [
    [names.acc, ACC],
    [names.loss, LOSS],
  ] as const) {
    names.configs.forEach((config, k) => {
      (SEEDS[k] ?? []).forEach((seed, s) => {
        const diverged = k === 2 && seed === '5';
        out.push({
          metric,
          summary: 'final',
          run: runId(config, seed),
          config,
          seed,
          value: diverged ? null : (table[k]?.[s] ?? null),
          step: 10000,
          loggedAt: diverged ? null : 10000,
          note: diverged ? `diverged at step ${DIVERGED_AT}: excluded` : null,
          usedInTests: !diverged,
        });
      });
    });
  }
  return out;
}

function configValues(names: SampleNames): ConfigValue[] {
  return (
    [
      [names.acc, ACC],
      [names.loss, LOSS],
    ] as const
  ).flatMap(([metric, table]) =>
    names.configs.map((config, k): ConfigValue => {
      const xs = table[k] ?? [];
      const half = ((T975[xs.length - 1] ?? 0) * sdOf(xs)) / Math.sqrt(xs.length);
      return {
        metric,
        summary: 'final',
        config,
        n: xs.length,
        missing: k === 2 ? 1 : 0,
        mean: meanOf(xs),
        low: meanOf(xs) - half,
        high: meanOf(xs) + half,
        level: 0.95,
        method: 't',
      };
    }),
  );
}

function ticks(names: SampleNames): TickCurve[] {
  return names.configs.map((config, k): TickCurve => {
    const mean = Array.from({ length: 8 }, (_, t) => 0.35 + (0.42 + 0.03 * k) * (1 - Math.exp(-(t + 1) / (2.2 + k))));
    return {
      metric: names.tick,
      config,
      step: 10000,
      ticks: mean.map((_, t) => t),
      mean,
      low: mean.map((m) => m - 0.02),
      high: mean.map((m) => m + 0.02),
      n: mean.map(() => (k === 2 ? 4 : (SEEDS[k] ?? []).length)),
      band: 't',
      exampleHalfWidth: mean.map((m) => Math.sqrt((m * (1 - m)) / 2000)),
      earliestGood: { tick: 4 + k, low: 3 + k, high: 5 + k, tolerance: 0.005 },
      versusBaseline:
        k === 0
          ? null
          : mean.map((m, t) => ({
              tick: t,
              difference: m - (mean[t] ?? 0) + 0.01 * k,
              pAdjusted: 0.2 / (t + 1),
              verdict: 'inconclusive' as const,
            })),
      diverged: k === 2 ? 1 : 0,
    };
  });
}

function halting(names: SampleNames): HaltingCurve[] {
  const thresholds = [0.5, 0.6, 0.7, 0.8, 0.9, 0.95];
  return names.configs.map(
    (config, k): HaltingCurve => ({
      config,
      thresholds,
      accuracy: thresholds.map((th) => ({
        mean: 0.55 + 0.3 * th + 0.02 * k,
        low: 0.53 + 0.3 * th + 0.02 * k,
        high: 0.57 + 0.3 * th + 0.02 * k,
      })),
      exitTick: thresholds.map((th) => ({
        mean: 1 + 6 * th ** 2 - 0.3 * k,
        low: 0.8 + 6 * th ** 2 - 0.3 * k,
        high: 1.2 + 6 * th ** 2 - 0.3 * k,
      })),
      seeds: k === 2 ? 4 : (SEEDS[k] ?? []).length,
      samples: 2000,
      ticks: 8,
      exitHistogram: {
        threshold: 0.8,
        counts: [40, 180, 420, 610, 380, 190, 110, 70].map((c) => c * (k === 0 ? 7 : k === 1 ? 5 : 4)),
      },
    }),
  );
}

function calibration(names: SampleNames): CalibrationCurve[] {
  return names.configs.map(
    (config, k): CalibrationCurve => ({
      config,
      bins: 10,
      seeds: k === 2 ? 4 : (SEEDS[k] ?? []).length,
      ece: Array.from({ length: 8 }, (_, t) => {
        const m = 0.02 + 0.12 * Math.exp(-t / 2.5) + 0.01 * k;
        return { tick: t, mean: m, low: m - 0.008, high: m + 0.008 };
      }),
      reliability: Array.from({ length: 10 }, (_, b) => {
        const mid = (b + 0.5) / 10;
        return b === 0
          ? { low: 0, high: 0.1, confidence: null, accuracy: null, count: 0 }
          : {
              low: b / 10,
              high: (b + 1) / 10,
              confidence: mid,
              accuracy: Math.min(1, mid - 0.04 + 0.01 * k),
              count: 100 * b,
            };
      }),
    }),
  );
}

function problems(names: SampleNames): Problem[] {
  const t = names.problemText;
  const c2 = names.configs[2];
  return [
    {
      severity: 'error',
      code: 'file-unreadable',
      message: `cannot parse ${names.path}/broken.csv: not a table${t}`,
      file: `${names.path}/broken.csv`,
    },
    {
      severity: 'warning',
      code: 'run-diverged',
      message: `train_loss went non-finite at step ${DIVERGED_AT} and stayed so${t}`,
      file: `${names.path}/${c2}/seed=5/log.csv`,
      run: runId(c2, '5'),
    },
    {
      severity: 'warning',
      code: 'row-malformed',
      message: `expected 4 fields, got 3${t}`,
      file: `${names.path}/${names.configs[1]}/seed=2/log.csv`,
      line: 42,
    },
    {
      severity: 'note',
      code: 'steps-duplicated',
      message: `3 steps logged twice (resumed run); the last row was kept${t}`,
      file: `${names.path}/${names.configs[0]}/seed=4/log.csv`,
      run: runId(names.configs[0], '4'),
    },
    { severity: 'note', code: 'goal-inferred', message: `${names.loss}: lower is better (guessed from the name)${t}` },
  ];
}

/** The sample `Results`; pass names to put other text (hostile text) in every name. */
export function sampleResults(names: SampleNames = SAMPLE_NAMES): Results {
  const configs: ConfigRecord[] = names.configs.map((id, k) => ({
    id,
    params: { [names.key]: names.values[k] ?? '' },
    seeds: [...(SEEDS[k] ?? [])],
    runs: (SEEDS[k] ?? []).length,
    diverged: k === 2 ? 1 : 0,
    short: 0,
  }));
  const metrics: MetricRecord[] = [
    {
      name: names.acc,
      goal: 'max',
      goalSource: 'option',
      kind: 'scalar',
      ticks: 0,
      horizon: 10000,
      firstStep: 0,
      lastStep: 10000,
    },
    {
      name: names.loss,
      goal: 'min',
      goalSource: 'inferred',
      kind: 'scalar',
      ticks: 0,
      horizon: 10000,
      firstStep: 0,
      lastStep: 10000,
    },
    {
      name: names.tick,
      goal: 'max',
      goalSource: 'inferred',
      kind: 'tick',
      ticks: 8,
      horizon: 10000,
      firstStep: 0,
      lastStep: 10000,
    },
  ];
  return {
    format: 'seedsift-results',
    version: 1,
    tool: { name: 'seedsift', version: '0.1.0' },
    generated: '2026-03-01T12:00:00.000Z',
    settings: fixtureSettings({ baseline: names.configs[0] }),
    inputs: { paths: [names.path], mode: 'logs', files: 18, filesRead: 17 },
    configs,
    metrics,
    setAside: [],
    runs: runs(names),
    values: values(names),
    configValues: configValues(names),
    comparisons: comparisons(names),
    curves: [0, 1, 2].flatMap((k) => [curve(names, 'acc', k), curve(names, 'loss', k)]),
    tasks: [],
    ticks: ticks(names),
    halting: halting(names),
    calibration: calibration(names),
    problems: problems(names),
  };
}

/** The sample with no tick metric, no halting and no calibration (a study without tick data). */
export function sampleResultsWithoutTicks(names: SampleNames = SAMPLE_NAMES): Results {
  const r = sampleResults(names);
  return { ...r, metrics: r.metrics.filter((m) => m.kind === 'scalar'), ticks: [], halting: [], calibration: [] };
}
