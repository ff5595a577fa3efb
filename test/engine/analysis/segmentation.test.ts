import { describe, expect, it } from 'vitest';
import { segmentCycles } from '../../../src-renderer/engine/analysis/segmentation';
import { EngineError } from '../../../src-renderer/engine/errors';
import { idlePhase, recordFromPhases, type Phase } from './analytic-records';

// Records built here from set rate histories (their truth is set by the test): the expected
// cycle boundaries are the sample indices where the set pump rate starts and stops.
const BBL_PER_MIN = 0.158987294928 / 60; // 1 bbl = 0.158987294928 m3 exactly (NIST SP 811 B.8)

const pump = (duration: number, rate: number): Phase => ({ duration, rate, pressure: (t, p0) => p0 + 1000 * t });
const rest = (duration: number): Phase => ({ duration, rate: 0, pressure: (t, p0) => p0 - 10 * t });
const back = (duration: number, rate: number): Phase => ({ duration, rate: -rate, pressure: (t, p0) => p0 - 100 * t });

describe('segmentCycles', () => {
  it('should split two pumping periods into two 1-based cycles with their shut-ins', () => {
    const q = 0.5 * BBL_PER_MIN;
    const r = recordFromPhases([idlePhase(20), pump(300, q), rest(600), pump(200, q), rest(400)]);
    const cycles = segmentCycles(r);
    expect(cycles.map((c) => c.index)).toEqual([1, 2]);
    // Pumping samples are t = 20..319 (rate of the phase holding each sample), shut-in to 919.
    expect(cycles[0].pumpStart).toBe(20);
    expect(cycles[0].pumpEnd).toBe(319);
    expect(cycles[0].shutInEnd).toBe(919);
    expect(cycles[1].pumpStart).toBe(920);
    expect(cycles[1].pumpEnd).toBe(1119);
    expect(cycles[1].shutInEnd).toBe(r.time.length - 1);
    expect(cycles[0].meanRate).toBeCloseTo(q, 12);
    // Volume pumped = rate x duration (300 samples of q x 1 s).
    expect(cycles[0].volumePumped).toBeCloseTo(300 * q, 9);
    expect(cycles[0].flowBack).toBe(false);
  });

  it('should bridge a short rate dropout and ignore rate noise', () => {
    const q = 0.4 * BBL_PER_MIN;
    const r = recordFromPhases([idlePhase(10), pump(120, q), rest(4), pump(150, q), rest(500)], { rateNoise: 0.03, seed: 3 });
    const cycles = segmentCycles(r);
    expect(cycles).toHaveLength(1);
    expect(cycles[0].pumpStart).toBe(10);
    expect(cycles[0].pumpEnd).toBe(283);
  });

  it('should keep a step-rate record of several rate levels as one cycle', () => {
    const steps = [0.1, 0.2, 0.4, 0.6, 0.8, 1.0, 1.2].map((b) => pump(180, b * BBL_PER_MIN));
    const r = recordFromPhases([idlePhase(30), ...steps, rest(900)], { rateNoise: 0.02 });
    const cycles = segmentCycles(r);
    expect(cycles).toHaveLength(1);
    expect(cycles[0].pumpEnd - cycles[0].pumpStart + 1).toBe(7 * 180);
  });

  it('should end the shut-in where flow-back starts and flag it', () => {
    const q = 0.5 * BBL_PER_MIN;
    const r = recordFromPhases([idlePhase(10), pump(200, q), rest(300), back(100, q), rest(50)]);
    const [c] = segmentCycles(r);
    expect(c.flowBack).toBe(true);
    expect(c.shutInEnd).toBe(509);
  });

  it('should use volume increments when the rate was derived from a sparse volume column', () => {
    const q = 0.5 * BBL_PER_MIN;
    const r = recordFromPhases([idlePhase(20), pump(300, q), rest(600), pump(300, q), rest(600)]);
    // A volume column recorded to 0.1 bbl, with the rate differentiated sample by sample from it:
    // most samples show zero rate, every few samples a jump.
    const step = 0.1 * 0.158987294928;
    const v = r.volume.map((x) => Math.floor(x / step) * step);
    const derived = new Float64Array(v.length);
    for (let i = 1; i < v.length; i++) derived[i] = (v[i] - v[i - 1]) / (r.time[i] - r.time[i - 1]);
    const cycles = segmentCycles({ time: r.time, rate: derived, volume: v }, { rateDerived: true });
    expect(cycles).toHaveLength(2);
    // Within the smoothing window (about 5 s) and one volume step (12 s at this rate) of the set boundaries.
    expect(Math.abs(cycles[0].pumpStart - 20)).toBeLessThanOrEqual(15);
    expect(Math.abs(cycles[1].pumpStart - 920)).toBeLessThanOrEqual(15);
  });

  it('should return no cycle for a record that never pumps, and reject unequal arrays', () => {
    const r = recordFromPhases([idlePhase(100)]);
    expect(segmentCycles(r)).toEqual([]);
    expect(() => segmentCycles({ time: r.time, rate: r.rate.subarray(1), volume: r.volume })).toThrow(EngineError);
  });
});
