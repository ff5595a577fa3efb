import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import {
  breakdownPressureNonPenetrating, breakdownPressurePenetrating, kirschMinimumHoopStress,
  poroelasticCoefficient, reopeningPressure, shmaxFromReopening, tensileStrengthFromPicks,
} from '../../../src-renderer/engine/stress/kirsch';

describe('Kirsch hoop stress', () => {
  it('should give 3 Shmin - SHmax - 2 Pp - dP on hand-worked numbers', () => {
    // Zoback 2007 ch. 6: sigma_tt,min = 3 Shmin - SHmax - 2 Pp - dP - sigma_dT, dP = Pw - Pp.
    // Shmin 30, SHmax 40, Pp 20, Pw 25 MPa: 90 - 40 - 40 - 5 = 5 MPa.
    expect(kirschMinimumHoopStress({ shmin: 30e6, shmax: 40e6, porePressure: 20e6, wellPressure: 25e6 })).toBeCloseTo(5e6, 0);
    // Cooling by 2 MPa of thermal stress lowers it by 2 MPa.
    expect(kirschMinimumHoopStress({ shmin: 30e6, shmax: 40e6, porePressure: 20e6, wellPressure: 25e6, thermalStress: 2e6 })).toBeCloseTo(3e6, 0);
  });

  it('should reach -T0 exactly at the Hubbert-Willis breakdown pressure', () => {
    // Hubbert & Willis (1957): breakdown when the hoop stress reaches -T0; the two relations must agree.
    const s = { shmin: 34e6, shmax: 47.2e6, porePressure: 20e6 };
    const pb = breakdownPressureNonPenetrating({ ...s, tensileStrength: 4e6 });
    expect(kirschMinimumHoopStress({ ...s, wellPressure: pb })).toBeCloseTo(-4e6, 3);
  });
});

describe('breakdown and reopening relations', () => {
  it('should compute Hubbert-Willis breakdown on hand-worked numbers', () => {
    // Pb = 3 Shmin - SHmax - Pp + T0 (Hubbert & Willis 1957): 90 - 40 - 20 + 5 = 35 MPa.
    expect(breakdownPressureNonPenetrating({ shmin: 30e6, shmax: 40e6, porePressure: 20e6, tensileStrength: 5e6 })).toBeCloseTo(35e6, 0);
  });

  it('should invert the Bredehoeft reopening relation for SHmax and T0', () => {
    // Bredehoeft et al. (1976): Pr = 3 Shmin - SHmax - Pp; SHmax = 3 Shmin - Pr - Pp; T0 = Pb - Pr.
    // Hand-worked: Shmin 34, Pr 34.8, Pp 20 MPa -> SHmax = 102 - 34.8 - 20 = 47.2 MPa.
    expect(shmaxFromReopening({ shmin: 34e6, reopening: 34.8e6, porePressure: 20e6 })).toBeCloseTo(47.2e6, 0);
    expect(reopeningPressure({ shmin: 34e6, shmax: 47.2e6, porePressure: 20e6 })).toBeCloseTo(34.8e6, 0);
    // Pb 38.8, Pr 34.8 -> T0 = 4 MPa.
    expect(tensileStrengthFromPicks(38.8e6, 34.8e6)).toBeCloseTo(4e6, 0);
  });

  it('should equal the reopening pressure when T0 is zero', () => {
    const s = { shmin: 30e6, shmax: 40e6, porePressure: 20e6 };
    expect(breakdownPressureNonPenetrating({ ...s, tensileStrength: 0 })).toBe(reopeningPressure(s));
  });

  it('should compute the penetrating-fluid breakdown on hand-worked numbers', () => {
    // Haimson & Fairhurst (1967) form as written in METHODS.md (from memory):
    // eta = alpha (1 - 2 nu) / (2 (1 - nu)); alpha 1, nu 0.25 -> eta = 0.5/1.5 = 1/3.
    expect(poroelasticCoefficient(1, 0.25)).toBeCloseTo(1 / 3, 12);
    // Pb = (3 x 30 - 40 + 5 - 2/3 x 20) / (2 x 2/3) = 41.667/1.3333 = 31.25 MPa.
    expect(breakdownPressurePenetrating({ shmin: 30e6, shmax: 40e6, porePressure: 20e6, tensileStrength: 5e6, biotCoefficient: 1, poissonRatio: 0.25 })).toBeCloseTo(31.25e6, 0);
    // alpha 0 -> eta 0 -> Pb = (90 - 40 + 5)/2 = 27.5 MPa.
    expect(breakdownPressurePenetrating({ shmin: 30e6, shmax: 40e6, porePressure: 20e6, tensileStrength: 5e6, biotCoefficient: 0 })).toBeCloseTo(27.5e6, 0);
  });

  it('should reject a negative tensile strength and non-finite input', () => {
    expect(() => breakdownPressureNonPenetrating({ shmin: 30e6, shmax: 40e6, porePressure: 20e6, tensileStrength: -1 })).toThrow(EngineError);
    expect(() => shmaxFromReopening({ shmin: Number.NaN, reopening: 1, porePressure: 1 })).toThrow(EngineError);
    expect(() => poroelasticCoefficient(1, 0.5)).toThrow(EngineError);
  });
});
