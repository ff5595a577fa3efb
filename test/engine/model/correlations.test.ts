import { describe, expect, it } from 'vitest';
import {
  breckelsVanEekelen,
  breckelsVanEekelenPsi,
  eatonFractureGradient,
  eatonShmin,
} from '../../../src-renderer/engine/model/correlations';
import { frictionalLimitFactor } from '../../../src-renderer/engine/stress/frictional';

// psi and ft exact: NIST SP 811 (2008) Appendix B.8; psi = 6894.757293168 Pa, ft = 0.3048 m.
const PSI = 6894.757293168361;
const FT = 0.3048;

describe('correlations', () => {
  it('should reproduce Breckels & van Eekelen (1982) at stated depths', () => {
    // Published form (SPE 10336, JPT 34), hand-computed: 0.197 x 10000^1.145 = 7489.73 psi;
    // 0.197 x 5000^1.145 = 3377.0 psi; 1.167 x 15000 - 4596 = 12909 psi.
    expect(breckelsVanEekelenPsi(10_000)).toBeCloseTo(0.197 * 10_000 ** 1.145, 9);
    expect(breckelsVanEekelenPsi(10_000)).toBeCloseTo(7489.73, 2);
    expect(breckelsVanEekelenPsi(5000)).toBeCloseTo(0.197 * 5000 ** 1.145, 9);
    expect(breckelsVanEekelenPsi(15_000)).toBeCloseTo(12_909, 9);
    // Overpressure term 0.46 (Pp - Pn), Pn = 0.465 D: at 10,000 ft with Pp = 6650 psi, Pn = 4650.
    expect(breckelsVanEekelenPsi(10_000, 6650)).toBeCloseTo(7489.73 + 0.46 * 2000, 2);
    // Normally pressured or underpressured: no term.
    expect(breckelsVanEekelenPsi(10_000, 4000)).toBeCloseTo(breckelsVanEekelenPsi(10_000), 9);
  });

  it('should document the step between the two branches at 11,500 ft', () => {
    // Computed from the published form: 0.197 x 11500^1.145 = 8789.52 psi, 1.167 x 11500 - 4596 = 8824.5 psi.
    const below = breckelsVanEekelenPsi(11_500);
    const above = breckelsVanEekelenPsi(11_500.000001);
    expect(below).toBeCloseTo(8789.52, 2);
    expect(above).toBeCloseTo(8824.5, 2);
    expect(above - below).toBeCloseTo(34.98, 2);
  });

  it('should convert Breckels & van Eekelen to SI exactly', () => {
    expect(breckelsVanEekelen(10_000 * FT)).toBeCloseTo(7489.731107515 * PSI, 2);
  });

  it('should reproduce Eaton (1969) in gradient and stress form', () => {
    // Hand-computed from F = (S/D - P/D) nu/(1 - nu) + P/D: S/D = 1.0, P/D = 0.465 psi/ft,
    // nu = 0.25 gives 0.535/3 + 0.465 = 0.64333 psi/ft; nu = 0.5 limit would give S/D.
    expect(eatonFractureGradient(1.0, 0.465, 0.25)).toBeCloseTo(0.643333, 6);
    expect(eatonFractureGradient(1.0, 0.465, 0)).toBeCloseTo(0.465, 12);
    expect(eatonShmin(45e6, 20e6, 0.25)).toBeCloseTo(20e6 + 25e6 / 3, 3);
    expect(() => eatonFractureGradient(1, 0.465, 0.5)).toThrow(/Poisson/);
  });

  it('should use the frictional factor 3.12 for mu 0.6', () => {
    // Zoback, Reservoir Geomechanics (2007) ch. 4: q = [sqrt(mu^2 + 1) + mu]^2 = 3.12 for mu = 0.6.
    expect(frictionalLimitFactor(0.6)).toBeCloseTo(3.12, 2);
  });
});
