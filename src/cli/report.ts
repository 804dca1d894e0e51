/**
 * `seedsift report PATH...`: the whole job. Reads the notebook (default or --notebook), merges its
 * front matter under the command-line options, runs the pipeline, writes exactly the outputs asked
 * for (none named: report.html), and applies the --fail-on gate.
 */
import { readFileSync } from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve } from 'node:path';
import { Command } from 'commander';
import type { ReportOptions } from '../analysis/options.js';
import type { Results } from '../analysis/results.js';
import { SeedsiftError } from '../problems.js';
import { parseNotebook, type NotebookOptions } from '../report/parseNotebook.js';
import { overviewText } from '../report/overviewText.js';
import { relativePaths } from './relativePaths.js';
import { DEFAULT_NOTEBOOK } from '../report/templatePaths.js';
import { failedGate } from './gate.js';
import { progressDisplay } from './progress.js';
import { addIngestOptions, resolveIngestOptions, type RawIngestOptions } from './ingestOptions.js';
import { modeFiles } from '../ingest/readingMode.js';
import { inputFiles } from './inputFiles.js';
import type { Io } from './io.js';
import { EXIT_GATE } from './exitCodes.js';
import { version } from './version.js';
import { writeOutput } from './writeOutput.js';

interface RawReportOptions extends RawIngestOptions {
  out?: string;
  json?: string;
  markdown?: string;
  fullCurves?: boolean;
  notebook?: string;
  baseline?: string;
  taskKey?: string;
  summary?: string;
  alpha?: string;
  correction?: string;
  margin?: string;
  paired?: boolean;
  diverged?: string;
  failed?: string;
  family?: string;
  interval?: string;
  seed?: string;
  failOn?: string;
  quiet?: boolean;
}

export function reportCommand(io: Io, done: (code: number) => void): Command {
  const command = new Command('report')
    .description('the whole job: compare configurations and write report.html (and/or --json, --markdown)')
    .argument('[paths...]', "folders or files of run logs (default: the notebook's runs:)")
    .option('-o, --out <file>', 'write the HTML report to FILE')
    .option('--json <file>', 'write results.json (the machine-readable results) to FILE')
    .option('--markdown <file>', 'write a Markdown verdict summary (for a pull request) to FILE')
    .option('--notebook <file>', 'render this notebook instead of the default one')
    .option('--baseline <selector>', 'key=value[,key=value]: the baseline config, or the baseline value of some keys')
    .option('--task-key <key>', 'a config key whose values are tasks: compare per task and aggregate across tasks')
    .option('--summary <how>', 'per-run value: final | last:P% | best | auc | reach:VALUE | step:N (default final)')
    .option('--alpha <a>', 'significance level (default 0.05)')
    .option('--correction <c>', 'multiple comparisons: holm | bh | none (default holm)')
    .option('--margin <m>', 'non-inferiority margin in metric units (one-sided Welch)')
    .option('--paired', 'pair runs by seed across configs (paired t, Wilcoxon signed-rank)')
    .option('--failed <policy>', 'failed runs (diverged or short): exclude | worst (default exclude)')
    .option('--diverged <policy>', 'the old name of --failed')
    .option(
      '--family <scope>',
      'correction family: study (each metric and summary over all tasks) | task (default study)',
    )
    .option('--interval <kind>', 'headline interval: welch | bca (default welch)')
    .option('--seed <n>', 'seed of every resampling (default 1)')
    .option('--fail-on <gate>', 'exit 1 when a comparison is worse | not-better')
    .option('--full-curves', 'write learning curves to --json on the full grid (default: at most 100 bins each)')
    .option('--quiet', 'print nothing but errors');
  addIngestOptions(command);
  command.action(async (paths: string[], raw: RawReportOptions) => {
    const notebookFile = raw.notebook ?? DEFAULT_NOTEBOOK;
    const notebookSource = readNotebook(notebookFile);
    const front = parseNotebook(notebookSource, raw.notebook ?? 'templates/notebook.md').options;
    const scores = raw.scores ?? front.scores;
    const runPaths = paths.length > 0 || scores !== undefined ? paths : notebookRuns(front, notebookFile);
    const named = { html: raw.out, json: raw.json, markdown: raw.markdown };
    const outputs =
      named.html === undefined && named.json === undefined && named.markdown === undefined
        ? { ...named, html: 'report.html' }
        : named;
    // Heavy modules (DuckDB, Vega) load only when the command runs, so --help starts fast.
    const { reportDate, reportPipeline } = await import('../pipeline.js');
    const ingestOptions = resolveIngestOptions(mergeIngest(front, raw));
    const files = [outputs.html, outputs.json, outputs.markdown].filter((f): f is string => f !== undefined);
    const twice = files.find((f, k) => files.findIndex((g) => resolve(g) === resolve(f)) !== k);
    if (twice !== undefined)
      throw new SeedsiftError(
        'usage',
        `-o, --json, --markdown: expected a different file for each, got ${twice} twice`,
      );
    const progress = progressDisplay(io, raw.quiet === true);
    const result = await reportPipeline({
      hooks: progress.hooks,
      paths: relativePaths(runPaths, io.cwd),
      ingest: ingestOptions,
      report: mergeReport(front, raw),
      notebook: { source: notebookSource, file: raw.notebook ?? 'templates/notebook.md' },
      generated: reportDate(io.env),
      jsonCurves: raw.fullCurves === true ? 'full' : 'coarse',
      version: version(),
      outputs: {
        html: outputs.html !== undefined,
        json: outputs.json !== undefined,
        markdown: outputs.markdown !== undefined,
      },
    }).finally(() => progress.done());
    const inputs = inputFiles(result.runSet, [...modeFiles(ingestOptions.mode), notebookFile]);
    const written: string[] = [];
    for (const [file, text] of [
      [outputs.html, result.html],
      [outputs.json, result.json],
      [outputs.markdown, result.markdown],
    ] as const) {
      if (file === undefined || text === null) continue;
      writeOutput(file, text, inputs);
      written.push(file);
    }
    if (raw.quiet !== true) io.stdout(overviewText(result.results) + outcomeLine(result.results, written));
    const gate = failedGate(result.results);
    if (gate !== null) {
      io.stderr(`seedsift: --fail-on ${result.results.settings.failOn}: ${gate}\n`);
      done(EXIT_GATE);
    } else done(0);
  });
  return command;
}

function readNotebook(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (error) {
    throw new SeedsiftError(
      'usage',
      `--notebook: cannot read ${file}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`,
    );
  }
}

/** Paths from the notebook's `runs:`, relative to the notebook's folder. */
function notebookRuns(front: NotebookOptions, notebookFile: string): string[] {
  if (front.runs === undefined || front.runs.length === 0) {
    throw new SeedsiftError(
      'usage',
      'report: expected PATH... on the command line or runs: in the notebook front matter',
    );
  }
  const base = dirname(notebookFile);
  return front.runs.map((p) => (isAbsolute(p) ? p : relative('.', join(base, p)) || '.'));
}

/** Command-line options override the front matter's. */
function mergeIngest(front: NotebookOptions, raw: RawReportOptions): RawIngestOptions {
  const pick = <K extends keyof RawIngestOptions & keyof NotebookOptions>(key: K): RawIngestOptions[K] =>
    (raw[key] ?? front[key]) as RawIngestOptions[K];
  const merged: RawIngestOptions = {};
  for (const key of ['layout', 'seedColumn', 'seedColumns', 'manifest', 'step', 'columns', 'scores', 'by'] as const) {
    const value = pick(key);
    if (value !== undefined) merged[key] = value;
  }
  // Goals: the command line's --metric wins per metric name.
  const goals = new Map<string, string>();
  for (const spec of [...(front.metric ?? []), ...(raw.metric ?? [])])
    goals.set(spec.slice(0, spec.lastIndexOf(':')), spec);
  if (goals.size > 0) merged.metric = [...goals.values()];
  return merged;
}

function mergeReport(front: NotebookOptions, raw: RawReportOptions): ReportOptions {
  return {
    alpha: raw.alpha ?? front.alpha,
    seed: raw.seed ?? front.seed,
    correction: raw.correction ?? front.correction,
    summary: raw.summary ?? front.summary,
    baseline: raw.baseline ?? front.baseline ?? null,
    taskKey: raw.taskKey ?? front.taskKey ?? null,
    margin: raw.margin ?? front.margin ?? null,
    paired: raw.paired ?? front.paired,
    failed: raw.failed ?? (raw.diverged === undefined ? front.failed : undefined),
    diverged: raw.diverged ?? front.diverged,
    family: raw.family ?? front.family,
    interval: raw.interval ?? front.interval,
    failOn: raw.failOn ?? front.failOn ?? null,
    level: front.level,
    resamples: front.resamples,
    bandResamples: front.bandResamples,
    bins: front.bins,
    bootstrapFrom: front.bootstrapFrom,
    haltingThresholds: front.haltingThresholds,
    haltingReference: front.haltingReference,
    calibrationBins: front.calibrationBins,
  };
}

function outcomeLine(results: Results, written: readonly string[]): string {
  const count = (v: string): number => results.comparisons.filter((c) => c.verdict === v).length;
  const excluded = results.runs.filter((r) => r.status !== 'ok').length;
  return `${results.runs.length} runs, ${results.configs.length} configs, ${results.comparisons.length} comparisons: ${count('better')} better, ${count('worse')} worse, ${count('inconclusive')} inconclusive; ${excluded} runs not ok, ${results.problems.length} problems\nwrote ${written.join(', ')}\n`;
}
