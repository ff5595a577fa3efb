import { describe, expect, it } from 'vitest';
import { gFunction, gFunctionSeries } from '../../../src-renderer/engine/analysis/gfunction';
import { EngineError } from '../../../src-renderer/engine/errors';

/**
 * Independent definition of Nolte's g: with fracture area growing as (t/tp)^alpha and
 * Carter leak-off, g(dtD) = 2 * integral_0^1 sqrt(1 + dtD - s^(1/alpha)) ds
 * (Nolte 1979, SPE 8341; derivation from memory). Composite Simpson, fine grid.
 */
function gByQuadrature(dtD: number, alpha: number): number {
  const n = 20000;
  const h = 1 / n;
  let sum = 0;
  for (let i = 0; i <= n; i++) {
    const s = i * h;
    const f = Math.sqrt(Math.max(0, 1 + dtD - s ** (1 / alpha)));
    sum += f * (i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2);
  }
  const g = 2 * (sum * h) / 3;
  const g0 = alpha === 1 ? 4 / 3 : Math.PI / 2;
  return (4 / Math.PI) * (g - g0);
}

describe('G-function', () => {
  it('should match the check values of METHODS.md to 1e-4', () => {
    // METHODS.md check values, computed there from Nolte (1979) SPE 8341.
    expect(Math.abs(gFunction(0.1, 1) - 0.2072)).toBeLessThan(1e-4);
    expect(Math.abs(gFunction(1, 1) - 1.4064)).toBeLessThan(1e-4);
    expect(Math.abs(gFunction(4, 1) - 3.7015)).toBeLessThan(1e-4);
    expect(Math.abs(gFunction(1, 0.5) - 1.2732)).toBeLessThan(1e-4);
    expect(Math.abs(gFunction(9, 0.5) - 5.9164)).toBeLessThan(1e-4);
    // G(1) for alpha 1/2 is exactly 4/pi (METHODS.md).
    expect(gFunction(1, 0.5)).toBeCloseTo(4 / Math.PI, 14);
  });

  it('should agree with the textbook formula evaluated directly where it is well conditioned', () => {
    // Nolte (1979) formulas as written in METHODS.md, evaluated naively for 0.05 <= dtD <= 50.
    for (const d of [0.05, 0.3, 1, 2.5, 7, 20, 50]) {
      const g1 = (4 / 3) * ((1 + d) ** 1.5 - d ** 1.5);
      const gHalf = (1 + d) * Math.asin((1 + d) ** -0.5) + Math.sqrt(d);
      expect(gFunction(d, 1)).toBeCloseTo((4 / Math.PI) * (g1 - 4 / 3), 11);
      expect(gFunction(d, 0.5)).toBeCloseTo((4 / Math.PI) * (gHalf - Math.PI / 2), 11);
    }
  });

  it('should agree with the leak-off integral that defines it', () => {
    // Quadrature of Nolte's defining integral (see gByQuadrature).
    for (const d of [0.2, 1, 3, 10]) {
      expect(gFunction(d, 1)).toBeCloseTo(gByQuadrature(d, 1), 6);
      expect(gFunction(d, 0.5)).toBeCloseTo(gByQuadrature(d, 0.5), 6);
    }
  });

  it('should be zero at shut-in, increasing, and follow the small and large dtD limits', () => {
    expect(gFunction(0, 1)).toBe(0);
    expect(gFunction(0, 0.5)).toBe(0);
    for (const alpha of [1, 0.5] as const) {
      let previous = 0;
      for (let e = -12; e <= 6; e += 0.25) {
        const g = gFunction(10 ** e, alpha);
        expect(g).toBeGreaterThan(previous);
        previous = g;
      }
    }
    // Small dtD: G ~ 8 dtD / pi (alpha 1), 2 dtD (alpha 1/2); next terms are O(dtD^1.5),
    // so at 1e-10 the relative error is about 1e-5 (series of the formulas, derived here).
    expect(gFunction(1e-10, 1) / ((8 * 1e-10) / Math.PI)).toBeCloseTo(1, 4);
    expect(gFunction(1e-10, 0.5) / (2 * 1e-10)).toBeCloseTo(1, 4);
    // And exactly to the second term: G = (4/pi)(4/3)(1.5 d - d^1.5 + 3/8 d^2 ...) (binomial series).
    const d = 1e-6;
    expect(gFunction(d, 1)).toBeCloseTo((16 / (3 * Math.PI)) * (1.5 * d - d ** 1.5 + 0.375 * d * d), 18);
    // Large dtD: G ~ (4/pi)(2 sqrt(d) - 4/3) and 8 sqrt(d)/pi - 2, error O(d^-0.5).
    const big = 1e12;
    expect(gFunction(big, 1)).toBeCloseTo((4 / Math.PI) * (2 * Math.sqrt(big) - 4 / 3), 4);
    expect(gFunction(big, 0.5)).toBeCloseTo((8 * Math.sqrt(big)) / Math.PI - 2, 4);
  });

  it('should compute a series over a shut-in from the pumping time', () => {
    // Constructed: tp = 100 s, shut-in at t = 100 s (index 2), samples every 50 s.
    const time = Float64Array.from([0, 50, 100, 110, 200, 500]);
    const g = gFunctionSeries(time, 2, 5, 100);
    expect(g.length).toBe(4);
    expect(g[0]).toBe(0);
    expect(g[1]).toBeCloseTo(gFunction(0.1), 14);
    expect(g[2]).toBeCloseTo(gFunction(1), 14);
    expect(g[3]).toBeCloseTo(gFunction(4), 14);
    const gHalf = gFunctionSeries(time, 2, 5, 100, 0.5);
    expect(gHalf[2]).toBeCloseTo(4 / Math.PI, 14);
  });

  it('should reject negative times, bad exponents and bad ranges with typed errors', () => {
    const code = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return (e as EngineError).code;
      }
      return 'none';
    };
    expect(code(() => gFunction(-0.1))).toBe('out-of-range');
    expect(code(() => gFunction(NaN))).toBe('out-of-range');
    expect(code(() => gFunction(1, 2 as never))).toBe('bad-argument');
    const time = Float64Array.from([0, 1, 2]);
    expect(code(() => gFunctionSeries(time, 1, 5, 1))).toBe('out-of-range');
    expect(code(() => gFunctionSeries(time, 1, 2, 0))).toBe('out-of-range');
  });
});
