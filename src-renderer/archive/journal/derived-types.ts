import type { Grade, Pick, PickKind } from '../../engine/result';
import type { TestMetadata, TestType } from '../../engine/record';
import type { ArchiveEventBody, ReviewState } from '../events';

/** The archive as derived from the review log (journal/derive.ts). All numbers SI. */

export interface DerivedField { id: string; name: string; createdBy: string; createdAt: string }

export interface DerivedWell {
  id: string; fieldId: string; name: string; location?: string;
  rigFloorElevation?: number; waterDepth?: number;
  survey?: { md: number; inc: number; azi: number }[];
  surveySourceFile?: string;
  createdBy: string; createdAt: string;
}

/** One change of a pick, kept forever. */
export interface PickChange {
  eventId: string;
  author: string;
  time: string;
  /** moved: set by hand; reset: back to the automatic pick; resolution: a conflict decision; restored: back to the signed version. */
  source: 'moved' | 'reset' | 'resolution' | 'restored';
  /** false: the automatic pick applies. */
  manual: boolean;
  pick: Pick | null;
  reason: string;
}

/** The pick in force for one test, cycle and kind, with its history. */
export interface DerivedPick {
  cycle: number;
  kind: PickKind;
  /** false: the automatic pick applies (after a reset). */
  manual: boolean;
  /** The hand-set pick (null: the engineer removed the pick). Meaningful when `manual`. */
  pick: Pick | null;
  reason: string;
  author: string;
  time: string;
  eventId: string;
  /** True while an unresolved conflict involves this pick. */
  conflicted: boolean;
  history: PickChange[];
}

export interface DerivedComment { eventId: string; author: string; time: string; text: string }

/** One line of a test's review log. */
export interface ReviewLogEntry {
  eventId: string; author: string; device: string; time: string;
  kind: ArchiveEventBody['kind'] | 'reopened-by-change';
  /** Plain words: reason, note or what happened. */
  note: string;
}

export interface DerivedTest {
  id: string; wellId: string;
  type: TestType; typeInferred: boolean;
  metadata: TestMetadata;
  fileHash: string; fileName: string; layout: string;
  importedBy: string; importedAt: string; importEventId: string;
  state: ReviewState;
  /** Who signed off (accepted) or rejected; null otherwise. */
  reviewer: string | null;
  /** Grade the reviewer signed off with; null unless accepted. */
  signedGrade: Grade | null;
  /** The sign-off in force; null unless accepted. */
  signOffEventId: string | null;
  rejectionReason: string | null;
  /** Last user who changed picks (the importer until someone does). */
  lastPickAuthor: string;
  /** Manual picks by `${cycle}:${kind}`. */
  picks: Record<string, DerivedPick>;
  /** Per-test limits overriding the project's. */
  limits: Record<string, number>;
  comments: DerivedComment[];
  log: ReviewLogEntry[];
  /** SHA-256 over the ids of every event that set this test's picks: what a sign-off must carry. */
  picksVersion: string;
  /** Ids of unresolved conflicts on this test. */
  openConflicts: string[];
  deleted: boolean;
  deletedReason: string | null;
}

export type ConflictKind =
  /** Two people changed the same pick without seeing each other's change. */
  | 'concurrent-pick-moves'
  /** A sign-off and a change to what it signs, neither made knowing of the other. */
  | 'sign-off-concurrent-change'
  /** A sign-off that carries a picks version this archive cannot reproduce (it saw picks this archive does not have, or different ones). */
  | 'stale-sign-off'
  /** A sign-off and a rejection of the same test, neither made knowing of the other. */
  | 'concurrent-review-decisions';

export interface ConflictResolution { eventId: string; author: string; time: string; keep: string; reason: string }

/** A disagreement the merge will not settle by itself: shown to users for a decision. */
export interface Conflict {
  /** Stable on every machine: derived from the ids of the events involved. */
  id: string;
  kind: ConflictKind;
  testId: string;
  /** The events involved (the decision keeps one of them). */
  eventIds: string[];
  authors: string[];
  /** The pick involved, for pick conflicts. */
  slot?: { cycle: number; kind: PickKind };
  message: string;
  resolution: ConflictResolution | null;
}

export type FindingKind =
  | 'self-sign-off'       // four eyes: the signer also set the picks it signs
  | 'unknown-test'        // event about a test this archive does not have
  | 'after-delete'        // event about a deleted test
  | 'duplicate-test-id'   // a second import under an existing test id
  | 'same-file-twice'     // the same raw file imported as two tests
  | 'unknown-conflict'    // a decision on a conflict this archive does not see
  | 'bad-resolution';     // a decision keeping an event not in the conflict

/** Something a user should see that is not a conflict to decide. */
export interface Finding { kind: FindingKind; eventId: string; author: string; testId?: string; message: string }

export interface JournalActivity { journal: string; author: string; device: string; events: number; lastSeq: number; lastTime: string; lastKind: string }

export interface LimitsChange { eventId: string; author: string; time: string; scope: 'project' | { testId: string }; limits: Record<string, number>; reason: string }

export interface DerivedState {
  fields: Record<string, DerivedField>;
  wells: Record<string, DerivedWell>;
  tests: Record<string, DerivedTest>;
  projectLimits: Record<string, number>;
  limitsLog: LimitsChange[];
  conflicts: Record<string, Conflict>;
  findings: Finding[];
  /** Who changed what: per journal, how many events and the last one. */
  journals: Record<string, JournalActivity>;
  eventCount: number;
}
