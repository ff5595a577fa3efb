import Dexie from 'dexie';
import type { ArchiveEvent, ArchiveEventBody } from './events';
import { journalRowOf, type StoredEvent, type StoredJournal } from './db';
import { ArchiveError } from './errors';
import { nowIso, type ArchiveContext, type DerivedCache, type FixedAuthoring } from './archive-context';
import { deriveArchiveState } from './journal/derive';
import { seenVectorOf, storedEventOf } from './team-rebuild';

/**
 * The review log: appending events (journal position, what they saw, Lamport clock, hash),
 * reading them back, fixed authoring for the demo seed, and the state derived from the
 * whole log. Append-only: nothing here changes or removes an event.
 */

/** The journals this device's new events see (in fixed authoring: that device's only). */
export async function localJournals(context: ArchiveContext): Promise<StoredJournal[]> {
  const rows = await context.db.journals.toArray();
  const fixed = context.fixed;
  return fixed ? rows.filter((r) => r.device === fixed.device) : rows;
}

/** The journal key (`author@device`) of a new event by `author` on this device. */
export function ownJournalKey(context: ArchiveContext, author: string): string {
  return `${author}@${context.fixed?.device ?? context.device}`;
}

/**
 * Append one event; call inside a read-write transaction over all tables. Fills the
 * envelope: `seq` (next in the author's journal on this device), `prev` (the hash of the
 * journal's last event), `seen` (how far every other journal held here goes), the
 * Lamport clock (highest held + 1), and the row's hash = the journal line's SHA-256.
 */
export async function appendEvent(context: ArchiveContext, author: string, body: ArchiveEventBody): Promise<StoredEvent> {
  const { db } = context;
  const device = context.fixed?.device ?? context.device;
  const journal = `${author}@${device}`;
  const rows = await localJournals(context);
  const fixed = context.fixed;
  const own = rows.find((r) => r.key === journal);
  const seq = (own?.lastSeq ?? 0) + 1;
  const clock = rows.reduce((m, r) => Math.max(m, r.clock), 0) + 1;
  const event: ArchiveEvent = {
    id: fixed ? `${journal}#${seq}` : crypto.randomUUID(),
    author,
    device,
    time: fixed ? new Date(fixed.start + clock * 60_000).toISOString() : nowIso(context),
    clock,
    prev: own?.lastHash ?? '',
    seq,
    seen: seenVectorOf(rows, journal),
    body,
  };
  const row = storedEventOf(event);
  await db.events.add(row);
  await db.journals.put({
    key: journal, author, device,
    seq: !own || own.seq === own.lastSeq ? seq : own.seq,
    lastSeq: seq, lastHash: row.hash, clock, events: (own?.events ?? 0) + 1,
  });
  if (!(await db.users.get(author))) await db.users.add({ name: author, createdAt: event.time });
  context.derivedCache = null;
  return row;
}

/** The event of a stored row (lookup keys and hash left out). */
export function toEvent(row: StoredEvent): ArchiveEvent {
  const { testId: _testId, journal: _journal, hash: _hash, ...event } = row;
  return event;
}

/** A test's review log, in Lamport order. */
export async function eventsForTest(context: ArchiveContext, testId: string): Promise<ArchiveEvent[]> {
  const rows = await context.db.events.where('[testId+clock]').between([testId, Dexie.minKey], [testId, Dexie.maxKey]).toArray();
  return rows.map(toEvent);
}

/** The events with a Lamport clock above `afterClock`, in clock order. */
export async function listEvents(context: ArchiveContext, afterClock = 0): Promise<ArchiveEvent[]> {
  const rows = await context.db.events.where('clock').above(afterClock).toArray();
  return rows.map(toEvent);
}

/** Every event held (primary-key order). */
export async function allEvents(context: ArchiveContext): Promise<ArchiveEvent[]> {
  return (await context.db.events.toArray()).map(toEvent);
}

/** The state derived from the whole log (cached while the log is unchanged). */
export async function derivedState(context: ArchiveContext): Promise<DerivedCache> {
  const count = await context.db.events.count();
  const cache = context.derivedCache;
  if (cache && cache.count === count && cache.epoch === context.epoch) return cache;
  const epoch = context.epoch;
  const events = await allEvents(context);
  const state = deriveArchiveState(events);
  const fresh = { count: events.length, epoch, state, events };
  if (epoch === context.epoch) context.derivedCache = fresh;
  return fresh;
}

/**
 * Run `work` with fixed authoring (see FixedAuthoring): for the demo seed, so two fresh
 * machines make the same demo events and exchanging bundles adds no duplicate tests.
 * @throws ArchiveError 'bad-state' when the archive already holds events.
 */
export async function withFixedAuthoring<T>(context: ArchiveContext, authoring: FixedAuthoring, work: () => Promise<T>): Promise<T> {
  const start = Date.parse(authoring.startTime);
  if (!authoring.device || !Number.isFinite(start)) throw new ArchiveError('bad-argument', 'Fixed authoring needs a device id and an ISO start time.');
  if ((await context.db.events.count()) > 0) throw new ArchiveError('bad-state', 'Fixed authoring is only for an archive without events.');
  context.fixed = { ...authoring, start };
  try {
    return await work();
  } finally {
    context.fixed = null;
  }
}

/** Recount the journals table from the log (after a restore). */
export async function rebuildJournalRows(context: ArchiveContext): Promise<void> {
  const { db } = context;
  context.derivedCache = null;
  context.epoch += 1;
  await db.transaction('rw', [db.events, db.journals], async () => {
    const byJournal = new Map<string, StoredEvent[]>();
    await db.events.each((row) => {
      const list = byJournal.get(row.journal);
      if (list) list.push(row); else byJournal.set(row.journal, [row]);
    });
    await db.journals.clear();
    for (const rows of byJournal.values()) await db.journals.put(journalRowOf(rows));
  });
}
