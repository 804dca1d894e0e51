/**
 * The report page: one self-contained HTML file rendered from `Results` and a notebook.
 *   1. render the notebook (`renderNotebook`: cells, prose, charts as inline SVG with their Vega specs);
 *   2. list the headings for the table of contents;
 *   3. hash the three inline scripts (the Vega runtime, Vega's expression interpreter and the small
 *      script that makes charts interactive) into the Content-Security-Policy, which forbids all
 *      network access and `eval`;
 *   4. fill the layout (a strict template on a private Handlebars instance) with the title, the
 *      date from `Results.generated`, a line of facts, the contents, the style sheet and the scripts.
 * Identical `Results` and notebook give identical bytes (no clock, no random ids, charts rendered
 * in order). Writing the file is the command line's job.
 */
import Handlebars from 'handlebars';
import type { Results } from '../analysis/results.js';
import type { ProgressHook } from '../progress.js';
import { contentSecurityPolicy } from './contentSecurityPolicy.js';
import { visibleText } from './escape.js';
import { parseNotebook } from './parseNotebook.js';
import { loadReportAssets } from './reportAssets.js';
import { renderNotebook } from './renderNotebook.js';
import { tableOfContents } from './tableOfContents.js';

/** The page title when the notebook's front matter gives none. */
export const DEFAULT_TITLE = 'seedsift report';

const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/**
 * `Results.generated` (ISO 8601) as a date people read: `1 March 2026, 12:00 UTC`; any other text as it is.
 * Cost O(1). Never throws. Example: `readableDate('2026-03-01T12:00:00.000Z')` → `'1 March 2026, 12:00 UTC'`.
 */
export function readableDate(iso: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:T(\d{2}):(\d{2}))?/.exec(iso);
  if (m === null) return iso;
  const month = MONTHS[Number(m[2]) - 1];
  if (month === undefined) return iso;
  const time = m[4] === undefined ? '' : `, ${m[4]}:${m[5] ?? '00'}${/Z$|[+-]00:?00$/.test(iso) ? ' UTC' : ''}`;
  return `${Number(m[3])} ${month} ${m[1]}${time}`;
}

function facts(results: Results): string[] {
  const s = results.settings;
  const correction = { holm: 'Holm correction', bh: 'Benjamini-Hochberg correction', none: 'no correction' }[
    s.correction
  ];
  const out = [
    `${results.runs.length} runs in ${results.configs.length} configs`,
    s.baseline === null ? 'every pair of configs compared' : `baseline ${visibleText(s.baseline, 80)}`,
    `summary ${visibleText(s.summary, 40)}`,
    `alpha ${s.alpha}`,
    correction,
  ];
  if (results.problems.length > 0)
    out.push(`${results.problems.length} input problem${results.problems.length === 1 ? '' : 's'}`);
  return out;
}

/**
 * Render the report page.
 * Cost: dominated by the charts (one Vega-Lite compile and one headless Vega run each).
 * Throws SeedsiftError('notebook') with the notebook's file and line for a mistake in the notebook
 * (see `parseNotebook` and `renderNotebook`).
 * Example: `await renderReport(results, readFileSync(DEFAULT_NOTEBOOK, 'utf8'), DEFAULT_NOTEBOOK)`
 * → `'<!DOCTYPE html>\n<html lang="en">...'`.
 */
export async function renderReport(
  results: Results,
  notebookSource: string,
  notebookFile: string,
  progress?: ProgressHook,
): Promise<string> {
  const notebook = parseNotebook(notebookSource, notebookFile);
  const title = notebook.options.title ?? DEFAULT_TITLE;
  const body = await renderNotebook(results, notebook, title, progress);
  const assets = loadReportAssets();
  const hb = Handlebars.create();
  for (const [name, source] of Object.entries(assets.partials)) hb.registerPartial(name, source);
  const layout = hb.compile(assets.layout, { strict: true });
  return layout({
    csp: contentSecurityPolicy([assets.vega, assets.interpreter, assets.hydrate]),
    version: results.tool.version,
    title: visibleText(title, 200),
    date: readableDate(results.generated),
    generated: results.generated,
    facts: facts(results),
    headings: tableOfContents(body.html),
    css: assets.css,
    body: body.html,
    vegaScript: assets.vega,
    interpreterScript: assets.interpreter,
    hydrateScript: assets.hydrate,
  });
}
