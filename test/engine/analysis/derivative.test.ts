import { describe, expect, it } from 'vitest';
import { binAverages, binnedSlopes, bourdetDerivative, logLogDiagnostic, smoothedDerivative } from '../../../src-renderer/engine/analysis/derivative';
import { fitLine } from '../../../src-renderer/engine/analysis/least-squares';
import { EngineError } from '../../../src-renderer/engine/errors';
import { seededRandom } from '../../../src-renderer/engine/synthetic/random';

/** Deterministic standard normal numbers from the engine's seeded generator (mulberry32). */
function noise(seed: number): () => number {
  const random = seededRandom(seed);
  return () => random.normal();
}

describe('derivative', () => {
  it('should differentiate a quadratic exactly inside the record', () => {
    // Analytic: y = 3x^2 + 2x + 5e7, dy/dx = 6x + 2. A least-squares slope over a symmetric
    // window of equally spaced points is exact for a quadratic (symmetry of the normal equations).
    const x = Float64Array.from({ length: 2001 }, (_, i) => i * 0.1);
    const y = x.map((v) => 3 * v * v + 2 * v + 5e7);
    const d = smoothedDerivative(x, y, 0, x.length - 1, 4.0);
    for (let i = 25; i < x.length - 25; i += 97) expect(d[i]).toBeCloseTo(6 * x[i] + 2, 5);
  });

  it('should follow the derivative of a noisy record within its expected scatter', () => {
    // Analytic: y = 1000 sin(x / 10) + noise (sd 1); dy/dx = 100 cos(x/10). Window 2 with
    // 201 points: slope sd = 1 / sqrt(sum (x - mean)^2) = 1 / sqrt(201 * 0.33) = 0.12;
    // curvature bias over the window is below 100 * (1/10)^2 * 1^2 / 6 = 0.17.
    const rand = noise(7);
    const x = Float64Array.from({ length: 20001 }, (_, i) => i * 0.01);
    const y = x.map((v) => 1000 * Math.sin(v / 10) + rand());
    const d = smoothedDerivative(x, y, 0, x.length - 1, 2);
    let worst = 0;
    for (let i = 200; i < x.length - 200; i++) worst = Math.max(worst, Math.abs(d[i] - 100 * Math.cos(x[i] / 10)));
    expect(worst).toBeLessThan(0.8);
  });

  it('should return NaN where a window holds too few points, and honour weights', () => {
    const x = [0, 1, 2, 10, 11, 12];
    const y = [0, 2, 4, 20, 22, 24];
    const d = smoothedDerivative(x, y, 0, 5, 2.5);
    expect(d[1]).toBeCloseTo(2, 12);
    expect(Number.isNaN(d[0])).toBe(true); // window [-1.25, 1.25] holds 2 points
    const weighted = smoothedDerivative(x, y, 0, 5, 30, [1, 1, 1, 5, 5, 5]);
    expect(weighted[3]).toBeCloseTo(2, 12);
  });

  it('should give a power law its exponent as the log-log slope of the Bourdet derivative', () => {
    // Analytic: p = a t^n on log-uniform times (spacing h); the L-spacing partners sit at
    // +-L' (L' = smallest multiple of h >= L), so the Bourdet derivative is
    // n p sinh(nL')/(nL') exactly (Bourdet et al. 1989 formula applied to a t^n).
    for (const n of [0.5, 1, -0.5, 0.25]) {
      const h = Math.LN10 / 50;
      const dt = Float64Array.from({ length: 251 }, (_, i) => Math.exp(-2 + i * h));
      const p = dt.map((t) => 3.7e5 * t ** n);
      const d = bourdetDerivative(dt, p, 0.2);
      const lPrime = Math.ceil(0.2 / h - 1e-9) * h;
      const factor = Math.sinh(n * lPrime) / (n * lPrime);
      for (let i = 5; i < 246; i++) expect(d[i] / (n * p[i] * factor)).toBeCloseTo(1, 10);
      expect(Number.isNaN(d[0]) && Number.isNaN(d[250])).toBe(true);
      // Log-log slope of the derivative: exactly n.
      const valid = [...d.keys()].filter((i) => Number.isFinite(d[i]));
      const slope = fitLine(valid.map((i) => Math.log(dt[i])), valid.map((i) => Math.log(Math.abs(d[i])))).slope;
      expect(slope).toBeCloseTo(n, 10);
    }
  });

  it('should recover a half slope and a radial-flow plateau through the log-log diagnostic with noise', () => {
    // Constructed shut-in: P = 4e7 - 2e5 sqrt(dt) (slope +1/2 on log-log, derivative = dP/2),
    // 1 Hz for 3 h, noise sd 300 Pa. Then a pure log decline P = 4e7 - 5e4 ln(1 + dt): the
    // derivative tends to the constant 5e4 Pa (radial-flow plateau, Bourdet et al. 1989).
    const rand = noise(11);
    const N = 10800;
    const time = Float64Array.from({ length: N + 101 }, (_, i) => i);
    const shutIn = 100;
    const sqrtCase = time.map((t) => (t <= shutIn ? 4e7 : 4e7 - 2e5 * Math.sqrt(t - shutIn) + 300 * rand()));
    const diag = logLogDiagnostic(time, sqrtCase, shutIn, time.length - 1, { lSpacing: 0.3, pointsPerDecade: 20 });
    expect(diag.elapsed.length).toBeGreaterThan(50);
    const late = [...diag.elapsed.keys()].filter((i) => diag.elapsed[i] > 30 && Number.isFinite(diag.derivative[i]));
    const slope = fitLine(late.map((i) => Math.log(diag.elapsed[i])), late.map((i) => Math.log(diag.derivative[i]))).slope;
    expect(slope).toBeCloseTo(0.5, 1);
    for (const i of late) expect(diag.derivative[i] / (0.5 * diag.pressureChange[i])).toBeCloseTo(1, 1);
    expect(Math.abs(time[diag.sampleIndex[10]] - shutIn - diag.elapsed[10])).toBeLessThan(1);

    // Measured from a stated reference (e.g. the ISIP) instead of the shut-in sample.
    const shifted = logLogDiagnostic(time, sqrtCase, shutIn, time.length - 1, { lSpacing: 0.3, referencePressure: 4e7 + 1e5 });
    expect(shifted.pressureChange[5] - diag.pressureChange[5]).toBeCloseTo(1e5, 6);

    const logCase = time.map((t) => (t <= shutIn ? 4e7 : 4e7 - 5e4 * Math.log1p(t - shutIn) + 300 * rand()));
    const radial = logLogDiagnostic(time, logCase, shutIn, time.length - 1, { lSpacing: 0.3 });
    const plateau = [...radial.elapsed.keys()].filter((i) => radial.elapsed[i] > 1000 && Number.isFinite(radial.derivative[i]));
    for (const i of plateau) expect(radial.derivative[i] / 5e4).toBeCloseTo(1, 1);
  });

  it('should average bins evenly spaced in x and differentiate them without bias', () => {
    // Constructed: y = 7 - 3x on 1000 samples of x = i/999; 10 bins of
    // 100 samples each: bin means lie on the same line, so every slope is exactly -3.
    const x = Float64Array.from({ length: 1000 }, (_, i) => i / 999);
    const y = x.map((v) => 7 - 3 * v);
    const bins = binAverages(x, y, 0, 999, 10, x.map((v) => 100 * v));
    expect(bins.x.length).toBe(10);
    expect([...bins.count]).toEqual(new Array(10).fill(100));
    expect(bins.first[3]).toBe(300);
    expect(bins.companion[3]).toBeCloseTo(100 * bins.x[3], 10);
    for (let k = 0; k < 10; k++) expect(bins.y[k]).toBeCloseTo(7 - 3 * bins.x[k], 12);
    // Positions in ln x, regression on x itself: unbiased however wide the window (y linear in x).
    const logBins = binAverages(x.map((v) => Math.log(v + 1e-3)), y, 0, 999, 50);
    const meanX = logBins.first.map((f, k) => {
      let sum = 0;
      for (let i = f; i < f + logBins.count[k]; i++) sum += x[i];
      return sum / logBins.count[k];
    });
    const slopes = binnedSlopes(logBins, Float64Array.from(meanX), 0.5, 200);
    for (const v of slopes.slope) if (Number.isFinite(v)) expect(v).toBeCloseTo(-3, 9);
    expect(slopes.spread.every((v) => v >= 0)).toBe(true);
    // Fewer samples than bins: one bin per sample.
    expect(binAverages([0, 1, 2], [5, 6, 7], 0, 2, 10).x.length).toBe(3);
  });

  it('should reject unusable input with typed errors', () => {
    expect(() => bourdetDerivative([0, 1], [1, 2], 0.1)).toThrow(EngineError);
    expect(() => bourdetDerivative([1, 1], [1, 2], 0.1)).toThrow(/increase/);
    expect(() => smoothedDerivative([0, 1, 2], [0, 1, 2], 0, 2, 0)).toThrow(EngineError);
    expect(() => smoothedDerivative([0, 2, 1], [0, 1, 2], 0, 2, 1)).toThrow(/decreases/);
    expect(() => logLogDiagnostic([0, 1, 2], [0, 1, 2], 0, 5)).toThrow(EngineError);
  });
});
