import type { AnalysisOptions } from '../engine/analysis-options';
import type { TestRecord } from '../engine/record';
import type { AnalysisResult } from '../engine/result';

/**
 * What the archive needs from the engine, injected so the same service runs in the app
 * (work done in a Web Worker: archive/worker-engine.ts) and in Node tests (direct calls).
 */
export interface ArchiveEngine {
  /** Read a contractor file into a normalised SI record (engine/import importTestFile). Throws EngineError. */
  parse(bytes: Uint8Array, fileName: string, options?: Record<string, unknown>): Promise<TestRecord>;
  /** Analyse a record (engine analyzeRecord). Throws EngineError on broken preconditions. */
  analyse(record: TestRecord, options: AnalysisOptions): Promise<AnalysisResult> | AnalysisResult;
}
