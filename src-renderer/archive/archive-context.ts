import type { ArchiveEvent } from './events';
import type { StressLedgerDb, StoredTest } from './db';
import type { ArchiveEngine } from './engine-port';
import type { DerivedState } from './journal/derived-types';
import type { ListRow } from './query';
import { rememberRows } from './archive-list';

/**
 * The state one open archive shares between its parts (archive.ts and the archive-*.ts
 * modules): the database, the engine, the clock, the in-memory caches and the authoring
 * identity. The `Archive` class owns one; the modules' free functions take it first.
 */

/**
 * Authoring with fixed identity (the demo seed): events on `device`, ids `journal#seq`,
 * times from `startTime` plus one minute per Lamport tick, seeing only that device's
 * journals, test ids from the raw file's hash. Two archives running the same work on the
 * same files make identical events.
 */
export interface FixedAuthoring {
  device: string;
  /** ISO 8601 UTC. */
  startTime: string;
}

/** The whole log's derived state, kept while the log is unchanged (see derivedState). */
export interface DerivedCache { count: number; epoch: number; state: DerivedState; events: ArchiveEvent[] }

export interface ArchiveContext {
  readonly db: StressLedgerDb;
  readonly engine: ArchiveEngine;
  readonly now: () => Date;
  /** Change listeners of this instance (subscribe). */
  readonly listeners: Set<() => void>;
  /** Tells other windows on the same database that something changed (null where unsupported). */
  readonly channel: BroadcastChannel | null;
  /** This installation's device id (kept in settings). */
  device: string;
  /** True while a backup is restored: the review log's append-only hooks stand aside. */
  restoring: boolean;
  /** The list rows of every test, or null until read (archive-list.ts). */
  listCache: Map<string, ListRow> | null;
  /** Bumped by every write that changes list rows, so a read begun before it is not cached. */
  cacheGeneration: number;
  /** Set inside withFixedAuthoring. */
  fixed: (FixedAuthoring & { start: number }) | null;
  /** Tail of the queue running team operations one at a time. */
  teamQueue: Promise<unknown>;
  /** Bumped when the log is recounted (restore), so a derived state read before it is not cached. */
  epoch: number;
  derivedCache: DerivedCache | null;
}

/** The time stamped on rows and events now (in fixed authoring: its start time). */
export function nowIso(context: ArchiveContext): string {
  return context.fixed ? context.fixed.startTime : context.now().toISOString();
}

/** Call every listener of this instance; a listener's failure does not stop the others. */
export function notifyListeners(context: ArchiveContext): void {
  for (const listener of [...context.listeners]) {
    try { listener(); } catch { /* a listener's failure is its own */ }
  }
}

/** Tell other windows, then this instance's listeners, that the archive changed. */
export function announceChange(context: ArchiveContext): void {
  context.channel?.postMessage('changed');
  notifyListeners(context);
}

/**
 * Run `work` in one read-write transaction over every table; rows it reports through
 * `touch` enter the in-memory list once the transaction has committed.
 */
export function writeTransaction<T>(context: ArchiveContext, work: (touch: (row: StoredTest) => void) => Promise<T>): Promise<T> {
  const { db } = context;
  const touched: StoredTest[] = [];
  const touch = (row: StoredTest) => { touched.push(row); };
  return db.transaction('rw', db.tables, async () => await work(touch)).then((value) => {
    rememberRows(context, touched);
    announceChange(context);
    return value;
  });
}

/** Read this installation's device id from settings, making and keeping one the first time. */
export async function ensureDevice(context: ArchiveContext): Promise<void> {
  const stored = await context.db.settings.get('device');
  if (typeof stored?.value === 'string' && stored.value) { context.device = stored.value; return; }
  context.device = crypto.randomUUID();
  await context.db.settings.put({ key: 'device', value: context.device });
}
