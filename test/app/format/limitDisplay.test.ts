import { describe, expect, it } from 'vitest';
import { DEFAULT_LIMITS } from '../../../src-renderer/engine/quality/limits';
import {
  formatLimit, formatLimitNumber, limitFromDisplay, limitToDisplay, limitUnitLabel, parseLimitInput,
} from '../../../src-renderer/app/format/limitDisplay';

// NIST SP 811 (2008) Appendix B.8: 1 psi = 6.894 757 E+03 Pa (exact value
// 0.45359237 kg x 9.80665 m/s2 / (0.0254 m)^2 = 6894.757293168361 Pa; reference/units/nist_sp811_factors.csv).
const PA_PER_PSI = 6894.757293168361;

describe('limit display', () => {
  it('should give every default limit a display that matches its SI unit', () => {
    // Fractions, R2, ratios and counts are dimensionless ("1"); durations are in s; the decline rate in Pa/s.
    const unitOf = { percent: '1', r2: '1', ratio: '1', count: '1', 'duration-min': 's', 'duration-s': 's', 'pressure-rate': 'Pa/s' } as const;
    for (const l of DEFAULT_LIMITS) expect(l.unit, l.key).toBe(unitOf[l.display]);
  });

  it('should show the pressure decline in kPa/min and take it back to Pa/s', () => {
    // SI definitions: 1 kPa = 1000 Pa, 1 min = 60 s, so 1 kPa/min = 1000/60 Pa/s.
    expect(limitToDisplay('pressure-rate', 'si', 5e3 / 60)).toBeCloseTo(5, 12);
    expect(limitFromDisplay('pressure-rate', 'si', 5)).toBeCloseTo(83.3333333333, 9);
    expect(limitFromDisplay('pressure-rate', 'si', 1)).toBeCloseTo(1000 / 60, 12);
    expect(limitUnitLabel('pressure-rate', 'si')).toBe('kPa/min');
  });

  it('should show the pressure decline in psi/min with the NIST SP 811 psi factor', () => {
    // 1 psi/min = 6894.757293168361 Pa / 60 s = 114.9126215528 Pa/s.
    expect(limitFromDisplay('pressure-rate', 'oilfield', 1)).toBeCloseTo(PA_PER_PSI / 60, 9);
    // 5 kPa/min = 5000 / 6894.757293168361 psi/min = 0.725189 psi/min.
    expect(limitToDisplay('pressure-rate', 'oilfield', 5e3 / 60)).toBeCloseTo(5000 / PA_PER_PSI, 9);
    expect(formatLimit('pressure-rate', 'oilfield', 5e3 / 60)).toBe('0.725\u00a0psi/min');
    expect(limitUnitLabel('pressure-rate', 'oilfield')).toBe('psi/min');
  });

  it('should round-trip every default limit through its display unit in both systems', () => {
    for (const system of ['si', 'oilfield'] as const) {
      for (const l of DEFAULT_LIMITS) {
        const back = limitFromDisplay(l.display, system, limitToDisplay(l.display, system, l.value));
        expect(back, `${l.key} ${system}`).toBeCloseTo(l.value, 10);
      }
    }
  });

  it('should show the default limits as an engineer writes them', () => {
    // Values set in engine/quality/limits.ts: 10 % CV, 5 % repeat, 95 % gauge range, 600 s = 10 min, 1 s sampling.
    const text = (key: string) => {
      const l = DEFAULT_LIMITS.find((d) => d.key === key)!;
      return formatLimit(l.display, 'si', l.value);
    };
    expect(text('rate-stability.maxCv')).toBe('10\u00a0%');
    expect(text('cycle-repeat.maxRepeatDifference')).toBe('5\u00a0%');
    expect(text('gauge-range.maxFraction')).toBe('95\u00a0%');
    expect(text('pick-agreement.maxSpreadFraction')).toBe('5\u00a0%');
    expect(text('loading-linearity.minR2')).toBe('0.9950');
    expect(text('loading-stiffness.minRatio')).toBe('0.50\u00a0×');
    expect(text('shut-in-stability.minDuration')).toBe('10\u00a0min');
    expect(text('shut-in-stability.endWindow')).toBe('2\u00a0min');
    expect(text('shut-in-stability.maxEndDeclineRate')).toBe('5\u00a0kPa/min');
    expect(text('sampling.maxInterval')).toBe('1\u00a0s');
    expect(text('sampling.minLoadingSamples')).toBe('20');
    expect(formatLimitNumber('percent', 'si', Number.NaN)).toBe('–');
  });

  it('should read typed values in the display unit back to SI', () => {
    expect(parseLimitInput('percent', 'si', '12,5')).toEqual({ ok: true, valueSI: 0.125 });
    expect(parseLimitInput('percent', 'si', '12 %')).toEqual({ ok: true, valueSI: 0.12 });
    expect(parseLimitInput('duration-min', 'si', '15')).toEqual({ ok: true, valueSI: 900 });
    expect(parseLimitInput('ratio', 'si', '1.2x')).toEqual({ ok: true, valueSI: 1.2 });
    const psi = parseLimitInput('pressure-rate', 'oilfield', '1 psi/min');
    expect(psi.ok && psi.valueSI).toBeCloseTo(PA_PER_PSI / 60, 9);
    const kpa = parseLimitInput('pressure-rate', 'si', '3');
    expect(kpa.ok && kpa.valueSI).toBeCloseTo(50, 12);
  });

  it('should refuse text that is not a number or out of range, saying why', () => {
    const refused = (r: ReturnType<typeof parseLimitInput>) => (r.ok ? null : r.message);
    expect(refused(parseLimitInput('percent', 'si', 'ten'))).toMatch(/not a number/);
    expect(refused(parseLimitInput('percent', 'si', '1.2.3'))).toMatch(/not a number/);
    expect(refused(parseLimitInput('percent', 'si', '150'))).toMatch(/between 0 and 100/);
    expect(refused(parseLimitInput('percent', 'si', '-1'))).toMatch(/between 0 and 100/);
    expect(refused(parseLimitInput('r2', 'si', '1.5'))).toMatch(/between 0 and 1/);
    expect(refused(parseLimitInput('count', 'si', '2.5'))).toMatch(/whole number/);
    expect(refused(parseLimitInput('count', 'si', '0'))).toMatch(/whole number/);
    expect(refused(parseLimitInput('duration-s', 'si', '0'))).toMatch(/above 0/);
    expect(refused(parseLimitInput('pressure-rate', 'si', '1e999'))).toMatch(/too large/);
    expect(refused(parseLimitInput('count', 'si', '   '))).toMatch(/Type a number/);
  });
});
