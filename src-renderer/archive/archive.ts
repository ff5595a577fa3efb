import Dexie from 'dexie';
import type {
  ApplyOutcome, ArchiveQuery, ArchiveSettings, FieldRow, ImportFileInput, ImportOptions, ImportOutcome,
  MissingRawFile, SavedMapping, StateCounts, TeamArchiveService, TeamConflict, TeamIssue, TestDetail, TestSummary, UserRow, WellRow,
} from './api';
import type { ArchiveEvent, ArchiveEventBody, ReviewState } from './events';
import type { AnalysisOptions } from '../engine/analysis-options';
import type { TestMetadata, TestRecord } from '../engine/record';
import { PICK_KINDS, type AnalysisResult, type Pick as EnginePick, type PickKind } from '../engine/result';
import { UNIT_SYSTEMS, type UnitSystem } from '../engine/units/unitSystem';
import {
  StressLedgerDb, journalRowOf, nameKey, type StoredEvent, type StoredField, type StoredJournal, type StoredPick, type StoredSamples,
  type StoredTest, type StoredWell,
} from './db';
import type { ArchiveEngine } from './engine-port';
import { ArchiveError } from './errors';
import {
  normaliseUserName, requireReason, stateAfterPickChange, stateAfterRejection, stateAfterReopen,
  stateAfterReviewRequest, stateAfterSignOff,
} from './review-rules';
import { canonicalJson } from './journal/canonical';
import { sha256Hex, sha256HexAsync, sha256OfText } from './journal/sha256';
import { validateEventShape } from './journal/validate';
import { mergeEventSets } from './journal/merge';
import { deriveArchiveState, NO_EVENT, picksVersionForTest } from './journal/derive';
import type { DerivedState, DerivedTest, Finding } from './journal/derived-types';
import { exportBundle, importBundle, journalTextsFromEvents } from './journal/bundle';
import { describeEvent, syncStatus, type SyncStatus } from './journal/sync-status';
import {
  eventsSeenWith, manualPicksOf, pickAuthorOf, picksKeyOf, seenVectorOf, storedEventOf, type ManualPick,
} from './team-rebuild';
import { decodeBackup, encodeBackup, type TableDump } from './backup';
import { compareSummaries, matchesQuery, toListRow, toSummary, type ListRow } from './query';
import { describeImportFailure } from './import-failure';

export interface ArchiveConfig {
  engine: ArchiveEngine;
  /** IndexedDB database name (default 'stress-ledger'); ignored when `db` is given. */
  databaseName?: string;
  db?: StressLedgerDb;
  /** Clock, for tests. */
  now?: () => Date;
}

const DEFAULT_FIELD_NAME = 'Unassigned field';

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

/** One table rewrite planned by the team rebuild (analysis done before the transaction). */
interface RebuildPlan {
  fields: StoredField[];
  wells: StoredWell[];
  tests: StoredTest[];
  samples: StoredSamples[];
  grades: ReturnType<typeof gradeRow>[];
  picks: { testId: string; rows: StoredPick[] }[];
  deleted: string[];
  projectLimits: Record<string, number> | null;
  missing: MissingRawFile[];
  issues: TeamIssue[];
}

/**
 * The archive service over Dexie: tests, samples, picks, review log, users, mappings and
 * settings. Every change runs in one Dexie transaction and appends its events to the
 * review log (append-only: this class has no way to change or remove an event, and hooks
 * refuse it).
 */
export class Archive implements TeamArchiveService {
  readonly db: StressLedgerDb;
  private readonly engine: ArchiveEngine;
  private readonly now: () => Date;
  private readonly listeners = new Set<() => void>();
  private device = '';
  private restoring = false;
  private listCache: Map<string, ListRow> | null = null;
  private cacheGeneration = 0;
  private readonly channel: BroadcastChannel | null;
  private fixed: (FixedAuthoring & { start: number }) | null = null;
  private teamQueue: Promise<unknown> = Promise.resolve();
  private epoch = 0;
  private derivedCache: { count: number; epoch: number; state: DerivedState; events: ArchiveEvent[] } | null = null;

  private constructor(config: ArchiveConfig) {
    this.db = config.db ?? new StressLedgerDb(config.databaseName);
    this.engine = config.engine;
    this.now = config.now ?? (() => new Date());
    const refuse = () => {
      if (this.restoring) return;
      throw new ArchiveError('bad-argument', 'The review log is append-only: events are never changed or removed.');
    };
    this.db.events.hook('updating', refuse);
    this.db.events.hook('deleting', refuse);
    this.channel = typeof BroadcastChannel === 'function' ? new BroadcastChannel(`stress-ledger-archive:${this.db.name}`) : null;
    if (this.channel) {
      this.channel.onmessage = () => { this.forgetList(); this.changed(); };
      (this.channel as { unref?: () => void }).unref?.();
    }
  }

  private forgetList(): void {
    this.listCache = null;
    this.cacheGeneration += 1;
  }

  /** Keep the in-memory list in step with rows this instance wrote (after commit). */
  private rememberRows(rows: StoredTest[]): void {
    if (this.listCache) for (const row of rows) this.listCache.set(row.id, toListRow(row));
    if (rows.length) this.cacheGeneration += 1;
  }

  /** Open (creating or upgrading) the database and return the service. */
  static async open(config: ArchiveConfig): Promise<Archive> {
    const archive = new Archive(config);
    await archive.db.open();
    await archive.ensureDevice();
    return archive;
  }

  close(): void { this.channel?.close(); this.db.close(); }

  /** This installation's device id (kept in settings). */
  deviceId(): string { return this.device; }

  private async ensureDevice(): Promise<void> {
    const stored = await this.db.settings.get('device');
    if (typeof stored?.value === 'string' && stored.value) { this.device = stored.value; return; }
    this.device = crypto.randomUUID();
    await this.db.settings.put({ key: 'device', value: this.device });
  }

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => { this.listeners.delete(listener); };
  }

  private changed(): void {
    for (const listener of [...this.listeners]) {
      try { listener(); } catch { /* a listener's failure is its own */ }
    }
  }

  private nowIso(): string { return this.fixed ? this.fixed.startTime : this.now().toISOString(); }

  // ----- review log -------------------------------------------------------------------

  /** The journals this device's new events see (in fixed authoring: that device's only). */
  private async localJournals(): Promise<StoredJournal[]> {
    const rows = await this.db.journals.toArray();
    return this.fixed ? rows.filter((r) => r.device === this.fixed!.device) : rows;
  }

  /**
   * Append one event; call inside a read-write transaction over all tables. Fills the
   * envelope: `seq` (next in the author's journal on this device), `prev` (the hash of the
   * journal's last event), `seen` (how far every other journal held here goes), the
   * Lamport clock (highest held + 1), and the row's hash = the journal line's SHA-256.
   */
  private async appendEvent(author: string, body: ArchiveEventBody): Promise<StoredEvent> {
    const device = this.fixed?.device ?? this.device;
    const journal = `${author}@${device}`;
    const rows = await this.localJournals();
    const own = rows.find((r) => r.key === journal);
    const seq = (own?.lastSeq ?? 0) + 1;
    const clock = rows.reduce((m, r) => Math.max(m, r.clock), 0) + 1;
    const event: ArchiveEvent = {
      id: this.fixed ? `${journal}#${seq}` : crypto.randomUUID(),
      author,
      device,
      time: this.fixed ? new Date(this.fixed.start + clock * 60_000).toISOString() : this.nowIso(),
      clock,
      prev: own?.lastHash ?? '',
      seq,
      seen: seenVectorOf(rows, journal),
      body,
    };
    const row = storedEventOf(event);
    await this.db.events.add(row);
    await this.db.journals.put({
      key: journal, author, device,
      seq: !own || own.seq === own.lastSeq ? seq : own.seq,
      lastSeq: seq, lastHash: row.hash, clock, events: (own?.events ?? 0) + 1,
    });
    if (!(await this.db.users.get(author))) await this.db.users.add({ name: author, createdAt: event.time });
    this.derivedCache = null;
    return row;
  }

  /**
   * Run `work` in one read-write transaction over every table; rows it reports through
   * `touch` enter the in-memory list once the transaction has committed.
   */
  private write<T>(work: (touch: (row: StoredTest) => void) => Promise<T>): Promise<T> {
    const touched: StoredTest[] = [];
    const touch = (row: StoredTest) => { touched.push(row); };
    return this.db.transaction('rw', this.db.tables, async () => await work(touch)).then((value) => {
      this.rememberRows(touched);
      this.channel?.postMessage('changed');
      this.changed();
      return value;
    });
  }

  async eventsForTest(testId: string): Promise<ArchiveEvent[]> {
    const rows = await this.db.events.where('[testId+clock]').between([testId, Dexie.minKey], [testId, Dexie.maxKey]).toArray();
    return rows.map(toEvent);
  }

  async listEvents(afterClock = 0): Promise<ArchiveEvent[]> {
    const rows = await this.db.events.where('clock').above(afterClock).toArray();
    return rows.map(toEvent);
  }

  // ----- reading -----------------------------------------------------------------------

  async listTests(query: ArchiveQuery = {}): Promise<TestSummary[]> {
    const rows = await this.listRows();
    const out: TestSummary[] = [];
    for (const row of rows.values()) if (matchesQuery(row, query)) out.push(toSummary(row));
    out.sort((a, b) => compareSummaries(a, b, query.sortBy ?? 'importedAt', query.descending ?? query.sortBy === undefined));
    return out;
  }

  /**
   * The list rows of every test, kept in memory after the first read (summaries only: a
   * few hundred bytes per test) and updated by this instance's writes; another window's
   * writes clear it through a BroadcastChannel.
   */
  private async listRows(): Promise<Map<string, ListRow>> {
    if (this.listCache) return this.listCache;
    const generation = this.cacheGeneration;
    const rows = new Map<string, ListRow>();
    // One bulk read (getAll) rather than a cursor: a cursor costs a round trip per row.
    for (const row of await this.db.tests.toArray()) rows.set(row.id, toListRow(row));
    if (generation === this.cacheGeneration) this.listCache = rows;
    return rows;
  }

  async countByState(query: ArchiveQuery = {}): Promise<StateCounts> {
    const states: ReviewState[] = ['imported', 'in-review', 'accepted', 'rejected'];
    const counts: StateCounts = { imported: 0, 'in-review': 0, accepted: 0, rejected: 0, total: 0 };
    const filter = { ...query, state: undefined };
    for (const row of (await this.listRows()).values()) if (matchesQuery(row, filter)) counts[row.state] += 1;
    counts.total = states.reduce((sum, s) => sum + counts[s], 0);
    return counts;
  }

  async isEmpty(): Promise<boolean> { return (await this.db.tests.count()) === 0; }

  async listFields(): Promise<FieldRow[]> {
    const rows = await this.db.fields.toArray();
    return rows.map(({ id, name }) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));
  }

  async listWells(fieldId?: string): Promise<WellRow[]> {
    const rows = fieldId ? await this.db.wells.where('fieldId').equals(fieldId).toArray() : await this.db.wells.toArray();
    return rows.map(stripWell).sort((a, b) => a.name.localeCompare(b.name));
  }

  async getTest(testId: string): Promise<TestDetail> {
    // The reads go out together, and the review log is read while the engine analyses.
    const [test, samples, manualPicks, settings] = await Promise.all([
      this.requireTest(testId), this.db.samples.get(testId), this.manualPicksInForce(testId), this.getSettings(),
    ]);
    if (!samples) throw new ArchiveError('not-found', `The samples of test ${testId} are missing.`);
    const limits = settings.limits;
    const log = this.eventsForTest(testId);
    log.catch(() => { /* reported where awaited below */ });
    const analysis = await this.engine.analyse(recordOf(test, samples), analysisOptions(test, limits, manualPicks));
    const updated = { ...test, ...summaryFromAnalysis(analysis) };
    if (updated.grade !== test.grade || updated.shmin !== test.shmin || updated.shminKind !== test.shminKind) {
      await this.db.transaction('rw', [this.db.tests, this.db.grades], async () => {
        await this.db.tests.put(updated);
        await this.db.grades.put(gradeRow(testId, analysis, limits, this.nowIso()));
      });
      this.rememberRows([updated]);
      this.channel?.postMessage('changed');
      this.changed();
    }
    return {
      summary: toSummary(updated),
      metadata: test.metadata,
      samples: { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume },
      analysis,
      manualPicks,
      log: await log,
    };
  }

  private async requireTest(testId: string): Promise<StoredTest> {
    const test = await this.db.tests.get(testId);
    if (!test) throw new ArchiveError('not-found', `No test with id ${testId}.`);
    return test;
  }

  private async manualPicksInForce(testId: string): Promise<ManualPick[]> {
    const rows = await this.db.picks.where('testId').equals(testId).sortBy('seq');
    return foldPicks(rows);
  }

  // ----- import ------------------------------------------------------------------------

  async importFiles(files: ImportFileInput[], user: string, options: ImportOptions = {}): Promise<ImportOutcome[]> {
    const importer = normaliseUserName(user);
    const outcomes: ImportOutcome[] = [];
    const limits = (await this.getSettings()).limits;
    for (let i = 0; i < files.length; i++) {
      outcomes.push(await this.importOne(files[i], importer, options, limits));
      options.onProgress?.(i + 1, files.length, files[i].name);
    }
    return outcomes;
  }

  private async importOne(file: ImportFileInput, user: string, options: ImportOptions, limits: Record<string, number>): Promise<ImportOutcome> {
    const fileName = file.name;
    try {
      const hash = await sha256HexAsync(file.bytes);
      const existing = await this.db.tests.where('fileHash').equals(hash).first();
      if (existing) return { fileName, status: 'duplicate', existingTestId: existing.id };
      const parsed = await this.engine.parse(file.bytes, fileName, options.parseOptions);
      const metadata: TestMetadata = { ...parsed.metadata, ...(options.overrides ?? {}) };
      const record: TestRecord = { ...parsed, metadata };
      const analysis = await this.engine.analyse(record, { type: options.type, overrides: options.overrides, limits });
      const testId = this.fixed ? `test-${hash.slice(0, 24)}` : crypto.randomUUID();
      const fieldName = cleanName(analysis.metadata.field ?? metadata.field) ?? options.defaultFieldName ?? DEFAULT_FIELD_NAME;
      const wellName = cleanName(analysis.metadata.well ?? metadata.well) ?? options.defaultWellName ?? fileName.replace(/\.[^.]+$/, '');
      const outcome = await this.write(async (touch): Promise<ImportOutcome> => {
        const again = await this.db.tests.where('fileHash').equals(hash).first();
        if (again) return { fileName, status: 'duplicate', existingTestId: again.id };
        const fieldId = await this.findOrCreateField(fieldName, user);
        const well = await this.findOrCreateWell(fieldId, wellName, user);
        const { time } = await this.appendEvent(user, {
          kind: 'test-imported', testId, wellId: well.id, type: analysis.type, typeInferred: analysis.typeInferred,
          metadata: analysis.metadata, fileHash: hash, fileName, layout: parsed.source.layout,
          ...(options.parseOptions ? { parseOptions: options.parseOptions } : {}),
        });
        const row: StoredTest = {
          id: testId, fieldId, fieldName: (await this.db.fields.get(fieldId))!.name, wellId: well.id, wellName: well.name,
          wellNameKey: nameKey(well.name), ...summaryFromAnalysis(analysis), state: 'imported', reviewer: null,
          lastPickAuthor: null, fileName, fileHash: hash, importedAt: time, importedBy: user,
          contractor: analysis.metadata.contractor, metadata: analysis.metadata, source: parsed.source,
        };
        await this.db.tests.add(row);
        touch(row);
        await this.db.samples.add({ testId, time: parsed.time, pressure: parsed.pressure, rate: parsed.rate, volume: parsed.volume });
        if (!(await this.db.rawFiles.get(hash))) {
          await this.db.rawFiles.add({ hash, bytes: file.bytes, size: file.bytes.length, fileName, storedAt: time });
        }
        await this.db.grades.put(gradeRow(testId, analysis, limits, time));
        return { fileName, status: 'imported', testId };
      });
      return outcome;
    } catch (error) {
      return { fileName, status: 'failed', error: describeImportFailure(error, fileName) };
    }
  }

  private async findOrCreateField(name: string, user: string): Promise<string> {
    const key = nameKey(name);
    const found = await this.db.fields.where('nameKey').equals(key).first();
    if (found) return found.id;
    const id = fieldIdOf(name);
    await this.db.fields.add({ id, name, nameKey: key });
    await this.appendEvent(user, { kind: 'field-created', fieldId: id, name });
    return id;
  }

  private async findOrCreateWell(fieldId: string, name: string, user: string): Promise<WellRow> {
    const key = nameKey(name);
    const found = await this.db.wells.where('[fieldId+nameKey]').equals([fieldId, key]).first();
    if (found) return stripWell(found);
    const well = { id: wellIdOf(fieldId, name), fieldId, name, nameKey: key };
    await this.db.wells.add(well);
    await this.appendEvent(user, { kind: 'well-created', wellId: well.id, fieldId, name });
    return stripWell(well);
  }

  async setWellSurvey(wellId: string, stations: { md: number; inc: number; azi: number }[], user: string, sourceFile?: string): Promise<WellRow> {
    const author = normaliseUserName(user);
    if (!Array.isArray(stations) || stations.some((s) => ![s.md, s.inc, s.azi].every(Number.isFinite) || s.inc < 0 || s.inc > 180 || s.azi < 0 || s.azi >= 360)) {
      throw new ArchiveError('bad-argument', 'Survey stations need finite MD (m), inclination 0-180 and azimuth 0-360 degrees.');
    }
    for (let i = 1; i < stations.length; i++) {
      if (!(stations[i].md > stations[i - 1].md)) throw new ArchiveError('bad-argument', `Survey station ${i + 1}: measured depth must increase.`);
    }
    return this.write(async () => {
      const well = await this.db.wells.get(wellId);
      if (!well) throw new ArchiveError('not-found', `No well with id ${wellId}.`);
      const copy = stations.map(({ md, inc, azi }) => ({ md, inc, azi }));
      await this.db.wells.update(wellId, { survey: copy });
      await this.appendEvent(author, { kind: 'survey-set', wellId, stations: copy, sourceFile });
      return stripWell({ ...well, survey: copy });
    });
  }

  // ----- picks and review --------------------------------------------------------------

  async movePick(testId: string, cycle: number, kind: PickKind, pick: EnginePick | null, reason: string, user: string): Promise<TestDetail> {
    const author = normaliseUserName(user);
    const why = requireReason(reason, 'change a pick');
    if (!Number.isInteger(cycle) || cycle < 1) throw new ArchiveError('bad-argument', 'The cycle number must be a whole number from 1.');
    if (!PICK_KINDS.includes(kind)) throw new ArchiveError('bad-argument', `Unknown pick kind "${kind}".`);
    if (pick && (![pick.pressure, pick.time].every(Number.isFinite) || !Number.isInteger(pick.sampleIndex) || pick.sampleIndex < 0)) {
      throw new ArchiveError('bad-argument', 'A pick needs a finite pressure (Pa), time (s) and a sample index.');
    }
    const stored: EnginePick | null = pick ? { ...pick, kind, manual: true, reason: why } : null;
    return this.changePicks(testId, author, why, (current) => [
      ...current.filter((p) => !(p.cycle === cycle && p.kind === kind)),
      { cycle, kind, pick: stored, reason: why, author, time: this.nowIso() },
    ], async (eventId, time) => {
      await this.db.picks.add({ testId, cycle, kind, pick: stored, reason: why, author, time, eventId });
    }, { kind: 'pick-moved', testId, cycle, pickKind: kind, pick: stored, reason: why });
  }

  async resetPicks(testId: string, reason: string, user: string): Promise<TestDetail> {
    const author = normaliseUserName(user);
    const why = requireReason(reason, 'reset the picks');
    return this.changePicks(testId, author, why, () => [], async (eventId, time) => {
      await this.db.picks.add({ testId, cycle: 0, kind: 'reset', pick: null, reason: why, author, time, eventId });
    }, { kind: 'picks-reset', testId, reason: why });
  }

  private async changePicks(
    testId: string, author: string, why: string,
    next: (current: ManualPick[]) => ManualPick[],
    store: (eventId: string, time: string) => Promise<void>,
    body: ArchiveEventBody,
  ): Promise<TestDetail> {
    const test = await this.requireTest(testId);
    const samples = await this.db.samples.get(testId);
    if (!samples) throw new ArchiveError('not-found', `The samples of test ${testId} are missing.`);
    const pickRows = await this.db.picks.where('testId').equals(testId).sortBy('seq');
    const lastSeq = pickRows.length ? pickRows[pickRows.length - 1].seq : undefined;
    const manualPicks = next(foldPicks(pickRows));
    const limits = (await this.getSettings()).limits;
    const analysis = await this.engine.analyse(recordOf(test, samples), analysisOptions(test, limits, manualPicks));
    const updated = await this.write(async (touch) => {
      const current = await this.requireTest(testId);
      const rows = await this.db.picks.where('testId').equals(testId).sortBy('seq');
      if ((rows.length ? rows[rows.length - 1].seq : undefined) !== lastSeq) {
        throw new ArchiveError('bad-state', 'The picks of this test changed meanwhile; open it again and retry.');
      }
      const review = stateAfterPickChange(current.state);
      if (review.reopens) await this.appendEvent(author, { kind: 'review-reopened', testId, reason: `Picks changed: ${why}` });
      const event = await this.appendEvent(author, body);
      await store(event.id, event.time);
      const row: StoredTest = {
        ...current, ...summaryFromAnalysis(analysis), state: review.state, lastPickAuthor: author,
        reviewer: review.reopens ? null : current.reviewer,
      };
      await this.db.tests.put(row);
      touch(row);
      await this.db.grades.put(gradeRow(testId, analysis, limits, event.time));
      return row;
    });
    return {
      summary: toSummary(updated), metadata: updated.metadata,
      samples: { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume },
      analysis, manualPicks: await this.manualPicksInForce(testId), log: await this.eventsForTest(testId),
    };
  }

  async requestReview(testId: string, user: string, note?: string): Promise<TestSummary> {
    const author = normaliseUserName(user);
    return this.review(testId, async (test) => {
      const state = stateAfterReviewRequest(test.state);
      await this.appendEvent(author, { kind: 'review-requested', testId, note: note?.trim() || undefined });
      return { state };
    });
  }

  async signOff(testId: string, user: string, note?: string): Promise<TestSummary> {
    const author = normaliseUserName(user);
    return this.review(testId, async (test) => {
      const state = stateAfterSignOff(test.state, author, test.lastPickAuthor ?? test.importedBy);
      // The journal's definition (journal/versions.ts), over the events this sign-off sees.
      const journal = `${author}@${this.fixed?.device ?? this.device}`;
      const seen = seenVectorOf(await this.localJournals(), journal);
      const picksVersion = picksVersionForTest(eventsSeenWith(await this.eventsForTest(testId), journal, seen), testId);
      await this.appendEvent(author, { kind: 'signed-off', testId, note: note?.trim() || undefined, grade: test.grade, picksVersion });
      return { state, reviewer: author };
    });
  }

  async reject(testId: string, user: string, reason: string): Promise<TestSummary> {
    const author = normaliseUserName(user);
    return this.review(testId, async (test) => {
      const next = stateAfterRejection(test.state, reason);
      await this.appendEvent(author, { kind: 'rejected', testId, reason: next.reason });
      return { state: next.state, reviewer: author };
    });
  }

  async reopen(testId: string, user: string, reason: string): Promise<TestSummary> {
    const author = normaliseUserName(user);
    return this.review(testId, async (test) => {
      const next = stateAfterReopen(test.state, reason);
      await this.appendEvent(author, { kind: 'review-reopened', testId, reason: next.reason });
      return { state: next.state, reviewer: null };
    });
  }

  async comment(testId: string, user: string, text: string): Promise<void> {
    const author = normaliseUserName(user);
    const body = (text ?? '').trim();
    if (!body) throw new ArchiveError('bad-argument', 'A comment needs some text.');
    await this.write(async () => {
      await this.requireTest(testId);
      await this.appendEvent(author, { kind: 'comment', testId, text: body });
    });
  }

  private review(testId: string, apply: (test: StoredTest) => Promise<Partial<StoredTest>>): Promise<TestSummary> {
    return this.write(async (touch) => {
      const test = await this.requireTest(testId);
      const row = { ...test, ...(await apply(test)) };
      await this.db.tests.put(row);
      touch(row);
      return toSummary(row);
    });
  }

  // ----- users, mappings, settings -----------------------------------------------------

  async listUsers(): Promise<UserRow[]> {
    const rows = await this.db.users.toArray();
    return rows.map(({ name, createdAt }) => ({ name, createdAt })).sort((a, b) => a.name.localeCompare(b.name));
  }

  async addUser(name: string): Promise<UserRow> {
    const clean = normaliseUserName(name);
    const result = await this.db.transaction('rw', this.db.users, async () => {
      const existing = await this.db.users.get(clean);
      if (existing) return { name: existing.name, createdAt: existing.createdAt };
      const row = { name: clean, createdAt: this.nowIso() };
      await this.db.users.add(row);
      return row;
    });
    this.changed();
    return result;
  }

  async saveMapping(mapping: Omit<SavedMapping, 'savedAt'>): Promise<SavedMapping> {
    if (!mapping.layout || !Array.isArray(mapping.columns)) throw new ArchiveError('bad-argument', 'A mapping needs a layout signature and its columns.');
    const row: SavedMapping = { ...mapping, savedBy: normaliseUserName(mapping.savedBy), savedAt: this.nowIso() };
    await this.db.mappings.put(row);
    this.changed();
    return row;
  }

  async getMapping(layout: string): Promise<SavedMapping | null> {
    return (await this.db.mappings.get(layout)) ?? null;
  }

  async getSettings(): Promise<ArchiveSettings> {
    const [limits, unitSystem] = await Promise.all([this.db.settings.get('limits'), this.db.settings.get('unitSystem')]);
    return {
      limits: (limits?.value as Record<string, number> | undefined) ?? {},
      unitSystem: (unitSystem?.value as UnitSystem | undefined) ?? 'si',
    };
  }

  async setLimits(limits: Record<string, number>, user: string, reason: string): Promise<ArchiveSettings> {
    const author = normaliseUserName(user);
    const why = requireReason(reason, 'change the project limits');
    for (const [key, value] of Object.entries(limits)) {
      if (!key || !Number.isFinite(value)) throw new ArchiveError('bad-argument', `Limit "${key}" must be a finite number.`);
    }
    const copy = { ...limits };
    await this.write(async () => {
      await this.db.settings.put({ key: 'limits', value: copy });
      await this.appendEvent(author, { kind: 'limits-changed', scope: 'project', limits: copy, reason: why });
    });
    return this.getSettings();
  }

  async setUnitSystem(unitSystem: UnitSystem): Promise<ArchiveSettings> {
    if (!UNIT_SYSTEMS.includes(unitSystem)) throw new ArchiveError('bad-argument', `Unknown unit system "${unitSystem}".`);
    await this.db.settings.put({ key: 'unitSystem', value: unitSystem });
    this.changed();
    return this.getSettings();
  }

  async regradeAll(onProgress?: (done: number, total: number) => void): Promise<number> {
    const ids = (await this.db.tests.toCollection().primaryKeys()) as string[];
    let changedCount = 0;
    for (let i = 0; i < ids.length; i++) {
      const before = await this.db.tests.get(ids[i]);
      const detail = await this.getTest(ids[i]);
      if (before && before.grade !== detail.summary.grade) changedCount += 1;
      onProgress?.(i + 1, ids.length);
    }
    return changedCount;
  }

  // ----- team journal ------------------------------------------------------------------

  /**
   * Run `work` with fixed authoring (see FixedAuthoring): for the demo seed, so two fresh
   * machines make the same demo events and exchanging bundles adds no duplicate tests.
   * @throws ArchiveError 'bad-state' when the archive already holds events.
   */
  async withFixedAuthoring<T>(authoring: FixedAuthoring, work: () => Promise<T>): Promise<T> {
    const start = Date.parse(authoring.startTime);
    if (!authoring.device || !Number.isFinite(start)) throw new ArchiveError('bad-argument', 'Fixed authoring needs a device id and an ISO start time.');
    if ((await this.db.events.count()) > 0) throw new ArchiveError('bad-state', 'Fixed authoring is only for an archive without events.');
    this.fixed = { ...authoring, start };
    try {
      return await work();
    } finally {
      this.fixed = null;
    }
  }

  /** Team operations one at a time (merges, decisions, rebuilds). */
  private serialTeam<T>(work: () => Promise<T>): Promise<T> {
    const next = this.teamQueue.then(work, work);
    this.teamQueue = next.catch(() => undefined);
    return next;
  }

  private async allEvents(): Promise<ArchiveEvent[]> {
    return (await this.db.events.toArray()).map(toEvent);
  }

  /** The state derived from the whole log (cached while the log is unchanged). */
  private async derived(): Promise<{ state: DerivedState; events: ArchiveEvent[]; count: number }> {
    const count = await this.db.events.count();
    const cache = this.derivedCache;
    if (cache && cache.count === count && cache.epoch === this.epoch) return cache;
    const epoch = this.epoch;
    const events = await this.allEvents();
    const state = deriveArchiveState(events);
    const fresh = { count: events.length, epoch, state, events };
    if (epoch === this.epoch) this.derivedCache = fresh;
    return fresh;
  }

  async applyEvents(incoming: readonly ArchiveEvent[], rawFiles?: ReadonlyMap<string, Uint8Array>): Promise<ApplyOutcome> {
    return this.serialTeam(async () => {
      const issues: TeamIssue[] = [];
      const valid: ArchiveEvent[] = [];
      for (const e of incoming) {
        const problem = validateEventShape(e);
        if (problem) issues.push({ kind: 'bad-event', message: `event ${(e as { id?: unknown })?.id ?? '?'}: ${problem}; not applied` });
        else valid.push(e);
      }
      const merge = mergeEventSets(await this.allEvents(), valid);
      for (const c of merge.collisions) issues.push({ kind: 'id-collision', message: c.message });
      const raw = new Map<string, Uint8Array>();
      for (const [hash, bytes] of rawFiles ?? []) {
        if (sha256Hex(bytes) === hash) raw.set(hash, bytes);
        else issues.push({ kind: 'raw-damaged', message: `raw file ${hash} does not match its hash; not stored` });
      }
      const fileNames = new Map<string, string>();
      for (const e of merge.events) if (e.body.kind === 'test-imported') fileNames.set(e.body.fileHash, e.body.fileName);
      if (merge.added.length || raw.size) {
        await this.db.transaction('rw', [this.db.events, this.db.journals, this.db.rawFiles, this.db.users], async () => {
          const present = await this.db.events.bulkGet(merge.added.map((e) => e.id));
          const rows = merge.added.filter((_, i) => !present[i]).map(storedEventOf);
          if (rows.length) await this.db.events.bulkAdd(rows);
          for (const key of new Set(rows.map((r) => r.journal))) {
            const all = await this.db.events.where('[journal+clock]').between([key, Dexie.minKey], [key, Dexie.maxKey]).toArray();
            await this.db.journals.put(journalRowOf(all));
          }
          const time = this.nowIso();
          for (const [hash, bytes] of raw) {
            if (!(await this.db.rawFiles.get(hash))) await this.db.rawFiles.add({ hash, bytes, size: bytes.length, fileName: fileNames.get(hash) ?? hash, storedAt: time });
          }
          for (const author of new Set(rows.map((r) => r.author))) {
            if (!(await this.db.users.get(author))) await this.db.users.add({ name: author, createdAt: time });
          }
        });
        this.derivedCache = null;
      }
      const rebuilt = await this.rebuildFromLog(raw);
      issues.push(...rebuilt.issues);
      const addedIds = new Set(merge.added.map((e) => e.id));
      const described = this.describeConflicts(rebuilt.state, rebuilt.events);
      this.channel?.postMessage('changed');
      this.changed();
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

  /**
   * Bring the tables in line with the state derived from the log: new tests (samples
   * built from raw files through the engine, no event written), review states,
   * reviewers, manual picks, limits, conflicts marks. Analysis runs before the write
   * transaction; the transaction is retried when the log grew meanwhile.
   */
  private async rebuildFromLog(raw: ReadonlyMap<string, Uint8Array>): Promise<{ state: DerivedState; events: ArchiveEvent[]; missing: MissingRawFile[]; issues: TeamIssue[] }> {
    for (let attempt = 0; attempt < 4; attempt++) {
      const { state, events, count } = await this.derived();
      const plan = await this.planRebuild(state, events, raw);
      const touched: StoredTest[] = [];
      const done = await this.db.transaction('rw', this.db.tables, async () => {
        if ((await this.db.events.count()) !== count) return false;
        await this.writePlan(plan);
        touched.push(...plan.tests);
        return true;
      });
      if (done) {
        if (plan.deleted.length) this.forgetList(); else this.rememberRows(touched);
        return { state, events, missing: plan.missing, issues: plan.issues };
      }
    }
    throw new ArchiveError('bad-state', 'The archive kept changing while team changes were applied; try again.');
  }

  private async planRebuild(state: DerivedState, events: readonly ArchiveEvent[], raw: ReadonlyMap<string, Uint8Array>): Promise<RebuildPlan> {
    const plan: RebuildPlan = { fields: [], wells: [], tests: [], samples: [], grades: [], picks: [], deleted: [], projectLimits: null, missing: [], issues: [] };
    const settings = await this.getSettings();
    let limits = settings.limits;
    if (events.some((e) => e.body.kind === 'limits-changed' && e.body.scope === 'project') && canonicalJson(state.projectLimits) !== canonicalJson(limits)) {
      limits = { ...state.projectLimits };
      plan.projectLimits = limits;
    }
    const fieldsById = new Map((await this.db.fields.toArray()).map((f) => [f.id, f]));
    const takenKeys = new Set([...fieldsById.values()].map((f) => f.nameKey));
    for (const field of Object.values(state.fields)) {
      const known = fieldsById.get(field.id);
      if (known) continue;
      // Two machines that named a field alike with different ids (archives made before
      // ids came from names): both kept, the second under a key that stays unique.
      let key = nameKey(field.name);
      if (takenKeys.has(key)) key = `${key}\u0001${field.id}`;
      takenKeys.add(key);
      const row = { id: field.id, name: field.name, nameKey: key };
      plan.fields.push(row);
      fieldsById.set(row.id, row);
    }
    const parseOptionsByImport = new Map<string, Record<string, unknown>>();
    for (const e of events) if (e.body.kind === 'test-imported' && e.body.parseOptions) parseOptionsByImport.set(e.id, e.body.parseOptions);
    const wellsById = new Map((await this.db.wells.toArray()).map((w) => [w.id, w]));
    for (const well of Object.values(state.wells)) {
      const known = wellsById.get(well.id);
      const row: StoredWell = {
        ...(known ?? {}), id: well.id, fieldId: well.fieldId, name: well.name, nameKey: nameKey(well.name),
        ...(well.location !== undefined ? { location: well.location } : {}),
        ...(well.rigFloorElevation !== undefined ? { rigFloorElevation: well.rigFloorElevation } : {}),
        ...(well.waterDepth !== undefined ? { waterDepth: well.waterDepth } : {}),
        ...(well.survey ? { survey: well.survey } : {}),
      };
      if (!known || canonicalJson(row) !== canonicalJson(known)) plan.wells.push(row);
      wellsById.set(row.id, row);
    }
    for (const test of Object.values(state.tests)) {
      const row = await this.db.tests.get(test.id);
      if (test.deleted) { if (row) plan.deleted.push(test.id); continue; }
      const manual = manualPicksOf(test);
      const pickAuthor = pickAuthorOf(test);
      const testLimits = Object.keys(test.limits).length ? { ...test.limits } : undefined;
      const review = {
        state: test.state, reviewer: test.reviewer, lastPickAuthor: pickAuthor,
        ...(test.openConflicts.length ? { openConflicts: [...test.openConflicts] } : {}),
      };
      if (!row) {
        const bytes = raw.get(test.fileHash) ?? (await this.db.rawFiles.get(test.fileHash))?.bytes;
        if (!bytes) { plan.missing.push({ testId: test.id, fileHash: test.fileHash, fileName: test.fileName }); continue; }
        const well = wellsById.get(test.wellId);
        const field = well ? fieldsById.get(well.fieldId) : undefined;
        if (!well || !field) {
          plan.issues.push({ kind: 'unknown-well', message: `test ${test.id} (${test.fileName}) names well ${test.wellId}, which this archive does not have; not shown yet` });
          continue;
        }
        const built = await this.buildTestFromRaw(test, bytes, parseOptionsByImport.get(test.importEventId), { ...limits, ...(testLimits ?? {}) }, manual);
        if ('issue' in built) { plan.issues.push(built.issue); continue; }
        const { parsed, analysis } = built;
        const stored: StoredTest = {
          id: test.id, fieldId: field.id, fieldName: field.name, wellId: well.id, wellName: well.name, wellNameKey: nameKey(well.name),
          ...summaryFromAnalysis(analysis), ...review, fileName: test.fileName, fileHash: test.fileHash,
          importedAt: test.importedAt, importedBy: test.importedBy, contractor: test.metadata.contractor,
          metadata: test.metadata, source: parsed.source, ...(testLimits ? { limits: testLimits } : {}),
        };
        plan.tests.push(stored);
        plan.samples.push({ testId: test.id, time: parsed.time, pressure: parsed.pressure, rate: parsed.rate, volume: parsed.volume });
        plan.grades.push(gradeRow(test.id, analysis, limits, this.nowIso()));
        plan.picks.push({ testId: test.id, rows: pickRowsOf(test, manual) });
        continue;
      }
      const current = foldPicks(await this.db.picks.where('testId').equals(test.id).sortBy('seq'));
      const picksChanged = picksKeyOf(current) !== picksKeyOf(manual);
      const limitsChanged = canonicalJson(row.limits ?? {}) !== canonicalJson(testLimits ?? {});
      let next: StoredTest = { ...row, ...review };
      if (!review.openConflicts) delete next.openConflicts;
      if (testLimits) next.limits = testLimits; else delete next.limits;
      if (picksChanged || limitsChanged) {
        const samples = await this.db.samples.get(test.id);
        if (samples) {
          try {
            const analysis = await this.engine.analyse(recordOf(next, samples), analysisOptions(next, limits, manual));
            next = { ...next, ...summaryFromAnalysis(analysis) };
            plan.grades.push(gradeRow(test.id, analysis, limits, this.nowIso()));
          } catch (error) {
            plan.issues.push({ kind: 'analysis-failed', message: `test ${test.id} could not be re-analysed with the merged picks: ${(error as Error).message}` });
          }
        }
        if (picksChanged) plan.picks.push({ testId: test.id, rows: pickRowsOf(test, manual) });
      }
      if (canonicalJson(summaryKey(next)) !== canonicalJson(summaryKey(row))) plan.tests.push(next);
    }
    return plan;
  }

  private async buildTestFromRaw(
    test: DerivedTest, bytes: Uint8Array, parseOptions: Record<string, unknown> | undefined, limits: Record<string, number>, manual: ManualPick[],
  ): Promise<{ parsed: TestRecord; analysis: AnalysisResult } | { issue: TeamIssue }> {
    try {
      const parsed = await this.engine.parse(bytes, test.fileName, parseOptions);
      const record: TestRecord = { ...parsed, metadata: test.metadata };
      const analysis = await this.engine.analyse(record, {
        type: test.typeInferred ? undefined : test.type, limits,
        manualPicks: manual.map(({ cycle, kind, pick, reason }) => ({ cycle, kind, pick, reason })),
      });
      return { parsed: record, analysis };
    } catch (error) {
      const failure = describeImportFailure(error, test.fileName);
      return { issue: { kind: 'raw-unreadable', message: `test ${test.id}: ${failure.message}`, file: test.fileName, line: failure.line, column: failure.column } };
    }
  }

  private async writePlan(plan: RebuildPlan): Promise<void> {
    if (plan.fields.length) await this.db.fields.bulkPut(plan.fields);
    if (plan.wells.length) await this.db.wells.bulkPut(plan.wells);
    for (const id of plan.deleted) {
      await this.db.tests.delete(id);
      await this.db.samples.delete(id);
      await this.db.grades.delete(id);
      await this.db.picks.where('testId').equals(id).delete();
    }
    if (plan.tests.length) await this.db.tests.bulkPut(plan.tests);
    for (const samples of plan.samples) await this.db.samples.put(samples);
    if (plan.grades.length) await this.db.grades.bulkPut(plan.grades);
    for (const { testId, rows } of plan.picks) {
      await this.db.picks.where('testId').equals(testId).delete();
      if (rows.length) await this.db.picks.bulkAdd(rows);
    }
    if (plan.projectLimits) await this.db.settings.put({ key: 'limits', value: plan.projectLimits });
  }

  private describeConflicts(state: DerivedState, events: readonly ArchiveEvent[]): TeamConflict[] {
    const byId = new Map(events.map((e) => [e.id, e]));
    const out: TeamConflict[] = Object.values(state.conflicts).map((c) => ({
      ...c,
      events: c.eventIds.map((id) => byId.get(id)).filter((e): e is ArchiveEvent => e !== undefined)
        .map((e) => ({ id: e.id, author: e.author, device: e.device, time: e.time, kind: e.body.kind, summary: describeEvent(e) })),
    }));
    const first = (c: TeamConflict) => c.events.reduce((m, e) => (e.time < m ? e.time : m), '\uffff');
    return out.sort((a, b) => (first(a) < first(b) ? -1 : first(a) > first(b) ? 1 : a.id < b.id ? -1 : 1));
  }

  async conflicts(options: { testId?: string; includeResolved?: boolean } = {}): Promise<TeamConflict[]> {
    const { state, events } = await this.derived();
    return this.describeConflicts(state, events)
      .filter((c) => (options.includeResolved || !c.resolution) && (!options.testId || c.testId === options.testId));
  }

  async findings(): Promise<Finding[]> {
    return [...(await this.derived()).state.findings];
  }

  async resolveConflict(conflictId: string, keep: string, user: string, reason: string): Promise<TeamConflict> {
    const author = normaliseUserName(user);
    const why = requireReason(reason, 'decide a conflict');
    return this.serialTeam(async () => {
      const { state } = await this.derived();
      const conflict = state.conflicts[conflictId];
      if (!conflict) throw new ArchiveError('not-found', `No conflict with id ${conflictId}.`);
      if (conflict.resolution) throw new ArchiveError('bad-state', `This conflict was already decided by ${conflict.resolution.author} ("${conflict.resolution.reason}").`);
      if (keep === NO_EVENT ? conflict.kind === 'concurrent-pick-moves' : !conflict.eventIds.includes(keep)) {
        throw new ArchiveError('bad-argument', keep === NO_EVENT
          ? 'A conflict between two pick moves is decided by keeping one of them.'
          : `Event ${keep} is not part of this conflict; keep one of ${conflict.eventIds.join(', ')}${conflict.kind === 'concurrent-pick-moves' ? '' : ` or "${NO_EVENT}"`}.`);
      }
      await this.write(async () => {
        await this.appendEvent(author, { kind: 'conflict-resolved', conflictId, testId: conflict.testId, keep, reason: why });
      });
      const rebuilt = await this.rebuildFromLog(new Map());
      this.channel?.postMessage('changed');
      this.changed();
      return this.describeConflicts(rebuilt.state, rebuilt.events).find((c) => c.id === conflictId)!;
    });
  }

  private async syncMarks(): Promise<Record<string, number>> {
    const stored = await this.db.settings.get('syncMarks');
    return (stored?.value as Record<string, number> | undefined) ?? {};
  }

  async markSynced(journal: string, seq: number): Promise<void> {
    if (!journal || !Number.isInteger(seq) || seq < 0) throw new ArchiveError('bad-argument', 'A sync mark needs a journal key and a whole number.');
    await this.db.transaction('rw', this.db.settings, async () => {
      const marks = await this.syncMarks();
      if ((marks[journal] ?? 0) >= seq) return;
      await this.db.settings.put({ key: 'syncMarks', value: { ...marks, [journal]: seq } });
    });
  }

  async syncStatus(user: string, options: { folderReachable?: boolean | null; writtenSeq?: number } = {}): Promise<SyncStatus> {
    const journal = `${normaliseUserName(user)}@${this.device}`;
    const marks = await this.syncMarks();
    return syncStatus({
      journal, events: await this.allEvents(),
      writtenSeq: Math.max(options.writtenSeq ?? 0, marks[journal] ?? 0),
      folderReachable: options.folderReachable ?? null,
    });
  }

  async exportBundle(user?: string): Promise<Uint8Array> {
    const [events, raw, journals] = await this.db.transaction('r', [this.db.events, this.db.rawFiles, this.db.journals], async () =>
      [await this.allEvents(), await this.db.rawFiles.toArray(), await this.db.journals.toArray()] as const);
    const bytes = exportBundle({
      journals: journalTextsFromEvents(events), raw: raw.map((r) => ({ hash: r.hash, bytes: r.bytes })),
      createdBy: user ? normaliseUserName(user) : this.device, createdAt: this.now().toISOString(),
    });
    for (const row of journals) if (row.device === this.device) await this.markSynced(row.key, row.lastSeq);
    return bytes;
  }

  async importBundle(bytes: Uint8Array, fileName: string): Promise<ApplyOutcome> {
    const bundle = importBundle(bytes, fileName);
    const outcome = await this.applyEvents(bundle.read.events, new Map(bundle.raw.map((r) => [r.hash, r.bytes])));
    const journalIssues: TeamIssue[] = bundle.read.issues.map((i) => ({ kind: i.kind, message: i.message, file: i.file, line: i.line, column: i.column }));
    const collisions: TeamIssue[] = bundle.read.collisions.map((c) => ({ kind: 'id-collision', message: c.message }));
    return { ...outcome, issues: [...journalIssues, ...collisions, ...outcome.issues] };
  }

  async missingRawFiles(): Promise<MissingRawFile[]> {
    const { state } = await this.derived();
    const out: MissingRawFile[] = [];
    for (const test of Object.values(state.tests)) {
      if (test.deleted || (await this.db.tests.get(test.id))) continue;
      if (!(await this.db.rawFiles.get(test.fileHash))) out.push({ testId: test.id, fileHash: test.fileHash, fileName: test.fileName });
    }
    return out;
  }

  async rawFile(hash: string): Promise<Uint8Array | null> {
    return (await this.db.rawFiles.get(hash))?.bytes ?? null;
  }

  /** Build tables for tests the log knows and whose raw files are here (e.g. after they arrived). */
  async rebuild(): Promise<MissingRawFile[]> {
    return this.serialTeam(async () => {
      const { missing } = await this.rebuildFromLog(new Map());
      this.channel?.postMessage('changed');
      this.changed();
      return missing;
    });
  }

  // ----- backup ------------------------------------------------------------------------

  async exportBackup(): Promise<Uint8Array> {
    const dump: TableDump = {};
    await this.db.transaction('r', this.db.tables, async () => {
      for (const table of this.db.tables) dump[table.name] = await table.toArray();
    });
    return encodeBackup(dump, this.db.verno, this.nowIso());
  }

  async restoreBackup(bytes: Uint8Array): Promise<void> {
    const { tables } = decodeBackup(bytes, this.db.verno);
    this.restoring = true;
    try {
      await this.db.transaction('rw', this.db.tables, async () => {
        for (const table of this.db.tables) {
          await table.clear();
          const rows = tables[table.name] ?? [];
          if (rows.length) await table.bulkAdd(rows);
        }
      });
    } finally {
      this.restoring = false;
      this.forgetList();
    }
    this.channel?.postMessage('changed');
    await this.ensureDevice();
    await this.rebuildJournalRows();
    this.changed();
  }

  /** Recount the journals table from the log (after a restore). */
  private async rebuildJournalRows(): Promise<void> {
    this.derivedCache = null;
    this.epoch += 1;
    await this.db.transaction('rw', [this.db.events, this.db.journals], async () => {
      const byJournal = new Map<string, StoredEvent[]>();
      await this.db.events.each((row) => {
        const list = byJournal.get(row.journal);
        if (list) list.push(row); else byJournal.set(row.journal, [row]);
      });
      await this.db.journals.clear();
      for (const rows of byJournal.values()) await this.db.journals.put(journalRowOf(rows));
    });
  }
}

// ----- helpers -------------------------------------------------------------------------

/** Field id from the name: every machine that creates a field of this name gives it the same id. */
export function fieldIdOf(name: string): string {
  return `field-${sha256OfText(nameKey(name)).slice(0, 24)}`;
}

/** Well id from its field and name, alike on every machine. */
export function wellIdOf(fieldId: string, name: string): string {
  return `well-${sha256OfText(`${fieldId}\n${nameKey(name)}`).slice(0, 24)}`;
}

function toEvent(row: StoredEvent): ArchiveEvent {
  const { testId: _testId, journal: _journal, hash: _hash, ...event } = row;
  return event;
}

function stripWell(row: WellRow & { nameKey?: string }): WellRow {
  const { nameKey: _key, ...well } = row;
  return well;
}

function cleanName(name: string | undefined): string | undefined {
  const trimmed = name?.trim().replace(/\s+/g, ' ');
  return trimmed ? trimmed : undefined;
}

function recordOf(test: StoredTest, samples: { time: Float64Array; pressure: Float64Array; rate: Float64Array; volume: Float64Array }): TestRecord {
  return { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume, metadata: test.metadata, source: test.source };
}

function analysisOptions(test: StoredTest, limits: Record<string, number>, manualPicks: ManualPick[]): AnalysisOptions {
  return {
    type: test.typeInferred ? undefined : test.type,
    limits: test.limits ? { ...limits, ...test.limits } : limits,
    manualPicks: manualPicks.map(({ cycle, kind, pick, reason }) => ({ cycle, kind, pick, reason })),
  };
}

function summaryFromAnalysis(analysis: AnalysisResult): Pick<StoredTest, 'type' | 'typeInferred' | 'depthTvd' | 'depthMd' | 'shmin' | 'shminKind' | 'grade'> {
  const shmin = analysis.stress.shmin;
  return {
    type: analysis.type,
    typeInferred: analysis.typeInferred,
    depthTvd: analysis.metadata.depthTvd ?? null,
    depthMd: analysis.metadata.depthMd ?? null,
    shmin: shmin ? shmin.value : null,
    shminKind: shmin ? shmin.kind : null,
    grade: analysis.quality.grade,
  };
}

/** The parts of a test row the rebuild may change (compared to skip writes that change nothing). */
function summaryKey(row: StoredTest): unknown {
  return {
    state: row.state, reviewer: row.reviewer, lastPickAuthor: row.lastPickAuthor, openConflicts: row.openConflicts ?? [],
    limits: row.limits ?? {}, grade: row.grade, shmin: row.shmin, shminKind: row.shminKind, type: row.type, depthTvd: row.depthTvd,
  };
}

/** Picks table rows for the manual picks in force of a derived test. */
function pickRowsOf(test: DerivedTest, manual: ManualPick[]): StoredPick[] {
  return manual.map((p) => ({
    testId: test.id, cycle: p.cycle, kind: p.kind, pick: p.pick, reason: p.reason, author: p.author, time: p.time,
    eventId: test.picks[`${p.cycle}:${p.kind}`]?.eventId ?? '',
  }));
}

function gradeRow(testId: string, analysis: AnalysisResult, limits: Record<string, number>, time: string) {
  return { testId, grade: analysis.quality.grade, quality: analysis.quality, limitsKey: canonicalJson(limits), computedAt: time };
}

/** Manual picks in force from the pick history (latest per cycle and kind, after the last reset). */
export function foldPicks(rows: StoredPick[]): ManualPick[] {
  const inForce = new Map<string, ManualPick>();
  for (const row of rows) {
    if (row.kind === 'reset') { inForce.clear(); continue; }
    inForce.set(`${row.cycle}:${row.kind}`, { cycle: row.cycle, kind: row.kind, pick: row.pick, reason: row.reason, author: row.author, time: row.time });
  }
  return [...inForce.values()].sort((a, b) => a.cycle - b.cycle || a.kind.localeCompare(b.kind));
}
