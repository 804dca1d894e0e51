/**
 * The whole job of `seedsift report`, as numbered steps in one function:
 *
 *   1. ingest     find the files and read them with DuckDB          → RunSet    (src/ingest/)
 *   2. resolve    check the report options against what was read    → ResolvedOptions
 *   3. analyze    summaries, curves, comparisons, verdicts, ticks   → Results   (src/analysis/)
 *                 (again for each other summary the notebook's cells name, merged in)
 *   4. render     the outputs asked for: HTML, JSON, Markdown       → strings   (src/report/)
 *
 * Writing files and exit codes are the command line's business (src/cli/report.ts).
 */
import type { ResolvedOptions, ReportOptions } from './analysis/options.js';
import { resolveOptions } from './analysis/options.js';
import { analyze } from './analysis/analyze.js';
import type { Results } from './analysis/results.js';
import { ingest, type IngestHooks } from './ingest/ingest.js';
import type { IngestOptions, RunSet } from './ingest/types.js';
import { resultsJson } from './report/resultsJson.js';
import { mergeSummary, notebookSummaries } from './report/notebookSummaries.js';
import { summaryMarkdown } from './report/summaryMarkdown.js';
import { SeedsiftError } from './problems.js';
import type { ProgressHook } from './progress.js';

export interface ReportJob {
  readonly paths: readonly string[];
  readonly ingest: IngestOptions;
  readonly report: ReportOptions;
  readonly notebook: { readonly source: string; readonly file: string };
  /** ISO date shown in the outputs. */
  readonly generated: string;
  readonly version: string;
  readonly outputs: { readonly html: boolean; readonly json: boolean; readonly markdown: boolean };
  /** Curves in results.json: on a coarser grid (default) or in full (`--full-curves`). */
  readonly jsonCurves?: 'coarse' | 'full';
  /** Observers of the work (progress display). */
  readonly hooks?: IngestHooks;
}

export interface ReportOutputs {
  readonly runSet: RunSet;
  readonly options: ResolvedOptions;
  readonly results: Results;
  readonly html: string | null;
  readonly json: string | null;
  readonly markdown: string | null;
}

export async function reportPipeline(job: ReportJob): Promise<ReportOutputs> {
  // 1. ingest
  const runSet = await ingest(job.paths, job.ingest, job.hooks);
  // 2. resolve
  const options = resolveOptions(job.report, runSet);
  // 3. analyze (once more for each other summary the notebook's cells name)
  const meta = { paths: job.paths, generated: job.generated, version: job.version };
  let results = analyze(runSet, options, meta, job.hooks?.progress);
  if (job.outputs.html)
    for (const summary of notebookSummaries(job.notebook.source))
      if (summary !== options.summaryText)
        results = mergeSummary(results, analyze(runSet, resolveOptions({ ...job.report, summary }, runSet), meta));
  // 4. render
  return {
    runSet,
    options,
    results,
    html: job.outputs.html ? await renderHtml(results, job.notebook, job.hooks?.progress) : null,
    json: job.outputs.json ? resultsJson(results, job.jsonCurves === 'full' ? { curvePoints: null } : {}) : null,
    markdown: job.outputs.markdown ? summaryMarkdown(results) : null,
  };
}

/**
 * The HTML report. Its renderer (Handlebars, Vega, Vega-Lite, the page's scripts) is loaded only
 * here, when a page is asked for: loading it costs about 0.3 s, a third of a small job.
 */
async function renderHtml(results: Results, notebook: ReportJob['notebook'], progress?: ProgressHook): Promise<string> {
  const { renderReport } = await import('./report/renderReport.js');
  return await renderReport(results, notebook.source, notebook.file, progress);
}

/** The report date: SOURCE_DATE_EPOCH (seconds) when set, so builds are reproducible; else now. */
export function reportDate(
  env: Readonly<Record<string, string | undefined>>,
  now: () => Date = () => new Date(),
): string {
  const epoch = env.SOURCE_DATE_EPOCH;
  if (epoch === undefined || epoch === '') return now().toISOString();
  const seconds = Number(epoch);
  if (!Number.isInteger(seconds) || seconds < 0) {
    throw new SeedsiftError('usage', `SOURCE_DATE_EPOCH: expected a whole number of seconds, got '${epoch}'`);
  }
  return new Date(seconds * 1000).toISOString();
}
