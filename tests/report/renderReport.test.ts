/**
 * The report page as a file: self-contained (no URL that could be fetched), a Content-Security-
 * Policy whose script hashes match the inline scripts (SHA-256 per FIPS 180-4, recomputed here
 * with node:crypto; hash-source syntax per CSP Level 3) and that allows no eval, every chart
 * present as SVG with a parseable compiled spec, the verdict table first, and the same bytes for
 * the same input. (The browser test opens the page; this one reads the text.)
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { interpreterScript } from '../../src/report/interpreterScript.js';
import { DEFAULT_NOTEBOOK } from '../../src/report/templatePaths.js';
import { readableDate, renderReport } from '../../src/report/renderReport.js';
import { demoSizedResults } from './demoSizedResults.js';
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
    const hashes = inlineScripts(html).map(
      (s) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`,
    );
    expect(hashes).toHaveLength(3);
    // Exactly the three hashes: no 'unsafe-eval' (Vega's expressions are interpreted, not compiled), no
    // 'unsafe-inline'.
    expect(directives.get('script-src')).toEqual(hashes);
    expect(csp).not.toContain('unsafe-eval');
  });

  it('contains no URL that could be fetched', () => {
    // Markup, styles and chart specs: every reference stays inside the page.
    const markup = inlineScripts(html).reduce((page, script) => page.replace(script, ''), html);
    expect(markup).not.toMatch(/\s(src|href|xlink:href|action|poster|srcset)="(?!#|data:)/i);
    expect(markup).not.toMatch(/url\((?!#)/i);
    expect(markup).not.toMatch(/@import|<link\b|<iframe\b|<img\b|<object\b|<embed\b/i);
    // Only XML namespace names remain, inside the Vega runtime (they are never fetched).
    const urls = new Set(html.match(/https?:\/\/[^\s"'`<>)]+/g) ?? []);
    expect([...urls].sort()).toEqual([
      'http://www.w3.org/1999/xlink',
      'http://www.w3.org/2000/svg',
      'http://www.w3.org/2000/xmlns/',
    ]);
    const vega = inlineScripts(html)[0] ?? '';
    for (const url of urls) expect(html.split(url).length - 1).toBe(vega.split(url).length - 1);
  });

  it('inlines the Vega runtime and its expression interpreter from node_modules, and the interaction script', () => {
    const [vega, interpreter, hydrate] = inlineScripts(html);
    expect(vega).toBe(readFileSync(new URL('../../node_modules/vega/build/vega.min.js', import.meta.url), 'utf8'));
    expect(interpreter).toBe(
      interpreterScript(
        readFileSync(new URL('../../node_modules/vega-interpreter/build/vega-interpreter.js', import.meta.url), 'utf8'),
      ),
    );
    expect(hydrate).toContain('vega.parse(spec, null, { ast: true })');
    expect(hydrate).toContain('expr: vegaInterpreter');
  });

  it('draws every chart as SVG with marks, beside a compiled Vega spec that parses', () => {
    const figures = [...html.matchAll(/<figure class="chart" id="chart-(\d+)">([\s\S]*?)<\/figure>/g)];
    // 15 charts of the cells, and the sweep of val_acc against memory (the fixture's one numeric key).
    expect(figures.length).toBe(16);
    for (const [, , inner] of figures) {
      const svg = /<svg[\s\S]*<\/svg>/.exec(inner ?? '')?.[0] ?? '';
      expect(svg).toMatch(/<path|<rect|<line|<circle/);
      const json =
        /<script type="application\/json" class="chart-spec">([\s\S]*?)<\/script>/.exec(inner ?? '')?.[1] ?? '';
      const spec = JSON.parse(json) as { marks?: unknown[]; $schema?: string };
      expect(Array.isArray(spec.marks)).toBe(true);
      expect(spec.$schema).toBeUndefined();
    }
    // Charts on one page never share an element id (clip paths would cross over).
    const ids = [...html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it(
    'draws no invisible hover layer in the SVG but keeps it in the live spec, and rounds chart data to 6 ' +
      'significant digits',
    () => {
      const figure =
        [...html.matchAll(/<figure class="chart" id="chart-\d+">([\s\S]*?)<\/figure>/g)]
          .map((m) => m[1] ?? '')
          .find((f) => f.includes('<title>val_acc: learning curves</title>')) ?? '';
      expect(figure).toContain('learning curves');
      const svg = /<svg[\s\S]*<\/svg>/.exec(figure)?.[0] ?? '';
      const json = /<script type="application\/json" class="chart-spec">([\s\S]*?)<\/script>/.exec(figure)?.[1] ?? '';
      expect(svg).toContain('mean_marks');
      expect(svg).not.toContain('hover_marks');
      expect(json).toContain('"name":"hover_marks"');
      // Every number in every chart's inline data: an integer, or at most 6 significant digits.
      const numbers: number[] = [];
      const walk = (node: unknown): void => {
        if (typeof node === 'number') numbers.push(node);
        else if (Array.isArray(node)) node.forEach(walk);
        else if (node !== null && typeof node === 'object') Object.values(node).forEach(walk);
      };
      for (const m of html.matchAll(/<script type="application\/json" class="chart-spec">([\s\S]*?)<\/script>/g)) {
        const spec = JSON.parse(m[1] ?? '{}') as { data?: { values?: unknown }[] };
        for (const d of spec.data ?? []) walk(d.values);
      }
      expect(numbers.length).toBeGreaterThan(1000);
      expect(numbers.filter((x) => !Number.isInteger(x) && Number(x.toPrecision(6)) !== x)).toEqual([]);
      // The fixture's data does carry longer numbers (so the check above is not vacuous).
      expect(
        sampleResults()
          .curves.flatMap((c) => c.mean)
          .some((x) => x !== null && Number(x.toPrecision(6)) !== x),
      ).toBe(true);
    },
  );

  it('says how to toggle configs beside the charts whose legend does it, and only there', () => {
    const figures = [...html.matchAll(/<figure class="chart" id="chart-\d+">([\s\S]*?)<\/figure>/g)].map(
      (m) => m[1] ?? '',
    );
    const titled = (title: string): string => figures.find((f) => f.includes(`<title>${title}</title>`)) ?? '';
    const hint =
      '<p class="chart-hint">Click a config in the legend to show it alone; shift-click to add or remove ' +
      'one; double-click the plot to show all.</p>';
    for (const title of [
      'val_acc: learning curves',
      'tick_acc by internal tick',
      'Halting: accuracy at exit against exit tick',
      'Calibration by internal tick',
    ])
      expect(titled(title)).toContain(hint);
    expect(titled('val_acc: one value per seed (final)')).not.toContain('chart-hint');
    // Two metrics' curves, ticks, halting, calibration.
    expect(figures.filter((f) => f.includes('chart-hint'))).toHaveLength(5);
    expect(html).toMatch(/\.chart-hint \{ display: none;/);
  });

  it(
    'puts the overview first (the answer before any chart), ' + 'with a table of contents and the date of the results',
    () => {
      const main = html.slice(html.indexOf('<main'));
      expect(main.indexOf('<div class="overview-cell">')).toBeGreaterThan(0);
      expect(main.indexOf('<div class="overview-cell">')).toBeLessThan(main.indexOf('<figure'));
      expect(main.indexOf('<div class="overview-cell">')).toBeLessThan(main.indexOf('<table class="verdicts">'));
      expect(html).toContain('<p class="kicker">seedsift report · 1 March 2026, 12:00 UTC</p>');
      const toc = /<nav class="toc"[\s\S]*?<\/nav>/.exec(html)?.[0] ?? '';
      for (const entry of [
        'Overview',
        'All verdicts',
        'val_acc',
        'train_loss',
        'Ticks',
        'Halting',
        'Calibration',
        'Runs',
        'Problems',
        'Methods',
      ]) {
        expect(toc).toContain(`>${entry}</a>`);
      }
      for (const [, id] of toc.matchAll(/href="#([^"]+)"/g)) expect(html).toContain(`id="${id}"`);
    },
  );

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

describe('the size of a report as large as the demo', () => {
  it('stays under 2 MB (6 configs x 5 seeds, a 200-bin learning curve, ticks, halting, calibration)', async () => {
    const results = demoSizedResults();
    // The fixture has the demo's shape (so the bound speaks for the demo report).
    expect(results.curves.filter((c) => c.metric === 'train_loss').map((c) => c.steps.length * c.runs.length)).toEqual([
      1000, 1000, 1000, 1000, 1000, 1000,
    ]);
    expect(results.ticks.map((t) => t.ticks.length)).toEqual([8, 8, 16, 16, 32, 32, 8, 8, 16, 16, 32, 32]);
    const page = await renderReport(results, NOTEBOOK, 'templates/notebook.md');
    // 17 charts of the cells and two sweeps (val_acc against ticks and against memory).
    expect([...page.matchAll(/<figure class="chart"/g)]).toHaveLength(19);
    // Rendered by the code of commit 8f350a1 (before this bound), this fixture measured 3,277,052 bytes.
    expect(Buffer.byteLength(page, 'utf8')).toBeLessThan(2_000_000);
  });
});

describe('readableDate', () => {
  it('reads ISO dates and leaves other text alone', () => {
    expect(readableDate('2026-03-01T12:00:00.000Z')).toBe('1 March 2026, 12:00 UTC');
    expect(readableDate('2026-12-31')).toBe('31 December 2026');
    expect(readableDate('yesterday')).toBe('yesterday');
  });
});
