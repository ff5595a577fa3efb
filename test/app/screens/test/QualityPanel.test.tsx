import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { CriterionResult } from '../../../../src-renderer/engine/result';
import { criterionCells, QualityPanel } from '../../../../src-renderer/app/screens/test/QualityPanel';
import { analyzeRecord } from '../../../../src-renderer/engine/analyze';
import { generateSyntheticTest } from '../../../../src-renderer/engine/synthetic/generate';

const base = { id: 'x', pass: true, message: '', severity: 'major' as const };
const row = (c: Partial<CriterionResult>): CriterionResult => ({ ...base, value: null, limit: null, ...c });

describe('criterionCells', () => {
  it('should show shares of a whole as percentages with one decimal', () => {
    expect(criterionCells(row({ value: 0.0234, limit: 0.05, unit: 'fraction' }), {})).toEqual({ value: '2.3', limit: '5.0', unit: '%' });
  });

  it('should show R2 to 4 decimals and ratios to 2', () => {
    expect(criterionCells(row({ value: 0.998765, limit: 0.995, unit: 'r2' }), {})).toEqual({ value: 'R²\u00a00.9988', limit: 'R²\u00a00.9950', unit: '' });
    expect(criterionCells(row({ value: 0.8349, limit: 0.5, unit: 'ratio' }), {})).toEqual({ value: '0.83', limit: '0.50', unit: '×' });
  });

  it('should show a pressure decline in kPa/min', () => {
    // 1 kPa/min = 1000 Pa / 60 s (NIST SP 811: kilo = 1e3, minute = 60 s).
    expect(criterionCells(row({ value: 2e3 / 60, limit: 5e3 / 60, unit: 'Pa/s' }), {})).toEqual({ value: '2.0', limit: '5.0', unit: 'kPa/min' });
  });

  it('should show times in seconds with three significant digits', () => {
    expect(criterionCells(row({ value: 0.0166667 * 60, limit: 1, unit: 's' }), {})).toEqual({ value: '1', limit: '1', unit: 's' });
    expect(criterionCells(row({ value: 0.25, limit: 1, unit: 's' }), {})).toEqual({ value: '0.25', limit: '1', unit: 's' });
  });

  it('should show a dash for a criterion that cannot be judged, keeping the limit', () => {
    expect(criterionCells(row({ pass: null, value: null, limit: 5e3 / 60, unit: 'Pa/s' }), {})).toEqual({ value: '–', limit: '5.0', unit: 'kPa/min' });
  });
});

describe('QualityPanel', () => {
  it('should show every criterion of a synthetic XLOT with the unit the engine gives', () => {
    // A synthetic Harrow Flats XLOT (Cobalt Ridge Test Services) whose truth is set here.
    const { record } = generateSyntheticTest({ type: 'xlot', seed: 5, depthTvd: 2100, shmin: 1e6 + 16_500 * 2100, metadata: { well: 'HF-6', field: 'Harrow Flats', contractor: 'Cobalt Ridge Test Services' } });
    const quality = analyzeRecord(record, {}).quality;
    for (const c of quality.criteria) expect(c.unit, c.id).toBeDefined();
    const html = renderToStaticMarkup(<QualityPanel quality={quality} limits={{}} />);
    const shutIn = quality.criteria.find((c) => c.id === 'shut-in-stability')!;
    expect(html).toContain('kPa/min');
    expect(html).toContain(`${(shutIn.limit! * 60 / 1000).toFixed(1)}<span class="hint">\u00a0kPa/min</span>`);
    expect(html).toMatch(/R²\u00a0[01]\.\d{4}/);
    expect(html).toContain('\u00a0%</span>');
  });
});
