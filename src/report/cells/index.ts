/**
 * The notebook cells, registered in one place on a private Handlebars instance. Each cell is one
 * file; this module turns a `Cell` into a Handlebars helper: it reads the call's arguments and
 * checks them against the cell's declaration (arity, options), finds the render state in the
 * template's private data (`@seedsift`), turns a `CellError` into a `SeedsiftError('notebook')`
 * with the notebook's file and line, stores the cell's HTML, and returns a placeholder block that
 * `renderNotebook` swaps for that HTML after the Markdown pass (so the cell's HTML never goes
 * through Markdown).
 */
import type Handlebars from 'handlebars';
import type { HelperOptions } from 'handlebars';
import { SeedsiftError } from '../../problems.js';
import { aggregates } from './aggregates.js';
import { calibration } from './calibration.js';
import { CellError, checkCall, type Cell, type RenderState } from './cell.js';
import { compare } from './compare.js';
import { curves } from './curves.js';
import { halting } from './halting.js';
import { methods } from './methods.js';
import { overview } from './overview.js';
import { metric } from './metric.js';
import { problems } from './problems.js';
import { runs } from './runs.js';
import { sweep } from './sweep.js';
import { ticks } from './ticks.js';
import { values } from './values.js';
import { verdicts } from './verdicts.js';

/** Every cell, by the name a notebook calls it. */
export const CELLS: readonly Cell[] = [
  overview,
  aggregates,
  sweep,
  verdicts,
  metric,
  curves,
  values,
  compare,
  ticks,
  halting,
  calibration,
  runs,
  problems,
  methods,
];

/** The names of the cells, for messages. */
export const CELL_NAMES: readonly string[] = CELLS.map((c) => c.name);

/** The placeholder block a cell leaves in the Markdown (on lines of its own, so Markdown passes it through). */
export const CELL_PLACEHOLDER = /<div data-seedsift-cell="(\d+)"><\/div>/g;

interface Located {
  readonly loc?: { readonly start: { readonly line: number } };
}

function helperOf(hb: typeof Handlebars, cell: Cell): Handlebars.HelperDelegate {
  return function cellHelper(...args: unknown[]): Handlebars.SafeString {
    const options = args[args.length - 1] as HelperOptions & Located;
    const params = args.slice(0, -1);
    const state = (options.data as { seedsift?: RenderState } | undefined)?.seedsift;
    if (state === undefined) throw new Error(`cell ${cell.name}: rendered without seedsift state`);
    const line = state.bodyLine - 1 + (options.loc?.start.line ?? 1);
    if (typeof options.fn === 'function') {
      throw new SeedsiftError(
        'notebook',
        `{{#${cell.name}}}: ${cell.name} is a cell, not a block; write ${cell.usage}`,
        { file: state.file, line },
      );
    }
    const call = { params, hash: (options.hash ?? {}) as Record<string, unknown> };
    let html: string;
    try {
      checkCall(cell, call);
      html = cell.render(state, call);
    } catch (error) {
      if (error instanceof CellError)
        throw new SeedsiftError('notebook', `{{${cell.name}}}: ${error.message}`, { file: state.file, line });
      throw error;
    }
    const index = state.cells.push(html) - 1;
    return new hb.SafeString(`\n\n<div data-seedsift-cell="${index}"></div>\n\n`);
  };
}

/**
 * Register every cell as a helper on a private Handlebars instance (made with `Handlebars.create()`).
 * Cost O(cells). Never throws.
 * Example: `registerCells(Handlebars.create())` → the instance knows `{{verdicts}}`, `{{curves "val_acc"}}`, ...
 */
export function registerCells(hb: typeof Handlebars): void {
  for (const cell of CELLS) hb.registerHelper(cell.name, helperOf(hb, cell));
}
