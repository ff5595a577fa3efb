import type { ArchiveQuery, TestSummary } from './api';
import type { StoredTest } from './db';
import { GRADES } from '../engine/result';

/**
 * Filtering and sorting of archive list rows, shared by the service and its tests.
 */

/** What the list keeps in memory per test: the summary and the lower-case well name. */
export type ListRow = TestSummary & { wellNameKey?: string };

/** The in-memory list row of a stored test. */
export function toListRow(row: StoredTest): ListRow {
  return { ...toSummary(row), wellNameKey: row.wellNameKey };
}

/** Whether a stored test matches every filter of the query. */
export function matchesQuery(row: ListRow, query: ArchiveQuery): boolean {
  if (query.state && row.state !== query.state) return false;
  if (query.fieldId && row.fieldId !== query.fieldId) return false;
  if (query.type && row.type !== query.type) return false;
  if (query.grade && row.grade !== query.grade) return false;
  if (query.wellSearch) {
    const needle = query.wellSearch.trim().toLocaleLowerCase();
    if (needle && !(row.wellNameKey ?? row.wellName.toLocaleLowerCase()).includes(needle)) return false;
  }
  return true;
}

/** The formation of a row: a list row's own, else the stored test's metadata (summaries are derived; no index). */
function formationOf(row: ListRow | StoredTest): { formation?: string } {
  const formation = row.formation ?? ('metadata' in row ? row.metadata?.formation : undefined);
  return formation ? { formation } : {};
}

/** The list summary of a stored test (metadata and source left out; the formation is taken from the metadata). */
export function toSummary(row: ListRow | StoredTest): TestSummary {
  return {
    id: row.id, fieldId: row.fieldId, fieldName: row.fieldName, wellId: row.wellId, wellName: row.wellName,
    type: row.type, typeInferred: row.typeInferred, depthTvd: row.depthTvd, depthMd: row.depthMd,
    shmin: row.shmin, shminKind: row.shminKind, grade: row.grade, state: row.state, reviewer: row.reviewer,
    lastPickAuthor: row.lastPickAuthor, fileName: row.fileName, fileHash: row.fileHash,
    importedAt: row.importedAt, importedBy: row.importedBy, contractor: row.contractor,
    ...formationOf(row),
    ...(row.openConflicts?.length ? { openConflicts: [...row.openConflicts] } : {}),
  };
}

const STATE_ORDER = { imported: 0, 'in-review': 1, accepted: 2, rejected: 3 } as const;

/**
 * Order of two summaries by one column; missing values (null) always sort last, ties by
 * id so the order is stable. Grades sort A before E; states in review order.
 */
export function compareSummaries(a: TestSummary, b: TestSummary, key: keyof TestSummary, descending: boolean): number {
  const va = rank(key, a[key]);
  const vb = rank(key, b[key]);
  const aMissing = va === null || va === undefined;
  const bMissing = vb === null || vb === undefined;
  if (aMissing || bMissing) return aMissing === bMissing ? byId(a, b) : aMissing ? 1 : -1;
  let order: number;
  if (typeof va === 'number' && typeof vb === 'number') order = va - vb;
  else if (PLAIN_ORDER_KEYS.has(key)) order = va < vb ? -1 : va > vb ? 1 : 0;
  else order = NATURAL.compare(String(va), String(vb));
  if (order === 0) return byId(a, b);
  return descending ? -order : order;
}

/** Natural, case-insensitive order for names ("HF-2" before "HF-10"). */
const NATURAL = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });
/** Keys whose text sorts by code point (ISO times, hashes, ids). */
const PLAIN_ORDER_KEYS = new Set<keyof TestSummary>(['importedAt', 'fileHash', 'id']);

function byId(a: TestSummary, b: TestSummary): number {
  return a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
}

function rank(key: keyof TestSummary, value: unknown): unknown {
  if (key === 'grade' && typeof value === 'string') return GRADES.indexOf(value as (typeof GRADES)[number]);
  if (key === 'state' && typeof value === 'string') return STATE_ORDER[value as keyof typeof STATE_ORDER];
  if (typeof value === 'boolean') return value ? 1 : 0;
  return value;
}
