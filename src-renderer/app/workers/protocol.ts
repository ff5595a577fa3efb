import type { AnalysisOptions } from '../../engine/analysis-options';
import type { TestRecord } from '../../engine/record';
import type { ShutInArrays } from './shutInArrays';
import type { AnalysisResult } from '../../engine/result';

/** Messages to the analysis worker. Every request carries an id echoed in its reply. */
export type WorkerRequest =
  | { id: number; op: 'parse'; bytes: Uint8Array; fileName: string; options?: Record<string, unknown> }
  | { id: number; op: 'analyse'; record: TestRecord; options: AnalysisOptions }
  | { id: number; op: 'preview'; bytes: Uint8Array; fileName: string; options?: Record<string, unknown> }
  /**
   * Shut-in diagnostic arrays of one cycle: `time` (s) and `downhole` (Pa) are the cycle's
   * shut-in samples only (element 0 at the pump stop), `pumpingTime` its pumping duration (s).
   */
  | { id: number; op: 'shut-in-diagnostics'; cycle: number; time: Float64Array; downhole: Float64Array; pumpingTime: number };

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
export type ShutInDiagnosticsReply = ShutInArrays;

/** The typed-array buffers of a reply value (a plain object of arrays), to transfer instead of copying. */
export function transferablesOf(value: unknown): ArrayBuffer[] {
  if (!value || typeof value !== 'object') return [];
  const buffers = new Set<ArrayBuffer>();
  for (const v of Object.values(value)) {
    if (ArrayBuffer.isView(v) && v.buffer instanceof ArrayBuffer) buffers.add(v.buffer);
  }
  return [...buffers];
}
