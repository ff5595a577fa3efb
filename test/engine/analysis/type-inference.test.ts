import { describe, expect, it } from 'vitest';
import { analyseLoading } from '../../../src-renderer/engine/analysis/loading-picks';
import { segmentCycles } from '../../../src-renderer/engine/analysis/segmentation';
import { inferTestType, rateLevels } from '../../../src-renderer/engine/analysis/type-inference';
import type { TestRecord } from '../../../src-renderer/engine/record';
import { idlePhase, loadingPhase, recordFromPhases, shutInPhase, type LoadingShape, type Phase } from './analytic-records';

// Test shapes (common practice, METHODS.md; White et al. 2002 for LOT/XLOT/FIT, US EPA
// Region 8 step-rate procedure 1999 for SRT): the records are built here with set shapes.
const Q = 0.5 * 0.158987294928 / 60; // 0.5 bbl/min, m3/s (NIST SP 811 barrel)
const lot: LoadingShape = { slope: 30e6 * Q, leakOffTime: 250, peakTime: 330, pumpDuration: 420, propagation: 28e6, rate: Q };
const limitTest: LoadingShape = { ...lot, leakOffTime: 900, peakTime: 1000, pumpDuration: 240, propagation: undefined };
const reload: LoadingShape = { slope: 30e6 * Q, leakOffTime: 120, peakTime: 200, pumpDuration: 300, rate: Q };

function infer(r: TestRecord) {
  const cycles = segmentCycles(r);
  const features = cycles.map((c) => analyseLoading(r.time, r.pressure, r.volume, c));
  return inferTestType({
    cycles,
    departed: features.map((f) => f.departureIndex !== null),
    brokeDown: features.map((f) => f.breakdownIndex !== null),
    time: r.time,
    rate: r.rate,
  });
}

describe('inferTestType', () => {
  it('should call one cycle stopped on the loading line a FIT', () => {
    const r = recordFromPhases([idlePhase(30), loadingPhase(limitTest), shutInPhase(600, 0.1e6, 21e6, 300)], { p0: 20e6, noise: 2e3 });
    const t = infer(r);
    expect(t.type).toBe('fit');
    expect(t.reasons[0]).toMatch(/before any departure/);
  });

  it('should call one cycle with a departure and breakdown a LOT', () => {
    const r = recordFromPhases([idlePhase(30), loadingPhase(lot), shutInPhase(900, 0.4e6, 22e6, 200)], { p0: 20e6, noise: 2e3 });
    expect(infer(r).type).toBe('lot');
  });

  it('should call two cycles after a breakdown an XLOT', () => {
    const r = recordFromPhases(
      [idlePhase(30), loadingPhase(lot), shutInPhase(900, 0.4e6, 22e6, 200), loadingPhase(reload), shutInPhase(900, 0.3e6, 22e6, 200)],
      { p0: 20e6, noise: 2e3 },
    );
    const t = infer(r);
    expect(t.type).toBe('xlot');
    expect(t.reasons[0]).toMatch(/2 pumping cycles/);
  });

  it('should call several rising rate levels in one pumping period an SRT', () => {
    const steps: Phase[] = [0.5, 1, 1.5, 2, 2.5, 3].map((f) => ({ duration: 240, rate: f * Q, pressure: (t, p0) => p0 + 2e3 * f * (1 - Math.exp(-t / 30)) }));
    const r = recordFromPhases([idlePhase(30), ...steps, shutInPhase(900, 0.2e6, 20e6, 300)], { p0: 20e6, noise: 2e3, rateNoise: 0.02 });
    const t = infer(r);
    expect(t.type).toBe('srt');
    const [cycle] = segmentCycles(r);
    expect(rateLevels(r.time, r.rate, cycle)).toHaveLength(6);
  });

  it('should call a small injection with a shut-in many times longer a DFIT', () => {
    // 4 min injection of 0.32 m3, then 3 h of shut-in: ratio 45.
    const inject: LoadingShape = { slope: 30e6 * Q, leakOffTime: 150, peakTime: 180, pumpDuration: 240, propagation: 27e6, rate: Q };
    const r = recordFromPhases([idlePhase(30), loadingPhase(inject), shutInPhase(3 * 3600, 0.3e6, 21e6, 1500)], { p0: 20e6, noise: 2e3, interval: 2 });
    const t = infer(r);
    expect(t.type).toBe('dfit');
    expect(t.reasons[0]).toMatch(/shut-in/);
  });

  it('should call a record without pumping a FIT with a reason', () => {
    const r = recordFromPhases([idlePhase(100)]);
    const t = infer(r);
    expect(t.type).toBe('fit');
    expect(t.reasons[0]).toMatch(/no pumping/);
  });
});
