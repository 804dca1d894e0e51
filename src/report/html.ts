/**
 * Small builders for the report's HTML: data text (escaped, hidden characters shown), names (cut
 * when very long, the full name kept in a tooltip), tables with numeric columns, notes. Every
 * builder escapes what it is given as text; `raw` cells are HTML that a caller built with these
 * same builders.
 */
import { escapeAttr, escapeHtml, visibleText } from './escape.js';

/** Names longer than this are cut on the page (the whole name stays in the title attribute). */
export const NAME_LIMIT = 120;

/** Names and paths longer than this may break anywhere; shorter ones never break inside. */
const BREAK_FROM = 32;

/**
 * Data text as HTML: hidden characters made visible, then escaped.
 * Cost O(length). Never throws. Example: `textHtml('a<b')` → `'a&lt;b'`.
 */
export function textHtml(text: string): string {
  return escapeHtml(visibleText(text));
}

/**
 * A name from the data (config, metric, seed, run, file) as an isolated span, cut to `NAME_LIMIT`
 * characters with the whole name in its title.
 * Cost O(length). Never throws. Example: `nameHtml('memory=4')` → `'<bdi class="name">memory=4</bdi>'`.
 */
export function nameHtml(name: string): string {
  const shown = visibleText(name, NAME_LIMIT);
  const title = shown === visibleText(name) ? '' : ` title="${escapeAttr(visibleText(name))}"`;
  return `<bdi class="${shown.length > BREAK_FROM ? 'name long' : 'name'}"${title}>${escapeHtml(shown)}</bdi>`;
}

/**
 * A path or code from the data in `<code>`, allowed to break anywhere when long.
 * Cost O(length). Never throws. Example: `codeHtml('a/b.csv')` → `'<code>a/b.csv</code>'`.
 */
export function codeHtml(text: string): string {
  const shown = visibleText(text);
  return `<code${shown.length > BREAK_FROM ? ' class="long"' : ''}>${escapeHtml(shown)}</code>`;
}

/** One table cell: text (escaped here) or HTML built by these builders. */
export type TableCell = string | { readonly html: string } | null;

/** A table: header labels, rows, which columns hold numbers (right-aligned, tabular figures). */
export interface TableSpec {
  readonly className?: string;
  readonly caption?: string;
  readonly head: readonly (string | { readonly html: string })[];
  readonly rows: readonly (readonly TableCell[])[];
  readonly numeric?: readonly number[];
  /** Extra class per row (e.g. a verdict), same length as rows when given. */
  readonly rowClasses?: readonly (string | null)[];
}

function cellHtml(cell: TableCell): string {
  if (cell === null) return '<span class="missing">—</span>';
  return typeof cell === 'string' ? textHtml(cell) : cell.html;
}

/**
 * Render a table. Header labels and string cells are escaped; `{ html }` cells are inserted as they are.
 * Cost O(cells). Never throws.
 * Example: `tableHtml({ head: ['a'], rows: [['<x>']] })` → `'<div class="table-wrap"><table>...<td>&lt;x&gt;</td>...'`.
 */
export function tableHtml(spec: TableSpec): string {
  const numeric = new Set(spec.numeric ?? []);
  const cls = (i: number): string => (numeric.has(i) ? ' class="num"' : '');
  const head = spec.head
    .map((h, i) => `<th scope="col"${cls(i)}>${typeof h === 'string' ? textHtml(h) : h.html}</th>`)
    .join('');
  const body = spec.rows
    .map((row, r) => {
      const rowClass = spec.rowClasses?.[r];
      const open = rowClass === undefined || rowClass === null ? '<tr>' : `<tr class="${escapeAttr(rowClass)}">`;
      return `${open}${row.map((c, i) => `<td${cls(i)}>${cellHtml(c)}</td>`).join('')}</tr>`;
    })
    .join('');
  const caption = spec.caption === undefined ? '' : `<caption>${escapeHtml(spec.caption)}</caption>`;
  const className = spec.className === undefined ? '' : ` class="${escapeAttr(spec.className)}"`;
  return (
    `<div class="table-wrap"><table${className}>${caption}<thead><tr>${head}</tr></thead><tbody>${body}` +
    `</tbody></table></div>`
  );
}

/**
 * A note paragraph (escaped text).
 * Cost O(length). Never throws. Example: `noteHtml('no tick data')` → `'<p class="note">no tick data</p>'`.
 */
export function noteHtml(text: string, className = 'note'): string {
  return `<p class="${escapeAttr(className)}">${textHtml(text)}</p>`;
}

/**
 * A bulleted list of data text lines (escaped).
 * Cost O(total length). Never throws.
 */
export function listHtml(lines: readonly string[], className = 'cautions'): string {
  if (lines.length === 0) return '';
  return `<ul class="${escapeAttr(className)}">${lines.map((l) => `<li>${textHtml(l)}</li>`).join('')}</ul>`;
}
