// Reference values: NIST/ITL Statistical Reference Datasets (StRD), Linear Least Squares
// Regression, Norris (certified values copied to shared/reference/strd, SOURCES.md).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import type { Grade } from '../../../src-renderer/engine/result';
import { fitShminTrend, shminTrendAt, type TrendPoint } from '../../../src-renderer/engine/model/shmin-trend';
import { studentTQuantile } from '../../../src-renderer/engine/model/student-t';
import { intervalsFromBreaks } from '../../../src-renderer/engine/model/trend-intervals';
import { referencePath } from '../../support/reference';

const STRD = referencePath('strd');

function norrisPoints(): TrendPoint[] {
  const rows = readFileSync(`${STRD}/Norris.csv`, 'utf8').trim().split(/\r?\n/).slice(1).map((l) => l.split(',').map(Number));
  return rows.map(([y, x], i) => ({ id: `n${i}`, tvd: x, shmin: y, kind: 'estimate', grade: 'A' }));
}

/** Synthetic Harrow Flats tests on Shmin = 1.0 MPa + 16.5 kPa/m x TVD with set scatter. */
function harrowPoints(grades: Grade[] = []): TrendPoint[] {
  const scatter = [0.3, -0.2, 0.1, -0.4, 0.25, -0.1, 0.05, 0.2, -0.3, 0.15];
  return scatter.map((d, i) => {
    const tvd = 800 + 200 * i;
    return { id: `hf-${i}`, tvd, shmin: 1e6 + 16_500 * tvd + d * 1e6, kind: 'estimate' as const, grade: grades[i] ?? 'A', well: `HF-${1 + (i % 3)}` };
  });
}

describe('shmin-trend', () => {
  it('should reproduce the NIST Norris certified line, its standard errors and bands with equal weights', () => {
    const certified = JSON.parse(readFileSync(`${STRD}/certified_values.json`, 'utf8')).datasets.Norris;
    const trend = fitShminTrend(norrisPoints());
    const seg = trend.segments[0];
    expect(seg.intercept).toBeCloseTo(certified.parameters[0].estimate_value, 10);
    expect(seg.gradient).toBeCloseTo(certified.parameters[1].estimate_value, 12);
    expect(seg.interceptStandardError).toBeCloseTo(certified.parameters[0].sd_value, 10);
    expect(seg.gradientStandardError).toBeCloseTo(certified.parameters[1].sd_value, 12);
    expect(seg.residualSd).toBeCloseTo(certified.residual_sd_value, 10);
    expect(seg.r2).toBeCloseTo(certified.r_squared_value, 12);
    // Confidence band of the mean line at x = 0 is +- t(0.975, 34) x SD(B0) (Draper & Smith 1998, ch. 3).
    const atZero = shminTrendAt(trend, 0)!;
    const t34 = studentTQuantile(0.975, 34);
    expect(t34).toBeCloseTo(2.032, 3); // NIST/SEMATECH t table, 34 degrees of freedom (from memory).
    expect(atZero.confidenceHigh - atZero.estimate).toBeCloseTo(t34 * certified.parameters[0].sd_value, 9);
    // Prediction band adds the residual variance: t sqrt(s^2 + SD(B0)^2).
    expect(atZero.predictionHigh - atZero.estimate).toBeCloseTo(t34 * Math.hypot(certified.residual_sd_value, certified.parameters[0].sd_value), 9);
  });

  it('should weight by grade like replicated observations', () => {
    // Weighted least squares with weight 2 equals ordinary least squares with the point
    // repeated twice (Draper & Smith 1998, ch. 9). Grades A (1) and C (0.5) give ratio 2.
    const weighted = harrowPoints(['A', 'C', 'C', 'A', 'C', 'A', 'C', 'C', 'A', 'C']);
    const replicated: TrendPoint[] = [];
    for (const p of weighted) {
      replicated.push({ ...p, grade: 'A' });
      if (p.grade === 'A') replicated.push({ ...p, id: `${p.id}-copy`, grade: 'A' });
    }
    const a = fitShminTrend(weighted).segments[0];
    const b = fitShminTrend(replicated).segments[0];
    expect(a.gradient).toBeCloseTo(b.gradient, 9);
    expect(a.intercept).toBeCloseTo(b.intercept, 3);
  });

  it('should recover a set trend, flag a gross outlier and keep it in the fit', () => {
    const pts = harrowPoints();
    pts.push({ id: 'bad', tvd: 1500, shmin: 1e6 + 16_500 * 1500 + 6e6, kind: 'estimate', grade: 'A' });
    const trend = fitShminTrend(pts);
    const bad = trend.points.find((p) => p.id === 'bad')!;
    expect(bad.role).toBe('fitted');
    expect(bad.outlier).toBe(true);
    expect(Math.abs(bad.studentisedResidual!)).toBeGreaterThan(2.5);
    expect(trend.points.filter((p) => p.outlier).map((p) => p.id)).toEqual(['bad']);
    const clean = fitShminTrend(harrowPoints()).segments[0];
    expect(clean.gradient).toBeCloseTo(16_500, -2);
    expect(clean.n).toBe(10);
  });

  it('should show FIT lower bounds without fitting them and flag a contradicted bound', () => {
    const pts = harrowPoints();
    pts.push({ id: 'fit-low', tvd: 1200, shmin: 15e6, kind: 'lower-bound', grade: 'B' });
    pts.push({ id: 'fit-high', tvd: 1200, shmin: 30e6, kind: 'lower-bound', grade: 'B' });
    const trend = fitShminTrend(pts);
    expect(trend.segments[0].n).toBe(10);
    const low = trend.points.find((p) => p.id === 'fit-low')!;
    const high = trend.points.find((p) => p.id === 'fit-high')!;
    expect(low.role).toBe('lower-bound');
    expect(low.boundViolated).toBe(false);
    expect(high.boundViolated).toBe(true);
  });

  it('should fit one line per depth interval and leave uncovered depths without a trend', () => {
    const pts = harrowPoints();
    const trend = fitShminTrend(pts, { shape: { kind: 'intervals', intervals: [{ name: 'upper', top: 0, base: 1700 }, { name: 'lower', top: 1700, base: 3000 }] } });
    expect(trend.segments.map((s) => [s.name, s.n])).toEqual([['upper', 5], ['lower', 5]]);
    expect(shminTrendAt(trend, 1000)!.segment).toBe('upper');
    expect(shminTrendAt(trend, 2000)!.segment).toBe('lower');
    expect(shminTrendAt(trend, 3500)).toBeNull();
  });

  it('should assign tests to intervals by formation name when asked', () => {
    const pts = harrowPoints().map((p) => ({ ...p, formation: p.tvd < 1700 ? 'Upper Harrow Shale' : 'Lower Harrow Sand' }));
    pts.push({ id: 'nowhere', tvd: 1000, shmin: 17e6, kind: 'estimate', grade: 'A', formation: 'Unknown' });
    const trend = fitShminTrend(pts, { shape: { kind: 'intervals', assignBy: 'formation', intervals: [
      { name: 'Upper Harrow Shale', top: 0, base: 1700 }, { name: 'Lower Harrow Sand', top: 1700, base: 4000 },
    ] } });
    expect(trend.segments.map((s) => s.n)).toEqual([5, 5]);
    expect(trend.points.find((p) => p.id === 'nowhere')!.reason).toMatch(/not one of the chosen intervals/);
  });

  it('should throw typed errors for repeated ids and unusable values', () => {
    const pts = harrowPoints();
    expect(() => fitShminTrend([...pts, pts[0]])).toThrow(/appears twice/);
    expect(() => fitShminTrend([{ ...pts[0], tvd: -5 }])).toThrow(EngineError);
    expect(() => fitShminTrend(pts, { confidence: 1.5 })).toThrow(/band level/);
  });

  it('should fit no line from too few tests and say why', () => {
    const trend = fitShminTrend(harrowPoints().slice(0, 2));
    expect(trend.segments).toEqual([]);
    expect(trend.provenance.join(' ')).toMatch(/needs three tests/);
    expect(shminTrendAt(trend, 1000)).toBeNull();
  });
});

describe('trend-intervals', () => {
  it('should split depth at the breaks, shallowest first', () => {
    expect(intervalsFromBreaks([2500, 1500, 1500])).toEqual([
      { name: '0-1500 m', top: 0, base: 1500 },
      { name: '1500-2500 m', top: 1500, base: 2500 },
      { name: '2500 m and deeper', top: 2500, base: Infinity },
    ]);
    expect(intervalsFromBreaks([])).toEqual([{ name: 'all depths', top: 0, base: Infinity }]);
    expect(() => intervalsFromBreaks([-1])).toThrow(EngineError);
  });
});
