import type { AnalysisResult, Grade, Pick, PickKind } from '../engine/result';
import type { TestMetadata, TestType } from '../engine/record';
import type { ArchiveEvent, ReviewState } from './events';

/**
 * What the app asks of the archive. The Dexie implementation lives in this folder;
 * screens use only this interface so they can be tested against an in-memory one.
 * All numbers SI.
 */

export interface FieldRow { id: string; name: string }
export interface WellRow {
  id: string; fieldId: string; name: string; location?: string;
  rigFloorElevation?: number; waterDepth?: number;
  survey?: { md: number; inc: number; azi: number }[];
}

/** One row of the archive list: everything the list shows, no samples. */
export interface TestSummary {
  id: string;
  fieldId: string; fieldName: string;
  wellId: string; wellName: string;
  type: TestType; typeInferred: boolean;
  depthTvd: number | null; depthMd: number | null;
  /** Shmin estimate or bound, Pa. */
  shmin: number | null;
  shminKind: 'estimate' | 'lower-bound' | 'upper-bound' | null;
  grade: Grade;
  state: ReviewState;
  /** Who signed off or rejected, when accepted or rejected. */
  reviewer: string | null;
  /** Last user who changed picks (or the importer). */
  lastPickAuthor: string | null;
  fileName: string; fileHash: string;
  importedAt: string; importedBy: string;
  contractor?: string;
}

export interface StoredSamples {
  time: Float64Array; pressure: Float64Array; rate: Float64Array; volume: Float64Array;
}

export interface TestDetail {
  summary: TestSummary;
  metadata: TestMetadata;
  samples: StoredSamples;
  /** Analysis with manual picks applied. */
  analysis: AnalysisResult;
  /** Manual picks in force: cycle -> kind -> pick. */
  manualPicks: { cycle: number; kind: PickKind; pick: Pick | null; reason: string; author: string; time: string }[];
  log: ArchiveEvent[];
}

export interface ImportOutcome {
  fileName: string;
  status: 'imported' | 'duplicate' | 'failed';
  testId?: string;
  /** For duplicates: the test that already holds this file. */
  existingTestId?: string;
  error?: { code: string; message: string; line?: number; column?: number };
}

export interface ArchiveQuery {
  fieldId?: string; wellSearch?: string; type?: TestType; grade?: Grade; state?: ReviewState;
  sortBy?: keyof TestSummary; descending?: boolean;
}
