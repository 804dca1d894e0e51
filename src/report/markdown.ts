/**
 * Markdown for the notebook's prose: markdown-it (CommonMark) with raw HTML allowed, since the
 * notebook is the author's own trusted file (every value from data is escaped by the cells and
 * never passes through Markdown), no typographic replacements, and an id on every heading so the
 * table of contents can link to it.
 */
import MarkdownIt from 'markdown-it';

/**
 * A markdown-it instance whose headings get ids from `slug` (unique within the page).
 * Cost O(1). Never throws.
 * Example: `createMarkdown(createSlugger()).render('## Curves')` → `'<h2 id="curves">Curves</h2>\n'`.
 */
export function createMarkdown(slug: (text: string) => string): ReturnType<typeof MarkdownIt> {
  const md = new MarkdownIt({ html: true, linkify: false, typographer: false });
  md.core.ruler.push('seedsift_heading_ids', (state) => {
    const tokens = state.tokens;
    tokens.forEach((token, i) => {
      if (token.type !== 'heading_open' || token.attrGet('id') !== null) return;
      const inline = tokens[i + 1];
      const text = (inline?.children ?? [])
        .filter((c) => c.type === 'text' || c.type === 'code_inline')
        .map((c) => c.content)
        .join('');
      token.attrSet('id', slug(text));
    });
    return true;
  });
  return md;
}
