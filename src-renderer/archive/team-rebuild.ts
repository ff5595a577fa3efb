import type { TestDetail } from './api';
import type { StoredEvent, StoredJournal } from './db';
import type { ArchiveEvent } from './events';
import { canonicalJson } from './journal/canonical';
import { journalKeyOf } from './journal/causality';
import type { DerivedTest } from './journal/derived-types';
import { eventHash } from './journal/journal-file';

/**
 * Helpers that turn the team journal's derived state (archive/journal/derive.ts) into the
 * archive's tables, and that build the causal fields of new events from the journals
 * table. Pure functions; the Archive class does the reading and writing.
 */

export type ManualPick = TestDetail['manualPicks'][number];

/** Pick event kinds: their authors are who "changed the picks" (four eyes). */
const PICK_KINDS_OF_LOG = new Set(['pick-moved', 'picks-reset']);

/**
 * The manual picks in force of a derived test, in the order the archive lists them
 * (cycle, then kind). Slots back on the automatic pick (after a reset) are left out.
 * @example manualPicksOf(state.tests.t1)[0] // { cycle: 1, kind: 'closure', pick: {...}, ... }
 */
export function manualPicksOf(test: DerivedTest): ManualPick[] {
  return Object.values(test.picks)
    .filter((slot) => slot.manual)
    .map((slot) => ({ cycle: slot.cycle, kind: slot.kind, pick: slot.pick, reason: slot.reason, author: slot.author, time: slot.time }))
    .sort((a, b) => a.cycle - b.cycle || a.kind.localeCompare(b.kind));
}

/** A key that is equal for two lists of manual picks exactly when the same picks are in force. */
export function picksKeyOf(picks: readonly ManualPick[]): string {
  return canonicalJson(picks.map(({ cycle, kind, pick }) => ({ cycle, kind, pick })));
}

/**
 * The archive's `lastPickAuthor` of a derived test: null while nobody has changed the
 * picks (the archive then names the importer for four eyes), else the last one who did.
 */
export function pickAuthorOf(test: DerivedTest): string | null {
  if (test.log.some((entry) => PICK_KINDS_OF_LOG.has(entry.kind))) return test.lastPickAuthor;
  return test.lastPickAuthor !== test.importedBy ? test.lastPickAuthor : null;
}

/**
 * The `seen` vector of a new event of journal `ownKey`: for every other journal held,
 * the highest `seq` up to which all its events are here (journal/causality.ts). Keys sorted.
 * @example seenVectorOf(rows, 'Ana@d1') // { 'Ben@d2': 14 }
 */
export function seenVectorOf(rows: readonly StoredJournal[], ownKey: string): Record<string, number> {
  const seen: Record<string, number> = {};
  for (const row of [...rows].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0))) {
    if (row.key !== ownKey && row.seq > 0) seen[row.key] = row.seq;
  }
  return seen;
}

/**
 * The events an event with this `seen` vector saw, among `events`: its own journal's,
 * those within the vector, and those made before journals had numbers.
 */
export function eventsSeenWith(events: readonly ArchiveEvent[], ownKey: string, seen: Record<string, number>): ArchiveEvent[] {
  return events.filter((e) => {
    if (e.seq === undefined) return true;
    const key = journalKeyOf(e);
    return key === ownKey || (seen[key] ?? 0) >= e.seq;
  });
}

/** The stored row of an event: lookup keys and its hash (the journal line's SHA-256). */
export function storedEventOf(event: ArchiveEvent): StoredEvent {
  return { ...event, testId: testIdOf(event), journal: journalKeyOf(event), hash: eventHash(event) };
}

/** The test an event is about ('' for none). */
export function testIdOf(event: ArchiveEvent): string {
  const body = event.body;
  if ('testId' in body) return body.testId;
  return body.kind === 'limits-changed' && body.scope !== 'project' ? body.scope.testId : '';
}
