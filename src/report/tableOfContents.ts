/**
 * The table of contents: the headings (levels 1 to 3) of the rendered main column that carry an
 * id, in page order. Reads HTML that seedsift itself produced (markdown-it output and cell HTML).
 */

/** One entry: heading level, id, and the heading's text as escaped HTML (tags removed). */
export interface TocEntry {
  readonly level: number;
  readonly id: string;
  readonly html: string;
}

/**
 * List the headings with ids in `html`.
 * Cost O(length). Never throws.
 * Example: `tableOfContents('<h2 id="runs">Runs</h2>')` → `[{ level: 2, id: 'runs', html: 'Runs' }]`.
 */
export function tableOfContents(html: string): TocEntry[] {
  const out: TocEntry[] = [];
  for (const m of html.matchAll(/<h([1-3])\b([^>]*)>([\s\S]*?)<\/h\1>/g)) {
    const id = /\sid="([^"]*)"/.exec(m[2] ?? '')?.[1];
    if (id === undefined || id === '') continue;
    const text = (m[3] ?? '').replace(/<[^>]*>/g, '').trim();
    out.push({ level: Number(m[1]), id, html: text === '' ? id : text });
  }
  return out;
}
