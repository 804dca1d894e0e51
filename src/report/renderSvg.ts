/**
 * Server-side chart rendering: Vega-Lite spec → Vega spec → SVG text, with no browser.
 *
 * Vega-Lite compiles with a collecting logger (nothing is printed); Vega runs headless
 * (`renderer: 'none'`) with a collecting logger, and `View.toSVG()` serialises the scenegraph.
 * Without the optional `canvas` package Vega estimates text widths from the font size, so the
 * output depends only on the spec. The SVG is then made deterministic and accessible:
 *   - clip-path and gradient ids, which Vega numbers from process-wide counters, are renumbered
 *     from 1 in order of appearance (two renders of one spec give the same bytes, whatever else
 *     ran before);
 *   - the root element gets `role`, `aria-roledescription`, an `aria-label` from the spec's
 *     `description`, and a `<title>` (the chart title) and `<desc>` (the description) child.
 */
import { compile } from 'vega-lite';
import type { TopLevelSpec } from 'vega-lite';
import { parse, View } from 'vega';
import type { Spec as VegaSpec } from 'vega';

/** A logger that keeps messages instead of printing them (the vega-util LoggerInterface). */
interface CollectingLogger {
  level(_?: number): number | CollectingLogger;
  error(...args: unknown[]): CollectingLogger;
  warn(...args: unknown[]): CollectingLogger;
  info(...args: unknown[]): CollectingLogger;
  debug(...args: unknown[]): CollectingLogger;
}

function collectingLogger(warnings: string[], errors: string[]): CollectingLogger {
  let level = 2; // vega-util Warn
  const text = (args: unknown[]): string => args.map((a) => (a instanceof Error ? a.message : String(a))).join(' ');
  const logger: CollectingLogger = {
    level(next?: number) {
      if (next === undefined) return level;
      level = next;
      return logger;
    },
    error(...args) {
      errors.push(text(args));
      return logger;
    },
    warn(...args) {
      warnings.push(text(args));
      return logger;
    },
    info() {
      return logger;
    },
    debug() {
      return logger;
    },
  };
  return logger;
}

/**
 * Compile a Vega-Lite spec to a Vega spec and keep the compiler's warnings.
 * Cost: one Vega-Lite compile (linear in the spec, data copied by reference).
 * Throws whatever Vega-Lite throws for a spec it cannot compile.
 * Example: `compileVegaWithWarnings(spec).warnings` → `[]` for every seedsift chart.
 */
export function compileVegaWithWarnings(spec: TopLevelSpec): {
  readonly spec: VegaSpec;
  readonly warnings: readonly string[];
} {
  const warnings: string[] = [];
  const errors: string[] = [];
  const compiled = compile(spec, { logger: collectingLogger(warnings, errors) }).spec as VegaSpec;
  if (errors.length > 0) throw new Error(`vega-lite: ${errors.join('; ')}`);
  return { spec: compiled, warnings };
}

/**
 * The compiled Vega spec of a Vega-Lite spec, for the interactive runtime embedded in the page.
 * Compiler warnings are dropped (tests assert there are none; see `compileVegaWithWarnings`).
 * Example: `compileVega(curvesChart(results, 'val_acc')!).marks` → the Vega marks.
 */
export function compileVega(spec: TopLevelSpec): VegaSpec {
  return compileVegaWithWarnings(spec).spec;
}

/**
 * Render a Vega-Lite spec to deterministic, accessible SVG text, and return Vega's warnings.
 * Cost: compile plus one headless dataflow run, linear in the data.
 * Throws an Error naming Vega's message when the dataflow reports an error.
 * Example: `(await renderSvgWithWarnings(spec)).svg.startsWith('<svg')` → `true`.
 */
export async function renderSvgWithWarnings(
  spec: TopLevelSpec,
): Promise<{ readonly svg: string; readonly warnings: readonly string[] }> {
  const compiled = compileVegaWithWarnings(spec);
  const warnings = [...compiled.warnings];
  const errors: string[] = [];
  const view = new View(parse(compiled.spec), {
    renderer: 'none',
    logger: collectingLogger(warnings, errors),
    logLevel: 2,
  });
  try {
    const raw = await view.toSVG();
    if (errors.length > 0) throw new Error(`vega: ${errors.join('; ')}`);
    return { svg: accessible(renumberIds(raw), titleText(spec), spec.description ?? ''), warnings };
  } finally {
    view.finalize();
  }
}

/**
 * Render a Vega-Lite spec to deterministic, accessible SVG text (see the module comment).
 * Throws as `renderSvgWithWarnings`.
 * Example: `await renderSvg(curvesChart(results, 'val_acc')!)`
 * → `'<svg xmlns=... role="graphics-document document" ...'`.
 */
export async function renderSvg(spec: TopLevelSpec): Promise<string> {
  return (await renderSvgWithWarnings(spec)).svg;
}

/** Renumber `clipN` and `gradient_N` ids inside tags only (text content is escaped, so `<...>` is a tag). */
function renumberIds(svg: string): string {
  const ids = new Map<string, string>();
  let clips = 0;
  let gradients = 0;
  const rename = (id: string): string => {
    let next = ids.get(id);
    if (next === undefined) {
      next = id.startsWith('clip') ? `clip${++clips}` : `gradient_${gradients++}`;
      ids.set(id, next);
    }
    return next;
  };
  return svg.replace(/<[^>]*>/g, (tag) =>
    tag.replace(/(id="|url\(#)(clip\d+|gradient_\d+)/g, (_m, prefix: string, id: string) => prefix + rename(id)),
  );
}

function titleText(spec: TopLevelSpec): string {
  const title = spec.title;
  if (title === undefined) return '';
  if (typeof title === 'string') return title;
  if (Array.isArray(title)) return title.join(' ');
  const text = (title as { text?: unknown }).text;
  if (typeof text === 'string') return text;
  return Array.isArray(text) ? text.join(' ') : '';
}

function escapeXml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

function accessible(svg: string, title: string, description: string): string {
  const open = svg.indexOf('>');
  if (!svg.startsWith('<svg') || open < 0) throw new Error('vega: toSVG did not return an <svg> element');
  const label = description === '' ? title : description;
  const attrs = ` role="graphics-document document" aria-roledescription="chart" aria-label="${escapeXml(label)}"`;
  const children =
    `<title>${escapeXml(title)}</title>` + `${description === '' ? '' : `<desc>${escapeXml(description)}</desc>`}`;
  return `${svg.slice(0, open)}${attrs}>${children}${svg.slice(open + 1)}`;
}
