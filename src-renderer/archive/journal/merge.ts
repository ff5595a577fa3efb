import type { ArchiveEvent } from '../events';
import { compareEventOrder } from './causality';
import { readJournal, serializeEvent, type JournalIssue, type JournalReadResult } from './journal-file';
import { sha256OfText } from './sha256';

/**
 * Merging event sets from journals, bundles and the local archive. Idempotent (an event
 * seen twice is one event), free of order (the result is sorted into the total order),
 * and nothing is lost: every distinct event id in any input is in the output. The only
 * events not carried over are second copies of an id that carry different content, which
 * means a journal was altered; those are reported as collisions, never silently chosen.
 */

export interface IdCollision {
  id: string;
  /** The copy kept (deterministically: lowest SHA-256 of its journal line). */
  kept: ArchiveEvent;
  /** The other copies with the same id. */
  others: ArchiveEvent[];
  message: string;
}

export interface MergeResult {
  /** Every distinct event, in the total order. */
  events: ArchiveEvent[];
  /** Events that were not in `base`, in the total order. */
  added: ArchiveEvent[];
  /** How many copies of already known events were passed in. */
  duplicates: number;
  collisions: IdCollision[];
}

/**
 * Merge event sets into one.
 * @param base events already held (e.g. the local archive).
 * @param incoming further sets (journals read from the team folder, a bundle), any order.
 * @example mergeEventSets(local, annaJournal.events, benJournal.events).added
 */
export function mergeEventSets(base: readonly ArchiveEvent[], ...incoming: readonly (readonly ArchiveEvent[])[]): MergeResult {
  const byId = new Map<string, ArchiveEvent>();
  const fromBase = new Set<string>();
  const clashes = new Map<string, ArchiveEvent[]>();
  let duplicates = 0;
  const take = (e: ArchiveEvent, isBase: boolean): void => {
    const known = byId.get(e.id);
    if (!known) {
      byId.set(e.id, e);
      if (isBase) fromBase.add(e.id);
      return;
    }
    duplicates++;
    if (known === e || serializeEvent(known) === serializeEvent(e)) return;
    const list = clashes.get(e.id) ?? [known];
    if (!list.some((x) => serializeEvent(x) === serializeEvent(e))) list.push(e);
    clashes.set(e.id, list);
  };
  for (const e of base) take(e, true);
  for (const set of incoming) for (const e of set) take(e, false);
  const collisions: IdCollision[] = [];
  for (const [id, copies] of clashes) {
    const ranked = copies.map((c) => ({ c, h: sha256OfText(serializeEvent(c)) })).sort((a, b) => (a.h < b.h ? -1 : a.h > b.h ? 1 : 0));
    const kept = ranked[0].c;
    byId.set(id, kept);
    collisions.push({
      id, kept, others: ranked.slice(1).map((r) => r.c),
      message: `event ${id} exists with ${copies.length} different contents; a journal was altered. The copy with the lowest hash is used; all copies are listed for review`,
    });
  }
  const events = collisions.length ? [...byId.values()].sort(compareEventOrder) : orderedUnion(byId, [base, ...incoming]);
  const added = events.filter((e) => !fromBase.has(e.id));
  return { events, added, duplicates, collisions };
}

function isOrdered(list: readonly ArchiveEvent[]): boolean {
  for (let i = 1; i < list.length; i++) if (compareEventOrder(list[i - 1], list[i]) >= 0) return false;
  return true;
}

/**
 * The chosen copy of every id, in the total order. Journals and earlier merges are
 * already in that order (a journal's clock only grows), so the usual case is a linear
 * merge of sorted lists; anything else is sorted.
 */
function orderedUnion(byId: Map<string, ArchiveEvent>, lists: readonly (readonly ArchiveEvent[])[]): ArchiveEvent[] {
  if (!lists.every(isOrdered)) return [...byId.values()].sort(compareEventOrder);
  let merged: ArchiveEvent[] = [];
  for (const list of lists) {
    if (list.length === 0) continue;
    const out: ArchiveEvent[] = new Array(merged.length + list.length);
    let i = 0, j = 0, k = 0;
    while (i < merged.length || j < list.length) {
      const a = merged[i], b = list[j];
      const order = a === undefined ? 1 : b === undefined ? -1 : compareEventOrder(a, b);
      if (order < 0) { out[k++] = a; i++; }
      else if (order > 0) { out[k++] = byId.get(b.id)!; j++; }
      else { out[k++] = a; i++; j++; } // the same event in both
    }
    out.length = k;
    merged = out;
  }
  return merged;
}

export interface JournalSetRead {
  /** Every distinct event of all the journals, in the total order. */
  events: ArchiveEvent[];
  issues: JournalIssue[];
  collisions: IdCollision[];
  reads: JournalReadResult[];
}

/**
 * Read and merge whole journal files (e.g. everything in a team folder or a bundle).
 * @param files journal file names and their text.
 * @example readJournalSet([{ file: 'anna@laptop-7.jsonl', text }]).events
 */
export function readJournalSet(files: readonly { file: string; text: string }[]): JournalSetRead {
  const reads = files.map((f) => readJournal(f.file, f.text));
  const merged = mergeEventSets([], ...reads.map((r) => r.events));
  return { events: merged.events, issues: reads.flatMap((r) => r.issues), collisions: merged.collisions, reads };
}
