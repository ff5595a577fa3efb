import { describe, expect, it } from 'vitest';
import { differenceHalfWidth, fillGaps, rateFromVolume, rateVolumeMismatch, volumeFromRate } from '../../../src-renderer/engine/import/rateVolume';

describe('rate and volume', () => {
  it('should integrate rate by the trapezoidal rule (exact for piecewise-linear rate)', () => {
    // synthetic: q = 0.01 t m3/s, V = 0.005 t^2 exactly at the samples for a linear rate
    const t = Float64Array.from({ length: 11 }, (_, i) => i);
    const q = t.map((x) => 0.01 * x);
    const v = volumeFromRate(t, q);
    expect(v[10]).toBeCloseTo(0.5, 14);
    expect(v[0]).toBe(0);
  });

  it('should differentiate volume back to the rate, robust to counter quantisation', () => {
    // synthetic: 2 bbl/min = 0.0052996 m3/s for 200 s at 1 Hz, volume counter rounded to 0.001 m3
    const q = (2 * 0.158987294928) / 60;
    const t = Float64Array.from({ length: 200 }, (_, i) => i);
    const v = t.map((x) => Math.round((q * x) / 0.001) * 0.001);
    const k = differenceHalfWidth(t);
    expect(k).toBe(5);
    const rate = rateFromVolume(t, v, k);
    for (let i = 0; i < 200; i++) expect(Math.abs(rate[i] - q) / q).toBeLessThan(0.2);
    for (let i = 5; i < 195; i++) expect(Math.abs(rate[i] - q) / q).toBeLessThan(0.02); // 1 mm3 per 10 s window
  });

  it('should fill gaps linearly and report an all-blank column', () => {
    const t = Float64Array.from([0, 1, 2, 3, 4]);
    const v = Float64Array.from([NaN, 1, NaN, 3, NaN]);
    expect(fillGaps(t, v)).toBe(3);
    expect(Array.from(v)).toEqual([1, 1, 2, 3, 3]);
    expect(fillGaps(t, new Float64Array(5).fill(NaN))).toBe(-1);
  });

  it('should measure the mismatch of a volume column and the integral of a rate column', () => {
    const t = Float64Array.from([0, 10]);
    expect(rateVolumeMismatch(t, Float64Array.from([1, 1]), Float64Array.from([0, 10]))).toBe(0);
    expect(rateVolumeMismatch(t, Float64Array.from([1, 1]), Float64Array.from([0, 11]))).toBeCloseTo(1 / 11, 12);
  });
});
