/**
 * A notebook file: YAML front matter between `---` lines, then Markdown with Handlebars cells
 * (DESIGN.md "Notebook"). `parseNotebook` splits the two, reads the front matter with `yaml`, and
 * returns its settings as a partial options record in the command line's terms (camelCase names
 * of the long options, values as written) for the CLI to merge: command-line options override the
 * front matter, and `resolveOptions` checks the values once, at the edge. Here only the shape is
 * checked (a key we know, a scalar where a scalar belongs), with the notebook's file and line.
 *
 * Front matter keys come from the option tables (`readingOptions.ts`, `analysisOptions.ts`: each
 * entry's `front`, the long option name: `alpha`, `task-key`, `seed-column`, ...; camelCase also
 * accepted), plus `title` (the page title) and `runs` (a path or a list of paths, as written: the
 * CLI resolves them against the notebook's folder). `metrics: { val_acc: max, loss: min }` gives
 * goals, returned in the `--metric NAME:GOAL` form.
 */
import { LineCounter, parseDocument, isMap, isScalar, isSeq, type Node, type Pair } from 'yaml';
import { ANALYSIS_OPTIONS } from '../analysis/analysisOptions.js';
import type { FrontShape, OptionSpec, RawValue } from '../analysis/optionSpec.js';
import { READING_OPTIONS } from '../analysis/readingOptions.js';
import { SeedsiftError } from '../problems.js';

/** Every option that front matter can give: the entries of both option tables. */
const TABLES = { ...READING_OPTIONS, ...ANALYSIS_OPTIONS };
type OptionKey = keyof typeof TABLES;

/**
 * Settings from a notebook's front matter (every field optional): `title`, `runs`, and options
 * under their table keys (camelCase), values as written (`metrics: { val_acc: max }` becomes
 * `metricGoals: ['val_acc:max']`, comma-separated lists become text as on the command line).
 */
export type NotebookOptions = {
  readonly title?: string;
  readonly runs?: readonly string[];
} & { readonly [K in OptionKey]?: RawValue };

/** A notebook split into its parts. */
export interface Notebook {
  readonly file: string;
  readonly options: NotebookOptions;
  /** The Markdown and Handlebars after the front matter. */
  readonly body: string;
  /** 1-based line of the file on which `body` starts. */
  readonly bodyLine: number;
}

type Kind = FrontShape | 'paths';

/**
 * Front matter keys → the fields they may fill and the shape of their value there. A key shared by
 * two options (`metrics`: a mapping of goals, or a list of metrics to compare) picks the option
 * whose shape the value has.
 */
const KEYS: Readonly<Record<string, readonly (readonly [string, Kind])[]>> = (() => {
  const out: Record<string, (readonly [string, Kind])[]> = { title: [['title', 'text']], runs: [['runs', 'paths']] };
  for (const [field, spec] of Object.entries(TABLES) as [string, OptionSpec<unknown>][])
    if (spec.front !== null) out[spec.front] = [...(out[spec.front] ?? []), [field, spec.shape] as const];
  return out;
})();

const camel = (key: string): string => key.replace(/-([a-z])/g, (_m, c: string) => c.toUpperCase());
const BY_CAMEL: Readonly<Record<string, string>> = Object.fromEntries(Object.keys(KEYS).map((k) => [camel(k), k]));

/**
 * Split a notebook into front matter settings and body. A notebook without front matter is all
 * body. Cost O(length of the source).
 * Throws SeedsiftError('notebook') with the file and line for: an unclosed front matter, YAML that
 * does not parse, front matter that is not a mapping, an unknown key, or a value of the wrong shape
 * (a list where text belongs, a goal other than max or min).
 * Example: `parseNotebook('---\nalpha: 0.01\n---\n# Study\n', 'study.md')` →
 * `{ file: 'study.md', options: { alpha: 0.01 }, body: '# Study\n', bodyLine: 4 }`.
 */
export function parseNotebook(source: string, file: string): Notebook {
  const text = source.startsWith('\ufeff') ? source.slice(1) : source;
  const lines = text.split('\n');
  if (!/^---\s*$/.test(lines[0] ?? '')) return { file, options: {}, body: text, bodyLine: 1 };
  const end = lines.findIndex((line, i) => i > 0 && /^(---|\.\.\.)\s*$/.test(line));
  if (end < 0)
    throw new SeedsiftError('notebook', 'front matter: expected a closing --- line, got the end of the file', {
      file,
      line: 1,
    });
  const yamlText = lines.slice(1, end).join('\n');
  const options = readFrontMatter(yamlText, file, 2);
  return { file, options, body: lines.slice(end + 1).join('\n'), bodyLine: end + 2 };
}

function readFrontMatter(yamlText: string, file: string, firstLine: number): NotebookOptions {
  const counter = new LineCounter();
  const doc = parseDocument(yamlText, { lineCounter: counter, prettyErrors: false, uniqueKeys: true });
  const lineOf = (offset: number | undefined): number =>
    firstLine - 1 + (offset === undefined ? 1 : counter.linePos(offset).line);
  const first = doc.errors[0];
  if (first !== undefined) {
    throw new SeedsiftError(
      'notebook',
      `front matter: expected YAML, got an error: ${first.message.split('\n')[0] ?? ''}`,
      { file, line: lineOf(first.pos[0]) },
    );
  }
  if (doc.contents === null) return {};
  if (!isMap(doc.contents))
    throw new SeedsiftError('notebook', 'front matter: expected key: value lines', {
      file,
      line: lineOf(doc.contents.range?.[0]),
    });
  const out: Record<string, unknown> = {};
  for (const pair of doc.contents.items as Pair<unknown, unknown>[]) {
    const keyNode = pair.key as Node | null;
    const line = lineOf(keyNode?.range?.[0]);
    const key = isScalar(keyNode) ? String(keyNode.value) : '';
    const canonical = Object.hasOwn(KEYS, key) ? key : BY_CAMEL[key];
    const entries = canonical === undefined ? undefined : KEYS[canonical];
    const valueNode = pair.value as Node | null;
    const entry = entries?.find(([, kind]) => (kind === 'goals') === isMap(valueNode)) ?? entries?.[0];
    if (entry === undefined) {
      throw new SeedsiftError(
        'notebook',
        `front matter: unknown key '${key}'; expected one of ${Object.keys(KEYS).join(', ')}`,
        { file, line },
      );
    }
    const [field, kind] = entry;
    const lineAt = (node: Node | null | undefined): number =>
      lineOf(node?.range?.[0] ?? valueNode?.range?.[0] ?? keyNode?.range?.[0]);
    out[field] = readValue(canonical ?? key, kind, valueNode, file, lineAt);
  }
  return out as NotebookOptions;
}

function scalarOf(node: Node | null): string | number | boolean | null | undefined {
  if (node === null) return null;
  if (!isScalar(node)) return undefined;
  const v = node.value;
  return typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' || v === null ? v : undefined;
}

function readValue(
  key: string,
  kind: Kind,
  node: Node | null,
  file: string,
  lineAt: (node: Node | null | undefined) => number,
): unknown {
  const fail = (expected: string, at: Node | null | undefined = node): never => {
    throw new SeedsiftError('notebook', `front matter ${key}: expected ${expected}`, { file, line: lineAt(at) });
  };
  if (kind === 'goals') {
    if (!isMap(node)) return fail('a mapping of metric names to max or min, e.g. { val_acc: max, loss: min }');
    return (node.items as Pair<unknown, unknown>[]).map((p) => {
      const name = scalarOf(p.key as Node | null);
      const goal = scalarOf(p.value as Node | null);
      if (typeof name !== 'string' && typeof name !== 'number')
        return fail('metric names as keys', p.key as Node | null);
      if (goal !== 'max' && goal !== 'min')
        return fail(`max or min for ${String(name)}, got ${String(goal)}`, p.key as Node | null);
      return `${String(name)}:${goal}`;
    });
  }
  if (kind === 'paths' || kind === 'csv' || kind === 'list') {
    const items = isSeq(node) ? node.items.map((n) => scalarOf(n as Node | null)) : [scalarOf(node)];
    if (items.some((v) => typeof v !== 'string' && typeof v !== 'number'))
      return fail(kind === 'paths' ? 'a path or a list of paths' : 'a list or comma-separated text');
    const texts = items.map((v) => String(v));
    return kind === 'csv' ? texts.join(',') : texts;
  }
  const v = scalarOf(node);
  if (v === undefined || v === null) return fail('a single value');
  if (kind === 'text') {
    if (typeof v === 'boolean') return fail('text');
    return String(v);
  }
  if (kind === 'number') {
    if (typeof v === 'boolean') return fail('a number');
    return v;
  }
  return typeof v === 'number' ? String(v) : v;
}
