import { describe, expect, it } from 'vitest';
import { buildRegionalModel, stressTable, type ModelTestInput } from '../../../../src-renderer/engine/model/regional-model';
import {
  GRADE_SYMBOL,
  LOWER_BOUND_SYMBOL,
  depthPlotOption,
} from '../../../../src-renderer/app/screens/model/depthPlotOption';

// Synthetic Harrow Flats tests; truth Shmin = 1 MPa + 16.5 kPa/m x TVD.
function tests(): ModelTestInput[] {
  const base = [900, 1300, 1700, 2100].map((tvd, i): ModelTestInput => ({
    testId: `t${i}`, file: `hf-${i}.csv`, well: i % 2 ? 'HF-2' : 'HF-1', field: 'Harrow Flats', tvd,
    shmin: { value: 1e6 + 16_500 * tvd + (i % 2 ? 2e5 : -2e5), kind: 'estimate', from: 'closure' },
    grade: i === 3 ? 'B' : 'A', state: 'accepted', reviewer: 'A. Brandt',
  }));
  base.push({ testId: 'fit', file: 'hf-f.csv', well: 'HF-1', field: 'Harrow Flats', tvd: 1100, shmin: { value: 17e6, kind: 'lower-bound', from: 'fitMaximum' }, grade: 'B', state: 'accepted', reviewer: 'A. Brandt' });
  base.push({ testId: 'rej', file: 'hf-r.csv', well: 'HF-2', field: 'Harrow Flats', tvd: 1500, shmin: { value: 30e6, kind: 'estimate', from: 'isip' }, grade: 'A', state: 'rejected', reviewer: 'A. Brandt' });
  base.push({ testId: 'other', file: 'x.csv', well: 'X-1', field: 'Other', tvd: 1500, shmin: { value: 30e6, kind: 'estimate', from: 'isip' }, grade: 'A', state: 'accepted', reviewer: 'A. Brandt' });
  return base;
}

function pointsOf(option: ReturnType<typeof depthPlotOption>) {
  const series = (option.series as { id: string; symbol?: string; data: { name: string; value: number[] }[] }[]).filter((s) => s.id.startsWith('pick-test'));
  return series.flatMap((s) => s.data.map((d) => ({ id: d.name, x: d.value[0], y: d.value[1], symbol: s.symbol })));
}

describe('depthPlotOption', () => {
  const model = buildRegionalModel(tests(), { field: 'Harrow Flats' });
  const rows = stressTable(model, { from: 100, to: 2500, step: 100 });

  it('should draw TVD increasing downward with the model curves', () => {
    const option = depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: false });
    expect((option.yAxis as { inverse: boolean }).inverse).toBe(true);
    const ids = (option.series as { id: string }[]).map((s) => s.id);
    expect(ids).toEqual(expect.arrayContaining(['sv', 'pp', 'shmin', 'shmin-conf-low', 'shmin-pred-high', 'shmax-high']));
  });

  it('should hide rejected tests and other fields by default and show rejected ones on request', () => {
    const hidden = pointsOf(depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: false })).map((p) => p.id);
    expect(hidden).not.toContain('rej');
    expect(hidden).not.toContain('other');
    expect(hidden).toContain('fit');
    const shown = pointsOf(depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: true })).map((p) => p.id);
    expect(shown).toContain('rej');
    expect(shown).not.toContain('other');
  });

  it('should mark grade by shape and FIT values as lower-bound arrows', () => {
    const pts = pointsOf(depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: false }));
    expect(pts.find((p) => p.id === 't0')!.symbol).toBe(GRADE_SYMBOL.A);
    expect(pts.find((p) => p.id === 't3')!.symbol).toBe(GRADE_SYMBOL.B);
    expect(pts.find((p) => p.id === 'fit')!.symbol).toBe(LOWER_BOUND_SYMBOL);
  });

  it('should convert the x axis to gradient and EMW', () => {
    // EMW [ppg] = P [psi] / (0.051948 TVD [ft]) (METHODS.md; exact 4/77); psi and ft from NIST SP 811.
    const emw = pointsOf(depthPlotOption(model, rows, { mode: 'emw', units: 'oilfield', showUnaccepted: false })).find((p) => p.id === 't0')!;
    const psi = (1e6 + 16_500 * 900 - 2e5) / 6894.757293168361;
    const ft = 900 / 0.3048;
    expect(emw.y).toBeCloseTo(ft, 6);
    expect(emw.x).toBeCloseTo(psi / ((4 / 77) * ft), 9);
    const grad = pointsOf(depthPlotOption(model, rows, { mode: 'gradient', units: 'si', showUnaccepted: false })).find((p) => p.id === 't0')!;
    expect(grad.x).toBeCloseTo((1e6 + 16_500 * 900 - 2e5) / 900 / 1000, 9);
  });
});

describe('depthPlotOption reference curves', () => {
  it('should draw Breckels & van Eekelen and Eaton when asked', () => {
    const model = buildRegionalModel(tests(), { field: 'Harrow Flats' });
    const rows = stressTable(model, { from: 3048, to: 3048.5, step: 1 });
    const option = depthPlotOption(model, rows, { mode: 'pressure', units: 'oilfield', showUnaccepted: false, showReferences: true });
    const bve = (option.series as { id: string; data: number[][] }[]).find((s) => s.id === 'ref-breckels')!;
    // 10,000 ft, normally pressured under the 10 kPa/m default (below 0.465 psi/ft): 0.197 x 10000^1.145 = 7489.7 psi (SPE 10336 form).
    expect(bve.data[0][0]).toBeCloseTo(7489.73, 1);
    expect((option.series as { id: string }[]).some((s) => s.id === 'ref-eaton')).toBe(true);
  });

  it('should draw Pp measurements as points with the Pp line through each of them', async () => {
    const { porePressureFromMeasurements } = await import('../../../../src-renderer/engine/model/pore-pressure');
    // Truth set here: 10.5 MPa at 950 m and 23 MPa at 1950 m TVD (between table rows).
    const measured = buildRegionalModel(tests(), { field: 'Harrow Flats', porePressure: porePressureFromMeasurements([{ tvd: 950, pressure: 10.5e6 }, { tvd: 1950, pressure: 23e6 }]) });
    const option = depthPlotOption(measured, stressTable(measured, { from: 100, to: 2500, step: 100 }), { mode: 'pressure', units: 'si', showUnaccepted: false });
    const series = option.series as { id: string; data: ({ value: number[] } | number[])[] }[];
    const points = series.find((s) => s.id === 'pp-measurements')!.data.map((d) => (d as { value: number[] }).value);
    expect(points).toEqual([[10.5, 950], [23, 1950]]);
    const line = series.find((s) => s.id === 'pp')!.data as number[][];
    for (const [x, y] of points) expect(line.find((d) => d[1] === y)![0]).toBeCloseTo(x, 9);
    expect(pointsOf(option).map((p) => p.id)).not.toContain('pp-950');
  });
});

describe('depthPlotOption depth ranges and layout', () => {
  const model = buildRegionalModel(tests(), { field: 'Harrow Flats' });
  const rows = stressTable(model, { from: 100, to: 2500, step: 100 });

  it('should draw the trend solid over the tested TVDs and dashed no shallower than one table step above them', () => {
    // Fitted tests at 900-2100 m, table step 100 m (synthetic truth above): solid 900-2100 m, extrapolated 800-900 m and 2100-2500 m.
    const option = depthPlotOption(model, rows, { mode: 'gradient', units: 'si', showUnaccepted: false });
    const series = option.series as { id: string; data: (number | null)[][] }[];
    const depthsOf = (id: string) => series.find((s) => s.id === id)!.data.map((d) => d[1]).filter((z): z is number => z !== null);
    const trend = depthsOf('shmin');
    expect(Math.min(...trend)).toBeCloseTo(900, 6);
    expect(Math.max(...trend)).toBeCloseTo(2100, 6);
    const extrapolated = depthsOf('shmin-extrapolated');
    expect(Math.min(...extrapolated)).toBeCloseTo(800, 6);
    expect(Math.max(...extrapolated)).toBeCloseTo(2500, 6);
    for (const id of ['shmin-conf-low', 'shmin-pred-high', 'shmax-high']) expect(Math.min(...depthsOf(id))).toBeCloseTo(800, 6);
    // The trend is linear in TVD, so at 900 m its gradient is (1 MPa + 16.5 kPa/m x 900 m) / 900 m within the fit's scatter (about 17.6 kPa/m).
    const shallow = series.find((s) => s.id === 'shmin')!.data.find((d) => d[1] === 900)!;
    expect(shallow[0]!).toBeGreaterThan(17.2);
    expect(shallow[0]!).toBeLessThan(18.0);
  });

  it('should start gradient and EMW curves below the mudline and give the axis a margin', () => {
    const option = depthPlotOption(model, rows, { mode: 'emw', units: 'si', showUnaccepted: false, mudline: 350 });
    const sv = (option.series as { id: string; data: (number | null)[][] }[]).find((s) => s.id === 'sv')!;
    expect(Math.min(...sv.data.map((d) => d[1]!))).toBe(400);
    const x = option.xAxis as { name: string; min: (e: { min: number; max: number }) => number; max: (e: { min: number; max: number }) => number };
    expect(x.name).toBe('Equivalent mud weight (sg EMW)');
    // Pp at 1.02 sg must not sit on the axis edge.
    expect(x.min({ min: 1.02, max: 2.3 })).toBeLessThan(1.02);
    expect(x.max({ min: 1.02, max: 2.3 })).toBeGreaterThan(2.3);
    // The pressure view keeps the curves from the first table row.
    const pressure = depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: false, mudline: 350 });
    expect((pressure.series as { id: string; data: number[][] }[]).find((s) => s.id === 'sv')!.data[0][1]).toBe(100);
  });

  it('should lay the legend out unpaged below the plot with a readable font', () => {
    const option = depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: true });
    const legend = option.legend as { type: string; textStyle: { fontSize: number } };
    expect(legend.type).toBe('plain');
    expect(legend.textStyle.fontSize).toBeGreaterThanOrEqual(12);
    expect((option.yAxis as { name: string }).name).toBe('TVD (m)');
  });
});
