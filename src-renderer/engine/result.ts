import type { TestMetadata, TestType } from './record';

/**
 * Analysis results, all SI (Pa, s, m, m3, m3/s). The command line converts to the
 * contract's display units (MPa, s, m, m3/min); the app converts to the user's units.
 */

export type PickKind =
  | 'leakOff'
  | 'breakdown'
  | 'propagation'
  | 'isip'
  | 'closure'
  | 'reopening'
  | 'fitMaximum'
  | 'extension';

export const PICK_KINDS: readonly PickKind[] = [
  'leakOff', 'breakdown', 'propagation', 'isip', 'closure', 'reopening', 'fitMaximum', 'extension',
];

/** One picked event. */
export interface Pick {
  kind: PickKind;
  /** Pressure at the tested depth, Pa (downhole). */
  pressure: number;
  /** Time of the event from the record's start, s. */
  time: number;
  /** Method id, e.g. "g-dpdg-tangent", "departure-from-linear-loading". */
  method: string;
  /** Index of the sample nearest the pick. */
  sampleIndex: number;
  /** For SRT extension: the rate at the break, m3/s. */
  rate?: number;
  /** True when an engineer set it by hand. */
  manual?: boolean;
  /** The reason given for a manual pick. */
  reason?: string;
  /**
   * 'lower' when the recorded value can only be a lower bound of the event: the gauge
   * clipped at its full-scale range at the pick, so the true pressure was higher.
   */
  bound?: 'lower';
}

/** A closure pick by one method, kept so the spread between methods can be reported. */
export interface ClosureCandidate {
  method: string;
  pressure: number;
  time: number;
  sampleIndex: number;
  /** G-function value at closure (when the method works in G). */
  g?: number;
  /**
   * True when the method's own model fits poorly (bilinear |dP/dt|: the change of regime is
   * gradual, a curve rather than a corner). Kept for the spread between methods; never the
   * cycle's closure pick.
   */
  gradual?: boolean;
}

/** Straight-line fit y = intercept + slope x, with its quality. */
export interface LineFit {
  slope: number;
  intercept: number;
  r2: number;
  /** Residual standard deviation (sqrt(RSS/(n-2))). */
  residualSd: number;
  n: number;
  /** Sample index range [start, end] (inclusive) the fit used. */
  start: number;
  end: number;
}

/** A pumping period followed by its shut-in (or flow-back). Indices are inclusive sample indices. */
export interface Cycle {
  /** 1-based cycle number. */
  index: number;
  pumpStart: number;
  pumpEnd: number;
  /** Shut-in from pumpEnd+1 to shutInEnd; equal to pumpEnd when there is no shut-in. */
  shutInEnd: number;
  /** Mean pump rate while pumping, m3/s. */
  meanRate: number;
  /** Volume pumped in this cycle, m3. */
  volumePumped: number;
  /** Flow-back (negative rate) after the shut-in. */
  flowBack: boolean;
}

export interface CycleAnalysis {
  cycle: Cycle;
  /** Linear loading fit, pressure (Pa) against cumulative cycle volume (m3); slope in Pa/m3. */
  loadingFit: LineFit | null;
  /** Expected slope 1/(c V), Pa/m3, when volume and compressibility are known. */
  expectedSlope: number | null;
  picks: Partial<Record<PickKind, Pick>>;
  /** Every closure method that found a pick, with the spread between them. */
  closureCandidates: ClosureCandidate[];
  /** max - min of the closure candidates, Pa; null with fewer than two. */
  closureSpread: number | null;
  /** Step-rate fit details (SRT only). */
  stepRate?: StepRateAnalysis;
}

export interface StepRateAnalysis {
  /** Stabilised steps: rate m3/s, pressure Pa (end of each step), sample index of the step end. */
  steps: { rate: number; pressure: number; endIndex: number; startIndex: number }[];
  matrixLine: LineFit | null;
  fractureLine: LineFit | null;
  /** Intersection: rate m3/s, pressure Pa. */
  extension: { rate: number; pressure: number } | null;
}

export type ShminKind = 'estimate' | 'lower-bound' | 'upper-bound';

export interface StressEstimates {
  shmin: { value: number; kind: ShminKind; from: PickKind; cycle: number } | null;
  shmax: {
    /** Reopening-relation value SHmax = 3 Shmin - Pr - Pp, Pa; null when no valid later cycle. */
    value: number | null;
    /** Frictional-limit bounds, Pa. */
    low: number;
    high: number;
    method: string;
    cautions: string[];
    detectability: Detectability | null;
  } | null;
  sv: { value: number; source: 'given' | 'file' | 'default-gradient'; gradient?: number };
  pp: { value: number; source: 'given' | 'file' | 'default-gradient'; gradient?: number };
  /** Friction coefficient used for the bounds. */
  frictionCoefficient: number;
  /** Tensile strength T0 = Pb - Pr, Pa, when both exist. */
  tensileStrength: number | null;
}

/** The record's own measure of how large a fracture must be before any pick can see it (METHODS.md). */
export interface Detectability {
  /** Smallest resolvable pressure departure, Pa (3 x loading residual SD, at least the gauge resolution). */
  minPressureDeparture: number;
  /** System compliance c V, m3/Pa (from the measured loading slope: 1/slope). */
  compliance: number;
  /** Smallest fracture volume that would show: compliance x minPressureDeparture, m3. */
  minDetectableVolume: number;
  /** Fracture length that volume implies for the assumed aperture and height, m. */
  impliedFractureLength: number;
  /** Wellbore radius used, m. */
  wellboreRadius: number;
  assumedAperture: number;
  assumedHeight: number;
  /** Ratio implied length / wellbore radius; Kirsch holds for ratios well below 1. */
  lengthToRadius: number;
  kirschApplies: boolean;
  message: string;
}

export type Grade = 'A' | 'B' | 'C' | 'D' | 'E';
export const GRADES: readonly Grade[] = ['A', 'B', 'C', 'D', 'E'];

export interface CriterionResult {
  id: string;
  /** true pass, false fail, null cannot be judged (message says what is missing). */
  pass: boolean | null;
  value: number | null;
  limit: number | null;
  /** Plain-language explanation. */
  message: string;
  /** How much a failure weighs: 'major' lowers the grade more than 'minor'. */
  severity: 'major' | 'minor';
  /**
   * Unit of `value` and `limit` (added for the criteria table): an SI unit ('s', 'Pa/s'),
   * 'fraction' for a share of a whole (shown as a percentage), 'ratio' for a plain ratio,
   * 'r2' for a coefficient of determination. Absent: no unit is known.
   */
  unit?: string;
}

export interface QualityResult {
  grade: Grade;
  criteria: CriterionResult[];
  /** Why this grade, in plain words. */
  explanation: string;
}

export interface AnalysisResult {
  type: TestType;
  typeInferred: boolean;
  /** Why the record looks like its inferred type (also given when the type was stated). */
  typeReasons: string[];
  samples: number;
  /** Metadata after command-line overrides were applied. */
  metadata: TestMetadata;
  /** Downhole pressure used for every pick, Pa (same length as the record). */
  downholePressure: Float64Array;
  /** Pressure added to gauge readings to reach downhole, Pa (0 for a downhole gauge). */
  hydrostaticCorrection: number;
  cycles: CycleAnalysis[];
  stress: StressEstimates;
  quality: QualityResult;
  warnings: string[];
}

/**
 * What the pipeline knows before stresses and quality are computed: the input to
 * `estimateStresses` (stress/) and `assessQuality` (quality/).
 */
export interface AnalysisContext {
  type: TestType;
  typeInferred: boolean;
  /** The record as imported (gauge pressure, rate, volume, SI). */
  time: Float64Array;
  rate: Float64Array;
  volume: Float64Array;
  /** Gauge pressure as recorded, Pa (for the gauge-range criterion). */
  gaugePressure: Float64Array;
  /** Downhole pressure at the tested depth, Pa. */
  downholePressure: Float64Array;
  metadata: TestMetadata;
  cycles: CycleAnalysis[];
}
