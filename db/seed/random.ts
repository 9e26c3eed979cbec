/**
 * A small, seeded pseudo-random source for the demo data generator.
 *
 * The core is mulberry32: a 32-bit state advanced by a Weyl increment (0x6d2b79f5) and scrambled
 * by two multiply–xorshift rounds. It is fast, has a period of 2^32 and is plenty for demo data;
 * it is not suitable for anything security related. The same seed always gives the same stream,
 * on every platform, because every step is 32-bit integer arithmetic (Math.imul, >>>).
 */

export interface Random {
  /** Uniform on [0, 1). */
  next(): number;
  /** Uniform on [min, max). */
  uniform(min: number, max: number): number;
  /** Integer uniform on [min, max], both ends included. */
  integer(min: number, max: number): number;
  /** Normal with the given mean and standard deviation (Box–Muller transform). */
  normal(mean?: number, sd?: number): number;
  /** One element of a non-empty list, each equally likely. */
  pick<T>(items: readonly T[]): T;
  /** True with probability p. */
  chance(p: number): boolean;
}

/** mulberry32: returns a generator of uniform numbers on [0, 1). */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function createRandom(seed: number): Random {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${seed}`);
  const next = mulberry32(Math.trunc(seed));
  // Box–Muller yields two independent normals per pair of uniforms; keep the second for next time.
  let spareNormal: number | null = null;

  const standardNormal = (): number => {
    if (spareNormal !== null) {
      const value = spareNormal;
      spareNormal = null;
      return value;
    }
    let u1 = next();
    while (u1 === 0) u1 = next(); // log(0) is -Infinity
    const u2 = next();
    const radius = Math.sqrt(-2 * Math.log(u1));
    spareNormal = radius * Math.sin(2 * Math.PI * u2);
    return radius * Math.cos(2 * Math.PI * u2);
  };

  return {
    next,
    uniform: (min, max) => min + (max - min) * next(),
    integer: (min, max) => {
      const low = Math.ceil(min);
      const high = Math.floor(max);
      if (high < low) throw new RangeError(`empty integer range [${min}, ${max}]`);
      return low + Math.floor(next() * (high - low + 1));
    },
    normal: (mean = 0, sd = 1) => mean + sd * standardNormal(),
    pick: <T>(items: readonly T[]): T => {
      if (items.length === 0) throw new RangeError('cannot pick from an empty list');
      return items[Math.floor(next() * items.length)];
    },
    chance: (p) => next() < p,
  };
}
