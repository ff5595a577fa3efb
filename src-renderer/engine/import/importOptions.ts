/**
 * Options of the importers: a forced column mapping (the app's saved mapping for a
 * contractor layout), a test type, metadata overrides, and whether a record may lack both
 * rate and volume.
 */
import { z } from 'zod';
import { EngineError } from '../errors';
import type { ColumnMapping, GaugePosition, TestMetadata, TestType } from '../record';

/** A forced reading of one source column. */
export interface ColumnOverride {
  /** 0-based column index in the table (for LAS: the curve index). */
  index: number;
  role: ColumnMapping['role'];
  /** Unit as written ("psi", "bbl/min", "s"); for timestamps 'iso-8601' or 'hh:mm:ss'. */
  unit?: string;
}

export interface ImportOptions {
  /** Forced column roles/units; these win over what the header says. */
  columns?: readonly ColumnOverride[];
  /** Test type, winning over the file's. */
  testType?: TestType;
  /** Metadata values (SI) winning over the file's. */
  metadata?: Partial<TestMetadata>;
  /** Gauge position, winning over the file's. */
  gaugePosition?: GaugePosition;
  /**
   * Accept a record with neither rate nor volume (e.g. a pressure-only DFIT fall-off).
   * Its rate and volume arrays are then NaN and `source.derived` is {rate: true, volume: true}.
   */
  allowMissingRateAndVolume?: boolean;
  /** Workbook sheet to read (name); default: the first sheet holding a table with a pressure column. */
  sheet?: string;
}

const finite = z.number().finite();
const roleSchema = z.enum(['time', 'pressure', 'rate', 'volume', 'timestamp', 'depth', 'other']);
const optionsSchema = z.object({
  columns: z.array(z.object({ index: z.number().int().min(0), role: roleSchema, unit: z.string().optional() })).optional(),
  testType: z.enum(['fit', 'lot', 'xlot', 'srt', 'dfit']).optional(),
  metadata: z.record(z.string(), z.union([finite, z.string(), z.record(z.string(), z.string()), z.undefined()])).optional(),
  gaugePosition: z.enum(['surface', 'downhole']).optional(),
  allowMissingRateAndVolume: z.boolean().optional(),
  sheet: z.string().optional(),
}).passthrough();

/**
 * Checks import options arriving from the app or the command line (zod schema).
 *
 * @param options the options as received
 * @param fileName for the error
 * @returns the same options, typed
 * @throws EngineError 'bad-argument' naming the first wrong option path
 * @example validateImportOptions({ testType: 'lot' }, 'a.csv')
 */
export function validateImportOptions(options: unknown, fileName: string): ImportOptions {
  const parsed = optionsSchema.safeParse(options ?? {});
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new EngineError('bad-argument', `import option "${issue.path.join('.') || '(options)'}" is invalid: ${issue.message}`, { file: fileName }, 'options as documented in importOptions.ts');
  }
  return options as ImportOptions;
}
