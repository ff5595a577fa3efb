import { describe, expect, it } from 'vitest';
import { fitLine } from '../../../src-renderer/engine/analysis/least-squares';
import { gFunction } from '../../../src-renderer/engine/analysis/gfunction';
import { EngineError } from '../../../src-renderer/engine/errors';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import { seededRandom } from '../../../src-renderer/engine/synthetic/random';

const XLOT = { type: 'xlot' as const, cycles: 3, depthTvd: 2000, shmin: 34e6, porePressure: 20e6, seed: 3 };

function indexAt(time: Float64Array, t: number): number {
  let best = 0;
  for (let i = 0; i < time.length; i++) if (Math.abs(time[i] - t) < Math.abs(time[best] - t)) best = i;
  return best;
}

describe('seeded random source', () => {
  it('should repeat its sequence for a seed and give normal deviates of unit variance', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    for (let i = 0; i < 5; i++) expect(a.uniform()).toBe(b.uniform());
    const r = seededRandom(9);
    let sum = 0;
    let ss = 0;
    const n = 20000;
    for (let i = 0; i < n; i++) { const x = r.normal(); sum += x; ss += x * x; }
    // Standard normal: mean 0, variance 1; sampling error of the mean ~ 1/sqrt(n) = 0.007.
    expect(Math.abs(sum / n)).toBeLessThan(0.03);
    expect(ss / n).toBeCloseTo(1, 1);
  });
});

describe('synthetic test generator', () => {
  const clean = generateSyntheticTest(XLOT);

  it('should be deterministic by seed', () => {
    const again = generateSyntheticTest(XLOT);
    expect(Array.from(again.record.pressure)).toEqual(Array.from(clean.record.pressure));
    const other = generateSyntheticTest({ ...XLOT, seed: 4 });
    expect(Array.from(other.record.pressure)).not.toEqual(Array.from(clean.record.pressure));
  });

  it('should load with the slope 1/(c V) within the noise', () => {
    // METHODS.md "System stiffness": dP/dV = 1/(c V); V 60 m3, c 6e-10 /Pa -> 27.78 MPa/m3.
    const { record, truth } = clean;
    expect(truth.expectedSlope).toBeCloseTo(1 / (60 * 6e-10), 0);
    const c = truth.cycles[0];
    const a = indexAt(record.time, c.pumpStartTime + 60);
    const b = indexAt(record.time, c.picks.leakOff!.time - 20);
    const fit = fitLine(record.volume, record.pressure, a, b);
    expect(fit.slope / truth.expectedSlope).toBeCloseTo(1, 2);
    expect(fit.r2).toBeGreaterThan(0.999);
  });

  it('should differ between surface and downhole gauges by the mud column rho g TVD', () => {
    // rho g TVD = 1200 x 9.80665 (standard gravity, NIST SP 811) x 2000 = 23.53596 MPa.
    const surface = generateSyntheticTest({ ...XLOT, gaugePosition: 'surface' });
    const downhole = generateSyntheticTest({ ...XLOT, gaugePosition: 'downhole' });
    expect(surface.truth.hydrostatic).toBeCloseTo(23.53596e6, 0);
    for (const i of [0, 500, 1500, 3000]) {
      expect(downhole.record.pressure[i] - surface.record.pressure[i]).toBeCloseTo(23.53596e6, 0);
    }
    expect(surface.record.metadata.gaugePosition).toBe('surface');
    expect(surface.record.metadata.mudDensity).toBe(1200);
  });

  it('should place every set event where the truth says', () => {
    const { record, truth } = clean;
    const downhole = (t: number) => record.pressure[indexAt(record.time, t)] + truth.hydrostatic;
    const c1 = truth.cycles[0].picks;
    // Tolerance: 4 noise SD (3 kPa) plus half a sample of loading rise (about 37 kPa/s x 0.5 s).
    expect(Math.abs(downhole(c1.leakOff!.time) - c1.leakOff!.pressure)).toBeLessThan(35e3);
    expect(Math.abs(downhole(c1.isip!.time) - c1.isip!.pressure)).toBeLessThan(15e3);
    expect(Math.abs(downhole(c1.closure!.time) - 34e6)).toBeLessThan(15e3);
    let peak = -Infinity;
    for (const p of record.pressure) peak = Math.max(peak, p + truth.hydrostatic);
    expect(Math.abs(peak - c1.breakdown!.pressure)).toBeLessThan(15e3);
    const c2 = truth.cycles[1].picks;
    expect(Math.abs(downhole(c2.reopening!.time) - c2.reopening!.pressure)).toBeLessThan(35e3);
    // SHmax and T0 by the Bredehoeft et al. (1976) relations on the set values.
    expect(truth.shmax).toBeCloseTo(3 * 34e6 - 34.8e6 - 20e6, 0);
    expect(truth.tensileStrength).toBeCloseTo(38.8e6 - 34.8e6, 0);
  });

  it('should decline linearly in the G-function before closure and flatten after it', () => {
    // Nolte (1979) G-function (analysis/gfunction.ts); normal leak-off: P linear in G until closure.
    const { record, truth } = clean;
    const c = truth.cycles[1];
    const tp = c.pumpEndTime - c.pumpStartTime;
    const a = indexAt(record.time, c.picks.isip!.time + 5);
    const b = indexAt(record.time, c.picks.closure!.time - 2);
    const g = new Float64Array(record.time.length);
    for (let i = a; i <= indexAt(record.time, c.shutInEndTime - 1); i++) g[i] = gFunction((record.time[i] - c.pumpEndTime) / tp);
    const before = fitLine(g, record.pressure, a, b);
    expect(before.r2).toBeGreaterThan(0.995);
    expect(before.slope).toBeCloseTo(-(34.5e6 - 34e6) / gFunction(0.5), -4);
    const after = fitLine(g, record.pressure, indexAt(record.time, c.picks.closure!.time + 60), indexAt(record.time, c.picks.closure!.time + 200));
    expect(Math.abs(after.slope)).toBeLessThan(0.5 * Math.abs(before.slope));
  });

  it('should put the step-rate extension at the intersection of the two stabilised lines', () => {
    // Two-line step-rate model, METHODS.md (US EPA Region 8, 1999): q* = (a2 - a1)/(b1 - b2).
    const { record, truth } = generateSyntheticTest({ type: 'srt', depthTvd: 1650, shmin: 28.2e6, mudDensity: 1000, noiseSd: 1e3, seed: 2 });
    const ext = truth.cycles[0].picks.extension!;
    const ends: { q: number; p: number }[] = [];
    for (let k = 1; k <= 8; k++) {
      const i = indexAt(record.time, truth.cycles[0].pumpStartTime + k * 240 - 1);
      ends.push({ q: record.rate[i], p: record.pressure[i] + truth.hydrostatic });
    }
    const matrix = fitLine(ends.slice(0, 4).map((e) => e.q), ends.slice(0, 4).map((e) => e.p));
    const fracture = fitLine(ends.slice(4).map((e) => e.q), ends.slice(4).map((e) => e.p));
    const q = (fracture.intercept - matrix.intercept) / (matrix.slope - fracture.slope);
    const p = matrix.intercept + matrix.slope * q;
    expect(q / ext.rate!).toBeCloseTo(1, 1);
    expect(p / ext.pressure).toBeCloseTo(1, 2);
  });

  it('should apply the flaws it is asked for', () => {
    const leak = generateSyntheticTest({ ...XLOT, cycles: 2, flaws: { leakingShutIn: true } });
    const c = leak.truth.cycles[1];
    const tail = fitLine(leak.record.time, leak.record.pressure, indexAt(leak.record.time, c.shutInEndTime - 120), indexAt(leak.record.time, c.shutInEndTime - 1));
    expect(-tail.slope).toBeCloseTo(40e3 / 60, -2);

    const clipped = generateSyntheticTest({ ...XLOT, cycles: 2, flaws: { clippedGauge: true } });
    let max = -Infinity;
    for (const p of clipped.record.pressure) max = Math.max(max, p);
    expect(max).toBe(clipped.truth.gaugeRange);
    expect(clipped.truth.gaugeRange).toBeLessThan(38.8e6 - clipped.truth.hydrostatic);

    const coarse = generateSyntheticTest({ type: 'lot', depthTvd: 1500, shmin: 25.75e6, gaugeResolution: 6894.757, sampleInterval: 5 });
    for (const p of coarse.record.pressure) expect(Math.abs(p / 6894.757 - Math.round(p / 6894.757))).toBeLessThan(1e-6);
    expect(coarse.record.time[1] - coarse.record.time[0]).toBeCloseTo(5, 9);
    expect(coarse.record.metadata.gaugeResolution).toBe(6894.757);
  });

  it('should reject impossible specifications', () => {
    expect(() => generateSyntheticTest({ ...XLOT, cycles: 5 })).toThrow(EngineError);
    expect(() => generateSyntheticTest({ type: 'lot', depthTvd: 2000, shmin: 20e6 })).toThrow(/mud column/);
    expect(() => generateSyntheticTest({ type: 'lot', depthTvd: -1, shmin: 20e6 })).toThrow(EngineError);
  });
});
