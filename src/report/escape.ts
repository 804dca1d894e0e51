/**
 * Escaping for every value that travels from data (run names, config ids, metric names, problem
 * messages, file paths) into a report. The notebook's own Markdown is trusted; data never is.
 *
 * - `escapeHtml`: text content and double-quoted attribute values (the five characters of the
 *   HTML Living Standard's "escaping a string" plus the single quote).
 * - `escapeAttr`: attribute values, escaping every ASCII character that is not a letter or digit as
 *   a numeric character reference (common practice: the OWASP XSS prevention rule for attributes),
 *   so the value stays inert even if a template forgets its quotes.
 * - `jsonForScript`: JSON that may sit inside `<script type="application/json">`: `<`, `>`, `&`
 *   and U+2028/U+2029 become `\uXXXX` escapes, so `</script>` and `<!--` cannot end or change the
 *   element, and the text still parses with `JSON.parse` to the same value.
 * - `visibleText`: invisible and direction-changing characters (C0/C1 controls, bidi embeddings,
 *   overrides and isolates, zero-width characters) shown as `‹U+202E›`, so that a name cannot
 *   disguise itself (an RTL override turning "txt.exe" around); long names cut to a limit.
 * - `escapeMarkdown`: text for GitHub-flavoured Markdown (table cells included): the punctuation
 *   that starts inline syntax backslash-escaped (CommonMark 0.31, section 2.4 allows a backslash
 *   before any ASCII punctuation), `|` for table cells, `$` (math), `@` and `#` (GitHub mentions
 *   and references); newlines as spaces.
 */

const HTML_ESCAPES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/**
 * Escape text for HTML text content or a double-quoted attribute.
 * Cost O(length). Never throws.
 * Example: `escapeHtml('<b>"x"</b>')` → `'&lt;b&gt;&quot;x&quot;&lt;/b&gt;'`.
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c] ?? c);
}

/**
 * Escape an attribute value: every ASCII character other than letters, digits, `-`, `_`, `.`
 * becomes `&#xHH;`; other characters pass through (they cannot end an attribute).
 * Cost O(length). Never throws.
 * Example: `escapeAttr('a b"c')` → `'a&#x20;b&#x22;c'`.
 */
export function escapeAttr(text: string): string {
  return text.replace(/[^-.0-9A-Z_a-z\u0080-\uffff]/g, (c) => `&#x${c.charCodeAt(0).toString(16)};`);
}

/**
 * Serialise a value as JSON that is safe inside an HTML `<script>` element. NaN and infinities
 * become null (as `JSON.stringify` does).
 * Cost O(size). Throws a TypeError on cyclic values (from `JSON.stringify`).
 * Example: `jsonForScript({ a: '</script>' })` → `'{"a":"\\u003c/script\\u003e"}'`.
 */
export function jsonForScript(value: unknown): string {
  const json = JSON.stringify(value) ?? 'null';
  return json.replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** Characters that are invisible or change text direction (Unicode bidi controls, zero-width marks, controls). */
const HIDDEN =
  // biome-ignore lint/suspicious/noControlCharactersInRegex: this expression exists to find control characters
  /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u061c\u200b-\u200f\u202a-\u202e\u2060-\u2064\u2066-\u2069\ufeff]/g;

/**
 * Make hidden characters visible (`‹U+202E›`), turn tabs and newlines into spaces, and cut the text
 * to `limit` characters with an ellipsis and the full length ("… (10000 characters)").
 * The result is plain text: escape it for its destination afterwards.
 * Cost O(length). Never throws.
 * Example: `visibleText('a\u202Eb')` → `'a‹U+202E›b'`.
 */
export function visibleText(text: string, limit = Infinity): string {
  const shown = text
    .replace(/[\t\n\r]/g, ' ')
    .replace(HIDDEN, (c) => `‹U+${c.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}›`);
  if (shown.length <= limit) return shown;
  return `${shown.slice(0, limit)}… (${text.length} characters)`;
}

/**
 * Escape text for GitHub-flavoured Markdown inline content, including a table cell: hidden
 * characters made visible, newlines as spaces, and a backslash before each of
 * `\ \` * _ [ ] < > | ~ & ! $ @ #` (so no emphasis, link, HTML, entity, cell break, math, mention
 * or reference is formed). Block syntax (`#` headings, lists) cannot start inside a cell or after
 * other text, which is where this is used.
 * Cost O(length). Never throws.
 * Example: `escapeMarkdown('a|b_c')` → `'a\\|b\\_c'`.
 */
export function escapeMarkdown(text: string, limit = Infinity): string {
  return visibleText(text, limit).replace(/[\\`*_[\]<>|~&!$@#]/g, (c) => `\\${c}`);
}
