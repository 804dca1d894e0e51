/**
 * Selectors: `key=value[,key=value]`, the way `--baseline` names configurations (DESIGN.md,
 * "Command line"). A selector that names every config key but the seed picks one configuration;
 * one that names fewer keys picks a family of baselines, each the counterpart of the configs that
 * share its other values (see `pairing.ts`).
 */
import { didYouMean } from '../didYouMean.js';
import { SeedsiftError } from '../problems.js';
import { naturalCompare } from './inventory.js';

export interface Selector {
  /** As typed, e.g. `memory=4`. */
  readonly text: string;
  readonly pairs: readonly { readonly key: string; readonly value: string }[];
}

/**
 * Parse `key=value[,key=value]`. Whitespace around keys and values is trimmed; a value may hold
 * further `=` signs (the first one splits). Throws SeedsiftError('usage') naming the option on an
 * empty selector, a pair without `=`, an empty key or value, a repeated key, or the key `seed`.
 * Example: `parseSelector('memory=4,ticks=8').pairs` is
 * `[{ key: 'memory', value: '4' }, { key: 'ticks', value: '8' }]`.
 */
export function parseSelector(text: string, option = '--baseline'): Selector {
  const expected = `${option}: expected key=value[,key=value]`;
  if (text.trim() === '') throw new SeedsiftError('usage', `${expected}, got an empty selector`);
  const pairs: { key: string; value: string }[] = [];
  for (const part of text.split(',')) {
    const eq = part.indexOf('=');
    const key = eq < 0 ? '' : part.slice(0, eq).trim();
    const value = eq < 0 ? '' : part.slice(eq + 1).trim();
    if (key === '' || value === '')
      throw new SeedsiftError('usage', `${expected}, got '${text}' ('${part.trim()}' is not key=value)`);
    if (key === 'seed')
      throw new SeedsiftError(
        'usage',
        `${option}: the seed is not part of a config; name config keys only, got '${text}'`,
      );
    if (pairs.some((p) => p.key === key))
      throw new SeedsiftError('usage', `${expected}, got '${text}' (key '${key}' named twice)`);
    pairs.push({ key, value });
  }
  return { text, pairs };
}

/** Whether a config's parameters carry every value the selector names. */
export function matchesSelector(params: Readonly<Record<string, string>>, selector: Selector): boolean {
  return selector.pairs.every((p) => params[p.key] === p.value);
}

/**
 * Check a selector against the configs that exist: every key it names must be a config key other
 * than the task key, and at least one config must match. Throws SeedsiftError('usage') listing
 * the keys or the values available, e.g.
 * "--baseline: memory=5 matches no config; memory takes 4, 8, 12".
 */
export function checkSelector(
  selector: Selector,
  configs: readonly { readonly params: Readonly<Record<string, string>> }[],
  keys: readonly string[],
  taskKey: string | null,
  option = '--baseline',
): void {
  for (const { key } of selector.pairs) {
    if (key === taskKey) {
      throw new SeedsiftError(
        'usage',
        `${option}: '${key}' is the task key (--task-key); comparisons already run per task, name other keys, ` +
          `got '${selector.text}'`,
      );
    }
    if (!keys.includes(key)) {
      const available = keys.filter((k) => k !== taskKey);
      throw new SeedsiftError(
        'usage',
        `${option}: no config key '${key}'; keys ` +
          `are ${available.length === 0 ? '(none)' : available.join(', ')}; ${didYouMean(key, available)}`,
      );
    }
  }
  if (configs.some((c) => matchesSelector(c.params, selector))) return;
  const takes = selector.pairs.map(({ key }) => `${key} takes ${valuesOf(configs, key).join(', ')}`);
  const absent = selector.pairs.find(({ key, value }) => !valuesOf(configs, key).includes(value));
  const hint =
    absent === undefined
      ? 'did you mean a combination that exists? (each value exists, but no config has them all)'
      : didYouMean(absent.value, valuesOf(configs, absent.key), `${absent.key}=`);
  throw new SeedsiftError('usage', `${option}: ${selector.text} matches no config; ${takes.join('; ')}; ${hint}`);
}

/** The distinct values of one key across configs, in natural order. */
export function valuesOf(
  configs: readonly { readonly params: Readonly<Record<string, string>> }[],
  key: string,
): string[] {
  const seen = new Set<string>();
  for (const c of configs) {
    const v = c.params[key];
    if (v !== undefined) seen.add(v);
  }
  return [...seen].sort(naturalCompare);
}
