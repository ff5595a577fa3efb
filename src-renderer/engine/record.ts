import type { CubicMetre, KilogramPerCubicMetre, Metre, PerPascal, Pascal } from './units/quantity';

/** Test types the engine knows. Lower-case ids are the command line's `--type` values. */
export type TestType = 'fit' | 'lot' | 'xlot' | 'srt' | 'dfit';
export const TEST_TYPES: readonly TestType[] = ['fit', 'lot', 'xlot', 'srt', 'dfit'];

export type GaugePosition = 'surface' | 'downhole';

/**
 * Metadata of a test as found in the file or given by the user, all SI.
 * Every field is optional: the import fills what the file says.
 */
export interface TestMetadata {
  well?: string;
  field?: string;
  contractor?: string;
  testType?: TestType;
  /** Date of the test, ISO 8601, if the file says. */
  date?: string;
  /** True vertical depth of the tested interval (below rig floor), m. */
  depthTvd?: Metre;
  /** Measured depth of the tested interval, m. */
  depthMd?: Metre;
  /** Density of the fluid column, kg/m3. */
  mudDensity?: KilogramPerCubicMetre;
  gaugePosition?: GaugePosition;
  /** Casing shoe measured depth, m. */
  casingShoeMd?: Metre;
  /** Casing shoe TVD, m. */
  casingShoeTvd?: Metre;
  /** Hole (bit) diameter, m. */
  holeDiameter?: Metre;
  /** Casing inner diameter, m. */
  casingInnerDiameter?: Metre;
  /** Open-hole length below the shoe, m. */
  openHoleLength?: Metre;
  /** Fluid volume under compression, m3. */
  systemVolume?: CubicMetre;
  /** Volume of the surface lines between pump and wellhead, m3 (added to the hole volume). */
  surfaceLineVolume?: CubicMetre;
  /** Effective compressibility of that volume, 1/Pa. */
  compressibility?: PerPascal;
  /** Mud type as written (water-based, oil-based ...). */
  mudType?: string;
  /** Full-scale range of the pressure gauge, Pa. */
  gaugeRange?: Pascal;
  /** Gauge resolution, Pa. */
  gaugeResolution?: Pascal;
  /** Pore pressure at test depth, Pa. */
  porePressure?: Pascal;
  /** Vertical stress at test depth, Pa. */
  verticalStress?: Pascal;
  /** Name of the tested formation (or zone) as written, e.g. "Ashgrove Shale". */
  formation?: string;
  /** Anything else in the metadata block, as written (key -> value). */
  extra?: Record<string, string>;
}

/** How a column of the source was read: for the import confirmation screen and saved mappings. */
export interface ColumnMapping {
  /** Index of the source column (0-based). */
  index: number;
  /** Header text as written. */
  header: string;
  /** What it was recognised as. */
  role: 'time' | 'pressure' | 'rate' | 'volume' | 'timestamp' | 'depth' | 'other';
  /** Unit as written or inferred ("psi", "bbl/min", "iso-8601"). */
  unit: string;
  /** Whether the unit was stated in the file (false: assumed). */
  unitStated: boolean;
}

/** The normalised record every importer returns: SI arrays of equal length. */
export interface TestRecord {
  /** Elapsed time from the first sample, s, strictly increasing. */
  time: Float64Array;
  /** Pressure as recorded at the gauge (see `metadata.gaugePosition`), Pa. */
  pressure: Float64Array;
  /** Pump rate, m3/s (differentiated from volume when the file has none). */
  rate: Float64Array;
  /** Cumulative pumped volume, m3 (integrated from rate when the file has none). */
  volume: Float64Array;
  metadata: TestMetadata;
  source: RecordSource;
}

export interface RecordSource {
  fileName: string;
  format: 'delimited' | 'xlsx' | 'las' | 'synthetic';
  /** Layout signature: a stable string from the header names and units, to remember mappings per contractor layout. */
  layout: string;
  columns: ColumnMapping[];
  /** Which of rate/volume were derived rather than read. */
  derived: { rate: boolean; volume: boolean };
  /** Absolute start time (ISO 8601) when the file had timestamps. */
  startTime?: string;
  /** Warnings found while reading that did not stop the import. */
  warnings: string[];
  /** Delimiter and decimal mark found, for delimited text. */
  delimiter?: string;
  decimalMark?: '.' | ',';
  sheet?: string;
}

/** A depth-indexed log (LAS), e.g. bulk density for the vertical stress. SI arrays. */
export interface DepthLog {
  /** Index depth, m (MD or TVD as the file says; `indexKind`). */
  depth: Float64Array;
  indexKind: 'md' | 'tvd' | 'unknown';
  curves: Record<string, { unit: string; values: Float64Array; description?: string; unitWritten?: string }>;
  well?: string;
  nullValue?: number;
  fileName: string;
  /** Warnings found while reading that did not stop the import. */
  warnings?: string[];
}

/** Number of samples in a record. */
export function recordLength(record: TestRecord): number {
  return record.time.length;
}
