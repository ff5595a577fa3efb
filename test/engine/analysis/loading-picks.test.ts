import { describe, expect, it } from 'vitest';
import { analyseLoading } from '../../../src-renderer/engine/analysis/loading-picks';
import { segmentCycles } from '../../../src-renderer/engine/analysis/segmentation';
import {
  idlePhase, leakOffPressure, loadingPhase, peakPressure, recordFromPhases, shutInPhase, type LoadingShape, type Phase,
} from './analytic-records';

// Analytic records whose truth is set here: a straight loading line of known stiffness, a
// parabolic bend from the set leak-off time to the set peak, an exponential drop to the set
// propagation pressure. Event definitions: White, Traugott & Swarbrick (2002), Petroleum
// Geoscience 8(2) (leak-off = end of the straight line; breakdown = peak; propagation =
// near-constant pumping pressure after it).
const Q = 0.5 * 0.158987294928 / 60; // 0.5 bbl/min in m3/s (bbl exact, NIST SP 811)
const STIFFNESS = 30e6; // Pa/m3, set
const P0 = 20e6; // Pa at the tested depth before pumping, set

const lotShape: LoadingShape = { slope: STIFFNESS * Q, leakOffTime: 250, peakTime: 330, pumpDuration: 420, propagation: 28e6, rate: Q };

function lotRecord(noise = 0, shape: LoadingShape = lotShape, extra: Phase[] = []) {
  return recordFromPhases([idlePhase(30), ...extra, loadingPhase(shape), shutInPhase(900, 0.4e6, 22e6, 200)], { p0: P0, noise, seed: 11 });
}

describe('analyseLoading', () => {
  it('should recover the set loading stiffness and leak-off of a clean LOT', () => {
    const r = lotRecord();
    const [cycle] = segmentCycles(r);
    const f = analyseLoading(r.time, r.pressure, r.volume, cycle);
    expect(f.abscissa).toBe('volume');
    expect(f.fit).not.toBeNull();
    expect(f.fit!.slope / STIFFNESS).toBeCloseTo(1, 3);
    expect(f.fit!.r2).toBeGreaterThan(0.99999);
    const truth = leakOffPressure(lotShape, P0);
    const truthIndex = 30 + 250;
    expect(f.departureIndex).not.toBeNull();
    // The departure shows once the bend exceeds the threshold: within 10 s and 2.5 % of the rise.
    expect(Math.abs(f.departureIndex! - truthIndex)).toBeLessThanOrEqual(10);
    expect(Math.abs(r.pressure[f.departureIndex!] - truth)).toBeLessThan(0.025 * (truth - P0));
    expect(f.breakdownIndex).toBe(30 + 330);
    expect(r.pressure[f.breakdownIndex!]).toBeCloseTo(peakPressure(lotShape, P0), -2);
    expect(f.plateau).not.toBeNull();
    expect(f.plateau!.pressure).toBeCloseTo(28e6, -4);
  });

  it('should hold the picks within the noise on a noisy LOT (3 kPa SD)', () => {
    const r = lotRecord(3e3);
    const [cycle] = segmentCycles(r);
    const f = analyseLoading(r.time, r.pressure, r.volume, cycle);
    expect(f.noise).toBeGreaterThan(1.5e3);
    expect(f.noise).toBeLessThan(6e3);
    expect(f.fit!.slope / STIFFNESS).toBeCloseTo(1, 2);
    expect(Math.abs(f.departureIndex! - 280)).toBeLessThanOrEqual(15);
    expect(Math.abs(f.breakdownIndex! - 360)).toBeLessThanOrEqual(3);
    expect(f.plateau!.pressure).toBeCloseTo(28e6, -4);
  });

  it('should find no departure and no breakdown in a limit test stopped on the line', () => {
    const fit: LoadingShape = { ...lotShape, leakOffTime: 500, peakTime: 600, pumpDuration: 240, propagation: undefined };
    const r = lotRecord(2e3, fit);
    const [cycle] = segmentCycles(r);
    const f = analyseLoading(r.time, r.pressure, r.volume, cycle);
    expect(f.departureIndex).toBeNull();
    expect(f.breakdownIndex).toBeNull();
    expect(f.plateau).toBeNull();
    expect(f.peakIndex).toBeGreaterThan(cycle.pumpEnd - 5);
    expect(f.fit!.slope / STIFFNESS).toBeCloseTo(1, 2);
  });

  it('should skip a soft toe at the start of pumping', () => {
    // Toe: 60 s whose stiffness rises linearly from 0 to the line's (air compressing), set here.
    const toe: Phase = { duration: 60, rate: Q, pressure: (t, p0) => p0 + (lotShape.slope * t * t) / 120 };
    const r = recordFromPhases([idlePhase(30), toe, loadingPhase(lotShape), shutInPhase(600, 0.4e6, 22e6, 200)], { p0: P0, noise: 2e3, seed: 5 });
    const [cycle] = segmentCycles(r);
    const f = analyseLoading(r.time, r.pressure, r.volume, cycle);
    expect(f.fit!.start).toBeGreaterThanOrEqual(30 + 40);
    expect(f.fit!.slope / STIFFNESS).toBeCloseTo(1, 2);
    expect(Math.abs(f.departureIndex! - (30 + 60 + 250))).toBeLessThanOrEqual(15);
  });

  it('should fall back to time x mean rate when the volume column does not increase', () => {
    const r = lotRecord();
    r.volume.fill(0);
    const [cycle] = segmentCycles(r);
    const f = analyseLoading(r.time, r.pressure, r.volume, cycle);
    expect(f.abscissa).toBe('time-at-mean-rate');
    expect(f.fit!.slope / STIFFNESS).toBeCloseTo(1, 3);
  });

  it('should find the line and departure on a 1,000,000-sample record', () => {
    const shape: LoadingShape = { ...lotShape, slope: lotShape.slope / 100, leakOffTime: 25_000, peakTime: 33_000, pumpDuration: 42_000 };
    const r = recordFromPhases([idlePhase(30), loadingPhase(shape), shutInPhase(10_000, 0.4e6, 22e6, 2000)], { p0: P0, noise: 3e3, interval: 0.05 });
    expect(r.time.length).toBeGreaterThan(1_000_000);
    const [cycle] = segmentCycles(r);
    const f = analyseLoading(r.time, r.pressure, r.volume, cycle);
    // Same rate, a hundredth of the pressure rise per second: a hundredth of the stiffness.
    expect(f.fit!.slope / (STIFFNESS / 100)).toBeCloseTo(1, 2);
    expect(Math.abs(r.time[f.departureIndex!] - 30 - 25_000)).toBeLessThan(1500);
  });
});
