import { describe, expect, it } from 'vitest';
import { jackknifeAcceleration } from '../../src/stats/jackknifeAcceleration.js';
import { mean } from '../../src/stats/moments.js';
import { A, B, expectRelative, leaveOneOutMeans } from './idealBootstrap.js';

describe('jackknifeAcceleration', () => {
  it('for the mean of A (one sample) is 0.019456097143550056 (METHODS.md)', () => {
    expectRelative(jackknifeAcceleration([leaveOneOutMeans(A)]), 0.019456097143550056);
  });

  it('for mean(A) - mean(B) is 0.013974522533729852 (METHODS.md; scipy.stats.bootstrap two-sample formula)', () => {
    const mB = mean(B);
    const mA = mean(A);
    const jx = leaveOneOutMeans(A).map((m) => m - mB);
    const jy = leaveOneOutMeans(B).map((m) => mA - m);
    expectRelative(jackknifeAcceleration([jx, jy]), 0.013974522533729852);
  });

  it("a shift of one sample's estimates does not change a (it depends on deviations only)", () => {
    const j = leaveOneOutMeans(A);
    expectRelative(jackknifeAcceleration([j.map((v) => v + 1000)]), 0.019456097143550056, 1e-9);
  });

  it('throws a RangeError when every leave-one-out estimate is equal', () => {
    expect(() => jackknifeAcceleration([[2, 2, 2]])).toThrow(/every leave-one-out estimate is equal/);
    expect(() => jackknifeAcceleration([[2]])).toThrow(RangeError);
  });
});
