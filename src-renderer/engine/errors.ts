/**
 * The engine's one error type. Broken preconditions and unreadable input throw an
 * `EngineError` with a stable `code`; "no result" is `null`; quality findings are values.
 *
 * Codes are part of the command line's JSON contract (`error.code`): add, never rename.
 */
export type EngineErrorCode =
  | 'unknown-unit'
  | 'non-numeric-cell'
  | 'time-not-increasing'
  | 'empty-table'
  | 'no-pressure-column'
  | 'no-time-column'
  | 'no-rate-or-volume'
  | 'out-of-range'
  | 'bad-metadata'
  | 'bad-encoding'
  | 'unsupported-format'
  | 'ragged-row'
  | 'bad-las'
  | 'bad-workbook'
  | 'bad-argument'
  | 'bad-survey'
  | 'too-few-points'
  | 'singular-matrix'
  | 'file-not-found'
  /** An unexpected failure inside the program (a defect to report), not a problem of the input. */
  | 'internal-error'
  /** A team bundle that fails its checksum or structure check (archive/journal/bundle.ts). */
  | 'bad-bundle';

/** Where in a source file an error was found. Lines and columns count from 1. */
export interface SourceLocation {
  file?: string;
  line?: number;
  column?: number;
  /** For workbooks: the sheet name and the A1-style cell. */
  sheet?: string;
  cell?: string;
}

export class EngineError extends Error {
  readonly code: EngineErrorCode;
  readonly location: SourceLocation;
  /** What was expected, in plain words, e.g. "a number in kPa". */
  readonly expected?: string;

  constructor(code: EngineErrorCode, message: string, location: SourceLocation = {}, expected?: string) {
    super(formatMessage(message, location, expected));
    this.name = 'EngineError';
    this.code = code;
    this.location = location;
    this.expected = expected;
  }

  /** Plain object for JSON output: `{code, message, file?, line?, column?, sheet?, cell?}`. */
  toJSON(): Record<string, unknown> {
    const out: Record<string, unknown> = { code: this.code, message: this.message };
    for (const [k, v] of Object.entries(this.location)) if (v !== undefined) out[k] = v;
    if (this.expected) out.expected = this.expected;
    return out;
  }

  /** A copy of this error with the file name filled in (import code often learns it late). */
  withFile(file: string): EngineError {
    if (this.location.file) return this;
    const copy = new EngineError(this.code, stripLocation(this.message), { ...this.location, file }, this.expected);
    return copy;
  }
}

function formatMessage(message: string, loc: SourceLocation, expected?: string): string {
  const where: string[] = [];
  if (loc.file) where.push(loc.file);
  if (loc.sheet) where.push(`sheet "${loc.sheet}"`);
  if (loc.cell) where.push(`cell ${loc.cell}`);
  if (loc.line !== undefined) where.push(`line ${loc.line}`);
  if (loc.column !== undefined) where.push(`column ${loc.column}`);
  const prefix = where.length ? `${where.join(', ')}: ` : '';
  const suffix = expected ? ` (expected ${expected})` : '';
  return `${prefix}${message}${suffix}`;
}

function stripLocation(message: string): string {
  const i = message.indexOf(': ');
  return i >= 0 && /line|column|sheet|cell/.test(message.slice(0, i)) ? message.slice(i + 2).replace(/ \(expected [^)]*\)$/, '') : message.replace(/ \(expected [^)]*\)$/, '');
}

export function isEngineError(e: unknown): e is EngineError {
  return e instanceof EngineError;
}
