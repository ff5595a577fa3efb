import { describe, expect, it } from 'vitest';
import { conflictIdOf, deriveArchiveState, NO_EVENT, pickSlotKey, picksVersionOf } from '../../../src-renderer/archive/journal/derive';
import { compareEventOrder, concurrent, happenedBefore } from '../../../src-renderer/archive/journal/causality';
import type { ArchiveEvent } from '../../../src-renderer/archive/events';
import { movePick, setUpField, Team } from './team-fixture';

// Synthetic team histories whose truth is set by the test (who saw what is known exactly).

function threePeople() {
  const team = new Team();
  const anna = team.person('Anna', 'laptop-7');
  const ben = team.person('Ben', 'desk-2');
  const carl = team.person('Carl', 'rig-office');
  setUpField(anna);
  ben.receiveFrom(anna);
  carl.receiveFrom(anna);
  return { team, anna, ben, carl };
}

describe('deriveArchiveState', () => {
  it('should derive fields, wells and tests from the log', () => {
    const { team } = threePeople();
    const state = deriveArchiveState(team.all);
    expect(state.fields['harrow-flats'].name).toBe('Harrow Flats');
    expect(state.wells['hf-3']).toMatchObject({ fieldId: 'harrow-flats', name: 'Harrow Flats 3', rigFloorElevation: 25, createdBy: 'Anna' });
    expect(state.tests.t1).toMatchObject({ type: 'lot', fileHash: 'hash-of-t1', state: 'imported', importedBy: 'Anna', lastPickAuthor: 'Anna', reviewer: null });
    expect(state.eventCount).toBe(3);
    // No pick events yet: the version is SHA-256 of the empty string (NIST CAVS, Len = 0).
    expect(state.tests.t1.picksVersion).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('should accept a test signed off by a second person who saw the picks', () => {
    const { team, anna, ben } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.2e6);
    anna.make({ kind: 'review-requested', testId: 't1' });
    ben.receiveFrom(anna);
    const signOff = ben.signOff('t1', 'B');
    const state = deriveArchiveState(team.all);
    expect(state.tests.t1).toMatchObject({ state: 'accepted', reviewer: 'Ben', signedGrade: 'B', signOffEventId: signOff.id, lastPickAuthor: 'Anna', openConflicts: [] });
    expect(state.tests.t1.picks[pickSlotKey(1, 'closure')]).toMatchObject({ manual: true, author: 'Anna', conflicted: false });
    expect(state.tests.t1.picks[pickSlotKey(1, 'closure')].pick?.pressure).toBe(31.2e6);
    expect(Object.keys(state.conflicts)).toHaveLength(0);
  });

  it('should not count a sign-off by the person who last set the picks, even from another device (four eyes)', () => {
    const { team, anna, ben } = threePeople();
    const annaDesk = team.person('Anna', 'desk-9');
    movePick(ben, 't1', 1, 'isip', 33e6);
    anna.receiveFrom(ben);
    movePick(anna, 't1', 1, 'closure', 31e6);
    annaDesk.receiveFrom(anna);
    annaDesk.signOff('t1');
    const state = deriveArchiveState(team.all);
    expect(state.tests.t1.state).toBe('imported');
    expect(state.tests.t1.reviewer).toBeNull();
    expect(state.findings.map((f) => f.kind)).toEqual(['self-sign-off']);
    // Ben did not set the last pick: his sign-off counts.
    ben.receiveFrom(annaDesk);
    ben.signOff('t1');
    expect(deriveArchiveState(team.all).tests.t1).toMatchObject({ state: 'accepted', reviewer: 'Ben' });
  });

  it('should not count a sign-off by the importer when nobody moved a pick', () => {
    const { team, anna } = threePeople();
    anna.signOff('t1');
    expect(deriveArchiveState(team.all).tests.t1.state).toBe('imported');
  });

  it('should report two concurrent moves of the same pick and keep both in the history', () => {
    const { team, anna, ben, carl } = threePeople();
    const a = movePick(anna, 't1', 1, 'closure', 31.0e6, 'closure at G-function tangent departure');
    const b = movePick(ben, 't1', 1, 'closure', 31.6e6, 'closure at sqrt-time inflection');
    expect(concurrent(a, b)).toBe(true);
    const state = deriveArchiveState(team.all);
    const id = conflictIdOf('concurrent-pick-moves', [a.id, b.id]);
    expect(state.conflicts[id]).toMatchObject({ kind: 'concurrent-pick-moves', testId: 't1', authors: ['Anna', 'Ben'], resolution: null, slot: { cycle: 1, kind: 'closure' } });
    const slot = state.tests.t1.picks[pickSlotKey(1, 'closure')];
    expect(slot.conflicted).toBe(true);
    expect(slot.history.map((h) => h.eventId).sort()).toEqual([a.id, b.id].sort());
    expect(state.tests.t1.openConflicts).toEqual([id]);

    // Carl sees both and decides for Anna's pick.
    carl.receiveFrom(anna);
    carl.receiveFrom(ben);
    carl.make({ kind: 'conflict-resolved', conflictId: id, testId: 't1', keep: a.id, reason: 'G-function tangent is the better-supported closure here' });
    const after = deriveArchiveState(team.all);
    expect(after.conflicts[id].resolution).toMatchObject({ author: 'Carl', keep: a.id });
    const resolved = after.tests.t1.picks[pickSlotKey(1, 'closure')];
    expect(resolved.pick?.pressure).toBe(31.0e6);
    expect(resolved.conflicted).toBe(false);
    expect(resolved.history).toHaveLength(3);
    expect(after.tests.t1.openConflicts).toEqual([]);
    expect(after.tests.t1.lastPickAuthor).toBe('Carl');
  });

  it('should not report concurrent moves that set the same pick, nor a move made after seeing the other', () => {
    const { team, anna, ben } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    movePick(ben, 't1', 1, 'closure', 31.0e6);
    expect(Object.keys(deriveArchiveState(team.all).conflicts)).toHaveLength(0);
    ben.receiveFrom(anna);
    movePick(ben, 't1', 1, 'closure', 31.4e6);
    anna.receiveFrom(ben);
    movePick(anna, 't1', 1, 'closure', 31.3e6);
    expect(Object.keys(deriveArchiveState(team.all).conflicts)).toHaveLength(0);
    expect(deriveArchiveState(team.all).tests.t1.picks['1:closure'].pick?.pressure).toBe(31.3e6);
  });

  it('should report a reset made without seeing a concurrent move', () => {
    const { team, anna, ben } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    ben.make({ kind: 'picks-reset', testId: 't1', reason: 'back to the automatic picks' });
    const late = movePick(anna, 't1', 2, 'isip', 34e6);
    const state = deriveArchiveState(team.all);
    const kinds = Object.values(state.conflicts).map((c) => c.kind);
    expect(kinds).toEqual(['concurrent-pick-moves']);
    expect(Object.values(state.conflicts)[0].eventIds).toContain(late.id);
  });

  it('should report a sign-off made while another person changed the picks, and not accept the test', () => {
    const { team, anna, ben } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    const signOff = ben.signOff('t1');
    const change = movePick(anna, 't1', 1, 'isip', 33.5e6, 'ISIP from the first second of shut-in');
    const state = deriveArchiveState(team.all);
    const id = conflictIdOf('sign-off-concurrent-change', [signOff.id, change.id]);
    expect(state.conflicts[id]).toMatchObject({ kind: 'sign-off-concurrent-change', authors: ['Anna', 'Ben'], resolution: null });
    expect(state.tests.t1.state).toBe('in-review');
    expect(state.tests.t1.reviewer).toBeNull();
  });

  it('should let a decision keep the sign-off, restoring the picks it signed', () => {
    const { team, anna, ben, carl } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    movePick(anna, 't1', 1, 'isip', 33.0e6);
    ben.receiveFrom(anna);
    const signOff = ben.signOff('t1');
    const change = movePick(anna, 't1', 1, 'isip', 33.5e6);
    const id = conflictIdOf('sign-off-concurrent-change', [signOff.id, change.id]);
    carl.receiveFrom(anna);
    carl.receiveFrom(ben);
    carl.make({ kind: 'conflict-resolved', conflictId: id, testId: 't1', keep: signOff.id, reason: 'the signed ISIP stands; the later one was a slip' });
    const state = deriveArchiveState(team.all);
    expect(state.tests.t1).toMatchObject({ state: 'accepted', reviewer: 'Ben', openConflicts: [] });
    const isip = state.tests.t1.picks['1:isip'];
    expect(isip.pick?.pressure).toBe(33.0e6);
    expect(isip.history.map((h) => h.source)).toEqual(['moved', 'moved', 'restored']);
  });

  it('should let a decision keep the change, leaving the test in review', () => {
    const { team, anna, ben, carl } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    const signOff = ben.signOff('t1');
    const change = movePick(anna, 't1', 1, 'isip', 33.5e6);
    const id = conflictIdOf('sign-off-concurrent-change', [signOff.id, change.id]);
    carl.receiveFrom(anna);
    carl.receiveFrom(ben);
    carl.make({ kind: 'conflict-resolved', conflictId: id, testId: 't1', keep: change.id, reason: 'the new ISIP needs its own review' });
    const state = deriveArchiveState(team.all);
    expect(state.tests.t1.state).toBe('in-review');
    expect(state.tests.t1.picks['1:isip'].pick?.pressure).toBe(33.5e6);
    expect(state.conflicts[id].resolution?.keep).toBe(change.id);
  });

  it('should let a decision void a stale sign-off, and refuse a decision keeping an unrelated event', () => {
    const { team, anna, ben, carl } = threePeople();
    const move = movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    const signOff = ben.make({ kind: 'signed-off', testId: 't1', grade: 'C', picksVersion: picksVersionOf(['not-a-real-pick']) });
    const id = conflictIdOf('stale-sign-off', [signOff.id]);
    carl.receiveFrom(ben);
    carl.make({ kind: 'conflict-resolved', conflictId: id, testId: 't1', keep: move.id, reason: 'wrong event' });
    let state = deriveArchiveState(team.all);
    expect(state.findings.map((f) => f.kind)).toEqual(['bad-resolution']);
    expect(state.conflicts[id].resolution).toBeNull();
    carl.make({ kind: 'conflict-resolved', conflictId: id, testId: 't1', keep: NO_EVENT, reason: 'sign again after checking the picks' });
    state = deriveArchiveState(team.all);
    expect(state.conflicts[id].resolution?.keep).toBe(NO_EVENT);
    expect(state.tests.t1.state).not.toBe('accepted');
    expect(state.tests.t1.openConflicts).toEqual([]);
  });

  it('should reopen the review when a pick changes after its author saw the acceptance', () => {
    const { team, anna, ben } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    const signOff = ben.signOff('t1');
    anna.receiveFrom(ben);
    const change = movePick(anna, 't1', 1, 'closure', 30.8e6);
    expect(happenedBefore(signOff, change)).toBe(true);
    const state = deriveArchiveState(team.all);
    expect(Object.keys(state.conflicts)).toHaveLength(0);
    expect(state.tests.t1.state).toBe('in-review');
    expect(state.tests.t1.log.map((l) => l.kind)).toContain('reopened-by-change');
  });

  it('should report a sign-off whose picks version does not match what its author saw', () => {
    const { team, anna, ben } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    const signOff = ben.make({ kind: 'signed-off', testId: 't1', grade: 'C', picksVersion: picksVersionOf(['some-other-pick']) });
    const state = deriveArchiveState(team.all);
    expect(state.conflicts[conflictIdOf('stale-sign-off', [signOff.id])].kind).toBe('stale-sign-off');
    expect(state.tests.t1.state).not.toBe('accepted');
  });

  it('should report a sign-off and a rejection made without seeing each other', () => {
    const { team, anna, ben, carl } = threePeople();
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    ben.receiveFrom(anna);
    carl.receiveFrom(anna);
    ben.signOff('t1');
    carl.make({ kind: 'rejected', testId: 't1', reason: 'pump rate unstable during loading' });
    const kinds = Object.values(deriveArchiveState(team.all).conflicts).map((c) => c.kind);
    expect(kinds).toContain('concurrent-review-decisions');
  });

  it('should keep events about a test it does not have as findings, losing none', () => {
    const team = new Team();
    const ben = team.person('Ben', 'desk-2');
    ben.make({ kind: 'comment', testId: 'missing', text: 'where is the import?' });
    const state = deriveArchiveState(team.all);
    expect(state.eventCount).toBe(1);
    expect(state.findings[0]).toMatchObject({ kind: 'unknown-test', testId: 'missing' });
  });

  it('should keep comments and limits per test and for the project', () => {
    const { team, anna, ben } = threePeople();
    ben.make({ kind: 'comment', testId: 't1', text: 'loading line is straight above 5 MPa' });
    anna.make({ kind: 'limits-changed', scope: 'project', limits: { minLoadingR2: 0.98 }, reason: 'field standard' });
    anna.make({ kind: 'limits-changed', scope: { testId: 't1' }, limits: { maxClosureSpread: 0.5e6 }, reason: 'noisy gauge' });
    const state = deriveArchiveState(team.all);
    expect(state.tests.t1.comments[0]).toMatchObject({ author: 'Ben', text: 'loading line is straight above 5 MPa' });
    expect(state.projectLimits).toEqual({ minLoadingR2: 0.98 });
    expect(state.tests.t1.limits).toEqual({ maxClosureSpread: 0.5e6 });
    expect(state.limitsLog).toHaveLength(2);
  });

  it('should order events made before team journals existed by their clock, reporting no conflict', () => {
    const { team, anna, ben } = threePeople();
    const legacy = (e: ArchiveEvent): ArchiveEvent => {
      const { seq: _seq, seen: _seen, ...rest } = e;
      return rest;
    };
    movePick(anna, 't1', 1, 'closure', 31.0e6);
    movePick(ben, 't1', 1, 'closure', 31.5e6);
    ben.receiveFrom(anna);
    const events = team.all.map(legacy);
    const state = deriveArchiveState(events);
    expect(Object.keys(state.conflicts)).toHaveLength(0);
    const last = [...events].sort(compareEventOrder).filter((e) => e.body.kind === 'pick-moved').pop()!;
    expect(state.tests.t1.picks['1:closure'].eventId).toBe(last.id);
  });
});
