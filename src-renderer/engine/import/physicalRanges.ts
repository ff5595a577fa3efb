/**
 * Physical plausibility limits applied at import. Values outside are refused with
 * 'out-of-range' naming where they were found. Limits are common practice for borehole
 * pressure tests, chosen wide enough never to refuse a real test:
 * - mud density 0.5-3.0 sg (500-3000 kg/m3): from light oil-based mud to the heaviest weighted muds;
 * - TVD 0-15,000 m (deeper than any drilled well's vertical depth); MD 0-20,000 m (extended reach);
 * - diameters 0.02-1.5 m; volumes 0-10,000 m3; compressibility 1e-12-1e-6 1/Pa;
 * - pressure samples not below -1 bar gauge (below vacuum), see checkPressureSamples.
 * Rates may be negative: flowback / bleed-off is recorded as negative injection rate and
 * is kept with its sign (volume then decreases).
 */
import { EngineError, type SourceLocation } from '../errors';

/** An inclusive range in SI with its display form for messages. */
export interface PhysicalRange {
  min: number;
  max: number;
  what: string;
}

export const PHYSICAL_RANGES: Readonly<Record<string, PhysicalRange>> = {
  mudDensity: { min: 500, max: 3000, what: 'a mud density of 0.5-3.0 sg (500-3000 kg/m3)' },
  equivalentDensity: { min: 0, max: 5000, what: 'an equivalent density of 0-5 sg' },
  depthTvd: { min: 0, max: 15000, what: 'a TVD of 0-15,000 m' },
  casingShoeTvd: { min: 0, max: 15000, what: 'a TVD of 0-15,000 m' },
  depthMd: { min: 0, max: 20000, what: 'an MD of 0-20,000 m' },
  casingShoeMd: { min: 0, max: 20000, what: 'an MD of 0-20,000 m' },
  openHoleLength: { min: 0, max: 20000, what: 'a length of 0-20,000 m' },
  holeDiameter: { min: 0.02, max: 1.5, what: 'a diameter of 0.02-1.5 m (1-60 in)' },
  casingInnerDiameter: { min: 0.02, max: 1.5, what: 'a diameter of 0.02-1.5 m (1-60 in)' },
  systemVolume: { min: 0, max: 10000, what: 'a volume of 0-10,000 m3' },
  surfaceLineVolume: { min: 0, max: 100, what: 'a surface line volume of 0-100 m3' },
  compressibility: { min: 1e-12, max: 1e-6, what: 'a compressibility of 1e-12 to 1e-6 1/Pa' },
  gaugeRange: { min: 1e5, max: 1e9, what: 'a gauge range of 1 bar to 1 GPa' },
  gaugeResolution: { min: 0, max: 1e7, what: 'a gauge resolution of 0-10 MPa' },
};

/** Lowest pressure sample accepted, Pa (gauge): -1 bar, i.e. below absolute zero for a gauge reading. */
export const MINIMUM_PRESSURE = -1e5;

/**
 * Throws when a value is outside its physical range.
 *
 * @param value SI value
 * @param range the range
 * @param location where the value was read
 * @throws EngineError 'out-of-range'
 * @example checkRange(1250, PHYSICAL_RANGES.mudDensity, {line: 4})
 */
export function checkRange(value: number, range: PhysicalRange, location: SourceLocation): void {
  if (!(value >= range.min && value <= range.max)) {
    throw new EngineError('out-of-range', `value ${formatSI(value)} is outside the physical range`, location, range.what);
  }
}

function formatSI(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(6))) : String(value);
}

/**
 * Index of the first pressure sample below MINIMUM_PRESSURE, or -1.
 *
 * @param pressure samples, Pa
 * @returns index or -1
 * @example firstPressureBelowVacuum(new Float64Array([1e5, -2e5])) // 1
 */
export function firstPressureBelowVacuum(pressure: Float64Array): number {
  for (let i = 0; i < pressure.length; i++) if (pressure[i] < MINIMUM_PRESSURE) return i;
  return -1;
}
