import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import {
  classifyStressRegime, frictionalLimitFactor, shmaxBoundsFromShmin, shminLowerBound,
} from '../../../src-renderer/engine/stress/frictional';

describe('frictional limit factor', () => {
  it('should match the check values of Zoback (2007) ch. 4 as listed in METHODS.md', () => {
    // METHODS.md "Stress bounds and regimes": q = 3.12 for mu 0.6, 3.69 for 0.7, 5.83 for 1.0
    // (Jaeger & Cook; Zoback, Reservoir Geomechanics 2007, ch. 4).
    expect(frictionalLimitFactor(0.6)).toBeCloseTo(3.12, 2);
    expect(frictionalLimitFactor(0.7)).toBeCloseTo(3.69, 2);
    expect(frictionalLimitFactor(1.0)).toBeCloseTo(5.83, 2);
  });

  it('should equal the closed form 3 + 2 sqrt(2) for mu = 1', () => {
    // [sqrt(2) + 1]^2 = 3 + 2 sqrt(2), exact algebra.
    expect(frictionalLimitFactor(1)).toBeCloseTo(3 + 2 * Math.SQRT2, 12);
  });

  it('should reject a friction coefficient that is not positive', () => {
    expect(() => frictionalLimitFactor(0)).toThrow(EngineError);
    expect(() => frictionalLimitFactor(Number.NaN)).toThrow(EngineError);
  });
});

describe('stress polygon bounds', () => {
  it('should give the normal-faulting lower bound on Shmin, Pp + (Sv - Pp)/q', () => {
    // Hand-worked: Sv 45.2 MPa, Pp 20 MPa, q(0.6) = 3.11943 -> 20 + 25.2/3.11943 = 28.078 MPa
    // (Zoback 2007 ch. 4 stress polygon).
    const q = frictionalLimitFactor(0.6);
    expect(shminLowerBound(45.2e6, 20e6, q) / 1e6).toBeCloseTo(28.078, 3);
  });

  it('should bound SHmax between Shmin and Pp + q (Shmin - Pp) for a Shmin estimate', () => {
    // Hand-worked: Shmin 34, Pp 20, Sv 45.2 MPa, mu 0.6: high = 20 + 3.11943 x 14 = 63.672 MPa.
    const b = shmaxBoundsFromShmin(34e6, 'estimate', 45.2e6, 20e6, 0.6);
    expect(b.low).toBe(34e6);
    expect(b.high / 1e6).toBeCloseTo(63.672, 3);
    expect(b.notes).toEqual([]);
  });

  it('should use Sv as S3 for the upper bound when Shmin exceeds Sv (reverse regime)', () => {
    // Zoback 2007 ch. 4: in the reverse regime S3 = Sv, so SHmax <= Pp + q (Sv - Pp).
    // Hand-worked: Sv 30, Pp 10, Shmin 35 MPa, mu 0.6 -> 10 + 3.11943 x 20 = 72.389 MPa.
    const b = shmaxBoundsFromShmin(35e6, 'estimate', 30e6, 10e6, 0.6);
    expect(b.high / 1e6).toBeCloseTo(72.389, 3);
  });

  it('should widen the bounds correctly when Shmin is only an upper or a lower bound', () => {
    const q = frictionalLimitFactor(0.6);
    const upper = shmaxBoundsFromShmin(34e6, 'upper-bound', 45.2e6, 20e6, 0.6);
    expect(upper.low).toBeCloseTo(20e6 + 25.2e6 / q, 0);
    const lower = shmaxBoundsFromShmin(30e6, 'lower-bound', 45.2e6, 20e6, 0.6);
    expect(lower.low).toBe(30e6);
    expect(lower.high).toBeCloseTo(20e6 + q * 25.2e6, 0);
    expect(lower.notes.length).toBe(1);
  });
});

describe('Anderson stress regime', () => {
  // Definitions: Anderson (1951) as in Zoback 2007 ch. 4 / METHODS.md.
  it('should classify normal, strike-slip and reverse regimes', () => {
    expect(classifyStressRegime(30e6, 35e6, 40e6, 45e6)).toBe('normal');
    expect(classifyStressRegime(30e6, 47e6, 50e6, 45e6)).toBe('strike-slip');
    expect(classifyStressRegime(50e6, 60e6, 70e6, 45e6)).toBe('reverse');
  });

  it('should say undetermined when the SHmax range straddles Sv', () => {
    expect(classifyStressRegime(30e6, 34e6, 63e6, 45e6)).toBe('undetermined');
  });

  it('should reject an inverted SHmax range', () => {
    expect(() => classifyStressRegime(30e6, 50e6, 40e6, 45e6)).toThrow(EngineError);
  });
});
