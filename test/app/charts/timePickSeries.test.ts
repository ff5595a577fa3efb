import { describe, expect, it } from 'vitest';
import { analyzeRecord } from '../../../src-renderer/engine/analyze';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import { placedPicks, timeChartOption, timeChartPickSeries } from '../../../src-renderer/app/charts/options';

// Synthetic XLOT whose truth is set here (Harrow Flats, invented): Shmin 30 MPa at 1850 m TVD.
const { record } = generateSyntheticTest({ type: 'xlot', depthTvd: 1850, shmin: 30e6, cycles: 2, seed: 4 });
const analysis = analyzeRecord(record);

type Series = { id: string; data: { name: string; value: [number, number] }[] };

describe('timeChartPickSeries', () => {
  it('should give the same pick markers as the pressure-time chart built with the picks', () => {
    const picks = placedPicks(analysis);
    const whole = (timeChartOption({
      time: record.time, gaugePressure: record.pressure, downholePressure: analysis.downholePressure, rate: record.rate,
      picks, units: 'oilfield', target: 800, range: null, showGauge: false,
    }) as { series: Series[] }).series.filter((s) => s.id.startsWith('pick-'));
    const alone = timeChartPickSeries(picks, 'oilfield') as unknown as Series[];
    expect(alone.map((s) => s.id)).toEqual(whole.map((s) => s.id));
    expect(alone.map((s) => s.data)).toEqual(whole.map((s) => s.data));
    // Positions in display units: minutes and psi (NIST SP 811 Appendix B.8: 1 psi = 6894.757 Pa).
    const first = picks[0];
    const drawn = alone.flatMap((s) => s.data).find((d) => d.name === `${first.cycle}:${first.kind}`)!;
    expect(drawn.value[0]).toBeCloseTo(first.pick.time / 60, 9);
    expect(drawn.value[1]).toBeCloseTo(first.pick.pressure / 6894.757293168, 6);
  });

  it('should give no series without picks', () => {
    expect(timeChartPickSeries([], 'si')).toEqual([]);
  });
});
