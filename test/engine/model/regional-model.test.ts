import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import type { Grade } from '../../../src-renderer/engine/result';
import { porePressureFromGradient } from '../../../src-renderer/engine/model/pore-pressure';
import { buildRegionalModel, stressTable, type ModelTestInput } from '../../../src-renderer/engine/model/regional-model';
import { verticalStressFromGradient } from '../../../src-renderer/engine/model/vertical-stress';

// Synthetic Harrow Flats tests (Cobalt Ridge Test Services): truth Shmin = 1 MPa + 16.5 kPa/m x TVD.
function harrowTests(): ModelTestInput[] {
  const scatter = [0.3, -0.2, 0.1, -0.4, 0.25, -0.1, 0.05, 0.2];
  const grades: Grade[] = ['A', 'B', 'A', 'B', 'A', 'C', 'A', 'B'];
  const tests: ModelTestInput[] = scatter.map((d, i) => {
    const tvd = 800 + 250 * i;
    return {
      testId: `t${i}`, file: `hf-${i}.csv`, well: `HF-${1 + (i % 2)}`, field: 'Harrow Flats', type: 'xlot',
      tvd, md: tvd + 10, shmin: { value: 1e6 + 16_500 * tvd + d * 1e6, kind: 'estimate', from: 'closure' },
      grade: grades[i], state: 'accepted', reviewer: 'R. Osei',
    };
  });
  tests.push({ testId: 'rejected', file: 'hf-r.csv', well: 'HF-1', field: 'Harrow Flats', tvd: 1500, shmin: { value: 40e6, kind: 'estimate', from: 'isip' }, grade: 'A', state: 'rejected', reviewer: 'R. Osei' });
  tests.push({ testId: 'unreviewed', file: 'hf-u.csv', well: 'HF-2', field: 'Harrow Flats', tvd: 1600, shmin: { value: 10e6, kind: 'estimate', from: 'isip' }, grade: 'A', state: 'in-review', reviewer: null });
  tests.push({ testId: 'fit', file: 'hf-f.csv', well: 'HF-1', field: 'Harrow Flats', type: 'fit', tvd: 1000, shmin: { value: 15e6, kind: 'lower-bound', from: 'fitMaximum' }, grade: 'B', state: 'accepted', reviewer: 'M. Lind' });
  tests.push({
    testId: 'reopen', file: 'hf-x.csv', well: 'HF-2', field: 'Harrow Flats', type: 'xlot', tvd: 2000,
    shmin: { value: 1e6 + 16_500 * 2000, kind: 'estimate', from: 'closure' }, grade: 'A', state: 'accepted', reviewer: 'M. Lind',
    shmaxReopening: { value: 40e6, cautions: ['The fracture must reach 0.3 m before a pick can see it.'] },
  });
  return tests;
}

describe('regional-model', () => {
  it('should fit accepted tests only and report why each other test was left out', () => {
    const model = buildRegionalModel(harrowTests());
    const by = new Map(model.tests.map((t) => [t.testId, t]));
    expect(by.get('rejected')!.used).toBe(false);
    expect(by.get('rejected')!.reason).toMatch(/not accepted/);
    expect(by.get('unreviewed')!.reason).toMatch(/in-review/);
    expect(by.get('fit')!.role).toBe('lower-bound');
    expect(by.get('fit')!.used).toBe(false);
    expect(model.trend.segments[0].n).toBe(9);
    expect(model.trend.segments[0].gradient).toBeCloseTo(16_500, -2);
    expect(model.cautions[0]).toMatch(/qualified engineer/);
  });

  it('should apply the minimum grade and, without an archive, ignore review state', () => {
    const model = buildRegionalModel(harrowTests(), { minGrade: 'B', acceptedOnly: false });
    const by = new Map(model.tests.map((t) => [t.testId, t]));
    expect(by.get('t5')!.reason).toMatch(/grade C is below the minimum B/);
    expect(by.get('rejected')!.used).toBe(true);
    expect(by.get('unreviewed')!.used).toBe(true);
    // The 10 MPa test at 1600 m sits 17 MPa below a trend of about 27 MPa: flagged, kept.
    expect(by.get('unreviewed')!.outlier).toBe(true);
    expect(model.cautions.join(' ')).toMatch(/outliers/);
  });

  it('should report the effective stress ratio per test from Sv and Pp at its depth', () => {
    const sv = verticalStressFromGradient(22_620);
    const pp = porePressureFromGradient(10_000);
    const model = buildRegionalModel(harrowTests(), { verticalStress: sv, porePressure: pp });
    const t = model.tests.find((x) => x.testId === 't0')!;
    // (Shmin - Pp)/(Sv - Pp) at 800 m: Sv = 18.096 MPa, Pp = 8 MPa, Shmin = 14.5 MPa.
    expect(t.sv).toBeCloseTo(18.096e6, 0);
    expect(t.effectiveStressRatio).toBeCloseTo((14.5e6 - 8e6) / (18.096e6 - 8e6), 9);
    expect(model.trendEffectiveStressRatio[0].ratio).toBeGreaterThan(0.5);
  });

  it('should carry reopening SHmax points with their cautions', () => {
    const model = buildRegionalModel(harrowTests());
    expect(model.reopeningPoints).toHaveLength(1);
    expect(model.reopeningPoints[0].cautions.join(' ')).toMatch(/0\.3 m/);
    expect(model.cautions.join(' ')).toMatch(/reopening relation/);
  });

  it('should sample the stress table with bands, bounds and an MD column', () => {
    const model = buildRegionalModel(harrowTests());
    const rows = stressTable(model, { from: 500, to: 2950, step: 500, well: 'HF-1', mdAtTvd: (z) => z + 10 });
    expect(rows.map((r) => r.tvd)).toEqual([500, 1000, 1500, 2000, 2500, 2950]);
    for (const r of rows) {
      expect(r.shminLow!).toBeLessThan(r.shminConfidenceLow!);
      expect(r.shminConfidenceLow!).toBeLessThan(r.shmin!);
      expect(r.shmin!).toBeLessThan(r.shminHigh!);
      expect(r.shmaxLow).toBe(r.shmin);
      expect(r.shmaxHigh!).toBeGreaterThan(r.shmaxLow!);
      expect(r.md).toBe(r.tvd + 10);
      expect(r.sv).toBeGreaterThan(r.pp);
    }
    expect(rows[0].extrapolated).toBe(true);
    expect(rows[2].extrapolated).toBe(false);
  });

  it('should throw typed errors for a bad range, step or repeated ids', () => {
    const model = buildRegionalModel(harrowTests());
    expect(() => stressTable(model, { from: 1000, to: 500, step: 10 })).toThrow(EngineError);
    expect(() => stressTable(model, { from: 0, to: 500, step: 0 })).toThrow(/step/);
    const tests = harrowTests();
    expect(() => buildRegionalModel([...tests, tests[0]])).toThrow(/appears twice/);
  });
});
