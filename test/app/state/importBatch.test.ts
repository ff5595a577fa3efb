import { describe, expect, it } from 'vitest';
import type { ColumnMapping } from '../../../src-renderer/engine/record';
import {
  applySavedMapping, columnOverrides, mappingChanged, metadataOverrides, metadataText, summariseOutcomes,
} from '../../../src-renderer/app/state/importBatch';

const detected: ColumnMapping[] = [
  { index: 0, header: 'Time (min)', role: 'time', unit: 'min', unitStated: true },
  { index: 1, header: 'Pressure', role: 'pressure', unit: 'psi', unitStated: false },
  { index: 2, header: 'Q', role: 'other', unit: '', unitStated: false },
];

describe('importBatch', () => {
  it('should convert typed oilfield metadata to SI overrides', () => {
    // NIST SP 811 Appendix B.8: 1 ft = 0.3048 m (exact); 1 lb/gal = 119.8264 kg/m3.
    const { overrides, problems } = metadataOverrides({ depthTvd: '10000', mudDensity: '10,5', well: ' HF-7 ' }, 'oilfield', 'lot');
    expect(problems).toEqual([]);
    expect(overrides.depthTvd).toBeCloseTo(3048, 6);
    expect(overrides.mudDensity).toBeCloseTo(10.5 * 119.8264, 2);
    expect(overrides.well).toBe('HF-7');
    expect(overrides.testType).toBe('lot');
  });

  it('should report a depth that is not a number and leave it out', () => {
    const { overrides, problems } = metadataOverrides({ depthTvd: 'deep' }, 'si', '');
    expect(overrides.depthTvd).toBeUndefined();
    expect(problems[0]).toContain('Test depth TVD');
  });

  it('should show SI metadata in the display units', () => {
    expect(metadataText({ depthTvd: 3048 as never }, 'depthTvd', 'depth', 'oilfield')).toBe('10000');
    expect(metadataText({}, 'well', undefined, 'si')).toBe('');
  });

  it('should detect a changed mapping and apply a saved one by column index', () => {
    const confirmed = detected.map((c) => (c.index === 2 ? { ...c, role: 'rate' as const, unit: 'bbl/min' } : c));
    expect(mappingChanged(detected, detected)).toBe(false);
    expect(mappingChanged(detected, confirmed)).toBe(true);
    const applied = applySavedMapping(detected, { layout: 'x', columns: confirmed, savedBy: 'A', savedAt: '' });
    expect(applied[2]).toMatchObject({ role: 'rate', unit: 'bbl/min' });
    expect(columnOverrides(applied)[2]).toEqual({ index: 2, role: 'rate', unit: 'bbl/min' });
  });

  it('should summarise a batch with the place of each failure', () => {
    const s = summariseOutcomes([
      { fileName: 'a.csv', status: 'imported', testId: '1' },
      { fileName: 'b.csv', status: 'duplicate', existingTestId: '1' },
      { fileName: 'c.csv', status: 'failed', error: { code: 'non-numeric-cell', message: 'not a number', line: 14, column: 3 } },
    ]);
    expect(s).toMatchObject({ entered: 1, duplicates: 1, failed: 1 });
    expect(s.failures[0].where).toBe('c.csv, line 14, column 3');
    expect(s.failures[0].message).toBe('not a number');
    // The engine's message starts with its place (engine/errors.ts formatMessage); the summary shows it once.
    const t = summariseOutcomes([{ fileName: 'd.csv', status: 'failed', error: { code: 'unknown-unit', message: 'd.csv, line 14, column 2: unknown unit "pqi"', line: 14, column: 2 } }]);
    expect(t.failures[0].message).toBe('unknown unit "pqi"');
  });
});
