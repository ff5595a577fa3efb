import type { AnalysisOptions } from '../../engine/analysis-options';
import { EngineError, type EngineErrorCode } from '../../engine/errors';
import type { TestRecord } from '../../engine/record';
import type { AnalysisResult } from '../../engine/result';
import type { ArchiveEngine } from '../../archive/engine-port';
import type { ImportPreview } from './engineCalls';
import type { ShutInArrays } from './shutInArrays';
import type { WorkerError, WorkerReply, WorkerRequest } from './protocol';

type Pending = { resolve: (v: unknown) => void; reject: (e: unknown) => void };
type RequestBody = WorkerRequest extends infer R ? (R extends { id: number } ? Omit<R, 'id'> : never) : never;

/** Rebuilds the engine's typed error from its plain form, so callers can switch on `code`. */
export function errorFromWorker(e: WorkerError): Error {
  if (e.name === 'EngineError') {
    const err = new EngineError(e.code as EngineErrorCode, '', e.location, e.expected);
    Object.defineProperty(err, 'message', { value: e.message, enumerable: false, writable: true, configurable: true });
    return err;
  }
  const err = new Error(e.message);
  err.name = e.name;
  return err;
}

/**
 * The app's handle on the analysis worker. It is also the archive's engine port
 * (archive/engine-port.ts), so imports the archive performs parse and analyse off the
 * window's thread.
 */
export class AnalysisClient implements ArchiveEngine {
  private worker: Worker | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, Pending>();

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module', name: 'analysis' });
    worker.onmessage = (event: MessageEvent<WorkerReply>) => {
      const reply = event.data;
      const p = this.pending.get(reply.id);
      if (!p) return;
      this.pending.delete(reply.id);
      if (reply.ok) p.resolve(reply.value); else p.reject(errorFromWorker(reply.error));
    };
    worker.onerror = (event) => {
      const error = new Error(`The analysis worker stopped: ${event.message || 'unknown error'}`);
      for (const p of this.pending.values()) p.reject(error);
      this.pending.clear();
      this.worker?.terminate();
      this.worker = null;
    };
    this.worker = worker;
    return worker;
  }

  private call<T>(body: RequestBody, transfer: Transferable[] = []): Promise<T> {
    const id = this.nextId++;
    const worker = this.ensureWorker();
    return new Promise<T>((resolve, reject) => {
      this.pending.set(id, { resolve: resolve as (v: unknown) => void, reject });
      worker.postMessage({ ...body, id } as WorkerRequest, transfer);
    });
  }

  /** Starts the worker ahead of the first request, so its code is loaded when a test is opened (no-op without workers). */
  warmUp(): void {
    if (typeof Worker === 'undefined') return;
    try { this.ensureWorker(); } catch { /* the first request starts it, or reports why it cannot */ }
  }

  parse(bytes: Uint8Array, fileName: string, options?: Record<string, unknown>): Promise<TestRecord> {
    return this.call<TestRecord>({ op: 'parse', bytes, fileName, options });
  }

  analyse(record: TestRecord, options: AnalysisOptions): Promise<AnalysisResult> {
    return this.call<AnalysisResult>({ op: 'analyse', record, options });
  }

  /** Detected columns, units and metadata of a file, for the import confirmation. */
  preview(bytes: Uint8Array, fileName: string, options?: Record<string, unknown>): Promise<ImportPreview> {
    return this.call<ImportPreview>({ op: 'preview', bytes, fileName, options });
  }

  /**
   * G-function, square-root-of-time and log-log arrays of one cycle's shut-in, computed in
   * the worker. `time` (s) and `downhole` (Pa) are the shut-in samples only; their buffers
   * are transferred (unusable here afterwards), so pass copies.
   */
  shutInDiagnostics(cycle: number, time: Float64Array, downhole: Float64Array, pumpingTime: number): Promise<ShutInArrays> {
    const transfer = time.buffer === downhole.buffer ? [time.buffer] : [time.buffer, downhole.buffer];
    return this.call<ShutInArrays>({ op: 'shut-in-diagnostics', cycle, time, downhole, pumpingTime }, transfer as ArrayBuffer[]);
  }

  dispose(): void {
    this.worker?.terminate();
    this.worker = null;
    for (const p of this.pending.values()) p.reject(new Error('The analysis worker was closed.'));
    this.pending.clear();
  }
}
