/**
 * Monte Carlo calibration of seedsift's tests and intervals at 3 to 20 seeds per arm
 * (`npm run calibrate`; options: `npm run calibrate -- --help`).
 *
 * Prints two tables, each cell a Monte Carlo proportion with its standard error sqrt(p(1-p)/reps):
 * 1. type-I error of two-sided tests at alpha (0.05) when both arms come from distributions with
 *    equal means: Welch's t-test, the permutation test on the difference of means (exact while
 *    C(2n, n) <= 200,000, that is up to n = 10 with its 184,756 splits; random relabelings above),
 *    Mann-Whitney (auto: exact here, the data have no ties), and "the percentile bootstrap
 *    interval of the difference excludes 0";
 * 2. coverage of nominal 95% intervals for a mean: t-interval, percentile, expanded percentile,
 *    BCa and bootstrap-t, on normal and lognormal(0, 1) data.
 * Then a note compares every cell with METHODS.md's table (20,000 replications, B = 2,000).
 *
 * Deterministic: every cell draws its datasets from `deriveSeed(seed, cell)`, so all methods in a
 * cell see the same datasets, and each method resamples with its own derived generator.
 * The simulation functions are exported for tests/stats/calibration.test.ts (a reduced run).
 */
import { pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { bootstrapMean, bootstrapMeanDifference, type BootstrapMethod } from '../src/stats/bootstrap.js';
import { mannWhitney } from '../src/stats/mannWhitney.js';
import { permutationTest } from '../src/stats/permutation.js';
import { createRandom, deriveSeed, type Random } from '../src/stats/random.js';
import { tInterval } from '../src/stats/tInterval.js';
import { welch } from '../src/stats/welch.js';
import { differenceCoverage } from './differenceCoverage.js';

/** A Monte Carlo proportion: hits / trials with standard error sqrt(p (1 - p) / trials). */
export interface Proportion {
  readonly rate: number;
  readonly se: number;
  readonly trials: number;
  /** Replications on which the method threw (e.g. BCa with every resample equal); not in trials. */
  readonly errors: number;
}

function proportion(hits: number, trials: number, errors: number): Proportion {
  const rate = trials > 0 ? hits / trials : NaN;
  return { rate, se: Math.sqrt((rate * (1 - rate)) / trials), trials, errors };
}

/** Standard normal by Box-Muller (1 - next() is in (0, 1], so the logarithm is finite). */
export function standardNormal(random: Random): number {
  return Math.sqrt(-2 * Math.log(1 - random.next())) * Math.cos(2 * Math.PI * random.next());
}

export const DISTRIBUTIONS = {
  normal: { mean: 0, draw: (r: Random) => standardNormal(r) },
  'N(0,9)': { mean: 0, draw: (r: Random) => 3 * standardNormal(r) },
  lognormal: { mean: Math.exp(0.5), draw: (r: Random) => Math.exp(standardNormal(r)) },
} as const;
export type Distribution = keyof typeof DISTRIBUTIONS;

function sample(distribution: Distribution, n: number, random: Random): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = DISTRIBUTIONS[distribution].draw(random);
  return out;
}

// ---------------------------------------------------------------------------------------------
// Type-I error

export const SCENARIOS = {
  'N vs N': ['normal', 'normal'],
  'lognormal vs lognormal': ['lognormal', 'lognormal'],
  'N(0,1) vs N(0,9)': ['normal', 'N(0,9)'],
} as const satisfies Record<string, readonly [Distribution, Distribution]>;
export type Scenario = keyof typeof SCENARIOS;

export const TESTS = ['welch', 'permutation', 'mannWhitney', 'bootstrapExcludesZero'] as const;
export type TestName = (typeof TESTS)[number];

export interface SimulationOptions {
  readonly reps: number;
  readonly seed: number;
  /** Bootstrap resamples B per interval. */
  readonly resamples: number;
  /** Random relabelings when the permutation test cannot enumerate every split. */
  readonly permutationResamples: number;
  readonly alpha: number;
}

/** Rejection rate at `alpha` of each test (or of the listed ones) under the scenario's null, n per arm. */
export function typeIErrors(
  scenario: Scenario,
  n: number,
  opts: SimulationOptions,
  tests: readonly TestName[] = TESTS,
): Record<TestName, Proportion | undefined> {
  const [dx, dy] = SCENARIOS[scenario];
  const cell = `type-I/${scenario}/${n}`;
  const data = createRandom(deriveSeed(opts.seed, `${cell}/data`));
  const permutationRandom = createRandom(deriveSeed(opts.seed, `${cell}/permutation`));
  const bootstrapRandom = createRandom(deriveSeed(opts.seed, `${cell}/bootstrap`));
  const hits = { welch: 0, permutation: 0, mannWhitney: 0, bootstrapExcludesZero: 0 };
  const errors = { welch: 0, permutation: 0, mannWhitney: 0, bootstrapExcludesZero: 0 };
  const run: Record<TestName, (x: Float64Array, y: Float64Array) => boolean> = {
    welch: (x, y) => welch(x, y).p <= opts.alpha,
    permutation: (x, y) =>
      permutationTest(x, y, permutationRandom, { resamples: opts.permutationResamples }).p <= opts.alpha,
    mannWhitney: (x, y) => mannWhitney(x, y).p <= opts.alpha,
    bootstrapExcludesZero: (x, y) => {
      const r = bootstrapMeanDifference(x, y, bootstrapRandom, {
        method: 'percentile',
        resamples: opts.resamples,
        level: 1 - opts.alpha,
      });
      return r.low > 0 || r.high < 0;
    },
  };
  for (let rep = 0; rep < opts.reps; rep++) {
    const x = sample(dx, n, data);
    const y = sample(dy, n, data);
    for (const test of tests) {
      try {
        if (run[test](x, y)) hits[test]++;
      } catch (error) {
        if (!(error instanceof RangeError)) throw error;
        errors[test]++;
      }
    }
  }
  const out: Record<TestName, Proportion | undefined> = {
    welch: undefined,
    permutation: undefined,
    mannWhitney: undefined,
    bootstrapExcludesZero: undefined,
  };
  for (const test of tests) out[test] = proportion(hits[test], opts.reps - errors[test], errors[test]);
  return out;
}

// ---------------------------------------------------------------------------------------------
// Coverage of intervals for a mean

export const INTERVALS = ['t', 'percentile', 'expanded-percentile', 'bca', 'bootstrap-t'] as const;
export type IntervalName = (typeof INTERVALS)[number];

export interface CoverageResult extends Proportion {
  /** Fraction of intervals with an infinite end (bootstrap-t at n = 3). */
  readonly infinite: number;
  /** Median width of the finite intervals (NaN when none is finite). */
  readonly medianWidth: number;
}

/** Coverage of the true mean by nominal `level` intervals from n values of the distribution. */
export function coverage(
  distribution: Distribution,
  n: number,
  opts: SimulationOptions & { readonly level?: number },
  intervals: readonly IntervalName[] = INTERVALS,
): Record<IntervalName, CoverageResult | undefined> {
  const level = opts.level ?? 0.95;
  const truth = DISTRIBUTIONS[distribution].mean;
  const cell = `coverage/${distribution}/${n}`;
  const data = createRandom(deriveSeed(opts.seed, `${cell}/data`));
  const out: Record<IntervalName, CoverageResult | undefined> = {
    t: undefined,
    percentile: undefined,
    'expanded-percentile': undefined,
    bca: undefined,
    'bootstrap-t': undefined,
  };
  const tallies = intervals.map((name) => ({
    name,
    random: createRandom(deriveSeed(opts.seed, `${cell}/${name}`)),
    hits: 0,
    errors: 0,
    infinite: 0,
    widths: [] as number[],
  }));
  for (let rep = 0; rep < opts.reps; rep++) {
    const x = sample(distribution, n, data);
    for (const tally of tallies) {
      let bounds: { low: number; high: number };
      try {
        bounds =
          tally.name === 't'
            ? tInterval(x, level)
            : bootstrapMean(x, tally.random, {
                method: tally.name as BootstrapMethod,
                resamples: opts.resamples,
                level,
              });
      } catch (error) {
        if (!(error instanceof RangeError)) throw error;
        tally.errors++;
        continue;
      }
      if (bounds.low <= truth && truth <= bounds.high) tally.hits++;
      if (Number.isFinite(bounds.low) && Number.isFinite(bounds.high)) tally.widths.push(bounds.high - bounds.low);
      else tally.infinite++;
    }
  }
  for (const t of tallies) {
    const trials = opts.reps - t.errors;
    out[t.name] = {
      ...proportion(t.hits, trials, t.errors),
      infinite: t.infinite / Math.max(1, trials),
      medianWidth: median(t.widths),
    };
  }
  return out;
}

function median(values: readonly number[]): number {
  if (values.length === 0) return NaN;
  const sorted = Float64Array.from(values).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1
    ? (sorted[mid] as number)
    : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

// ---------------------------------------------------------------------------------------------
// METHODS.md's table (Monte Carlo, 20,000 replications, B = 2,000), for the comparison note.

const METHODS_REPS = 20_000;
const METHODS_TYPE_I: Partial<Record<string, Partial<Record<TestName, number>>>> = {
  'N vs N/3': { welch: 0.036, mannWhitney: 0, permutation: 0, bootstrapExcludesZero: 0.195 },
  'N vs N/5': { welch: 0.046, mannWhitney: 0.034, permutation: 0.05, bootstrapExcludesZero: 0.125 },
  'lognormal vs lognormal/5': { welch: 0.02, mannWhitney: 0.032, permutation: 0.049, bootstrapExcludesZero: 0.133 },
  'N(0,1) vs N(0,9)/5': { welch: 0.052, mannWhitney: 0.046, permutation: 0.07, bootstrapExcludesZero: 0.146 },
  'N(0,1) vs N(0,9)/10': { welch: 0.053, mannWhitney: 0.06, permutation: 0.061, bootstrapExcludesZero: 0.093 },
};
const METHODS_COVERAGE: Partial<Record<string, Partial<Record<IntervalName, number>>>> = {
  'normal/3': { t: 0.949, percentile: 0.751, 'expanded-percentile': 0.752, bca: 0.723 },
  'normal/5': { t: 0.949, percentile: 0.838, 'expanded-percentile': 0.917, bca: 0.836, 'bootstrap-t': 0.948 },
  'normal/10': { t: 0.955, percentile: 0.908, 'expanded-percentile': 0.949, bca: 0.906, 'bootstrap-t': 0.954 },
  'normal/20': { t: 0.95, percentile: 0.929, 'expanded-percentile': 0.949, bca: 0.928, 'bootstrap-t': 0.951 },
  'lognormal/5': { t: 0.818, percentile: 0.718, 'expanded-percentile': 0.809, bca: 0.738, 'bootstrap-t': 0.893 },
  'lognormal/20': { t: 0.866, percentile: 0.854, 'expanded-percentile': 0.878, bca: 0.872, 'bootstrap-t': 0.92 },
};

interface Comparison {
  readonly where: string;
  readonly ours: Proportion;
  readonly methods: number;
  readonly z: number;
}

function compare(where: string, ours: Proportion | undefined, methods: number | undefined, into: Comparison[]): void {
  if (ours === undefined || methods === undefined || !(ours.trials > 0)) return;
  const se = Math.sqrt(ours.se ** 2 + (methods * (1 - methods)) / METHODS_REPS);
  into.push({ where, ours, methods, z: se > 0 ? (ours.rate - methods) / se : ours.rate === methods ? 0 : Infinity });
}

// ---------------------------------------------------------------------------------------------
// Printing

const fmt = (p: Proportion | undefined): string =>
  p === undefined || !(p.trials > 0)
    ? '-'
    : `${p.rate.toFixed(3)} ±${p.se.toFixed(3)}${p.errors > 0 ? ` (${p.errors} failed)` : ''}`;

function table(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, k) => Math.max(h.length, ...rows.map((r) => (r[k] ?? '').length)));
  const line = (cells: readonly string[]): string =>
    cells
      .map((c, k) => c.padEnd(widths[k] as number))
      .join('  ')
      .trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n');
}

const HELP = `npm run calibrate -- [options]
  --reps N                   replications per cell (default 4000)
  --resamples B              bootstrap resamples per interval (default 1000)
  --permutation-resamples M  random relabelings when a permutation test cannot enumerate (default 2000)
  --sizes LIST               seeds per arm (default 3,5,10,20)
  --seed S                   seed (default 1)
  --only WHAT                type-i, coverage, difference or both (default both: all three)`;

function main(argv: readonly string[]): void {
  const { values } = parseArgs({
    args: [...argv],
    options: {
      reps: { type: 'string', default: '4000' },
      resamples: { type: 'string', default: '1000' },
      'permutation-resamples': { type: 'string', default: '2000' },
      sizes: { type: 'string', default: '3,5,10,20' },
      seed: { type: 'string', default: '1' },
      only: { type: 'string', default: 'both' },
      help: { type: 'boolean', default: false },
    },
  });
  if (values.help) {
    console.log(HELP);
    return;
  }
  const integer = (name: string, text: string, min: number): number => {
    const v = Number(text);
    if (!Number.isInteger(v) || v < min) throw new RangeError(`--${name}: expected an integer >= ${min}, got ${text}`);
    return v;
  };
  const opts: SimulationOptions = {
    reps: integer('reps', values.reps, 1),
    resamples: integer('resamples', values.resamples, 10),
    permutationResamples: integer('permutation-resamples', values['permutation-resamples'], 1),
    seed: integer('seed', values.seed, -(2 ** 31)),
    alpha: 0.05,
  };
  const sizes = values.sizes.split(',').map((s) => integer('sizes', s.trim(), 2));
  const only = values.only;
  if (!['type-i', 'coverage', 'difference', 'both'].includes(only))
    throw new RangeError(`--only: expected type-i, coverage, difference or both, got ${only}`);
  const started = performance.now();
  console.log(
    `seedsift calibration: ${opts.reps} replications per cell, B = ${opts.resamples} bootstrap resamples, ` +
      `${opts.permutationResamples} random relabelings when a permutation test cannot enumerate, seed ${opts.seed}.`,
  );
  console.log('Each cell: Monte Carlo proportion ± its standard error sqrt(p(1-p)/reps).\n');
  const comparisons: Comparison[] = [];

  if (only === 'both' || only === 'difference') {
    console.log('Coverage of nominal 95% intervals for a difference of means (n v n seeds, equal means)');
    const rows: string[][] = [];
    for (const distribution of ['normal', 'lognormal'] as const) {
      for (const n of [10, 20, 30]) {
        const r = differenceCoverage(distribution, n, opts);
        const welchOk = Math.abs(r['welch-t'].rate - 0.95) <= 0.015;
        rows.push([
          `${n} v ${n}`,
          distribution === 'lognormal' ? 'lognormal(0,1)' : 'normal',
          fmt(r['welch-t']),
          fmt(r.bca),
          distribution === 'normal' && n >= 20
            ? welchOk
              ? 'Welch within 0.95 ± 0.015'
              : 'Welch OUTSIDE 0.95 ± 0.015'
            : '',
        ]);
      }
    }
    console.log(table(['n', 'data', 'Welch t-interval', 'BCa bootstrap', 'target'], rows));
    console.log();
  }

  if (only === 'both' || only === 'type-i') {
    console.log(`Type-I error of two-sided tests at alpha = ${opts.alpha} (n seeds per arm, equal means)`);
    const rows: string[][] = [];
    for (const n of sizes) {
      for (const scenario of Object.keys(SCENARIOS) as Scenario[]) {
        const r = typeIErrors(scenario, n, opts);
        rows.push([String(n), scenario, ...TESTS.map((t) => fmt(r[t]))]);
        for (const t of TESTS)
          compare(`type-I ${scenario}, n = ${n}, ${t}`, r[t], METHODS_TYPE_I[`${scenario}/${n}`]?.[t], comparisons);
      }
    }
    console.log(table(['n', 'scenario', 'Welch t', 'permutation', 'Mann-Whitney', 'bootstrap CI excludes 0'], rows));
    console.log(
      `(permutation: exact while C(2n, n) <= 200,000, so up to n = 10; Monte Carlo with ` +
        `${opts.permutationResamples} relabelings above. ` +
        'Mann-Whitney: exact distribution, the data have no ties. Bootstrap: percentile interval of the difference, ' +
        'resampling within arms.)\n',
    );
  }

  if (only === 'both' || only === 'coverage') {
    console.log('Coverage of nominal 95% intervals for a mean');
    const rows: string[][] = [];
    for (const distribution of ['normal', 'lognormal'] as const) {
      for (const n of sizes) {
        const r = coverage(distribution, n, opts);
        const bt = r['bootstrap-t'];
        const extra = [
          bt !== undefined && bt.infinite > 0 ? `bootstrap-t infinite in ${(100 * bt.infinite).toFixed(1)}%` : '',
          bt !== undefined && r.t !== undefined && Number.isFinite(bt.medianWidth) && bt.infinite < 0.5
            ? `median width bootstrap-t / t ${(bt.medianWidth / r.t.medianWidth).toFixed(2)}`
            : '',
        ]
          .filter((s) => s !== '')
          .join('; ');
        rows.push([
          String(n),
          distribution === 'lognormal' ? 'lognormal(0,1)' : 'normal',
          ...INTERVALS.map((i) => fmt(r[i])),
          extra,
        ]);
        for (const i of INTERVALS) {
          if (!(i === 'bootstrap-t' && n === 3))
            compare(
              `coverage ${distribution}, n = ${n}, ${i}`,
              r[i],
              METHODS_COVERAGE[`${distribution}/${n}`]?.[i],
              comparisons,
            );
        }
      }
    }
    console.log(table(['n', 'data', 't-interval', 'percentile', 'expanded pct', 'BCa', 'bootstrap-t', 'note'], rows));
    console.log();
  }

  printNote(comparisons, opts);
  console.log(`\n(${((performance.now() - started) / 1000).toFixed(1)} s)`);
}

function printNote(comparisons: readonly Comparison[], opts: SimulationOptions): void {
  console.log(
    `Comparison with METHODS.md's table (${METHODS_REPS.toLocaleString('en')} replications, B = 2,000): ` +
      `${comparisons.length} cells in common.`,
  );
  if (comparisons.length === 0) return;
  const off = comparisons.filter((c) => Math.abs(c.z) > 3);
  const worst = comparisons.reduce((a, b) => (Math.abs(b.z) > Math.abs(a.z) ? b : a));
  console.log(
    `Largest difference: ${worst.where}: ${worst.ours.rate.toFixed(3)} here vs ${worst.methods.toFixed(3)} in ` +
      `METHODS.md (z = ${worst.z.toFixed(1)}).`,
  );
  if (off.length === 0) {
    console.log('Every common cell agrees within 3 combined Monte Carlo standard errors.');
  } else {
    console.log(`${off.length} cells differ by more than 3 combined Monte Carlo standard errors:`);
    for (const c of off)
      console.log(
        `  ${c.where}: ${c.ours.rate.toFixed(3)} ±${c.ours.se.toFixed(3)} vs ${c.methods.toFixed(3)} ` +
          `(z = ${c.z.toFixed(1)})`,
      );
  }
  if (opts.resamples !== 2000) {
    console.log(`Bootstrap cells here used B = ${opts.resamples} resamples, METHODS.md used B = 2,000.`);
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main(process.argv.slice(2));
}
