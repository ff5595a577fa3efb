import { describe, expect, it } from 'vitest';
import { downholePressure } from '../../../src-renderer/engine/analysis/downhole';
import { segmentCycles } from '../../../src-renderer/engine/analysis/segmentation';
import { closureCandidates, isipPick } from '../../../src-renderer/engine/analysis/shut-in';
import { reducedShutIn } from '../../../src-renderer/engine/analysis/shut-in-input';
import type { Cycle } from '../../../src-renderer/engine/result';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';

// The reduction's rules are set by the product (shut-in-input.ts); the checks here are
// exact bookkeeping: kept samples equal the record's, indices map back, pumping time kept.
function record(n: number) {
  const time = Float64Array.from({ length: n }, (_, i) => i * 0.1);
  const pressure = Float64Array.from({ length: n }, (_, i) => 3e7 - 10 * i);
  return { time, pressure };
}

describe('reducedShutIn', () => {
  it('should leave a short shut-in as recorded', () => {
    const { time, pressure } = record(30_000);
    const cycle: Cycle = { index: 1, pumpStart: 100, pumpEnd: 5000, shutInEnd: 20_000, meanRate: 1e-3, volumePumped: 0.5, flowBack: false };
    expect(reducedShutIn(time, pressure, cycle)).toBeNull();
  });

  it('should keep the early decline as recorded, thin the rest and map indices back', () => {
    const { time, pressure } = record(500_000);
    const cycle: Cycle = { index: 1, pumpStart: 100, pumpEnd: 10_100, shutInEnd: 499_999, meanRate: 1e-3, volumePumped: 0.5, flowBack: false };
    const r = reducedShutIn(time, pressure, cycle)!;
    expect(r.time.length).toBeLessThanOrEqual(1 + 4000 + 20_000 + 1);
    // Pumping time tp = time[pumpEnd] - time[pumpStart] is unchanged.
    expect(r.time[r.cycle.pumpEnd] - r.time[r.cycle.pumpStart]).toBe(time[10_100] - time[100]);
    expect(r.indexMap[r.cycle.pumpEnd]).toBe(10_100);
    expect(r.indexMap[r.cycle.shutInEnd]).toBe(499_999);
    // The first 4000 shut-in samples are consecutive record samples.
    for (let k = 1; k <= 4000; k++) expect(r.indexMap[r.cycle.pumpEnd + k]).toBe(10_100 + k);
    for (let k = 0; k < r.time.length; k++) {
      expect(r.time[k]).toBe(time[r.indexMap[k]]);
      expect(r.pressure[k]).toBe(pressure[r.indexMap[k]]);
      if (k > 0) expect(r.indexMap[k]).toBeGreaterThan(r.indexMap[k - 1]);
    }
  });

  it('should give the shut-in picks of the full record on a 72,000-sample shut-in', () => {
    // Synthetic DFIT (truth set by the generator: closure = Shmin = 34 MPa, ISIP 34.5 MPa), 0.1 s sampling, 2 h shut-in.
    const { record, truth } = generateSyntheticTest({ type: 'dfit', depthTvd: 2000, shmin: 34e6, sampleInterval: 0.1, shutInDuration: 7200 });
    const p = downholePressure(record.pressure, record.metadata).pressure;
    const [cycle] = segmentCycles(record);
    const r = reducedShutIn(record.time, p, cycle)!;
    expect(r).not.toBeNull();
    expect(isipPick(r.time, r.pressure, r.cycle)!.pressure).toBeCloseTo(isipPick(record.time, p, cycle)!.pressure, -3);
    const full = closureCandidates(record.time, p, cycle);
    const reduced = closureCandidates(r.time, r.pressure, r.cycle);
    expect(reduced.map((k) => k.method)).toEqual(full.map((k) => k.method));
    reduced.forEach((k, i) => {
      expect(Math.abs(k.pressure - full[i].pressure)).toBeLessThan(20e3);
      expect(Math.abs(k.pressure - truth.shmin)).toBeLessThan(0.1e6);
    });
  });
});
