import { describe, expect, it } from 'vitest';
import {
  COMPONENT_COMPRESSIBILITY,
  expectedLoadingSlope,
  mudBaseFluid,
  mudCompressibility,
  systemVolumeFromGeometry,
} from '../../../src-renderer/engine/analysis/stiffness';
import type { TestMetadata } from '../../../src-renderer/engine/record';
import { EngineError } from '../../../src-renderer/engine/errors';

const meta = (m: Record<string, unknown>) => m as unknown as TestMetadata;
// NIST SP 811 App. B.8: 1 psi = 6.894 757 E+03 Pa (reference/units/nist_sp811_factors.csv).
const PSI = 6894.757;

describe('system stiffness', () => {
  it('should convert the component compressibilities of METHODS.md to 1/Pa', () => {
    // METHODS.md (Bourgoyne et al. 1986 ch. 3, from memory): water 3.0e-6/psi = 4.35e-10/Pa,
    // oil 5.0e-6/psi, solids 0.2e-6/psi; psi factor from NIST SP 811.
    expect(COMPONENT_COMPRESSIBILITY.water).toBeCloseTo(3.0e-6 / PSI, 16);
    expect(COMPONENT_COMPRESSIBILITY.water / 4.35e-10).toBeCloseTo(1, 2);
    expect(COMPONENT_COMPRESSIBILITY.oil / (5.0e-6 / PSI)).toBeCloseTo(1, 6);
    expect(COMPONENT_COMPRESSIBILITY.solids / (0.2e-6 / PSI)).toBeCloseTo(1, 6);
  });

  it('should mix compressibilities by volume fraction', () => {
    // Hand computation: 0.6 x 5.0e-6 + 0.3 x 3.0e-6 + 0.1 x 0.2e-6 = 3.92e-6 /psi.
    expect(mudCompressibility('OBM', { oil: 0.6, water: 0.3, solids: 0.1 }) * PSI).toBeCloseTo(3.92e-6, 10);
    // Defaults: water-based (and unrecognised) -> water, oil-based -> oil.
    expect(mudCompressibility()).toBe(COMPONENT_COMPRESSIBILITY.water);
    expect(mudCompressibility('Water-based KCl polymer')).toBe(COMPONENT_COMPRESSIBILITY.water);
    expect(mudCompressibility('synthetic-based')).toBe(COMPONENT_COMPRESSIBILITY.oil);
    expect(mudBaseFluid('OBM')).toBe('oil');
    expect(mudBaseFluid('non-aqueous (NAF)')).toBe('oil');
    expect(mudBaseFluid('sea water')).toBe('water');
    expect(mudBaseFluid('unknown stuff')).toBeNull();
  });

  it('should reject fractions that do not sum to one', () => {
    expect(() => mudCompressibility('WBM', { water: 0.5, solids: 0.1 })).toThrow(EngineError);
    expect(() => mudCompressibility('WBM', { water: 1.2 })).toThrow(/outside 0..1/);
  });

  it('should compute the volume from casing and open hole geometry', () => {
    // Hand computation: 9-5/8 in casing, ID 8.681 in = 0.2204974 m, shoe at 2000 m MD:
    // pi/4 x 0.2204974^2 x 2000 = 76.3707 m3; 8-1/2 in hole (0.2159 m), 10 m below the shoe:
    // pi/4 x 0.2159^2 x 10 = 0.36610 m3; surface lines 0.5 m3. Total 77.2368 m3.
    const m = meta({ casingInnerDiameter: 8.681 * 0.0254, casingShoeMd: 2000, holeDiameter: 0.2159, depthMd: 2010, surfaceLineVolume: 0.5 });
    expect(systemVolumeFromGeometry(m)).toBeCloseTo(76.3707 + 0.3661 + 0.5, 3);
    // openHoleLength wins over depthMd - shoe.
    expect(systemVolumeFromGeometry({ ...m, openHoleLength: 0 } as TestMetadata)).toBeCloseTo(76.3707 + 0.5, 3);
    // Missing shoe depth, or open hole without a diameter: cannot say.
    expect(systemVolumeFromGeometry(meta({ casingInnerDiameter: 0.22 }))).toBeNull();
    expect(systemVolumeFromGeometry(meta({ casingInnerDiameter: 0.22, casingShoeMd: 1000, openHoleLength: 5 }))).toBeNull();
    expect(() => systemVolumeFromGeometry(meta({ casingInnerDiameter: -1, casingShoeMd: 1000 }))).toThrow(EngineError);
  });

  it('should give the expected loading slope 1/(cV)', () => {
    // Hand computation: 50 m3 of water, c = 3.0e-6/psi = 4.3511e-10/Pa:
    // 1/(4.3511e-10 x 50) = 4.5966e7 Pa/m3 = 6666.7 psi/m3 (= 1/(3e-6 x 50) psi/m3 exactly).
    const given = expectedLoadingSlope(meta({ systemVolume: 50 }));
    expect(given?.source).toBe('given');
    expect((given?.slope ?? 0) / PSI / (1 / (3e-6 * 50))).toBeCloseTo(1, 6);
    // Given compressibility wins over the mud type.
    const stated = expectedLoadingSlope(meta({ systemVolume: 10, compressibility: 5e-10, mudType: 'OBM' }));
    expect(stated?.slope).toBeCloseTo(1 / (5e-10 * 10), 0);
    // From geometry, oil-based: 1/(7.2519e-10 x 76.3707).
    const geometry = expectedLoadingSlope(meta({ casingInnerDiameter: 8.681 * 0.0254, casingShoeMd: 2000, mudType: 'oil-based' }));
    expect(geometry?.source).toBe('geometry');
    expect(geometry?.volume).toBeCloseTo(76.3707, 3);
    expect((geometry?.slope ?? 0) / (1 / ((5e-6 / PSI) * 76.3707))).toBeCloseTo(1, 5);
    expect(expectedLoadingSlope(meta({ mudType: 'WBM' }))).toBeNull();
    expect(() => expectedLoadingSlope(meta({ systemVolume: 10, compressibility: 0 }))).toThrow(EngineError);
  });
});
