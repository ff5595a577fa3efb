import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import {
  DEFAULT_HYDROSTATIC_GRADIENT,
  porePressureAt,
  porePressureFromGradient,
  porePressureFromMeasurements,
} from '../../../src-renderer/engine/model/pore-pressure';

describe('pore-pressure', () => {
  it('should use a hydrostatic 10.0 kPa/m from the datum by default', () => {
    // Common practice hydrostatic gradient of formation brine, about 10 kPa/m (METHODS.md gives 0.465 psi/ft = 10.52 kPa/m).
    expect(DEFAULT_HYDROSTATIC_GRADIENT).toBe(10_000);
    const p = porePressureFromGradient(undefined, 25);
    expect(porePressureAt(p, 10)).toBe(0);
    expect(porePressureAt(p, 1025)).toBeCloseTo(10e6, 6);
  });

  it('should join measurements with straight lines and extend below with the gradient', () => {
    const p = porePressureFromMeasurements([{ tvd: 2000, pressure: 25e6 }, { tvd: 1000, pressure: 10e6 }], { datum: 0 });
    expect(porePressureAt(p, 500)).toBeCloseTo(5e6, 6);
    expect(porePressureAt(p, 1500)).toBeCloseTo(17.5e6, 6);
    expect(porePressureAt(p, 2500)).toBeCloseTo(25e6 + 10_000 * 500, 6);
    expect(p.provenance[0]).toMatch(/2 measurements/);
  });

  it('should throw typed errors for unusable measurements', () => {
    expect(() => porePressureFromMeasurements([])).toThrow(EngineError);
    expect(() => porePressureFromMeasurements([{ tvd: 100, pressure: 1e6 }, { tvd: 100, pressure: 2e6 }])).toThrow(/two pore-pressure/);
    expect(() => porePressureFromGradient(0)).toThrow(/outside/);
  });
});
