/**
 * The bad-input corpus (tests/fixtures/bad/: committed cases, plus the ones make.ts writes at test
 * time) through the command line, as a user meets it: `seedsift scan CASE --json -` and
 * `seedsift report CASE --json FILE`. Each case either gives exit 0 with a problem that names the
 * file (and the line, where the file has lines), or exit 2 with one line on stderr and no stack
 * trace; never exit 70; and nothing is lost without a listed problem (noSilentLoss.ts).
 *
 * What each case must produce is the policy of DESIGN.md "Messy logs" and README "What seedsift
 * does with bad input" (every excluded run, row or file is a coded problem); the line numbers are
 * counted by hand in the fixture texts.
 */
import { execFile } from 'node:child_process';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Results } from '../../src/analysis/results.js';
import { run } from '../../src/cli/program.js';
import { ingest } from '../../src/ingest/ingest.js';
import type { RunSet } from '../../src/ingest/types.js';
import type { Problem, ProblemCode } from '../../src/problems.js';
import { makeBadCases, type Unmade } from '../fixtures/bad/make.js';
import { silentLosses, type LossView } from '../fixtures/bad/noSilentLoss.js';
import { none } from '../fixtures/ingest/tree.js';
import { memoryIo } from '../cli/memoryIo.js';

/** The committed corpus, as a path relative to the working directory (so problems name short paths). */
const BAD = relative(process.cwd(), fileURLToPath(new URL('../fixtures/bad', import.meta.url)));
let generated = '';
let unmade: Unmade[] = [];
const out = mkdtempSync(join(tmpdir(), 'seedsift-bad-out-'));

beforeAll(async () => {
  generated = mkdtempSync(join(tmpdir(), 'seedsift-bad-'));
  unmade = await makeBadCases(generated);
  for (const u of unmade)
    console.log(
      `bad-input case ${u.name}: ${u.reason}; ${u.needsOrdinaryUser === true ? `runs as uid ${NOBODY}` : 'fails'}`,
    );
  // The cases that need an ordinary user run in a child process as `nobody`, which must reach them.
  if (unmade.some((u) => u.needsOrdinaryUser === true)) {
    chmodSync(generated, 0o755);
    chmodSync(out, 0o777);
  }
});
afterAll(() => {
  rmSync(generated, { recursive: true, force: true });
  rmSync(out, { recursive: true, force: true });
});

interface Expected {
  readonly code: ProblemCode;
  /** Path relative to the case folder ('' for the case folder itself). */
  readonly file: string;
  /** The line; `null` when the problem must have none (Parquet rows, whole files). */
  readonly line?: number | null;
  readonly message?: RegExp;
  readonly run?: string;
}

interface Case {
  readonly name: string;
  readonly generated?: true;
  /** Extra options; `{case}` stands for the case's folder. */
  readonly args?: readonly string[];
  readonly expect: readonly Expected[];
  /** Statuses of runs (by id) that must be as given. */
  readonly runs?: Readonly<Record<string, string>>;
}

const CASES: readonly Case[] = [
  {
    name: 'empty-file',
    expect: [{ code: 'file-empty', file: 'seed=1/log.csv', line: null, message: /empty \(0 bytes\)/ }],
    runs: { 'seed=2': 'ok' },
  },
  {
    name: 'header-only',
    expect: [{ code: 'file-empty', file: 'seed=1/log.csv', line: null, message: /header but no data rows/ }],
    runs: { 'seed=2': 'ok' },
  },
  { name: 'blank-lines', expect: [{ code: 'file-empty', file: 'seed=1/log.csv', message: /only blank lines/ }] },
  {
    name: 'ragged-short-row',
    expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 3, message: /missing columns/ }],
    runs: { 'seed=1': 'ok' },
  },
  {
    name: 'ragged-long-row',
    expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 4, message: /too many columns/ }],
  },
  {
    name: 'unterminated-quote',
    expect: [
      { code: 'row-malformed', file: 'seed=1/log.csv', line: 3, message: /unterminated quote.*spans lines 3 to 5/ },
    ],
  },
  { name: 'bom', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 4 }], runs: { 'seed=1': 'ok' } },
  { name: 'crlf', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 4 }] },
  { name: 'cr-only', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 3 }] },
  { name: 'mixed-delimiters-txt', expect: [{ code: 'row-malformed', file: 'seed=1/log.txt', line: 3 }] },
  { name: 'mixed-delimiters-csv', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 3 }] },
  { name: 'latin1-bytes', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 3, message: /not utf-8/ }] },
  { name: 'nul-bytes-tail', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 4 }] },
  { name: 'duplicate-columns', expect: [{ code: 'column-duplicated', file: 'seed=1/log.csv', message: /loss/ }] },
  { name: 'step-text', expect: [{ code: 'step-invalid', file: 'seed=1/log.csv', line: 3, run: 'seed=1' }] },
  { name: 'step-empty', expect: [{ code: 'step-invalid', file: 'seed=1/log.csv', line: 3 }] },
  {
    name: 'step-not-finite',
    expect: [{ code: 'step-invalid', file: 'seed=1/log.csv', line: 3, message: /^2 row\(s\).*\(lines 3, 4\)$/ }],
  },
  {
    name: 'all-nan-metric',
    expect: [
      // Never finite is not a divergence (that needs a finite stretch first): the metric is empty.
      { code: 'metric-empty', file: 'seed=1/log.csv', message: /loss has no finite value/ },
      { code: 'cells-missing', file: 'seed=1/log.csv', message: /loss 3 \(3 nan\/inf\)/ },
    ],
    runs: { 'seed=1': 'ok' },
  },
  {
    name: 'all-empty-metric',
    expect: [{ code: 'column-not-numeric', file: 'seed=1/log.csv', message: /column loss/ }],
  },
  {
    name: 'text-metric-column',
    expect: [{ code: 'column-not-numeric', file: 'seed=1/log.csv', message: /column phase/ }],
  },
  {
    name: 'text-cells',
    expect: [{ code: 'cells-missing', file: 'seed=1/log.csv', message: /loss 2 \(2 not a number\)/ }],
  },
  {
    name: 'duplicate-steps',
    expect: [{ code: 'steps-duplicated', file: 'seed=1/log.csv', line: 5, message: /^2 step\(s\)/ }],
  },
  { name: 'unsorted-steps', expect: [{ code: 'steps-unsorted', file: 'seed=1/log.csv', line: 4 }] },
  {
    name: 'no-step-column',
    expect: [{ code: 'step-column-missing', file: 'seed=1/log.csv', line: null }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'step-only',
    expect: [{ code: 'metric-empty', file: 'seed=1/log.csv', run: 'seed=1' }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'no-logs',
    expect: [
      { code: 'no-logs', file: '' },
      { code: 'file-skipped', file: 'notes.md' },
      { code: 'file-skipped', file: 'model.pt' },
    ],
  },
  {
    name: 'hidden-only',
    expect: [
      { code: 'file-skipped', file: 'seed=1/.log.csv', message: /hidden/ },
      { code: 'no-logs', file: '' },
    ],
  },
  {
    name: 'not-gzip',
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv.gz', message: /gzip/ }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'whitespace-ragged',
    expect: [{ code: 'row-malformed', file: 'seed=1/log.txt', line: 3, message: /3 whitespace-separated fields/ }],
  },
  { name: 'quoted-newline', expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 4 }] },
  {
    name: 'bad-params-json',
    expect: [{ code: 'file-unreadable', file: 'seed=1/params.json', line: 3 }],
    runs: { 'seed=1': 'ok' },
  },
  {
    name: 'params-mismatch',
    expect: [{ code: 'params-mismatch', file: 'lr=0.1/seed=1/params.json', line: 1, message: /lr=0\.2.*lr=0\.1/ }],
  },
  {
    name: 'manifest-missing-files',
    args: ['--manifest', '{case}/runs.csv'],
    expect: [
      { code: 'manifest-file-missing', file: 'runs.csv', line: 3, message: /missing\.csv/ },
      { code: 'manifest-invalid', file: 'runs.csv', line: 4 },
    ],
    runs: { 'lr=0.1,seed=1': 'ok' },
  },
  {
    name: 'seed-column-empty',
    args: ['--seed-column', 'seed'],
    expect: [{ code: 'seed-missing', file: 'log.csv', line: 3 }],
    runs: { 'seed=1': 'ok', 'seed=2': 'ok' },
  },
  {
    name: 'two-files-one-run',
    expect: [
      { code: 'run-duplicate', file: 'seed=1/b.csv', run: 'seed=1' },
      { code: 'steps-duplicated', file: 'seed=1/b.csv', line: 2, run: 'seed=1', message: /step 2/ },
    ],
  },
  {
    name: 'tick-dump-incomplete',
    expect: [{ code: 'tick-dump-invalid', file: 'seed=1/dump.csv', message: /certainty/ }],
  },
  // Cases that must read cleanly: no warning or error, the values checked below.
  { name: 'negative-steps', expect: [], runs: { 'seed=1': 'ok' } },
  { name: 'fractional-steps', expect: [], runs: { 'seed=1': 'ok' } },
  // The longest run is never short of itself; the two files hold the same numbers, which the copy check reports.
  {
    name: 'negative-last-step',
    expect: [{ code: 'series-identical', file: 'seed=2/log.csv', run: 'seed=2' }],
    runs: { 'seed=1': 'ok', 'seed=2': 'ok' },
  },
  { name: 'long-numbers', expect: [], runs: { 'seed=1': 'ok' } },
  {
    name: 'hive-name-collision',
    // The two files hold the same numbers: the copy check reports the second.
    expect: [{ code: 'series-identical', file: 'file_index=3/seed=1/log.csv', run: 'file_index=3,seed=1' }],
    runs: { 'c0=5,seed=1': 'ok', 'file_index=3,seed=1': 'ok' },
  },
  // Generated by make.ts.
  {
    name: 'one-line-5mb',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv', line: null, message: /first line has \d+ fields/ }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'long-row-5mb',
    generated: true,
    expect: [{ code: 'row-malformed', file: 'seed=1/log.csv', line: 3, message: /line size/ }],
    runs: { 'seed=1': 'ok' },
  },
  {
    name: 'binary-junk',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv', message: /binary data/ }],
    runs: { 'seed=1': 'rejected', 'seed=2': 'ok' },
  },
  {
    name: 'truncated-gzip',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv.gz', message: /ends before its end marker/ }],
    runs: { 'seed=1': 'rejected', 'seed=2': 'ok' },
  },
  {
    name: 'damaged-gzip',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv.gz', message: /gzip/ }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'parquet-wrong-schema',
    generated: true,
    expect: [{ code: 'step-column-missing', file: 'seed=1/log.parquet', message: /columns: name, loss\)/ }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'parquet-step-text',
    generated: true,
    expect: [{ code: 'step-invalid', file: 'seed=1/log.parquet', line: null, message: /\(row 1, row 2\)$/ }],
    runs: { 'seed=1': 'rejected' },
  },
  {
    name: 'parquet-corrupt',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.parquet' }],
    runs: { 'seed=1': 'rejected' },
  },
  { name: 'parquet-in-hive-folders', generated: true, expect: [], runs: { 'ticks=8,seed=1': 'ok' } },
  {
    name: 'glob-characters-in-names',
    generated: true,
    expect: [{ code: 'run-duplicate', file: 'seed=1/logX.csv', run: 'seed=1' }],
    runs: { 'seed=1': 'ok', 'seed=2': 'ok', 'seed=3': 'ok' },
  },
  {
    name: 'symlink-loop',
    generated: true,
    expect: [{ code: 'file-skipped', file: 'seed=1/up', message: /symbolic link loop/ }],
    runs: { 'seed=1': 'ok' },
  },
  {
    name: 'symlink-self',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv', message: /ELOOP/ }],
    runs: { 'seed=2': 'ok' },
  },
  {
    name: 'symlink-dangling',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv', message: /broken symbolic link/ }],
    runs: { 'seed=2': 'ok' },
  },
  {
    name: 'fifo',
    generated: true,
    expect: [{ code: 'file-skipped', file: 'seed=1/log.csv', message: /pipe/ }],
    runs: { 'seed=2': 'ok' },
  },
  {
    name: 'unreadable-permissions',
    generated: true,
    expect: [{ code: 'file-unreadable', file: 'seed=1/log.csv', message: /EACCES/ }],
    runs: { 'seed=1': 'rejected', 'seed=2': 'ok' },
  },
];

const casePath = (c: Case): string => (c.generated === true ? join(generated, c.name) : join(BAD, c.name));
const argsOf = (c: Case): string[] => (c.args ?? []).map((a) => a.replace('{case}', casePath(c)));

/** Fails with the list of problems when an expected one is missing. */
function expectProblems(problems: readonly Problem[], c: Case): void {
  const root = casePath(c);
  for (const e of c.expect) {
    const file = e.file === '' ? root : join(root, e.file);
    const hit = problems.find(
      (p) =>
        p.code === e.code &&
        p.file === file &&
        (e.line === undefined || (e.line === null ? p.line === undefined : p.line === e.line)) &&
        (e.run === undefined || p.run === e.run) &&
        (e.message === undefined || e.message.test(p.message)),
    );
    expect(
      hit,
      `${c.name}: expected ${JSON.stringify({ ...e, message: e.message?.source })}\namong ` +
        `${JSON.stringify(problems, null, 1)}`,
    ).toBeDefined();
  }
}

/** A clean case lists notes only (goal-inferred and the like), no warning or error. */
function expectNoWarnings(problems: readonly Problem[], c: Case): void {
  if (c.expect.length === 0)
    expect(
      problems.filter((p) => p.severity !== 'note'),
      c.name,
    ).toEqual([]);
}

/** The user id a case that needs an ordinary user runs as when the tests run as root (`nobody` on Debian). */
const NOBODY = 65534;
const SEEDSIFT = fileURLToPath(new URL('../../src/cli/seedsift.js', import.meta.url));

interface Outcome {
  readonly code: number;
  readonly out: string;
  readonly err: string;
}

/**
 * Run `seedsift ARGS` for case `c`: in-process as usual; a case make.ts could only make for an
 * ordinary user (`unreadable-permissions` under root, who reads a file whatever its mode) in a child
 * process with privileges dropped to `nobody`; any other case make.ts could not make fails with its
 * reason, so that no case counts as passed without having run.
 */
async function runCase(c: Case, args: readonly string[]): Promise<Outcome> {
  const u = unmade.find((x) => x.name === c.name);
  if (u === undefined) {
    const io = memoryIo();
    const code = await run([...args], io);
    return { code, out: io.out(), err: io.err() };
  }
  if (u.needsOrdinaryUser !== true) throw new Error(`bad-input case ${c.name} could not be made: ${u.reason}`);
  try {
    const { stdout, stderr } = await promisify(execFile)(process.execPath, [SEEDSIFT, ...args], {
      uid: NOBODY,
      gid: NOBODY,
      env: { ...process.env, SEEDSIFT_FROM_SOURCE: '1', HOME: tmpdir() },
      maxBuffer: 64 * 1024 * 1024,
    });
    return { code: 0, out: stdout, err: stderr };
  } catch (error) {
    const e = error as { code?: unknown; stdout?: string; stderr?: string; message: string };
    if (typeof e.code !== 'number')
      throw new Error(`bad-input case ${c.name}: could not run as uid ${NOBODY}: ${e.message}`);
    return { code: e.code, out: e.stdout ?? '', err: e.stderr ?? '' };
  }
}

describe('the bad-input corpus through seedsift scan --json -', () => {
  it.each(CASES.map((c) => [c.name, c] as const))(
    '%s',
    async (_name, c) => {
      const o = await runCase(c, ['scan', casePath(c), ...argsOf(c), '--json', '-']);
      expect(o.err, `${c.name}: stderr`).toBe('');
      expect(o.code).toBe(0);
      const scan = JSON.parse(o.out) as LossView & { problems: Problem[]; runs: { id: string; status: string }[] };
      expectProblems(scan.problems, c);
      expectNoWarnings(scan.problems, c);
      expect(silentLosses(scan), c.name).toEqual([]);
      for (const [id, status] of Object.entries(c.runs ?? {}))
        expect(scan.runs.find((r) => r.id === id)?.status, `${c.name}: run ${id}`).toBe(status);
    },
    60_000,
  ); // a case run as nobody starts a child process through tsx: 5 s or more on a loaded machine
});

describe('the bad-input corpus through seedsift report --json FILE', () => {
  it.each(CASES.map((c) => [c.name, c] as const))(
    '%s',
    async (_name, c) => {
      const file = join(out, `${c.name}.json`);
      const o = await runCase(c, ['report', casePath(c), ...argsOf(c), '--json', file]);
      expect(o.err, `${c.name}: stderr`).toBe('');
      expect(o.code).toBe(0);
      const results = JSON.parse(readFileSync(file, 'utf8')) as Results;
      expectProblems(results.problems, c);
      for (const r of results.runs)
        if (r.status !== 'ok')
          expect(
            r.problems.length + results.problems.filter((p) => p.file !== undefined && r.files.includes(p.file)).length,
            `${c.name}: run ${r.id}`,
          ).toBeGreaterThan(0);
      for (const [id, status] of Object.entries(c.runs ?? {}))
        expect(results.runs.find((r) => r.id === id)?.status, `${c.name}: run ${id}`).toBe(status);
    },
    60_000,
  );
});

describe('the whole corpus at once (committed and generated): still a report, nothing lost silently', () => {
  it('scan and report over every case together', async () => {
    const io = memoryIo();
    expect(await run(['scan', BAD, generated, '--json', '-'], io)).toBe(0);
    expect(io.err()).toBe('');
    const scan = JSON.parse(io.out()) as LossView;
    expect(silentLosses(scan)).toEqual([]);
    expect(scan.files.length).toBeGreaterThan(60);
    const report = memoryIo();
    const html = join(out, 'all.html');
    expect(
      await run(
        ['report', BAD, generated, '-o', html, '--json', join(out, 'all.json'), '--markdown', join(out, 'all.md')],
        report,
      ),
    ).toBe(0);
    expect(report.err()).toBe('');
    expect(readFileSync(html, 'utf8')).toMatch(/<\/html>\s*$/);
  });
});

describe('values of the cases that must read cleanly (checked against the fixture texts, parsed by hand)', () => {
  const series = async (dir: string): Promise<RunSet> => await ingest([dir], none);
  const pairs = (set: RunSet, id: string, metric: string): [number[], number[]] => {
    const s = set.runs.find((r) => r.id === id)?.metrics[metric];
    return [Array.from(s?.steps ?? []), Array.from(s?.values ?? [])];
  };

  it('negative and fractional steps are kept as they are', async () => {
    expect(pairs(await series(join(BAD, 'negative-steps')), 'seed=1', 'loss')).toEqual([
      [-20, -10, 0, 10],
      [0.9, 0.8, 0.7, 0.6],
    ]);
    expect(pairs(await series(join(BAD, 'fractional-steps')), 'seed=1', 'loss')).toEqual([
      [0.25, 0.5, 0.75, 1],
      [0.9, 0.8, 0.7, 0.6],
    ]);
  });

  it('long and extreme numbers equal what parseFloat makes of the same text (correct rounding, -0 kept)', async () => {
    const text = readFileSync(join(BAD, 'long-numbers/seed=1/log.csv'), 'utf8');
    const expected = text
      .trim()
      .split('\n')
      .slice(1)
      .map((line) => parseFloat(line.split(',')[1] as string));
    const [, values] = pairs(await series(join(BAD, 'long-numbers')), 'seed=1', 'loss');
    expect(values.length).toBe(expected.length);
    values.forEach((v, k) => {
      expect(Object.is(v, expected[k]), `row ${k + 1}: ${v} vs ${expected[k]}`).toBe(true);
    });
  });

  it('a BOM does not hide the step column; CRLF and CR line ends give the same rows', async () => {
    for (const name of ['bom', 'crlf'])
      expect(pairs(await series(join(BAD, name)), 'seed=1', 'loss'), name).toEqual([
        [1, 2, 4],
        [0.9, 0.8, 0.6],
      ]);
    expect(pairs(await series(join(BAD, 'cr-only')), 'seed=1', 'loss')).toEqual([
      [1, 3],
      [0.9, 0.7],
    ]);
  });

  it("folders named like the reader's own columns (c0=5, file_index=3) do not replace a column", async () => {
    const set = await series(join(BAD, 'hive-name-collision'));
    for (const id of ['c0=5,seed=1', 'file_index=3,seed=1'])
      expect(pairs(set, id, 'loss'), id).toEqual([
        [1, 2, 3],
        [0.9, 0.8, 0.7],
      ]);
  });

  it('a Parquet file under key=value folders gets no extra columns from them', async () => {
    const set = await series(join(generated, 'parquet-in-hive-folders'));
    expect(set.metrics.map((m) => m.name)).toEqual(['loss']);
    expect(pairs(set, 'ticks=8,seed=1', 'loss')).toEqual([
      [1, 2, 3],
      [0.9, 0.8, 0.7],
    ]);
  });

  it('file names with glob characters (log?.csv, log[1].csv, log*.csv) are read as themselves', async () => {
    const root = join(generated, 'glob-characters-in-names');
    const set = await series(root);
    expect(Object.fromEntries(set.files.map((f) => [f.file.slice(root.length + 1), f.rows]))).toEqual({
      'seed=1/log?.csv': 3,
      'seed=1/logX.csv': 2,
      'seed=2/log[1].csv': 5,
      'seed=3/log*.csv': 5,
    });
    for (const id of ['seed=1', 'seed=2', 'seed=3'])
      expect(pairs(set, id, 'loss'), id).toEqual([
        [1, 2, 3, 4, 5],
        [0.89, 0.88, 0.87, 0.86, 0.85],
      ]);
  });

  it('an intact gzip beside a truncated one is read in full', async () => {
    const set = await series(join(generated, 'truncated-gzip'));
    const [steps] = pairs(set, 'seed=2', 'loss');
    expect(steps.length).toBe(2000);
  });
});

interface UsageCase {
  readonly name: string;
  readonly argv: () => string[];
  /** What the one line must say (the option or the file at fault). */
  readonly says: RegExp;
}

const USAGE: readonly UsageCase[] = [
  {
    // A layout that matches no file at all stops (issue 14); one that misses some files is a problem per file.
    name: 'a --layout that matches no file',
    argv: () => ['scan', join(BAD, 'layout-matches-nothing'), '--layout', '{model}-{seed}/log.csv'],
    says: /--layout: '\{model\}-\{seed\}\/log\.csv' matches none of the 2 files found \(first: .*runA_1\/log\.csv\)/,
  },
  {
    name: 'a PATH that does not exist',
    argv: () => ['scan', join(BAD, 'does-not-exist')],
    says: /PATH: .*no such file or folder.*does-not-exist/,
  },
  {
    name: 'a malformed --layout',
    argv: () => ['scan', join(BAD, 'layout-matches-nothing'), '--layout', '{model}_{seed'],
    says: /--layout '\{model\}_\{seed'/,
  },
  {
    name: 'a manifest with no file column',
    argv: () => [
      'scan',
      join(BAD, 'manifest-no-file-column'),
      '--manifest',
      join(BAD, 'manifest-no-file-column/runs.csv'),
    ],
    says: /manifest: expected a column named file.*runs\.csv:1/,
  },
  {
    name: 'a manifest that does not exist',
    argv: () => ['scan', BAD, '--manifest', join(BAD, 'nope.csv')],
    says: /--manifest: .*no such file.*nope\.csv/,
  },
  {
    name: 'a score table that does not exist',
    argv: () => ['report', '--scores', join(BAD, 'nope.csv'), '--json', join(out, 'x.json')],
    says: /--scores: expected an existing file/,
  },
];

describe('input errors: exit 2, one line on stderr, no stack trace', () => {
  it.each(USAGE.map((u) => [u.name, u] as const))('%s', async (_name, u) => {
    for (const command of [
      u.argv(),
      u.argv()[0] === 'scan' ? ['report', ...u.argv().slice(1), '--json', join(out, 'y.json')] : null,
    ]) {
      if (command === null) continue;
      const io = memoryIo();
      expect(await run(command, io), command.join(' ')).toBe(2);
      expect(io.err()).toMatch(/^seedsift: [^\n]+\n$/);
      expect(io.err()).not.toMatch(/\bat .*:\d+/);
      expect(io.err()).toMatch(u.says);
    }
  });

  it('a score table that is a truncated gzip or empty is a problem, not an error', async () => {
    for (const [file, says] of [
      [join(generated, 'truncated-gzip/seed=1/log.csv.gz'), /ends before its end marker/],
      [join(BAD, 'empty-file/seed=1/log.csv'), /empty/],
    ] as const) {
      const io = memoryIo();
      const json = join(out, 'scores.json');
      expect(await run(['report', '--scores', file, '--json', json], io)).toBe(0);
      const results = JSON.parse(readFileSync(json, 'utf8')) as Results;
      expect(results.problems.find((p) => p.file === file)?.message).toMatch(says);
    }
  });
});
