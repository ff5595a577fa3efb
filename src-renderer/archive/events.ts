import type { Grade, Pick, PickKind } from '../engine/result';
import type { TestMetadata, TestType } from '../engine/record';

/**
 * The review log: every change to the archive is an immutable event. Tables are
 * derived from events; the team journal (one file per user and device) carries
 * exactly these events between machines.
 */

/** Review states, in plain words. */
export type ReviewState = 'imported' | 'in-review' | 'accepted' | 'rejected';

export interface EventEnvelope {
  /** Globally unique id (device id + counter, or a random UUID). */
  id: string;
  /** User name as chosen at start. */
  author: string;
  /** Device id, stable per installation. */
  device: string;
  /** Wall-clock time, ISO 8601 UTC. */
  time: string;
  /** Lamport clock: max(seen) + 1 at creation. */
  clock: number;
  /** SHA-256 (hex) of the previous event in the same journal; '' for the first. */
  prev: string;
  /**
   * Position in its own journal, 1-based (added for the team journal; see
   * archive/journal/causality.ts). Absent on events written before journals existed.
   */
  seq?: number;
  /**
   * Causal history: for every other journal (`author@device`), the highest `seq` of that
   * journal this device had seen when the event was made. An event B saw event A iff
   * A is earlier in B's own journal or `B.seen[journal(A)] >= A.seq`. Absent on events made
   * before team journals existed (their order is then the Lamport clock's).
   */
  seen?: Record<string, number>;
}

export type ArchiveEventBody =
  | { kind: 'field-created'; fieldId: string; name: string }
  | { kind: 'well-created'; wellId: string; fieldId: string; name: string; location?: string; rigFloorElevation?: number; waterDepth?: number }
  | { kind: 'survey-set'; wellId: string; stations: { md: number; inc: number; azi: number }[]; sourceFile?: string }
  | {
      kind: 'test-imported';
      testId: string;
      wellId: string;
      type: TestType;
      typeInferred: boolean;
      metadata: TestMetadata;
      /** SHA-256 of the raw file; raw bytes stored once by hash. */
      fileHash: string;
      fileName: string;
      layout: string;
      /**
       * Options the file was read with (e.g. column roles the user confirmed), so another
       * machine reads the raw file the same way (added with the team journal).
       */
      parseOptions?: Record<string, unknown>;
    }
  | { kind: 'pick-moved'; testId: string; cycle: number; pickKind: PickKind; pick: Pick | null; reason: string }
  | { kind: 'picks-reset'; testId: string; reason: string }
  | { kind: 'limits-changed'; scope: 'project' | { testId: string }; limits: Record<string, number>; reason: string }
  | { kind: 'review-requested'; testId: string; note?: string }
  | { kind: 'signed-off'; testId: string; note?: string; grade: Grade; picksVersion: string }
  | { kind: 'rejected'; testId: string; reason: string }
  | { kind: 'review-reopened'; testId: string; reason: string }
  | { kind: 'comment'; testId: string; text: string }
  | { kind: 'test-deleted'; testId: string; reason: string }
  /**
   * A person's decision on a conflict found by the merge (archive/journal/conflicts.ts):
   * `keep` is the id of the event whose outcome stands.
   */
  | { kind: 'conflict-resolved'; conflictId: string; testId: string; keep: string; reason: string };

export type ArchiveEvent = EventEnvelope & { body: ArchiveEventBody };
