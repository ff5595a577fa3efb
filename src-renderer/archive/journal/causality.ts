import type { ArchiveEvent } from '../events';

/**
 * Causal order between events of different journals.
 *
 * Each event carries its position in its own journal (`seq`) and a vector of what its
 * device had seen of every other journal (`seen`). Event A happened before B when B's
 * device had seen A: same journal and lower `seq`, or `B.seen[journal(A)] >= A.seq`.
 * Two events where neither happened before the other are concurrent: their authors
 * worked without knowing of each other's change, and the merge reports a conflict
 * rather than silently letting one win. A vector is used (rather than a list of direct
 * predecessors) so the test needs no other event: it still works when a journal the
 * event depends on is missing or damaged on this machine.
 *
 * The Lamport `clock` is kept for the total order (clock, then device, then id), which is
 * consistent with causality: if A happened before B then A.clock < B.clock.
 */

/** The journal an event belongs to: `author@device`. */
export function journalKeyOf(event: Pick<ArchiveEvent, 'author' | 'device'>): string {
  return `${event.author}@${event.device}`;
}

/**
 * True when `a` happened before `b` (b's device had seen a). False for the same event
 * and for concurrent events. Events without causal fields (`seq`, `seen`) were made
 * before team journals existed, on one machine that had seen every earlier event of its
 * archive: for them the total order stands in for causality (no conflict is reported).
 * @example happenedBefore(importEvent, pickEventThatSawIt) // true
 */
export function happenedBefore(a: ArchiveEvent, b: ArchiveEvent): boolean {
  if (a.id === b.id) return false;
  if (a.seq === undefined || b.seq === undefined || b.seen === undefined) return compareEventOrder(a, b) < 0;
  const aKey = journalKeyOf(a);
  if (aKey === journalKeyOf(b)) return a.seq < b.seq;
  const seen = b.seen[aKey];
  return seen !== undefined && seen >= a.seq;
}

/** True when neither event happened before the other (and they are different events). */
export function concurrent(a: ArchiveEvent, b: ArchiveEvent): boolean {
  return a.id !== b.id && !happenedBefore(a, b) && !happenedBefore(b, a);
}

/**
 * The total order every machine applies events in: Lamport clock, then device, then id
 * (plain code-unit string comparison, independent of locale).
 * @returns negative, zero or positive, as for Array.prototype.sort.
 */
export function compareEventOrder(a: ArchiveEvent, b: ArchiveEvent): number {
  if (a.clock !== b.clock) return a.clock - b.clock;
  if (a.device !== b.device) return a.device < b.device ? -1 : 1;
  if (a.id !== b.id) return a.id < b.id ? -1 : 1;
  return 0;
}

/** Events sorted into the total order (a new array). */
export function sortEvents(events: readonly ArchiveEvent[]): ArchiveEvent[] {
  return [...events].sort(compareEventOrder);
}
