import type {
  ApplyOutcome, ArchiveQuery, ArchiveSettings, FieldRow, ImportFileInput, ImportOptions, ImportOutcome,
  MissingRawFile, SavedMapping, StateCounts, TeamArchiveService, TeamConflict, TestDetail, TestHeader, TestSummary, UserRow, WellRow,
} from './api';
import type { ArchiveEvent } from './events';
import type { Pick as EnginePick, PickKind } from '../engine/result';
import type { UnitSystem } from '../engine/units/unitSystem';
import { StressLedgerDb } from './db';
import type { ArchiveEngine } from './engine-port';
import { ArchiveError } from './errors';
import type { Finding } from './journal/derived-types';
import type { SyncStatus } from './journal/sync-status';
import { ensureDevice, notifyListeners, type ArchiveContext, type FixedAuthoring } from './archive-context';
import { eventsForTest, listEvents, withFixedAuthoring } from './archive-events';
import { countByState, forgetList, listTests } from './archive-list';
import { getTest, getTestDetail, getTestHeader, regradeAll } from './archive-analysis';
import { listFields, listWells, setWellSurvey } from './archive-wells';
import { importFiles } from './archive-import';
import { comment, movePick, reject, reopen, requestReview, resetPicks, signOff } from './archive-review';
import { addUser, getMapping, getSettings, listUsers, saveMapping, setLimits, setUnitSystem } from './archive-settings';
import { applyEvents, conflicts, findings, missingRawFiles, rebuild, resolveConflict } from './archive-team';
import { exportBundle, importBundle, markSynced, rawFile, syncStatus } from './archive-bundles';
import { exportBackup, restoreBackup } from './archive-backup';

export type { FixedAuthoring } from './archive-context';
export { fieldIdOf, wellIdOf } from './archive-wells';
export { foldPicks } from './archive-analysis';

/**
 * The `Archive` service over Dexie. This file is the shell: opening, closing, change
 * listeners, and one delegating method per service call. The work lives beside it:
 * archive-context.ts (shared state, the write transaction), archive-events.ts (the
 * review log), archive-list.ts, archive-analysis.ts, archive-wells.ts, archive-import.ts,
 * archive-review.ts, archive-settings.ts, archive-team.ts, archive-rebuild.ts,
 * archive-bundles.ts and archive-backup.ts.
 */

export interface ArchiveConfig {
  engine: ArchiveEngine;
  /** IndexedDB database name (default 'stress-ledger'); ignored when `db` is given. */
  databaseName?: string;
  db?: StressLedgerDb;
  /** Clock, for tests. */
  now?: () => Date;
}

/**
 * The archive service over Dexie: tests, samples, picks, review log, users, mappings and
 * settings. Every change runs in one Dexie transaction and appends its events to the
 * review log (append-only: this class has no way to change or remove an event, and hooks
 * refuse it).
 */
export class Archive implements TeamArchiveService {
  readonly db: StressLedgerDb;
  private readonly context: ArchiveContext;

  private constructor(config: ArchiveConfig) {
    const db = config.db ?? new StressLedgerDb(config.databaseName);
    const channel = typeof BroadcastChannel === 'function' ? new BroadcastChannel(`stress-ledger-archive:${db.name}`) : null;
    const context: ArchiveContext = {
      db, engine: config.engine, now: config.now ?? (() => new Date()), listeners: new Set(), channel,
      device: '', restoring: false, listCache: null, cacheGeneration: 0, fixed: null,
      teamQueue: Promise.resolve(), epoch: 0, derivedCache: null,
    };
    this.db = db;
    this.context = context;
    const refuse = () => {
      if (context.restoring) return;
      throw new ArchiveError('bad-argument', 'The review log is append-only: events are never changed or removed.');
    };
    db.events.hook('updating', refuse);
    db.events.hook('deleting', refuse);
    if (channel) {
      channel.onmessage = () => { forgetList(context); notifyListeners(context); };
      (channel as { unref?: () => void }).unref?.();
    }
  }

  /** Open (creating or upgrading) the database and return the service. */
  static async open(config: ArchiveConfig): Promise<Archive> {
    const archive = new Archive(config);
    await archive.db.open();
    await ensureDevice(archive.context);
    return archive;
  }

  close(): void { this.context.channel?.close(); this.db.close(); }

  /** This installation's device id (kept in settings). */
  deviceId(): string { return this.context.device; }

  subscribe(listener: () => void): () => void {
    const { listeners } = this.context;
    listeners.add(listener);
    return () => { listeners.delete(listener); };
  }

  // ----- review log and reading ------------------------------------------------------------

  eventsForTest(testId: string): Promise<ArchiveEvent[]> { return eventsForTest(this.context, testId); }
  listEvents(afterClock = 0): Promise<ArchiveEvent[]> { return listEvents(this.context, afterClock); }
  listTests(query: ArchiveQuery = {}): Promise<TestSummary[]> { return listTests(this.context, query); }
  countByState(query: ArchiveQuery = {}): Promise<StateCounts> { return countByState(this.context, query); }
  async isEmpty(): Promise<boolean> { return (await this.db.tests.count()) === 0; }
  listFields(): Promise<FieldRow[]> { return listFields(this.context); }
  listWells(fieldId?: string): Promise<WellRow[]> { return listWells(this.context, fieldId); }
  getTest(testId: string): Promise<TestDetail> { return getTest(this.context, testId); }
  getTestHeader(testId: string): Promise<TestHeader> { return getTestHeader(this.context, testId); }
  getTestDetail(header: TestHeader): Promise<TestDetail> { return getTestDetail(this.context, header); }

  // ----- import and wells --------------------------------------------------------------

  importFiles(files: ImportFileInput[], user: string, options: ImportOptions = {}): Promise<ImportOutcome[]> {
    return importFiles(this.context, files, user, options);
  }

  setWellSurvey(wellId: string, stations: { md: number; inc: number; azi: number }[], user: string, sourceFile?: string): Promise<WellRow> {
    return setWellSurvey(this.context, wellId, stations, user, sourceFile);
  }

  // ----- picks and review --------------------------------------------------------------

  movePick(testId: string, cycle: number, kind: PickKind, pick: EnginePick | null, reason: string, user: string): Promise<TestDetail> {
    return movePick(this.context, testId, cycle, kind, pick, reason, user);
  }

  resetPicks(testId: string, reason: string, user: string): Promise<TestDetail> { return resetPicks(this.context, testId, reason, user); }
  requestReview(testId: string, user: string, note?: string): Promise<TestSummary> { return requestReview(this.context, testId, user, note); }
  signOff(testId: string, user: string, note?: string): Promise<TestSummary> { return signOff(this.context, testId, user, note); }
  reject(testId: string, user: string, reason: string): Promise<TestSummary> { return reject(this.context, testId, user, reason); }
  reopen(testId: string, user: string, reason: string): Promise<TestSummary> { return reopen(this.context, testId, user, reason); }
  comment(testId: string, user: string, text: string): Promise<void> { return comment(this.context, testId, user, text); }

  // ----- users, mappings, settings -----------------------------------------------------

  listUsers(): Promise<UserRow[]> { return listUsers(this.context); }
  addUser(name: string): Promise<UserRow> { return addUser(this.context, name); }
  saveMapping(mapping: Omit<SavedMapping, 'savedAt'>): Promise<SavedMapping> { return saveMapping(this.context, mapping); }
  getMapping(layout: string): Promise<SavedMapping | null> { return getMapping(this.context, layout); }
  getSettings(): Promise<ArchiveSettings> { return getSettings(this.context); }

  setLimits(limits: Record<string, number>, user: string, reason: string): Promise<ArchiveSettings> {
    return setLimits(this.context, limits, user, reason);
  }

  setUnitSystem(unitSystem: UnitSystem): Promise<ArchiveSettings> { return setUnitSystem(this.context, unitSystem); }

  regradeAll(onProgress?: (done: number, total: number) => void): Promise<number> { return regradeAll(this.context, onProgress); }

  // ----- team journal ------------------------------------------------------------------

  /**
   * Run `work` with fixed authoring (see FixedAuthoring): for the demo seed, so two fresh
   * machines make the same demo events and exchanging bundles adds no duplicate tests.
   * @throws ArchiveError 'bad-state' when the archive already holds events.
   */
  withFixedAuthoring<T>(authoring: FixedAuthoring, work: () => Promise<T>): Promise<T> {
    return withFixedAuthoring(this.context, authoring, work);
  }

  applyEvents(incoming: readonly ArchiveEvent[], rawFiles?: ReadonlyMap<string, Uint8Array>): Promise<ApplyOutcome> {
    return applyEvents(this.context, incoming, rawFiles);
  }

  conflicts(options: { testId?: string; includeResolved?: boolean } = {}): Promise<TeamConflict[]> { return conflicts(this.context, options); }
  findings(): Promise<Finding[]> { return findings(this.context); }

  resolveConflict(conflictId: string, keep: string, user: string, reason: string): Promise<TeamConflict> {
    return resolveConflict(this.context, conflictId, keep, user, reason);
  }

  markSynced(journal: string, seq: number): Promise<void> { return markSynced(this.context, journal, seq); }

  syncStatus(user: string, options: { folderReachable?: boolean | null; writtenSeq?: number } = {}): Promise<SyncStatus> {
    return syncStatus(this.context, user, options);
  }

  exportBundle(user?: string): Promise<Uint8Array> { return exportBundle(this.context, user); }
  importBundle(bytes: Uint8Array, fileName: string): Promise<ApplyOutcome> { return importBundle(this.context, bytes, fileName); }
  missingRawFiles(): Promise<MissingRawFile[]> { return missingRawFiles(this.context); }
  rawFile(hash: string): Promise<Uint8Array | null> { return rawFile(this.context, hash); }

  /** Build tables for tests the log knows and whose raw files are here (e.g. after they arrived). */
  rebuild(): Promise<MissingRawFile[]> { return rebuild(this.context); }

  // ----- backup ------------------------------------------------------------------------

  exportBackup(): Promise<Uint8Array> { return exportBackup(this.context); }
  restoreBackup(bytes: Uint8Array): Promise<void> { return restoreBackup(this.context, bytes); }
}
