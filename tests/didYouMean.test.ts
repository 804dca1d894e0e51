import { describe, expect, it } from 'vitest';
import { closestNames, didYouMean, editDistance, unknownName } from '../src/didYouMean.js';

describe('editDistance', () => {
  it('counts insertions, deletions, substitutions and neighbour swaps (optimal string alignment)', () => {
    // The textbook example (common practice): kitten -> sitting takes 3 edits (k->s, e->i, +g).
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('flaw', 'lawn')).toBe(2);
    expect(editDistance('same', 'same')).toBe(0);
    // A swap of neighbours is one edit (Damerau); plain Levenshtein would count 2.
    expect(editDistance('stpe', 'step')).toBe(1);
    // the optimal string alignment value (a true Damerau distance would be 2)
    expect(editDistance('ca', 'abc')).toBe(3);
  });
});

describe('closestNames and unknownName', () => {
  it('offers the close names, closest first, and nothing far', () => {
    expect(closestNames('val_ac', ['train_loss', 'val_loss', 'val_acc'])).toEqual(['val_acc']);
    expect(closestNames('acc', ['val_acc', 'acc_top5', 'loss'])).toEqual(['val_acc', 'acc_top5']);
    expect(closestNames('memroy', ['ticks', 'memory'])).toEqual(['memory']);
    expect(closestNames('xyz', ['ticks', 'memory'])).toEqual([]);
    expect(didYouMean('xyz', ['ticks', 'memory'])).toBe('did you mean one of ticks, memory?');
    expect(didYouMean('8x', ['8', '16'], 'ticks=')).toBe('did you mean ticks=8?');
  });

  it('builds one line: what is missing, what exists, did you mean', () => {
    const e = unknownName('--metrics', 'metric', 'val_ac', ['val_acc', 'loss']);
    expect(e.code).toBe('usage');
    expect(e.message).toBe("--metrics: no metric 'val_ac' (metrics: val_acc, loss); did you mean val_acc?");
  });
});
