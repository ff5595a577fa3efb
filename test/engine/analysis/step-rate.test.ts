import { describe, expect, it } from 'vitest';
import { rateSteps, stepRateAnalysis } from '../../../src-renderer/engine/analysis/step-rate';
import type { Cycle } from '../../../src-renderer/engine/result';
import { EngineError } from '../../../src-renderer/engine/errors';
import { seededRandom } from '../../../src-renderer/engine/synthetic/random';

/** Deterministic standard normal numbers from the engine's seeded generator (mulberry32). */
function noise(seed: number): () => number {
  const random = seededRandom(seed);
  return () => random.normal();
}

// 1 bbl = 0.158987294928 m3 exactly (NIST SP 811 App. B.8, 42 US gal of 231 in3).
const BBL_PER_MIN = 0.158987294928 / 60;

/**
 * Synthetic SRT whose truth is set here: equal 10-minute steps at 1 Hz with 10 s ramps
 * between them; the stabilised pressure follows P = 30 MPa + 2.0 MPa per bbl/min below the
 * break at 1.8 bbl/min and 0.4 MPa per bbl/min above it (continuous, so the intersection is
 * exactly the break: q* = 1.8 bbl/min, P* = 33.6 MPa). Within each step pressure approaches
 * its stabilised value with a 60 s time constant; gauge noise 5 kPa, rate noise 1 %.
 */
function syntheticSrt(ratesBblMin: number[], breakBblMin = 1.8, lowSlope = 2.0e6, highSlope = 0.4e6) {
  const rand = noise(3);
  const stable = (q: number) => 30e6 + lowSlope * Math.min(q, breakBblMin) + highSlope * Math.max(0, q - breakBblMin);
  const time: number[] = [];
  const pressure: number[] = [];
  const rate: number[] = [];
  let t = 0;
  let p = 30e6;
  let previous = 0;
  for (const q of ratesBblMin) {
    for (let s = 0; s < 610; s++, t++) {
      const current = s < 10 ? previous + ((q - previous) * (s + 1)) / 10 : q;
      p = stable(current) + (p - stable(current)) * Math.exp(-1 / 60);
      time.push(t);
      pressure.push(p + 5e3 * rand());
      rate.push(current * BBL_PER_MIN * (1 + 0.01 * rand()));
    }
    previous = q;
  }
  const cycle: Cycle = { index: 1, pumpStart: 0, pumpEnd: time.length - 1, shutInEnd: time.length - 1, meanRate: 0, volumePumped: 0, flowBack: false };
  return { time: Float64Array.from(time), pressure: Float64Array.from(pressure), rate: Float64Array.from(rate), cycle };
}

describe('step-rate analysis', () => {
  it('should find every step and its stabilised pressure', () => {
    const r = syntheticSrt([0.5, 1, 1.5, 2, 2.5, 3, 3.5]);
    const steps = rateSteps(r.time, r.pressure, r.rate, r.cycle);
    expect(steps).toHaveLength(7);
    // Step 2 (1 bbl/min): stabilised 30 + 2.0 x 1 = 32 MPa (truth above); after 600 s the
    // transient is e^-10 of the 1 MPa step, averaged over the last 60 s with 5 kPa noise.
    expect(steps[1].rate / BBL_PER_MIN).toBeCloseTo(1, 2);
    expect(Math.abs(steps[1].pressure - 32e6)).toBeLessThan(3e3);
    expect(steps[1].endIndex).toBeGreaterThan(steps[1].startIndex + 500);
  });

  it('should recover the known break as the intersection of the matrix and fracture lines', () => {
    const r = syntheticSrt([0.5, 1, 1.5, 2, 2.5, 3, 3.5]);
    const a = stepRateAnalysis(r.time, r.pressure, r.rate, r.cycle);
    expect(a.matrixLine?.n).toBe(3); // 0.5, 1, 1.5 below the break; 4 points above (EPA: >= 2)
    expect(a.fractureLine?.n).toBe(4);
    expect((a.matrixLine?.slope ?? 0) * BBL_PER_MIN).toBeCloseTo(2.0e6, -4);
    expect((a.fractureLine?.slope ?? 0) * BBL_PER_MIN).toBeCloseTo(0.4e6, -4);
    // Truth set above: q* = 1.8 bbl/min, P* = 33.6 MPa. Tolerance: 2 % in rate, 10 kPa.
    expect(Math.abs((a.extension?.rate ?? 0) / BBL_PER_MIN - 1.8)).toBeLessThan(0.036);
    expect(Math.abs((a.extension?.pressure ?? 0) - 33.6e6)).toBeLessThan(1e4);
    // Formula of METHODS.md: q* = (a2 - a1)/(b1 - b2), P* = a1 + b1 q*.
    const m = a.matrixLine!;
    const f = a.fractureLine!;
    expect(a.extension!.rate).toBeCloseTo((f.intercept - m.intercept) / (m.slope - f.slope), 12);
  });

  it('should need at least two points on each side of the break', () => {
    // Break between the 3rd and 4th of 5 steps; with 3 steps there is no analysis.
    const few = syntheticSrt([1, 2, 3]);
    const a = stepRateAnalysis(few.time, few.pressure, few.rate, few.cycle);
    expect(a.steps).toHaveLength(3);
    expect(a.matrixLine).toBeNull();
    expect(a.extension).toBeNull();
    // Five steps with a break after the fourth: EPA Region 8 (1999) wants two points above the
    // break, so the fit may not put a one-point fracture line there; it uses two.
    const late = syntheticSrt([0.5, 1, 1.5, 2, 2.5], 2.2);
    const b = stepRateAnalysis(late.time, late.pressure, late.rate, late.cycle);
    expect(b.fractureLine?.n).toBe(2);
    // Asking for three on each side of five steps leaves nothing to fit.
    const c = stepRateAnalysis(late.time, late.pressure, late.rate, late.cycle, { minimumPointsEachSide: 3 });
    expect(c.steps).toHaveLength(5);
    expect(c.matrixLine).toBeNull();
  });

  it('should give no extension when the record shows one straight line', () => {
    // Constructed: no break (same slope both sides), so the best two lines are near parallel
    // and their intersection is meaningless or outside the tested rates.
    const r = syntheticSrt([0.5, 1, 1.5, 2, 2.5, 3], 10);
    const a = stepRateAnalysis(r.time, r.pressure, r.rate, r.cycle, { minimumPointsEachSide: 3 });
    expect(a.matrixLine).not.toBeNull();
    if (a.extension) {
      // If the noise makes the lines cross inside the range, the pressures must still lie on the line.
      expect(Math.abs(a.extension.pressure - (30e6 + 2e6 * (a.extension.rate / BBL_PER_MIN)))).toBeLessThan(2e4);
    }
  });

  it('should give no extension when the upper line is steeper (no fracturing)', () => {
    const r = syntheticSrt([0.5, 1, 1.5, 2, 2.5, 3], 1.8, 0.4e6, 2.0e6);
    const a = stepRateAnalysis(r.time, r.pressure, r.rate, r.cycle);
    expect(a.extension).toBeNull();
  });

  it('should reject broken input with typed errors', () => {
    const r = syntheticSrt([1, 2]);
    expect(() => stepRateAnalysis(r.time, r.pressure, r.rate.subarray(1), r.cycle)).toThrow(EngineError);
    expect(() => stepRateAnalysis(r.time, r.pressure, r.rate, { ...r.cycle, pumpEnd: 10_000 })).toThrow(/do not fit/);
  });
});
