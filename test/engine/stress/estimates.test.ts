import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import type { TestMetadata } from '../../../src-renderer/engine/record';
import type { AnalysisContext, CycleAnalysis, Pick, PickKind } from '../../../src-renderer/engine/result';
import {
  DEFAULT_OVERBURDEN_GRADIENT, DEFAULT_PORE_PRESSURE_GRADIENT, estimateStresses, shminFromPicks,
} from '../../../src-renderer/engine/stress/estimates';
import { frictionalLimitFactor } from '../../../src-renderer/engine/stress/frictional';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import { contextFromTruth } from '../synthetic/context-from-truth';

function cycle(index: number, picks: Partial<Record<PickKind, number>>, fit = { slope: 30e6, residualSd: 5e3 }): CycleAnalysis {
  const full: Partial<Record<PickKind, Pick>> = {};
  for (const [kind, pressure] of Object.entries(picks) as [PickKind, number][]) {
    full[kind] = { kind, pressure, time: index * 100, method: 'hand', sampleIndex: index * 100 };
  }
  return {
    cycle: { index, pumpStart: 0, pumpEnd: 1, shutInEnd: 2, meanRate: 1e-3, volumePumped: 0.5, flowBack: false },
    loadingFit: { slope: fit.slope, intercept: 0, r2: 0.999, residualSd: fit.residualSd, n: 100, start: 0, end: 99 },
    expectedSlope: null,
    picks: full,
    closureCandidates: [],
    closureSpread: null,
  };
}

function context(cycles: CycleAnalysis[], metadata: TestMetadata = { depthTvd: 2000 as never }): AnalysisContext {
  const empty = new Float64Array(0);
  return { type: 'xlot', typeInferred: false, time: empty, rate: empty, volume: empty, gaugePressure: empty, downholePressure: empty, metadata, cycles };
}

describe('Shmin hierarchy', () => {
  // METHODS.md "Leak-off test events and which one estimates Shmin" (White et al. 2002;
  // Zoback et al. 2003): later-cycle closure > first closure > ISIP > propagation >
  // extension > leak-off > FIT maximum.
  it('should prefer the closure of the latest later cycle', () => {
    const s = shminFromPicks([cycle(1, { closure: 34.5e6, isip: 35e6 }), cycle(2, { closure: 34.1e6 }), cycle(3, { closure: 34.0e6 })]);
    expect(s).toEqual({ value: 34.0e6, kind: 'estimate', from: 'closure', cycle: 3 });
  });

  it('should fall back to the first-cycle closure, then to the lowest ISIP as an upper bound', () => {
    expect(shminFromPicks([cycle(1, { closure: 34.5e6, isip: 35e6, leakOff: 36e6 })])).toEqual({ value: 34.5e6, kind: 'estimate', from: 'closure', cycle: 1 });
    expect(shminFromPicks([cycle(1, { isip: 35e6 }), cycle(2, { isip: 34.6e6 })])).toEqual({ value: 34.6e6, kind: 'upper-bound', from: 'isip', cycle: 2 });
  });

  it('should use propagation, extension, leak-off and FIT maximum in that order', () => {
    expect(shminFromPicks([cycle(1, { propagation: 35.2e6, leakOff: 35.5e6 })])?.from).toBe('propagation');
    expect(shminFromPicks([cycle(1, { propagation: 35.2e6, leakOff: 35.5e6 })])?.kind).toBe('upper-bound');
    expect(shminFromPicks([cycle(1, { extension: 34.3e6, leakOff: 35e6 })])).toMatchObject({ from: 'extension', kind: 'estimate' });
    expect(shminFromPicks([cycle(1, { leakOff: 35e6, fitMaximum: 33e6 })])).toMatchObject({ from: 'leakOff', kind: 'estimate' });
    expect(shminFromPicks([cycle(1, { fitMaximum: 33e6 })])).toMatchObject({ from: 'fitMaximum', kind: 'lower-bound', value: 33e6 });
    expect(shminFromPicks([cycle(1, { breakdown: 40e6 })])).toBeNull();
  });
});

describe('stress estimates', () => {
  it('should state the default gradients when Pp and Sv are not given', () => {
    // Common practice (METHODS.md): hydrostatic 10.0 kPa/m; overburden 1 psi/ft = 6894.757 Pa / 0.3048 m
    // = 22620.6 Pa/m (NIST SP 811 factors).
    expect(DEFAULT_OVERBURDEN_GRADIENT).toBeCloseTo(22620.59, 1);
    const s = estimateStresses(context([cycle(1, { closure: 34e6 })]));
    expect(s.pp).toEqual({ value: 2000 * DEFAULT_PORE_PRESSURE_GRADIENT, source: 'default-gradient', gradient: 10e3 });
    expect(s.sv.source).toBe('default-gradient');
    expect(s.sv.value / 1e6).toBeCloseTo(45.241, 3);
  });

  it('should use given Pp and Sv and derive SHmax, T0 and the detectability from a valid second cycle', () => {
    // Bredehoeft et al. (1976): SHmax = 3 x 34 - 34.8 - 20 = 47.2 MPa; T0 = 38.8 - 34.8 = 4 MPa.
    const ctx = context(
      [cycle(1, { leakOff: 35.5e6, breakdown: 38.8e6, isip: 34.5e6, closure: 34e6 }), cycle(2, { reopening: 34.8e6, isip: 34.5e6, closure: 34e6 })],
      { depthTvd: 2000 as never, porePressure: 20e6 as never, verticalStress: 45.2e6 as never },
    );
    const s = estimateStresses(ctx);
    expect(s.pp).toEqual({ value: 20e6, source: 'given' });
    expect(s.shmax?.value).toBeCloseTo(47.2e6, 0);
    expect(s.tensileStrength).toBeCloseTo(4e6, 0);
    expect(s.shmax?.low).toBe(34e6);
    expect(s.shmax?.high).toBeCloseTo(20e6 + frictionalLimitFactor(0.6) * 14e6, 0);
    expect(s.shmax?.detectability?.kirschApplies).toBe(false);
    expect(s.shmax?.cautions.some((c) => c.includes('Ito et al. 1999'))).toBe(true);
    expect(s.shmax?.cautions.some((c) => c.includes('could not see a fracture smaller than'))).toBe(true);
    expect(s.shmax?.method).toContain('reopening-relation');
  });

  it('should refuse SHmax and T0 from a reopening above breakdown', () => {
    const ctx = context([cycle(1, { breakdown: 38.8e6, closure: 34e6 }), cycle(2, { reopening: 39.3e6, closure: 34e6 })], { depthTvd: 2000 as never, porePressure: 20e6 as never });
    const s = estimateStresses(ctx);
    expect(s.shmax?.value).toBeNull();
    expect(s.tensileStrength).toBeNull();
    expect(s.shmax?.cautions.some((c) => c.includes('above the first-cycle breakdown'))).toBe(true);
  });

  it('should give frictional bounds only, with a wider friction coefficient when asked', () => {
    const s = estimateStresses(context([cycle(1, { closure: 34e6 })], { depthTvd: 2000 as never, porePressure: 20e6 as never }), { frictionCoefficient: 1.0 });
    expect(s.frictionCoefficient).toBe(1.0);
    expect(s.shmax?.value).toBeNull();
    // mu 1.0: q = 5.828 (METHODS.md) -> high = 20 + 5.828 x 14 = 101.6 MPa.
    expect(s.shmax!.high / 1e6).toBeCloseTo(101.6, 1);
  });

  it('should return null Shmin and SHmax when no pick estimates Shmin', () => {
    const s = estimateStresses(context([cycle(1, {})]));
    expect(s.shmin).toBeNull();
    expect(s.shmax).toBeNull();
  });

  it('should throw bad-metadata without TVD, Pp and Sv', () => {
    expect(() => estimateStresses(context([cycle(1, { closure: 34e6 })], {}))).toThrow(EngineError);
    try { estimateStresses(context([], {})); } catch (e) { expect((e as EngineError).code).toBe('bad-metadata'); }
  });

  it('should recover the set Shmin, SHmax and T0 of a synthetic XLOT', () => {
    // Truth set by the generator: SHmax = 3 Shmin - Pr - Pp with the set reopening (Bredehoeft et al. 1976).
    const { record, truth } = generateSyntheticTest({ type: 'xlot', cycles: 3, depthTvd: 2000, shmin: 34e6, porePressure: 20e6, seed: 7 });
    const s = estimateStresses(contextFromTruth(record, truth));
    expect(s.shmin?.value).toBe(truth.shmin);
    expect(s.shmax?.value).toBeCloseTo(truth.shmax!, 0);
    expect(s.tensileStrength).toBeCloseTo(truth.tensileStrength!, 0);
    // The reopening cycle's own loading fit gives a compliance near 1/(c V) = 36 L/MPa.
    expect(s.shmax!.detectability!.compliance).toBeCloseTo(1 / truth.expectedSlope, 9);
  });
});
