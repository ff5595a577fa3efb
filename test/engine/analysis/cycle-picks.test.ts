import { describe, expect, it } from 'vitest';
import { assembleCyclePicks, primaryClosure } from '../../../src-renderer/engine/analysis/cycle-picks';
import { analyseLoading } from '../../../src-renderer/engine/analysis/loading-picks';
import { segmentCycles } from '../../../src-renderer/engine/analysis/segmentation';
import type { ClosureCandidate } from '../../../src-renderer/engine/result';
import { idlePhase, loadingPhase, recordFromPhases, shutInPhase, type LoadingShape } from './analytic-records';

// Which picks apply to which test: METHODS.md "Leak-off test events" (White et al. 2002;
// Zoback et al. 2003): a FIT gives its maximum only; reopening exists in later cycles only.
const Q = 0.5 * 0.158987294928 / 60; // 0.5 bbl/min in m3/s (NIST SP 811 barrel)
const lot: LoadingShape = { slope: 30e6 * Q, leakOffTime: 250, peakTime: 330, pumpDuration: 420, propagation: 28e6, rate: Q };
const reload: LoadingShape = { slope: 30e6 * Q, leakOffTime: 120, peakTime: 200, pumpDuration: 300, rate: Q };

function twoCycles() {
  const r = recordFromPhases(
    [idlePhase(30), loadingPhase(lot), shutInPhase(900, 0.4e6, 22e6, 200), loadingPhase(reload), shutInPhase(900, 0.3e6, 22e6, 200)],
    { p0: 20e6, noise: 2e3 },
  );
  const cycles = segmentCycles(r);
  const features = cycles.map((c) => analyseLoading(r.time, r.pressure, r.volume, c));
  return { r, cycles, features };
}

describe('assembleCyclePicks', () => {
  it('should give leak-off and breakdown in cycle 1 and reopening in cycle 2 of an XLOT', () => {
    const { r, cycles, features } = twoCycles();
    const out = assembleCyclePicks({ type: 'xlot', time: r.time, pressure: r.pressure, rate: r.rate, cycles, features, expectedSlope: null });
    expect(Object.keys(out[0].picks)).toEqual(expect.arrayContaining(['leakOff', 'breakdown', 'propagation']));
    expect(out[0].picks.reopening).toBeUndefined();
    expect(out[1].picks.reopening).toBeDefined();
    expect(out[1].picks.leakOff).toBeUndefined();
    expect(out[1].picks.breakdown).toBeUndefined();
    expect(out[1].picks.reopening!.pressure).toBeLessThan(out[0].picks.breakdown!.pressure);
    for (const c of out) for (const p of Object.values(c.picks)) expect(p!.method).toMatch(/\w/);
  });

  it('should give only the maximum of a FIT', () => {
    const { r, cycles, features } = twoCycles();
    const out = assembleCyclePicks({ type: 'fit', time: r.time, pressure: r.pressure, rate: r.rate, cycles: cycles.slice(0, 1), features: features.slice(0, 1), expectedSlope: 1e7 });
    expect(out[0].picks.fitMaximum!.sampleIndex).toBe(features[0].peakIndex);
    expect(out[0].picks.isip).toBeUndefined();
    expect(out[0].picks.closure).toBeUndefined();
    expect(out[0].expectedSlope).toBe(1e7);
  });
});

describe('primaryClosure', () => {
  it('should prefer the G dP/dG tangent pick, then the order of the shut-in methods', () => {
    const c = (method: string, pressure: number): ClosureCandidate => ({ method, pressure, time: 0, sampleIndex: 0 });
    expect(primaryClosure([c('sqrt-time', 2), c('g-dpdg-tangent', 1)])!.method).toBe('g-dpdg-tangent');
    expect(primaryClosure([c('bilinear-dpdt', 3), c('compliance', 2)])!.method).toBe('compliance');
    expect(primaryClosure([])).toBeNull();
  });
});
