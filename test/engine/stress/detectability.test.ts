import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { fractureDetectability } from '../../../src-renderer/engine/stress/detectability';

describe('fracture detectability', () => {
  it('should reproduce a hand-computed field case', () => {
    // METHODS.md "Detectability of fracture initiation" (common practice reasoning).
    // Hand computation: slope 33 MPa/m3 -> compliance c V = 1/33e6 = 3.0303e-8 m3/Pa;
    // dPmin = 3 x 20 kPa = 60 kPa; dVmin = 1.8182e-3 m3 = 1.82 L;
    // crack 0.1 mm x 1 m -> L = 1.8182e-3 / 1e-4 = 18.18 m; r = 0.108 m -> L/r = 168.4.
    const d = fractureDetectability({ loadingFit: { slope: 33e6, residualSd: 20e3 } })!;
    expect(d.minPressureDeparture).toBeCloseTo(60e3, 6);
    expect(d.compliance).toBeCloseTo(3.0303e-8, 11);
    expect(d.minDetectableVolume).toBeCloseTo(1.8182e-3, 7);
    expect(d.impliedFractureLength).toBeCloseTo(18.18, 2);
    expect(d.lengthToRadius).toBeCloseTo(168.35, 1);
    expect(d.kirschApplies).toBe(false);
    expect(d.message).toContain('could not see a fracture smaller than 1.82 L');
    expect(d.message).toContain('where the Kirsch relations no longer hold');
  });

  it('should use the gauge resolution when it exceeds three residual SDs, and the stated geometry', () => {
    // 1 psi = 6894.757 Pa (NIST SP 811). 3 x 1 kPa < 6894.757 Pa, so dPmin = 6894.757 Pa.
    // Hole 0.3112 m (12.25 in) -> r = 0.1556 m; open hole 5 m -> h = 5 m.
    // dV = 6894.757 / 20e6 = 3.4474e-4 m3; L = 3.4474e-4 / (1e-4 x 5) = 0.6895 m; L/r = 4.431.
    const d = fractureDetectability({ loadingFit: { slope: 20e6, residualSd: 1e3 }, gaugeResolution: 6894.757, holeDiameter: 0.3112, openHoleLength: 5 })!;
    expect(d.minPressureDeparture).toBeCloseTo(6894.757, 3);
    expect(d.assumedHeight).toBe(5);
    expect(d.wellboreRadius).toBeCloseTo(0.1556, 6);
    expect(d.impliedFractureLength).toBeCloseTo(0.6895, 3);
    expect(d.lengthToRadius).toBeCloseTo(4.431, 2);
  });

  it('should say Kirsch applies for a very stiff small system', () => {
    // A laboratory-sized interval: slope 1e13 Pa/m3, SD 10 kPa -> dV = 3e-9 m3, L = 3e-5 m, L/r = 2.8e-4.
    const d = fractureDetectability({ loadingFit: { slope: 1e13, residualSd: 1e4 } })!;
    expect(d.impliedFractureLength).toBeCloseTo(3e-5, 10);
    expect(d.kirschApplies).toBe(true);
    expect(d.message).toContain('the Kirsch relations can apply');
  });

  it('should return null for a loading slope that is not positive', () => {
    expect(fractureDetectability({ loadingFit: { slope: 0, residualSd: 1e3 } })).toBeNull();
    expect(fractureDetectability({ loadingFit: { slope: 1e7, residualSd: 0 } })).toBeNull();
  });

  it('should reject a non-positive geometry', () => {
    expect(() => fractureDetectability({ loadingFit: { slope: 1e7, residualSd: 1e3 }, aperture: 0 })).toThrow(EngineError);
  });
});
