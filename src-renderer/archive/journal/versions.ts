import type { ArchiveEvent } from '../events';
import type { PickKind } from '../../engine/result';
import type { ConflictKind } from './derived-types';
import { sha256OfText } from './sha256';

/** Names that every machine computes alike: picks versions, conflict ids, pick keys. */

/**
 * The SHA-256 that names a set of pick events: hex of the sorted ids joined by newlines.
 * A sign-off carries this for the pick events its author had seen.
 * @example picksVersionOf([]) // 'e3b0c442...b855' (the hash of nothing)
 */
export function picksVersionOf(eventIds: readonly string[]): string {
  return sha256OfText([...eventIds].sort().join('\n'));
}

/**
 * The picks version a sign-off of `testId` must carry, from the events this archive
 * holds (which, on the signer's machine, are exactly what the signer has seen): the
 * `picksVersionOf` the ids of every pick move, picks reset and conflict decision about
 * the test. Equal to `deriveArchiveState(events).tests[testId].picksVersion`.
 * @example picksVersionForTest(await archive.eventsForTest('t1'), 't1')
 */
export function picksVersionForTest(events: readonly ArchiveEvent[], testId: string): string {
  const ids = new Set<string>();
  for (const e of events) {
    const b = e.body;
    if ((b.kind === 'pick-moved' || b.kind === 'picks-reset' || b.kind === 'conflict-resolved') && b.testId === testId) ids.add(e.id);
  }
  return picksVersionOf([...ids]);
}

/** A conflict id from its kind and the events involved: the same on every machine. */
export function conflictIdOf(kind: ConflictKind, eventIds: readonly string[]): string {
  return `${kind}:${sha256OfText([...eventIds].sort().join('\n')).slice(0, 24)}`;
}

/**
 * `keep` value of a decision on a sign-off conflict that lets none of its events stand:
 * the sign-off is void and the test stays in review.
 */
export const NO_EVENT = 'none';

/** Key of a pick slot in `DerivedTest.picks`. */
export function pickSlotKey(cycle: number, kind: PickKind): string {
  return `${cycle}:${kind}`;
}

