import { describe, expect, it } from 'vitest';
import { shutInDiagnostics, shutInSeriesOf, shutInSlice, type ShutInArrays } from '../../../src-renderer/app/charts/shutInDiagnostics';
import { runEngineRequest } from '../../../src-renderer/app/workers/engineCalls';
import { transferablesOf } from '../../../src-renderer/app/workers/protocol';
import { gFunction } from '../../../src-renderer/engine/analysis/gfunction';
import type { CycleAnalysis } from '../../../src-renderer/engine/result';

/** A synthetic cycle: pumped 0..tp s after a 50 s lead, then shut in with P falling linearly in G (truth set here). */
function record(tp: number, duration: number) {
  const lead = 50;
  const n = lead + tp + duration + 1;
  const time = Float64Array.from({ length: n }, (_, i) => i * 1.0);
  // Barree, Barree & Craig (2009), SPE Prod. & Oper. 24(3): normal leak-off gives P linear in G.
  const p = Float64Array.from(time, (t) => (t < lead ? 15e6 : t <= lead + tp ? 20e6 + ((t - lead) / tp) * 10e6 : 30e6 - 2e6 * gFunction((t - lead - tp) / tp)));
  const cycle: CycleAnalysis = {
    cycle: { index: 2, pumpStart: lead, pumpEnd: lead + tp, shutInEnd: n - 1, meanRate: 1e-3, volumePumped: 0.1, flowBack: false },
    loadingFit: null, expectedSlope: null,
    picks: { closure: { kind: 'closure', sampleIndex: lead + tp + 900, time: time[lead + tp + 900], pressure: p[lead + tp + 900] } as never },
    closureCandidates: [], closureSpread: null,
  };
  return { time, p, cycle };
}

describe('shut-in diagnostics request', () => {
  it('should give, from the shut-in slice alone, the same series as the whole record gives', async () => {
    const { time, p, cycle } = record(600, 1800);
    const whole = shutInDiagnostics(time, p, cycle)!;
    const slice = shutInSlice(time, p, cycle)!;
    expect(slice.time.length).toBe(cycle.cycle.shutInEnd - cycle.cycle.pumpEnd + 1);
    expect(slice.pumpingTime).toBe(600);
    const arrays = await runEngineRequest({ id: 1, op: 'shut-in-diagnostics', cycle: 2, time: slice.time, downhole: slice.downhole, pumpingTime: slice.pumpingTime }) as ShutInArrays;
    const rebuilt = shutInSeriesOf(arrays, cycle);
    expect(rebuilt).toEqual(whole);
    // Barree, Barree & Craig (2009): the closure tangent through the origin has the slope of P in G (2 MPa per unit G here).
    expect(rebuilt.tangentSlope!).toBeCloseTo(2e6, -3);
    expect(rebuilt.picks.map((x) => x.dt)).toEqual([900]);
  });

  it('should list each typed-array buffer of a reply once, for transfer', () => {
    const shared = new Float64Array(4);
    const list = transferablesOf({ a: shared, b: shared.subarray(1), c: new Float64Array(2), n: 3 });
    expect(list.length).toBe(2);
    expect(list).toContain(shared.buffer);
    expect(transferablesOf(null)).toEqual([]);
  });
});
