import { describe, expect, it } from 'vitest';
import type { TestSummary } from '../../../src-renderer/archive/api';
import { countByState, EMPTY_FILTER, filterTests, sortTests } from '../../../src-renderer/app/state/archiveFilter';

function row(id: string, over: Partial<TestSummary>): TestSummary {
  return {
    id, fieldId: 'f1', fieldName: 'Harrow Flats', wellId: 'w', wellName: 'HF-1', type: 'lot', typeInferred: false,
    depthTvd: 1000, depthMd: 1000, shmin: 20e6, shminKind: 'estimate', grade: 'B', state: 'imported', reviewer: null,
    lastPickAuthor: null, fileName: `${id}.csv`, fileHash: id, importedAt: '2026-01-01T00:00:00Z', importedBy: 'A', ...over,
  };
}

const tests = [
  row('a', { wellName: 'HF-10', depthTvd: 2500, grade: 'A', state: 'accepted', reviewer: 'Ines' }),
  row('b', { wellName: 'HF-2', depthTvd: null, grade: 'C', state: 'in-review' }),
  row('c', { wellName: 'HF-1', depthTvd: 900, grade: 'E', state: 'rejected', reviewer: 'Ines', type: 'fit' }),
  row('d', { wellName: 'North HF-3', depthTvd: 1800, grade: 'B' }),
];

describe('archiveFilter', () => {
  it('should search well names case-insensitively anywhere in the name', () => {
    expect(filterTests(tests, { ...EMPTY_FILTER, wellSearch: 'hf-1' }).map((t) => t.id)).toEqual(['a', 'c']);
    expect(filterTests(tests, { ...EMPTY_FILTER, wellSearch: 'north' }).map((t) => t.id)).toEqual(['d']);
  });

  it('should combine filters with AND', () => {
    expect(filterTests(tests, { ...EMPTY_FILTER, reviewer: 'Ines', type: 'fit' }).map((t) => t.id)).toEqual(['c']);
  });

  it('should filter by a TVD range and leave out tests without a TVD', () => {
    expect(filterTests(tests, { ...EMPTY_FILTER, tvdFrom: 1000, tvdTo: 2000 }).map((t) => t.id)).toEqual(['d']);
    expect(filterTests(tests, { ...EMPTY_FILTER, tvdFrom: 1000 }).map((t) => t.id)).toEqual(['a', 'd']);
  });

  it('should sort numbers numerically and put missing values last in both directions', () => {
    expect(sortTests(tests, { key: 'depthTvd', descending: false }).map((t) => t.id)).toEqual(['c', 'd', 'a', 'b']);
    expect(sortTests(tests, { key: 'depthTvd', descending: true }).map((t) => t.id)).toEqual(['a', 'd', 'c', 'b']);
  });

  it('should sort well names in natural order (HF-2 before HF-10)', () => {
    expect(sortTests(tests, { key: 'wellName', descending: false }).map((t) => t.wellName)).toEqual(['HF-1', 'HF-2', 'HF-10', 'North HF-3']);
  });

  it('should sort review states in workflow order', () => {
    expect(sortTests(tests, { key: 'state', descending: false }).map((t) => t.state)).toEqual(['imported', 'in-review', 'accepted', 'rejected']);
  });

  it('should count tests per state', () => {
    expect(countByState(tests)).toEqual({ imported: 1, 'in-review': 1, accepted: 1, rejected: 1 });
  });

  it('should filter 10,000 tests and keep every match', () => {
    const many = Array.from({ length: 10_000 }, (_, i) => row(`t${i}`, { wellName: `HF-${i % 97}`, grade: (['A', 'B', 'C', 'D', 'E'] as const)[i % 5] }));
    const found = filterTests(many, { ...EMPTY_FILTER, wellSearch: 'HF-5', grade: 'A' });
    const expected = many.filter((t) => t.wellName.includes('HF-5') && t.grade === 'A');
    expect(found).toHaveLength(expected.length);
    expect(found.length).toBeGreaterThan(0);
  });
});
