import { describe, expect, it } from 'vitest';
import { downholePressure, fluidColumnPressure } from '../../../src-renderer/engine/analysis/downhole';
import { EngineError } from '../../../src-renderer/engine/errors';
import type { TestMetadata } from '../../../src-renderer/engine/record';

const meta = (m: Record<string, unknown>): TestMetadata => m as TestMetadata;

describe('downholePressure', () => {
  it('should add rho g TVD for a surface gauge (hand-computed)', () => {
    // 1250 kg/m3 x 9.80665 m/s2 (standard gravity, exact, NIST SP 811) x 2000 m = 24 516 625 Pa.
    const p = Float64Array.of(0, 1e6, 2.5e7);
    const out = downholePressure(p, meta({ gaugePosition: 'surface', depthTvd: 2000, mudDensity: 1250 }));
    expect(out.correction).toBeCloseTo(24_516_625, 6);
    expect(Array.from(out.pressure)).toEqual([24_516_625, 25_516_625, 49_516_625].map((v) => expect.closeTo(v, 6)));
    expect(out.gaugePosition).toBe('surface');
  });

  it('should match the oilfield hydrostatic rule 0.052 x ppg x ft', () => {
    // 10 ppg at 10 000 ft: 0.051948 psi/ft per ppg (METHODS.md EMW relation) x 10 x 10 000 = 5194.8 psi.
    const ppg = 0.45359237 / 0.003785411784; // kg/m3 per ppg (lb / US gal, exact definitions, NIST SP 811)
    const psi = 6894.757293168361; // Pa per psi (NIST SP 811 B.8)
    const pa = fluidColumnPressure(10 * ppg, 10_000 * 0.3048);
    expect(pa / psi).toBeCloseTo(5194.8, 0);
  });

  it('should leave a downhole gauge as recorded', () => {
    const p = Float64Array.of(3e7, 3.1e7);
    const out = downholePressure(p, meta({ gaugePosition: 'downhole' }));
    expect(out.correction).toBe(0);
    expect(Array.from(out.pressure)).toEqual([3e7, 3.1e7]);
    expect(out.pressure).not.toBe(p);
  });

  it('should treat a gauge of unknown position as surface and name what is missing', () => {
    const p = Float64Array.of(1e6);
    try {
      downholePressure(p, meta({ depthTvd: 1500 }), 'lot-a.csv');
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineError);
      expect((e as EngineError).code).toBe('bad-metadata');
      expect((e as EngineError).message).toContain('needs the mud density');
      expect((e as EngineError).message).not.toContain('needs the TVD');
      expect((e as EngineError).location.file).toBe('lot-a.csv');
    }
    expect(() => downholePressure(p, meta({ mudDensity: 1200 }))).toThrow(/TVD/);
  });

  it('should reject a non-physical density', () => {
    expect(() => fluidColumnPressure(-5, 100)).toThrow(EngineError);
    expect(() => fluidColumnPressure(1000, Number.NaN)).toThrow(EngineError);
  });
});
