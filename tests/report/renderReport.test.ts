/**
 * The report page as a file: self-contained (no URL that could be fetched), a Content-Security-
 * Policy whose script hashes match the inline scripts (SHA-256 per FIPS 180-4, recomputed here
 * with node:crypto; hash-source syntax per CSP Level 3), every chart present as SVG with a
 * parseable compiled spec, the verdict table first, and the same bytes for the same input.
 * (The browser test opens the page; this one reads the text.)
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_NOTEBOOK } from '../../src/report/templatePaths.js';
import { readableDate, renderReport } from '../../src/report/renderReport.js';
import { sampleResults } from './sampleResults.js';

const NOTEBOOK = readFileSync(DEFAULT_NOTEBOOK, 'utf8');
let html = '';

beforeAll(async () => {
  html = await renderReport(sampleResults(), NOTEBOOK, 'templates/notebook.md');
});

/** Executable inline scripts (no type attribute), as the browser would hash them. */
function inlineScripts(page: string): string[] {
  return [...page.matchAll(/<script>([\s\S]*?)<\/script>/g)].map((m) => m[1] ?? '');
}

describe('renderReport', () => {
  it('starts with a Content-Security-Policy that forbids network access', () => {
    const head = html.slice(0, html.indexOf('</head>'));
    const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]*)">/.exec(head)?.[1] ?? '';
    expect(head.indexOf('Content-Security-Policy')).toBeLessThan(head.indexOf('<style>'));
    const directives = new Map(csp.split('; ').map((d) => [d.split(' ')[0], d.split(' ').slice(1)] as const));
    expect(directives.get('default-src')).toEqual(["'none'"]);
    expect(directives.get('connect-src')).toEqual(["'none'"]);
    expect(directives.get('img-src')).toEqual(['data:']);
    expect(directives.get('style-src')).toEqual(["'unsafe-inline'"]);
    const hashes = inlineScripts(html).map((s) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`);
    expect(hashes).toHaveLength(2);
    expect(directives.get('script-src')).toEqual([...hashes, "'unsafe-eval'"]);
  });

  it('contains no URL that could be fetched', () => {
    // Markup, styles and chart specs: every reference stays inside the page.
    const markup = inlineScripts(html).reduce((page, script) => page.replace(script, ''), html);
    expect(markup).not.toMatch(/\s(src|href|xlink:href|action|poster|srcset)="(?!#|data:)/i);
    expect(markup).not.toMatch(/url\((?!#)/i);
    expect(markup).not.toMatch(/@import|<link\b|<iframe\b|<img\b|<object\b|<embed\b/i);
    // Only XML namespace names remain, inside the Vega runtime (they are never fetched).
    const urls = new Set(html.match(/https?:\/\/[^\s"'`<>)]+/g) ?? []);
    expect([...urls].sort()).toEqual(['http://www.w3.org/1999/xlink', 'http://www.w3.org/2000/svg', 'http://www.w3.org/2000/xmlns/']);
    const vega = inlineScripts(html)[0] ?? '';
    for (const url of urls) expect(html.split(url).length - 1).toBe(vega.split(url).length - 1);
  });

  it('inlines the Vega runtime from node_modules and the interaction script', () => {
    const [vega, hydrate] = inlineScripts(html);
    expect(vega).toBe(readFileSync(new URL('../../node_modules/vega/build/vega.min.js', import.meta.url), 'utf8'));
    expect(hydrate).toContain('new vega.View(vega.parse(spec)');
  });

  it('draws every chart as SVG with marks, beside a compiled Vega spec that parses', () => {
    const figures = [...html.matchAll(/<figure class="chart" id="chart-(\d+)">([\s\S]*?)<\/figure>/g)];
    expect(figures.length).toBe(15);
    for (const [, , inner] of figures) {
      const svg = /<svg[\s\S]*<\/svg>/.exec(inner ?? '')?.[0] ?? '';
      expect(svg).toMatch(/<path|<rect|<line|<circle/);
      const json = /<script type="application\/json" class="chart-spec">([\s\S]*?)<\/script>/.exec(inner ?? '')?.[1] ?? '';
      const spec = JSON.parse(json) as { marks?: unknown[]; $schema?: string };
      expect(Array.isArray(spec.marks)).toBe(true);
      expect(spec.$schema).toBeUndefined();
    }
    // Charts on one page never share an element id (clip paths would cross over).
    const ids = [...html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('puts the verdict table first, with a table of contents and the date of the results', () => {
    const main = html.slice(html.indexOf('<main'));
    expect(main.indexOf('<table class="verdicts">')).toBeLessThan(main.indexOf('<figure'));
    expect(html).toContain('<p class="kicker">seedsift report · 1 March 2026, 12:00 UTC</p>');
    const toc = /<nav class="toc"[\s\S]*?<\/nav>/.exec(html)?.[0] ?? '';
    for (const entry of ['Verdicts', 'val_acc', 'train_loss', 'Ticks', 'Halting', 'Calibration', 'Runs', 'Problems', 'Methods']) {
      expect(toc).toContain(`>${entry}</a>`);
    }
    for (const [, id] of toc.matchAll(/href="#([^"]+)"/g)) expect(html).toContain(`id="${id}"`);
  });

  it('prints: print styles hide the contents column', () => {
    expect(html).toMatch(/@media print \{[\s\S]*\.toc[^}]*display: none/);
  });

  it('gives the same bytes for the same results', async () => {
    const again = await renderReport(sampleResults(), NOTEBOOK, 'templates/notebook.md');
    expect(again === html).toBe(true);
  });

  it('uses the front matter title', async () => {
    const page = await renderReport(sampleResults(), '---\ntitle: Memory <study>\n---\n{{verdicts}}\n', 'n.md');
    expect(page).toContain('<title>Memory &lt;study&gt;</title>');
    expect(page).toContain('<h1>Memory &lt;study&gt;</h1>');
  });
});

describe('readableDate', () => {
  it('reads ISO dates and leaves other text alone', () => {
    expect(readableDate('2026-03-01T12:00:00.000Z')).toBe('1 March 2026, 12:00 UTC');
    expect(readableDate('2026-12-31')).toBe('31 December 2026');
    expect(readableDate('yesterday')).toBe('yesterday');
  });
});
