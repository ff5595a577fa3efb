import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { displayIndices, largestTriangleThreeBuckets, minMaxPerPixel } from '../../../src-renderer/app/charts/decimate';

describe('largestTriangleThreeBuckets', () => {
  it('should reproduce a worked example of the published bucket rule', () => {
    // Worked by hand from Steinarsson (2013), MSc thesis, University of Iceland, sec. 4.2:
    // n = 10, threshold 4 -> bucket size (10-2)/(4-2) = 4; buckets {1..4} and {5..8}.
    // Bucket 1: triangle with (0,0) and next-bucket mean (6.5, 0.5): areas 6, 1, 31, 2 -> index 3.
    // Bucket 2: triangle with (3,5) and last point (9,0): areas 20, 3, 10, 5 -> index 5.
    const x = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9];
    const y = [0, 1, 0, 5, 0, 0, 2, 0, 0, 0];
    expect(Array.from(largestTriangleThreeBuckets(x, y, 4))).toEqual([0, 3, 5, 9]);
  });

  it('should keep the first and last samples and return exactly the threshold', () => {
    fc.assert(fc.property(
      fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 10, maxLength: 400 }),
      fc.integer({ min: 3, max: 9 }),
      (values, threshold) => {
        const x = values.map((_, i) => i);
        const kept = largestTriangleThreeBuckets(x, values, threshold);
        expect(kept.length).toBe(threshold);
        expect(kept[0]).toBe(0);
        expect(kept[kept.length - 1]).toBe(values.length - 1);
        for (let i = 1; i < kept.length; i++) expect(kept[i]).toBeGreaterThan(kept[i - 1]);
      },
    ));
  });

  it('should return every index when the record is shorter than the threshold', () => {
    expect(Array.from(largestTriangleThreeBuckets([0, 1, 2], [5, 6, 7], 10))).toEqual([0, 1, 2]);
  });

  it('should keep an isolated spike (the largest triangle in its bucket)', () => {
    const n = 10_000;
    const x = Array.from({ length: n }, (_, i) => i);
    const y = Array.from({ length: n }, (_, i) => (i === 4321 ? 100 : Math.sin(i / 500)));
    expect(Array.from(largestTriangleThreeBuckets(x, y, 200))).toContain(4321);
  });
});

describe('minMaxPerPixel', () => {
  it('should keep the lowest and highest sample of every pixel column', () => {
    // Property from the definition (common practice for dense-signal plotting): drawn as a
    // polyline, the kept points span the same vertical extent per column as the full data.
    fc.assert(fc.property(
      fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 200, maxLength: 2000 }),
      fc.integer({ min: 2, max: 40 }),
      (values, pixels) => {
        const n = values.length;
        const x = values.map((_, i) => i);
        const kept = minMaxPerPixel(x, values, pixels);
        expect(kept.length).toBeLessThanOrEqual(pixels * 4);
        const column = (i: number) => Math.min(pixels - 1, Math.floor((i / (n - 1)) * pixels));
        const fullMin = new Map<number, number>();
        const fullMax = new Map<number, number>();
        values.forEach((v, i) => {
          const c = column(i);
          fullMin.set(c, Math.min(fullMin.get(c) ?? Infinity, v));
          fullMax.set(c, Math.max(fullMax.get(c) ?? -Infinity, v));
        });
        const keptMin = new Map<number, number>();
        const keptMax = new Map<number, number>();
        for (const i of kept) {
          const c = column(i);
          keptMin.set(c, Math.min(keptMin.get(c) ?? Infinity, values[i]));
          keptMax.set(c, Math.max(keptMax.get(c) ?? -Infinity, values[i]));
        }
        // Values compare as numbers: -0 and +0 are the same reading (x + 0 turns -0 into +0).
        for (const [c, v] of fullMin) expect(keptMin.get(c)! + 0).toBe(v + 0);
        for (const [c, v] of fullMax) expect(keptMax.get(c)! + 0).toBe(v + 0);
        expect(kept[0]).toBe(0);
        expect(kept[kept.length - 1]).toBe(n - 1);
      },
    ), { numRuns: 60 });
  });

  it('should keep exactly first, lowest, highest and last of each column when times repeat or leave gaps', () => {
    // Reference: the definition applied sample by sample (column = floor((x - x0) / span * pixels),
    // first occurrence on ties), against the run-by-run search over sorted times.
    fc.assert(fc.property(
      fc.array(fc.tuple(fc.integer({ min: 0, max: 3 }), fc.integer({ min: -50, max: 50 })), { minLength: 50, maxLength: 3000 }),
      fc.integer({ min: 1, max: 60 }),
      (steps, pixels) => {
        let t = 0;
        const x = steps.map(([dt]) => (t += dt === 3 ? 40 : dt));
        const y = steps.map(([, v]) => v);
        const n = x.length;
        const span = x[n - 1] - x[0];
        const expected: number[] = [];
        if (n <= pixels * 4) for (let i = 0; i < n; i++) expected.push(i);
        else if (!(span > 0)) expected.push(0, n - 1);
        else {
          const groups = new Map<number, { first: number; lo: number; hi: number; last: number }>();
          for (let i = 0; i < n; i++) {
            const c = Math.min(pixels - 1, Math.floor(((x[i] - x[0]) / span) * pixels));
            const g = groups.get(c);
            if (!g) { groups.set(c, { first: i, lo: i, hi: i, last: i }); continue; }
            g.last = i;
            if (y[i] < y[g.lo]) g.lo = i;
            if (y[i] > y[g.hi]) g.hi = i;
          }
          for (const g of groups.values()) {
            for (const k of [g.first, g.lo, g.hi, g.last].sort((a, b) => a - b)) if (expected[expected.length - 1] !== k) expected.push(k);
          }
        }
        expect(Array.from(minMaxPerPixel(x, y, pixels))).toEqual(expected);
      },
    ), { numRuns: 80 });
  });

  it('should return indices in increasing order', () => {
    const n = 50_000;
    const x = Float64Array.from({ length: n }, (_, i) => i * 0.5);
    const y = Float64Array.from({ length: n }, (_, i) => Math.cos(i) * i);
    const kept = minMaxPerPixel(x, y, 300);
    for (let i = 1; i < kept.length; i++) expect(kept[i]).toBeGreaterThan(kept[i - 1]);
  });
});

describe('displayIndices', () => {
  it('should keep the global peak and trough after LTTB thinning', () => {
    const n = 5000;
    const x = Float64Array.from({ length: n }, (_, i) => i);
    const y = Float64Array.from({ length: n }, (_, i) => Math.sin(i / 7) + (i === 2501 ? 3 : 0) - (i === 1234 ? 3 : 0));
    const kept = Array.from(displayIndices(x, y, 1000));
    expect(kept).toContain(2501);
    expect(kept).toContain(1234);
    for (let i = 1; i < kept.length; i++) expect(kept[i]).toBeGreaterThan(kept[i - 1]);
  });

  it('should thin a million-sample record to a drawable size and keep its peak', () => {
    const n = 1_000_000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) { x[i] = i; y[i] = i === 777_777 ? 50 : Math.sin(i / 1000); }
    const kept = displayIndices(x, y, 2000);
    expect(kept.length).toBeLessThanOrEqual(2000);
    expect(Array.from(kept)).toContain(777_777);
  });
});
