/**
 * `npm run bench`: seedsift against the pandas/scipy peer on the same synthetic runs.
 *
 * For each data set: generate it with bench/peer/make_runs.py into bench/.data/<name>/ (cached),
 * run one untimed warm-up of each tool, then run `seedsift report DIR --json OUT --baseline B` and
 * `reference_pipeline.py DIR --out OUT --baseline B` in turns (ABBA order: seedsift first on even
 * repeats, the peer first on odd ones), each under `/usr/bin/time -v`; then seedsift once more with
 * the HTML report as well. Prints the medians, the ratios, peak memory and the issue's targets, and
 * writes the same text to bench/.out/latest.txt. Options: `npm run bench -- --help`.
 */
import { existsSync, mkdirSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { agreement } from './agreement.js';
import { ratioTable, scalingTable, timingTable, type Sample, type SizeResult } from './benchTable.js';
import { bytesOnDisk, configsOnDisk, ensureDataset, SYSTEM_PYTHON } from './dataset.js';
import { BENCH_SIZES, peerBaseline, runCount, SIZE_GROUPS, type BenchSize, type SizeGroup } from './sizes.js';
import { checkTargets, formatTargets } from './targets.js';
import { timedRun } from './timedRun.js';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const PEER_DIR = fileURLToPath(new URL('./peer/', import.meta.url));
const DATA = join(ROOT, 'bench', '.data');
const OUT = join(ROOT, 'bench', '.out');

const HELP = `npm run bench -- [options]
  --sizes LIST   comma-separated groups: ${SIZE_GROUPS.join(', ')} (default small,medium,scaling)
  --large        add the large data set (400 runs x 20,000 steps; takes many minutes)
  --repeats N    timed runs of each tool per data set (default 3)
  --warmup N     untimed runs of each tool per data set before the timed ones (default 1)
  --entry E      seedsift entry: auto (dist/ when built and up to date, else src/ via tsx), dist, src
  --help         this text`;

const ENTRIES = ['auto', 'dist', 'src'] as const;
type Entry = (typeof ENTRIES)[number];

interface BenchOptions {
  readonly groups: readonly SizeGroup[];
  readonly entry: Entry;
  readonly repeats: number;
  readonly warmup: number;
}

function parseOptions(argv: readonly string[]): BenchOptions | null {
  const { values } = parseArgs({
    args: [...argv],
    options: {
      sizes: { type: 'string', default: 'small,medium,scaling' },
      large: { type: 'boolean', default: false },
      repeats: { type: 'string', default: '3' },
      warmup: { type: 'string', default: '1' },
      entry: { type: 'string', default: 'auto' },
      help: { type: 'boolean', default: false },
    },
  });
  if (values.help) return null;
  const groups = values.sizes
    .split(',')
    .map((s) => s.trim())
    .filter((s) => s !== '');
  for (const g of groups) {
    if (!(SIZE_GROUPS as readonly string[]).includes(g))
      throw new RangeError(`--sizes: expected some of ${SIZE_GROUPS.join(', ')}, got '${g}'`);
  }
  if (values.large && !groups.includes('large')) groups.push('large');
  const count = (name: string, text: string, min: number): number => {
    const n = Number(text);
    if (!Number.isInteger(n) || n < min)
      throw new RangeError(`--${name}: expected a whole number >= ${min}, got '${text}'`);
    return n;
  };
  if (!(ENTRIES as readonly string[]).includes(values.entry))
    throw new RangeError(`--entry: expected one of ${ENTRIES.join(', ')}, got '${values.entry}'`);
  return {
    groups: groups as SizeGroup[],
    entry: values.entry as Entry,
    repeats: count('repeats', values.repeats, 1),
    warmup: count('warmup', values.warmup, 0),
  };
}

/**
 * The seedsift command a user would run: the bundle dist/main.js (`npm run build`) when it exists
 * and no source file is newer than it (a stale build would time code that is not there any more),
 * else the sources through tsx. `--entry` forces one.
 */
function seedsiftCommand(entry: Entry): { args: string[]; label: string } {
  const compiled = { args: ['dist/main.js'], label: 'node dist/main.js' };
  const sources = { args: ['--import', 'tsx', 'src/cli/main.ts'], label: 'node --import tsx src/cli/main.ts' };
  if (entry === 'dist') return compiled;
  if (entry === 'src') return sources;
  if (!existsSync(join(ROOT, compiled.args[0] as string)))
    return { ...sources, label: `${sources.label} (no dist/ build)` };
  const stale = staleBuild();
  if (stale !== null)
    return { ...sources, label: `${sources.label} (dist/ is older than ${stale}; --entry dist to use it anyway)` };
  return compiled;
}

/** The first src/ file newer than the bundle dist/main.js, or null. */
function staleBuild(): string | null {
  const built = statSync(join(ROOT, 'dist', 'main.js')).mtimeMs;
  for (const entry of readdirSync(join(ROOT, 'src'), { withFileTypes: true, recursive: true })) {
    if (!entry.isFile()) continue;
    const source = join(entry.parentPath, entry.name);
    if (statSync(source).mtimeMs > built) return relative(ROOT, source);
  }
  return null;
}

function sample(command: string, args: readonly string[]): Sample {
  const loadBefore = loadavg()[0] ?? NaN;
  return { measurement: timedRun(command, args, ROOT), loadBefore };
}

function progress(size: string, tool: string, label: string, s: Sample): void {
  const m = s.measurement;
  console.log(
    `  ${size} ${tool} ${label}: wall ${m.wallSeconds.toFixed(2)} s, CPU ${m.cpuSeconds.toFixed(2)} s, peak ` +
      `${m.peakMiB.toFixed(0)} MiB, load ${s.loadBefore.toFixed(2)}`,
  );
}

function benchSize(size: BenchSize, options: BenchOptions, seedsift: readonly string[]): SizeResult {
  const dir = join(DATA, size.name);
  const started = performance.now();
  const generated = ensureDataset(join(PEER_DIR, 'make_runs.py'), dir, size.spec);
  const dataMiB = bytesOnDisk(dir) / 2 ** 20;
  const baseline = peerBaseline(configsOnDisk(dir));
  console.log(
    `${size.name}: ${runCount(size.spec)} runs (${size.spec.configs} configs x ${size.spec.seeds} seeds) x ` +
      `${size.spec.steps} steps, ${size.spec.metrics} metrics, ${size.spec.ticks} ticks; ${dataMiB.toFixed(0)} MiB ` +
      `${generated ? `generated in ${((performance.now() - started) / 1000).toFixed(1)} s` : 'reused'}; ` +
      `baseline ${baseline}`,
  );

  const out = join(OUT, size.name);
  mkdirSync(out, { recursive: true });
  const rel = (p: string): string => relative(ROOT, p);
  const ownJson = join(out, 'seedsift.json');
  const peerJson = join(out, 'peer.json');
  const reportArgs = (...outputs: string[]): string[] => [
    ...seedsift,
    'report',
    rel(dir),
    ...outputs,
    '--baseline',
    baseline,
  ];
  const ownArgs = reportArgs('--json', rel(ownJson));
  const peerArgs = [join(PEER_DIR, 'reference_pipeline.py'), rel(dir), '--out', rel(peerJson), '--baseline', baseline];
  const runPeer = size.peerSkipped === null;
  if (!runPeer) console.log(`  peer not run: ${size.peerSkipped}`);

  for (let k = 0; k < options.warmup; k++) {
    progress(size.name, 'seedsift', `warm-up ${k + 1}`, sample(process.execPath, ownArgs));
    if (runPeer) progress(size.name, 'peer', `warm-up ${k + 1}`, sample(SYSTEM_PYTHON, peerArgs));
  }
  const own: Sample[] = [];
  const peer: Sample[] = [];
  for (let k = 0; k < options.repeats; k++) {
    const peerFirst = k % 2 === 1;
    if (runPeer && peerFirst) peer.push(sample(SYSTEM_PYTHON, peerArgs));
    own.push(sample(process.execPath, ownArgs));
    if (runPeer && !peerFirst) peer.push(sample(SYSTEM_PYTHON, peerArgs));
    progress(size.name, 'seedsift', `#${k + 1}`, own[k] as Sample);
    if (runPeer) progress(size.name, 'peer', `#${k + 1}`, peer[k] as Sample);
  }
  let html: Sample | string | null = null;
  if (size.html) {
    try {
      html = sample(
        process.execPath,
        reportArgs('--json', rel(join(out, 'seedsift-html.json')), '-o', rel(join(out, 'report.html'))),
      );
      progress(size.name, 'seedsift', 'with HTML', html);
    } catch (error) {
      html =
        (error as Error).message
          .split('\n')
          .filter((l) => l.startsWith('seedsift:'))
          .join(' ') || (error as Error).message;
      console.log(`  ${size.name} seedsift with HTML: FAILED: ${html}`);
    }
  }
  return {
    size,
    baseline,
    dataMiB,
    seedsift: own,
    peer: runPeer ? peer : null,
    html,
    agreement: runPeer ? agreement(ownJson, peerJson) : null,
  };
}

/** Lines about what was not measured: peers not run, HTML runs that failed. */
function notes(results: readonly SizeResult[]): string[] {
  const lines: string[] = [];
  for (const r of results) {
    if (r.size.peerSkipped !== null) lines.push(`${r.size.name}: peer not run: ${r.size.peerSkipped}`);
    if (typeof r.html === 'string') lines.push(`${r.size.name}: the run with the HTML report failed: ${r.html}`);
  }
  return lines.length === 0 ? [] : [...lines, ''];
}

function main(argv: readonly string[]): void {
  const options = parseOptions(argv);
  if (options === null) {
    console.log(HELP);
    return;
  }
  for (const script of ['make_runs.py', 'reference_pipeline.py']) {
    if (!existsSync(join(PEER_DIR, script))) throw new Error(`expected ${script} in bench/peer/ (${PEER_DIR})`);
  }
  const seedsift = seedsiftCommand(options.entry);
  const header = [
    `seedsift bench, ${new Date().toISOString()}`,
    `Node ${process.version}; ${cpus().length} x ${cpus()[0]?.model ?? 'unknown CPU'}; load average at start ${loadavg()
      .map((l) => l.toFixed(2))
      .join(' ')}`,
    `seedsift: ${seedsift.label} report DIR --json OUT --baseline B   (HTML run adds -o report.html)`,
    `peer:     ${SYSTEM_PYTHON} bench/peer/reference_pipeline.py DIR --out OUT --baseline B`,
    `${options.repeats} timed runs of each tool per data set, in turns (ABBA), after ${options.warmup} untimed ` +
      `warm-up run(s); wall = median; peak = largest of the runs (GNU time, max RSS)`,
  ].join('\n');
  console.log(header);
  const results = BENCH_SIZES.filter((s) => options.groups.includes(s.group)).map((s) =>
    benchSize(s, options, seedsift.args),
  );
  const text = [
    header,
    `load average at end ${loadavg()
      .map((l) => l.toFixed(2))
      .join(' ')}`,
    '',
    timingTable(results),
    '',
    ratioTable(results),
    '',
    scalingTable(results),
    '',
    ...notes(results),
    'Targets (issue "Scale and speed"):',
    formatTargets(checkTargets(results)),
    '',
  ].join('\n');
  console.log(`\n${text}`);
  mkdirSync(OUT, { recursive: true });
  writeFileSync(join(OUT, 'latest.txt'), text);
  console.log(`(also written to ${relative(ROOT, join(OUT, 'latest.txt'))})`);
}

main(process.argv.slice(2));
