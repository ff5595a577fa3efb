import type { AnalysisResult, Grade, Pick, PickKind } from '../engine/result';
import type { ColumnMapping, TestMetadata, TestType } from '../engine/record';
import type { UnitSystem } from '../engine/units/unitSystem';
import type { ArchiveEvent, ReviewState } from './events';
import type { Conflict, Finding } from './journal/derived-types';
import type { SyncStatus } from './journal/sync-status';

/**
 * What the app asks of the archive. The Dexie implementation lives in this folder;
 * screens use only this interface so they can be tested against an in-memory one.
 * All numbers SI.
 */

export interface FieldRow { id: string; name: string }
export interface WellRow {
  id: string; fieldId: string; name: string; location?: string;
  rigFloorElevation?: number; waterDepth?: number;
  survey?: { md: number; inc: number; azi: number }[];
}

/** One row of the archive list: everything the list shows, no samples. */
export interface TestSummary {
  id: string;
  fieldId: string; fieldName: string;
  wellId: string; wellName: string;
  type: TestType; typeInferred: boolean;
  depthTvd: number | null; depthMd: number | null;
  /** Shmin estimate or bound, Pa. */
  shmin: number | null;
  shminKind: 'estimate' | 'lower-bound' | 'upper-bound' | null;
  grade: Grade;
  state: ReviewState;
  /** Who signed off or rejected, when accepted or rejected. */
  reviewer: string | null;
  /** Last user who changed picks (or the importer). */
  lastPickAuthor: string | null;
  fileName: string; fileHash: string;
  importedAt: string; importedBy: string;
  contractor?: string;
  /** Tested formation from the test's metadata (absent when the file names none); derived, not indexed. */
  formation?: string;
  /** Ids of unresolved team conflicts on this test (added with the team journal; absent when none). */
  openConflicts?: string[];
}

export interface StoredSamples {
  time: Float64Array; pressure: Float64Array; rate: Float64Array; volume: Float64Array;
}

export interface TestDetail {
  summary: TestSummary;
  metadata: TestMetadata;
  samples: StoredSamples;
  /** Analysis with manual picks applied. */
  analysis: AnalysisResult;
  /** Manual picks in force: cycle -> kind -> pick. */
  manualPicks: { cycle: number; kind: PickKind; pick: Pick | null; reason: string; author: string; time: string }[];
  log: ArchiveEvent[];
}

/**
 * A test as read from the archive, before its analysis (getTestHeader): enough to draw the
 * pressure-time chart at once. The analysis follows with getTestDetail.
 */
export interface TestHeader {
  /** The stored summary (grade and Shmin as of the last analysis). */
  summary: TestSummary;
  metadata: TestMetadata;
  samples: StoredSamples;
  /** Manual picks in force when read. */
  manualPicks: TestDetail['manualPicks'];
  /**
   * Pressure at the tested depth, Pa, one per sample: the gauge readings plus the constant
   * hydrostatic correction (engine/analysis/downhole.ts); null when the metadata cannot give
   * it (the analysis then reports why).
   */
  downholePressure: Float64Array | null;
  /** The correction added to each gauge reading, Pa (0 for a downhole gauge); null with downholePressure. */
  hydrostaticCorrection: number | null;
}

export interface ImportOutcome {
  fileName: string;
  status: 'imported' | 'duplicate' | 'failed';
  testId?: string;
  /** For duplicates: the test that already holds this file. */
  existingTestId?: string;
  error?: { code: string; message: string; line?: number; column?: number };
}

export interface ArchiveQuery {
  fieldId?: string; wellSearch?: string; type?: TestType; grade?: Grade; state?: ReviewState;
  sortBy?: keyof TestSummary; descending?: boolean;
}

// ---------------------------------------------------------------------------
// Service interface (added with the Dexie implementation in archive/archive.ts).
// ---------------------------------------------------------------------------

/** A file handed to the archive for import: the bridge's PickedFile has this shape. */
export interface ImportFileInput {
  name: string;
  /** Path inside a picked folder, or the file name. */
  relativePath?: string;
  bytes: Uint8Array;
}

/** Options of one import run; applied to every file of the run. */
export interface ImportOptions {
  /** Test type to use instead of the inferred one. */
  type?: TestType;
  /** Metadata that wins over the file's own (e.g. well or depth typed in by the user). */
  overrides?: Partial<TestMetadata>;
  /** Field name used when the file names none (default "Unassigned field"). */
  defaultFieldName?: string;
  /** Well name used when the file names none (default: the file name without extension). */
  defaultWellName?: string;
  /** Passed unchanged to the engine's file importer (column mapping confirmed by the user ...). */
  parseOptions?: Record<string, unknown>;
  /** Called after each file with the count done so far. */
  onProgress?: (done: number, total: number, fileName: string) => void;
}

/** Number of tests in each review state (for the list's tabs). */
export interface StateCounts {
  imported: number;
  'in-review': number;
  accepted: number;
  rejected: number;
  total: number;
}

export interface UserRow { name: string; createdAt: string }

/** A column mapping confirmed by a user, remembered per contractor layout signature. */
export interface SavedMapping {
  /** Layout signature (RecordSource.layout). */
  layout: string;
  columns: ColumnMapping[];
  contractor?: string;
  savedBy: string;
  savedAt: string;
}

/** Project settings kept in the archive. */
export interface ArchiveSettings {
  /** Quality criteria limits overriding the engine defaults, by limit key. */
  limits: Record<string, number>;
  unitSystem: UnitSystem;
}

/** Stable codes of the archive's typed errors (ArchiveError in archive/errors.ts). Add, never rename. */
export type ArchiveErrorCode =
  | 'not-found'
  | 'four-eyes'
  | 'reason-required'
  | 'bad-state'
  | 'bad-user'
  | 'bad-argument'
  | 'bad-backup'
  | 'backup-version';

/**
 * Everything the screens ask of the archive. Implemented by `Archive` (archive/archive.ts)
 * over Dexie. Every mutating call appends events to the review log; nothing updates or
 * deletes an event. Errors are `ArchiveError` (code above) or, for unreadable files inside
 * `importFiles`, reported per file in the outcome.
 */
export interface ArchiveService {
  /** Summaries matching the query, sorted; never loads samples. */
  listTests(query?: ArchiveQuery): Promise<TestSummary[]>;
  /** Number of tests per review state, with the same filters as listTests (state ignored). */
  countByState(query?: ArchiveQuery): Promise<StateCounts>;
  /** A test with samples, re-analysed with its manual picks and the project limits. */
  getTest(testId: string): Promise<TestDetail>;
  /**
   * A test with samples and downhole pressure but no analysis, read without running the
   * engine (for drawing the record at once). Optional so other implementations stay valid.
   */
  getTestHeader?(testId: string): Promise<TestHeader>;
  /**
   * The full detail of a test read with getTestHeader: its samples (the header's own arrays)
   * analysed with the manual picks and project limits in force now, as getTest gives.
   */
  getTestDetail?(header: TestHeader): Promise<TestDetail>;
  listFields(): Promise<FieldRow[]>;
  listWells(fieldId?: string): Promise<WellRow[]>;
  /** Replace a well's directional survey (MD m, inclination and azimuth in degrees). */
  setWellSurvey(wellId: string, stations: { md: number; inc: number; azi: number }[], user: string, sourceFile?: string): Promise<WellRow>;
  /** Import files: each enters whole (one transaction) or not at all; one outcome per file, in order. */
  importFiles(files: ImportFileInput[], user: string, options?: ImportOptions): Promise<ImportOutcome[]>;
  /** Set (pick) or remove (null) a pick by hand. On an accepted or rejected test this reopens the review. */
  movePick(testId: string, cycle: number, kind: PickKind, pick: Pick | null, reason: string, user: string): Promise<TestDetail>;
  /** Drop every manual pick of a test (back to the automatic picks). Reopens an accepted test. */
  resetPicks(testId: string, reason: string, user: string): Promise<TestDetail>;
  requestReview(testId: string, user: string, note?: string): Promise<TestSummary>;
  /** Accept a test in review. Refused (code 'four-eyes') when `user` last changed the picks, or imported it and nobody did. */
  signOff(testId: string, user: string, note?: string): Promise<TestSummary>;
  /** Reject a test; a reason is required (code 'reason-required'). */
  reject(testId: string, user: string, reason: string): Promise<TestSummary>;
  /** Put an accepted or rejected test back in review; a reason is required. */
  reopen(testId: string, user: string, reason: string): Promise<TestSummary>;
  comment(testId: string, user: string, text: string): Promise<void>;
  /** The test's review log, oldest first. */
  eventsForTest(testId: string): Promise<ArchiveEvent[]>;
  /** The whole log in Lamport order (for the team journal). */
  listEvents(afterClock?: number): Promise<ArchiveEvent[]>;
  listUsers(): Promise<UserRow[]>;
  addUser(name: string): Promise<UserRow>;
  saveMapping(mapping: Omit<SavedMapping, 'savedAt'>): Promise<SavedMapping>;
  getMapping(layout: string): Promise<SavedMapping | null>;
  getSettings(): Promise<ArchiveSettings>;
  /** Replace the project limits (logged with a reason). Summaries are re-graded lazily by getTest, or all at once by regradeAll. */
  setLimits(limits: Record<string, number>, user: string, reason: string): Promise<ArchiveSettings>;
  setUnitSystem(unitSystem: UnitSystem): Promise<ArchiveSettings>;
  /** Re-run the analysis of every test with the current limits; returns the number of summaries whose grade changed. */
  regradeAll(onProgress?: (done: number, total: number) => void): Promise<number>;
  /** True when the archive holds no test (the app seeds the demo archive then). */
  isEmpty(): Promise<boolean>;
  /** The whole archive as one file (see archive/backup.ts for the format). */
  exportBackup(): Promise<Uint8Array>;
  /** Replace the whole archive with a backup made by exportBackup. */
  restoreBackup(bytes: Uint8Array): Promise<void>;
  /** Called after every change to the archive; returns an unsubscribe function. */
  subscribe(listener: () => void): () => void;
}

// ---------------------------------------------------------------------------
// Team journal (added with the shared folder and bundles; see archive/journal/index.ts).
// ---------------------------------------------------------------------------

/** Something noticed while taking in team changes that is neither a conflict nor a finding. */
export interface TeamIssue {
  /** e.g. 'torn-tail', 'chain-broken' (journal damage), 'id-collision', 'bad-event', 'raw-damaged', 'raw-unreadable'. */
  kind: string;
  message: string;
  file?: string;
  line?: number;
  column?: number;
}

/** A test whose import is known but whose raw file is not here yet (its samples cannot be built). */
export interface MissingRawFile { testId: string; fileHash: string; fileName: string }

/** What applying team changes (a bundle, the team folder) did. */
export interface ApplyOutcome {
  /** Events new to this archive. */
  added: number;
  /** Copies of events already held. */
  duplicates: number;
  /** Unresolved conflicts that involve an added event. */
  conflicts: TeamConflict[];
  /** Findings (four eyes, unknown test, ...) about added events. */
  findings: Finding[];
  issues: TeamIssue[];
  missingRawFiles: MissingRawFile[];
}

/** One event of a conflict, in plain words. */
export interface ConflictEventLine { id: string; author: string; device: string; time: string; kind: string; summary: string }

/** A conflict with its events described, for the conflict list. */
export interface TeamConflict extends Conflict { events: ConflictEventLine[] }

/**
 * The archive with team sharing: everything of ArchiveService, plus taking in events of
 * other people (bundles, the team folder), conflicts and their decisions, and the sync
 * status. Implemented by `Archive` (archive/archive.ts).
 */
export interface TeamArchiveService extends ArchiveService {
  /** This installation's device id. */
  deviceId(): string;
  /** Merge events from elsewhere and rebuild the affected tests; raw files by SHA-256 build samples of newly known tests. */
  applyEvents(incoming: readonly ArchiveEvent[], rawFiles?: ReadonlyMap<string, Uint8Array>): Promise<ApplyOutcome>;
  /** Conflicts, oldest first: unresolved only unless `includeResolved`. */
  conflicts(options?: { testId?: string; includeResolved?: boolean }): Promise<TeamConflict[]>;
  /** Findings of the whole log (four eyes, events about unknown tests, ...). */
  findings(): Promise<Finding[]>;
  /** Decide a conflict: keep one of its events, or NO_EVENT ('none') to void a sign-off conflict. A reason is required. */
  resolveConflict(conflictId: string, keep: string, user: string, reason: string): Promise<TeamConflict>;
  /** What is waiting to sync for `user` on this device, and who changed what. */
  syncStatus(user: string, options?: { folderReachable?: boolean | null; writtenSeq?: number }): Promise<SyncStatus>;
  /** Record that the journal's events up to `seq` are in the team folder (or an exported bundle). */
  markSynced(journal: string, seq: number): Promise<void>;
  /** Every journal and raw file as one team bundle file. */
  exportBundle(user?: string): Promise<Uint8Array>;
  /** Check a bundle (refused whole with EngineError 'bad-bundle' when damaged) and apply its events. */
  importBundle(bytes: Uint8Array, fileName: string): Promise<ApplyOutcome>;
  /** Tests known from the log whose raw file is not here. */
  missingRawFiles(): Promise<MissingRawFile[]>;
  /** A raw file by SHA-256, or null. */
  rawFile(hash: string): Promise<Uint8Array | null>;
}
