/**
 * Reads and analyses the files named on the command line, one after the other, keeping
 * going after a failure: each file gets either its analysis or its error. Shared by the
 * `analyze` and `model` commands. Between import and analysis the file's bytes are
 * released and collected (memory.ts) to keep peak memory near the record's own size.
 */
import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { analyzeRecord } from '../analyze';
import { EngineError, isEngineError } from '../errors';
import { importTestFile } from '../import/import-test-file';
import type { TestRecord } from '../record';
import type { AnalysisResult } from '../result';
import { fileResultJson } from './json-output';
import { collectGarbage } from './memory';
import { analysisOptionsFor, type CliArguments } from './options';

/** Something that takes text (process.stdout / process.stderr, or a test buffer). */
export interface TextSink {
  write(text: string): unknown;
}

/** Options of {@link analyzeFilesForCli}. */
export interface AnalyzeFilesOptions {
  /** Where progress lines go (default: nowhere). */
  stderr?: TextSink;
  /** Called with each outcome as soon as its file is done (e.g. to write its text summary). */
  onOutcome?: (outcome: CliFileOutcome) => void;
  /** Drop each record and analysis after onOutcome, keeping only the JSON (memory on many files). */
  release?: boolean;
}

/** The outcome for one file. */
export interface CliFileOutcome {
  /** The path as given on the command line. */
  path: string;
  /** The file name shown in results (the path's last part). */
  file: string;
  record: TestRecord | null;
  analysis: AnalysisResult | null;
  error: EngineError | null;
  /** The contract's per-file JSON object. */
  json: Record<string, unknown>;
}

/**
 * Imports and analyses every file with the command-line options (values given win over
 * the file's metadata). Progress lines go to `stderr`. Never throws for a bad file: its
 * outcome carries the error (unexpected failures become code 'internal-error').
 *
 * @param paths file paths. @param args parsed command line (type, tvd, mud, gauge, pp, sv, ...).
 * @param io where progress goes, a per-file callback, and whether to release records.
 * @returns one outcome per path, in order.
 * @example const outcomes = await analyzeFilesForCli(['a.csv'], parseCliArguments(['analyze', 'a.csv']));
 */
export async function analyzeFilesForCli(paths: readonly string[], args: CliArguments, io: AnalyzeFilesOptions = {}): Promise<CliFileOutcome[]> {
  const outcomes: CliFileOutcome[] = [];
  for (let i = 0; i < paths.length; i++) {
    const path = paths[i];
    const file = basename(path);
    io.stderr?.write(`[${i + 1}/${paths.length}] ${file}: analysing\n`);
    let record: TestRecord | null = null;
    let analysis: AnalysisResult | null = null;
    let error: EngineError | null = null;
    try {
      const imported = await importPath(path, file);
      record = imported;
      collectGarbage();
      analysis = analyzeRecord(imported, analysisOptionsFor(args, imported.metadata, file));
    } catch (e) {
      error = asEngineError(e, file);
    }
    let json: Record<string, unknown>;
    try {
      json = fileResultJson(file, analysis, record, error);
    } catch (e) {
      // A result the contract cannot express is this file's failure, not the whole run's.
      error = asEngineError(e, file);
      analysis = null;
      json = fileResultJson(file, null, null, error);
    }
    if (error) io.stderr?.write(`[${i + 1}/${paths.length}] failed: ${error.message}\n`);
    else io.stderr?.write(`[${i + 1}/${paths.length}] ${file}: ${analysis?.type.toUpperCase()}, grade ${analysis?.quality.grade}\n`);
    const outcome: CliFileOutcome = { path, file, record: error ? null : record, analysis, error, json };
    io.onOutcome?.(outcome);
    if (io.release) {
      outcome.record = null;
      outcome.analysis = null;
    }
    outcomes.push(outcome);
  }
  return outcomes;
}

/** Reads and imports one file; the file's bytes are unreachable once this returns (memory). */
async function importPath(path: string, file: string): Promise<TestRecord> {
  return importTestFile(await readBytes(path, file), file);
}

async function readBytes(path: string, file: string): Promise<Uint8Array> {
  try {
    const buffer = await readFile(path);
    return new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.byteLength);
  } catch (e) {
    const code = (e as { code?: string }).code;
    if (code === 'ENOENT') throw new EngineError('file-not-found', `no such file: ${path}`, { file }, 'a readable file');
    if (code === 'EISDIR') throw new EngineError('file-not-found', `${path} is a folder, not a file`, { file }, 'a file');
    throw new EngineError('file-not-found', `cannot read ${path}: ${(e as Error).message}`, { file }, 'a readable file');
  }
}

function asEngineError(e: unknown, file: string): EngineError {
  if (isEngineError(e)) return e.withFile(file);
  const message = e instanceof Error ? e.message : String(e);
  return new EngineError('internal-error', `unexpected failure: ${message}`, { file });
}
