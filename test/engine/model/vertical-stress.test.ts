import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import type { DepthLog } from '../../../src-renderer/engine/record';
import {
  verticalStressAt,
  verticalStressFromDensityLog,
  verticalStressFromGradient,
} from '../../../src-renderer/engine/model/vertical-stress';
import { thrown } from '../../support/errors';

// g_n = 9.80665 m/s2 exactly (NIST SP 811, 2008, Appendix B.8).
const G = 9.80665;

function log(depth: number[], rho: number[], unit = 'g/cm3', extra: Partial<DepthLog> = {}): DepthLog {
  return {
    depth: Float64Array.from(depth),
    indexKind: 'tvd',
    curves: { RHOB: { unit, values: Float64Array.from(rho) } },
    fileName: 'harrow-flats-1-density.las',
    nullValue: -999.25,
    ...extra,
  };
}

describe('vertical-stress', () => {
  it('should give rho g z exactly for a constant density from the surface', () => {
    // Analytic: Sv = integral of rho g dz = rho g z for constant rho (hydrostatics).
    const depths = Array.from({ length: 301 }, (_, i) => i * 10);
    const profile = verticalStressFromDensityLog(log(depths, depths.map(() => 2.3)), { shallowFill: { kind: 'constant' } });
    for (const z of [0, 5, 1234.5, 3000, 3500]) expect(verticalStressAt(profile, z)).toBeCloseTo(2300 * G * z, 4);
  });

  it('should give the quadratic for a linearly increasing density', () => {
    // Analytic: rho = a + b z gives Sv = g (a z + b z^2 / 2).
    const a = 1800;
    const b = 0.25;
    const depths = Array.from({ length: 61 }, (_, i) => i * 50);
    const profile = verticalStressFromDensityLog(log(depths, depths.map((z) => a + b * z), 'kg/m3'), { shallowFill: { kind: 'constant' } });
    for (const z of [0, 75, 1010, 2999]) expect(verticalStressAt(profile, z)).toBeCloseTo(G * (a * z + (b * z * z) / 2), 3);
  });

  it('should add the sea-water column, air gap and a stated linear shallow fill', () => {
    // Offshore: 25 m air gap, 100 m water at 1025 kg/m3 (common practice), log from 500 m at
    // 2200 kg/m3; the fill runs linearly from 1700 kg/m3 at the mudline (125 m) to 2200 at 500 m.
    const depths = Array.from({ length: 51 }, (_, i) => 500 + i * 10);
    const profile = verticalStressFromDensityLog(log(depths, depths.map(() => 2.2)), {
      rigFloorElevation: 25, waterDepth: 100, shallowFill: { kind: 'linear', mudlineDensity: 1700 },
    });
    expect(verticalStressAt(profile, 25)).toBe(0);
    expect(verticalStressAt(profile, 125)).toBeCloseTo(1025 * G * 100, 6);
    const atLogTop = 1025 * G * 100 + G * 375 * (1700 + 2200) / 2;
    expect(verticalStressAt(profile, 500)).toBeCloseTo(atLogTop, 4);
    expect(verticalStressAt(profile, 900)).toBeCloseTo(atLogTop + 2200 * G * 400, 4);
    expect(profile.provenance.join(' ')).toMatch(/linearly from 1700 kg\/m3/);
  });

  it('should skip null values and bridge the gap linearly, saying so', () => {
    // Truth: constant 2.4 g/cm3; nulls between 200 and 260 m must not change the integral.
    const depths = Array.from({ length: 51 }, (_, i) => i * 10);
    const rho: number[] = depths.map((z) => (z > 200 && z < 260 ? -999.25 : 2.4));
    rho[5] = NaN;
    const profile = verticalStressFromDensityLog(log(depths, rho), { shallowFill: { kind: 'constant' } });
    expect(verticalStressAt(profile, 400)).toBeCloseTo(2400 * G * 400, 4);
    expect(profile.provenance.join(' ')).toMatch(/6 null or unusable density samples skipped/);
    expect(profile.provenance.join(' ')).toMatch(/200\.0-260\.0 m/);
  });

  it('should accept a log written from the bottom up and read an unstated unit by magnitude', () => {
    const depths = [300, 200, 100, 0];
    const profile = verticalStressFromDensityLog(log(depths, [2.1, 2.1, 2.1, 2.1], ''), { shallowFill: { kind: 'constant' } });
    expect(verticalStressAt(profile, 300)).toBeCloseTo(2100 * G * 300, 5);
    expect(profile.provenance.join(' ')).toMatch(/read as g\/cm3/);
  });

  it('should apply a stated gradient below the mudline', () => {
    // 1 psi/ft = 22.6206 kPa/m (common practice overburden gradient, METHODS.md).
    const profile = verticalStressFromGradient(22620.6, { rigFloorElevation: 30, waterDepth: 200 });
    expect(verticalStressAt(profile, 1230)).toBeCloseTo(1025 * G * 200 + 22620.6 * 1000, 3);
  });

  it('should throw typed errors for a log without density or with a wrong unit', () => {
    const noDensity: DepthLog = { ...log([0, 1], [2, 2]), curves: { GR: { unit: 'API', values: Float64Array.from([50, 60]) } } };
    expect(() => verticalStressFromDensityLog(noDensity)).toThrow(EngineError);
    const error = thrown(() => verticalStressFromDensityLog(log([0, 1], [2, 2], 'psi')));
    expect(error.code).toBe('unknown-unit');
    expect(error.location.file).toBe('harrow-flats-1-density.las');
    expect(() => verticalStressFromGradient(-1)).toThrow(/outside/);
  });
});
