import type { ReviewState } from './events';
import { ArchiveError } from './errors';

/**
 * The review rules as pure functions: which state an action leads to, and when it is
 * refused. The archive service calls these before writing anything.
 *
 *   imported --request review--> in-review --sign off--> accepted
 *                                in-review --reject-----> rejected
 *   imported --reject--> rejected
 *   accepted | rejected --reopen (reason)--> in-review
 *   a pick change on an accepted or rejected test reopens it (in-review).
 */

export type ReviewAction = 'request-review' | 'sign-off' | 'reject' | 'reopen' | 'move-pick' | 'comment';

/** Shortest reason accepted for a rejection, reopening or pick change (characters, trimmed). */
export const MINIMUM_REASON_LENGTH = 3;

/** A user name is usable when, trimmed, it has 1-64 characters and no control characters. */
export function normaliseUserName(name: string): string {
  const trimmed = (name ?? '').trim();
  // eslint-disable-next-line no-control-regex
  if (!trimmed || trimmed.length > 64 || /[\u0000-\u001f\u007f]/.test(trimmed)) {
    throw new ArchiveError('bad-user', 'A user name of 1 to 64 printable characters is required.');
  }
  return trimmed;
}

/** The reason, trimmed; throws 'reason-required' when it is missing or too short. */
export function requireReason(reason: string | undefined, what: string): string {
  const trimmed = (reason ?? '').trim();
  if (trimmed.length < MINIMUM_REASON_LENGTH) {
    throw new ArchiveError('reason-required', `A reason of at least ${MINIMUM_REASON_LENGTH} characters is required to ${what}.`);
  }
  return trimmed;
}

/** State after requesting review; only an imported test can be sent for review. */
export function stateAfterReviewRequest(state: ReviewState): ReviewState {
  if (state !== 'imported') {
    throw new ArchiveError('bad-state', `Only an imported test can be sent for review (this one is ${state}).`);
  }
  return 'in-review';
}

/**
 * State after a sign-off, applying the four-eyes rule: the person who signs off must not
 * be the one who last set the picks (or, with no manual pick, who imported the test).
 *
 * @param state current review state; must be 'in-review'
 * @param user who signs off
 * @param lastPickAuthor who last changed the picks, or the importer
 */
export function stateAfterSignOff(state: ReviewState, user: string, lastPickAuthor: string | null): ReviewState {
  if (state !== 'in-review') {
    throw new ArchiveError('bad-state', `Only a test in review can be signed off (this one is ${state}).`);
  }
  if (lastPickAuthor !== null && sameUser(user, lastPickAuthor)) {
    throw new ArchiveError('four-eyes', `${user} set the picks of this test last; a second engineer must sign it off.`);
  }
  return 'accepted';
}

/** State after a rejection: from imported or in-review, with a reason. */
export function stateAfterRejection(state: ReviewState, reason: string | undefined): { state: ReviewState; reason: string } {
  const kept = requireReason(reason, 'reject a test');
  if (state !== 'imported' && state !== 'in-review') {
    throw new ArchiveError('bad-state', `Only an imported test or one in review can be rejected (this one is ${state}); reopen it first.`);
  }
  return { state: 'rejected', reason: kept };
}

/** State after reopening: from accepted or rejected, with a reason. */
export function stateAfterReopen(state: ReviewState, reason: string | undefined): { state: ReviewState; reason: string } {
  const kept = requireReason(reason, 'reopen a review');
  if (state !== 'accepted' && state !== 'rejected') {
    throw new ArchiveError('bad-state', `Only an accepted or rejected test can be reopened (this one is ${state}).`);
  }
  return { state: 'in-review', reason: kept };
}

/**
 * What a pick change does to the review: accepted picks are frozen, so changing them
 * reopens the review; a rejected test is reopened the same way. Other states stay.
 */
export function stateAfterPickChange(state: ReviewState): { state: ReviewState; reopens: boolean } {
  if (state === 'accepted' || state === 'rejected') return { state: 'in-review', reopens: true };
  return { state, reopens: false };
}

/** Whether two user names are the same person (case and surrounding space ignored). */
export function sameUser(a: string, b: string): boolean {
  return a.trim().toLocaleLowerCase() === b.trim().toLocaleLowerCase();
}
