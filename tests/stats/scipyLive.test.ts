/**
 * Differential test against scipy on FRESH inputs: cases are drawn here with our seeded `Random`,
 * sent as JSON on stdin to Debian's /usr/bin/python3 running tests/reference/scipy_live.py
 * (python3-scipy; 1.10.1 on Debian 12), and scipy's answers (JSON on stdout) are compared with
 * src/stats. Unlike the committed fixture (scipyFixture.test.ts), the inputs are not frozen in a
 * file, so a change of seed here exercises new data.
 *
 * When /usr/bin/python3 cannot import scipy: with CI set the test fails (CI must install
 * python3-scipy; .ci/run does); otherwise it is skipped with a printed notice.
 *
 * Tolerances as in scipyFixture.test.ts: p-values and CDF values relative 1e-9 or absolute 1e-12;
 * statistics and df relative 1e-10 (absolute 1e-12 near 0).
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { ALTERNATIVES, type Alternative } from '../../src/stats/alternative.js';
import { mannWhitney } from '../../src/stats/mannWhitney.js';
import { noncentralTCdf } from '../../src/stats/noncentralT.js';
import { pairedT } from '../../src/stats/pairedT.js';
import { createRandom, deriveSeed, type Random } from '../../src/stats/random.js';
import { welch } from '../../src/stats/welch.js';

const PYTHON = '/usr/bin/python3';
const SCRIPT = fileURLToPath(new URL('../reference/scipy_live.py', import.meta.url));
const CASES_PER_FUNCTION = 30;

const probe = spawnSync(PYTHON, ['-c', 'import scipy; print(scipy.__version__)'], {
  encoding: 'utf8',
  timeout: 30_000,
});
const scipyVersion = probe.status === 0 ? probe.stdout.trim() : undefined;
const unavailable =
  scipyVersion === undefined
    ? `${PYTHON} cannot import scipy ` +
      `(${probe.error?.message ?? probe.stderr.trim().split('\n').pop() ?? 'unknown error'}); ` +
      'install Debian python3-scipy: apt-get install -y python3-scipy'
    : undefined;
const inCi = Boolean(process.env.CI);
if (unavailable !== undefined && !inCi) {
  console.warn(`NOTICE: scipyLive.test.ts skipped: ${unavailable}`);
}

type ByAlternative = Readonly<Record<Alternative, number>>;
type LiveCase =
  | { readonly fn: 'welch' | 'pairedT' | 'mannWhitney'; readonly x: number[]; readonly y: number[] }
  | { readonly fn: 'nctCdf'; readonly t: number; readonly df: number; readonly ncp: number };
interface TestAnswer {
  readonly statistic: number;
  readonly df: number;
  readonly p: ByAlternative;
}
interface MannWhitneyAnswer {
  readonly u: number;
  readonly asymptotic: ByAlternative;
  readonly asymptoticNoContinuity: ByAlternative;
}

/** Standard normal by Box-Muller from two uniforms (1 - next() is in (0, 1], so the log is finite). */
function normal(random: Random): number {
  return Math.sqrt(-2 * Math.log(1 - random.next())) * Math.cos(2 * Math.PI * random.next());
}

function group(random: Random, n: number, shape: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const z = normal(random);
    if (shape === 0)
      out.push(50 + 3 * z); // normal
    else if (shape === 1)
      out.push(5 * Math.exp(z)); // lognormal: skewed
    else out.push(Math.round(3 + 1.5 * z)); // integers: ties
  }
  return out;
}

const size = (random: Random): number => 2 + random.int(29); // 2 to 30

/** Fresh cases from our generator: 30 per function, sizes 2 to 30, normal, skewed and tied data. */
function drawCases(seed: number): LiveCase[] {
  const cases: LiveCase[] = [];
  const random = createRandom(deriveSeed(seed, 'scipyLive'));
  for (let i = 0; i < CASES_PER_FUNCTION; i++) {
    const shape = i % 3;
    const shift = [0, 1, 4][random.int(3)] as number;
    let x: number[];
    let y: number[];
    do {
      x = group(random, size(random), shape).map((v) => v + shift);
      y = group(random, size(random), shape);
    } while (spread(x) + spread(y) === 0);
    cases.push({ fn: 'welch', x, y });
    cases.push({
      fn: 'mannWhitney',
      x: group(random, size(random), shape),
      y: group(random, size(random), shape).map((v) => v + shift),
    });
    const n = size(random);
    const a = group(random, n, shape);
    let b: number[];
    do b = a.map((v) => (shape === 2 ? v + random.int(3) - 1 - shift : v - shift + 0.5 * normal(random)));
    while (spread(a.map((v, k) => v - (b[k] as number))) === 0);
    cases.push({ fn: 'pairedT', x: a, y: b });
    const ncp = -4 + 12 * random.next();
    cases.push({ fn: 'nctCdf', t: ncp + 3 * normal(random), df: 1 + 60 * random.next(), ncp });
  }
  return cases;
}

function spread(v: readonly number[]): number {
  return Math.max(...v) - Math.min(...v);
}

function askScipy(cases: readonly LiveCase[]): { scipy: string; results: unknown[] } {
  const run = spawnSync(PYTHON, [SCRIPT], {
    input: JSON.stringify({ cases }),
    encoding: 'utf8',
    timeout: 120_000,
    maxBuffer: 64 * 1024 * 1024,
  });
  if (run.status !== 0)
    throw new Error(`scipy_live.py failed (status ${run.status}): ${run.error?.message ?? run.stderr}`);
  return JSON.parse(run.stdout) as { scipy: string; results: unknown[] };
}

function expectClose(actual: number, expected: number, rel: number, abs: number, what: string): void {
  const error = Math.abs(actual - expected);
  expect(error, `${what}: got ${actual}, reference ${expected}`).toBeLessThanOrEqual(
    Math.max(rel * Math.abs(expected), abs),
  );
}
const expectP = (actual: number, expected: number, what: string): void =>
  expectClose(actual, expected, 1e-9, 1e-12, what);

describe.skipIf(unavailable !== undefined && !inCi)(
  `src/stats against live scipy ${scipyVersion ?? ''} (Debian python3-scipy, ${PYTHON})`,
  () => {
    it('can run scipy (required when CI is set)', () => {
      expect(unavailable, unavailable).toBeUndefined();
    });

    it(
      `agrees on ${CASES_PER_FUNCTION} fresh cases each of Welch, Mann-Whitney (asymptotic), paired t and the ` +
        `noncentral t CDF`,
      () => {
        expect(unavailable, unavailable).toBeUndefined();
        const cases = drawCases(20240611);
        const { results } = askScipy(cases);
        expect(results).toHaveLength(cases.length);
        const counted = { welch: 0, mannWhitney: 0, pairedT: 0, nctCdf: 0 };
        cases.forEach((c, k) => {
          const label = `case ${k} (${c.fn})`;
          counted[c.fn]++;
          if (c.fn === 'nctCdf') {
            expectP(
              noncentralTCdf(c.t, c.df, c.ncp),
              (results[k] as { cdf: number }).cdf,
              `${label} cdf(${c.t}, ${c.df}, ${c.ncp})`,
            );
            return;
          }
          if (c.fn === 'mannWhitney') {
            const answer = results[k] as MannWhitneyAnswer;
            for (const alternative of ALTERNATIVES) {
              const r = mannWhitney(c.x, c.y, { alternative, method: 'asymptotic' });
              expect(r.u, label).toBe(answer.u);
              expectP(r.p, answer.asymptotic[alternative], `${label} ${alternative}`);
              expectP(
                mannWhitney(c.x, c.y, { alternative, method: 'asymptotic', continuity: false }).p,
                answer.asymptoticNoContinuity[alternative],
                `${label} ${alternative} without continuity`,
              );
            }
            return;
          }
          const answer = results[k] as TestAnswer;
          for (const alternative of ALTERNATIVES) {
            const r = c.fn === 'welch' ? welch(c.x, c.y, { alternative }) : pairedT(c.x, c.y, { alternative });
            expectClose(r.statistic, answer.statistic, 1e-10, 1e-12, `${label} t`);
            expectClose(r.df, answer.df, 1e-10, 0, `${label} df`);
            expectP(r.p, answer.p[alternative], `${label} p ${alternative}`);
          }
        });
        expect(counted).toEqual({
          welch: CASES_PER_FUNCTION,
          mannWhitney: CASES_PER_FUNCTION,
          pairedT: CASES_PER_FUNCTION,
          nctCdf: CASES_PER_FUNCTION,
        });
      },
    );
  },
);
