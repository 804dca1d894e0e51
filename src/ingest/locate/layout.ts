/**
 * `--layout TEMPLATE`: where a run's config and seed sit in its path, for folders that do not use
 * `key=value` names. The template is matched against the path relative to the PATH given on the
 * command line (`/`-separated), from its start to its end.
 *
 * Template syntax (seedsift's own):
 * - `{name}` captures one or more characters, never a `/`. Names start with a letter or `_` and
 *   go on with letters, digits, `_`, `-`, `.`. The field `seed` is the replicate; fields starting
 *   with `_` are information (kept, not part of the config); each name may appear once.
 * - `*` matches any characters within one segment (possibly none).
 * - `**` is a whole segment and matches any depth: zero or more folders in the middle
 *   (`runs/**\/log.csv`), one or more segments at the end (`runs/**`).
 * - Everything else matches itself (so `.`, `(`, `+` are literal).
 * Fields and `*` match lazily from left to right: each takes the shortest text that still lets
 * the rest of the template match. So `{model}_{task}_{seed}_{_stamp}` splits
 * `looped_glyph-count-v2_3_20260301120000` as model `looped`, task `glyph-count-v2`, seed `3`,
 * _stamp `20260301120000` (the last field, anchored at the end, takes what is left). A value
 * that itself holds the separator (`glyph_count`) is split at its first one: choose a separator
 * that never occurs inside a value, or put the field last.
 */
import { SeedsiftError } from '../../problems.js';

/** A compiled layout template. */
export interface Layout {
  readonly template: string;
  /** Field names in template order (including `seed` and `_` fields). */
  readonly fields: readonly string[];
  /** The regular expression the template compiles to (anchored at both ends). */
  readonly pattern: RegExp;
  /** Field values for a `/`-separated relative path, or null when the path does not match. */
  match(relPath: string): Record<string, string> | null;
}

const NAME = /^[A-Za-z_][A-Za-z0-9_.-]*$/;

function usage(template: string, what: string): SeedsiftError {
  return new SeedsiftError('usage', `--layout '${template}': ${what}`);
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/**
 * Compile a `--layout` template into one anchored RegExp (built once; matching a path then costs
 * about O(length of the path x number of fields) with lazy backtracking within segments).
 * Throws SeedsiftError('usage') naming the problem for a malformed template: empty, absolute,
 * an empty segment, unbalanced `{` `}`, an empty or invalid field name, a repeated field, or `**`
 * that is not a whole segment.
 * Example: `compileLayout('{model}_{seed}/log.csv').match('ctm_3/log.csv')` is
 * `{ model: 'ctm', seed: '3' }`.
 */
export function compileLayout(template: string): Layout {
  const body = template.startsWith('./') ? template.slice(2) : template;
  if (body === '')
    throw usage(template, 'expected a path template such as {model}/seed_{seed}/log.csv, got an empty one');
  if (body.startsWith('/'))
    throw usage(template, 'expected a path relative to the PATH given, got one starting with /');
  if (body.split('/').includes(''))
    throw usage(template, 'expected non-empty path segments, got an empty one (// or a trailing /)');

  const fields: string[] = [];
  let source = '';
  let i = 0;
  while (i < body.length) {
    const c = body[i] as string;
    if (c === '{') {
      const close = body.indexOf('}', i + 1);
      const nextOpen = body.indexOf('{', i + 1);
      if (close < 0 || (nextOpen >= 0 && nextOpen < close)) {
        throw usage(template, `unbalanced braces: the '{' at character ${i + 1} has no matching '}'`);
      }
      const name = body.slice(i + 1, close);
      if (!NAME.test(name)) {
        throw usage(
          template,
          `expected a field name (a letter or _, then letters, digits, _ - .) inside {}, got '{${name}}'`,
        );
      }
      if (fields.includes(name)) throw usage(template, `the field {${name}} appears twice; each field may appear once`);
      fields.push(name);
      source += '([^/]+?)';
      i = close + 1;
    } else if (c === '}') {
      throw usage(template, `unbalanced braces: the '}' at character ${i + 1} has no matching '{'`);
    } else if (c === '*' && body[i + 1] === '*') {
      const wholeSegment = (i === 0 || body[i - 1] === '/') && (i + 2 === body.length || body[i + 2] === '/');
      if (!wholeSegment)
        throw usage(template, `'**' must be a whole path segment (as in runs/**/log.csv), found at character ${i + 1}`);
      if (i + 2 === body.length) {
        source += '.+';
        i += 2;
      } else {
        source += '(?:[^/]+/)*?';
        i += 3;
      }
    } else if (c === '*') {
      source += '[^/]*?';
      i += 1;
    } else {
      source += escapeRegExp(c);
      i += 1;
    }
  }

  const pattern = new RegExp(`^${source}$`, 's');
  return {
    template,
    fields,
    pattern,
    match(relPath: string): Record<string, string> | null {
      const m = pattern.exec(relPath);
      if (m === null) return null;
      const out: Record<string, string> = {};
      fields.forEach((name, k) => {
        out[name] = m[k + 1] as string;
      });
      return out;
    },
  };
}
