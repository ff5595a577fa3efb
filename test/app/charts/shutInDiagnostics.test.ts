import { describe, expect, it } from 'vitest';
import { shutInDiagnostics } from '../../../src-renderer/app/charts/shutInDiagnostics';
import { gFunction } from '../../../src-renderer/engine/analysis/gfunction';
import type { CycleAnalysis } from '../../../src-renderer/engine/result';

/** A cycle pumped 0..tp s and shut in until the end, with the pressure given by a function of time since shut-in. */
function shutInCase(tp: number, duration: number, pressureAt: (dt: number, tp: number) => number) {
  const n = tp + duration + 1;
  const time = Float64Array.from({ length: n }, (_, i) => i);
  const p = Float64Array.from(time, (t) => (t <= tp ? 20e6 + (t / tp) * 10e6 : pressureAt(t - tp, tp)));
  const cycle: CycleAnalysis = {
    cycle: { index: 1, pumpStart: 0, pumpEnd: tp, shutInEnd: n - 1, meanRate: 1e-3, volumePumped: 0.1, flowBack: false },
    loadingFit: null, expectedSlope: null, picks: {}, closureCandidates: [], closureSpread: null,
  };
  return { time, p, cycle };
}

describe('shutInDiagnostics', () => {
  it('should compute G with Nolte\'s definition (check value G(1) = 1.4064 for alpha = 1)', () => {
    // METHODS.md, Nolte (1979) SPE 8341: alpha = 1, G(dtD = 1) = 1.4064.
    const { time, p, cycle } = shutInCase(600, 1200, (dt) => 30e6 - 1e3 * dt);
    const s = shutInDiagnostics(time, p, cycle)!;
    expect(s.g[600]).toBeCloseTo(1.4064, 4);
    expect(s.g[0]).toBe(0);
  });

  it('should give G dP/dG as a straight line through the origin when pressure falls linearly in G', () => {
    // Barree, Barree & Craig (2009), SPE Prod. & Oper. 24(3): under normal leak-off P falls linearly
    // in G, so G dP/dG = m G, a line through the origin. Here m = 2 MPa per unit G.
    const m = 2e6;
    const { time, p, cycle } = shutInCase(600, 1800, (dt, tp) => 30e6 - m * gFunction(dt / tp));
    const s = shutInDiagnostics(time, p, cycle)!;
    for (const i of [300, 900, 1500]) expect(s.gdpdg[i] / s.g[i]).toBeCloseTo(m, -3);
  });

  it('should show a log-log derivative at half the pressure change for a square-root-of-time decline', () => {
    // Bourdet, Ayoub & Pirard (1989), SPE Form. Eval. 4(2): for dP = A dt^n the derivative
    // dt d(dP)/d(dt) = n dP; with n = 1/2 the ratio is 0.5 (the +1/2 slope before closure, METHODS.md).
    const { time, p, cycle } = shutInCase(600, 3600, (dt) => 30e6 - 5e4 * Math.sqrt(dt));
    const s = shutInDiagnostics(time, p, cycle)!;
    const ratios: number[] = [];
    for (let i = 0; i < s.logElapsed.length; i++) {
      if (s.logElapsed[i] > 20 && Number.isFinite(s.logDerivative[i])) ratios.push(s.logDerivative[i] / s.deltaP[i]);
    }
    expect(ratios.length).toBeGreaterThan(5);
    for (const r of ratios) expect(r).toBeCloseTo(0.5, 1);
  });

  it('should return null for a cycle without a shut-in', () => {
    const { time, p, cycle } = shutInCase(600, 2, (dt) => 30e6 - dt);
    expect(shutInDiagnostics(time, p, cycle)).toBeNull();
  });
});
