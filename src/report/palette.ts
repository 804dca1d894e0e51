/**
 * The look of every seedsift chart: colours, type and the Vega-Lite `config` block.
 *
 * Colours come from the colour-blind-safe palette of Okabe & Ito (2008), "Color Universal Design
 * (CUD): how to make figures and presentations that are friendly to colorblind people"
 * (https://jfly.uni-koeln.de/color/), then, for configs 9 to 17, Paul Tol's muted scheme. Configs
 * take them in the order of `Results.configs`, so a config has the same colour in every chart of
 * one report. With a task key a config's colour is its group's (`method=x` has one colour on every
 * task); from `HIGHLIGHT_FROM` groups on, only the baseline and decided candidates keep a colour
 * and the rest are drawn in `MUTED_INK` (the charts' captions say so). Verdicts use the palette's green and
 * vermillion plus a neutral grey, and are always named in text and shape as well as colour.
 *
 * The look is our own: a warm paper background, serif titles over sans-serif labels, dotted grid
 * lines, no frame around the plot area.
 */
import type { Config } from 'vega-lite';
import type { Results, Verdict } from '../analysis/results.js';
import { configGroups, highlightedGroups } from './studyShape.js';

/** Okabe & Ito (2008) colours, by their published names. */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

/**
 * Paul Tol's "muted" qualitative scheme (Tol 2021, "Colour schemes", SRON technical note
 * SRON/EPS/TN/09-002; values from memory), also designed to stay apart for colour-blind readers:
 * the colours of configs 9 to 17, so that a study with more configs than Okabe & Ito have colours
 * does not show two configs in one colour.
 */
export const TOL_MUTED = {
  indigo: '#332288',
  cyan: '#88CCEE',
  teal: '#44AA99',
  green: '#117733',
  olive: '#999933',
  sand: '#DDCC77',
  rose: '#CC6677',
  wine: '#882255',
  purple: '#AA4499',
} as const;

/**
 * Order in which configs take colours: the Okabe & Ito colours first, the darker, high-contrast
 * ones first on a light background and yellow (low contrast on white) last; then Tol's muted
 * colours. An 18th config starts the cycle again.
 */
export const CONFIG_COLOURS: readonly string[] = [
  OKABE_ITO.blue,
  OKABE_ITO.vermillion,
  OKABE_ITO.bluishGreen,
  OKABE_ITO.reddishPurple,
  OKABE_ITO.orange,
  OKABE_ITO.skyBlue,
  OKABE_ITO.black,
  OKABE_ITO.yellow,
  // Tol's colours least like an Okabe & Ito one first (rose, teal, sand and cyan are near
  // reddish purple, bluish green, yellow and sky blue).
  TOL_MUTED.indigo,
  TOL_MUTED.olive,
  TOL_MUTED.wine,
  TOL_MUTED.green,
  TOL_MUTED.purple,
  TOL_MUTED.rose,
  TOL_MUTED.teal,
  TOL_MUTED.sand,
  TOL_MUTED.cyan,
];

/** Verdict colours (grey is not in the palette: it is the neutral "no decision"). */
export const VERDICT_COLOURS: Readonly<Record<Verdict, string>> = {
  better: OKABE_ITO.bluishGreen,
  worse: OKABE_ITO.vermillion,
  inconclusive: '#7d7a73',
};

/** Verdict shapes, so that the verdict never rests on colour alone. */
export const VERDICT_SHAPES: Readonly<Record<Verdict, string>> = {
  better: 'triangle-up',
  worse: 'triangle-down',
  inconclusive: 'circle',
};

export const VERDICTS: readonly Verdict[] = ['better', 'worse', 'inconclusive'];

/** Neutral ink for reference lines (zero, diagonal, margins). */
export const REFERENCE_INK = '#4a4740';
export const PAPER = '#fbf9f4';
export const TITLE_FONT = "Charter, 'Bitstream Charter', 'Iowan Old Style', 'Palatino Linotype', Georgia, serif";
export const LABEL_FONT = "'Fira Sans', 'Source Sans 3', 'Segoe UI', 'Helvetica Neue', Arial, sans-serif";
export const CHART_WIDTH = 520;
export const CHART_HEIGHT = 260;

/**
 * A colour scale for the configs drawn in one chart: `domain` lists them in `Results.configs`
 * order, `range` gives each its report-wide colour. Configs not in `Results.configs` (which
 * analysis should never produce) follow, in the order given.
 * Cost O(configs * present). Never throws.
 * Example: `configColourScale(results, ['b'])` with configs [a, b] → `{ domain: ['b'], range: ['#D55E00'] }`.
 */
export function configColourScale(results: Results, present: readonly string[]): { domain: string[]; range: string[] } {
  const groups = configGroups(results);
  const order = [...new Set(groups.values())];
  const highlighted = highlightedGroups(results);
  const colourOf = (group: string, fallback: number): string => {
    if (highlighted !== null) {
      const i = highlighted.indexOf(group);
      return i < 0 ? MUTED_INK : (CONFIG_COLOURS[i] ?? OKABE_ITO.black);
    }
    const i = order.indexOf(group);
    return CONFIG_COLOURS[(i < 0 ? fallback : i) % CONFIG_COLOURS.length] ?? OKABE_ITO.black;
  };
  const known = results.configs.map((c) => c.id);
  const wanted = new Set(present);
  const extra = [...wanted].filter((id) => !groups.has(id));
  const domain: string[] = [];
  const range: string[] = [];
  [...known, ...extra].forEach((id, index) => {
    if (!wanted.has(id)) return;
    domain.push(id);
    range.push(colourOf(groups.get(id) ?? id, order.length + index - known.length));
  });
  return { domain, range };
}

/** The grey of configs that are not highlighted on a page with many (see `highlightedGroups`). */
export const MUTED_INK = '#c4beb2';

/**
 * The report-wide colour of one config (its index in `Results.configs`, cycling after seventeen).
 * Example: `configColour(results, results.configs[0].id)` → `'#0072B2'`.
 */
export function configColour(results: Results, config: string): string {
  return configColourScale(results, [config]).range[0] ?? OKABE_ITO.black;
}

/** Legend of the config colours: solid strokes, whatever the layer's mark. */
export const CONFIG_LEGEND = { symbolType: 'stroke', symbolOpacity: 1, symbolStrokeWidth: 3, symbolSize: 220 } as const;

/** The Vega-Lite `config` block shared by every chart. */
export const CHART_CONFIG: Config = {
  background: PAPER,
  padding: { left: 8, right: 16, top: 8, bottom: 8 },
  font: LABEL_FONT,
  view: { stroke: null },
  title: {
    font: TITLE_FONT,
    fontSize: 16,
    fontWeight: 'normal',
    color: '#1f1d1a',
    anchor: 'start',
    offset: 12,
    subtitleFont: LABEL_FONT,
    subtitleFontSize: 11,
    subtitleColor: '#5c5850',
    subtitlePadding: 5,
    subtitleLineHeight: 15,
  },
  axis: {
    domainColor: '#8f8a80',
    tickColor: '#8f8a80',
    gridColor: '#e4dfd3',
    gridDash: [1, 3],
    labelColor: '#3d3a34',
    labelFontSize: 10.5,
    titleColor: '#2b2924',
    titleFontSize: 11.5,
    titleFontWeight: 'normal',
    titleFont: TITLE_FONT,
    labelLimit: 220,
  },
  legend: {
    orient: 'bottom',
    direction: 'vertical',
    columns: 2,
    columnPadding: 18,
    labelLimit: 260,
    labelFontSize: 10.5,
    labelColor: '#3d3a34',
    titleFont: TITLE_FONT,
    titleFontWeight: 'normal',
    titleFontSize: 11.5,
    titleColor: '#2b2924',
    symbolStrokeWidth: 2.5,
  },
  range: { category: [...CONFIG_COLOURS] },
  line: { strokeWidth: 2, strokeCap: 'round', strokeJoin: 'round' },
  point: { size: 36 },
  text: { font: LABEL_FONT, fontSize: 10.5, color: '#2b2924' },
};
