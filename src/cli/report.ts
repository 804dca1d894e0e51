/**
 * `seedsift report PATH...`: the whole job. Reads the notebook (default or --notebook), merges its
 * front matter under the command-line options, runs the pipeline, writes exactly the outputs asked
 * for (none named: report.html), and applies the --fail-on gate.
 */
import { readFileSync } from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve } from 'node:path';
import { Command } from 'commander';
import { ANALYSIS_OPTIONS } from '../analysis/analysisOptions.js';
import type { Results } from '../analysis/results.js';
import { SeedsiftError } from '../problems.js';
import { parseNotebook, type NotebookOptions } from '../report/parseNotebook.js';
import { overviewText } from '../report/overviewText.js';
import { relativePaths } from './relativePaths.js';
import { DEFAULT_NOTEBOOK } from '../report/templatePaths.js';
import { failedGate, ungated } from './gate.js';
import { progressDisplay } from './progress.js';
import { rawIngestOptions, resolveIngestOptions } from './ingestOptions.js';
import { addTableOptions, tableValues } from './tableOptions.js';
import { modeFiles } from '../ingest/readingMode.js';
import { inputFiles } from './inputFiles.js';
import type { Io } from './io.js';
import { EXIT_GATE, EXIT_NO_EVIDENCE } from './exitCodes.js';
import { STDOUT } from './writeOutput.js';
import { version } from './version.js';
import { writeOutput } from './writeOutput.js';

/** The options of `report` that are not in the option tables: where outputs go. */
interface OutputOptions {
  out?: string;
  json?: string;
  markdown?: string;
  fullCurves?: boolean;
  notebook?: string;
  quiet?: boolean;
}

export function reportCommand(io: Io, done: (code: number) => void): Command {
  const command = new Command('report')
    .description('the whole job: compare configurations and write report.html (and/or --json, --markdown)')
    .argument('[paths...]', "folders or files of run logs (default: the notebook's runs:)")
    .option('-o, --out <file>', "write the HTML report to FILE ('-' for standard output)")
    .option('--json <file>', "write results.json (the machine-readable results) to FILE ('-' for standard output)")
    .option(
      '--markdown <file>',
      "write a Markdown verdict summary (for a pull request) to FILE ('-' for standard output)",
    )
    .option('--notebook <file>', 'render this notebook instead of the default one (e.g. study.md)')
    .option('--full-curves', 'write learning curves to --json on the full grid (default: at most 100 bins each)')
    .option('--quiet', 'print nothing but errors');
  addTableOptions(command, 'report');
  command.action(async (paths: string[], raw: OutputOptions & Record<string, unknown>) => {
    const notebookFile = raw.notebook ?? DEFAULT_NOTEBOOK;
    const notebookSource = readNotebook(notebookFile);
    const front = parseNotebook(notebookSource, raw.notebook ?? 'templates/notebook.md').options;
    const reading = rawIngestOptions(raw, front);
    const scores = reading.scores;
    const runPaths = paths.length > 0 || scores !== undefined ? paths : notebookRuns(front, notebookFile);
    const named = { html: raw.out, json: raw.json, markdown: raw.markdown };
    const outputs =
      named.html === undefined && named.json === undefined && named.markdown === undefined
        ? { ...named, html: 'report.html' }
        : named;
    // Heavy modules (DuckDB, Vega) load only when the command runs, so --help starts fast.
    const { reportDate, reportPipeline } = await import('../pipeline.js');
    const ingestOptions = resolveIngestOptions(reading);
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
      report: tableValues(ANALYSIS_OPTIONS, raw, front),
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
      if (file === STDOUT) io.stdout(text);
      else writeOutput(file, text, inputs);
      written.push(file === STDOUT ? 'standard output' : file);
    }
    // With an output on standard output, the outcome line goes to stderr so it does not mix in.
    const toStdout = [outputs.html, outputs.json, outputs.markdown].includes(STDOUT);
    if (raw.quiet !== true)
      (toStdout ? io.stderr : io.stdout)(overviewText(result.results) + outcomeLine(result.results, written));
    const nothing = result.results.settings.failOn === null ? null : ungated(result.results);
    if (nothing !== null) {
      io.stderr(`seedsift: --fail-on ${result.results.settings.failOn}: ${nothing}\n`);
      done(EXIT_NO_EVIDENCE);
      return;
    }
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

function outcomeLine(results: Results, written: readonly string[]): string {
  const count = (v: string): number => results.comparisons.filter((c) => c.verdict === v).length;
  const excluded = results.runs.filter((r) => r.status !== 'ok').length;
  return (
    `${results.runs.length} runs, ${results.configs.length} configs, ${results.comparisons.length} ` +
    `comparisons: ${count('better')} better, ${count('worse')} worse, ${count('inconclusive')} ` +
    `inconclusive; ${excluded} runs not ok, ${results.problems.length} problems\nwrote ${written.join(', ')}\n`
  );
}
