/**
 * `results.json`: the `Results` contract written as deterministic JSON.
 *
 * Keys come out in the order of the `Results` type, which is the order of `properties` in
 * `results.schema.json` (one source for both: a key added to the type and the schema lands in its
 * place). Keys the schema does not list (records such as `params`, or keys added later) keep the
 * order of the value. 2-space indentation, a trailing newline. NaN and infinities become null, as
 * the contract says ("numbers that do not exist are null, never NaN"); undefined object members are
 * left out, as `JSON.stringify` does.
 */
import type { Results } from '../analysis/results.js';
import { coarseCurves, JSON_CURVE_POINTS } from './coarseCurves.js';
import schema from './results.schema.json' with { type: 'json' };

/** The part of a JSON Schema node that decides key order. */
interface SchemaNode {
  readonly $ref?: string;
  readonly properties?: Readonly<Record<string, SchemaNode>>;
  readonly items?: SchemaNode;
  readonly additionalProperties?: SchemaNode | boolean;
}

const ROOT = schema as unknown as SchemaNode & { readonly definitions: Readonly<Record<string, SchemaNode>> };

function resolve(node: SchemaNode | undefined): SchemaNode | undefined {
  if (node?.$ref === undefined) return node;
  const name = node.$ref.replace('#/definitions/', '');
  return ROOT.definitions[name];
}

/** A copy of `value` whose objects list their keys in schema order; non-finite numbers become null. */
function ordered(value: unknown, node: SchemaNode | undefined): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (value === null || typeof value !== 'object') return value;
  const n = resolve(node);
  if (Array.isArray(value)) return value.map((v: unknown) => (v === undefined ? null : ordered(v, n?.items)));
  const record = value as Readonly<Record<string, unknown>>;
  const out: Record<string, unknown> = {};
  const known = n?.properties ?? {};
  const rest = typeof n?.additionalProperties === 'object' ? n.additionalProperties : undefined;
  for (const key of Object.keys(known)) {
    if (Object.hasOwn(record, key) && record[key] !== undefined) out[key] = ordered(record[key], known[key]);
  }
  for (const key of Object.keys(record)) {
    if (!Object.hasOwn(known, key) && record[key] !== undefined) out[key] = ordered(record[key], rest);
  }
  return out;
}

/**
 * Serialise `Results` as `results.json` (format `seedsift-results`, version 1): key order of the
 * type, 2-space indentation, trailing newline, null for every missing or non-finite number.
 * Curves are written on a coarser grid of at most `curvePoints` bins (default `JSON_CURVE_POINTS`;
 * null for the full grid), said in `curveGrid`; `problemCodes` groups the problems by code.
 * Identical `Results` give identical bytes. Cost O(size of Results). Never throws for a `Results`
 * value (plain records only; a cyclic value would throw a TypeError from `JSON.stringify`).
 * Example: `resultsJson(results).startsWith('{\n  "format": "seedsift-results",\n  "version": 1,')` → true.
 */
export function resultsJson(results: Results, options: { readonly curvePoints?: number | null } = {}): string {
  const points = options.curvePoints === undefined ? JSON_CURVE_POINTS : options.curvePoints;
  const bins = Math.max(0, ...results.curves.map((c) => c.steps.length));
  const curves = points === null ? results.curves : coarseCurves(results.curves, points);
  const curveGrid = { maxPoints: points, coarsened: points !== null && bins > points };
  return (
    JSON.stringify(ordered({ ...results, curves, curveGrid, problemCodes: problemCodes(results) }, ROOT), null, 2) +
    `\n`
  );
}

/** Problems grouped by code: severity, count and the first three messages (every one stays in `problems`). */
function problemCodes(results: Results): { code: string; severity: string; count: number; examples: string[] }[] {
  const byCode = new Map<string, { code: string; severity: string; count: number; examples: string[] }>();
  for (const p of results.problems) {
    const g = byCode.get(p.code) ?? { code: p.code, severity: p.severity, count: 0, examples: [] };
    g.count += 1;
    if (g.examples.length < 3) g.examples.push(p.message);
    byCode.set(p.code, g);
  }
  return [...byCode.values()];
}

/** The JSON Schema (draft-07) of `results.json`, as shipped in `results.schema.json`. */
export const RESULTS_SCHEMA: Readonly<Record<string, unknown>> = schema;
