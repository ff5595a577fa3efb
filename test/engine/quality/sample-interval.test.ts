import { describe, expect, it } from 'vitest';
import { medianSampleInterval } from '../../../src-renderer/engine/quality/criteria/sample-interval';
import { seededRandom } from '../../../src-renderer/engine/synthetic/random';

/**
 * The median by its definition: sort, take the middle value for an odd count and the mean
 * of the two middle values for an even count (NIST/SEMATECH e-Handbook of Statistical
 * Methods, section 1.3.5.1, "Measures of Location").
 */
function medianByDefinition(time: Float64Array): number {
  const intervals = new Float64Array(time.length - 1);
  for (let i = 1; i < time.length; i++) intervals[i - 1] = time[i] - time[i - 1];
  intervals.sort();
  const mid = Math.floor(intervals.length / 2);
  return intervals.length % 2 ? intervals[mid] : (intervals[mid - 1] + intervals[mid]) / 2;
}

/** Deterministic uniform numbers from the engine's seeded generator (mulberry32). */
function uniformSource(seed: number): () => number {
  const random = seededRandom(seed);
  return () => random.uniform();
}

function series(n: number, next: (i: number) => number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = next(i);
  return out;
}

describe('medianSampleInterval', () => {
  it('should give the hand-computed median of short records', () => {
    // intervals 1, 1, 2: median 1; intervals 1, 2, 3, 4: median (2 + 3) / 2 = 2.5 (definition above)
    expect(medianSampleInterval(new Float64Array([0, 1, 2, 4]))).toBe(1);
    expect(medianSampleInterval(new Float64Array([0, 1, 3, 6, 10]))).toBe(2.5);
    expect(medianSampleInterval(new Float64Array([5]))).toBeNaN();
  });

  it('should equal the sorted median bit for bit on long synthetic records of many shapes', () => {
    const uniform = uniformSource(42);
    const shapes: ((n: number) => Float64Array)[] = [
      // times written with two decimals, as contractor files do: intervals differ in the last bits
      (n) => series(n, (i) => Number((i * 0.1).toFixed(2))),
      // whole seconds: every interval exactly 1
      (n) => series(n, (i) => i),
      // jittered logger clock
      (n) => { let t = 0; return series(n, () => (t += 0.1 + (uniform() - 0.5) * 0.01)); },
      // two rates, half the record each
      (n) => { let t = 0; return series(n, (i) => (t += i < n / 2 ? 0.5 : 1.5)); },
      // intervals of 1 and 2 mixed at random: the median sits on a tie
      (n) => { let t = 0; return series(n, () => (t += uniform() < 0.5 ? 1 : 2)); },
      // repeated time stamps (zero intervals) and gaps with NaN: reference path
      (n) => { let t = 0; return series(n, () => (t += uniform() < 0.5 ? 0 : 1)); },
      (n) => series(n, (i) => (uniform() < 0.001 ? NaN : i)),
      // unordered times
      (n) => series(n, () => uniform() * 100),
    ];
    for (const [k, shape] of shapes.entries()) {
      for (const n of [8_193, 8_194, 120_001, 250_000]) {
        const time = shape(n);
        const expected = medianByDefinition(time);
        const got = medianSampleInterval(time);
        expect(Object.is(got, expected), `shape ${k}, n ${n}: ${got} vs ${expected}`).toBe(true);
      }
    }
  });
});
