import type { ArchiveQuery, StateCounts, TestSummary } from './api';
import type { ArchiveContext } from './archive-context';
import type { StoredTest } from './db';
import type { ReviewState } from './events';
import { compareSummaries, matchesQuery, toListRow, toSummary, type ListRow } from './query';

/**
 * The archive list: test summaries kept in memory after the first read, filtered, sorted
 * and counted per review state (query.ts holds the pure filter and sort).
 */

/** Drop the in-memory list (another window wrote, a backup was restored, tests were deleted). */
export function forgetList(context: ArchiveContext): void {
  context.listCache = null;
  context.cacheGeneration += 1;
}

/** Keep the in-memory list in step with rows this instance wrote (after commit). */
export function rememberRows(context: ArchiveContext, rows: StoredTest[]): void {
  if (context.listCache) for (const row of rows) context.listCache.set(row.id, toListRow(row));
  if (rows.length) context.cacheGeneration += 1;
}

/**
 * The list rows of every test, kept in memory after the first read (summaries only: a
 * few hundred bytes per test) and updated by this instance's writes; another window's
 * writes clear it through a BroadcastChannel.
 */
async function listRows(context: ArchiveContext): Promise<Map<string, ListRow>> {
  if (context.listCache) return context.listCache;
  const generation = context.cacheGeneration;
  const rows = new Map<string, ListRow>();
  // One bulk read (getAll) rather than a cursor: a cursor costs a round trip per row.
  for (const row of await context.db.tests.toArray()) rows.set(row.id, toListRow(row));
  if (generation === context.cacheGeneration) context.listCache = rows;
  return rows;
}

/** Summaries matching the query, sorted (newest import first when no sort is asked). */
export async function listTests(context: ArchiveContext, query: ArchiveQuery = {}): Promise<TestSummary[]> {
  const rows = await listRows(context);
  const out: TestSummary[] = [];
  for (const row of rows.values()) if (matchesQuery(row, query)) out.push(toSummary(row));
  out.sort((a, b) => compareSummaries(a, b, query.sortBy ?? 'importedAt', query.descending ?? query.sortBy === undefined));
  return out;
}

/** Tests per review state under the query's other filters. */
export async function countByState(context: ArchiveContext, query: ArchiveQuery = {}): Promise<StateCounts> {
  const states: ReviewState[] = ['imported', 'in-review', 'accepted', 'rejected'];
  const counts: StateCounts = { imported: 0, 'in-review': 0, accepted: 0, rejected: 0, total: 0 };
  const filter = { ...query, state: undefined };
  for (const row of (await listRows(context)).values()) if (matchesQuery(row, filter)) counts[row.state] += 1;
  counts.total = states.reduce((sum, s) => sum + counts[s], 0);
  return counts;
}
