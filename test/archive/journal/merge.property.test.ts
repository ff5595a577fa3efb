import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ArchiveEvent } from '../../../src-renderer/archive/events';
import type { PickKind } from '../../../src-renderer/engine/result';
import { compareEventOrder, happenedBefore, journalKeyOf } from '../../../src-renderer/archive/journal/causality';
import { canonicalJson } from '../../../src-renderer/archive/journal/canonical';
import { conflictIdOf, deriveArchiveState, NO_EVENT, pickSlotKey, picksVersionForTest } from '../../../src-renderer/archive/journal/derive';
import { mergeEventSets, readJournalSet } from '../../../src-renderer/archive/journal/merge';
import { exportBundle, importBundle, journalTextsFromEvents } from '../../../src-renderer/archive/journal/bundle';
import { movePick, setUpField, Team, type Person } from './team-fixture';

/**
 * Property tests: random team histories (three people, one of them on two devices,
 * making changes and exchanging what they hold at random), then every way of putting the
 * journals back together. The oracle for "who had seen what" is the simulation's own
 * record of each person's holdings, independent of the causal fields under test.
 */

const KINDS: PickKind[] = ['closure', 'isip'];
const TESTS = ['t1', 't2'];

const actionArb = fc.oneof(
  { weight: 5, arbitrary: fc.record({ type: fc.constant('move' as const), who: fc.nat(3), test: fc.nat(1), cycle: fc.integer({ min: 1, max: 2 }), kind: fc.nat(1), value: fc.nat(2) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('reset' as const), who: fc.nat(3), test: fc.nat(1) }) },
  { weight: 2, arbitrary: fc.record({ type: fc.constant('sign' as const), who: fc.nat(3), test: fc.nat(1) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('reject' as const), who: fc.nat(3), test: fc.nat(1) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('comment' as const), who: fc.nat(3), test: fc.nat(1) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('limits' as const), who: fc.nat(3), test: fc.nat(1) }) },
  { weight: 4, arbitrary: fc.record({ type: fc.constant('sync' as const), who: fc.nat(3), from: fc.nat(3) }) },
  { weight: 3, arbitrary: fc.record({ type: fc.constant('resolve' as const), who: fc.nat(3), pick: fc.nat(9) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('reopen' as const), who: fc.nat(3), test: fc.nat(1) }) },
);

type Action = typeof actionArb extends fc.Arbitrary<infer A> ? A : never;

function simulate(actions: Action[]) {
  const team = new Team();
  const people: Person[] = [team.person('Anna', 'laptop-7'), team.person('Ben', 'desk-2'), team.person('Carl', 'rig-office'), team.person('Anna', 'desk-9')];
  setUpField(people[0], TESTS);
  for (const p of people.slice(1)) p.receiveFrom(people[0]);
  for (const a of actions) {
    const p = people[a.who];
    switch (a.type) {
      case 'move': movePick(p, TESTS[a.test], a.cycle, KINDS[a.kind], 30e6 + a.value * 0.5e6); break;
      case 'reset': p.make({ kind: 'picks-reset', testId: TESTS[a.test], reason: 'start again' }); break;
      case 'sign': p.signOff(TESTS[a.test]); break;
      case 'reject': p.make({ kind: 'rejected', testId: TESTS[a.test], reason: 'leak-off not visible' }); break;
      case 'comment': p.make({ kind: 'comment', testId: TESTS[a.test], text: 'checked' }); break;
      case 'limits': p.make({ kind: 'limits-changed', scope: { testId: TESTS[a.test] }, limits: { minLoadingR2: 0.97 }, reason: 'noisy' }); break;
      case 'sync': if (a.from !== a.who) p.receiveFrom(people[a.from]); break;
      case 'reopen': p.make({ kind: 'review-reopened', testId: TESTS[a.test], reason: 'second look' }); break;
      case 'resolve': {
        // Decide one of the open conflicts this person can see, keeping one of its events (or none, for sign-off conflicts).
        const open = Object.values(p.view().conflicts).filter((c) => !c.resolution);
        if (open.length === 0) break;
        const c = open[a.pick % open.length];
        const choices = c.kind === 'concurrent-pick-moves' ? c.eventIds : [...c.eventIds, NO_EVENT];
        p.make({ kind: 'conflict-resolved', conflictId: c.id, testId: c.testId, keep: choices[a.pick % choices.length], reason: 'decided after a call' });
        break;
      }
    }
  }
  return { team, people };
}

/** Small seeded generator (mulberry32) so shuffles shrink with fast-check's seed. */
function random(seed: number): () => number {
  let t = seed >>> 0;
  return () => {
    t = (t + 0x6d2b79f5) >>> 0;
    let r = Math.imul(t ^ (t >>> 15), 1 | t);
    r = (r + Math.imul(r ^ (r >>> 7), 61 | r)) ^ r;
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296;
  };
}

function shuffled<T>(items: readonly T[], next: () => number): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(next() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

const historyArb = fc.array(actionArb, { minLength: 1, maxLength: 60, size: 'medium' });
const RUNS = { numRuns: 120 };

describe('journal merge (properties)', () => {
  it('should derive the same archive from any order and any repetition of the events', () => {
    fc.assert(fc.property(historyArb, fc.integer(), (actions, seed) => {
      const { team } = simulate(actions);
      const reference = deriveArchiveState(team.all);
      const next = random(seed);
      const withRepeats = [...team.all, ...team.all.filter(() => next() < 0.3)];
      const state = deriveArchiveState(shuffled(withRepeats, next));
      expect(canonicalJson(state)).toBe(canonicalJson(reference));
      expect(state.eventCount).toBe(team.all.length);
    }), RUNS);
  });

  it('should merge journals in any grouping, order and overlap to the same events, losing none', () => {
    fc.assert(fc.property(historyArb, fc.integer(), (actions, seed) => {
      const { team, people } = simulate(actions);
      const next = random(seed);
      // Each person's holdings are one partial, overlapping view; merge them in a random order and grouping.
      const views = shuffled(people.map((p) => [...p.holds.values()]), next);
      views.push(people.flatMap((p) => p.own));
      const left = mergeEventSets(views[0], ...views.slice(1, 2));
      const right = mergeEventSets([], ...views.slice(2));
      const all = mergeEventSets(left.events, right.events);
      expect(all.collisions).toEqual([]);
      expect(all.events.map((e) => e.id).sort()).toEqual(team.all.map((e) => e.id).sort());
      expect(canonicalJson(deriveArchiveState(all.events))).toBe(canonicalJson(deriveArchiveState(team.all)));
      // Merging again adds nothing (idempotent).
      expect(mergeEventSets(all.events, ...views).added).toEqual([]);
    }), RUNS);
  });

  it('should read back the same events from journal files and from a bundle, in any file order', () => {
    fc.assert(fc.property(historyArb, fc.integer(), (actions, seed) => {
      const { team } = simulate(actions);
      const texts = shuffled(journalTextsFromEvents(shuffled(team.all, random(seed))), random(seed + 1));
      const read = readJournalSet(texts);
      expect(read.issues).toEqual([]);
      expect(read.events).toEqual([...team.all].sort(compareEventOrder));
      const bundle = exportBundle({ journals: texts, raw: [], createdBy: 'Anna', createdAt: '2026-11-02T08:00:00.000Z' });
      expect(importBundle(bundle, 'team.slbundle').read.events).toEqual(read.events);
    }), { numRuns: 60 });
  });

  it('should agree with the record of who had seen what, and keep the clock consistent with it', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { team } = simulate(actions);
      for (const a of team.all) {
        for (const b of team.all) {
          expect(happenedBefore(a, b)).toBe(team.before(a, b));
          if (team.before(a, b)) expect(a.clock).toBeLessThan(b.clock);
        }
      }
    }), { numRuns: 60 });
  });

  it('should report only real concurrent pick changes, and leave no disagreement at the end unreported', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { team } = simulate(actions);
      const state = deriveArchiveState(team.all);
      const byId = new Map(team.all.map((e) => [e.id, e]));
      for (const c of Object.values(state.conflicts)) {
        const events = c.eventIds.map((id) => byId.get(id)!);
        // Soundness: the events of a conflict never saw one another.
        if (events.length === 2) expect(team.before(events[0], events[1]) || team.before(events[1], events[0])).toBe(false);
      }
      // Completeness: where the latest changes of a pick (none seen by another) disagree, the pick is marked conflicted.
      for (const testId of TESTS) {
        const test = state.tests[testId];
        for (const [key, slot] of Object.entries(test.picks)) {
          const changes = team.all.filter((e) => (e.body.kind === 'pick-moved' && e.body.testId === testId && pickSlotKey(e.body.cycle, e.body.pickKind) === key)
            || (e.body.kind === 'picks-reset' && e.body.testId === testId && slot.history.some((h) => h.eventId === e.id)));
          const latest = changes.filter((x) => !changes.some((y) => team.before(x, y)));
          const outcomes = new Set(latest.map((e) => (e.body.kind === 'pick-moved' ? canonicalJson(e.body.pick) : 'automatic')));
          const decided = team.all.some((e) => e.body.kind === 'conflict-resolved' && e.body.testId === testId);
          if (outcomes.size > 1 && !decided) expect(slot.conflicted).toBe(true);
        }
      }
    }), RUNS);
  });

  it('should accept a test only on a sign-off by someone other than the last pick author it saw, with no open conflict on it', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { team } = simulate(actions);
      const state = deriveArchiveState(team.all);
      const byId = new Map(team.all.map((e) => [e.id, e]));
      for (const test of Object.values(state.tests)) {
        if (test.state !== 'accepted') continue;
        const signOff = byId.get(test.signOffEventId!)!;
        const seenPicks = team.all
          .filter((e) => (e.body.kind === 'pick-moved' || e.body.kind === 'picks-reset') && 'testId' in e.body && e.body.testId === test.id && team.before(e, signOff))
          .sort(compareEventOrder);
        const lastAuthor = seenPicks.length ? seenPicks[seenPicks.length - 1].author : test.importedBy;
        expect(signOff.author).not.toBe(lastAuthor);
        expect(test.reviewer).toBe(signOff.author);
        expect(Object.values(state.conflicts).filter((c) => c.eventIds.includes(signOff.id) && !c.resolution)).toEqual([]);
      }
    }), RUNS);
  });

  it('should keep every event of every journal: each appears in the activity counts', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { team } = simulate(actions);
      const state = deriveArchiveState(team.all);
      const perJournal = new Map<string, number>();
      for (const e of team.all) perJournal.set(journalKeyOf(e), (perJournal.get(journalKeyOf(e)) ?? 0) + 1);
      for (const [key, n] of perJournal) expect(state.journals[key].events).toBe(n);
      const testEvents = team.all.filter((e: ArchiveEvent) => 'testId' in e.body && e.body.kind !== 'test-imported' && e.body.kind !== 'comment');
      const logged = new Set(Object.values(state.tests).flatMap((t) => t.log.map((l) => l.eventId)));
      for (const e of testEvents) expect(logged.has(e.id)).toBe(true);
    }), RUNS);
  });

  it('should never lose a conflict a machine has seen when more events arrive, so every decision finds its conflict', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { team, people } = simulate(actions);
      const full = deriveArchiveState(team.all);
      for (const p of people) {
        for (const c of Object.values(p.view().conflicts)) {
          if (c.kind !== 'stale-sign-off') expect(full.conflicts[c.id]?.eventIds).toEqual(c.eventIds);
        }
      }
      expect(full.findings.filter((f) => f.kind === 'unknown-conflict' || f.kind === 'bad-resolution')).toEqual([]);
    }), RUNS);
  });

  it('should find the same conflicts with and without dropping events everyone has seen', () => {
    // Long histories on few picks, so the per-pick lists pass the pruning threshold.
    const busy = fc.array(fc.oneof(
      { weight: 6, arbitrary: fc.record({ type: fc.constant('move' as const), who: fc.nat(3), test: fc.constant(0), cycle: fc.constant(1), kind: fc.nat(1), value: fc.nat(2) }) },
      { weight: 2, arbitrary: fc.record({ type: fc.constant('sign' as const), who: fc.nat(3), test: fc.constant(0) }) },
      { weight: 1, arbitrary: fc.record({ type: fc.constant('reset' as const), who: fc.nat(3), test: fc.constant(0) }) },
      { weight: 4, arbitrary: fc.record({ type: fc.constant('sync' as const), who: fc.nat(3), from: fc.nat(3) }) },
    ), { minLength: 40, maxLength: 200 });
    fc.assert(fc.property(busy, (actions) => {
      const { team } = simulate(actions as Action[]);
      const pruned = deriveArchiveState(team.all, { pruneThreshold: 2 });
      const full = deriveArchiveState(team.all, { pruneThreshold: Infinity });
      expect(canonicalJson(pruned)).toBe(canonicalJson(full));
    }), { numRuns: 60 });
  });

  it('should give the same picks version from the raw events as from the derived archive, on every machine', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { people } = simulate(actions);
      for (const p of people) {
        const events = [...p.holds.values()];
        const view = deriveArchiveState(events);
        for (const testId of TESTS) expect(picksVersionForTest(events, testId)).toBe(view.tests[testId].picksVersion);
      }
    }), { numRuns: 60 });
  });

  it('should give the same conflict ids on every machine', () => {
    fc.assert(fc.property(historyArb, (actions) => {
      const { team } = simulate(actions);
      const state = deriveArchiveState(team.all);
      for (const c of Object.values(state.conflicts)) expect(c.id).toBe(conflictIdOf(c.kind, c.eventIds));
    }), RUNS);
  });
});
