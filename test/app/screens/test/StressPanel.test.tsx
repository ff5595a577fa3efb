import { describe, expect, it } from 'vitest';
import { detectabilityText, stressAttention } from '../../../../src-renderer/app/screens/test/StressPanel';
import type { StressEstimates } from '../../../../src-renderer/engine/result';
import { analyzeRecord } from '../../../../src-renderer/engine/analyze';
import { generateSyntheticTest } from '../../../../src-renderer/engine/synthetic/generate';

describe('stress panel', () => {
  it('should write the detectable volume once, in the chosen units', () => {
    const message = 'The record could not see a fracture smaller than 0.47 L (smallest resolvable departure 60 kPa, system compliance 7.85 L/MPa); …';
    // NIST SP 811 Appendix B.8: 1 gal (US) = 3.785412 E-03 m3, so 4.71e-4 m3 = 0.124 gal.
    const oil = detectabilityText(message, 'oilfield', 4.71e-4);
    expect(oil).toContain('smaller than 0.12 gal (');
    expect(oil).not.toContain('0.47 L');
    expect(oil).toContain('7.85 L/MPa');
    expect(detectabilityText(message, 'si', 4.71e-4)).toBe(message);
  });

  it('should mark the stresses only for more than the standing SHmax caution', () => {
    // Synthetic Harrow Flats XLOT whose truth is set here; every test carries an SHmax caution.
    const { record } = generateSyntheticTest({ type: 'xlot', depthTvd: 1850, shmin: 30e6, cycles: 2, seed: 4 });
    const stress = analyzeRecord(record).stress;
    const plain: StressEstimates = { ...stress, shmin: stress.shmin ? { ...stress.shmin, kind: 'estimate' } : null, shmax: stress.shmax ? { ...stress.shmax, value: null } : null };
    expect(plain.shmax?.cautions.length ?? 0).toBeGreaterThan(0);
    expect(stressAttention(plain)).toEqual([]);
    if (stress.shmax) expect(stressAttention({ ...plain, shmax: { ...stress.shmax, value: 40e6 } })).toHaveLength(1);
    if (stress.shmin) expect(stressAttention({ ...plain, shmin: { ...stress.shmin, kind: 'lower-bound' } })[0]).toContain('lower bound');
  });
});
