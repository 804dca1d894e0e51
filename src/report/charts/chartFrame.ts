/**
 * The top-level frame every chart shares: schema, size, look, title, subtitle and the
 * accessible description (Vega's `description` becomes the SVG's aria-label in `renderSvg`).
 */
import type { TopLevelSpec } from 'vega-lite';
import { CHART_CONFIG, CHART_HEIGHT, CHART_WIDTH } from '../palette.js';

/** The fields of a Vega-Lite top-level spec that `chartFrame` fills in. */
export type ChartFrame = Pick<TopLevelSpec, '$schema' | 'description' | 'title' | 'config'> & {
  width: number;
  height: number | { step: number };
};

export const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/**
 * Build the shared frame. `height` is a pixel height, or `{ step }` for charts with one row per
 * config or comparison. Subtitle lines are drawn one under another.
 * Cost O(1). Never throws.
 * Example: `chartFrame({ title: 'val_acc', subtitle: ['a'], description: 'd' })`
 * → `{ $schema, title: { text: 'val_acc', subtitle: ['a'] }, ... }`.
 */
export function chartFrame(opts: {
  readonly title: string;
  readonly subtitle: readonly string[];
  readonly description: string;
  readonly height?: number | { readonly step: number };
}): ChartFrame {
  const height =
    opts.height === undefined
      ? CHART_HEIGHT
      : typeof opts.height === 'number'
        ? opts.height
        : { step: opts.height.step };
  return {
    $schema: VEGA_LITE_SCHEMA,
    description: opts.description,
    title: { text: wrapLines([opts.title], TITLE_CHARS), subtitle: wrapLines(opts.subtitle, SUBTITLE_CHARS) },
    width: CHART_WIDTH,
    height,
    config: CHART_CONFIG,
  };
}

/**
 * Headless Vega estimates text width as 0.8 x font size per character (no canvas to measure),
 * about 1.6 times the real width, and widens the SVG to fit. Lines are wrapped at these lengths
 * so the estimate stays near the plot width (520 px: 16 px titles, 11 px subtitles).
 */
const TITLE_CHARS = 50;
const SUBTITLE_CHARS = 70;

/**
 * Word-wrap lines at `max` characters (a longer word keeps a line of its own).
 * Cost O(total length). Never throws. Example: `wrapLines(['a bb ccc'], 4)` → `['a bb', 'ccc']`.
 */
export function wrapLines(lines: readonly string[], max: number): string[] {
  const out: string[] = [];
  for (const line of lines) {
    let current = '';
    for (const word of line.split(' ')) {
      if (current !== '' && current.length + 1 + word.length > max) {
        out.push(current);
        current = word;
      } else {
        current = current === '' ? word : `${current} ${word}`;
      }
    }
    out.push(current);
  }
  return out;
}

/** One entry of a layered spec's `layer` array. */
export type Layer = Extract<TopLevelSpec, { layer: readonly unknown[] }>['layer'][number];

/** Format strings (d3-format) used in tooltips and labels. */
export const NUMBER_FORMAT = '.4~g';
export const STEP_FORMAT = ',.6~g';
