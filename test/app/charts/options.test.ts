import { describe, expect, it } from 'vitest';
import { analyzeRecord } from '../../../src-renderer/engine/analyze';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import type { CycleAnalysis } from '../../../src-renderer/engine/result';
import {
  cyclesOverlayOption, indexRange, onlyNoiseBelowZero, parsePickKey, pickKey, placedPicks, stepRateChartOption, timeChartOption, volumeChartOption,
} from '../../../src-renderer/app/charts/options';
import { PICK_STYLE } from '../../../src-renderer/app/charts/style';

// Synthetic XLOT whose truth is set here (Harrow Flats, invented): Shmin 30 MPa at 1850 m TVD.
const { record, truth } = generateSyntheticTest({ type: 'xlot', depthTvd: 1850, shmin: 30e6, cycles: 2, seed: 4 });
const analysis = analyzeRecord(record);

type Series = { id: string; type: string; data: unknown[]; symbol?: string; symbolRotate?: number; yAxisIndex?: number };
const seriesOf = (o: unknown) => (o as { series: Series[] }).series;

describe('chart options', () => {
  it('should draw pressure and rate on two axes in the chosen units, thinned to the target', () => {
    const option = timeChartOption({
      time: record.time, gaugePressure: record.pressure, downholePressure: analysis.downholePressure, rate: record.rate,
      picks: placedPicks(analysis), units: 'oilfield', target: 500, range: null, showGauge: false,
    });
    const yAxes = (option as { yAxis: { name: string }[] }).yAxis;
    expect(yAxes[0].name).toBe('Pressure (psi)');
    expect(yAxes[1].name).toBe('Rate (bbl/min)');
    const downhole = seriesOf(option).find((s) => s.id === 'downhole')!;
    expect(downhole.data.length).toBeLessThanOrEqual(500);
    // NIST SP 811 Appendix B.8: 1 psi = 6894.757 Pa. The peak drawn equals the record's peak in psi
    // (decimation keeps extremes).
    const peakDrawn = Math.max(...(downhole.data as [number, number][]).map((p) => p[1]));
    const peakTrue = Math.max(...analysis.downholePressure) / 6894.757293168;
    expect(peakDrawn).toBeCloseTo(peakTrue, 6);
    const rate = seriesOf(option).find((s) => s.id === 'rate')!;
    expect(rate.yAxisIndex).toBe(1);
  });

  it('should start the pressure axis at zero when the only values below zero are gauge noise', () => {
    // Synthetic series whose truth is set here: a surface gauge reads about -0.003 MPa at rest (noise),
    // against a 13 MPa peak; a record that truly goes 20 % below zero keeps its negative axis.
    expect(onlyNoiseBelowZero([Float64Array.from([-3e3, 0, 13e6])])).toBe(true);
    expect(onlyNoiseBelowZero([Float64Array.from([0, 13e6]), Float64Array.from([-1e3, 5e6])])).toBe(true);
    expect(onlyNoiseBelowZero([Float64Array.from([-2.6e6, 13e6])])).toBe(false);
    expect(onlyNoiseBelowZero([Float64Array.from([1e6, 13e6])])).toBe(false);
  });

  it('should give every pick kind its own marker shape, at the pick position', () => {
    const picks = placedPicks(analysis);
    expect(picks.length).toBeGreaterThan(3);
    const option = timeChartOption({
      time: record.time, gaugePressure: record.pressure, downholePressure: analysis.downholePressure, rate: record.rate,
      picks, units: 'si', target: 800, range: null, showGauge: true,
    });
    const pickSeries = seriesOf(option).filter((s) => s.id.startsWith('pick-'));
    // Shape is symbol and rotation (breakdown and reopening are triangles pointing up and down).
    const symbols = pickSeries.map((s) => `${s.symbol}@${s.symbolRotate ?? 0}`);
    expect(new Set(symbols).size).toBe(symbols.length);
    for (const s of pickSeries) {
      const kind = s.id.slice(5) as keyof typeof PICK_STYLE;
      expect(s.symbol).toBe(PICK_STYLE[kind].symbol);
      for (const d of s.data as { name: string; value: [number, number] }[]) {
        const key = parsePickKey(d.name)!;
        const pick = picks.find((p) => p.cycle === key.cycle && p.kind === key.kind)!.pick;
        expect(d.value[0]).toBeCloseTo(pick.time / 60, 9); // minutes
        expect(d.value[1]).toBeCloseTo(pick.pressure / 1e6, 9); // MPa
      }
    }
  });

  it('should draw only the zoomed window but keep the full time axis', () => {
    const n = record.time.length;
    const t0 = record.time[Math.floor(n / 3)];
    const t1 = record.time[Math.floor(n / 2)];
    const option = timeChartOption({
      time: record.time, gaugePressure: record.pressure, downholePressure: analysis.downholePressure, rate: record.rate,
      picks: [], units: 'si', target: 10_000, range: [t0, t1], showGauge: false,
    });
    const xs = (seriesOf(option).find((s) => s.id === 'downhole')!.data as [number, number][]).map((p) => p[0]);
    expect(Math.min(...xs)).toBeLessThanOrEqual(t0 / 60);
    expect(Math.max(...xs)).toBeGreaterThanOrEqual(t1 / 60);
    expect(xs.length).toBeLessThan(n);
    const axis = (option as { xAxis: { min: number; max: number } }).xAxis;
    expect(axis.max).toBeGreaterThanOrEqual(record.time[n - 1] / 60);
    expect(axis.max).toBeLessThan(record.time[n - 1] / 60 * 1.5);
  });

  it('should draw the fitted loading line through its own intercept and slope', () => {
    const option = volumeChartOption({ time: record.time, volume: record.volume, downholePressure: analysis.downholePressure, cycles: analysis.cycles, units: 'si', target: 800 });
    const c1 = analysis.cycles[0];
    const fit = c1.loadingFit!;
    const line = seriesOf(option).find((s) => s.id === 'fit-1')!.data as [number, number][];
    // Display: MPa against m3. The line starts at the intercept (zero volume pumped).
    expect(line[0][0]).toBe(0);
    expect(line[0][1]).toBeCloseTo(fit.intercept / 1e6, 9);
    expect(line[1][1]).toBeCloseTo((fit.intercept + fit.slope * line[1][0]) / 1e6, 9);
    // The synthetic record was built with a known stiffness (truth.loadingSlope, Pa/m3).
    expect(fit.slope).toBeGreaterThan(0.8 * truth.loadingSlope);
    expect(fit.slope).toBeLessThan(1.2 * truth.loadingSlope);
  });

  it('should overlay every cycle from its own start', () => {
    const option = cyclesOverlayOption({ time: record.time, downholePressure: analysis.downholePressure, cycles: analysis.cycles, units: 'si', target: 400 });
    const series = seriesOf(option);
    expect(series).toHaveLength(analysis.cycles.length);
    for (const s of series) expect((s.data as [number, number][])[0][0]).toBe(0);
  });

  it('should draw the step-rate lines and their intersection at the extension pressure', () => {
    const srt = generateSyntheticTest({ type: 'srt', depthTvd: 2100, shmin: 33e6, seed: 9 });
    const a = analyzeRecord(srt.record);
    const cycle = a.cycles.find((c: CycleAnalysis) => c.stepRate && c.stepRate.steps.length > 0);
    expect(cycle).toBeDefined();
    const option = stepRateChartOption({ cycle: cycle!, units: 'si' })!;
    const sr = cycle!.stepRate!;
    const ext = seriesOf(option).find((s) => s.id === 'pick-extension');
    if (sr.extension) {
      // Intersection of the two lines: q* = (a2 - a1)/(b1 - b2), P* = a1 + b1 q* (METHODS.md, EPA Region 8 1999).
      const m = sr.matrixLine!;
      const f = sr.fractureLine!;
      const q = (f.intercept - m.intercept) / (m.slope - f.slope);
      const value = (ext!.data[0] as { value: [number, number] }).value;
      expect(value[0]).toBeCloseTo(q * 60, 6); // m3/min
      expect(value[1]).toBeCloseTo((m.intercept + m.slope * q) / 1e6, 6); // MPa
    }
    expect(seriesOf(option).find((s) => s.id === 'steps')!.data).toHaveLength(sr.steps.length);
  });

  it('should find index ranges by binary search and round-trip pick keys', () => {
    const x = [0, 1, 2, 3, 4, 5];
    expect(indexRange(x, 2, 3)).toEqual([1, 4]);
    expect(indexRange(x, -5, 100)).toEqual([0, 5]);
    expect(parsePickKey(pickKey(3, 'closure'))).toEqual({ cycle: 3, kind: 'closure' });
    expect(parsePickKey('nonsense')).toBeNull();
  });
});

describe('axis ends', () => {
  it('should round axis ends to readable values', async () => {
    const { niceCeil, niceFloor, tickLabel } = await import('../../../src-renderer/app/charts/options');
    expect(niceCeil(849)).toBe(850);
    expect(niceCeil(76.1)).toBe(80);
    expect(niceCeil(50)).toBe(50);
    expect(niceFloor(0)).toBe(0);
    expect(niceFloor(0.4)).toBe(0);
    expect(niceFloor(123)).toBe(100);
    expect(tickLabel(76.11666666)).toBe('76.1');
    expect(tickLabel(0.00123)).toBe('0.0012');
  });
});
