import { describe, expect, it } from 'vitest';
import {
  normaliseUserName, requireReason, sameUser, stateAfterPickChange, stateAfterRejection, stateAfterReopen,
  stateAfterReviewRequest, stateAfterSignOff,
} from '../../src-renderer/archive/review-rules';
import { ArchiveError } from '../../src-renderer/archive/errors';

// The rules checked here are the product's review policy (DESIGN.md "Review": a test is
// accepted only when a second person signs off, reasons kept for every rejection, accepted
// picks frozen and changing them reopens the review); four-eyes sign-off is common practice.

function codeOf(fn: () => unknown): string | undefined {
  try { fn(); } catch (e) { return e instanceof ArchiveError ? e.code : 'other'; }
  return undefined;
}

describe('review-rules', () => {
  it('should send only an imported test for review', () => {
    expect(stateAfterReviewRequest('imported')).toBe('in-review');
    expect(codeOf(() => stateAfterReviewRequest('accepted'))).toBe('bad-state');
  });

  it('should refuse a sign-off by the engineer who last set the picks', () => {
    expect(codeOf(() => stateAfterSignOff('in-review', 'Ana Petrov', 'ana petrov '))).toBe('four-eyes');
    expect(stateAfterSignOff('in-review', 'Ben Osei', 'Ana Petrov')).toBe('accepted');
  });

  it('should refuse a sign-off of a test that is not in review', () => {
    expect(codeOf(() => stateAfterSignOff('imported', 'Ben Osei', 'Ana Petrov'))).toBe('bad-state');
    expect(codeOf(() => stateAfterSignOff('accepted', 'Ben Osei', 'Ana Petrov'))).toBe('bad-state');
  });

  it('should require a reason to reject and keep it trimmed', () => {
    expect(codeOf(() => stateAfterRejection('in-review', ''))).toBe('reason-required');
    expect(codeOf(() => stateAfterRejection('in-review', '  a '))).toBe('reason-required');
    expect(stateAfterRejection('imported', '  gauge saturated at peak ')).toEqual({ state: 'rejected', reason: 'gauge saturated at peak' });
    expect(codeOf(() => stateAfterRejection('accepted', 'late finding'))).toBe('bad-state');
  });

  it('should reopen only accepted or rejected tests, with a reason', () => {
    expect(stateAfterReopen('accepted', 'new mud density').state).toBe('in-review');
    expect(stateAfterReopen('rejected', 'gauge recalibrated').state).toBe('in-review');
    expect(codeOf(() => stateAfterReopen('accepted', ''))).toBe('reason-required');
    expect(codeOf(() => stateAfterReopen('in-review', 'why not'))).toBe('bad-state');
  });

  it('should reopen the review when picks of an accepted test change', () => {
    expect(stateAfterPickChange('accepted')).toEqual({ state: 'in-review', reopens: true });
    expect(stateAfterPickChange('rejected')).toEqual({ state: 'in-review', reopens: true });
    expect(stateAfterPickChange('imported')).toEqual({ state: 'imported', reopens: false });
    expect(stateAfterPickChange('in-review')).toEqual({ state: 'in-review', reopens: false });
  });

  it('should accept printable user names and refuse empty or control characters', () => {
    expect(normaliseUserName('  Ana Petrov ')).toBe('Ana Petrov');
    expect(codeOf(() => normaliseUserName('   '))).toBe('bad-user');
    expect(codeOf(() => normaliseUserName('a\u0007b'))).toBe('bad-user');
    expect(codeOf(() => normaliseUserName('x'.repeat(65)))).toBe('bad-user');
    expect(sameUser('Ana', ' ana')).toBe(true);
    expect(requireReason(' ok then ', 'x')).toBe('ok then');
  });
});
