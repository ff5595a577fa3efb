import type { ArchiveEvent, ArchiveEventBody } from '../events';
import type { PickKind } from '../../engine/result';
import { canonicalJson } from './canonical';
import { compareEventOrder, journalKeyOf } from './causality';
import type { Conflict, ConflictKind, DerivedPick, DerivedState, DerivedTest, PickChange } from './derived-types';
import { conflictIdOf, NO_EVENT, pickSlotKey, picksVersionOf } from './versions';

export { conflictIdOf, NO_EVENT, pickSlotKey, picksVersionForTest, picksVersionOf } from './versions';

/**
 * The archive's tables, derived from the review log.
 *
 * Events are de-duplicated by id and applied in one total order (Lamport clock, then
 * device, then id), so every machine holding the same events derives the same state
 * whatever order they arrived in. Where the total order alone would silently pick a
 * winner between people who did not see each other's work, the derivation records a
 * Conflict instead (see derived-types.ts): the later event in the total order is shown
 * meanwhile, marked as conflicted, and a `conflict-resolved` event settles it. A sign-off
 * is counted only when its author is not the last person who set the picks it signs
 * (four eyes, judged on what the signer had seen), its picks version matches, and no
 * change or rejection was made concurrently with it.
 */

type Body<K extends ArchiveEventBody['kind']> = Extract<ArchiveEventBody, { kind: K }>;

/**
 * An event with its journal key and causal fields looked up once: the derivation compares
 * events pairwise many times, and this keeps each comparison to a few property reads.
 */
interface Node {
  e: ArchiveEvent;
  key: string;
  /** `seq`, or -1 when the event has none. */
  seq: number;
  seen: Record<string, number> | undefined;
  /** Position in the total order. */
  index: number;
  /** Small number standing for the journal (index into per-journal arrays). */
  journal: number;
}

/** `happenedBefore` (causality.ts) on nodes. */
function before(a: Node, b: Node): boolean {
  if (a === b) return false;
  if (a.seq < 0 || b.seq < 0 || b.seen === undefined) return a.index < b.index;
  if (a.key === b.key) return a.seq < b.seq;
  const seen = b.seen[a.key];
  return seen !== undefined && seen >= a.seq;
}

function isConcurrent(a: Node, b: Node): boolean {
  return a !== b && !before(a, b) && !before(b, a);
}

/** Bookkeeping per test that is not part of the derived state. */
interface TestTrack {
  /** Events that set picks (moves, resets, decisions), in total order. */
  pickEvents: Node[];
  /** Every pick move, reset and conflict decision about the test: what `picksVersion` covers. */
  versionEvents: Node[];
  /** Picks version over all of `versionEvents`, while their count is `versionCount`. */
  version: string;
  versionCount: number;
  /** Versions of subsets of `versionEvents`, by seen count per journal. */
  subsetVersions: Map<string, string>;
  /** Pick events plus per-test limit changes: what a sign-off must not race with. */
  changes: Node[];
  /** Sign-offs that passed four eyes, and rejections. */
  decisions: Node[];
  resets: Node[];
  /** Per pick: its changes that a later event might not have seen (see `pruneSeenByAll`). */
  candidates: Map<string, Node[]>;
}

/** Unique events (first of each id) in the total order. */
function orderedUnique(events: readonly ArchiveEvent[]): ArchiveEvent[] {
  let sortedAndUnique = true;
  for (let i = 1; i < events.length && sortedAndUnique; i++) sortedAndUnique = compareEventOrder(events[i - 1], events[i]) < 0;
  if (sortedAndUnique) return [...events];
  const byId = new Map<string, ArchiveEvent>();
  for (const e of events) if (!byId.has(e.id)) byId.set(e.id, e);
  return [...byId.values()].sort(compareEventOrder);
}

/**
 * Derive fields, wells, tests (type, metadata, file hash, picks in force with history,
 * review state, reviewer, last pick author, comments, limits), conflicts and findings
 * from the review log. Deterministic: any order or repetition of the same events gives
 * the same state. Events with the same id are taken as the same event (use
 * `mergeEventSets` first to catch ids that were reused for different content).
 * @param events review-log events from every journal, any order, duplicates allowed.
 * @param options.pruneThreshold see DeriveOptions (speed only).
 * @example deriveArchiveState([...mine, ...theirs]).tests['t1'].state // 'accepted'
 */
export function deriveArchiveState(events: readonly ArchiveEvent[], options: DeriveOptions = {}): DerivedState {
  return new Derivation(options.pruneThreshold ?? 16).run(orderedUnique(events));
}

export interface DeriveOptions {
  /**
   * List length from which events every journal has seen are dropped from the pairwise
   * conflict checks (default 16). Only speed depends on it; `Infinity` turns it off
   * (tests compare both).
   */
  pruneThreshold?: number;
}

/** Kinds a picks version covers (see `picksVersionForTest`). */
const VERSIONED_KINDS = new Set<string>(['pick-moved', 'picks-reset', 'conflict-resolved']);

/** Kinds a later event can name (a decision keeps one; a pick's history points at one). */
const REFERENCED_KINDS = new Set<string>(['pick-moved', 'picks-reset', 'signed-off', 'rejected', 'limits-changed', 'conflict-resolved']);

class Derivation {
  readonly state: DerivedState = {
    fields: {}, wells: {}, tests: {}, projectLimits: {}, limitsLog: [], conflicts: {}, findings: [], journals: {}, eventCount: 0,
  };
  private readonly tracks = new Map<string, TestTrack>();
  private readonly byId = new Map<string, Node>();
  private readonly testByFile = new Map<string, string>();
  private readonly conflictsByTest = new Map<string, Conflict[]>();
  /** Events still to come per journal, and the seen vector of each journal's latest event so far. */
  private readonly journalKeys: string[] = [];
  private remaining = new Int32Array(0);
  private readonly latestSeen: (Record<string, number> | undefined)[] = [];
  /** Journal of the event being applied (its own view counts even when it is its journal's last). */
  private current = -1;

  constructor(private readonly pruneThreshold: number) {}

  run(ordered: ArchiveEvent[]): DerivedState {
    // One key string per journal (not per event), so key comparisons are mostly pointer checks.
    const keys = new Map<string, Map<string, number>>();
    const counts: number[] = [];
    const nodes = ordered.map((e, index): Node => {
      let byDevice = keys.get(e.author);
      if (!byDevice) keys.set(e.author, (byDevice = new Map()));
      let journal = byDevice.get(e.device);
      if (journal === undefined) {
        journal = this.journalKeys.length;
        byDevice.set(e.device, journal);
        this.journalKeys.push(journalKeyOf(e));
        counts.push(0);
      }
      counts[journal]++;
      return { e, key: this.journalKeys[journal], seq: e.seq ?? -1, seen: e.seen, index, journal };
    });
    this.remaining = Int32Array.from(counts);
    for (const node of nodes) {
      this.remaining[node.journal]--;
      this.current = node.journal;
      if (node.seen) this.latestSeen[node.journal] = node.seen;
      if (REFERENCED_KINDS.has(node.e.body.kind)) this.byId.set(node.e.id, node);
      this.noteActivity(node);
      this.apply(node);
    }
    this.state.eventCount = ordered.length;
    for (const [testId, track] of this.tracks) {
      this.state.tests[testId].picksVersion = picksVersionOf(track.versionEvents.map((p) => p.e.id));
    }
    return this.state;
  }

  private noteActivity(n: Node): void {
    const { e, key } = n;
    const j = this.state.journals[key] ?? (this.state.journals[key] = { journal: key, author: e.author, device: e.device, events: 0, lastSeq: 0, lastTime: e.time, lastKind: e.body.kind });
    j.events++;
    if ((e.seq ?? 0) >= j.lastSeq) { j.lastSeq = e.seq ?? j.lastSeq; j.lastTime = e.time; j.lastKind = e.body.kind; }
  }

  private apply(n: Node): void {
    const e = n.e;
    const b = e.body;
    const s = this.state;
    switch (b.kind) {
      case 'field-created':
        if (!s.fields[b.fieldId]) s.fields[b.fieldId] = { id: b.fieldId, name: b.name, createdBy: e.author, createdAt: e.time };
        else s.fields[b.fieldId].name = b.name;
        return;
      case 'well-created': {
        const { kind: _kind, wellId, ...rest } = b;
        s.wells[wellId] = { ...s.wells[wellId], id: wellId, ...rest, createdBy: s.wells[wellId]?.createdBy ?? e.author, createdAt: s.wells[wellId]?.createdAt ?? e.time };
        return;
      }
      case 'survey-set': {
        const well = s.wells[b.wellId];
        if (well) { well.survey = b.stations; well.surveySourceFile = b.sourceFile; }
        return;
      }
      case 'test-imported':
        return this.importTest(n, b);
      case 'limits-changed':
        s.limitsLog.push({ eventId: e.id, author: e.author, time: e.time, scope: b.scope, limits: b.limits, reason: b.reason });
        // The archive's setLimits replaces the project limits whole, so the log's latest project change is the set in force.
        if (b.scope === 'project') { s.projectLimits = { ...b.limits }; return; }
        return this.withTest(n, b.scope.testId, (test, track) => {
          Object.assign(test.limits, b.limits);
          this.log(test, e, b.reason);
          this.changeMade(test, track, n);
          track.changes.push(n);
        });
      default:
        return this.withTest(n, b.testId, (test, track) => this.applyToTest(n, test, track));
    }
  }

  private importTest(n: Node, b: Body<'test-imported'>): void {
    const e = n.e;
    if (this.state.tests[b.testId]) {
      this.finding('duplicate-test-id', e, b.testId, `${e.author} imported ${b.fileName} as test ${b.testId}, which already exists; the first import stands`);
      return;
    }
    const other = this.testByFile.get(b.fileHash);
    if (other) this.finding('same-file-twice', e, b.testId, `${b.fileName} was imported as test ${b.testId} and as test ${other}`);
    else this.testByFile.set(b.fileHash, b.testId);
    this.state.tests[b.testId] = {
      id: b.testId, wellId: b.wellId, type: b.type, typeInferred: b.typeInferred, metadata: b.metadata,
      fileHash: b.fileHash, fileName: b.fileName, layout: b.layout,
      importedBy: e.author, importedAt: e.time, importEventId: e.id,
      state: 'imported', reviewer: null, signedGrade: null, signOffEventId: null, rejectionReason: null,
      lastPickAuthor: e.author, picks: {}, limits: {}, comments: [], log: [],
      picksVersion: picksVersionOf([]), openConflicts: [], deleted: false, deletedReason: null,
    };
    this.tracks.set(b.testId, { pickEvents: [], versionEvents: [], changes: [], decisions: [], resets: [], candidates: new Map(), version: picksVersionOf([]), versionCount: 0, subsetVersions: new Map() });
    this.log(this.state.tests[b.testId], e, b.fileName);
  }

  private withTest(n: Node, testId: string, action: (test: DerivedTest, track: TestTrack) => void): void {
    const e = n.e;
    const test = this.state.tests[testId];
    const track = this.tracks.get(testId);
    if (!test || !track) { this.finding('unknown-test', e, testId, `${e.author}'s ${e.body.kind} is about test ${testId}, which this archive does not have (its import may be in a journal not yet received)`); return; }
    if (test.deleted && e.body.kind !== 'comment') { this.log(test, e, 'not applied: the test was deleted'); this.finding('after-delete', e, testId, `${e.author}'s ${e.body.kind} on test ${testId} came after it was deleted; not applied`); return; }
    action(test, track);
  }

  private applyToTest(n: Node, test: DerivedTest, track: TestTrack): void {
    const e = n.e;
    const b = e.body;
    if (VERSIONED_KINDS.has(b.kind)) track.versionEvents.push(n);
    switch (b.kind) {
      case 'pick-moved':
        this.setPick(test, track, n, b.cycle, b.pickKind, { manual: true, pick: b.pick, reason: b.reason, source: 'moved' });
        this.pickEventDone(test, track, n, b.reason);
        return;
      case 'picks-reset':
        for (const slot of Object.values(test.picks)) this.setPick(test, track, n, slot.cycle, slot.kind, { manual: false, pick: null, reason: b.reason, source: 'reset' });
        track.resets.push(n);
        this.pickEventDone(test, track, n, b.reason);
        return;
      case 'review-requested':
        if (test.state !== 'accepted') test.state = 'in-review';
        this.log(test, e, b.note ?? '');
        return;
      case 'signed-off':
        return this.signOff(test, track, n, b);
      case 'rejected':
        this.log(test, e, b.reason);
        for (const d of track.decisions) {
          if (d.e.body.kind === 'signed-off' && isConcurrent(d, n)) this.addConflict('concurrent-review-decisions', test, [d.e, e], `${d.e.author} signed off test ${test.id} while ${e.author} rejected it ("${b.reason}")`);
        }
        track.decisions.push(n);
        Object.assign(test, { state: 'rejected', reviewer: e.author, rejectionReason: b.reason, signedGrade: null, signOffEventId: null });
        return;
      case 'review-reopened':
        this.log(test, e, b.reason);
        Object.assign(test, { state: 'in-review', reviewer: null, signedGrade: null, signOffEventId: null });
        return;
      case 'comment':
        test.comments.push({ eventId: e.id, author: e.author, time: e.time, text: b.text });
        return;
      case 'test-deleted':
        this.log(test, e, b.reason);
        test.deleted = true;
        test.deletedReason = b.reason;
        return;
      case 'conflict-resolved':
        return this.resolve(test, track, n, b);
      default:
        return;
    }
  }

  /** Book-keeping after any event that set picks. */
  private pickEventDone(test: DerivedTest, track: TestTrack, n: Node, note: string): void {
    this.log(test, n.e, note);
    this.changeMade(test, track, n);
    track.pickEvents.push(n);
    track.changes.push(n);
    test.lastPickAuthor = n.e.author;
  }

  /** A change to what a sign-off signs: races with concurrent sign-offs, reopens an acceptance it saw. */
  private changeMade(test: DerivedTest, track: TestTrack, n: Node): void {
    const e = n.e;
    let contested = false;
    track.decisions = this.pruneSeenByAll(track.decisions);
    for (const d of track.decisions) {
      if (d.e.body.kind !== 'signed-off' || !isConcurrent(d, n)) continue;
      this.addConflict('sign-off-concurrent-change', test, [d.e, e], `${d.e.author} signed off test ${test.id} while ${e.author} changed it (${e.body.kind}) without seeing the sign-off`);
      if (test.signOffEventId === d.e.id) contested = true;
    }
    if (test.state !== 'accepted') return;
    Object.assign(test, { state: 'in-review', reviewer: null, signedGrade: null, signOffEventId: null });
    if (!contested) test.log.push({ eventId: e.id, author: e.author, device: e.device, time: e.time, kind: 'reopened-by-change', note: `review reopened: ${e.body.kind} after the sign-off` });
  }

  private setPick(test: DerivedTest, track: TestTrack, n: Node, cycle: number, kind: PickKind, change: Omit<PickChange, 'eventId' | 'author' | 'time'>): void {
    const e = n.e;
    const key = pickSlotKey(cycle, kind);
    const candidates = this.pruneSeenByAll(track.candidates.get(key) ?? []);
    // Every earlier change of this pick (and every reset of the test) that this event did not
    // see is a conflict, pair by pair: a pair's verdict depends only on the two events, so a
    // machine that holds more events never loses a conflict another machine has decided.
    for (const f of candidates) this.race(test, f, n, cycle, kind);
    for (const r of track.resets) if (!candidates.includes(r)) this.race(test, r, n, cycle, kind);
    candidates.push(n);
    track.candidates.set(key, candidates);
    const entry: PickChange = { eventId: e.id, author: e.author, time: e.time, ...change };
    const slot: DerivedPick = test.picks[key] ?? { cycle, kind, manual: false, pick: null, reason: '', author: e.author, time: e.time, eventId: e.id, conflicted: false, history: [] };
    slot.history.push(entry);
    Object.assign(slot, { manual: entry.manual, pick: entry.pick, reason: entry.reason, author: entry.author, time: entry.time, eventId: entry.eventId });
    test.picks[key] = slot;
    this.refreshConflictMarks(test);
  }

  private race(test: DerivedTest, f: Node, n: Node, cycle: number, kind: PickKind): void {
    if (f === n || before(f, n) || this.sameOutcome(f, n)) return;
    this.addConflict('concurrent-pick-moves', test, [f.e, n.e], `${f.e.author} and ${n.e.author} both changed the ${kind} pick of cycle ${cycle} of test ${test.id} without seeing each other's change`, { cycle, kind });
  }

  /**
   * Drop from a long list the events that no event still to come can have missed: every
   * journal with events left has already seen them (journals only ever learn more), so
   * they can take part in no further conflict. Keeps the pairwise checks near linear.
   */
  private pruneSeenByAll(list: Node[]): Node[] {
    if (list.length < this.pruneThreshold) return list;
    return list.filter((f) => {
      if (f.seq < 0) return false; // without causal fields: before every later event, never racing
      const fKey = f.key;
      for (let j = 0; j < this.remaining.length; j++) {
        if ((this.remaining[j] === 0 && j !== this.current) || j === f.journal) continue;
        if ((this.latestSeen[j]?.[fKey] ?? 0) < f.seq) return true;
      }
      return false;
    });
  }

  /** Two pick events that leave the same pick (same value, or both back to automatic). */
  private sameOutcome(a: Node, b: Node): boolean {
    return this.cachedOutcome(a) === this.cachedOutcome(b);
  }

  private readonly outcomes = new Map<Node, string>();

  private cachedOutcome(n: Node): string {
    let o = this.outcomes.get(n);
    if (o === undefined) { o = this.outcomeOf(n.e, 0); this.outcomes.set(n, o); }
    return o;
  }

  private outcomeOf(e: ArchiveEvent, depth: number): string {
    const b = e.body;
    if (b.kind === 'pick-moved') return canonicalJson({ manual: true, pick: b.pick });
    if (b.kind === 'conflict-resolved' && depth < 8) {
      const kept = this.byId.get(b.keep);
      if (kept) return this.outcomeOf(kept.e, depth + 1);
    }
    return 'automatic';
  }

  private signOff(test: DerivedTest, track: TestTrack, n: Node, b: Body<'signed-off'>): void {
    const e = n.e;
    this.log(test, e, b.note ?? `grade ${b.grade}`);
    const seenPicks = track.pickEvents.filter((p) => before(p, n));
    const pickAuthor = seenPicks.length ? seenPicks[seenPicks.length - 1].e.author : test.importedBy;
    if (pickAuthor === e.author) {
      this.finding('self-sign-off', e, test.id, `${e.author} signed off test ${test.id} but also set its picks last; a second person must sign off (four eyes)`);
      return;
    }
    const conflicts: Conflict[] = [];
    const seenVersioned = track.versionEvents.filter((p) => before(p, n));
    const sawAll = seenVersioned.length === track.versionEvents.length;
    if (sawAll && track.versionCount !== track.versionEvents.length) {
      track.version = picksVersionOf(track.versionEvents.map((p) => p.e.id));
      track.versionCount = track.versionEvents.length;
    }
    const seenVersion = sawAll ? track.version : this.subsetVersion(track, seenVersioned);
    if (seenVersion !== b.picksVersion) {
      conflicts.push(this.addConflict('stale-sign-off', test, [e], `${e.author}'s sign-off of test ${test.id} is for a picks version this archive cannot reproduce: picks it saw are missing here, or differ`));
    }
    track.changes = this.pruneSeenByAll(track.changes);
    for (const c of track.changes) {
      if (isConcurrent(c, n)) conflicts.push(this.addConflict('sign-off-concurrent-change', test, [e, c.e], `${e.author} signed off test ${test.id} while ${c.e.author} changed it (${c.e.body.kind}) without seeing the sign-off`));
    }
    for (const d of track.decisions) {
      if (d.e.body.kind === 'rejected' && isConcurrent(d, n)) conflicts.push(this.addConflict('concurrent-review-decisions', test, [d.e, e], `${e.author} signed off test ${test.id} while ${d.e.author} rejected it`));
    }
    track.decisions.push(n);
    if (conflicts.length === 0) this.accept(test, e, b);
    else Object.assign(test, { state: 'in-review', reviewer: null, signedGrade: null, signOffEventId: null });
  }

  /**
   * Picks version of the pick events a sign-off saw. What it saw of each journal is a
   * prefix, so the count seen per journal names the set: versions are cached by it.
   */
  private subsetVersion(track: TestTrack, seen: Node[]): string {
    const perJournal = new Map<number, number>();
    for (const p of seen) perJournal.set(p.journal, (perJournal.get(p.journal) ?? 0) + 1);
    const cacheKey = [...perJournal].sort((a, b) => a[0] - b[0]).map(([j, n]) => `${j}:${n}`).join(',');
    let version = track.subsetVersions.get(cacheKey);
    if (version === undefined) {
      version = picksVersionOf(seen.map((p) => p.e.id));
      track.subsetVersions.set(cacheKey, version);
    }
    return version;
  }

  private accept(test: DerivedTest, e: ArchiveEvent, b: Body<'signed-off'>): void {
    Object.assign(test, { state: 'accepted', reviewer: e.author, signedGrade: b.grade, signOffEventId: e.id, rejectionReason: null });
  }

  private resolve(test: DerivedTest, track: TestTrack, n: Node, b: Body<'conflict-resolved'>): void {
    const e = n.e;
    const conflict = this.state.conflicts[b.conflictId];
    if (!conflict || conflict.testId !== test.id) { this.log(test, e, `not applied: conflict ${b.conflictId} is not known here`); this.finding('unknown-conflict', e, test.id, `${e.author} decided conflict ${b.conflictId}, which this archive does not see`); return; }
    const voids = b.keep === NO_EVENT && conflict.kind !== 'concurrent-pick-moves';
    if (!voids && !conflict.eventIds.includes(b.keep)) { this.log(test, e, `not applied: ${b.keep} is not part of the conflict`); this.finding('bad-resolution', e, test.id, `${e.author}'s decision on ${b.conflictId} keeps ${b.keep}, which is not part of it`); return; }
    conflict.resolution = { eventId: e.id, author: e.author, time: e.time, keep: b.keep, reason: b.reason };
    this.log(test, e, b.reason);
    if (voids) { this.refreshConflictMarks(test); return; }
    const keptNode = this.byId.get(b.keep)!;
    const kept = keptNode.e;
    if (conflict.kind === 'concurrent-pick-moves' && conflict.slot) {
      const kb = kept.body;
      const change = kb.kind === 'pick-moved'
        ? { manual: true, pick: kb.pick, reason: b.reason, source: 'resolution' as const }
        : { manual: false, pick: null, reason: b.reason, source: 'resolution' as const };
      this.setPick(test, track, n, conflict.slot.cycle, conflict.slot.kind, change);
      this.pickEventDone(test, track, n, b.reason);
    } else if (kept.body.kind === 'signed-off') {
      const signOff = kept;
      const open = (this.conflictsByTest.get(test.id) ?? []).filter((c) => c.eventIds.includes(signOff.id) && c.kind !== 'concurrent-pick-moves' && (!c.resolution || c.resolution.keep !== signOff.id));
      if (open.length === 0) {
        this.restoreSignedPicks(test, track, n, keptNode, conflict);
        this.accept(test, signOff, signOff.body as Body<'signed-off'>);
      }
    } else if (kept.body.kind === 'rejected') {
      Object.assign(test, { state: 'rejected', reviewer: kept.author, rejectionReason: kept.body.reason, signedGrade: null, signOffEventId: null });
    }
    this.refreshConflictMarks(test);
  }

  /** The sign-off stands: picks the conflicting change touched go back to what the signer saw. */
  private restoreSignedPicks(test: DerivedTest, track: TestTrack, n: Node, signOff: Node, conflict: Conflict): void {
    const e = n.e;
    const changes = conflict.eventIds.map((id) => this.byId.get(id)!.e).filter((c) => c.id !== signOff.e.id);
    let restored = false;
    for (const c of changes) {
      const slots = c.body.kind === 'pick-moved' ? [pickSlotKey(c.body.cycle, c.body.pickKind)] : c.body.kind === 'picks-reset' ? Object.keys(test.picks) : [];
      for (const key of slots) {
        const slot = test.picks[key];
        if (!slot) continue;
        const seen = [...slot.history].reverse().find((h) => before(this.byId.get(h.eventId)!, signOff));
        const entry: PickChange = { eventId: e.id, author: e.author, time: e.time, source: 'restored', manual: seen?.manual ?? false, pick: seen?.pick ?? null, reason: conflict.resolution?.reason ?? '' };
        slot.history.push(entry);
        Object.assign(slot, { manual: entry.manual, pick: entry.pick, reason: entry.reason, author: entry.author, time: entry.time, eventId: entry.eventId });
        restored = true;
      }
      if (c.body.kind === 'limits-changed') this.log(test, e, `limits change ${c.id} overruled by the sign-off decision; set the limits again if still wanted`);
    }
    if (restored) track.pickEvents.push(n);
  }

  private addConflict(kind: ConflictKind, test: DerivedTest, events: ArchiveEvent[], message: string, slot?: Conflict['slot']): Conflict {
    const ids = events.map((x) => x.id);
    const id = conflictIdOf(kind, ids);
    const existing = this.state.conflicts[id];
    if (existing) return existing;
    const conflict: Conflict = { id, kind, testId: test.id, eventIds: [...ids].sort(), authors: [...new Set(events.map((x) => x.author))].sort(), message, resolution: null };
    if (slot) conflict.slot = slot;
    this.state.conflicts[id] = conflict;
    const list = this.conflictsByTest.get(test.id);
    if (list) list.push(conflict); else this.conflictsByTest.set(test.id, [conflict]);
    this.refreshConflictMarks(test);
    return conflict;
  }

  private refreshConflictMarks(test: DerivedTest): void {
    const open = (this.conflictsByTest.get(test.id) ?? []).filter((c) => !c.resolution);
    if (open.length === 0 && test.openConflicts.length === 0) return;
    test.openConflicts = open.map((c) => c.id);
    for (const [key, slot] of Object.entries(test.picks)) {
      slot.conflicted = open.some((c) => c.slot !== undefined && pickSlotKey(c.slot.cycle, c.slot.kind) === key);
    }
  }

  private log(test: DerivedTest, e: ArchiveEvent, note: string): void {
    test.log.push({ eventId: e.id, author: e.author, device: e.device, time: e.time, kind: e.body.kind, note });
  }

  private finding(kind: DerivedState['findings'][number]['kind'], e: ArchiveEvent, testId: string | undefined, message: string): void {
    this.state.findings.push({ kind, eventId: e.id, author: e.author, testId, message });
  }
}
