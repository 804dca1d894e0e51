/**
 * renderSvg / compileVega (src/report/renderSvg.ts; kept beside the chart tests, the folder this
 * helper owns). External references: Vega's own SVG output and id counters (vega-scenegraph
 * `clip_id`), Vega-Lite's and Vega's logger messages.
 */
import { parse, View } from 'vega';
import type { TopLevelSpec } from 'vega-lite';
import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  compileVega,
  compileVegaWithWarnings,
  renderSvg,
  renderSvgWithWarnings,
} from '../../../src/report/renderSvg.js';

const clipped = (n: number): TopLevelSpec => ({
  title: 'clipped',
  description: 'a clipped bar chart',
  data: { values: Array.from({ length: n }, (_, i) => ({ a: `k${i}`, b: i + 1 })) },
  mark: { type: 'bar', clip: true },
  encoding: { x: { field: 'a', type: 'nominal' }, y: { field: 'b', type: 'quantitative' } },
});

afterEach(() => {
  vi.restoreAllMocks();
});

describe('renderSvg', () => {
  it('adds an escaped <title>, <desc>, role and aria-label from the spec title and description', async () => {
    const svg = await renderSvg({ ...clipped(2), title: { text: 'T <&> "x"' }, description: "D 'q' <b>" });
    expect(svg.startsWith('<svg ')).toBe(true);
    const root = svg.slice(0, svg.indexOf('>') + 1);
    expect(root).toContain(' role="graphics-document document"');
    expect(root).toContain(' aria-label="D &#39;q&#39; &lt;b&gt;"');
    expect(svg.slice(root.length)).toMatch(
      /^<title>T &lt;&amp;&gt; &quot;x&quot;<\/title><desc>D &#39;q&#39; &lt;b&gt;<\/desc>/,
    );
  });

  it('numbers clip ids from 1 whatever rendered before, where raw Vega output does not', async () => {
    const rawSvg = async (spec: TopLevelSpec): Promise<string> => {
      const view = new View(parse(compileVega(spec)), { renderer: 'none' });
      const out = await view.toSVG();
      view.finalize();
      return out;
    };
    const rawFirst = await rawSvg(clipped(3));
    await rawSvg(clipped(4));
    expect(await rawSvg(clipped(3))).not.toBe(rawFirst); // Vega's process-wide counter moved on

    const first = await renderSvg(clipped(3));
    await renderSvg(clipped(4));
    const again = await renderSvg(clipped(3));
    expect(again).toBe(first);
    expect(first).toContain('id="clip1"');
    expect(first).toContain('url(#clip1)');
    expect(new Set(first.match(/clip\d+/g))).toEqual(new Set(['clip1']));
  });

  it('rejects when Vega cannot parse the spec', async () => {
    const bad: TopLevelSpec = { ...clipped(2), transform: [{ calculate: 'datum.b +* 2', as: 'c' }] };
    await expect(renderSvg(bad)).rejects.toThrow();
  });

  it('collects Vega runtime warnings instead of printing them', async () => {
    const warn = vi.spyOn(console, 'warn');
    const error = vi.spyOn(console, 'error');
    const empty: TopLevelSpec = {
      data: { values: [{ a: null }, { a: null }] },
      mark: 'point',
      encoding: { x: { field: 'a', type: 'quantitative' } },
    };
    const { warnings } = await renderSvgWithWarnings(empty);
    expect(warnings.join('\n')).toContain('Infinite extent');
    expect(warn).not.toHaveBeenCalled();
    expect(error).not.toHaveBeenCalled();
  });
});

describe('compileVega', () => {
  it('returns the compiled Vega spec', () => {
    const vega = compileVega(clipped(2));
    expect(vega.$schema).toMatch(/^https:\/\/vega\.github\.io\/schema\/vega\/v\d+\.json$/);
    expect(vega.marks?.length).toBeGreaterThan(0);
    expect(vega.description).toBe('a clipped bar chart');
  });

  it('collects Vega-Lite compiler warnings instead of printing them', () => {
    const warn = vi.spyOn(console, 'warn');
    const spec: TopLevelSpec = {
      data: { values: [{ a: 1 }] },
      mark: 'bar',
      encoding: { x: { field: 'a', type: 'quantitative' }, theta: { field: 'a', type: 'quantitative' } },
    };
    const { warnings } = compileVegaWithWarnings(spec);
    expect(warnings).toEqual(['theta dropped as it is incompatible with "bar".']); // Vega-Lite's log/message.ts wording
    expect(warn).not.toHaveBeenCalled();
  });
});
