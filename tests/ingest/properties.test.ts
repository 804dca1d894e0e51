/**
 * Property-based tests of ingest on random small studies (fast-check, seeded): random headers
 * (odd names, duplicates, empty names), random cells (numbers written every which way, very long
 * numbers, empty, nan/inf, text), random row orders with repeated steps, ragged and blank lines,
 * CRLF, BOM, gzip, and random folder names. Each study is written to disk, read with `ingest`, and
 * compared with an independent reading of the same bytes:
 *
 * - the fields come from csv-parse (not DuckDB, which ingest uses), and every number from
 *   `parseFloat` on a cell that is a decimal number (a strict pattern below); the values ingest
 *   keeps must equal those exactly (`Object.is`: -0 and the last bit count);
 * - the messy-log policies (DESIGN.md "Messy logs", the module comments of src/ingest/assemble/messy.ts and
 *   runs.ts) are re-derived here from those fields: last row wins on a repeated step, steps sorted,
 *   empty / nan / inf / text cells missing and counted, a run diverged when its last values are
 *   non-finite, rows with an unusable step dropped and counted, malformed rows rejected with their lines;
 * - nothing is lost silently (tests/fixtures/bad/noSilentLoss.ts), and every row of every file is
 *   accounted for: it reaches a series, or a problem counts it.
 *
 * Known difference, not generated: DuckDB reads digit separators (`1_000` is 1000), parseFloat does not.
 * Not a difference: a row with extra fields that are all empty (`1,0.5,`, a trailing delimiter) is
 * read as the row without them by DuckDB; nothing is lost, so the reading here does the same.
 */
import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { parse } from 'csv-parse/sync';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ingest } from '../../src/ingest/ingest.js';
import type { RunSet } from '../../src/ingest/types.js';
import { silentLosses } from '../fixtures/bad/noSilentLoss.js';
import { none } from '../fixtures/ingest/tree.js';

// ---------------------------------------------------------------------------------------------
// Generators

const STEP_COLUMNS = ['step', 'iteration', 'epoch'] as const;
/** Metric column names: odd on purpose; none is a step, seed, tick or sample name, none is `name@k`. */
const METRIC_NAMES = [
  'loss',
  'val acc',
  'ünï',
  'a,b',
  'q"uote',
  ' padded ',
  'padded',
  '123',
  '',
  '  ',
  'NaN',
  '-',
  'x@y',
  'col=1',
  '📈',
  'Loss',
  'loss',
] as const;
const CONFIG_VALUES = ['a', 'a b', 'ü', 'x,y', 'k=v', '-1', '0.10', '🙂'] as const;
const SEEDS = ['1', '2', '03'] as const;

const finiteCell = fc
  .tuple(
    fc.double({ noNaN: true, noDefaultInfinity: true }),
    fc.integer({ min: 0, max: 3 }),
    fc.integer({ min: 1, max: 21 }),
  )
  .map(([x, how, digits]) =>
    how === 0
      ? String(x)
      : how === 1
        ? x.toExponential(digits - 1)
        : how === 2
          ? x.toPrecision(digits)
          : x.toFixed(Math.min(digits, 20)),
  );
const longNumber = fc.stringMatching(/^-?\d{1,40}(\.\d{1,60})?([eE][+-]?\d{1,3})?$/);
const nonFinite = fc.constantFrom('nan', 'NaN', 'inf', '-inf', 'Infinity', '-INF', '1e400', '-1e999');
const textCell = fc.constantFrom(
  'abc',
  'n/a',
  '-',
  '1,5',
  '1e',
  '0x10',
  'Ø',
  'true',
  'FALSE',
  'null',
  '"quoted"',
  '.',
  '+',
  'e5',
  '1.2.3',
);
const emptyCell = fc.constantFrom('', ' ', '  ');
const cell = fc.oneof(
  { arbitrary: finiteCell, weight: 6 },
  { arbitrary: longNumber, weight: 1 },
  { arbitrary: nonFinite, weight: 1 },
  { arbitrary: textCell, weight: 1 },
  { arbitrary: emptyCell, weight: 2 },
  { arbitrary: finiteCell.map((s) => ` ${s} `), weight: 1 },
);
const stepCell = fc.oneof(
  { arbitrary: fc.integer({ min: -3, max: 12 }).map(String), weight: 12 },
  { arbitrary: fc.constantFrom('2.5', '0.5', '7.25', ' 4 ', '1e1'), weight: 1 },
  { arbitrary: fc.constantFrom('', 'x', 'nan', '1e400', '-inf'), weight: 1 },
);

type Line =
  | { readonly kind: 'row'; readonly cells: readonly string[] }
  | { readonly kind: 'blank' }
  | { readonly kind: 'spaces' };

interface GenFile {
  readonly cfg: string;
  readonly seed: string;
  readonly name: 'log.csv' | 'log2.csv' | 'log.csv.gz';
  /** Header cells as written (names before trimming and renaming). */
  readonly header: readonly string[];
  readonly stepAt: number;
  readonly lines: readonly Line[];
  readonly eol: '\n' | '\r\n';
  readonly bom: boolean;
  readonly finalEol: boolean;
  readonly quoteAll: boolean;
}

const genFile: fc.Arbitrary<GenFile> = fc
  .record({
    cfg: fc.constantFrom(...CONFIG_VALUES),
    seed: fc.constantFrom(...SEEDS),
    name: fc.constantFrom('log.csv', 'log2.csv', 'log.csv.gz'),
    step: fc.constantFrom(...STEP_COLUMNS),
    metrics: fc.array(fc.constantFrom(...METRIC_NAMES), { minLength: 1, maxLength: 4 }),
    stepAt: fc.nat(),
    eol: fc.constantFrom('\n' as const, '\r\n' as const),
    bom: fc.boolean(),
    finalEol: fc.boolean(),
    quoteAll: fc.boolean(),
    rowCount: fc.integer({ min: 0, max: 12 }),
  })
  .chain((g) => {
    const width = g.metrics.length + 1;
    const stepAt = g.stepAt % width;
    const header = [...g.metrics.slice(0, stepAt), g.step, ...g.metrics.slice(stepAt)];
    const row = fc
      .tuple(stepCell, fc.array(cell, { minLength: width - 1, maxLength: width - 1 }))
      .map(([s, cs]): Line => ({ kind: 'row', cells: [...cs.slice(0, stepAt), s, ...cs.slice(stepAt)] }));
    const ragged = fc
      .array(cell, { minLength: 1, maxLength: width + 2 })
      .filter((cs) => cs.length !== width)
      .map((cells): Line => ({ kind: 'row', cells }));
    const line = fc.oneof(
      { arbitrary: row, weight: 16 },
      { arbitrary: ragged, weight: 1 },
      { arbitrary: fc.constant<Line>({ kind: 'blank' }), weight: 1 },
      { arbitrary: fc.constant<Line>({ kind: 'spaces' }), weight: 1 },
    );
    return fc.array(line, { minLength: g.rowCount, maxLength: g.rowCount }).map(
      (lines): GenFile => ({
        cfg: g.cfg,
        seed: g.seed,
        name: g.name,
        header,
        stepAt,
        lines,
        eol: g.eol,
        bom: g.bom,
        finalEol: g.finalEol,
        quoteAll: g.quoteAll,
      }),
    );
  });

const pathOf = (f: GenFile): string => `cfg=${f.cfg}/seed=${f.seed}/${f.name}`;
const genStudy = fc.uniqueArray(genFile, { minLength: 1, maxLength: 4, selector: pathOf });

function fieldText(c: string, quoteAll: boolean): string {
  return quoteAll || /[",\r\n]/.test(c) ? `"${c.replaceAll('"', '""')}"` : c;
}

function fileText(f: GenFile): string {
  const lines = [f.header, ...f.lines.map((l) => (l.kind === 'row' ? l.cells : null))].map((cells, k) => {
    if (cells !== null) return cells.map((c) => fieldText(c, f.quoteAll)).join(',');
    const l = f.lines[k - 1] as Line;
    return l.kind === 'spaces' ? '  ' : '';
  });
  return (f.bom ? '\uFEFF' : '') + lines.join(f.eol) + (f.finalEol ? f.eol : '');
}

// ---------------------------------------------------------------------------------------------
// The independent reading

type Cell =
  | { readonly kind: 'finite'; readonly value: number }
  | { readonly kind: 'nonfinite' }
  | { readonly kind: 'empty' }
  | { readonly kind: 'text' };

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NAN_INF = /^[+-]?(nan|inf|infinity)$/i;

/** A cell as the README's policy reads it: a decimal number (parseFloat), nan/inf, true/false (1/0), empty, or text. */
function classify(raw: string): Cell {
  const t = raw.trim();
  if (t === '') return { kind: 'empty' };
  if (DECIMAL.test(t)) {
    const value = parseFloat(t);
    return Number.isFinite(value) ? { kind: 'finite', value } : { kind: 'nonfinite' };
  }
  if (NAN_INF.test(t)) return { kind: 'nonfinite' };
  if (/^true$/i.test(t)) return { kind: 'finite', value: 1 };
  if (/^false$/i.test(t)) return { kind: 'finite', value: 0 };
  return { kind: 'text' };
}

/** Column names as the README gives them: trimmed, empty ones `columnK`, repeats renamed `_2`, `_3`. */
function columnNames(raw: readonly string[]): string[] {
  const names = raw.map((n, k) => (n.trim() === '' ? `column${k + 1}` : n.trim()));
  const taken = new Set(names);
  const seen = new Set<string>();
  return names.map((n) => {
    if (!seen.has(n)) {
      seen.add(n);
      return n;
    }
    let k = 2;
    while (taken.has(`${n}_${k}`)) k++;
    taken.add(`${n}_${k}`);
    return `${n}_${k}`;
  });
}

interface RefRow {
  readonly line: number;
  readonly step: Cell;
  /** Metric name -> cell. */
  readonly cells: ReadonlyMap<string, Cell>;
}

interface RefFile {
  readonly path: string;
  /** Metric column names (every column but the step). */
  readonly metrics: readonly string[];
  readonly rows: readonly RefRow[];
  readonly malformedLines: readonly number[];
}

function readReference(f: GenFile, path: string): RefFile {
  const records = parse(fileText(f), {
    bom: true,
    relax_column_count: true,
    skip_empty_lines: true,
    info: true,
    record_delimiter: f.eol,
  }) as unknown as { record: string[]; info: { lines: number } }[];
  const [head, ...data] = records;
  const names = columnNames(head?.record ?? []);
  const stepName = names[f.stepAt] as string;
  const rows: RefRow[] = [];
  const malformedLines: number[] = [];
  for (const { record, info } of data) {
    // Extra fields that are empty (a trailing delimiter: `1,0.5,`) hold nothing; DuckDB ignores them, and so does this
    // reading.
    const extraEmpty = record.length > names.length && record.slice(names.length).every((c) => c === '');
    if (record.length !== names.length && !extraEmpty) {
      malformedLines.push(info.lines);
      continue;
    }
    const cells = new Map<string, Cell>();
    names.forEach((n, k) => {
      if (n !== stepName) cells.set(n, classify(record[k] as string));
    });
    rows.push({ line: info.lines, step: classify(record[f.stepAt] as string), cells });
  }
  return { path, metrics: names.filter((n) => n !== stepName), rows, malformedLines };
}

interface RefSeries {
  readonly steps: number[];
  readonly values: number[];
  readonly missing: number;
  readonly divergedAt: number | null;
  readonly duplicateSteps: number[];
}

/** One metric of one run under the policies of DESIGN.md "Messy logs" (see the module comment). */
function refSeries(rows: readonly RefRow[], name: string): RefSeries & { winners: Set<RefRow>; losers: Set<RefRow> } {
  const order = rows
    .map((r, k) => ({ r, k, step: (r.step as { value: number }).value }))
    .sort((a, b) => a.step - b.step || a.k - b.k);
  const logs = (r: RefRow): boolean => {
    const c = r.cells.get(name);
    return c !== undefined && (c.kind === 'finite' || c.kind === 'nonfinite');
  };
  let missing = 0;
  for (const r of rows) if (!logs(r) || r.cells.get(name)?.kind === 'nonfinite') missing++;
  const winners: RefRow[] = [];
  const duplicateSteps: number[] = [];
  const losers = new Set<RefRow>();
  for (let i = 0; i < order.length; ) {
    let j = i;
    while (j < order.length && (order[j] as { step: number }).step === (order[i] as { step: number }).step) j++;
    const logging = order.slice(i, j).filter((o) => logs(o.r));
    if (logging.length > 0) winners.push((logging[logging.length - 1] as { r: RefRow }).r);
    if (logging.length > 1) duplicateSteps.push((order[i] as { step: number }).step);
    for (const o of logging.slice(0, -1)) losers.add(o.r);
    i = j;
  }
  let end = winners.length;
  while (end > 0 && (winners[end - 1] as RefRow).cells.get(name)?.kind === 'nonfinite') end--;
  // A divergence needs a finite value before the non-finite tail (a never-finite metric is empty).
  const finiteBefore = winners.slice(0, end).some((w) => w.cells.get(name)?.kind === 'finite');
  const divergedAt =
    end < winners.length && finiteBefore ? ((winners[end] as RefRow).step as { value: number }).value : null;
  const finite = winners.filter((w) => w.cells.get(name)?.kind === 'finite');
  return {
    steps: finite.map((w) => (w.step as { value: number }).value),
    values: finite.map((w) => (w.cells.get(name) as { value: number }).value),
    missing,
    divergedAt,
    duplicateSteps,
    winners: new Set(finite),
    losers,
  };
}

interface RefRun {
  readonly id: string;
  readonly cfg: string;
  readonly files: readonly RefFile[];
  readonly rows: readonly RefRow[];
  readonly invalid: ReadonlyMap<string, RefRow[]>;
  readonly series: ReadonlyMap<string, ReturnType<typeof refSeries>>;
  readonly lastStep: number | null;
  readonly divergedAt: number | null;
  status: string;
}

function reference(root: string, study: readonly GenFile[]): { files: RefFile[]; runs: RefRun[] } {
  const files = study.map((f) => readReference(f, join(root, pathOf(f))));
  const used = files.filter((f) => f.rows.length + f.malformedLines.length > 0);
  // Study-wide: a metric is a column holding a number (finite, nan or inf) in some file.
  const numeric = new Set<string>();
  for (const f of used)
    for (const r of f.rows)
      for (const [n, c] of r.cells) if (c.kind === 'finite' || c.kind === 'nonfinite') numeric.add(n);
  const groups = new Map<string, { cfg: string; files: RefFile[] }>();
  study.forEach((g, k) => {
    const f = files[k] as RefFile;
    if (!used.includes(f)) return;
    const id = `cfg=${g.cfg},seed=${g.seed}`;
    const group = groups.get(id) ?? { cfg: g.cfg, files: [] };
    group.files.push(f);
    groups.set(id, group);
  });
  const runs: RefRun[] = [];
  for (const [id, group] of groups) {
    group.files.sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0)); // walk order within a folder
    const metricNames = [...new Set(group.files.flatMap((f) => f.metrics))].filter((n) => numeric.has(n));
    const invalid = new Map<string, RefRow[]>();
    const rows: RefRow[] = [];
    for (const f of group.files) {
      for (const r of f.rows) {
        if (r.step.kind !== 'finite') invalid.set(f.path, [...(invalid.get(f.path) ?? []), r]);
        else
          rows.push({
            ...r,
            cells: new Map(metricNames.map((n) => [n, r.cells.get(n) ?? { kind: 'empty' as const }])),
          });
      }
    }
    const series = new Map(metricNames.map((n) => [n, refSeries(rows, n)] as const));
    let lastStep: number | null = null;
    let divergedAt: number | null = null;
    for (const s of series.values()) {
      if (s.steps.length > 0) lastStep = Math.max(lastStep ?? -Infinity, s.steps[s.steps.length - 1] as number);
      if (s.divergedAt !== null) divergedAt = Math.min(divergedAt ?? Infinity, s.divergedAt);
    }
    const status = divergedAt !== null ? 'diverged' : lastStep === null ? 'rejected' : 'ok';
    runs.push({ id, cfg: group.cfg, files: group.files, rows, invalid, series, lastStep, divergedAt, status });
  }
  // A run is short when it ends before, and below 90% of, the longest run of its config that is not rejected.
  for (const r of runs) {
    const others = runs.filter((o) => o.cfg === r.cfg && o.status !== 'rejected').map((o) => o.lastStep ?? 0);
    const max = Math.max(...others);
    if (r.status === 'ok' && (r.lastStep as number) < max && (r.lastStep as number) < 0.9 * max) r.status = 'short';
  }
  return { files, runs };
}

// ---------------------------------------------------------------------------------------------
// The comparison

const same = (a: readonly number[], b: readonly number[]): boolean =>
  a.length === b.length && a.every((x, k) => Object.is(x, b[k]));

function compare(set: RunSet, ref: { files: RefFile[]; runs: RefRun[] }): void {
  expect(silentLosses(set)).toEqual([]);
  for (const f of ref.files) {
    const rec = set.files.find((r) => r.file === f.path);
    expect(rec, f.path).toBeDefined();
    expect(rec?.status, f.path).toBe('read');
    expect([rec?.rows, rec?.rejectedRows], `${f.path}: rows kept, rows rejected`).toEqual([
      f.rows.length,
      f.malformedLines.length,
    ]);
    const lines = set.problems.filter((p) => p.code === 'row-malformed' && p.file === f.path).map((p) => p.line);
    expect(lines, `${f.path}: lines of the malformed rows`).toEqual(f.malformedLines);
    if (f.rows.length + f.malformedLines.length === 0)
      expect(
        set.problems.some((p) => p.code === 'file-empty' && p.file === f.path),
        f.path,
      ).toBe(true);
  }
  expect(set.runs.map((r) => r.id).sort()).toEqual(ref.runs.map((r) => r.id).sort());
  for (const r of ref.runs) {
    const run = set.runs.find((x) => x.id === r.id);
    if (run === undefined) continue;
    const where = `run ${r.id}`;
    expect([run.status, run.lastStep, run.divergedAt], `${where}: status, lastStep, divergedAt`).toEqual([
      r.status,
      r.lastStep ?? 0,
      r.divergedAt,
    ]);
    expect(Object.keys(run.metrics).sort(), `${where}: metrics`).toEqual([...r.series.keys()].sort());
    const problemsOf = set.problems.filter((p) => p.run === r.id);
    for (const [name, s] of r.series) {
      const got = run.metrics[name];
      expect(got, `${where} ${name}`).toBeDefined();
      if (got === undefined) continue;
      expect(
        same(Array.from(got.steps), s.steps),
        `${where} ${name}: steps ${String(Array.from(got.steps))} vs ${String(s.steps)}`,
      ).toBe(true);
      expect(
        same(Array.from(got.values), s.values),
        `${where} ${name}: values ${String(Array.from(got.values))} vs ${String(s.values)}`,
      ).toBe(true);
      expect([got.missing, got.divergedAt], `${where} ${name}: missing, divergedAt`).toEqual([s.missing, s.divergedAt]);
      if (s.missing > 0)
        expect(
          problemsOf.some((p) => p.code === 'cells-missing' && p.message.includes(`${name} ${s.missing} (`)),
          `${where} ${name}: cells-missing ${s.missing}`,
        ).toBe(true);
    }
    if (![...r.series.values()].some((s) => s.missing > 0))
      expect(
        problemsOf.some((p) => p.code === 'cells-missing'),
        `${where}: no cells-missing`,
      ).toBe(false);
    // Unusable steps: counted per file, first lines listed.
    for (const [file, rows] of r.invalid) {
      const p = problemsOf.find((q) => q.code === 'step-invalid' && q.file === file);
      expect(p?.message, `${where}: step-invalid in ${file}`).toMatch(new RegExp(`^${rows.length} row\\(s\\)`));
      expect(p?.line, `${where}: first invalid step line`).toBe(rows[0]?.line);
    }
    expect(problemsOf.filter((q) => q.code === 'step-invalid').length, `${where}: step-invalid problems`).toBe(
      r.invalid.size,
    );
    const duplicated = new Set([...r.series.values()].flatMap((s) => s.duplicateSteps));
    const dup = problemsOf.find((q) => q.code === 'steps-duplicated');
    if (duplicated.size > 0)
      expect(dup?.message, `${where}: steps-duplicated`).toMatch(new RegExp(`^${duplicated.size} step\\(s\\)`));
    else expect(dup, `${where}: no steps-duplicated`).toBeUndefined();
    // Every usable row reaches a series or is counted by a problem of its run.
    for (const row of r.rows) {
      const reaches = [...r.series.values()].some((s) => s.winners.has(row));
      if (reaches) continue;
      const lost = [...r.series.values()].some((s) => s.losers.has(row));
      const counted =
        (lost && dup !== undefined) || problemsOf.some((q) => q.code === 'cells-missing') || r.series.size === 0;
      expect(counted, `${where}: row at line ${row.line} neither used nor counted`).toBe(true);
    }
    if (r.status !== 'ok')
      expect(
        problemsOf.length + set.problems.filter((p) => p.file !== undefined && run.files.includes(p.file)).length,
        `${where}: ${r.status} without a problem`,
      ).toBeGreaterThan(0);
  }
}

async function writeStudy(study: readonly GenFile[]): Promise<string> {
  const root = await mkdtemp(join(tmpdir(), 'seedsift-prop-'));
  for (const f of study) {
    const path = join(root, pathOf(f));
    await mkdir(join(path, '..'), { recursive: true });
    const text = Buffer.from(fileText(f));
    await writeFile(path, f.name.endsWith('.gz') ? gzipSync(text) : text);
  }
  return root;
}

describe('ingest on random small studies, against csv-parse + parseFloat and the written policies', () => {
  it('every number equals the independent parse; every row, file and run is used or counted', async () => {
    await fc.assert(
      fc.asyncProperty(genStudy, async (study) => {
        const root = await writeStudy(study);
        try {
          compare(await ingest([root], none), reference(root, study));
        } finally {
          await rm(root, { recursive: true, force: true });
        }
      }),
      { numRuns: 50, seed: 20260301 },
    );
    // 50 studies through DuckDB: about 4-15 s on a loaded 2-core machine, over vitest's 5 s default.
  }, 120_000);

  it('the generators reach the cases they are for (a check on the test itself)', () => {
    const sample = fc.sample(genStudy, { numRuns: 50, seed: 20260301 }).flat();
    const cells = sample.flatMap((f) => f.lines.flatMap((l) => (l.kind === 'row' ? l.cells : [])));
    const kinds = new Set(cells.map((c) => classify(c).kind));
    expect([...kinds].sort()).toEqual(['empty', 'finite', 'nonfinite', 'text']);
    expect(sample.some((f) => f.lines.some((l) => l.kind !== 'row'))).toBe(true);
    expect(sample.some((f) => f.name.endsWith('.gz') && f.bom && f.eol === '\r\n')).toBe(true);
    expect(sample.some((f) => new Set(f.header.map((h) => h.trim())).size < f.header.length)).toBe(true);
  });
});
