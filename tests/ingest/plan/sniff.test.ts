import { describe, expect, it } from 'vitest';
import { countFields, sniffDelimiter, whitespaceFields } from '../../../src/ingest/plan/sniff.js';

// The rule is ours (src/ingest/plan/sniff.ts): candidates , tab ; | in order, then runs of
// whitespace; a candidate must split the first line into >1 fields and agree on more than half.
describe('sniffDelimiter', () => {
  it('semicolons', () => {
    expect(sniffDelimiter(['step;loss;acc', '1;0,5;0,1', '2;0,4;0,2'])).toEqual({ char: ';' });
  });
  it('tabs', () => {
    expect(sniffDelimiter(['step\tloss', '1\t0.5'])).toEqual({ char: '\t' });
  });
  it('aligned columns: runs of whitespace', () => {
    expect(sniffDelimiter(['step   loss    acc', '   1   0.5     0.1', '  10   0.25    0.2'])).toEqual({ char: null });
  });
  it('a malformed minority does not change the choice', () => {
    expect(sniffDelimiter(['step loss acc', '1 0.5 0.1', '2 0.4 0.2 9', '3 0.3 0.3'])).toEqual({ char: null });
    expect(sniffDelimiter(['step,loss', '1,2', '3', '4,5'])).toEqual({ char: ',' });
  });
  it('commas inside quotes do not split', () => {
    expect(countFields('a,"b,c",d', ',')).toBe(3);
  });
  it('blank lines are ignored; nothing at all gives a comma', () => {
    expect(sniffDelimiter(['', 'a|b', '', '1|2'])).toEqual({ char: '|' });
    expect(sniffDelimiter([])).toEqual({ char: ',' });
  });
  it('whitespaceFields drops leading and trailing blanks', () => {
    expect(whitespaceFields(' \t1  0.5\t2 ')).toEqual(['1', '0.5', '2']);
  });
});
