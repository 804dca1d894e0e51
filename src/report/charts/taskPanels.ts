/**
 * Small multiples per task (`--task-key`): one small panel per task, each with its own axes (tasks
 * differ in scale and length), colour by group (a method has one colour on every task).
 * - `taskCurvesChart`: learning curves, the mean across seeds and its band (single seeds are left
 *   out at this size; the per-seed chart shows them);
 * - `taskValuesChart`: each run's summary value as a dot, one row per group, the mean as a tick.
 * At most `TASK_PANELS` tasks are drawn for the primary metric (`OTHER_TASK_PANELS` for others):
 * tasks with a decided comparison of the metric first (most decided first), then in study order;
 * the subtitle says how many are left out.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results } from '../../analysis/results.js';
import { CHART_CONFIG, CONFIG_LEGEND, configColourScale } from '../palette.js';
import { configGroups, primaryMetric, taskNames } from '../studyShape.js';
import { VEGA_LITE_SCHEMA, wrapLines } from './chartFrame.js';

/** Most task panels in one chart of the primary metric, and of any other metric. */
export const TASK_PANELS = 24;
export const OTHER_TASK_PANELS = 8;
const COLUMNS = 4;

/**
 * The tasks a chart of `metric` draws (see the module comment) and how many there are in all.
 * Cost O(comparisons + configs). Never throws.
 */
export function panelTasks(results: Results, metric: string): { readonly tasks: string[]; readonly total: number } {
  const all = taskNames(results);
  const decided = new Map<string, number>();
  for (const c of results.comparisons)
    if (c.metric === metric && c.task !== null && c.verdict !== 'inconclusive')
      decided.set(c.task, (decided.get(c.task) ?? 0) + 1);
  const ordered = [...all].sort(
    (a, b) => (decided.get(b) ?? 0) - (decided.get(a) ?? 0) || all.indexOf(a) - all.indexOf(b),
  );
  const limit = primaryMetric(results) === metric ? TASK_PANELS : OTHER_TASK_PANELS;
  const chosen = new Set(ordered.slice(0, limit));
  return { tasks: all.filter((t) => chosen.has(t)), total: all.length };
}

function leftOutLine(shown: number, total: number): string[] {
  return shown < total
    ? [
        `${shown} of ${total} tasks: those with a decided comparison first, then in study order; the ` +
          `other ${total - shown} are in the tables and results.json.`,
      ]
    : [];
}

function frame(
  results: Results,
  title: string,
  subtitle: readonly string[],
  description: string,
  groups: readonly string[],
) {
  return {
    $schema: VEGA_LITE_SCHEMA,
    description,
    title: { text: title, subtitle: wrapLines(subtitle, 90) },
    config: { ...CHART_CONFIG, legend: { ...CHART_CONFIG.legend, columns: 3 } },
    colour: {
      field: 'group',
      type: 'nominal',
      title: 'config',
      scale: configColourScale(results, groups),
      legend: CONFIG_LEGEND,
    } as const,
  };
}

/** The top of a panel chart: schema, description, title and config, in that order. */
function head(f: ReturnType<typeof frame>) {
  return { $schema: f.$schema, description: f.description, title: f.title, config: f.config };
}

/** One panel per task, in `tasks` order, wrapped at `COLUMNS` panels a row. */
function byTask(tasks: readonly string[]) {
  return {
    facet: {
      field: 'task',
      type: 'nominal',
      title: null,
      sort: tasks,
      header: { labelFontSize: 10.5, labelPadding: 2 },
    },
    columns: COLUMNS,
  } as const;
}

/**
 * Learning curves of `metric`, one panel per task; null without a task key or curves.
 * Cost O(panels x configs x bins). Never throws.
 */
export function taskCurvesChart(results: Results, metric: string): TopLevelSpec | null {
  const key = results.settings.taskKey;
  if (key === null) return null;
  const { tasks, total } = panelTasks(results, metric);
  const wanted = new Set(tasks);
  const groupOf = configGroups(results);
  const taskOf = new Map(results.configs.map((c) => [c.id, c.params[key] ?? '']));
  const rows = results.curves
    .filter((c) => c.metric === metric && wanted.has(taskOf.get(c.config) ?? ''))
    .map((c) => ({
      task: taskOf.get(c.config) ?? '',
      group: groupOf.get(c.config) ?? c.config,
      step: [...c.steps],
      mean: [...c.mean],
      low: c.low.map((v, i) => (v === null || c.high[i] === null ? null : v)),
      high: c.high.map((v, i) => (v === null || c.low[i] === null ? null : v)),
    }));
  if (rows.length === 0) return null;
  const groups = [...new Set(rows.map((r) => r.group))];
  const f = frame(
    results,
    `${metric}: learning curves per task`,
    [
      'Line: mean across seeds; band: its interval between seeds, per step. Each task has its own axes.',
      ...leftOutLine(tasks.length, total),
    ],
    `Learning curves of ${metric} in ${tasks.length} task panels, one line per config.`,
    groups,
  );
  const x = { field: 'step', type: 'quantitative', title: null, axis: { format: '~s', tickCount: 3 } } as const;
  const y = (field: string) =>
    ({
      field,
      type: 'quantitative',
      title: null,
      scale: { zero: false },
      axis: { tickCount: 3, format: '~g' },
    }) as const;
  return {
    ...head(f),
    data: { values: rows },
    transform: [{ flatten: ['step', 'mean', 'low', 'high'] }],
    ...byTask(tasks),
    spec: {
      width: 150,
      height: 80,
      layer: [
        { mark: { type: 'area', opacity: 0.18 }, encoding: { x, y: y('low'), y2: { field: 'high' }, color: f.colour } },
        {
          mark: { type: 'line', strokeWidth: 1.6 },
          encoding: {
            x,
            y: y('mean'),
            color: f.colour,
            tooltip: [
              { field: 'group', type: 'nominal', title: 'config' },
              { field: 'step', type: 'quantitative', title: 'step' },
              { field: 'mean', type: 'quantitative', title: 'mean', format: '.4~g' },
            ],
          },
        },
      ],
    },
    resolve: { scale: { x: 'independent', y: 'independent' } },
  } as unknown as TopLevelSpec;
}

/**
 * Per-seed summary values of `metric`, one panel per task; null without a task key or values.
 * Cost O(panels x runs). Never throws.
 */
export function taskValuesChart(results: Results, metric: string, summary: string): TopLevelSpec | null {
  const key = results.settings.taskKey;
  if (key === null) return null;
  const { tasks, total } = panelTasks(results, metric);
  const wanted = new Set(tasks);
  const groupOf = configGroups(results);
  const taskOf = new Map(results.configs.map((c) => [c.id, c.params[key] ?? '']));
  const dots = results.values
    .filter(
      (v) => v.metric === metric && v.summary === summary && v.value !== null && wanted.has(taskOf.get(v.config) ?? ''),
    )
    .map((v) => ({
      task: taskOf.get(v.config) ?? '',
      group: groupOf.get(v.config) ?? v.config,
      seed: v.seed,
      value: v.value,
      kind: v.usedInTests ? 'run' : 'run, not used',
    }));
  if (dots.length === 0) return null;
  const means = results.configValues
    .filter(
      (c) => c.metric === metric && c.summary === summary && c.mean !== null && wanted.has(taskOf.get(c.config) ?? ''),
    )
    .map((c) => ({
      task: taskOf.get(c.config) ?? '',
      group: groupOf.get(c.config) ?? c.config,
      value: c.mean,
      kind: 'mean',
    }));
  const groups = [...new Set([...dots, ...means].map((r) => r.group))];
  const f = frame(
    results,
    `${metric}: one value per seed, per task (${summary})`,
    [
      'Dots: single seeds (hollow: not used in tests); tick: mean across seeds. Each task has its own axis.',
      ...leftOutLine(tasks.length, total),
    ],
    `Per-seed ${summary} values of ${metric} in ${tasks.length} task panels, one row per config.`,
    groups,
  );
  const x = {
    field: 'value',
    type: 'quantitative',
    title: null,
    scale: { zero: false },
    axis: { tickCount: 3, format: '~g' },
  } as const;
  const y = { field: 'group', type: 'nominal', title: null, sort: groups, axis: null } as const;
  return {
    ...head(f),
    data: { values: [...dots, ...means] },
    ...byTask(tasks),
    spec: {
      width: 150,
      height: { step: 11 },
      layer: [
        {
          transform: [{ filter: "datum.kind !== 'mean'" }],
          mark: { type: 'point', size: 26, opacity: 0.8 },
          encoding: {
            x,
            y,
            color: f.colour,
            fill: {
              condition: {
                test: "datum.kind === 'run'",
                field: 'group',
                type: 'nominal',
                scale: configColourScale(results, groups),
                legend: null,
              },
              value: 'transparent',
            },
            tooltip: [
              { field: 'group', type: 'nominal', title: 'config' },
              { field: 'seed', type: 'nominal', title: 'seed' },
              { field: 'value', type: 'quantitative', title: 'value', format: '.4~g' },
            ],
          },
        },
        {
          transform: [{ filter: "datum.kind === 'mean'" }],
          mark: { type: 'tick', thickness: 2, size: 10, orient: 'vertical' },
          encoding: { x, y, color: f.colour },
        },
      ],
    },
    resolve: { scale: { x: 'independent' } },
  } as unknown as TopLevelSpec;
}
