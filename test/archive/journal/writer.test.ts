import { describe, expect, it } from 'vitest';
import { JournalWriter } from '../../../src-renderer/archive/journal/writer';
import { eventHash, readJournal, serializeEvent } from '../../../src-renderer/archive/journal/journal-file';
import { syncStatus } from '../../../src-renderer/archive/journal/sync-status';
import { canonicalJson } from '../../../src-renderer/archive/journal/canonical';

// Synthetic events; expected values follow from the Lamport clock rule (clock = max seen + 1,
// Lamport 1978, "Time, Clocks, and the Ordering of Events in a Distributed System").

describe('JournalWriter', () => {
  it('should number events, chain them and follow the Lamport rule on what it observed', () => {
    const anna = new JournalWriter('Anna', 'laptop-7', { now: () => '2026-11-02T08:00:00.000Z' });
    const ben = new JournalWriter('Ben', 'desk-2', { now: () => '2026-11-02T08:00:01.000Z' });
    const a1 = anna.append({ kind: 'comment', testId: 't1', text: 'one' });
    const b1 = ben.append({ kind: 'comment', testId: 't1', text: 'two' });
    const b2 = ben.append({ kind: 'comment', testId: 't1', text: 'three' });
    anna.observe([b2.event, b1.event, b2.event]); // any order, repeated
    const a2 = anna.append({ kind: 'comment', testId: 't1', text: 'four' });
    expect(a1.event).toMatchObject({ id: 'Anna@laptop-7#1', seq: 1, clock: 1, prev: '', seen: {} });
    expect(a2.event).toMatchObject({ seq: 2, clock: 3, prev: a1.hash, seen: { 'Ben@desk-2': 2 } });
    expect(a2.line).toBe(serializeEvent(a2.event));
  });

  it('should carry over what observed events had seen (transitively)', () => {
    const anna = new JournalWriter('Anna', 'laptop-7');
    const ben = new JournalWriter('Ben', 'desk-2');
    const carl = new JournalWriter('Carl', 'rig-office');
    ben.observe([anna.append({ kind: 'comment', testId: 't1', text: 'a' }).event]);
    const b = ben.append({ kind: 'comment', testId: 't1', text: 'b' }).event;
    carl.observe([b]);
    expect(carl.append({ kind: 'comment', testId: 't1', text: 'c' }).event.seen).toEqual({ 'Anna@laptop-7': 1, 'Ben@desk-2': 1 });
  });

  it('should continue its own chain after a restart from the events it made before', () => {
    const before = new JournalWriter('Anna', 'laptop-7');
    const old = [before.append({ kind: 'comment', testId: 't1', text: 'a' }).event, before.append({ kind: 'comment', testId: 't1', text: 'b' }).event];
    const after = new JournalWriter('Anna', 'laptop-7');
    after.observe(old);
    const next = after.append({ kind: 'comment', testId: 't1', text: 'c' });
    expect(next.event).toMatchObject({ seq: 3, prev: eventHash(old[1]), clock: 3 });
    const text = [...old, next.event].map((e) => serializeEvent(e) + '\n').join('');
    expect(readJournal('Anna@laptop-7.jsonl', text).issues).toEqual([]);
  });

  it('should refuse a body with a number a journal cannot hold', () => {
    const anna = new JournalWriter('Anna', 'laptop-7');
    expect(() => anna.append({ kind: 'limits-changed', scope: 'project', limits: { minLoadingR2: Number.NaN }, reason: 'x' })).toThrow('finite number');
  });
});

describe('canonicalJson', () => {
  it('should sort keys and drop undefined members so equal events give equal lines', () => {
    expect(canonicalJson({ b: 1, a: { d: [1, undefined], c: 'x' }, e: undefined })).toBe('{"a":{"c":"x","d":[1,null]},"b":1}');
  });
});

describe('syncStatus', () => {
  it('should list own events not yet in the folder and who changed what last', () => {
    let t = 0;
    const now = () => new Date(Date.UTC(2026, 10, 2, 8, 0, t++)).toISOString();
    const anna = new JournalWriter('Anna', 'laptop-7', { now });
    const ben = new JournalWriter('Ben', 'desk-2', { now });
    const events = [
      anna.append({ kind: 'comment', testId: 't1', text: 'a' }).event,
      anna.append({ kind: 'review-requested', testId: 't1' }).event,
      ben.append({ kind: 'rejected', testId: 't1', reason: 'rate not stable' }).event,
      anna.append({ kind: 'picks-reset', testId: 't1', reason: 'start again' }).event,
    ];
    const status = syncStatus({ journal: 'Anna@laptop-7', events, writtenSeq: 1, folderReachable: false });
    expect(status.waiting.map((w) => w.summary)).toEqual(['asked for a review of test t1', 'reset the picks of test t1 to automatic (start again)']);
    expect(status.localSeq).toBe(3);
    expect(status.people.map((p) => [p.author, p.events, p.lastSummary])).toEqual([
      ['Anna', 3, 'reset the picks of test t1 to automatic (start again)'],
      ['Ben', 1, 'rejected test t1 (rate not stable)'],
    ]);
    expect(status.recent[0].author).toBe('Anna');
  });
});
