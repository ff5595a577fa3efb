/**
 * The team journal: review-log events carried between machines through a shared folder
 * or a bundle file, merged without a server. Pure TypeScript: runs in the renderer, a
 * Web Worker and Node alike (the Node side of the folder is src-main/team-folder.ts).
 *
 * Design, and where it departs from the first sketch (and why):
 * - The review log is the source of truth; `deriveArchiveState` folds it in one total
 *   order (Lamport clock, device, id), so any arrival order gives the same archive.
 * - Causality is a per-event vector `seen` (highest `seq` seen of every other journal)
 *   plus `seq`, added to EventEnvelope, rather than a list of predecessor ids: "did B see
 *   A" is then one lookup that needs no other event, so it still holds when the journal
 *   holding A's predecessors is missing or damaged here.
 * - `prev` is the SHA-256 of the predecessor's journal line, and lines are canonical JSON
 *   (sorted keys), so the chain is checked on the bytes as read and rebuilt identically
 *   from events (bundles re-serialise journals from the archive).
 * - SHA-256 is synchronous, in plain TypeScript (tested on the FIPS 180-2 vectors):
 *   reading a journal hashes every line, and keeping the reader, merge and derivation
 *   synchronous keeps them plain functions; `crypto.subtle` is used for large raw files.
 * - Conflicts are pairwise (two events that did not see each other) and never closed by a
 *   later event implicitly, only by a `conflict-resolved` decision (new body kind). A
 *   pair's verdict depends on the two events alone, so a machine holding more events
 *   never loses a conflict another machine showed (and decided). A frontier-based
 *   "latest changes only" check was tried and dropped: it made conflicts vanish as more
 *   history arrived, leaving decisions pointing at nothing.
 * - `picksVersion` = SHA-256 of the sorted ids of the test's pick moves, resets and
 *   conflict decisions the signer had seen (`picksVersionForTest` on the signer's local
 *   events, equal to `DerivedTest.picksVersion`: what the app must put in a sign-off). A version this archive cannot reproduce is
 *   a 'stale-sign-off' conflict (usually: a journal the signer had is missing here).
 * - Four eyes is judged on what the signer saw: the last pick event in the sign-off's
 *   causal past (or the importer) must be by someone else, on any device.
 * - A decision on a sign-off conflict keeps the sign-off (its signed picks are restored),
 *   keeps the change (sign-off void), or keeps `NO_EVENT` (void); a decision on a pick
 *   conflict keeps one pick.
 * - Events without `seq`/`seen` (made before journals existed) are ordered by the total
 *   order alone and never reported as conflicts.
 * - The Dexie archive (archive/archive.ts) makes its events with `seq`, `seen` (from its
 *   journals table: per journal, the highest `seq` held without a gap) and the row hash
 *   `eventHash(e)`; a sign-off's `picksVersion` is `picksVersionForTest` over the events
 *   inside that `seen`. `Archive.applyEvents` merges, stores and rebuilds its tables from
 *   `deriveArchiveState`.
 * - A project `limits-changed` replaces the project limits whole (as the archive's
 *   setLimits does), rather than adding to them.
 */
export { sha256Hex, sha256OfText, sha256HexAsync } from './sha256';
export { canonicalJson } from './canonical';
export { base64Encode, base64Decode } from './base64';
export { journalKeyOf, happenedBefore, concurrent, compareEventOrder, sortEvents } from './causality';
export {
  serializeEvent, eventHash, journalFileName, parseJournalFileName, readJournal, startCursor,
  type JournalIssue, type JournalIssueKind, type JournalCursor, type JournalReadResult,
} from './journal-file';
export { validateEventShape, EVENT_KINDS } from './validate';
export { JournalWriter, type WriterHead, type WrittenEvent } from './writer';
export { deriveArchiveState, picksVersionOf, picksVersionForTest, conflictIdOf, pickSlotKey, NO_EVENT, type DeriveOptions } from './derive';
export type * from './derived-types';
export { mergeEventSets, readJournalSet, type MergeResult, type IdCollision, type JournalSetRead } from './merge';
export {
  exportBundle, importBundle, journalTextsFromEvents, BUNDLE_MAGIC, BUNDLE_NOTICE,
  type RawFile, type JournalText, type BundleContents, type ImportedBundle,
} from './bundle';
export { syncStatus, describeEvent, type SyncStatus, type ChangeLine, type PersonActivity } from './sync-status';
