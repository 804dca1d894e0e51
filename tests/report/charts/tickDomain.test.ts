/** tickDomain: from the first to the last tick (worked by hand). */
import { describe, expect, it } from 'vitest';
import { tickDomain } from '../../../src/report/charts/tickDomain.js';

describe('tickDomain', () => {
  it('spans the first to the last tick, in any order', () => {
    expect(tickDomain([0, 1, 2, 31])).toEqual([0, 31]);
    expect(tickDomain([7, 0, 3])).toEqual([0, 7]);
  });

  it('widens a single tick by half a tick each side, and gives [0, 1] for none', () => {
    expect(tickDomain([4, 4])).toEqual([3.5, 4.5]);
    expect(tickDomain([])).toEqual([0, 1]);
  });
});
