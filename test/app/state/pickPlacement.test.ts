import { describe, expect, it } from 'vitest';
import type { TestDetail } from '../../../src-renderer/archive/api';
import type { CycleAnalysis } from '../../../src-renderer/engine/result';
import { manualPickAt, nearestIndex, nearestIndexUnsorted, pickRange, previewOptions } from '../../../src-renderer/app/state/pickPlacement';
import { describeEvent } from '../../../src-renderer/app/state/logWords';

const cycle: CycleAnalysis = {
  cycle: { index: 2, pumpStart: 100, pumpEnd: 200, shutInEnd: 400, meanRate: 1e-3, volumePumped: 0.1, flowBack: false },
  loadingFit: null, expectedSlope: null, picks: {}, closureCandidates: [], closureSpread: null,
};

describe('pickPlacement', () => {
  it('should find the nearest sample by binary search, ties to the earlier one', () => {
    const t = [0, 1, 2, 4, 8, 16];
    expect(nearestIndex(t, 5.9)).toBe(3);
    expect(nearestIndex(t, 6)).toBe(3);
    expect(nearestIndex(t, 6.1)).toBe(4);
    expect(nearestIndex(t, -3)).toBe(0);
    expect(nearestIndex(t, 99)).toBe(5);
    expect(nearestIndex(t, 3, 4, 5)).toBe(4);
    expect(nearestIndexUnsorted([5, 1, 9, 3], 8, 0, 3)).toBe(2);
  });

  it('should keep loading picks in the pumping part and shut-in picks after the pumps stop', () => {
    // Common practice: LOP, breakdown and propagation are read while pumping; ISIP and closure on the shut-in.
    expect(pickRange(cycle, 'leakOff')).toEqual([100, 200]);
    expect(pickRange(cycle, 'closure')).toEqual([200, 400]);
    expect(pickRange(cycle, 'isip')).toEqual([200, 400]);
  });

  it('should build a hand pick on the curve unless a pressure is typed', () => {
    const time = Float64Array.from([0, 10, 20]);
    const p = Float64Array.from([1e6, 2e6, 3e6]);
    expect(manualPickAt('closure', 1, time, p, 'why')).toMatchObject({ time: 10, pressure: 2e6, manual: true, reason: 'why', method: 'manual' });
    expect(manualPickAt('closure', 1, time, p, 'why', 2.5e6).pressure).toBe(2.5e6);
  });

  it('should replace an earlier hand pick of the same cycle and kind in the preview', () => {
    const detail = {
      analysis: { type: 'lot' },
      manualPicks: [
        { cycle: 1, kind: 'closure', pick: null, reason: 'a', author: 'X', time: '' },
        { cycle: 1, kind: 'isip', pick: null, reason: 'b', author: 'X', time: '' },
      ],
    } as unknown as TestDetail;
    const o = previewOptions(detail, { 'sampling.maxInterval': 2 }, { cycle: 1, kind: 'closure', pick: null, reason: 'c' });
    expect(o.manualPicks).toHaveLength(2);
    expect(o.manualPicks!.map((m) => m.reason)).toEqual(['b', 'c']);
    expect(o.limits).toEqual({ 'sampling.maxInterval': 2 });
  });

  it('should describe review-log events in plain words with their reasons', () => {
    const base = { id: '1', author: 'A', device: 'd', time: '2026-01-01T00:00:00Z', clock: 1, prev: '' };
    expect(describeEvent({ ...base, body: { kind: 'rejected', testId: 't', reason: 'gauge clipped' } })).toBe('Rejected. Reason: gauge clipped');
    expect(describeEvent({ ...base, body: { kind: 'pick-moved', testId: 't', cycle: 2, pickKind: 'closure', pick: null, reason: 'noise' } }))
      .toBe('Removed the closure of cycle 2. Reason: noise');
  });
});
