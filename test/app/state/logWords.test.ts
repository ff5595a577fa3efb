import { describe, expect, it } from 'vitest';
import type { ArchiveEvent } from '../../../src-renderer/archive/events';
import { NO_EVENT } from '../../../src-renderer/archive/journal/versions';
import { describeEvent } from '../../../src-renderer/app/state/logWords';

// Synthetic review-log events of a Harrow Flats test; the expected sentences are set here.
const envelope = (id: string, author: string, time: string) => ({ id, author, device: 'd1', time, clock: 1, prev: '' });
const moveA: ArchiveEvent = { ...envelope('a1', 'Ada Brennan', '2026-12-01T10:00:00Z'), body: { kind: 'pick-moved', testId: 't1', cycle: 1, pickKind: 'closure', pick: { kind: 'closure', time: 600, pressure: 3e7, sampleIndex: 600, method: 'manual', manual: true }, reason: 'G-function' } };
const signB: ArchiveEvent = { ...envelope('b1', 'Idris Calloway', '2026-12-01T10:05:00Z'), body: { kind: 'signed-off', testId: 't1', grade: 'B', picksVersion: 'v' } };

describe('describeEvent', () => {
  it('should name the change a conflict decision kept', () => {
    const decision: ArchiveEvent = { ...envelope('c1', 'Idris Calloway', '2026-12-01T11:00:00Z'), body: { kind: 'conflict-resolved', conflictId: 'k', testId: 't1', keep: 'a1', reason: 'Cleaner closure signature' } };
    expect(describeEvent(decision, [moveA, signB, decision])).toMatch(/^Decided a team conflict: kept Ada Brennan's pick change of 2026-12-01 \d\d:\d\d\. Reason: Cleaner closure signature$/);
    expect(describeEvent(decision)).toBe('Decided a team conflict: kept one of the two changes. Reason: Cleaner closure signature');
  });

  it('should say a void decision leaves the test in review', () => {
    const decision: ArchiveEvent = { ...envelope('c2', 'Maren Holt', '2026-12-01T11:00:00Z'), body: { kind: 'conflict-resolved', conflictId: 'k', testId: 't1', keep: NO_EVENT, reason: 'Signed the old picks' } };
    expect(describeEvent(decision, [signB])).toBe('Decided a team conflict: neither side stands, the sign-off is void and the test stays in review. Reason: Signed the old picks');
  });
});
