import { describe, expect, it } from 'vitest';
import { medianOf, noiseStandardDeviation, quantileOf, recordingStep } from '../../../src-renderer/engine/analysis/robust-statistics';
import { normalSource } from './analytic-records';

describe('quantileOf', () => {
  it('should agree with the nearest-rank quantile of the sorted values', () => {
    // Reference: sort, then take index round(q (n - 1)) (nearest-rank definition, Hyndman & Fan 1996 type 3-like).
    const normal = normalSource(2);
    const v = Float64Array.from({ length: 1001 }, () => normal());
    const sorted = Array.from(v).sort((a, b) => a - b);
    for (const q of [0, 0.1, 0.5, 0.9, 1]) expect(quantileOf(v, q)).toBe(sorted[Math.round(q * 1000)]);
    expect(medianOf([5, 1, 4])).toBe(4);
    expect(Number.isNaN(medianOf([Number.NaN]))).toBe(true);
  });
});

describe('noiseStandardDeviation', () => {
  it('should recover the SD of white noise on a ramp', () => {
    // Gaussian noise of SD 2 on a straight ramp: second differences remove the ramp; the
    // MAD x 1.4826 / sqrt(6) estimate (von Neumann 1941 difference variance; Gaussian MAD factor) is about 2.
    const normal = normalSource(4);
    const v = Float64Array.from({ length: 200_000 }, (_, i) => 1000 + 3 * i + 2 * normal());
    expect(noiseStandardDeviation(v)).toBeCloseTo(2, 1);
  });

  it('should be 0 on a noiseless line and find the recording step of quantised data', () => {
    expect(noiseStandardDeviation(Float64Array.of(1, 2, 3, 4, 5))).toBe(0);
    expect(recordingStep(Float64Array.of(0, 0.5, 0.5, 1.5, 1.5))).toBe(0.5);
  });
});
