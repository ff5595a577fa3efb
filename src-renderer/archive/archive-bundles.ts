import type { ApplyOutcome, TeamIssue } from './api';
import type { ArchiveContext } from './archive-context';
import { allEvents } from './archive-events';
import { applyEvents } from './archive-team';
import { ArchiveError } from './errors';
import { exportBundle as encodeBundle, importBundle as decodeBundle, journalTextsFromEvents } from './journal/bundle';
import { syncStatus as describeSyncStatus, type SyncStatus } from './journal/sync-status';
import { normaliseUserName } from './review-rules';

/**
 * Sharing by file and sync bookkeeping: the team bundle (every journal and raw file in
 * one file) out and in, the marks of how far each journal is in the team folder, the
 * sync status, and raw files by hash.
 */

async function syncMarks(context: ArchiveContext): Promise<Record<string, number>> {
  const stored = await context.db.settings.get('syncMarks');
  return (stored?.value as Record<string, number> | undefined) ?? {};
}

/** Record that the journal's events up to `seq` are in the team folder (marks only grow). */
export async function markSynced(context: ArchiveContext, journal: string, seq: number): Promise<void> {
  const { db } = context;
  if (!journal || !Number.isInteger(seq) || seq < 0) throw new ArchiveError('bad-argument', 'A sync mark needs a journal key and a whole number.');
  await db.transaction('rw', db.settings, async () => {
    const marks = await syncMarks(context);
    if ((marks[journal] ?? 0) >= seq) return;
    await db.settings.put({ key: 'syncMarks', value: { ...marks, [journal]: seq } });
  });
}

/** What is waiting to sync for `user` on this device, and who changed what. */
export async function syncStatus(
  context: ArchiveContext, user: string, options: { folderReachable?: boolean | null; writtenSeq?: number } = {},
): Promise<SyncStatus> {
  const journal = `${normaliseUserName(user)}@${context.device}`;
  const marks = await syncMarks(context);
  return describeSyncStatus({
    journal, events: await allEvents(context),
    writtenSeq: Math.max(options.writtenSeq ?? 0, marks[journal] ?? 0),
    folderReachable: options.folderReachable ?? null,
  });
}

/** Every journal and raw file as one bundle file; this device's journals are then marked synced. */
export async function exportBundle(context: ArchiveContext, user?: string): Promise<Uint8Array> {
  const { db } = context;
  const [events, raw, journals] = await db.transaction('r', [db.events, db.rawFiles, db.journals], async () =>
    [await allEvents(context), await db.rawFiles.toArray(), await db.journals.toArray()] as const);
  const bytes = encodeBundle({
    journals: journalTextsFromEvents(events), raw: raw.map((r) => ({ hash: r.hash, bytes: r.bytes })),
    createdBy: user ? normaliseUserName(user) : context.device, createdAt: context.now().toISOString(),
  });
  for (const row of journals) if (row.device === context.device) await markSynced(context, row.key, row.lastSeq);
  return bytes;
}

/** Check a bundle (refused whole when damaged) and apply its events; journal damage comes back as issues. */
export async function importBundle(context: ArchiveContext, bytes: Uint8Array, fileName: string): Promise<ApplyOutcome> {
  const bundle = decodeBundle(bytes, fileName);
  const outcome = await applyEvents(context, bundle.read.events, new Map(bundle.raw.map((r) => [r.hash, r.bytes])));
  const journalIssues: TeamIssue[] = bundle.read.issues.map((i) => ({ kind: i.kind, message: i.message, file: i.file, line: i.line, column: i.column }));
  const collisions: TeamIssue[] = bundle.read.collisions.map((c) => ({ kind: 'id-collision', message: c.message }));
  return { ...outcome, issues: [...journalIssues, ...collisions, ...outcome.issues] };
}

/** A raw file by SHA-256, or null. */
export async function rawFile(context: ArchiveContext, hash: string): Promise<Uint8Array | null> {
  return (await context.db.rawFiles.get(hash))?.bytes ?? null;
}
