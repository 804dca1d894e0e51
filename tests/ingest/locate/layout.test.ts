import { describe, expect, it } from 'vitest';
import { compileLayout } from '../../../src/ingest/locate/layout.js';
import { SeedsiftError } from '../../../src/problems.js';

describe('compileLayout', () => {
  // Worked example from DESIGN.md "Inputs" (the template and the split it must give). An
  // independent engine agrees: Python 3 re.fullmatch(r'([^/]+?)_([^/]+?)_([^/]+?)_([^/]+?)', ...)
  // gives ('looped', 'glyph-count-v2', '3', '20260301120000') (run while writing this test).
  it('splits the DESIGN example lazily from left to right', () => {
    const layout = compileLayout('{model}/{model2}_{task}_{seed}_{_stamp}/eval.csv');
    expect(layout.fields).toEqual(['model', 'model2', 'task', 'seed', '_stamp']);
    expect(layout.match('looped/looped_glyph-count-v2_3_20260301120000/eval.csv')).toEqual({
      model: 'looped',
      model2: 'looped',
      task: 'glyph-count-v2',
      seed: '3',
      _stamp: '20260301120000',
    });
  });

  it('gives the DESIGN split for the one-segment template', () => {
    // DESIGN.md: `{model}_{task}_{seed}_{_stamp}` splits this as model looped, task glyph-count-v2, seed 3.
    expect(compileLayout('{model}_{task}_{seed}_{_stamp}').match('looped_glyph-count-v2_3_20260301120000')).toEqual({
      model: 'looped',
      task: 'glyph-count-v2',
      seed: '3',
      _stamp: '20260301120000',
    });
  });

  it('gives the earlier fields the shortest text and the last field the rest', () => {
    // Lazy quantifiers take the fewest characters that let the rest match (ECMAScript RegExp, common
    // practice); Python 3 re.fullmatch(r'([^/]+?)_([^/]+?)_([^/]+?)', 'x_y_z_w') gives ('x', 'y', 'z_w').
    expect(compileLayout('{a}_{b}_{c}').match('x_y_z_w')).toEqual({ a: 'x', b: 'y', c: 'z_w' });
    // A value holding the separator is split at its first one (documented limitation).
    expect(compileLayout('{model}_{seed}').match('glyph_count_7')).toEqual({ model: 'glyph', seed: 'count_7' });
  });

  it('never lets a field span a /', () => {
    const layout = compileLayout('{model}_{seed}.csv');
    expect(layout.match('a/b_3.csv')).toBeNull();
    expect(compileLayout('{a}/{b}.csv').match('x/y/z.csv')).toBeNull();
  });

  it('requires a field to take at least one character', () => {
    expect(compileLayout('{a}_{b}.csv').match('_b.csv')).toBeNull();
  });

  it('matches the whole relative path, not a part of it', () => {
    const layout = compileLayout('{model}/seed_{seed}');
    expect(layout.match('ctm/seed_1/log.csv')).toBeNull();
    expect(layout.match('x/ctm/seed_1')).toBeNull();
    expect(layout.match('ctm/seed_1')).toEqual({ model: 'ctm', seed: '1' });
  });

  it('* matches within one segment, possibly nothing', () => {
    const layout = compileLayout('{model}/*/log*.csv');
    expect(layout.match('ctm/2026-03-01/log.csv')).toEqual({ model: 'ctm' });
    expect(layout.match('ctm/2026-03-01/log_eval.csv')).toEqual({ model: 'ctm' });
    expect(layout.match('ctm/a/b/log.csv')).toBeNull();
  });

  it('** matches any depth, including none', () => {
    const layout = compileLayout('{model}/**/seed_{seed}.csv');
    expect(layout.match('ctm/seed_1.csv')).toEqual({ model: 'ctm', seed: '1' });
    expect(layout.match('ctm/a/seed_2.csv')).toEqual({ model: 'ctm', seed: '2' });
    expect(layout.match('ctm/a/b/c/seed_3.csv')).toEqual({ model: 'ctm', seed: '3' });
    const tail = compileLayout('{model}_{seed}/**');
    expect(tail.match('ctm_4/eval/log.csv')).toEqual({ model: 'ctm', seed: '4' });
    expect(tail.match('ctm_4')).toBeNull();
    expect(compileLayout('**/{seed}.csv').match('a/b/5.csv')).toEqual({ seed: '5' });
  });

  it('treats regular-expression characters in the template literally', () => {
    const layout = compileLayout('run(+{seed}).csv');
    expect(layout.match('run(+3).csv')).toEqual({ seed: '3' });
    expect(layout.match('run+3.csv')).toBeNull();
    expect(compileLayout('{seed}.csv').match('3xcsv')).toBeNull();
  });

  it('accepts a leading ./', () => {
    expect(compileLayout('./{seed}.csv').match('9.csv')).toEqual({ seed: '9' });
  });

  const malformed: [string, RegExp][] = [
    ['{model/{seed}.csv', /unbalanced braces: the '\{' at character 1 has no matching '\}'/],
    ['{model}}/x.csv', /unbalanced braces: the '\}' at character 8 has no matching '\{'/],
    ['{model}/{seed', /unbalanced braces/],
    ['{model}/{model}.csv', /the field \{model\} appears twice/],
    ['{}/x.csv', /expected a field name .* got '\{\}'/],
    ['{a b}/x.csv', /got '\{a b\}'/],
    ['{1st}/x.csv', /got '\{1st\}'/],
    ['a**/x.csv', /'\*\*' must be a whole path segment/],
    ['a/***/x.csv', /'\*\*' must be a whole path segment/],
    ['', /got an empty one/],
    ['/abs/{seed}.csv', /starting with \//],
    ['a//{seed}.csv', /empty one/],
    ['{model}/', /empty one/],
  ];
  it.each(malformed)('rejects the malformed template %j with a usage error', (template, message) => {
    let error: unknown;
    try {
      compileLayout(template);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(SeedsiftError);
    expect((error as SeedsiftError).code).toBe('usage');
    expect((error as SeedsiftError).message).toMatch(message);
    expect((error as SeedsiftError).message).toContain(`--layout '${template}'`);
  });
});
