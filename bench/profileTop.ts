/**
 * Read a V8 CPU profile (`node --cpu-prof ...` writes a .cpuprofile) and print where the main
 * thread's time went (`npx tsx bench/profileTop.ts FILE.cpuprofile [--top N]`):
 * - the top N functions by self time (time on top of the stack), with file and line;
 * - self time summed by area: src/ingest, src/analysis, src/stats, src/report, src/cli, DuckDB's
 *   package, other npm packages, tsx/esbuild, Node internals, garbage collection, idle, program;
 * - inclusive time of the pipeline's functions (any sample with the function on its stack).
 * Sample weights are the profile's timeDeltas. Only the JavaScript main thread is sampled: DuckDB's
 * own threads show up as idle (waiting) time on it.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';

interface ProfileNode {
  readonly id: number;
  readonly callFrame: { readonly functionName: string; readonly url: string; readonly lineNumber: number };
  readonly children?: readonly number[];
}

interface CpuProfile {
  readonly nodes: readonly ProfileNode[];
  readonly samples: readonly number[];
  readonly timeDeltas: readonly number[];
}

/** Inclusive times are printed for these function names when they appear. */
const PIPELINE = [
  'ingest',
  'resolveOptions',
  'analyze',
  'learningCurves',
  'compareFamily',
  'tickCurves',
  'metricValues',
  'bootstrapMeanDifference',
  'bootstrapMean',
  'permutationTest',
  'mannWhitney',
  'welch',
  'renderReport',
  'resultsJson',
];

/** The area a frame belongs to, from its URL. */
function area(url: string, name: string): string {
  if (name === '(garbage collector)' || name === '(idle)' || name === '(program)' || name === '(root)') return name;
  const m = /\/src\/(ingest|analysis|stats|report|cli)\//.exec(url);
  if (m && !url.includes('node_modules')) return `src/${m[1]}`;
  if (/\/src\/[^/]+\.ts$/.test(url) && !url.includes('node_modules')) return 'src (top level)';
  if (url.includes('@duckdb')) return 'DuckDB (node-api)';
  if (url.includes('@stdlib')) return 'npm: @stdlib (t, beta functions)';
  if (/node_modules\/(vega|d3-)/.test(url)) return 'npm: vega, vega-lite, d3';
  if (url.includes('/tsx/') || url.includes('esbuild')) return 'tsx/esbuild';
  const pkg = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (pkg) return `npm: ${pkg[1]}`;
  if (url.startsWith('node:internal/modules')) return 'module loading (Node)';
  if (url.startsWith('node:')) return 'Node internals';
  if (url === '') return 'native';
  return 'other';
}

function main(argv: readonly string[]): void {
  const { values, positionals } = parseArgs({
    args: [...argv],
    allowPositionals: true,
    options: { top: { type: 'string', default: '10' } },
  });
  const file = positionals[0];
  if (file === undefined) throw new RangeError('usage: npx tsx bench/profileTop.ts FILE.cpuprofile [--top N]');
  const profile = JSON.parse(readFileSync(file, 'utf8')) as CpuProfile;
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);

  const self = new Map<number, number>();
  profile.samples.forEach((id, i) => {
    self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0));
  });
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  const ms = (us: number): string =>
    `${(us / 1000).toFixed(0).padStart(7)} ms ${((100 * us) / total).toFixed(1).padStart(5)}%`;
  const where = (n: ProfileNode): string =>
    `${n.callFrame.url.replace(/^file:\/\/.*?\/(src|node_modules)\//, '$1/')}:${n.callFrame.lineNumber + 1}`;

  const fnSelf = new Map<string, { us: number; node: ProfileNode }>();
  const areaSelf = new Map<string, number>();
  for (const [id, us] of self) {
    const n = byId.get(id);
    if (n === undefined) continue;
    const key = `${n.callFrame.functionName || '(anonymous)'} ${where(n)}`;
    fnSelf.set(key, { us: (fnSelf.get(key)?.us ?? 0) + us, node: n });
    const a = area(n.callFrame.url, n.callFrame.functionName);
    areaSelf.set(a, (areaSelf.get(a) ?? 0) + us);
  }
  console.log(
    `${file}: ${(total / 1000).toFixed(0)} ms sampled on the main thread\n\nTop ${values.top} functions by self time:`,
  );
  for (const [key, v] of [...fnSelf].sort((a, b) => b[1].us - a[1].us).slice(0, Number(values.top)))
    console.log(`${ms(v.us)}  ${key}`);
  console.log('\nSelf time by area:');
  const areas = [...areaSelf].sort((x, y) => y[1] - x[1]);
  for (const [a, us] of areas.slice(0, 14)) console.log(`${ms(us)}  ${a}`);
  const rest = areas.slice(14).reduce((sum, [, us]) => sum + us, 0);
  if (rest > 0) console.log(`${ms(rest)}  ${areas.length - 14} other areas`);

  const inclusive = new Map<string, number>();
  profile.samples.forEach((leaf, i) => {
    const seen = new Set<string>();
    for (let id: number | undefined = leaf; id !== undefined; id = parent.get(id)) {
      const name = byId.get(id)?.callFrame.functionName ?? '';
      if (PIPELINE.includes(name)) seen.add(name);
    }
    for (const name of seen) inclusive.set(name, (inclusive.get(name) ?? 0) + (profile.timeDeltas[i] ?? 0));
  });
  console.log('\nInclusive time of pipeline functions (synchronous JavaScript on the stack):');
  for (const name of PIPELINE) if (inclusive.has(name)) console.log(`${ms(inclusive.get(name) ?? 0)}  ${name}`);
}

main(process.argv.slice(2));
