/**
 * Where the time and memory of one `seedsift report` go, stage by stage (`npx tsx bench/stages.ts
 * DIR [--baseline B] [--html]`): the pipeline's steps of src/pipeline.ts (ingest with DuckDB, resolve,
 * analyze, render JSON, and the HTML report with --html) run in-process, each timed with
 * performance.now() (wall) and process.cpuUsage() (CPU of every thread, DuckDB's included), with the
 * resident memory after it and the peak so far (process.resourceUsage().maxRSS).
 * It runs the job the default notebook asks for (its front matter sets no option), so it is the
 * same work as `seedsift report DIR --json OUT --baseline B`, minus writing the file.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { analyze } from '../src/analysis/analyze.js';
import { resolveOptions } from '../src/analysis/options.js';
import { resolveIngestOptions } from '../src/cli/ingestOptions.js';
import { ingest } from '../src/ingest/ingest.js';
import { renderReport } from '../src/report/renderReport.js';
import { resultsJson } from '../src/report/resultsJson.js';
import { DEFAULT_NOTEBOOK } from '../src/report/templatePaths.js';

const MiB = 2 ** 20;

async function stage<T>(name: string, work: () => T | Promise<T>): Promise<T> {
  const cpu = process.cpuUsage();
  const start = performance.now();
  const result = await work();
  const wall = performance.now() - start;
  const used = process.cpuUsage(cpu);
  const memory = process.memoryUsage();
  console.log(
    `${name.padEnd(10)} wall ${wall.toFixed(0).padStart(6)} ms  CPU ` +
      `${((used.user + used.system) / 1000).toFixed(0).padStart(6)} ms  ` +
      `RSS after ${(memory.rss / MiB).toFixed(0).padStart(5)} MiB (JS heap ${(memory.heapUsed / MiB).toFixed(0)}, ` +
      `array buffers ${(memory.arrayBuffers / MiB).toFixed(0)})  ` +
      `peak so far ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MiB`,
  );
  return result;
}

async function main(argv: readonly string[]): Promise<void> {
  const { values, positionals } = parseArgs({
    args: [...argv],
    allowPositionals: true,
    options: { baseline: { type: 'string' }, html: { type: 'boolean', default: false } },
  });
  const paths = positionals;
  if (paths.length === 0) throw new RangeError('usage: npx tsx bench/stages.ts DIR [--baseline B] [--html]');
  console.log(`start      RSS ${(process.memoryUsage().rss / MiB).toFixed(0)} MiB after loading the modules`);
  const runSet = await stage('ingest', () => ingest(paths, resolveIngestOptions({})));
  const options = await stage('resolve', () => resolveOptions({ baseline: values.baseline ?? null }, runSet));
  const results = await stage('analyze', () =>
    analyze(runSet, options, { paths, generated: new Date(0).toISOString(), version: 'bench' }),
  );
  const json = await stage('json', () => resultsJson(results));
  console.log(
    `           results.json ${(json.length / MiB).toFixed(1)} MiB; ${results.comparisons.length} comparisons, ` +
      `${results.curves.length} curves`,
  );
  if (values.html) {
    const html = await stage('html', () =>
      renderReport(results, readFileSync(DEFAULT_NOTEBOOK, 'utf8'), 'templates/notebook.md'),
    );
    console.log(`           report.html ${(html.length / MiB).toFixed(1)} MiB`);
  }
}

await main(process.argv.slice(2));
