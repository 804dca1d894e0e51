/** Build RunSets in memory for analysis tests (invented data; no files). */
import type { Goal, MetricInfo, Run, RunSet, RunStatus, Series } from '../../src/ingest/types.js';
import type { Random } from '../../src/stats/random.js';

export interface SeriesSpec {
  readonly steps: readonly number[];
  readonly values: readonly number[];
  readonly divergedAt?: number | null;
}

export function series(steps: readonly number[], values: readonly number[], divergedAt: number | null = null): Series {
  return { steps: Float64Array.from(steps), values: Float64Array.from(values), divergedAt, missing: 0 };
}

export function configId(keys: readonly string[], params: Readonly<Record<string, string>>): string {
  return keys
    .filter((k) => params[k] !== undefined)
    .map((k) => `${k}=${params[k]}`)
    .join(',');
}

export interface RunSpec {
  readonly params: Readonly<Record<string, string>>;
  readonly seed: string | number;
  readonly metrics: Readonly<Record<string, SeriesSpec | number | null>>;
  readonly status?: RunStatus;
}

/** A run set; numbers in `metrics` become one point at step 0 (score tables), null no series. */
export function runSet(
  keys: readonly string[],
  specs: readonly RunSpec[],
  metrics: readonly (MetricInfo | { name: string; goal: Goal })[],
  mode: 'logs' | 'scores' = 'logs',
): RunSet {
  const runs: Run[] = specs.map((spec) => {
    const config = configId(keys, spec.params);
    const seed = String(spec.seed);
    const m: Record<string, Series> = {};
    let lastStep = 0;
    let divergedAt: number | null = null;
    for (const [name, v] of Object.entries(spec.metrics)) {
      if (v === null) continue;
      const s = typeof v === 'number' ? series([0], [v]) : series(v.steps, v.values, v.divergedAt ?? null);
      m[name] = s;
      if (s.steps.length > 0) lastStep = Math.max(lastStep, s.steps[s.steps.length - 1] as number);
      if (s.divergedAt !== null) divergedAt = divergedAt === null ? s.divergedAt : Math.min(divergedAt, s.divergedAt);
    }
    return {
      id: `${config},seed=${seed}`,
      config,
      params: spec.params,
      seed,
      info: {},
      files: [],
      identity: mode === 'scores' ? 'scores' : 'hive',
      metrics: m,
      tickMetrics: {},
      status: spec.status ?? (divergedAt === null ? 'ok' : 'diverged'),
      lastStep,
      divergedAt,
    };
  });
  const infos: MetricInfo[] = metrics.map((x) =>
    'kind' in x
      ? x
      : { name: x.name, goal: x.goal, goalSource: 'option', bookkeeping: false, kind: 'scalar', ticks: 0 },
  );
  return { mode, keys, runs, metrics: infos, tickDumps: [], files: [], problems: [] };
}

/** Standard normal draw (Box-Muller; the second value is discarded for simplicity). */
export function normal(random: Random): number {
  let u = random.next();
  while (u === 0) u = random.next();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random.next());
}

export const meta = { paths: ['runs'], generated: '2026-01-01T00:00:00.000Z', version: '0.1.0' } as const;
