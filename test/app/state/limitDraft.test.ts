import { describe, expect, it } from 'vitest';
import { limitDraftChanges } from '../../../src-renderer/app/state/limitDraft';

// NIST SP 811 (2008) Appendix B.8: 1 psi = 6894.757293168361 Pa.
const PA_PER_PSI = 6894.757293168361;

describe('limit draft', () => {
  it('should turn typed display values into SI changes', () => {
    const { changes, errors } = limitDraftChanges({
      'rate-stability.maxCv': '12',
      'shut-in-stability.maxEndDeclineRate': '3',
      'shut-in-stability.minDuration': '15',
    }, {}, 'si');
    expect(errors).toEqual({});
    expect(changes['rate-stability.maxCv']).toBeCloseTo(0.12, 12);
    expect(changes['shut-in-stability.maxEndDeclineRate']).toBeCloseTo(3000 / 60, 12); // 3 kPa/min = 50 Pa/s
    expect(changes['shut-in-stability.minDuration']).toBe(900);
  });

  it('should take a decline rate typed in psi/min in the oilfield system', () => {
    const { changes } = limitDraftChanges({ 'shut-in-stability.maxEndDeclineRate': '0.5' }, {}, 'oilfield');
    expect(changes['shut-in-stability.maxEndDeclineRate']).toBeCloseTo(0.5 * PA_PER_PSI / 60, 9);
  });

  it('should ignore empty texts and texts equal to the saved value as shown', () => {
    // 50 Pa/s is shown as "3" kPa/min: typing "3" again changes nothing (no rounding drift).
    const { changes, errors } = limitDraftChanges({ 'shut-in-stability.maxEndDeclineRate': '3', 'rate-stability.maxCv': ' ' },
      { 'shut-in-stability.maxEndDeclineRate': 50.0000001 }, 'si');
    expect(changes).toEqual({});
    expect(errors).toEqual({});
  });

  it('should report a message per refused text and keep it out of the changes', () => {
    const { changes, errors } = limitDraftChanges({ 'rate-stability.maxCv': '150', 'sampling.minLoadingSamples': '7.5', 'gauge-range.maxFraction': '90' }, {}, 'si');
    expect(Object.keys(errors).sort()).toEqual(['rate-stability.maxCv', 'sampling.minLoadingSamples']);
    expect(changes).toEqual({ 'gauge-range.maxFraction': 0.9 });
  });

  it('should refuse a stiffness band whose lowest ratio is not below the highest', () => {
    // Defaults (engine/quality/limits.ts): 0.5 to 1.5.
    const { changes, errors } = limitDraftChanges({ 'loading-stiffness.minRatio': '1.6' }, {}, 'si');
    expect(errors['loading-stiffness.minRatio']).toMatch(/below the highest/);
    expect(changes).toEqual({});
    expect(limitDraftChanges({ 'loading-stiffness.minRatio': '1.2' }, {}, 'si').errors).toEqual({});
  });
});
