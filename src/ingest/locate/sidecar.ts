/**
 * `params.json` beside a run's log: a JSON object of parameters (training scripts often dump
 * their config there). It adds parameters to what the path or manifest says, and it is the check
 * against a mislabelled folder: where it disagrees with the path, the path's value is kept and a
 * `params-mismatch` problem is recorded.
 *
 * Rules (seedsift's own):
 * - Only the file in the same folder as the log counts (not parent folders): one folder, one run
 *   config, no guessing about which ancestor applies.
 * - Top-level keys only. String values are taken as they are; other values become their JSON
 *   text, objects with sorted keys (`3`, `0.0001`, `true`, `null`, `[1,2]`, `{"a":1,"b":2}`).
 * - Two values agree when their texts are equal or both are decimal numbers with the same value
 *   (`0.10` and `0.1`, `1e-4` and `0.0001`).
 * - `seed` is compared with the path's seed; when the path has none it supplies the seed.
 *   Keys starting with `_` are information, like `_`-prefixed layout fields.
 * - A file that is not a JSON object is a `file-unreadable` problem (with its line when the JSON
 *   parser says where); the run keeps the values from its path.
 */
import { readFile } from 'node:fs/promises';
import { problem, type Problem } from '../../problems.js';

export const SIDECAR_NAME = 'params.json';

/** A parsed params.json. */
export interface Sidecar {
  /** Path of the params.json, as seedsift opened it. */
  readonly file: string;
  /** Top-level values, stringified (see the module comment), in file order. */
  readonly values: Readonly<Record<string, string>>;
  /** 1-based line of each top-level key. */
  readonly lines: Readonly<Record<string, number>>;
}

/** A run's identity before and after a sidecar is merged. */
export interface Identity {
  readonly params: Readonly<Record<string, string>>;
  readonly info: Readonly<Record<string, string>>;
  readonly seed: string | null;
}

function sortKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(sortKeys);
  if (v !== null && typeof v === 'object') {
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(v).sort()) out[k] = sortKeys((v as Record<string, unknown>)[k]);
    return out;
  }
  return v;
}

/**
 * Canonical text of a JSON value: strings as they are, anything else as JSON text with object
 * keys sorted at every depth (numbers as JSON writes them). Pure, O(size).
 * Example: `canonicalValue({ b: 1, a: 0.0001 })` is `'{"a":0.0001,"b":1}'`.
 */
export function canonicalValue(v: unknown): string {
  return typeof v === 'string' ? v : JSON.stringify(sortKeys(v));
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * Whether two parameter texts mean the same value: equal text, or both decimal numbers (optional
 * sign, digits, point, exponent) with the same IEEE-754 double value. Pure, O(length).
 * Example: `sameValue('1e-4', '0.0001')` is true; `sameValue('True', 'true')` is false.
 */
export function sameValue(a: string, b: string): boolean {
  return a === b || (DECIMAL.test(a) && DECIMAL.test(b) && Number(a) === Number(b));
}

function lineAt(text: string, position: number): number {
  let line = 1;
  for (let i = 0; i < position && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

/** Lines of the top-level keys of a JSON object text (a small scanner: strings and nesting only). */
function topLevelKeyLines(text: string): Map<string, number> {
  const out = new Map<string, number>();
  let depth = 0;
  let line = 1;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '\n') line++;
    else if (c === '{' || c === '[') depth++;
    else if (c === '}' || c === ']') depth--;
    else if (c === '"') {
      const start = i;
      for (i++; i < text.length && text[i] !== '"'; i++) if (text[i] === '\\') i++;
      if (depth === 1 && /^\s*:/.test(text.slice(i + 1, i + 64))) {
        const key = JSON.parse(text.slice(start, i + 1)) as string;
        if (!out.has(key)) out.set(key, line);
      }
    }
  }
  return out;
}

/**
 * Read `params.json` at `file`. Returns `sidecar: null` when there is no such file, and a
 * `file-unreadable` problem (sidecar null) when it cannot be read or is not a JSON object.
 * Cost: one file read, O(size). Never throws.
 * Example: a file `{"ticks": 32, "lr": "1e-4"}` gives values `{ ticks: '32', lr: '1e-4' }`.
 */
export async function readSidecar(file: string): Promise<{ sidecar: Sidecar | null; problems: Problem[] }> {
  let text: string;
  try {
    text = (await readFile(file, 'utf8')).replace(/^\uFEFF/, '');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT' || code === 'ENOTDIR') return { sidecar: null, problems: [] };
    return {
      sidecar: null,
      problems: [
        problem(
          'file-unreadable',
          `params.json could not be read (${code ?? String(error)}); its parameters were not used`,
          { file },
        ),
      ],
    };
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch (error) {
    const message = (error as Error).message;
    const at = /position (\d+)/.exec(message);
    const where = at === null ? { file } : { file, line: lineAt(text, Number(at[1])) };
    return {
      sidecar: null,
      problems: [
        problem('file-unreadable', `params.json is not valid JSON (${message}); its parameters were not used`, where),
      ],
    };
  }
  if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed)) {
    const got = parsed === null ? 'null' : Array.isArray(parsed) ? 'an array' : `a ${typeof parsed}`;
    return {
      sidecar: null,
      problems: [
        problem(
          'file-unreadable',
          `params.json: expected a JSON object of parameters, got ${got}; its parameters were not used`,
          { file },
        ),
      ],
    };
  }
  const keyLines = topLevelKeyLines(text);
  const values: Record<string, string> = {};
  const lines: Record<string, number> = {};
  for (const [key, value] of Object.entries(parsed)) {
    values[key] = canonicalValue(value);
    const line = keyLines.get(key);
    if (line !== undefined) lines[key] = line;
  }
  return { sidecar: { file, values, lines }, problems: [] };
}

/**
 * Merge a sidecar into a run's identity. Keys the identity lacks are added (params in sidecar
 * order after the existing ones; `_` keys to info); keys it has are compared and a disagreement
 * is a `params-mismatch` problem at the sidecar's line, the identity's value kept. `origin` names
 * where the identity came from ("path", "manifest") for the message. `takeSeed` false (the seed
 * is inside the file) puts a sidecar `seed` into info instead. Pure; cost O(keys).
 * Example: identity `{ params: { ticks: '32' } }` and sidecar `{ ticks: '16', lr: '0.1' }` give
 * params `{ ticks: '32', lr: '0.1' }` and one params-mismatch problem.
 */
export function mergeSidecar(
  identity: Identity,
  sidecar: Sidecar,
  origin: string,
  takeSeed: boolean,
): { identity: Identity; problems: Problem[] } {
  const params: Record<string, string> = { ...identity.params };
  const info: Record<string, string> = { ...identity.info };
  let seed = identity.seed;
  const problems: Problem[] = [];
  const check = (key: string, ours: string, theirs: string): void => {
    if (sameValue(ours, theirs)) return;
    const line = sidecar.lines[key];
    const message =
      `params.json says ${key}=${theirs} but the ${origin} says ${key}=${ours}; ` + `the ${origin}'s value was kept`;
    problems.push(
      problem('params-mismatch', message, line === undefined ? { file: sidecar.file } : { file: sidecar.file, line }),
    );
  };
  for (const [key, value] of Object.entries(sidecar.values)) {
    if (key === 'seed' && takeSeed) {
      if (seed === null) seed = value;
      else check(key, seed, value);
    } else if (key === 'seed' || key.startsWith('_')) {
      const ours = info[key];
      if (ours === undefined) info[key] = value;
      else check(key, ours, value);
    } else {
      const ours = params[key];
      if (ours === undefined) params[key] = value;
      else check(key, ours, value);
    }
  }
  return { identity: { params, info, seed }, problems };
}
