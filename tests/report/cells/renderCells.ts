/** Render a notebook body for cell tests (charts are only rendered when a cell asks for one). */
import type { Results } from '../../../src/analysis/results.js';
import { parseNotebook } from '../../../src/report/parseNotebook.js';
import { renderNotebook } from '../../../src/report/renderNotebook.js';

export async function renderCells(source: string, results: Results): Promise<string> {
  return (await renderNotebook(results, parseNotebook(source, 'cells.md'), 'cells')).html;
}

/** Text of an HTML fragment: tags removed, the five entities decoded, spaces collapsed. */
export function textOf(html: string): string {
  return html
    .replace(/<[^>]*>/g, ' ')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ')
    .trim();
}
