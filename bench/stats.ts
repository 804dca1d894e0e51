/**
 * How long the two most expensive statistics of a comparison take (`npx tsx bench/stats.ts`):
 * - a BCa bootstrap interval for the difference of means of two arms of 10, with 10,000 resamples
 *   (METHODS.md's default for intervals that decide something);
 * - the exact permutation test for 10 v 10, all C(20, 10) = 184,756 splits.
 * Each is run once to warm up, then `--runs` times (default 9); the median and the range are
 * printed in milliseconds. Inputs are fixed normal draws from a seeded generator.
 */
import { cpus } from 'node:os';
import { parseArgs } from 'node:util';
import { bootstrapMeanDifference } from '../src/stats/bootstrap.js';
import { permutationTest } from '../src/stats/permutation.js';
import { createRandom, type Random } from '../src/stats/random.js';

function normal(random: Random): number {
  return Math.sqrt(-2 * Math.log(1 - random.next())) * Math.cos(2 * Math.PI * random.next());
}

function arm(random: Random, n: number, centre: number): Float64Array {
  return Float64Array.from({ length: n }, () => centre + 1.5 * normal(random));
}

/** Milliseconds of each of `runs` timed calls, after one warm-up call; also returns the last result. */
function time<T>(runs: number, work: () => T): { ms: number[]; last: T } {
  let last = work();
  const ms: number[] = [];
  for (let k = 0; k < runs; k++) {
    const start = performance.now();
    last = work();
    ms.push(performance.now() - start);
  }
  return { ms: ms.sort((a, b) => a - b), last };
}

const median = (sorted: readonly number[]): number => {
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1
    ? (sorted[mid] as number)
    : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
};

function report(label: string, ms: readonly number[], detail: string): void {
  const f = (v: number): string => v.toFixed(1);
  console.log(
    `${label}: median ${f(median(ms))} ms (min ${f(ms[0] as number)}, max ${f(ms[ms.length - 1] as number)}, ` +
      `${ms.length} runs)  ${detail}`,
  );
}

function main(argv: readonly string[]): void {
  const { values } = parseArgs({ args: [...argv], options: { runs: { type: 'string', default: '9' } } });
  const runs = Number(values.runs);
  if (!Number.isInteger(runs) || runs < 1)
    throw new RangeError(`--runs: expected a positive integer, got ${values.runs}`);
  const data = createRandom(2024);
  const x = arm(data, 10, 71.5);
  const y = arm(data, 10, 70);
  console.log(`seedsift stats timings: Node ${process.version}, ${cpus()[0]?.model ?? 'unknown CPU'}`);

  const bca = time(runs, () => bootstrapMeanDifference(x, y, createRandom(1), { method: 'bca', resamples: 10_000 }));
  const b = bca.last;
  report(
    'BCa interval, 10 v 10, 10,000 resamples',
    bca.ms,
    `[${b.low.toFixed(3)}, ${b.high.toFixed(3)}] for difference ${b.estimate.toFixed(3)}`,
  );

  const permutation = time(runs, () => permutationTest(x, y, createRandom(1)));
  const p = permutation.last;
  report(
    'exact permutation test, 10 v 10',
    permutation.ms,
    `${p.splits.toLocaleString('en')} splits, exact ${p.exact}, p = ${p.p.toPrecision(4)}`,
  );
}

main(process.argv.slice(2));
