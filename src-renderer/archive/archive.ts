import Dexie from 'dexie';
import type {
  ArchiveQuery, ArchiveService, ArchiveSettings, FieldRow, ImportFileInput, ImportOptions, ImportOutcome,
  SavedMapping, StateCounts, TestDetail, TestSummary, UserRow, WellRow,
} from './api';
import type { ArchiveEvent, ArchiveEventBody, ReviewState } from './events';
import type { AnalysisOptions } from '../engine/analysis-options';
import type { TestMetadata, TestRecord } from '../engine/record';
import { PICK_KINDS, type AnalysisResult, type Pick as EnginePick, type PickKind } from '../engine/result';
import { UNIT_SYSTEMS, type UnitSystem } from '../engine/units/unitSystem';
import {
  StressLedgerDb, nameKey, type StoredEvent, type StoredPick, type StoredTest,
} from './db';
import type { ArchiveEngine } from './engine-port';
import { ArchiveError } from './errors';
import {
  normaliseUserName, requireReason, stateAfterPickChange, stateAfterRejection, stateAfterReopen,
  stateAfterReviewRequest, stateAfterSignOff,
} from './review-rules';
import { canonicalJson, sha256HexAsync, sha256HexOfText } from './sha256';
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
type ManualPick = TestDetail['manualPicks'][number];

/**
 * The archive service over Dexie: tests, samples, picks, review log, users, mappings and
 * settings. Every change runs in one Dexie transaction and appends its events to the
 * review log (append-only: this class has no way to change or remove an event, and hooks
 * refuse it).
 */
export class Archive implements ArchiveService {
  readonly db: StressLedgerDb;
  private readonly engine: ArchiveEngine;
  private readonly now: () => Date;
  private readonly listeners = new Set<() => void>();
  private device = '';
  private restoring = false;
  private listCache: Map<string, ListRow> | null = null;
  private cacheGeneration = 0;
  private readonly channel: BroadcastChannel | null;

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

  private nowIso(): string { return this.now().toISOString(); }

  // ----- review log -------------------------------------------------------------------

  /** Append one event; call inside a read-write transaction over all tables. */
  private async appendEvent(author: string, body: ArchiveEventBody): Promise<StoredEvent> {
    const journal = `${author}@${this.device}`;
    const latest = await this.db.events.orderBy('clock').last();
    const latestInJournal = await this.db.events
      .where('[journal+clock]').between([journal, Dexie.minKey], [journal, Dexie.maxKey]).last();
    const previousSeq = latestInJournal
      ? latestInJournal.seq ?? await this.db.events.where('[journal+clock]').between([journal, Dexie.minKey], [journal, Dexie.maxKey]).count()
      : 0;
    const event: ArchiveEvent = {
      id: crypto.randomUUID(),
      author,
      device: this.device,
      time: this.nowIso(),
      clock: (latest?.clock ?? 0) + 1,
      prev: latestInJournal?.hash ?? '',
      seq: previousSeq + 1,
      body,
    };
    const hash = sha256HexOfText(canonicalJson(event));
    const row: StoredEvent = { ...event, testId: 'testId' in body ? body.testId : '', journal, hash };
    await this.db.events.add(row);
    if (!(await this.db.users.get(author))) await this.db.users.add({ name: author, createdAt: event.time });
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
    await this.db.tests.each((row) => { rows.set(row.id, toListRow(row)); });
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
    const test = await this.requireTest(testId);
    const samples = await this.db.samples.get(testId);
    if (!samples) throw new ArchiveError('not-found', `The samples of test ${testId} are missing.`);
    const manualPicks = await this.manualPicksInForce(testId);
    const limits = (await this.getSettings()).limits;
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
      log: await this.eventsForTest(testId),
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
      const testId = crypto.randomUUID();
      const fieldName = cleanName(analysis.metadata.field ?? metadata.field) ?? options.defaultFieldName ?? DEFAULT_FIELD_NAME;
      const wellName = cleanName(analysis.metadata.well ?? metadata.well) ?? options.defaultWellName ?? fileName.replace(/\.[^.]+$/, '');
      const outcome = await this.write(async (touch): Promise<ImportOutcome> => {
        const again = await this.db.tests.where('fileHash').equals(hash).first();
        if (again) return { fileName, status: 'duplicate', existingTestId: again.id };
        const fieldId = await this.findOrCreateField(fieldName, user);
        const well = await this.findOrCreateWell(fieldId, wellName, user);
        const time = this.nowIso();
        await this.appendEvent(user, {
          kind: 'test-imported', testId, wellId: well.id, type: analysis.type, typeInferred: analysis.typeInferred,
          metadata: analysis.metadata, fileHash: hash, fileName, layout: parsed.source.layout,
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
    const id = crypto.randomUUID();
    await this.db.fields.add({ id, name, nameKey: key });
    await this.appendEvent(user, { kind: 'field-created', fieldId: id, name });
    return id;
  }

  private async findOrCreateWell(fieldId: string, name: string, user: string): Promise<WellRow> {
    const key = nameKey(name);
    const found = await this.db.wells.where('[fieldId+nameKey]').equals([fieldId, key]).first();
    if (found) return stripWell(found);
    const well = { id: crypto.randomUUID(), fieldId, name, nameKey: key };
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
      const picks = await this.manualPicksInForce(testId);
      const picksVersion = sha256HexOfText(canonicalJson(picks.map(({ cycle, kind, pick }) => ({ cycle, kind, pick }))));
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
    this.changed();
  }
}

// ----- helpers -------------------------------------------------------------------------

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
    limits,
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
