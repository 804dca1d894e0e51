/**
 * Merge the RunSets of several sources (digests, and the logs read directly beside them) into the
 * one RunSet that ingest hands to analysis, as if every run had been read in one call:
 *
 * - Parts in the order given (ingest orders them by where their first file was found).
 * - Keys: first seen, part by part. Config and run ids are rebuilt with the merged keys (assemble/runIds.ts
 *   `configId`, `runId`), so a part that met its keys in another order names its runs like the
 *   others; problems, dumps and file records follow the new ids.
 * - Runs: concatenated. Two parts with one config and seed: `run-duplicate`, and the runs are
 *   merged series by series, the later part's value winning on a step both have (as raw logs
 *   stacked in file order). Exact for the finite values both parts logged; where the later part
 *   had a missing cell at a step the earlier one logged, the earlier value is kept (stacked raw
 *   logs would drop it); a divergence is taken from the part whose series reaches further, and
 *   dropped if a finite value of the other part comes after it. Missing counts add up.
 * - Status: `short` is decided again over the merged runs (assemble/markShort.ts), because the
 *   longest run of a config may sit in another part; the parts' `run-short` problems are
 *   replaced by the new ones.
 * - Metric infos: merged by name, scalars first then tick metrics, each in first-seen order, the
 *   largest tick count kept. The goal: `--metric` when given now, else the first part's; another
 *   part with another goal is a `goal-conflict`. `goal-inferred` notes are kept once per metric
 *   whose goal is still a guess.
 * - Tick dumps, file records and problems: concatenated, part by part; then the merge's own
 *   problems (`run-duplicate`, `goal-conflict`), then `run-short`, then `goal-inferred`, which is
 *   the order ingest gives them when it reads everything at once.
 */
import { problem, SeedsiftError, type Problem } from '../../problems.js';
import { finishDrafts, type Draft } from '../lines/drafts.js';
import { markShort } from '../assemble/markShort.js';
import { configId, runId } from '../assemble/runIds.js';
import { mergeRun, type MergedRun } from './mergeRun.js';
import type { FileRecord, Goal, IngestOptions, MetricInfo, RunSet, TickDump } from '../types.js';

/** One source of runs: a digest file, or the logs read directly (`digest` null). */
export interface RunSetPart {
  readonly digest: string | null;
  readonly runSet: RunSet;
}

const label = (part: RunSetPart): string => part.digest ?? 'the logs read directly';

/** Params of a config id (`a=1,b=2`), for a dump whose run has no log in its part. */
function paramsOf(config: string): Record<string, string> {
  const params: Record<string, string> = {};
  for (const pair of config === '' ? [] : config.split(',')) {
    const at = pair.indexOf('=');
    params[pair.slice(0, at)] = pair.slice(at + 1);
  }
  return params;
}

/** Metric infos merged by name (see the module comment), with `goal-conflict` problems. */
function mergeMetrics(
  parts: readonly RunSetPart[],
  options: Pick<IngestOptions, 'metricGoals'>,
): { metrics: MetricInfo[]; problems: Problem[] } {
  const first = new Map<string, { info: MetricInfo; part: RunSetPart }>();
  const conflicted = new Set<string>();
  const problems: Problem[] = [];
  const scalars = new Map<string, MetricInfo>();
  const ticks = new Map<string, MetricInfo>();
  const says = (g: Goal | null, p: RunSetPart): string =>
    `${label(p)} says ${g === null ? 'no goal is known' : `${g === 'max' ? 'higher' : 'lower'} is better`}`;
  for (const part of parts) {
    for (const info of part.runSet.metrics) {
      const kept = first.get(info.name);
      if (kept === undefined) first.set(info.name, { info, part });
      else if (
        kept.info.goal !== info.goal &&
        !Object.hasOwn(options.metricGoals, info.name) &&
        !conflicted.has(info.name)
      ) {
        conflicted.add(info.name);
        problems.push(
          problem(
            'goal-conflict',
            `${info.name}: ${says(kept.info.goal, kept.part)}, ${says(info.goal, part)}; the first was kept (say ` +
              `--metric ${info.name}:max or ${info.name}:min to choose)`,
            part.digest === null ? {} : { file: part.digest },
          ),
        );
      }
      const table = info.kind === 'scalar' ? scalars : ticks;
      const seen = table.get(info.name);
      if (seen === undefined) table.set(info.name, info);
      else if (info.ticks > seen.ticks) table.set(info.name, { ...seen, ticks: info.ticks });
    }
  }
  const goalOf = (name: string): Pick<MetricInfo, 'goal' | 'goalSource'> => {
    const given = Object.hasOwn(options.metricGoals, name) ? options.metricGoals[name] : undefined;
    const kept = (first.get(name) as { info: MetricInfo }).info;
    return given === undefined
      ? { goal: kept.goal, goalSource: kept.goalSource }
      : { goal: given, goalSource: 'option' };
  };
  const metrics = [...scalars.values(), ...ticks.values()].map((m) => ({ ...m, ...goalOf(m.name) }));
  return { metrics, problems };
}

/**
 * The `goal-inferred` note of each metric whose goal is still a guess, then the `goal-unknown`
 * note of each whose goal is still unknown (the order raw ingest gives them), from the part that
 * gave its goal.
 */
function guessedGoals(parts: readonly RunSetPart[], metrics: readonly MetricInfo[]): Problem[] {
  return (['inferred', 'unknown'] as const).flatMap((source) => {
    const code = source === 'inferred' ? 'goal-inferred' : 'goal-unknown';
    const names = [...new Set(metrics.filter((m) => m.goalSource === source).map((m) => m.name))];
    return names.flatMap((name) => {
      const part = parts.find((p) => p.runSet.metrics.some((m) => m.name === name));
      const note = part?.runSet.problems.find((p) => p.code === code && p.message.startsWith(`${name}: `));
      return note === undefined ? [] : [note];
    });
  });
}

/**
 * Merge RunSet parts into one RunSet (see the module comment). Pure but for `finishDrafts` (no
 * file is read: the drafts it finishes name no rows). Cost: O(runs + problems) plus, for each
 * duplicated run, O(points) to merge its series.
 * Throws SeedsiftError('input') when parts with runs mix score tables and per-step logs.
 * Example: digests of `ticks=8` and of `ticks=16` merge into one RunSet with both configs, as
 * `ingest(['ticks=8', 'ticks=16'])` gives.
 */
export async function mergeRunSets(
  parts: readonly RunSetPart[],
  options: Pick<IngestOptions, 'metricGoals'>,
): Promise<RunSet> {
  const withRuns = parts.filter((p) => p.runSet.runs.length > 0);
  const mode = withRuns[0]?.runSet.mode ?? 'logs';
  const other = withRuns.find((p) => p.runSet.mode !== mode);
  if (other !== undefined) {
    throw new SeedsiftError(
      'input',
      `${label(other)}: holds ${other.runSet.mode === 'scores' ? 'a score table' : 'per-step logs'}, ` +
        `${label(withRuns[0] as RunSetPart)} holds ${mode === 'scores' ? 'a score table' : 'per-step logs'}; they ` +
        `cannot be read together`,
    );
  }
  const keys: string[] = [];
  for (const p of parts) for (const k of p.runSet.keys) if (!keys.includes(k)) keys.push(k);
  const runs = new Map<string, MergedRun>();
  const origin = new Map<string, string[]>();
  const renamed: { part: RunSetPart; rename: (id: string) => string; config: (d: TickDump) => string }[] = [];
  for (const part of parts) {
    const ids = new Map<string, { id: string; config: string }>();
    for (const r of part.runSet.runs) {
      const config = configId(r.params, keys);
      ids.set(r.id, { id: runId(config, r.seed), config });
    }
    for (const d of part.runSet.tickDumps) {
      if (ids.has(d.run)) continue;
      const config = configId(paramsOf(d.config), keys);
      ids.set(d.run, { id: runId(config, d.seed), config });
    }
    renamed.push({ part, rename: (id) => ids.get(id)?.id ?? id, config: (d) => ids.get(d.run)?.config ?? d.config });
    for (const r of part.runSet.runs) {
      const { id, config: c } = ids.get(r.id) as { id: string; config: string };
      const run: MergedRun = { ...r, id, config: c, status: r.status === 'short' ? 'ok' : r.status };
      const where = part.digest ?? r.files[0] ?? label(part);
      const seen = runs.get(id);
      origin.set(id, [...(origin.get(id) ?? []), where]);
      runs.set(id, seen === undefined ? run : mergeRun(seen, run));
    }
  }
  const duplicates: Problem[] = [];
  for (const [id, from] of origin) {
    if (from.length < 2) continue;
    duplicates.push(
      problem(
        'run-duplicate',
        `${from.length} sources claim this config and seed: ${from.join(', ')}; their series were merged in that ` +
          `order (later values win on repeated steps)`,
        { run: id, file: from[1] as string },
      ),
    );
  }
  const merged = [...runs.values()];
  const drafts: Draft[] = [];
  markShort(merged, drafts);
  const short = await finishDrafts(drafts);
  const { metrics, problems: conflicts } = mergeMetrics(parts, options);
  const kept: Problem[] = [];
  const tickDumps: TickDump[] = [];
  const files: FileRecord[] = [];
  for (const { part, rename, config } of renamed) {
    for (const p of part.runSet.problems) {
      if (p.code === 'run-short' || p.code === 'goal-inferred' || p.code === 'goal-unknown') continue;
      kept.push(p.run === undefined ? p : { ...p, run: rename(p.run) });
    }
    for (const d of part.runSet.tickDumps) tickDumps.push({ ...d, run: rename(d.run), config: config(d) });
    for (const f of part.runSet.files) files.push({ ...f, runs: f.runs.map(rename) });
  }
  return {
    mode,
    keys,
    runs: merged,
    metrics,
    tickDumps,
    files,
    problems: [...kept, ...duplicates, ...conflicts, ...short, ...guessedGoals(parts, metrics)],
  };
}
