/**
 * The engine calls the analysis worker makes. Kept apart from the worker's message
 * loop so the same requests can run in place (tests, or a browser without workers).
 */
import { analyzeRecord } from '../../engine/analyze';
import { isEngineError } from '../../engine/errors';
import { detectColumns, importTestFile, type TablePreview } from '../../engine/import/import-test-file';
import type { TestRecord } from '../../engine/record';
import type { WorkerRequest } from './protocol';
import { shutInArrays } from './shutInArrays';

/** What a full read of the file gave, for the confirmation screen. */
export interface ParsedSummary {
  samples: number;
  /** Duration of the record, s. */
  duration: number;
  derived: { rate: boolean; volume: boolean };
  warnings: string[];
  /** First rows as read, SI (time s, pressure Pa, rate m3/s, volume m3). */
  firstRows: [number, number, number, number][];
}

/** What the import confirmation shows for one file before it enters the archive. */
export interface ImportPreview {
  /** Detected columns, units, metadata and first text rows (engine detectColumns). */
  table: TablePreview;
  /** The full read with this mapping, or null when it fails (see parseError). */
  parsed: ParsedSummary | null;
  parseError: { code: string; message: string; line?: number; column?: number; expected?: string } | null;
}

/** Summarises a parsed record for the confirmation table. */
export function summaryOfRecord(record: TestRecord): ParsedSummary {
  const n = record.time.length;
  const rows: [number, number, number, number][] = [];
  for (let i = 0; i < Math.min(n, 5); i++) rows.push([record.time[i], record.pressure[i], record.rate[i], record.volume[i]]);
  return { samples: n, duration: n ? record.time[n - 1] - record.time[0] : 0, derived: record.source.derived, warnings: record.source.warnings, firstRows: rows };
}

/** Column detection, then a full read to find any problem (file, line, column) before import. */
export async function previewFile(bytes: Uint8Array, fileName: string, options?: Record<string, unknown>): Promise<ImportPreview> {
  const table = await detectColumns(bytes, fileName, options);
  try {
    return { table, parsed: summaryOfRecord(await importTestFile(bytes, fileName, options)), parseError: null };
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { table, parsed: null, parseError: { code: e.code, message: e.message, line: e.location.line, column: e.location.column, expected: e.expected } };
  }
}

export async function runEngineRequest(request: WorkerRequest): Promise<unknown> {
  switch (request.op) {
    case 'parse':
      return importTestFile(request.bytes, request.fileName, request.options);
    case 'analyse':
      return analyzeRecord(request.record, request.options);
    case 'preview':
      return previewFile(request.bytes, request.fileName, request.options);
    case 'shut-in-diagnostics':
      return shutInArrays(request.time, request.downhole, request.pumpingTime);
  }
}
