/**
 * A seeded pseudo-random generator: xoshiro128** (Blackman & Vigna 2018, "Scrambled linear
 * pseudorandom number generators"), state seeded by SplitMix32 so that any integer seed gives a
 * well-mixed state. 32-bit arithmetic only, so it is fast in JavaScript and identical on every
 * platform. Not for cryptography.
 *
 * Randomness is always passed in: every resampling function takes a `Random`; nothing in seedsift
 * keeps module-level random state.
 *
 * Example: `createRandom(1).next()` is the same number on every machine, in [0, 1).
 */
export interface Random {
  /** A uniform double in [0, 1) with 32 bits of randomness. */
  next(): number;
  /**
   * A uniform integer in [0, n) for 1 <= n <= 2^32 (Lemire's nearly divisionless method is not needed at these sizes;
   * multiply-shift).
   */
  int(n: number): number;
}

/** SplitMix32 step (a 32-bit variant of Steele, Lea & Flood 2014): mixes a seed into state words. */
function splitMix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * Create a xoshiro128** generator from an integer seed.
 * Throws a RangeError when the seed is not a finite integer.
 */
export function createRandom(seed: number): Random {
  if (!Number.isInteger(seed)) throw new RangeError(`random seed must be an integer, got ${seed}`);
  const mix = { s: seed | 0 };
  let a = splitMix32(mix);
  let b = splitMix32(mix);
  let c = splitMix32(mix);
  let d = splitMix32(mix);
  if ((a | b | c | d) === 0) a = 1;
  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  };
  return {
    next: () => nextUint32() / 4294967296,
    int: (n: number) => Math.floor((nextUint32() / 4294967296) * n),
  };
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/** Derive an independent child seed from a parent seed and a label (FNV-1a of the label mixed in). */
export function deriveSeed(seed: number, label: string): number {
  let h = 0x811c9dc5 ^ (seed | 0);
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h | 0;
}
