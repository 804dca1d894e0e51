/**
 * Across-task aggregates (`Results.tasks`, Agarwal et al. 2021): two charts of our own design.
 * - `aggregatesChart`: per group (config without the task key), the interquartile mean of its
 *   normalised task x run scores as a tick on a short rail with its stratified bootstrap interval
 *   as a bar, and beside it the probability of improvement over the baseline as a bar growing from
 *   the even line at 0.5 (left: the baseline tends to be better; right: the candidate).
 * - `profileChart`: performance profiles, the fraction of a group's task x run scores above each
 *   threshold, one step line per group.
 * Groups take their report-wide colours (`configColourScale`). Draws what `Results` carries.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Results, TaskAggregate } from '../../analysis/results.js';
import { CHART_CONFIG, CONFIG_LEGEND, configColourScale, REFERENCE_INK } from '../palette.js';
import { VEGA_LITE_SCHEMA, wrapLines } from './chartFrame.js';

const ROW = 22;

function ofMetric(results: Results, metric: string): TaskAggregate[] {
  return results.tasks.filter((t) => t.metric === metric && t.interquartileMean !== null);
}

/** Scale words: normalised scores run 0..1 (METHODS.md), raw ones keep the metric's units. */
function scaleWords(aggs: readonly TaskAggregate[]): string {
  return aggs.some((a) => a.normalisation !== undefined)
    ? 'normalised score (0 = worst run of the task, 1 = best)'
    : 'score';
}

/**
 * Interquartile mean with interval, and probability of improvement, per group; null without aggregates.
 * Cost O(groups). Never throws.
 */
export function aggregatesChart(results: Results, metric: string): TopLevelSpec | null {
  const aggs = ofMetric(results, metric);
  if (aggs.length === 0) return null;
  const groups = aggs.map((a) => a.config);
  const colour = { field: 'config', type: 'nominal', scale: configColourScale(results, groups), legend: null } as const;
  const y = {
    field: 'config',
    type: 'nominal',
    title: null,
    sort: groups,
    scale: { domain: groups },
    axis: { labelLimit: 220 },
  } as const;
  const rows = aggs.map((a) => ({
    config: a.config,
    iqm: a.interquartileMean,
    low: a.low,
    high: a.high,
    tasks: a.tasks,
    poi: a.probabilityOfImprovement,
    baseline: a.baseline ?? '',
  }));
  const tooltip = [
    { field: 'config', type: 'nominal', title: 'config' },
    { field: 'iqm', type: 'quantitative', title: 'interquartile mean', format: '.3f' },
    { field: 'low', type: 'quantitative', title: 'interval low', format: '.3f' },
    { field: 'high', type: 'quantitative', title: 'interval high', format: '.3f' },
    { field: 'tasks', type: 'quantitative', title: 'tasks' },
  ];
  const withPoi = rows.filter((r) => r.poi !== null);
  const iqmPanel = {
    width: 250,
    height: { step: ROW },
    data: { values: rows },
    layer: [
      {
        mark: { type: 'rule', strokeWidth: 7, opacity: 0.35, strokeCap: 'butt' },
        encoding: {
          y,
          x: { field: 'low', type: 'quantitative', title: `IQM, ${scaleWords(aggs)}` },
          x2: { field: 'high' },
          color: colour,
        },
      },
      {
        mark: { type: 'tick', thickness: 3, size: 16 },
        encoding: { y, x: { field: 'iqm', type: 'quantitative' }, color: colour, tooltip },
      },
    ],
  };
  const poiPanel = {
    width: 200,
    height: { step: ROW },
    // Every group keeps its row (the baseline's is empty), so the rows line up with the left panel.
    data: { values: rows.map((r) => ({ ...r, even: 0.5 })) },
    layer: [
      {
        transform: [{ filter: 'isValid(datum.poi)' }],
        mark: { type: 'bar', height: 10, opacity: 0.8 },
        encoding: {
          y: { ...y, axis: null, scale: { domain: groups } },
          x: {
            field: 'even',
            type: 'quantitative',
            scale: { domain: [0, 1] },
            title: 'P(candidate better), averaged over tasks',
          },
          x2: { field: 'poi' },
          color: colour,
          tooltip: [
            { field: 'config', type: 'nominal', title: 'candidate' },
            { field: 'baseline', type: 'nominal', title: 'baseline' },
            { field: 'poi', type: 'quantitative', title: 'P(candidate better)', format: '.3f' },
          ],
        },
      },
      {
        data: { values: [{}] },
        mark: { type: 'rule', color: REFERENCE_INK, strokeDash: [3, 3] },
        encoding: { x: { datum: 0.5, type: 'quantitative' } },
      },
    ],
  };
  const tasks = Math.max(...aggs.map((a) => a.tasks));
  return {
    $schema: VEGA_LITE_SCHEMA,
    description:
      `Across ${tasks} tasks, ${metric}: interquartile mean of each config's normalised scores with ` +
      `its interval, and the probability that a candidate beats its baseline on a task.`,
    title: {
      text: `${metric} across ${tasks} tasks`,
      subtitle: wrapLines(
        [
          'Left: interquartile mean (tick) with its 95% stratified bootstrap interval (bar).',
          ...(withPoi.length > 0
            ? [
                'Right: chance that a run of the candidate beats one of its baseline, per task, averaged; ' +
                  'dashed line at 0.5 (even).',
              ]
            : []),
        ],
        90,
      ),
    },
    config: CHART_CONFIG,
    hconcat: withPoi.length > 0 ? [iqmPanel, poiPanel] : [iqmPanel],
    spacing: 24,
  } as unknown as TopLevelSpec;
}

/**
 * Performance profiles: fraction of each group's normalised scores above each threshold; null without aggregates.
 * Cost O(groups x thresholds). Never throws.
 */
export function profileChart(results: Results, metric: string): TopLevelSpec | null {
  const aggs = ofMetric(results, metric).filter((a) => a.profile.thresholds.length > 1);
  if (aggs.length === 0) return null;
  const groups = aggs.map((a) => a.config);
  const goal = results.metrics.find((m) => m.name === metric)?.goal ?? 'max';
  const values = aggs.map((a) => ({
    config: a.config,
    threshold: [...a.profile.thresholds],
    fraction: [...a.profile.fraction],
  }));
  return {
    $schema: VEGA_LITE_SCHEMA,
    description:
      `Performance profiles of ${metric}: for each config, the fraction of its task x run ` +
      `scores ${goal === 'max' ? 'above' : 'below'} each threshold.`,
    title: {
      text: `${metric}: performance profiles`,
      subtitle: wrapLines(
        [
          `Fraction of each config's task x run scores ${goal === 'max' ? 'above' : 'below'} a threshold; a ` +
            `curve further ${goal === 'max' ? 'up and right' : 'up'} is better across more tasks.`,
        ],
        90,
      ),
    },
    config: CHART_CONFIG,
    width: 480,
    height: 200,
    data: { values },
    transform: [{ flatten: ['threshold', 'fraction'] }],
    mark: { type: 'line', interpolate: 'step-after', strokeWidth: 2 },
    encoding: {
      x: { field: 'threshold', type: 'quantitative', title: `threshold (${scaleWords(aggs)})` },
      y: { field: 'fraction', type: 'quantitative', title: 'fraction of runs', scale: { domain: [0, 1] } },
      color: {
        field: 'config',
        type: 'nominal',
        title: 'config',
        scale: configColourScale(results, groups),
        legend: CONFIG_LEGEND,
      },
      tooltip: [
        { field: 'config', type: 'nominal', title: 'config' },
        { field: 'threshold', type: 'quantitative', title: 'threshold', format: '.3f' },
        { field: 'fraction', type: 'quantitative', title: 'fraction', format: '.3f' },
      ],
    },
  } as TopLevelSpec;
}
