/**
 * The report command's brain: from a `RunSet` and resolved options to `Results`, in steps.
 *
 *   1. inventory      configs, runs and metrics in a stable order (configs by parameter values in
 *                     key order, numeric-aware; metrics in first-seen order)
 *   2. pairing        which config is compared with which (`--baseline`, `--task-key`)
 *   3. per metric     per-run summary values (each config at its own step), comparisons (each at
 *                     its own step; one family per metric and summary over all tasks, or per task
 *                     under --family task), learning curves (logs only), task aggregates
 *   4. ticks          accuracy by tick, halting and calibration (`ticks.ts`, `halting.ts`, `calibration.ts`)
 *   5. assemble       settings, records, problems (ingest's, then analysis', deduplicated)
 *
 * Deterministic: the same run set, options and seed give identical `Results`; every random stream
 * is derived from `options.seed` and a label naming what it is for.
 */
import type { MetricInfo, Run, RunSet } from '../ingest/types.js';
import { problem, type Problem } from '../problems.js';
import { calibrationCurves } from './calibration.js';
import { configValues } from './configValues.js';
import type { PowerCache } from './compare.js';
import { learningCurves } from './curves.js';
import { haltingCurves } from './halting.js';
import { inventory, orderRuns } from './inventory.js';
import { optionSettings, type ResolvedOptions } from './options.js';
import { pairConfigs, type Pairing } from './pairing.js';
import type {
  CalibrationCurve,
  Comparison,
  ConfigValue,
  Curve,
  HaltingCurve,
  MetricRecord,
  Results,
  RunValue,
  Settings,
  TaskAggregate,
  TickCurve,
} from './results.js';
import { metricComparisons } from './metricComparisons.js';
import { metricValues } from './runValues.js';
import { matchesSelector } from './selectors.js';
import { checkOptions } from './checkOptions.js';
import { chooseMetrics } from './chooseMetrics.js';
import { dedupeProblems, withoutRepeatedGoals } from './dedupeProblems.js';
import { sanityChecks } from './sanityChecks.js';
import { selectRuns } from './selectRuns.js';
import { withoutUncomparedGoals } from './setAside.js';
import { summaryGoal } from './summarySpec.js';
import { normaliseTaskScores, taskAggregates, type TaskScore } from './tasks.js';
import { ACCURACY_NAME, examplesFromDumps, tickCurves } from './ticks.js';
import type { ProgressHook } from '../progress.js';

export interface AnalyzeMeta {
  readonly paths: readonly string[];
  /** ISO date of the report. */
  readonly generated: string;
  readonly version: string;
}

/**
 * Analyse a run set. Throws SeedsiftError('usage') when the task key is not a config key or the
 * baseline selector matches no config (listing what is available); data problems never throw,
 * they become `Problem`s and null fields.
 * Cost: dominated by the permutation tests (one per comparison) and, at 20+ runs, bootstraps.
 * `progress` hears of each metric as its work starts ('comparing', metrics done, metrics).
 * Example: `analyze(runSet, resolveOptions({ baseline: 'memory=4' }), meta).comparisons`.
 */
export function analyze(
  input: RunSet,
  options: ResolvedOptions,
  meta: AnalyzeMeta,
  progress: ProgressHook = () => undefined,
): Results {
  // 1. select and inventory: the runs, configs and metrics the options choose
  checkOptions(options, input);
  const selection = selectRuns(input, options);
  const runSet = selection.runSet;
  const choice = chooseMetrics(runSet, options);
  const inv = inventory(runSet);
  const runs = orderRuns(runSet);
  const problems: Problem[] = [...selection.problems, ...sanityChecks(runSet), ...choice.problems];

  // 2. pairing
  const pairing = pairConfigs(inv.configs, runSet.keys, options.baseline, options.taskKey, options.candidates);
  if (pairing.armKeys.length > 0)
    problems.push(
      problem(
        'arm-keys',
        `counterparts for --baseline ${options.baseline?.text ?? ''} were matched ignoring ` +
          `${pairing.armKeys.join(', ')}: their values change only with ` +
          `${options.baseline?.pairs.map((p) => p.key).join(', ') ?? ''} (attributes of the arm)`,
      ),
    );
  for (const m of pairing.missing) {
    const where = m.task === null ? '' : ` (task ${m.task})`;
    problems.push(
      problem(
        'counterpart-missing',
        `${m.config}${where} has no counterpart ${m.counterpart} for --baseline ${options.baseline?.text ?? ''}; ` +
          'it is not compared',
      ),
    );
  }
  const compared = new Set<string>();
  for (const p of pairing.pairs) compared.add(p.baselineConfig).add(p.candidateConfig);

  // 3. per metric
  const metrics: MetricRecord[] = [];
  const values: RunValue[] = [];
  const perConfig: ConfigValue[] = [];
  const comparisons: Comparison[] = [];
  const curves: Curve[] = [];
  const tasks: TaskAggregate[] = [];
  const ticks: TickCurve[] = [];
  const cache: PowerCache = new Map();
  const runsByConfig = groupRuns(runs);
  for (const [i, info] of choice.metrics.entries()) {
    progress('comparing', i, choice.metrics.length);
    const record = inv.metrics.find((m) => m.name === info.name && m.kind === info.kind) as MetricRecord;
    if (info.kind === 'tick') {
      metrics.push(record);
      ticks.push(
        ...tickCurves(runs, info, {
          step: options.summary.kind === 'step' ? options.summary.step : null,
          level: options.level,
          alpha: options.alpha,
          baseline: tickBaseline(inv.configs, options),
          // A between-example band is a binomial one: only for a share of correct examples (an accuracy).
          ...(ACCURACY_NAME.test(info.name) ? { examplesByConfig: examplesFromDumps(runSet.tickDumps) } : {}),
        }),
      );
      continue;
    }
    // A metric whose goal is unknown is summarised as "higher" (direction only, metricComparisons.ts).
    const direction = info.goal ?? 'max';
    const mv = metricValues(
      runs,
      info.name,
      direction,
      options.summary,
      options.summaryText,
      options.failed,
      compared,
      runSet.mode,
    );
    values.push(...mv.values);
    perConfig.push(...configValues(mv.values, options));
    problems.push(...mv.problems);
    const result = metricComparisons(info, runsByConfig, pairing, options, runSet.mode, cache);
    comparisons.push(...result.comparisons);
    problems.push(...result.problems);
    const steps = new Set(result.comparisons.map((c) => c.step));
    metrics.push({ ...record, horizon: steps.size === 1 ? ([...steps][0] ?? null) : null });
    if (runSet.mode === 'logs') {
      curves.push(...learningCurves(runs, info.name, options));
    }
    if (options.taskKey !== null) tasks.push(...metricTasks(info, runs, mv.byRun, pairing, options));
  }

  progress('comparing', choice.metrics.length, choice.metrics.length);

  // 4. ticks: per-sample dumps
  const { halting, calibration } = dumpAnalyses(runSet, options, problems);

  // 5. assemble
  const allProblems = withoutUncomparedGoals(
    dedupeProblems([...runSet.problems, ...withoutRepeatedGoals(problems, runSet)]),
    choice.metrics.map((m) => m.name),
  );
  const byRun = new Map<string, string[]>();
  for (const p of allProblems) if (p.run !== undefined) byRun.set(p.run, [...(byRun.get(p.run) ?? []), p.message]);
  return {
    format: 'seedsift-results',
    version: 1,
    tool: { name: 'seedsift', version: meta.version },
    generated: meta.generated,
    settings: settingsOf(options),
    inputs: {
      paths: meta.paths,
      mode: runSet.mode,
      files: runSet.files.length,
      filesRead: runSet.files.filter((f) => f.status === 'read').length,
    },
    configs: inv.configs,
    metrics,
    setAside: choice.setAside.map(({ name, reason }) => ({ name, reason })),
    runs: inv.runs.map((r) => ({ ...r, problems: byRun.get(r.id) ?? [] })),
    values,
    configValues: perConfig,
    comparisons,
    curves,
    tasks,
    ticks,
    halting,
    calibration,
    problems: allProblems,
  };
}

/** The settings block of Results (what ran, as the user gave it), from the options table. */
export function settingsOf(o: ResolvedOptions): Settings {
  return optionSettings(o);
}

function groupRuns(runs: readonly Run[]): Map<string, Run[]> {
  const out = new Map<string, Run[]>();
  for (const run of runs) out.set(run.config, [...(out.get(run.config) ?? []), run]);
  return out;
}

/** The one config the selector picks, for the per-tick comparison (null when it picks several or none). */
function tickBaseline(
  configs: readonly { readonly id: string; readonly params: Readonly<Record<string, string>> }[],
  options: ResolvedOptions,
): string | null {
  const selector = options.baseline;
  if (selector === null) return null;
  const matching = configs.filter((c) => matchesSelector(c.params, selector));
  return matching.length === 1 ? (matching[0] as (typeof matching)[number]).id : null;
}

function metricTasks(
  info: MetricInfo,
  runs: readonly Run[],
  byRun: ReadonlyMap<string, { readonly value: number | null; readonly failed: boolean }>,
  pairing: Pairing,
  options: ResolvedOptions,
): TaskAggregate[] {
  const taskKey = options.taskKey as string;
  const groupOf = new Map<string, string>();
  for (const p of pairing.pairs) groupOf.set(p.baselineConfig, p.baseline).set(p.candidateConfig, p.candidate);
  const scores: TaskScore[] = [];
  const groups: string[] = [];
  for (const run of runs) {
    const group = groupOf.get(run.config);
    const v = byRun.get(run.id);
    if (group === undefined || v === undefined || v.value === null || v.failed) continue;
    if (!groups.includes(group)) groups.push(group);
    scores.push({ task: run.params[taskKey] ?? '', group, value: v.value });
  }
  const baselineOf = new Map<string, string>();
  if (options.baseline !== null)
    for (const p of pairing.pairs) if (!baselineOf.has(p.candidate)) baselineOf.set(p.candidate, p.baseline);
  const normal = normaliseTaskScores(scores, groups);
  const settings = { ...options, leftOut: normal.leftOut };
  return taskAggregates(
    info.name,
    summaryGoal(options.summary, info.goal ?? 'max'),
    groups,
    normal.scores,
    baselineOf,
    settings,
  );
}

function dumpAnalyses(
  runSet: RunSet,
  options: ResolvedOptions,
  problems: Problem[],
): { halting: HaltingCurve[]; calibration: CalibrationCurve[] } {
  if (runSet.tickDumps.length === 0) return { halting: [], calibration: [] };
  try {
    return {
      halting: haltingCurves(runSet.tickDumps, {
        thresholds: options.haltingThresholds,
        level: options.level,
        referenceThreshold: options.haltingReference,
      }),
      calibration: calibrationCurves(runSet.tickDumps, { bins: options.calibrationBins, level: options.level }),
    };
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    problems.push(problem('tick-dump-invalid', `halting and calibration were not computed: ${error.message}`));
    return { halting: [], calibration: [] };
  }
}
