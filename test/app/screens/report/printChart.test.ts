import { describe, expect, it } from 'vitest';
import { placedPicks, timeChartOption } from '../../../../src-renderer/app/charts/options';
import { PRINT_GRID_BOTTOM, withoutZoomSlider, withZoomSlider } from '../../../../src-renderer/app/screens/report/printChart';
import { analyzeRecord } from '../../../../src-renderer/engine/analyze';
import { generateSyntheticTest } from '../../../../src-renderer/engine/synthetic/generate';

// Synthetic Harrow Flats LOT whose truth is set here.
const { record } = generateSyntheticTest({ type: 'lot', depthTvd: 1500, shmin: 25e6, seed: 2 });
const analysis = analyzeRecord(record);

describe('printed charts', () => {
  it('should hide the zoom slider and keep the rest of the chart', () => {
    const screen = timeChartOption({
      time: record.time, gaugePressure: record.pressure, downholePressure: analysis.downholePressure, rate: record.rate,
      picks: placedPicks(analysis), units: 'si', target: 600, range: null, showGauge: true,
    });
    const printed = withoutZoomSlider(screen) as { dataZoom: { type: string; show?: boolean }[]; grid: { bottom: number }; series: unknown[] };
    const slider = printed.dataZoom.find((z) => z.type === 'slider')!;
    expect(slider.show).toBe(false);
    expect(printed.dataZoom.find((z) => z.type === 'inside')!.show).toBeUndefined();
    expect(printed.grid.bottom).toBe(PRINT_GRID_BOTTOM);
    expect(printed.series).toBe((screen as { series: unknown[] }).series);
    // Back on screen the slider is switched on explicitly (a chart merges options) with the screen's margin.
    const back = withZoomSlider(printed as never, true) as { dataZoom: { type: string; show?: boolean }[]; grid: { bottom: number } };
    expect(back.dataZoom.find((z) => z.type === 'slider')!.show).toBe(true);
    expect(withZoomSlider(screen, true).grid).toEqual((screen as { grid: unknown }).grid);
    // The screen option itself is left as it was.
    expect(((screen as { dataZoom: { type: string; show?: boolean }[] }).dataZoom.find((z) => z.type === 'slider')!).show).toBeUndefined();
  });
});
