/**
 * Per-config summary of the per-run values of one metric: the mean across seeds with its interval
 * by METHODS.md's rule (t-interval of the mean at every n, BCa bootstrap under `--interval bca`
 * from 4 runs; no interval from one run), for the report's per-seed values chart. Between-seed spread
 * only: it says how well the config's mean is pinned down, not how two configs differ (that is the
 * comparison's difference interval).
 */
import { createRandom, deriveSeed } from '../stats/random.js';
import { binBand, freshDraws } from './curves.js';
import type { ConfigValue, IntervalChoice, RunValue } from './results.js';

export interface ConfigValueSettings {
  readonly level: number;
  readonly interval: IntervalChoice;
  readonly bandResamples: number;
  readonly seed: number;
}

/**
 * Summarise `values` (one metric, one summary) per config, in the order configs first appear.
 * Runs without a value (diverged under exclude, censored, missing) are left out and counted in `missing`.
 * Cost O(values), plus a bootstrap per config with 20 runs or more.
 * Example: five runs of a config at 0.80..0.84 give mean 0.82 with a 95% t-interval.
 */
export function configValues(values: readonly RunValue[], settings: ConfigValueSettings): ConfigValue[] {
  const byConfig = new Map<string, RunValue[]>();
  for (const v of values) byConfig.set(v.config, [...(byConfig.get(v.config) ?? []), v]);
  const out: ConfigValue[] = [];
  for (const [config, list] of byConfig) {
    const first = list[0] as RunValue;
    const present = Float64Array.from(list.filter((v) => v.value !== null).map((v) => v.value as number));
    const random = createRandom(deriveSeed(settings.seed, `values|${first.metric}|${first.summary}|${config}`));
    const band = binBand(present, settings, freshDraws(random, settings.bandResamples));
    out.push({
      metric: first.metric,
      summary: first.summary,
      config,
      n: present.length,
      missing: list.length - present.length,
      mean: band.mean,
      low: band.low,
      high: band.high,
      level: settings.level,
      method: band.method,
    });
  }
  return out;
}
