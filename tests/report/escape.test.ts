/**
 * Escaping, checked against the parsers that will read the output: JSON.parse (ECMA-404), the
 * HTML rules for script data (HTML Living Standard: a script element ends at `</script`), and
 * markdown-it (a CommonMark and GFM implementation) for Markdown.
 */
import fc from 'fast-check';
import MarkdownIt from 'markdown-it';
import { describe, expect, it } from 'vitest';
import { escapeAttr, escapeHtml, escapeMarkdown, jsonForScript, visibleText } from '../../src/report/escape.js';

const HOSTILE = [
  '<script>alert(1)</script>',
  '</script>',
  `"'><img src=x onerror=alert(1)>`,
  '{{verdicts}}',
  '[x](javascript:alert(1))',
  'a\u202Eb',
  '<!-- x -->',
  'line\nbreak',
  'pipe | cell',
  '&amp; &lt;',
];

/** Decode the five entities escapeHtml writes (and markdown-it's &quot;). */
function decode(html: string): string {
  return html
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&');
}

describe('escapeHtml', () => {
  it('escapes the five HTML-significant characters and nothing else', () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
    expect(escapeHtml('plain text 123')).toBe('plain text 123');
  });
  it('never leaves a tag-opening character in the output', () => {
    fc.assert(fc.property(fc.string(), (s) => !/[<>"']/.test(escapeHtml(s)) && decode(escapeHtml(s)) === s));
  });
});

describe('escapeAttr', () => {
  it('turns every ASCII character but letters, digits, -, _ and . into a character reference', () => {
    expect(escapeAttr('a b"c<d>e=f`g')).toBe('a&#x20;b&#x22;c&#x3c;d&#x3e;e&#x3d;f&#x60;g');
    expect(escapeAttr('x-y_z.1')).toBe('x-y_z.1');
  });
  it('leaves no quote, space, angle bracket, equals sign or backtick', () => {
    // The class is all of ASCII, \x00 included, so that only non-ASCII characters are stripped.
    // biome-ignore lint/suspicious/noControlCharactersInRegex: the class must start at \x00
    fc.assert(fc.property(fc.string(), (s) => !/[\s"'<>=`]/.test(escapeAttr(s).replace(/[^\x00-\x7f]/g, ''))));
  });
});

describe('jsonForScript', () => {
  it('parses back to the same value (ECMA-404 \\u escapes)', () => {
    const value = { names: HOSTILE, sep: '\u2028\u2029', n: 1.5 };
    expect(JSON.parse(jsonForScript(value))).toEqual(value);
  });
  it('cannot end or change a script element: no <, >, & or line separators appear', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        const text = jsonForScript(v);
        return !/[<>&\u2028\u2029]/.test(text) && !/<\/script/i.test(text);
      }),
    );
    expect(jsonForScript('</script><!--')).toBe('"\\u003c/script\\u003e\\u003c!--"');
  });
  it('writes NaN and infinities as null, as JSON.stringify does', () => {
    expect(jsonForScript({ a: NaN, b: Infinity })).toBe('{"a":null,"b":null}');
  });
});

describe('visibleText', () => {
  it('shows bidi overrides and zero-width characters as code points', () => {
    expect(visibleText('abc\u202Etxt.exe')).toBe('abc‹U+202E›txt.exe');
    expect(visibleText('a\u200Bb\u2066c')).toBe('a‹U+200B›b‹U+2066›c');
    expect(visibleText('tab\there\nnew')).toBe('tab here new');
  });
  it('cuts long text and says how long it was', () => {
    const long = 'x'.repeat(10_000);
    expect(visibleText(long, 10)).toBe('xxxxxxxxxx… (10000 characters)');
    expect(visibleText('short', 10)).toBe('short');
  });
});

describe('escapeMarkdown, read back by markdown-it', () => {
  const md = new MarkdownIt();
  /** Render text as the second cell of a GFM table row and return that cell's text. */
  function cellText(text: string): string | undefined {
    const html = md.render(`| a | b |\n| --- | --- |\n| x | y ${escapeMarkdown(text)} |\n`);
    const cells = [...html.matchAll(/<td>([\s\S]*?)<\/td>/g)].map((m) => m[1] ?? '');
    return cells.length === 2 ? decode(cells[1] ?? '') : undefined;
  }

  it('keeps hostile names literal inside a table cell (no HTML, link, emphasis, or cell break)', () => {
    for (const name of HOSTILE) {
      expect(cellText(name)).toBe(`y ${visibleText(name)}`);
    }
  });

  it('keeps any printable ASCII text literal in a cell (property, 300 cases)', () => {
    const printable = fc.string({
      unit: fc.constantFrom(...Array.from({ length: 95 }, (_, i) => String.fromCharCode(32 + i))),
      maxLength: 40,
    });
    fc.assert(
      fc.property(printable, (s) => cellText(s) === `y ${s}`.trim()),
      { numRuns: 300, seed: 7 },
    );
  });
});
