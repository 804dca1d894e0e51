/**
 * results.json and its JSON Schema, checked against things outside the writer:
 * - ajv (a JSON Schema draft-07 validator) validates the output against results.schema.json;
 * - DESIGN.md's `results.json` block (the published contract): every key it names is required by
 *   the schema, with the enumerations it lists;
 * - src/analysis/results.ts (the type): the schema lists each interface's members in the type's
 *   order, requires exactly its non-optional members, and the writer emits keys in that order.
 */
import { Ajv } from 'ajv';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Comparison, Results } from '../../src/analysis/results.js';
import { PROBLEM_CODES } from '../../src/problems.js';
import { RESULTS_SCHEMA, resultsJson } from '../../src/report/resultsJson.js';
import { sampleResults } from './sampleResults.js';

interface Node {
  type?: string | string[];
  $ref?: string;
  properties?: Record<string, Node>;
  required?: string[];
  items?: Node;
  enum?: unknown[];
  const?: unknown;
  additionalProperties?: Node | boolean;
  definitions?: Record<string, Node>;
}
const SCHEMA = RESULTS_SCHEMA as Node;

function resolve(node: Node | undefined): Node | undefined {
  if (node?.$ref === undefined) return node;
  return SCHEMA.definitions?.[node.$ref.replace('#/definitions/', '')];
}

/** A copy of the schema in which every object with properties allows no other keys. */
function strict(node: Node): Node {
  const out: Node = { ...node };
  if (node.properties !== undefined) {
    out.properties = Object.fromEntries(Object.entries(node.properties).map(([k, v]) => [k, strict(v)]));
    out.additionalProperties = false;
  }
  if (node.items !== undefined) out.items = strict(node.items);
  if (node.definitions !== undefined)
    out.definitions = Object.fromEntries(Object.entries(node.definitions).map(([k, v]) => [k, strict(v)]));
  return out;
}

/** The sample with every optional and nullable branch filled, so validation covers them. */
function fullResults(): Results {
  const r = sampleResults();
  const first = r.comparisons[0] as Comparison;
  const paired: Comparison = {
    ...first,
    task: 'glyphs',
    tests: { ...first.tests, paired: { t: 2.1, df: 4, p: 0.1, wilcoxonP: 0.125, pairs: 5 } },
    nonInferiority: { margin: 0.5, test: 'paired-t', p: 0.01, holds: true },
  };
  return {
    ...r,
    comparisons: [paired, ...r.comparisons.slice(1)],
    curves: r.curves.map((c) => ({ ...c, bandByBin: c.steps.map(() => 't' as const) })),
    tasks: [
      {
        metric: 'val_acc',
        config: 'memory=8',
        interquartileMean: 0.7,
        low: 0.6,
        high: 0.8,
        tasks: 3,
        probabilityOfImprovement: 0.6,
        baseline: 'memory=4',
        profile: { thresholds: [0.5, 0.7], fraction: [1, 0.4] },
      },
    ],
  };
}

describe('results.schema.json', () => {
  const ajv = new Ajv({ allErrors: true, strict: false });

  it('validates the sample results as written by resultsJson (ajv, draft-07)', () => {
    const validate = ajv.compile(SCHEMA);
    for (const r of [sampleResults(), fullResults()]) {
      const ok = validate(JSON.parse(resultsJson(r)));
      expect(validate.errors ?? []).toEqual([]);
      expect(ok).toBe(true);
    }
  });

  it('lists every key the sample holds (validation with no extra keys allowed)', () => {
    const validate = ajv.compile(strict(SCHEMA));
    validate(JSON.parse(resultsJson(fullResults())));
    expect(validate.errors ?? []).toEqual([]);
  });

  it('rejects results that break the contract', () => {
    const validate = ajv.compile(SCHEMA);
    const good = JSON.parse(resultsJson(sampleResults())) as Record<string, unknown>;
    const bad1 = { ...good, version: 2 };
    const bad2 = { ...good, comparisons: [{ ...(good.comparisons as object[])[0], verdict: 'maybe' }] };
    const { runs: _runs, ...bad3 } = good;
    for (const bad of [bad1, bad2, bad3]) expect(validate(bad)).toBe(false);
  });

  it('accepts every problem code of src/problems.ts, and only code-shaped text', () => {
    const problems = resolve(SCHEMA.properties?.problems)?.items;
    const validate = ajv.compile(resolve(problems?.properties?.code) ?? {});
    for (const code of Object.keys(PROBLEM_CODES)) expect(validate(code), code).toBe(true);
    for (const bad of ['', 'Not a code', 'run_diverged', '-x']) expect(validate(bad), bad).toBe(false);
  });
});

// ---------------------------------------------------------------------------------------------
// DESIGN.md contract: parse the `results.json` block (its own small notation: `key: value`,
// `{ ... }` nesting, `name[]` arrays, `name{}` records, `name?` optional, `a|b` enumerations).

interface DesignKey {
  readonly path: string;
  readonly optional: boolean;
  enumeration?: string[];
}

function designKeys(): DesignKey[] {
  const design = readFileSync(new URL('../reference/results-contract.md', import.meta.url), 'utf8');
  const from = design.indexOf('### `results.json`');
  const block = /```\n([\s\S]*?)```/.exec(design.slice(from))?.[1] ?? '';
  const tokens = block.replace(/\/\/[^\n]*/g, '').match(/\.\.\.|[A-Za-z_]\w*|\[\]|\{\}|"[^"]*"|\d+|[{}:,|?]/g) ?? [];
  const out: DesignKey[] = [];
  let i = 0;
  const entries = (prefix: string): void => {
    while (i < tokens.length && tokens[i] !== '}') {
      const t = tokens[i++] as string;
      if (t === ',' || t === '...') continue;
      if (!/^[A-Za-z_]/.test(t)) throw new Error(`DESIGN.md block: unexpected ${t}`);
      let array = false;
      let optional = false;
      while (tokens[i] === '[]' || tokens[i] === '{}' || tokens[i] === '?') {
        const s = tokens[i++];
        if (s === '[]') array = true;
        if (s === '?') optional = true;
      }
      const entry: DesignKey = { path: `${prefix === '' ? '' : `${prefix}.`}${t}${array ? '[]' : ''}`, optional };
      out.push(entry);
      if (tokens[i] !== ':') continue;
      i += 1;
      if (tokens[i] === '{') {
        i += 1;
        entries(entry.path);
        i += 1;
      } else if (/^[A-Za-z_]/.test(tokens[i] ?? '')) {
        const values = [tokens[i++] as string];
        while (tokens[i] === '|') {
          values.push(tokens[i + 1] as string);
          i += 2;
        }
        if (values.length > 1) entry.enumeration = values;
      } else {
        i += 1;
      }
    }
  };
  entries('');
  return out;
}

/** The schema node at a path like `comparisons[].difference` (`[]` steps into items). */
function nodeAt(path: string): Node | undefined {
  let node: Node | undefined = resolve(SCHEMA);
  if (path === '') return node;
  for (const part of path.split('.')) {
    node = resolve(node?.properties?.[part.replace('[]', '')]);
    if (part.endsWith('[]')) node = resolve(node?.items);
  }
  return node;
}

describe('the schema requires the keys DESIGN.md publishes', () => {
  const keys = designKeys();

  it('reads the whole block (a parse that found nothing would pass the next tests vacuously)', () => {
    const paths = keys.map((k) => k.path);
    expect(paths).toContain('comparisons[].difference.estimate');
    expect(paths).toContain('comparisons[].tests.mannWhitney.exact');
    expect(paths).toContain('problems[].run');
    expect(keys.length).toBeGreaterThan(50);
  });

  it('requires every key that DESIGN.md does not mark optional, on its path', () => {
    for (const key of keys) {
      const parts = key.path.split('.');
      const last = (parts.at(-1) ?? '').replace('[]', '');
      const parent = nodeAt(parts.slice(0, -1).join('.'));
      expect(Object.keys(parent?.properties ?? {}), `schema must describe ${key.path}`).toContain(last);
      if (!key.optional) expect(parent?.required ?? [], `schema must require ${key.path}`).toContain(last);
      if (key.path.endsWith('[]')) expect(resolve(parent?.properties?.[last])?.type).toBe('array');
    }
  });

  it('allows exactly the values DESIGN.md lists for enumerations', () => {
    const enumerations = keys.filter((k) => k.enumeration !== undefined);
    expect(enumerations.map((k) => k.path)).toEqual([
      'runs[].status',
      'comparisons[].goal',
      'comparisons[].verdict',
      'problems[].severity',
    ]);
    for (const key of enumerations) {
      const node = resolve(
        nodeAt(key.path.split('.').slice(0, -1).join('.'))?.properties?.[key.path.split('.').at(-1) ?? ''],
      );
      expect([...(node?.enum ?? [])].sort(), key.path).toEqual([...(key.enumeration ?? [])].sort());
    }
    expect(nodeAt('format')?.const).toBe('seedsift-results');
    expect(nodeAt('version')?.const).toBe(1);
  });
});

// ---------------------------------------------------------------------------------------------
// src/analysis/results.ts: member order and optionality of each interface.

/** Top-level members of `export interface NAME { ... }`: [name, optional], in order. */
function typeMembers(source: string, name: string): [string, boolean][] {
  const start = source.indexOf(`export interface ${name} {`);
  if (start < 0) throw new Error(`interface ${name} not found in results.ts`);
  const out: [string, boolean][] = [];
  let depth = 0;
  for (const [i, line] of source.slice(start).split('\n').entries()) {
    const m = /^\s*readonly (\w+)(\?)?:/.exec(line);
    if (m !== null && depth === 1) out.push([m[1] as string, m[2] === '?']);
    const code = /^\s*(\/\*\*|\*|\/\/)/.test(line) ? '' : line.replace(/\/\*.*?\*\//g, '').replace(/\/\/.*$/, '');
    for (const ch of code) depth += ch === '{' ? 1 : ch === '}' ? -1 : 0;
    if (i > 0 && depth === 0) break;
  }
  return out;
}

const INTERFACES: Record<string, string> = {
  Results: '',
  // Settings are derived from the options table: tests/cli/tableOptions.test.ts holds the schema to it.
  ConfigRecord: 'configs[]',
  MetricRecord: 'metrics[]',
  RunRecord: 'runs[]',
  RunValue: 'values[]',
  ConfigValue: 'configValues[]',
  Comparison: 'comparisons[]',
  Difference: 'comparisons[].difference',
  Curve: 'curves[]',
  TaskAggregate: 'tasks[]',
  TickCurve: 'ticks[]',
  HaltingCurve: 'halting[]',
  CalibrationCurve: 'calibration[]',
};

describe('the schema follows the Results type (src/analysis/results.ts)', () => {
  // results.ts and comparisonTypes.ts (the comparison records, kept apart for length) together are the type.
  const source = ['results.ts', 'comparisonTypes.ts']
    .map((f) => readFileSync(new URL(`../../src/analysis/${f}`, import.meta.url), 'utf8'))
    .join('\n');
  for (const [name, path] of Object.entries(INTERFACES)) {
    it(`${name}: same members, in the same order, the same ones optional`, () => {
      const members = typeMembers(source, name);
      expect(members.length).toBeGreaterThan(1);
      const node = nodeAt(path);
      expect(Object.keys(node?.properties ?? {})).toEqual(members.map(([m]) => m));
      expect([...(node?.required ?? [])].sort()).toEqual(
        members
          .filter(([, optional]) => !optional)
          .map(([m]) => m)
          .sort(),
      );
    });
  }
});

describe('resultsJson', () => {
  it('writes keys in the order of the type, 2-space indentation and a trailing newline', () => {
    const text = resultsJson(sampleResults());
    expect(
      text.startsWith('{\n  "format": "seedsift-results",\n  "version": 1,\n  "tool": {\n    "name": "seedsift",'),
    ).toBe(true);
    expect(text.endsWith('}\n')).toBe(true);
    const parsed = JSON.parse(text) as Record<string, unknown>;
    expect(Object.keys(parsed)).toEqual(Object.keys(nodeAt('')?.properties ?? {}));
    const comparison = (parsed.comparisons as Record<string, unknown>[])[0] ?? {};
    expect(Object.keys(comparison)).toEqual(
      Object.keys(nodeAt('comparisons[]')?.properties ?? {}).filter((k) => k in comparison),
    );
  });

  it('orders keys by the type whatever order the value was built in', () => {
    const r = sampleResults();
    const reversed = Object.fromEntries(Object.entries(r).reverse()) as unknown as Results;
    expect(resultsJson(reversed)).toBe(resultsJson(r));
  });

  it('keeps the order of records (params) as given', () => {
    const r = sampleResults();
    const run = { ...(r.runs[0] as Results['runs'][number]), params: { zeta: '1', alpha: '2' } };
    const parsed = JSON.parse(resultsJson({ ...r, runs: [run] })) as { runs: { params: Record<string, string> }[] };
    expect(Object.keys(parsed.runs[0]?.params ?? {})).toEqual(['zeta', 'alpha']);
  });

  it('writes NaN and infinities as null, never NaN', () => {
    const r = sampleResults();
    const c = r.comparisons[0] as Comparison;
    const broken: Comparison = {
      ...c,
      p: NaN,
      effect: { ...c.effect, hedgesG: Infinity },
      detectable: { ...c.detectable, minimumEffect: -Infinity },
    };
    const text = resultsJson({ ...r, comparisons: [broken] });
    expect(text).not.toMatch(/NaN|Infinity/);
    const parsed = JSON.parse(text) as {
      comparisons: { p: unknown; effect: { hedgesG: unknown }; detectable: { minimumEffect: unknown } }[];
    };
    expect(parsed.comparisons[0]?.p).toBeNull();
    expect(parsed.comparisons[0]?.effect.hedgesG).toBeNull();
    expect(parsed.comparisons[0]?.detectable.minimumEffect).toBeNull();
  });

  it('leaves out undefined optional members and is byte-identical for identical results', () => {
    const text = resultsJson(sampleResults());
    const parsed = JSON.parse(text) as { comparisons: { tests: Record<string, unknown> }[] };
    expect(Object.keys(parsed.comparisons[0]?.tests ?? {})).toEqual(['welch', 'permutation', 'mannWhitney']);
    expect(text).toBe(resultsJson(sampleResults()));
    expect(JSON.parse(resultsJson(fullResults())).comparisons[0].tests.paired.pairs).toBe(5);
  });
});
