import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { TestSummary } from '../../../../src-renderer/archive/api';
import { depthPlotOption } from '../../../../src-renderer/app/screens/model/depthPlotOption';
import { modelInputFromSummary, testsHaveFormations, trendOptionsForChoice } from '../../../../src-renderer/app/screens/model/modelInputs';
import { StressModelScreen } from '../../../../src-renderer/app/screens/model/StressModelScreen';
import { buildRegionalModel, stressTable, type ModelTestInput } from '../../../../src-renderer/engine/model/regional-model';

// Synthetic Harrow Flats tests with invented formations; truth set here:
// Ashgrove Shale Shmin = 1 MPa + 16.5 kPa/m x TVD, Millrace Sandstone 4 MPa + 15 kPa/m x TVD (small alternating scatter).
function harrowTests(): ModelTestInput[] {
  const shale = [700, 950, 1200, 1400].map((tvd, i): ModelTestInput => ({
    testId: `s${i}`, file: `hf-s${i}.csv`, well: i % 2 ? 'HF-2' : 'HF-1', field: 'Harrow Flats', tvd,
    shmin: { value: 1e6 + 16_500 * tvd + (i % 2 ? 1e5 : -1e5), kind: 'estimate', from: 'closure' },
    grade: 'A', state: 'accepted', reviewer: 'Idris Calloway', formation: 'Ashgrove Shale',
  }));
  const sand = [1900, 2200, 2500, 2800].map((tvd, i): ModelTestInput => ({
    testId: `m${i}`, file: `hf-m${i}.csv`, well: i % 2 ? 'HF-2' : 'HF-1', field: 'Harrow Flats', tvd,
    shmin: { value: 4e6 + 15_000 * tvd + (i % 2 ? 1e5 : -1e5), kind: 'estimate', from: 'closure' },
    grade: 'A', state: 'accepted', reviewer: 'Idris Calloway', formation: 'Millrace Sandstone',
  }));
  return [...shale, ...sand];
}

describe('trend by formation on the model screen', () => {
  it('should carry the formation of an archive summary into the model input', () => {
    const summary: TestSummary = {
      id: 't1', fieldId: 'f', fieldName: 'Harrow Flats', wellId: 'w', wellName: 'HF-3', type: 'lot', typeInferred: false,
      depthTvd: 1200, depthMd: 1216, shmin: 20.8e6, shminKind: 'estimate', grade: 'A', state: 'accepted', reviewer: 'Idris Calloway',
      lastPickAuthor: null, fileName: 'HF-3_LOT_1200m.txt', fileHash: 'h', importedAt: '2026-04-04T09:00:00Z', importedBy: 'Maren Holt',
      formation: 'Ashgrove Shale',
    };
    expect(modelInputFromSummary(summary).formation).toBe('Ashgrove Shale');
    const { formation: _omit, ...withoutFormation } = summary;
    expect('formation' in modelInputFromSummary(withoutFormation)).toBe(false);
  });

  it('should fit one line per formation, name each in the legend and in the table rows', () => {
    const tests = harrowTests();
    expect(testsHaveFormations(tests)).toBe(true);
    const { trend, notes } = trendOptionsForChoice('formation', tests, []);
    const model = buildRegionalModel(tests, { field: 'Harrow Flats', trend });
    expect(notes[0]).toMatch(/one line per formation/);
    expect(model.trend.segments.map((s) => s.name)).toEqual(['Ashgrove Shale', 'Millrace Sandstone']);
    // Truth set above: 16.5 and 15.0 kPa/m.
    expect(Math.abs(model.trend.segments[0].gradient - 16_500)).toBeLessThan(500);
    expect(Math.abs(model.trend.segments[1].gradient - 15_000)).toBeLessThan(500);
    const rows = stressTable(model, { from: 100, to: 3000, step: 100 });
    const option = depthPlotOption(model, rows, { mode: 'pressure', units: 'si', showUnaccepted: false });
    const series = option.series as { id: string; name: string; data: (number | null)[][] }[];
    const lines = series.filter((s) => s.id.startsWith('shmin-line-'));
    expect(lines.map((s) => s.name)).toEqual(['Shmin trend: Ashgrove Shale', 'Shmin trend: Millrace Sandstone']);
    expect(series.some((s) => s.id === 'shmin')).toBe(false);
    // Each line is drawn only over the rows that use it: the shale line stops where the sandstone starts.
    const drawnDepths = (s: { data: (number | null)[][] }) => s.data.filter((d) => d[0] !== null).map((d) => d[1] as number);
    expect(Math.max(...drawnDepths(lines[0]))).toBeLessThan(Math.min(...drawnDepths(lines[1])));
    expect(rows.find((r) => r.tvd === 1000)!.segment).toBe('Ashgrove Shale');
    expect(rows.find((r) => r.tvd === 2600)!.segment).toBe('Millrace Sandstone');
  });

  it('should fall back to one line when no test names its formation', () => {
    const tests = harrowTests().map(({ formation: _f, ...t }) => t);
    expect(testsHaveFormations(tests)).toBe(false);
    const { trend, notes } = trendOptionsForChoice('formation', tests, []);
    expect(trend).toBeUndefined();
    expect(notes[0]).toMatch(/No test names its formation/);
  });

  it('should offer "by formation" only when tests carry formations and show the named lines', () => {
    const render = (tests: ModelTestInput[], initialTrend?: 'one' | 'breaks' | 'formation') => renderToStaticMarkup(
      <StressModelScreen tests={tests} units="si" appVersion="0.1.0" onOpenTest={() => undefined} saveFile={async () => null} initialTrend={initialTrend} />,
    );
    const plain = render(harrowTests().map(({ formation: _f, ...t }) => t), 'formation');
    expect(plain).toContain('data-testid="model-trend-one"');
    expect(plain).toContain('data-testid="model-trend-breaks"');
    expect(plain).not.toContain('data-testid="model-trend-formation"');
    const byFormation = render(harrowTests(), 'formation');
    expect(byFormation).toContain('data-testid="model-trend-formation"');
    expect(byFormation).toMatch(/Ashgrove Shale: Shmin = [\d.]+ MPa \+ 1[67]\.\d\d kPa\/m × TVD/);
    expect(byFormation).toMatch(/Millrace Sandstone: Shmin = [\d.]+ MPa \+ 1[45]\.\d\d kPa\/m × TVD/);
    expect(byFormation).toContain('<th>Formation</th>');
    expect(byFormation).toContain('<th>Trend line</th>');
    expect(byFormation).toContain('fitted together as &quot;unnamed&quot;');
    const oneLine = render(harrowTests());
    expect(oneLine).toMatch(/<span>Shmin = /);
    expect(oneLine).not.toContain('<th>Trend line</th>');
  });
});
