import { describe, expect, it } from 'vitest';
import { openTestArchive, tableCounts } from './support/open';
import { simpleFile } from './support/engine';
import type { Archive } from '../../src-renderer/archive/archive';
import { ArchiveError } from '../../src-renderer/archive/errors';
import { EngineError } from '../../src-renderer/engine/errors';
import { NO_EVENT, picksVersionForTest } from '../../src-renderer/archive/journal/derive';
import { deriveArchiveState } from '../../src-renderer/archive/journal/derive';
import { eventHash, readJournal } from '../../src-renderer/archive/journal/journal-file';
import { journalTextsFromEvents } from '../../src-renderer/archive/journal/bundle';
import type { Pick } from '../../src-renderer/engine/result';

// Team sharing between two archives without a server (two people, two devices, each on its
// own fake-indexeddb database). Causality: vector clocks (C. Fidge 1988; F. Mattern 1989);
// Lamport clocks (L. Lamport, CACM 21(7), 1978). Four eyes: DESIGN.md "Review". Records are
// synthetic Harrow Flats tests by Cobalt Ridge Test Services; their truth is set here.

const ANA = 'Ana Petrov';
const BEN = 'Ben Osei';

async function twoMachines() {
  const a = await openTestArchive();
  const b = await openTestArchive();
  const files = [
    simpleFile('hf-1-fit.csv', 'HF-1', { peak: 30e6, tvd: 1850 }),
    simpleFile('hf-2-lot.csv', 'HF-2', { peak: 34e6, tvd: 2100 }),
    simpleFile('hf-3-fit.csv', 'HF-3', { peak: 28e6, tvd: 1600 }),
  ];
  const outcomes = await a.archive.importFiles(files, ANA);
  const ids = outcomes.map((o) => o.testId!);
  return { a, b, ids };
}

/** A's whole archive to B, as a bundle file. */
async function send(from: Archive, to: Archive, user: string) {
  return to.importBundle(await from.exportBundle(user), 'team.slbundle');
}

function pickAt(pressure: number): Pick {
  return { kind: 'fitMaximum', pressure, time: 20, method: 'manual', sampleIndex: 2 };
}

function comparable(list: Awaited<ReturnType<Archive['listTests']>>) {
  return list.map(({ id, wellName, fieldName, state, grade, reviewer, lastPickAuthor, importedBy, fileHash, shmin, wellId, fieldId }) =>
    ({ id, wellName, fieldName, state, grade, reviewer, lastPickAuthor, importedBy, fileHash, shmin, wellId, fieldId }));
}

async function errorCode(promise: Promise<unknown>): Promise<string> {
  try { await promise; } catch (e) { return e instanceof ArchiveError || e instanceof EngineError ? e.code : `other: ${String(e)}`; }
  return 'no error';
}

describe('team sharing through bundles', () => {
  it('should give new events their journal position, what they saw, and the journal line hash', async () => {
    const { a, b } = await twoMachines();
    await send(a.archive, b.archive, ANA);
    await b.archive.comment((await b.archive.listTests())[0].id, BEN, 'closure looks early');
    const events = await b.archive.listEvents();
    const mine = events.filter((e) => e.author === BEN);
    const anas = events.filter((e) => e.author === ANA);
    expect(mine.map((e) => e.seq)).toEqual([1]);
    // Ben saw every one of Ana's events (vector clock entry = her highest seq).
    expect(mine[0].seen).toEqual({ [`${ANA}@${a.archive.deviceId()}`]: anas.length });
    expect(mine[0].clock).toBe(Math.max(...anas.map((e) => e.clock)) + 1);
    const rows = await b.archive.db.events.toArray();
    for (const row of rows) {
      const { testId: _t, journal: _j, hash, ...event } = row;
      expect(hash).toBe(eventHash(event));
    }
    // Every journal the archive writes reads back clean: chain and numbering intact.
    for (const journal of journalTextsFromEvents(events)) expect(readJournal(journal.file, journal.text).issues).toEqual([]);
  });

  it('should show the same tests on a second machine, built from the raw files without new events', async () => {
    const { a, b } = await twoMachines();
    const outcome = await send(a.archive, b.archive, ANA);
    expect(outcome).toMatchObject({ duplicates: 0, conflicts: [], findings: [], issues: [], missingRawFiles: [] });
    expect(outcome.added).toBe((await a.archive.listEvents()).length);
    expect(comparable(await b.archive.listTests({ sortBy: 'wellName' }))).toEqual(comparable(await a.archive.listTests({ sortBy: 'wellName' })));
    expect(b.engine.calls.parse).toBe(3);
    expect((await b.archive.listEvents()).length).toBe((await a.archive.listEvents()).length);
    const detail = await b.archive.getTest((await b.archive.listTests())[0].id);
    expect(detail.samples.time.length).toBeGreaterThan(0);
    expect((await b.archive.listFields()).map((f) => f.name)).toEqual(['Harrow Flats']);
  });

  it('should carry a sign-off of a test changed elsewhere back, with its picks version matching', async () => {
    const { a, b, ids } = await twoMachines();
    const t1 = ids[0];
    await a.archive.movePick(t1, 1, 'fitMaximum', pickAt(29e6), 'peak was a spike', ANA);
    await a.archive.requestReview(t1, ANA);
    await send(a.archive, b.archive, ANA);
    // Four eyes across machines: on B, Ana (who set the picks on A) may not sign off.
    expect(await errorCode(b.archive.signOff(t1, ANA))).toBe('four-eyes');
    const signed = await b.archive.signOff(t1, BEN, 'picks checked');
    expect(signed).toMatchObject({ state: 'accepted', reviewer: BEN });
    const signOff = (await b.archive.eventsForTest(t1)).at(-1)!;
    expect(signOff.body).toMatchObject({ kind: 'signed-off', picksVersion: picksVersionForTest(await a.archive.eventsForTest(t1), t1) });
    const back = await send(b.archive, a.archive, BEN);
    expect(back.conflicts).toEqual([]);
    expect(back.findings).toEqual([]);
    const [summary] = await a.archive.listTests({ state: 'accepted' });
    expect(summary).toMatchObject({ id: t1, reviewer: BEN, lastPickAuthor: ANA });
    expect(await a.archive.conflicts()).toEqual([]);
    // The manual pick is in force on both machines.
    for (const archive of [a.archive, b.archive]) {
      expect((await archive.getTest(t1)).manualPicks.map((p) => p.pick?.pressure)).toEqual([29e6]);
    }
  });

  it('should report concurrent pick moves as one conflict on both machines and settle it by a decision', async () => {
    const { a, b, ids } = await twoMachines();
    const t2 = ids[1];
    await send(a.archive, b.archive, ANA);
    await a.archive.movePick(t2, 1, 'fitMaximum', pickAt(33e6), 'peak is a pump surge', ANA);
    await b.archive.movePick(t2, 1, 'fitMaximum', pickAt(32e6), 'gauge spike at the peak', BEN);
    const atA = await send(b.archive, a.archive, BEN);
    const atB = await send(a.archive, b.archive, ANA);
    expect(atA.conflicts.map((c) => c.kind)).toEqual(['concurrent-pick-moves']);
    expect(atB.conflicts.map((c) => c.id)).toEqual(atA.conflicts.map((c) => c.id));
    const [conflict] = await a.archive.conflicts();
    expect(conflict.authors).toEqual([ANA, BEN]);
    expect(conflict.events.map((e) => e.author).sort()).toEqual([ANA, BEN]);
    expect((await a.archive.listTests()).find((t) => t.id === t2)!.openConflicts).toEqual([conflict.id]);
    // Both machines show the same pick meanwhile (the later one in the total order).
    const shownA = (await a.archive.getTest(t2)).manualPicks[0].pick!.pressure;
    expect((await b.archive.getTest(t2)).manualPicks[0].pick!.pressure).toBe(shownA);
    // A decision needs a reason and one of the two moves.
    expect(await errorCode(a.archive.resolveConflict(conflict.id, NO_EVENT, ANA, 'neither'))).toBe('bad-argument');
    expect(await errorCode(a.archive.resolveConflict(conflict.id, conflict.eventIds[0], ANA, ' '))).toBe('reason-required');
    const bensMove = conflict.events.find((e) => e.author === BEN)!.id;
    const decided = await a.archive.resolveConflict(conflict.id, bensMove, ANA, 'the gauge spike explains the peak');
    expect(decided.resolution).toMatchObject({ keep: bensMove, author: ANA });
    expect(await errorCode(a.archive.resolveConflict(conflict.id, bensMove, ANA, 'again'))).toBe('bad-state');
    await send(a.archive, b.archive, ANA);
    for (const archive of [a.archive, b.archive]) {
      expect(await archive.conflicts()).toEqual([]);
      expect((await archive.getTest(t2)).manualPicks[0].pick!.pressure).toBe(32e6);
      expect((await archive.listTests()).find((t) => t.id === t2)!.openConflicts).toBeUndefined();
    }
  });

  it('should show a sign-off made concurrently with a pick change as a conflict, not an acceptance', async () => {
    const { a, b, ids } = await twoMachines();
    const t3 = ids[2];
    await a.archive.requestReview(t3, ANA);
    await send(a.archive, b.archive, ANA);
    await b.archive.signOff(t3, BEN, 'fine');
    await a.archive.movePick(t3, 1, 'fitMaximum', pickAt(27e6), 'peak was a spike', ANA);
    const atA = await send(b.archive, a.archive, BEN);
    await send(a.archive, b.archive, ANA);
    expect(atA.conflicts.map((c) => c.kind)).toEqual(['sign-off-concurrent-change']);
    for (const archive of [a.archive, b.archive]) {
      const summary = (await archive.listTests()).find((t) => t.id === t3)!;
      expect(summary.state).toBe('in-review');
      expect(summary.reviewer).toBeNull();
    }
    // Keeping the sign-off restores the picks it signed (the automatic ones) and accepts the test.
    const [conflict] = await b.archive.conflicts({ testId: t3 });
    const signOffId = conflict.events.find((e) => e.kind === 'signed-off')!.id;
    await b.archive.resolveConflict(conflict.id, signOffId, BEN, 'the spike is real pressure; automatic pick stands');
    await send(b.archive, a.archive, BEN);
    for (const archive of [a.archive, b.archive]) {
      expect((await archive.listTests()).find((t) => t.id === t3)).toMatchObject({ state: 'accepted', reviewer: BEN });
      expect((await archive.getTest(t3)).manualPicks).toEqual([]);
      expect(await archive.conflicts()).toEqual([]);
      expect((await archive.conflicts({ includeResolved: true })).map((c) => c.resolution?.keep)).toEqual([signOffId]);
    }
  });

  it('should read a raw file on the second machine with the options it was imported with', async () => {
    const a = await openTestArchive();
    const b = await openTestArchive();
    const parseOptions = { columns: [{ index: 1, role: 'pressure', unit: 'Pa' }] };
    await a.archive.importFiles([simpleFile('hf-4-fit.csv', 'HF-4')], ANA, { parseOptions });
    await send(a.archive, b.archive, ANA);
    expect(b.engine.parseOptions).toEqual([parseOptions]);
  });

  it('should add nothing when the same bundle is imported twice', async () => {
    const { a, b } = await twoMachines();
    const bundle = await a.archive.exportBundle(ANA);
    await b.archive.importBundle(bundle, 'team.slbundle');
    const before = await tableCounts(b.archive);
    const again = await b.archive.importBundle(bundle, 'team.slbundle');
    expect(again.added).toBe(0);
    expect(again.duplicates).toBe((await a.archive.listEvents()).length);
    expect(await tableCounts(b.archive)).toEqual(before);
  });

  it('should refuse a damaged bundle whole, with an EngineError naming the file', async () => {
    const { a, b } = await twoMachines();
    const bundle = await a.archive.exportBundle(ANA);
    bundle[bundle.length - 10] ^= 1;
    const error = await b.archive.importBundle(bundle, 'team.slbundle').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(EngineError);
    expect(error).toMatchObject({ code: 'bad-bundle' });
    expect((error as EngineError).message).toMatch(/checksum/);
    expect(await b.archive.listEvents()).toEqual([]);
  });

  it('should list tests whose raw file has not arrived, and build them when it does', async () => {
    const { a, b, ids } = await twoMachines();
    const events = await a.archive.listEvents();
    const outcome = await b.archive.applyEvents(events);
    expect(outcome.missingRawFiles.map((m) => m.testId).sort()).toEqual([...ids].sort());
    expect(await b.archive.listTests()).toEqual([]);
    const raw = new Map<string, Uint8Array>();
    for (const m of outcome.missingRawFiles) raw.set(m.fileHash, (await a.archive.rawFile(m.fileHash))!);
    const later = await b.archive.applyEvents([], raw);
    expect(later).toMatchObject({ added: 0, missingRawFiles: [] });
    expect((await b.archive.listTests()).map((t) => t.id).sort()).toEqual([...ids].sort());
    // A raw file whose content does not match its hash is not stored.
    const bad = await b.archive.applyEvents([], new Map([['00'.repeat(32), new Uint8Array([1])]]));
    expect(bad.issues.map((i) => i.kind)).toEqual(['raw-damaged']);
  });

  it('should derive from its log the same review states its tables show', async () => {
    const { a, b, ids } = await twoMachines();
    await a.archive.requestReview(ids[0], ANA);
    await send(a.archive, b.archive, ANA);
    await b.archive.signOff(ids[0], BEN);
    await b.archive.reject(ids[1], BEN, 'pump stopped mid-test');
    await send(b.archive, a.archive, BEN);
    const state = deriveArchiveState(await a.archive.listEvents());
    for (const summary of await a.archive.listTests()) {
      expect([summary.state, summary.reviewer]).toEqual([state.tests[summary.id].state, state.tests[summary.id].reviewer]);
    }
    expect((await a.archive.syncStatus(ANA)).people.map((p) => p.author)).toEqual([ANA, BEN]);
  });

  it('should count own events as waiting until they are in an exported bundle', async () => {
    const { a } = await twoMachines();
    const own = (await a.archive.listEvents()).length;
    expect((await a.archive.syncStatus(ANA)).waiting).toHaveLength(own);
    await a.archive.exportBundle(ANA);
    const status = await a.archive.syncStatus(ANA, { folderReachable: null });
    expect(status).toMatchObject({ waiting: [], writtenSeq: own, localSeq: own, folderReachable: null });
  });
});
