import Dexie from 'dexie';
import type { ApplyOutcome, MissingRawFile, TeamConflict, TeamIssue } from './api';
import { announceChange, nowIso, writeTransaction, type ArchiveContext } from './archive-context';
import { allEvents, appendEvent, derivedState } from './archive-events';
import { rebuildFromLog } from './archive-rebuild';
import { journalRowOf } from './db';
import { ArchiveError } from './errors';
import type { ArchiveEvent } from './events';
import { NO_EVENT } from './journal/derive';
import type { DerivedState, Finding } from './journal/derived-types';
import { mergeEventSets } from './journal/merge';
import { sha256Hex } from './journal/sha256';
import { describeEvent } from './journal/sync-status';
import { validateEventShape } from './journal/validate';
import { normaliseUserName, requireReason } from './review-rules';
import { storedEventOf } from './team-rebuild';

/**
 * Team changes: events from elsewhere merged into the log (with their raw files), the
 * tables rebuilt from it, conflicts described and decided, findings, and tests whose raw
 * file is not here. Team operations run one at a time.
 */

/** Team operations one at a time (merges, decisions, rebuilds). */
function serialTeam<T>(context: ArchiveContext, work: () => Promise<T>): Promise<T> {
  const next = context.teamQueue.then(work, work);
  context.teamQueue = next.catch(() => undefined);
  return next;
}

/** Merge events from elsewhere (shape-checked; raw files checked against their hash) and rebuild the tables. */
export async function applyEvents(
  context: ArchiveContext, incoming: readonly ArchiveEvent[], rawFiles?: ReadonlyMap<string, Uint8Array>,
): Promise<ApplyOutcome> {
  const { db } = context;
  return serialTeam(context, async () => {
    const issues: TeamIssue[] = [];
    const valid: ArchiveEvent[] = [];
    for (const e of incoming) {
      const problem = validateEventShape(e);
      if (problem) issues.push({ kind: 'bad-event', message: `event ${(e as { id?: unknown })?.id ?? '?'}: ${problem}; not applied` });
      else valid.push(e);
    }
    const merge = mergeEventSets(await allEvents(context), valid);
    for (const c of merge.collisions) issues.push({ kind: 'id-collision', message: c.message });
    const raw = new Map<string, Uint8Array>();
    for (const [hash, bytes] of rawFiles ?? []) {
      if (sha256Hex(bytes) === hash) raw.set(hash, bytes);
      else issues.push({ kind: 'raw-damaged', message: `raw file ${hash} does not match its hash; not stored` });
    }
    const fileNames = new Map<string, string>();
    for (const e of merge.events) if (e.body.kind === 'test-imported') fileNames.set(e.body.fileHash, e.body.fileName);
    if (merge.added.length || raw.size) {
      await db.transaction('rw', [db.events, db.journals, db.rawFiles, db.users], async () => {
        const present = await db.events.bulkGet(merge.added.map((e) => e.id));
        const rows = merge.added.filter((_, i) => !present[i]).map(storedEventOf);
        if (rows.length) await db.events.bulkAdd(rows);
        for (const key of new Set(rows.map((r) => r.journal))) {
          const all = await db.events.where('[journal+clock]').between([key, Dexie.minKey], [key, Dexie.maxKey]).toArray();
          await db.journals.put(journalRowOf(all));
        }
        const time = nowIso(context);
        for (const [hash, bytes] of raw) {
          if (!(await db.rawFiles.get(hash))) await db.rawFiles.add({ hash, bytes, size: bytes.length, fileName: fileNames.get(hash) ?? hash, storedAt: time });
        }
        for (const author of new Set(rows.map((r) => r.author))) {
          if (!(await db.users.get(author))) await db.users.add({ name: author, createdAt: time });
        }
      });
      context.derivedCache = null;
    }
    const rebuilt = await rebuildFromLog(context, raw);
    issues.push(...rebuilt.issues);
    const addedIds = new Set(merge.added.map((e) => e.id));
    const described = describeConflicts(rebuilt.state, rebuilt.events);
    announceChange(context);
    return {
      added: merge.added.length,
      duplicates: merge.duplicates,
      conflicts: described.filter((c) => !c.resolution && c.eventIds.some((id) => addedIds.has(id))),
      findings: rebuilt.state.findings.filter((f) => addedIds.has(f.eventId)),
      issues,
      missingRawFiles: rebuilt.missing,
    };
  });
}

/** The conflicts of a derived state with their events in plain words, oldest first. */
function describeConflicts(state: DerivedState, events: readonly ArchiveEvent[]): TeamConflict[] {
  const byId = new Map(events.map((e) => [e.id, e]));
  const out: TeamConflict[] = Object.values(state.conflicts).map((c) => ({
    ...c,
    events: c.eventIds.map((id) => byId.get(id)).filter((e): e is ArchiveEvent => e !== undefined)
      .map((e) => ({ id: e.id, author: e.author, device: e.device, time: e.time, kind: e.body.kind, summary: describeEvent(e) })),
  }));
  const first = (c: TeamConflict) => c.events.reduce((m, e) => (e.time < m ? e.time : m), '\uffff');
  return out.sort((a, b) => (first(a) < first(b) ? -1 : first(a) > first(b) ? 1 : a.id < b.id ? -1 : 1));
}

/** Conflicts, oldest first: unresolved only unless `includeResolved`; of one test when `testId`. */
export async function conflicts(context: ArchiveContext, options: { testId?: string; includeResolved?: boolean } = {}): Promise<TeamConflict[]> {
  const { state, events } = await derivedState(context);
  return describeConflicts(state, events)
    .filter((c) => (options.includeResolved || !c.resolution) && (!options.testId || c.testId === options.testId));
}

/** Findings of the whole log. */
export async function findings(context: ArchiveContext): Promise<Finding[]> {
  return [...(await derivedState(context)).state.findings];
}

/** Decide a conflict (keep one of its events, or NO_EVENT to void a sign-off conflict), logged with the reason. */
export async function resolveConflict(context: ArchiveContext, conflictId: string, keep: string, user: string, reason: string): Promise<TeamConflict> {
  const author = normaliseUserName(user);
  const why = requireReason(reason, 'decide a conflict');
  return serialTeam(context, async () => {
    const { state } = await derivedState(context);
    const conflict = state.conflicts[conflictId];
    if (!conflict) throw new ArchiveError('not-found', `No conflict with id ${conflictId}.`);
    if (conflict.resolution) throw new ArchiveError('bad-state', `This conflict was already decided by ${conflict.resolution.author} ("${conflict.resolution.reason}").`);
    if (keep === NO_EVENT ? conflict.kind === 'concurrent-pick-moves' : !conflict.eventIds.includes(keep)) {
      throw new ArchiveError('bad-argument', keep === NO_EVENT
        ? 'A conflict between two pick moves is decided by keeping one of them.'
        : `Event ${keep} is not part of this conflict; keep one of ${conflict.eventIds.join(', ')}${conflict.kind === 'concurrent-pick-moves' ? '' : ` or "${NO_EVENT}"`}.`);
    }
    await writeTransaction(context, async () => {
      await appendEvent(context, author, { kind: 'conflict-resolved', conflictId, testId: conflict.testId, keep, reason: why });
    });
    const rebuilt = await rebuildFromLog(context, new Map());
    announceChange(context);
    return describeConflicts(rebuilt.state, rebuilt.events).find((c) => c.id === conflictId)!;
  });
}

/** Tests known from the log whose raw file is not here. */
export async function missingRawFiles(context: ArchiveContext): Promise<MissingRawFile[]> {
  const { db } = context;
  const { state } = await derivedState(context);
  const out: MissingRawFile[] = [];
  for (const test of Object.values(state.tests)) {
    if (test.deleted || (await db.tests.get(test.id))) continue;
    if (!(await db.rawFiles.get(test.fileHash))) out.push({ testId: test.id, fileHash: test.fileHash, fileName: test.fileName });
  }
  return out;
}

/** Build tables for tests the log knows and whose raw files are here (e.g. after they arrived). */
export async function rebuild(context: ArchiveContext): Promise<MissingRawFile[]> {
  return serialTeam(context, async () => {
    const { missing } = await rebuildFromLog(context, new Map());
    announceChange(context);
    return missing;
  });
}
