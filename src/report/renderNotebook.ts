/**
 * A notebook rendered to the HTML of the page's main column:
 *   1. split front matter and body (`parseNotebook`);
 *   2. run the body as a strict Handlebars template on a private instance with the cells
 *      registered; each cell stores its HTML and leaves a placeholder block, and records the
 *      charts it shows;
 *   3. render the Markdown (prose) with markdown-it;
 *   4. put each cell's HTML in place of its placeholder;
 *   5. render every recorded chart to SVG (one after another, so ids are stable), with its compiled
 *      Vega spec beside it for the interactive view, and put it in its figure. Chart data is rounded
 *      to 6 significant digits first (`roundChartData`), and the SVG leaves out the invisible hover
 *      layers that only the interactive view uses (`staticChart`).
 * Template mistakes (a misspelled cell or field, a metric that does not exist, a syntax error)
 * become SeedsiftError('notebook') with the notebook's file and line.
 */
import Handlebars from 'handlebars';
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../analysis/results.js';
import { SeedsiftError } from '../problems.js';
import type { ProgressHook } from '../progress.js';
import { CELL_NAMES, CELL_PLACEHOLDER, registerCells } from './cells/index.js';
import { CHART_PLACEHOLDER, type RenderState } from './cells/cell.js';
import { jsonForScript, visibleText } from './escape.js';
import { createMarkdown } from './markdown.js';
import type { Notebook } from './parseNotebook.js';
import { roundChartData } from './charts/roundChartData.js';
import { staticChart } from './charts/staticChart.js';
import { compileVega, renderSvg } from './renderSvg.js';
import { createSlugger } from './slugger.js';
import { studyContext, type StudyContext } from './studyContext.js';

/** What a template can read: the whole `Results` and handy lists. */
export interface NotebookContext {
  readonly title: string;
  readonly generated: string;
  readonly results: Results;
  readonly settings: Results['settings'];
  readonly configs: Results['configs'];
  readonly metrics: Results['metrics'];
  /** Metrics with learning curves or per-run values (not per-tick). */
  readonly scalarMetrics: Results['metrics'];
  readonly tickMetrics: Results['metrics'];
  /** The study's shape for the default notebook (`studyContext`). */
  readonly study: StudyContext;
}

/** The rendered notebook: the main column's HTML. */
export interface RenderedNotebook {
  readonly html: string;
  /** Charts on the page. */
  readonly charts: number;
}

/**
 * Render a parsed notebook against `Results` (see the module comment for the steps).
 * Cost: the template and Markdown are linear in the notebook; each chart costs one Vega-Lite
 * compile and one headless Vega run.
 * Throws SeedsiftError('notebook') with file and line for template mistakes; rethrows chart
 * rendering errors (a bug, not a user mistake).
 * Example: `await renderNotebook(results, parseNotebook('{{verdicts}}', 'n.md'), 'Study')`
 * → `{ html: '<div class="verdicts-cell">...', charts: 0 }`.
 */
export async function renderNotebook(
  results: Results,
  notebook: Notebook,
  title: string,
  progress: ProgressHook = () => undefined,
): Promise<RenderedNotebook> {
  const slug = createSlugger();
  const state: RenderState = { results, file: notebook.file, bodyLine: notebook.bodyLine, charts: [], cells: [], slug };
  const markdownText = runTemplate(notebook, state, context(results, title));
  const html = createMarkdown(slug)
    .render(markdownText)
    .replace(CELL_PLACEHOLDER, (_m: string, i: string) => state.cells[Number(i)] ?? '');
  const figures: string[] = [];
  for (const [i, spec] of state.charts.entries()) {
    progress('drawing', i, state.charts.length);
    figures.push(await chartHtml(spec, i));
  }
  progress('drawing', state.charts.length, state.charts.length);
  return {
    html: html.replace(CHART_PLACEHOLDER, (_m: string, i: string) => figures[Number(i)] ?? ''),
    charts: figures.length,
  };
}

function context(results: Results, title: string): NotebookContext {
  return {
    title,
    generated: results.generated,
    results,
    settings: results.settings,
    configs: results.configs,
    metrics: results.metrics,
    scalarMetrics: results.metrics.filter((m) => m.kind === 'scalar'),
    tickMetrics: results.metrics.filter((m) => m.kind === 'tick'),
    study: studyContext(results),
  };
}

function runTemplate(notebook: Notebook, state: RenderState, ctx: NotebookContext): string {
  const hb = Handlebars.create();
  registerCells(hb);
  try {
    const template = hb.compile(notebook.body, { strict: true });
    return template(ctx, { data: { seedsift: state } });
  } catch (error) {
    throw notebookError(error, notebook);
  }
}

/** Turn a Handlebars error into a SeedsiftError with the notebook line. */
function notebookError(error: unknown, notebook: Notebook): unknown {
  if (error instanceof SeedsiftError || !(error instanceof Error)) return error;
  const where = (templateLine: number | undefined): { file: string; line?: number } =>
    templateLine === undefined
      ? { file: notebook.file }
      : { file: notebook.file, line: notebook.bodyLine - 1 + templateLine };
  const strict = /^"(.*)" not defined in /s.exec(error.message);
  const lineNumber = (error as { lineNumber?: unknown }).lineNumber;
  if (strict !== null) {
    const name = visibleText(strict[1] ?? '', 80);
    return new SeedsiftError(
      'notebook',
      `unknown cell or field '${name}'; the cells are ${CELL_NAMES.join(', ')} (e.g. {{curves "val_acc"}})`,
      where(typeof lineNumber === 'number' ? lineNumber : undefined),
    );
  }
  const parse = /^Parse error on line (\d+):[\s\S]*?(Expecting [\s\S]*)$/.exec(error.message);
  if (parse !== null) {
    const expecting = (parse[2] ?? '').replace(/^Expecting /, '').split(', got ');
    return new SeedsiftError(
      'notebook',
      `template syntax: expected ${expecting[0] ?? ''}, got ${expecting[1] ?? 'something else'}`,
      where(Number(parse[1])),
    );
  }
  return new SeedsiftError(
    'notebook',
    `template: ${error.message.split('\n')[0] ?? ''}`,
    where(typeof lineNumber === 'number' ? lineNumber : undefined),
  );
}

/**
 * One chart: its server-rendered SVG (ids prefixed so charts on one page do not share clip paths)
 * and its compiled Vega spec as JSON for the interactive view, both from the rounded data.
 */
async function chartHtml(full: TopLevelSpec, index: number): Promise<string> {
  const prefix = `c${index + 1}-`;
  const spec = roundChartData(full);
  const svg = prefixIds(stripNamespaces(await renderSvg(staticChart(spec))), prefix);
  const { $schema: _schema, ...vega } = compileVega(spec) as { $schema?: string } & Record<string, unknown>;
  return (
    `<div class="chart-view" data-chart="${index + 1}">${svg}</div><script type="application/json" ` +
    `class="chart-spec">${jsonForScript(vega)}</script>`
  );
}

/** Namespace declarations are not needed for SVG inside HTML; dropping them leaves no URL in the page. */
function stripNamespaces(svg: string): string {
  return svg.replace(/^<svg[^>]*>/, (tag) => tag.replace(/\s+xmlns(:xlink)?="[^"]*"/g, ''));
}

/** Prefix every id (and reference to one) inside tags; text is escaped, so `<...>` is always a tag. */
function prefixIds(svg: string, prefix: string): string {
  return svg.replace(/<[^>]*>/g, (tag) =>
    tag
      .replace(/(\sid=")([^"]+)"/g, (_m, a: string, id: string) => `${a}${prefix}${id}"`)
      .replace(/url\(#([^)]+)\)/g, (_m, id: string) => `url(#${prefix}${id})`)
      .replace(/(\shref=")#([^"]+)"/g, (_m, a: string, id: string) => `${a}#${prefix}${id}"`),
  );
}
