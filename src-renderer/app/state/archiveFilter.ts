import type { TestSummary } from '../../archive/api';
import type { ReviewState } from '../../archive/events';
import type { Grade, } from '../../engine/result';
import type { TestType } from '../../engine/record';

/** What the archive list filters and sorts by. Empty strings mean "any". */
export interface ListFilter {
  wellSearch: string;
  field: string;
  type: TestType | '';
  grade: Grade | '';
  state: ReviewState | '';
  reviewer: string;
  /** TVD range, m (null: open end). */
  tvdFrom: number | null;
  tvdTo: number | null;
}

export type SortKey = 'fieldName' | 'wellName' | 'type' | 'depthTvd' | 'shmin' | 'grade' | 'state' | 'reviewer' | 'importedAt';

export interface ListSort { key: SortKey; descending: boolean }

export const EMPTY_FILTER: ListFilter = { wellSearch: '', field: '', type: '', grade: '', state: '', reviewer: '', tvdFrom: null, tvdTo: null };

/** One collator for every comparison (creating one per call is what makes localeCompare slow). */
const COLLATOR = new Intl.Collator('en', { numeric: true });

const STATE_ORDER: Record<ReviewState, number> = { imported: 0, 'in-review': 1, accepted: 2, rejected: 3 };

/** Keeps the tests that match every set filter; the well search is case-insensitive and matches anywhere in the name. */
export function filterTests(tests: readonly TestSummary[], filter: ListFilter): TestSummary[] {
  const needle = filter.wellSearch.trim().toLowerCase();
  return tests.filter((t) =>
    (!needle || t.wellName.toLowerCase().includes(needle))
    && (!filter.field || t.fieldName === filter.field)
    && (!filter.type || t.type === filter.type)
    && (!filter.grade || t.grade === filter.grade)
    && (!filter.state || t.state === filter.state)
    && (!filter.reviewer || (t.reviewer ?? '') === filter.reviewer)
    && (filter.tvdFrom === null || (t.depthTvd !== null && t.depthTvd >= filter.tvdFrom))
    && (filter.tvdTo === null || (t.depthTvd !== null && t.depthTvd <= filter.tvdTo)));
}

/**
 * Sorts a copy by one column. Missing values (no TVD, no Shmin, no reviewer) go last
 * in both directions; ties keep a stable order by well name then id.
 */
export function sortTests(tests: readonly TestSummary[], sort: ListSort): TestSummary[] {
  const dir = sort.descending ? -1 : 1;
  const value = (t: TestSummary): string | number | null => {
    switch (sort.key) {
      case 'state': return STATE_ORDER[t.state];
      case 'reviewer': return t.reviewer;
      default: return t[sort.key] as string | number | null;
    }
  };
  return tests
    .map((t, i) => ({ t, i, v: value(t) }))
    .sort((a, b) => {
      const av = a.v;
      const bv = b.v;
      if (av === null || av === undefined || av === '') {
        if (!(bv === null || bv === undefined || bv === '')) return 1;
      } else if (bv === null || bv === undefined || bv === '') {
        return -1;
      } else if (av !== bv) {
        const c = typeof av === 'number' && typeof bv === 'number' ? av - bv : COLLATOR.compare(String(av), String(bv));
        if (c !== 0) return c * dir;
      }
      return COLLATOR.compare(a.t.wellName, b.t.wellName) || (a.t.id < b.t.id ? -1 : a.t.id > b.t.id ? 1 : 0) || a.i - b.i;
    })
    .map((x) => x.t);
}

/** Number of tests in each review state. */
export function countByState(tests: readonly TestSummary[]): Record<ReviewState, number> {
  const out: Record<ReviewState, number> = { imported: 0, 'in-review': 0, accepted: 0, rejected: 0 };
  for (const t of tests) out[t.state]++;
  return out;
}

/** Distinct values of a column, sorted, for the filter menus. */
export function distinctValues(tests: readonly TestSummary[], key: 'fieldName' | 'reviewer'): string[] {
  const set = new Set<string>();
  for (const t of tests) { const v = t[key]; if (v) set.add(v); }
  return [...set].sort(COLLATOR.compare);
}
