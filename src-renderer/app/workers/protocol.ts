import type { AnalysisOptions } from '../../engine/analysis-options';
import type { TestRecord } from '../../engine/record';
import type { AnalysisResult } from '../../engine/result';

/** Messages to the analysis worker. Every request carries an id echoed in its reply. */
export type WorkerRequest =
  | { id: number; op: 'parse'; bytes: Uint8Array; fileName: string; options?: Record<string, unknown> }
  | { id: number; op: 'analyse'; record: TestRecord; options: AnalysisOptions }
  | { id: number; op: 'preview'; bytes: Uint8Array; fileName: string; options?: Record<string, unknown> };

/** An EngineError (or any error) carried across the worker boundary. */
export interface WorkerError {
  name: string;
  code: string;
  message: string;
  location: { file?: string; line?: number; column?: number; sheet?: string; cell?: string };
  expected?: string;
}

export type WorkerReply =
  | { id: number; ok: true; value: unknown }
  | { id: number; ok: false; error: WorkerError };

export type ParseReply = TestRecord;
export type AnalyseReply = AnalysisResult;
