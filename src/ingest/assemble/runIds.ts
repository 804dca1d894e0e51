/**
 * Run and config ids: a run's config id is its params as `key=value` in `RunSet.keys` order (keys
 * first seen first), joined by commas; its run id is the config id + `,seed=` + the seed, or
 * `seed=S` for an empty config. Used by run assembly, score tables and digest merging alike.
 */

/**
 * Config keys in first-seen order over the sources. Pure.
 * Example: sources with params {ticks, memory} then {ticks, lr} give `['ticks', 'memory', 'lr']`.
 */
export function configKeys(sources: readonly { readonly params: Readonly<Record<string, string>> }[]): string[] {
  const keys: string[] = [];
  for (const s of sources) for (const k of Object.keys(s.params)) if (!keys.includes(k)) keys.push(k);
  return keys;
}

/**
 * Config id of a run's params (see the module comment). Pure.
 * Example: `configId({ memory: '4', ticks: '8' }, ['ticks', 'memory'])` is `'ticks=8,memory=4'`.
 */
export function configId(params: Readonly<Record<string, string>>, keys: readonly string[]): string {
  return keys
    .filter((k) => Object.hasOwn(params, k))
    .map((k) => `${k}=${params[k] as string}`)
    .join(',');
}

/** Run id from config id and seed. Example: `runId('ticks=8', '3')` is `'ticks=8,seed=3'`. */
export function runId(config: string, seed: string): string {
  return config === '' ? `seed=${seed}` : `${config},seed=${seed}`;
}
