/**
 * A small deterministic pseudo-random generator for synthetic records: mulberry32
 * (a 32-bit multiply-xorshift generator, public domain, Tommy Ettinger 2017, from
 * memory) with Box-Muller normal deviates (Box & Muller 1958). Not for cryptography.
 */

/** A seeded generator of uniform [0, 1) and standard normal numbers. */
export interface RandomSource {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Standard normal (mean 0, SD 1). */
  normal(): number;
}

/**
 * A mulberry32 generator seeded with a 32-bit integer; the same seed always gives the
 * same sequence.
 *
 * @param seed any finite number (truncated to 32 bits).
 * @returns a RandomSource.
 * @throws nothing.
 * @example seededRandom(42).uniform() // the same value on every run
 */
export function seededRandom(seed: number): RandomSource {
  let state = (Math.trunc(seed) >>> 0) || 0x9e3779b9;
  let spare: number | null = null;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    if (spare !== null) { const s = spare; spare = null; return s; }
    let u = 0;
    while (u <= 1e-300) u = uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal };
}
