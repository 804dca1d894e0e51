import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import {
  canonicalValue,
  mergeSidecar,
  readSidecar,
  sameValue,
  type Sidecar,
} from '../../../src/ingest/locate/sidecar.js';
import { makeTree, removeTree } from '../../fixtures/locate/tree.js';

const made: string[] = [];
afterEach(async () => {
  await Promise.all(made.splice(0).map(removeTree));
});
async function tree(t: Record<string, string>): Promise<string> {
  const root = await makeTree(t);
  made.push(root);
  return root;
}

// Expected JSON texts: ECMAScript JSON.stringify / Number::toString (common practice); Python's
// json.dumps gives the same texts for these values.
describe('canonicalValue', () => {
  it('keeps strings and writes other values as JSON text with sorted keys', () => {
    expect(canonicalValue('ctm')).toBe('ctm');
    expect(canonicalValue(32)).toBe('32');
    expect(canonicalValue(0.0001)).toBe('0.0001');
    expect(canonicalValue(1e-7)).toBe('1e-7');
    expect(canonicalValue(true)).toBe('true');
    expect(canonicalValue(null)).toBe('null');
    expect(canonicalValue([1, 'a'])).toBe('[1,"a"]');
    expect(canonicalValue({ b: 1, a: { d: 2, c: 3 } })).toBe('{"a":{"c":3,"d":2},"b":1}');
  });
});

describe('sameValue', () => {
  it('treats equal decimal numbers as the same value', () => {
    expect(sameValue('0.10', '0.1')).toBe(true);
    expect(sameValue('1e-4', '0.0001')).toBe(true);
    expect(sameValue('32', '32.0')).toBe(true);
  });
  it('compares anything else as text', () => {
    expect(sameValue('32', '16')).toBe(false);
    expect(sameValue('True', 'true')).toBe(false);
    expect(sameValue('', '0')).toBe(false);
    expect(sameValue('0x10', '16')).toBe(false);
  });
});

describe('readSidecar', () => {
  it('returns null and no problem when there is no params.json', async () => {
    const root = await tree({ 'log.csv': 'step\n' });
    expect(await readSidecar(join(root, 'params.json'))).toEqual({ sidecar: null, problems: [] });
  });

  it('reads top-level keys, stringified, with the line of each key', async () => {
    const root = await tree({
      'params.json': '{\n  "ticks": 32,\n  "lr": 0.0001,\n  "model": {"ticks": 1, "w": [1, 2]},\n  "name": "ctm"\n}\n',
    });
    const { sidecar, problems } = await readSidecar(join(root, 'params.json'));
    expect(problems).toEqual([]);
    expect(sidecar?.values).toEqual({ ticks: '32', lr: '0.0001', model: '{"ticks":1,"w":[1,2]}', name: 'ctm' });
    expect(sidecar?.lines).toEqual({ ticks: 2, lr: 3, model: 4, name: 5 });
  });

  it('reports invalid JSON as file-unreadable with the file and the line', async () => {
    const root = await tree({ 'params.json': '{\n  "ticks": 32,\n  "lr": 0.1,\n}\n' });
    const file = join(root, 'params.json');
    const { sidecar, problems } = await readSidecar(file);
    expect(sidecar).toBeNull();
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'file-unreadable', severity: 'error', file, line: 4 });
    expect(problems[0]?.message).toMatch(/params\.json is not valid JSON/);
  });

  it('reports a JSON value that is not an object', async () => {
    const root = await tree({ 'params.json': '[1, 2]' });
    const { sidecar, problems } = await readSidecar(join(root, 'params.json'));
    expect(sidecar).toBeNull();
    expect(problems[0]?.message).toMatch(/expected a JSON object of parameters, got an array/);
  });
});

describe('mergeSidecar', () => {
  const sidecar: Sidecar = {
    file: 'runs/a/params.json',
    values: { ticks: '16', memory: '4', seed: '3', _host: 'gpu1', lr: '0.10' },
    lines: { ticks: 2, memory: 3, seed: 4 },
  };

  it('adds new keys after the path keys and keeps the path value on disagreement', () => {
    const { identity, problems } = mergeSidecar(
      { params: { ticks: '32', lr: '0.1' }, info: {}, seed: '3' },
      sidecar,
      'path',
      true,
    );
    expect(identity.params).toEqual({ ticks: '32', lr: '0.1', memory: '4' });
    expect(Object.keys(identity.params)).toEqual(['ticks', 'lr', 'memory']);
    expect(identity.info).toEqual({ _host: 'gpu1' });
    expect(identity.seed).toBe('3');
    expect(problems).toEqual([
      {
        severity: 'warning',
        code: 'params-mismatch',
        file: 'runs/a/params.json',
        line: 2,
        message: "params.json says ticks=16 but the path says ticks=32; the path's value was kept",
      },
    ]);
  });

  it('supplies the seed when the path has none, and checks it when it has one', () => {
    expect(mergeSidecar({ params: {}, info: {}, seed: null }, sidecar, 'path', true).identity.seed).toBe('3');
    const { problems } = mergeSidecar({ params: {}, info: {}, seed: '5' }, sidecar, 'manifest', true);
    expect(problems.map((p) => [p.code, p.line, p.message])).toEqual([
      ['params-mismatch', 4, "params.json says seed=3 but the manifest says seed=5; the manifest's value was kept"],
    ]);
  });

  it('puts the seed into info when the seed is inside the file', () => {
    const { identity } = mergeSidecar({ params: {}, info: {}, seed: null }, sidecar, 'path', false);
    expect(identity.seed).toBeNull();
    expect(identity.info).toEqual({ seed: '3', _host: 'gpu1' });
  });

  it('does not change its inputs', () => {
    const base = Object.freeze({ params: Object.freeze({ ticks: '32' }), info: Object.freeze({}), seed: null });
    expect(() => mergeSidecar(base, sidecar, 'path', true)).not.toThrow();
    expect(base.params).toEqual({ ticks: '32' });
  });
});
