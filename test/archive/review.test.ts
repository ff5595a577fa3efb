import { describe, expect, it } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';
import { ArchiveError } from '../../src-renderer/archive/errors';
import { eventHash } from '../../src-renderer/archive/journal/journal-file';

// Review policy from DESIGN.md ("Review"): four eyes, reasons for rejections, accepted picks
// frozen and reopened on change, append-only log. Lamport clocks: L. Lamport, "Time, clocks,
// and the ordering of events in a distributed system", CACM 21(7), 1978.

async function importedTest() {
  const opened = await openTestArchive();
  const [outcome] = await opened.archive.importFiles([simpleFile('hf-1.csv', 'HF-1', { peak: 30e6 })], 'Ana Petrov');
  return { ...opened, testId: outcome.testId! };
}

async function errorCode(promise: Promise<unknown>): Promise<string> {
  try { await promise; } catch (e) { return e instanceof ArchiveError ? e.code : `other: ${String(e)}`; }
  return 'no error';
}

describe('archive review', () => {
  it('should refuse a sign-off by the importer when nobody changed the picks', async () => {
    const { archive, testId } = await importedTest();
    await archive.requestReview(testId, 'Ana Petrov');
    expect(await errorCode(archive.signOff(testId, 'Ana Petrov'))).toBe('four-eyes');
    const summary = await archive.signOff(testId, 'Ben Osei', 'picks checked');
    expect(summary).toMatchObject({ state: 'accepted', reviewer: 'Ben Osei' });
  });

  it('should refuse a sign-off by the last author of the picks, even if someone else imported it', async () => {
    const { archive, testId } = await importedTest();
    const detail = await archive.getTest(testId);
    const auto = detail.analysis.cycles[0].picks.fitMaximum!;
    await archive.movePick(testId, 1, 'fitMaximum', { ...auto, pressure: 29e6 }, 'peak was a spike', 'Ben Osei');
    await archive.requestReview(testId, 'Ben Osei');
    expect(await errorCode(archive.signOff(testId, 'ben osei'))).toBe('four-eyes');
    expect((await archive.signOff(testId, 'Ana Petrov')).state).toBe('accepted');
  });

  it('should require a reason to reject and keep it in the log', async () => {
    const { archive, testId } = await importedTest();
    await archive.requestReview(testId, 'Ana Petrov');
    expect(await errorCode(archive.reject(testId, 'Ben Osei', ' '))).toBe('reason-required');
    expect((await archive.getTest(testId)).summary.state).toBe('in-review');
    await archive.reject(testId, 'Ben Osei', 'pump rate not steady during loading');
    const log = await archive.eventsForTest(testId);
    expect(log.at(-1)!.body).toEqual({ kind: 'rejected', testId, reason: 'pump rate not steady during loading' });
  });

  it('should reopen an accepted test when its picks change, logging why', async () => {
    const { archive, testId } = await importedTest();
    await archive.requestReview(testId, 'Ana Petrov');
    await archive.signOff(testId, 'Ben Osei');
    const detail = await archive.getTest(testId);
    const auto = detail.analysis.cycles[0].picks.fitMaximum!;
    const after = await archive.movePick(testId, 1, 'fitMaximum', { ...auto, pressure: 28e6, time: auto.time }, 'gauge spike at peak', 'Ana Petrov');
    expect(after.summary).toMatchObject({ state: 'in-review', reviewer: null, lastPickAuthor: 'Ana Petrov', shmin: 28e6 });
    expect(after.manualPicks).toHaveLength(1);
    expect(after.manualPicks[0]).toMatchObject({ cycle: 1, kind: 'fitMaximum', author: 'Ana Petrov', reason: 'gauge spike at peak' });
    expect(after.analysis.cycles[0].picks.fitMaximum).toMatchObject({ pressure: 28e6, manual: true });
    const kinds = after.log.map((e) => e.body.kind);
    expect(kinds.slice(-2)).toEqual(['review-reopened', 'pick-moved']);
    // Ana changed the picks, so Ana cannot sign off now; Ben can.
    expect(await errorCode(archive.signOff(testId, 'Ana Petrov'))).toBe('four-eyes');
    expect((await archive.signOff(testId, 'Ben Osei')).state).toBe('accepted');
  });

  it('should remove an automatic pick with null and restore it with a reset', async () => {
    const { archive, testId } = await importedTest();
    const removed = await archive.movePick(testId, 1, 'fitMaximum', null, 'no clear maximum', 'Ana Petrov');
    expect(removed.analysis.cycles[0].picks.fitMaximum).toBeUndefined();
    expect(removed.summary.shmin).toBeNull();
    const reset = await archive.resetPicks(testId, 'back to automatic', 'Ana Petrov');
    expect(reset.manualPicks).toEqual([]);
    expect(reset.summary.shmin).toBe(30e6);
    // History is kept: both changes stay in the picks table.
    expect(await archive.db.picks.where('testId').equals(testId).count()).toBe(2);
  });

  it('should refuse a pick change without a reason or with a bad cycle', async () => {
    const { archive, testId } = await importedTest();
    expect(await errorCode(archive.movePick(testId, 1, 'isip', null, '', 'Ana'))).toBe('reason-required');
    expect(await errorCode(archive.movePick(testId, 0, 'isip', null, 'why not', 'Ana'))).toBe('bad-argument');
    expect(await errorCode(archive.movePick('nope', 1, 'isip', null, 'why not', 'Ana'))).toBe('not-found');
  });

  it('should reopen a rejected test only with a reason', async () => {
    const { archive, testId } = await importedTest();
    await archive.reject(testId, 'Ben Osei', 'wrong well in header');
    expect(await errorCode(archive.reopen(testId, 'Ana Petrov', ''))).toBe('reason-required');
    expect((await archive.reopen(testId, 'Ana Petrov', 'header corrected')).state).toBe('in-review');
  });

  it('should keep the log append-only, hash-chained per journal and Lamport-ordered', async () => {
    const { archive, testId } = await importedTest();
    await archive.comment(testId, 'Ana Petrov', 'shoe at 1850 m');
    await archive.requestReview(testId, 'Ana Petrov');
    await archive.comment(testId, 'Ben Osei', 'looks fine');
    const events = await archive.listEvents();
    expect(events.map((e) => e.clock)).toEqual(events.map((_, i) => i + 1));
    const rows = await archive.db.events.orderBy('clock').toArray();
    for (const author of ['Ana Petrov', 'Ben Osei']) {
      const journal = rows.filter((r) => r.author === author);
      expect(journal[0].prev).toBe('');
      for (let i = 1; i < journal.length; i++) {
        const previous = journal[i - 1];
        const { testId: _t, journal: _j, hash: _h, ...event } = previous;
        // The chain link is the journal's own line hash (archive/journal/journal-file.ts).
        expect(journal[i].prev).toBe(eventHash(event));
        expect(previous.hash).toBe(eventHash(event));
        expect(journal[i].seq).toBe(i + 1);
      }
    }
    await expect(archive.db.events.update(rows[0].id, { author: 'Mallory' })).rejects.toBeInstanceOf(ArchiveError);
    await expect(archive.db.events.delete(rows[0].id)).rejects.toBeInstanceOf(ArchiveError);
    expect((await archive.db.events.get(rows[0].id))!.author).toBe('Ana Petrov');
    expect(await errorCode(archive.comment(testId, 'Ana', '  '))).toBe('bad-argument');
  });

  it('should keep project limits with a reason and regrade with them', async () => {
    const { archive, testId } = await importedTest();
    expect((await archive.getTest(testId)).summary.grade).toBe('A');
    expect(await errorCode(archive.setLimits({ minimumSamples: 10 }, 'Lead', ''))).toBe('reason-required');
    await archive.setLimits({ minimumSamples: 10 }, 'Lead', 'project standard: at least 10 samples');
    expect(await archive.regradeAll()).toBe(1);
    expect((await archive.listTests())[0].grade).toBe('D');
    expect((await archive.getSettings()).limits).toEqual({ minimumSamples: 10 });
    await archive.setUnitSystem('oilfield');
    expect((await archive.getSettings()).unitSystem).toBe('oilfield');
  });

  it('should save and return a column mapping per layout', async () => {
    const { archive } = await openTestArchive();
    const columns = [{ index: 0, header: 'Elapsed (min)', role: 'time' as const, unit: 'min', unitStated: true }];
    await archive.saveMapping({ layout: 'elapsed-min|whp-psi', columns, savedBy: 'Ana Petrov', contractor: 'Cobalt Ridge Test Services' });
    expect(await archive.getMapping('elapsed-min|whp-psi')).toMatchObject({ columns, savedBy: 'Ana Petrov' });
    expect(await archive.getMapping('other')).toBeNull();
  });
});

describe('archive review log and the team journal', () => {
  it('should number each journal from 1 and hash events as the journal file does', async () => {
    const { eventHash } = await import('../../src-renderer/archive/journal/journal-file');
    const { archive, testId } = await importedTest();
    await archive.comment(testId, 'Ben Osei', 'first from Ben');
    await archive.comment(testId, 'Ana Petrov', 'third from Ana');
    const rows = await archive.db.events.orderBy('clock').toArray();
    expect(rows.filter((r) => r.author === 'Ana Petrov').map((r) => r.seq)).toEqual([1, 2, 3, 4]);
    expect(rows.filter((r) => r.author === 'Ben Osei').map((r) => r.seq)).toEqual([1]);
    const events = await archive.listEvents();
    // The stored hash (and so every `prev`) equals the journal line hash of archive/journal.
    for (let i = 0; i < rows.length; i++) expect(rows[i].hash).toBe(eventHash(events[i]));
  });
});
