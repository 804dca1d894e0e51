/**
 * Differences against the baseline: one row per comparison, the difference (candidate − baseline)
 * with its interval, a rule at zero, the verdict in colour, shape and words.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Comparison, Results } from '../../analysis/results.js';
import { CHART_WIDTH, REFERENCE_INK, VERDICT_COLOURS, VERDICT_SHAPES, VERDICTS } from '../palette.js';
import { chartFrame, NUMBER_FORMAT, type Layer } from './chartFrame.js';
import { intervalLabels } from './intervalLabel.js';

/**
 * Vega-Lite spec of the comparisons of one metric and summary (`Results.comparisons`):
 * per comparison, `difference.estimate` as a point and `difference.low`..`high` as a bar (rows
 * without an interval show the point alone and say so in the tooltip), a solid rule at 0, and,
 * when a non-inferiority margin is set (`Comparison.nonInferiority`, else `Settings.margin`), a
 * dashed rule at the margin on the worse side (−margin for goal max, +margin for goal min).
 * Verdicts are coloured (Okabe-Ito green / vermillion, grey), shaped, in the legend and written
 * in a column at the right of each row.
 * Returns null when there is no comparison. Cost O(comparisons). Never throws.
 * Example: `compareChart(results, 'val_acc', 'last:10%')` → layers zero, margin?, interval, estimate, verdict.
 */
export function compareChart(results: Results, metric: string, summary: string): TopLevelSpec | null {
  const comparisons = results.comparisons.filter((c) => c.metric === metric && c.summary === summary);
  const first = comparisons[0];
  if (first === undefined) return null;

  const labels = rowLabels(comparisons);
  const rows = comparisons.map((c, i) => ({
    label: labels[i] ?? '',
    baseline: c.baseline,
    candidate: c.candidate,
    task: c.task ?? '',
    estimate: c.difference.estimate,
    low: c.difference.low,
    high: c.difference.high,
    interval: c.difference.low !== null && c.difference.high !== null ? 'yes' : 'none (too few runs)',
    verdict: c.verdict,
    p: c.p,
    pAdjusted: c.pAdjusted,
    nBaseline: c.n.baseline,
    nCandidate: c.n.candidate,
  }));
  const goal = first.goal;
  const margin = comparisons.find((c) => c.nonInferiority !== null)?.nonInferiority?.margin ?? results.settings.margin;
  const marginAt = margin === null ? null : goal === 'max' ? -Math.abs(margin) : Math.abs(margin);

  const y = {
    field: 'label',
    type: 'nominal',
    title: null,
    sort: null,
    scale: { domain: labels },
    axis: { labelLimit: 260 },
  } as const;
  const x = {
    field: 'estimate',
    type: 'quantitative',
    title: `difference in ${metric} (candidate − baseline)`,
  } as const;
  const verdictScale = { domain: [...VERDICTS], range: VERDICTS.map((v) => VERDICT_COLOURS[v]) };
  const shapeScale = { domain: [...VERDICTS], range: VERDICTS.map((v) => VERDICT_SHAPES[v]) };
  const color = { field: 'verdict', type: 'nominal', title: 'verdict', scale: verdictScale } as const;

  const layers: Layer[] = [
    {
      name: 'zero',
      data: { values: [{}] },
      mark: { type: 'rule', color: REFERENCE_INK, strokeWidth: 1.2 },
      encoding: { x: { datum: 0, type: 'quantitative' } },
    },
  ];
  if (marginAt !== null) {
    layers.push({
      name: 'margin',
      data: { values: [{}] },
      mark: { type: 'rule', color: REFERENCE_INK, strokeDash: [5, 4], strokeWidth: 1 },
      encoding: { x: { datum: marginAt, type: 'quantitative' } },
    });
  }
  const intervals = rows.filter((r) => r.low !== null && r.high !== null);
  if (intervals.length > 0) {
    layers.push({
      name: 'interval',
      data: { values: intervals },
      mark: { type: 'rule', strokeWidth: 3, strokeCap: 'round' },
      encoding: { x: { ...x, field: 'low' }, x2: { field: 'high' }, y, color },
    });
  }
  layers.push(
    {
      name: 'estimate',
      data: { values: rows },
      mark: { type: 'point', filled: true, size: 90, stroke: '#ffffff', strokeWidth: 0.8 },
      encoding: {
        x,
        y,
        color,
        shape: { field: 'verdict', type: 'nominal', title: 'verdict', scale: shapeScale },
        tooltip: [
          { field: 'candidate', type: 'nominal', title: 'candidate' },
          { field: 'baseline', type: 'nominal', title: 'baseline' },
          ...(comparisons.some((c) => c.task !== null)
            ? [{ field: 'task', type: 'nominal', title: 'task' } as const]
            : []),
          { field: 'estimate', type: 'quantitative', title: 'difference', format: NUMBER_FORMAT },
          { field: 'low', type: 'quantitative', title: 'interval low', format: NUMBER_FORMAT },
          { field: 'high', type: 'quantitative', title: 'interval high', format: NUMBER_FORMAT },
          { field: 'interval', type: 'nominal', title: 'interval' },
          { field: 'p', type: 'quantitative', title: 'p', format: '.3~g' },
          { field: 'pAdjusted', type: 'quantitative', title: 'p adjusted', format: '.3~g' },
          { field: 'nBaseline', type: 'quantitative', title: 'runs, baseline' },
          { field: 'nCandidate', type: 'quantitative', title: 'runs, candidate' },
          { field: 'verdict', type: 'nominal', title: 'verdict' },
        ],
      },
    },
    {
      name: 'verdict',
      data: { values: rows },
      mark: { type: 'text', align: 'left', baseline: 'middle', fontSize: 10.5, fontWeight: 'bold' },
      encoding: { x: { value: CHART_WIDTH + 10 }, y, text: { field: 'verdict', type: 'nominal' }, color },
    },
  );

  const methods = intervalLabels(
    comparisons
      .filter((c) => c.difference.method !== 'none')
      .map((c) => ({ method: c.difference.method, level: c.difference.level })),
  );
  const subtitle = [
    `Point: candidate − baseline in ${metric} units (${summary}); ${goal === 'max' ? 'higher' : 'lower'} is better.`,
    methods === ''
      ? 'No row has an interval (too few runs).'
      : `Bar: ${methods}, unadjusted. Verdicts ` +
        `use ` +
        (results.settings.correction === 'none' ? 'unadjusted' : `${results.settings.correction}-adjusted`) +
        ` p at alpha ${results.settings.alpha}, so a bar clear of 0 can stand beside an inconclusive verdict.`,
  ];
  if (marginAt !== null) subtitle.push(`Dashed line: non-inferiority margin (${marginAt}).`);

  return {
    ...chartFrame({
      title: `${metric}: differences against the baseline`,
      subtitle,
      description:
        `Differences in ${metric} (${summary}) for ${comparisons.length} ` +
        `comparison${comparisons.length === 1 ? '' : 's'}: ${rows.map((r) => `${r.label}: ${r.verdict}`).join('; ')}.`,
      height: { step: 34 },
    }),
    layer: layers,
  };
}

/** "candidate vs baseline [task]", made unique by a counter when two rows would collide. */
function rowLabels(comparisons: readonly Comparison[]): string[] {
  const used = new Set<string>();
  return comparisons.map((c) => {
    const base = `${c.candidate} vs ${c.baseline}${c.task === null ? '' : ` [${c.task}]`}`;
    let label = base;
    for (let k = 2; used.has(label); k++) label = `${base} (${k})`;
    used.add(label);
    return label;
  });
}
