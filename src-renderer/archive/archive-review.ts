import type { TestDetail, TestSummary } from './api';
import { nowIso, writeTransaction, type ArchiveContext } from './archive-context';
import {
  analysisOptions, foldPicks, gradeRow, manualPicksInForce, recordOf, requireTest, summaryFromAnalysis,
} from './archive-analysis';
import { appendEvent, eventsForTest, localJournals, ownJournalKey } from './archive-events';
import { getSettings } from './archive-settings';
import type { StoredTest } from './db';
import { ArchiveError } from './errors';
import type { ArchiveEventBody } from './events';
import { picksVersionForTest } from './journal/derive';
import {
  normaliseUserName, requireReason, stateAfterPickChange, stateAfterRejection, stateAfterReopen,
  stateAfterReviewRequest, stateAfterSignOff,
} from './review-rules';
import { eventsSeenWith, seenVectorOf, type ManualPick } from './team-rebuild';
import { toSummary } from './query';
import { PICK_KINDS, type Pick as EnginePick, type PickKind } from '../engine/result';

/**
 * Picks and review: moving or resetting manual picks (re-analysed before the write, a
 * frozen review reopened), and the review state changes with four eyes, whose rules are
 * the pure functions of review-rules.ts. Each change is one transaction with its events.
 */

/** Set (pick) or remove (null) a manual pick; reopens an accepted or rejected test. */
export async function movePick(
  context: ArchiveContext, testId: string, cycle: number, kind: PickKind, pick: EnginePick | null, reason: string, user: string,
): Promise<TestDetail> {
  const author = normaliseUserName(user);
  const why = requireReason(reason, 'change a pick');
  if (!Number.isInteger(cycle) || cycle < 1) throw new ArchiveError('bad-argument', 'The cycle number must be a whole number from 1.');
  if (!PICK_KINDS.includes(kind)) throw new ArchiveError('bad-argument', `Unknown pick kind "${kind}".`);
  if (pick && (![pick.pressure, pick.time].every(Number.isFinite) || !Number.isInteger(pick.sampleIndex) || pick.sampleIndex < 0)) {
    throw new ArchiveError('bad-argument', 'A pick needs a finite pressure (Pa), time (s) and a sample index.');
  }
  const stored: EnginePick | null = pick ? { ...pick, kind, manual: true, reason: why } : null;
  return changePicks(context, testId, author, why, (current) => [
    ...current.filter((p) => !(p.cycle === cycle && p.kind === kind)),
    { cycle, kind, pick: stored, reason: why, author, time: nowIso(context) },
  ], async (eventId, time) => {
    await context.db.picks.add({ testId, cycle, kind, pick: stored, reason: why, author, time, eventId });
  }, { kind: 'pick-moved', testId, cycle, pickKind: kind, pick: stored, reason: why });
}

/** Drop every manual pick of a test; reopens an accepted or rejected test. */
export async function resetPicks(context: ArchiveContext, testId: string, reason: string, user: string): Promise<TestDetail> {
  const author = normaliseUserName(user);
  const why = requireReason(reason, 'reset the picks');
  return changePicks(context, testId, author, why, () => [], async (eventId, time) => {
    await context.db.picks.add({ testId, cycle: 0, kind: 'reset', pick: null, reason: why, author, time, eventId });
  }, { kind: 'picks-reset', testId, reason: why });
}

/**
 * Analyse with the next manual picks, then in one transaction: refuse when the picks
 * changed meanwhile, reopen a frozen review, log `body`, store the pick row, update the
 * summary and grade.
 */
async function changePicks(
  context: ArchiveContext, testId: string, author: string, why: string,
  next: (current: ManualPick[]) => ManualPick[],
  store: (eventId: string, time: string) => Promise<void>,
  body: ArchiveEventBody,
): Promise<TestDetail> {
  const { db } = context;
  const test = await requireTest(context, testId);
  const samples = await db.samples.get(testId);
  if (!samples) throw new ArchiveError('not-found', `The samples of test ${testId} are missing.`);
  const pickRows = await db.picks.where('testId').equals(testId).sortBy('seq');
  const lastSeq = pickRows.length ? pickRows[pickRows.length - 1].seq : undefined;
  const manualPicks = next(foldPicks(pickRows));
  const limits = (await getSettings(context)).limits;
  const analysis = await context.engine.analyse(recordOf(test, samples), analysisOptions(test, limits, manualPicks));
  const updated = await writeTransaction(context, async (touch) => {
    const current = await requireTest(context, testId);
    const rows = await db.picks.where('testId').equals(testId).sortBy('seq');
    if ((rows.length ? rows[rows.length - 1].seq : undefined) !== lastSeq) {
      throw new ArchiveError('bad-state', 'The picks of this test changed meanwhile; open it again and retry.');
    }
    const review = stateAfterPickChange(current.state);
    if (review.reopens) await appendEvent(context, author, { kind: 'review-reopened', testId, reason: `Picks changed: ${why}` });
    const event = await appendEvent(context, author, body);
    await store(event.id, event.time);
    const row: StoredTest = {
      ...current, ...summaryFromAnalysis(analysis), state: review.state, lastPickAuthor: author,
      reviewer: review.reopens ? null : current.reviewer,
    };
    await db.tests.put(row);
    touch(row);
    await db.grades.put(gradeRow(testId, analysis, limits, event.time));
    return row;
  });
  return {
    summary: toSummary(updated), metadata: updated.metadata,
    samples: { time: samples.time, pressure: samples.pressure, rate: samples.rate, volume: samples.volume },
    analysis, manualPicks: await manualPicksInForce(context, testId), log: await eventsForTest(context, testId),
  };
}

export async function requestReview(context: ArchiveContext, testId: string, user: string, note?: string): Promise<TestSummary> {
  const author = normaliseUserName(user);
  return changeReview(context, testId, async (test) => {
    const state = stateAfterReviewRequest(test.state);
    await appendEvent(context, author, { kind: 'review-requested', testId, note: note?.trim() || undefined });
    return { state };
  });
}

/** Accept a test in review; four eyes against who last changed the picks (or imported it). */
export async function signOff(context: ArchiveContext, testId: string, user: string, note?: string): Promise<TestSummary> {
  const author = normaliseUserName(user);
  return changeReview(context, testId, async (test) => {
    const state = stateAfterSignOff(test.state, author, test.lastPickAuthor ?? test.importedBy);
    // The journal's definition (journal/versions.ts), over the events this sign-off sees.
    const journal = ownJournalKey(context, author);
    const seen = seenVectorOf(await localJournals(context), journal);
    const picksVersion = picksVersionForTest(eventsSeenWith(await eventsForTest(context, testId), journal, seen), testId);
    await appendEvent(context, author, { kind: 'signed-off', testId, note: note?.trim() || undefined, grade: test.grade, picksVersion });
    return { state, reviewer: author };
  });
}

export async function reject(context: ArchiveContext, testId: string, user: string, reason: string): Promise<TestSummary> {
  const author = normaliseUserName(user);
  return changeReview(context, testId, async (test) => {
    const next = stateAfterRejection(test.state, reason);
    await appendEvent(context, author, { kind: 'rejected', testId, reason: next.reason });
    return { state: next.state, reviewer: author };
  });
}

export async function reopen(context: ArchiveContext, testId: string, user: string, reason: string): Promise<TestSummary> {
  const author = normaliseUserName(user);
  return changeReview(context, testId, async (test) => {
    const next = stateAfterReopen(test.state, reason);
    await appendEvent(context, author, { kind: 'review-reopened', testId, reason: next.reason });
    return { state: next.state, reviewer: null };
  });
}

export async function comment(context: ArchiveContext, testId: string, user: string, text: string): Promise<void> {
  const author = normaliseUserName(user);
  const body = (text ?? '').trim();
  if (!body) throw new ArchiveError('bad-argument', 'A comment needs some text.');
  await writeTransaction(context, async () => {
    await requireTest(context, testId);
    await appendEvent(context, author, { kind: 'comment', testId, text: body });
  });
}

/** One review change in one transaction: `apply` logs its event and returns the row's new review fields. */
function changeReview(context: ArchiveContext, testId: string, apply: (test: StoredTest) => Promise<Partial<StoredTest>>): Promise<TestSummary> {
  return writeTransaction(context, async (touch) => {
    const test = await requireTest(context, testId);
    const row = { ...test, ...(await apply(test)) };
    await context.db.tests.put(row);
    touch(row);
    return toSummary(row);
  });
}
