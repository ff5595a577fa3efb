/**
 * What a synthetic test is made of: the specification whose truth the caller sets, and
 * the truth the generator reports back. All SI (Pa, m, s, m3, m3/s, kg/m3, 1/Pa);
 * event pressures are downhole, at the tested depth.
 */
import type { GaugePosition, TestMetadata, TestType } from '../record';
import type { PickKind } from '../result';

/** Flaws a synthetic record can carry, each one a known failure of field records. */
export interface SyntheticFlaws {
  /** Air in the line: a long soft toe and a loading line about 0.45 times as stiff. */
  airInLine?: boolean;
  /** Every shut-in keeps falling at `leakRate` (default 40 kPa/min) on top of the normal decline. */
  leakingShutIn?: boolean;
  /** Pump rate wanders about 18 % (coefficient of variation) around its mean. */
  unsteadyRate?: boolean;
  /** XLOT: the second cycle reopens above the first breakdown, or its shut-in lasts 90 s only. */
  badSecondCycle?: 'reopening-above-breakdown' | 'no-stable-shut-in';
  /** The gauge range sits between propagation and breakdown: readings clip at full scale. */
  clippedGauge?: boolean;
}

export interface SyntheticSpec {
  type: TestType;
  /** Seed of the deterministic generator (default 1). */
  seed?: number;
  /** True vertical depth of the tested interval, m (> 0). */
  depthTvd: number;
  /** Density of the fluid column, kg/m3 (default 1200; 1000 for SRT). */
  mudDensity?: number;
  /** Where the gauge sits (default surface). */
  gaugePosition?: GaugePosition;
  /** Minimum horizontal stress at depth, Pa: the closure pressure truth. */
  shmin: number;
  /** Pore pressure at depth, Pa (default 10.0 kPa/m x TVD). */
  porePressure?: number;
  /** Vertical stress, Pa, written to the metadata when given. */
  verticalStress?: number;
  /** Event pressures at depth, Pa; defaults from shmin (see eventPressures). */
  leakOff?: number;
  breakdown?: number;
  propagation?: number;
  isip?: number;
  reopening?: number;
  /** FIT: the test pressure held (default 80 % of the way from the mud column to leak-off). */
  fitPressure?: number;
  /** SRT: extension pressure (default shmin + 0.3 MPa). */
  extensionPressure?: number;
  /** XLOT cycles, 2-4 (default 2). */
  cycles?: number;
  /** Pump rate, m3/s (default 0.5 bbl/min = 1.325e-3). */
  rate?: number;
  /** Fluid volume under compression, m3 (default 60). */
  systemVolume?: number;
  /** Effective compressibility, 1/Pa (default 6e-10). */
  compressibility?: number;
  /** Written to metadata (systemVolume, compressibility): default true. */
  includeSystemMetadata?: boolean;
  /** Sample interval of the record, s (default 1; a multiple of 0.1). */
  sampleInterval?: number;
  /** Gaussian noise on the gauge pressure, Pa (default 3 kPa). */
  noiseSd?: number;
  /** Gauge resolution, Pa: readings are rounded to it (default none). */
  gaugeResolution?: number;
  /** Gauge full-scale range, Pa (default 10 000 psi surface, 15 000 psi downhole). */
  gaugeRange?: number;
  /** Shut-in length, s (default 900; DFIT 3600). */
  shutInDuration?: number;
  /** Dimensionless shut-in time of closure, (t - ts)/tp (default 0.5; DFIT 1.0). */
  closureTime?: number;
  /** Leak rate of a leaking shut-in, Pa/s (default 40 kPa/min). */
  leakRate?: number;
  /** Flow back after the last shut-in (cycles of an XLOT always bleed back between them). */
  flowBack?: boolean;
  /** SRT: number of equal steps (default 8) and their length, s (default 240). */
  steps?: number;
  stepDuration?: number;
  flaws?: SyntheticFlaws;
  /** Extra metadata (well, field, contractor, date, hole diameter, open-hole length...). */
  metadata?: Partial<TestMetadata>;
  /** File name written into the record source. */
  fileName?: string;
}

/** One set event: pressure at depth, Pa, and time from the record start, s. */
export interface TruthEvent {
  pressure: number;
  time: number;
  /** SRT extension: rate at the break, m3/s. */
  rate?: number;
}

export interface TruthCycle {
  index: number;
  pumpStartTime: number;
  pumpEndTime: number;
  /** End of the shut-in (start of flow-back or end of record), s. */
  shutInEndTime: number;
  picks: Partial<Record<PickKind, TruthEvent>>;
}

export interface SyntheticTruth {
  type: TestType;
  seed: number;
  shmin: number;
  porePressure: number;
  verticalStress?: number;
  /** SHmax implied by the set reopening, 3 Shmin - Pr - Pp, Pa (XLOT). */
  shmax?: number;
  /** Tensile strength Pb - Pr, Pa (XLOT). */
  tensileStrength?: number;
  /** Mud column rho g TVD, Pa: downhole minus surface gauge pressure. */
  hydrostatic: number;
  /** 1/(c V), Pa/m3. */
  expectedSlope: number;
  /** Loading stiffness the record was built with, Pa/m3 (softer with air in the line). */
  loadingSlope: number;
  /** Gauge range written to metadata, Pa. */
  gaugeRange: number;
  cycles: TruthCycle[];
  flaws: SyntheticFlaws;
}
