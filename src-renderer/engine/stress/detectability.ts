/**
 * Detectability of fracture initiation: the record's own measure of how large a fracture
 * must be before a breakdown or reopening pick can see it (METHODS.md "Detectability of
 * fracture initiation"; common practice reasoning, no single published source).
 *
 * A pressurised volume V of effective compressibility c moves by dP = dV/(c V) when a
 * fracture takes dV. The loading fit gives c V directly: compliance = 1/slope (m3/Pa).
 * The smallest resolvable departure dPmin = max(3 x residual SD of the loading fit, gauge
 * resolution) gives dVmin = c V dPmin. A near-wall tensile crack of aperture w, height h
 * and length L holds about w h L, so L = dVmin/(w h). The Kirsch relations (kirsch.ts)
 * hold for a crack short compared with the hole radius r; this module reports L/r.
 *
 * For review by a qualified engineer; not a substitute for the operator's well-control
 * policy; defers to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { Detectability, LineFit } from '../result';

/** Default aperture of a fresh wall crack, m (0.1 mm; an assumption stated in every message). */
export const DEFAULT_CRACK_APERTURE = 1e-4;
/** Default crack height when the open-hole length is unknown, m. */
export const DEFAULT_CRACK_HEIGHT = 1;
/** Default wellbore radius, m: an 8.5 in (0.2159 m) hole. */
export const DEFAULT_WELLBORE_RADIUS = 0.108;
/** Implied length over radius below which the Kirsch relations are taken to hold ("well below" = a tenth). */
export const KIRSCH_LENGTH_RATIO_LIMIT = 0.1;

export interface DetectabilityInput {
  /** Linear loading fit, pressure (Pa) against volume (m3): slope Pa/m3, residualSd Pa. */
  loadingFit: Pick<LineFit, 'slope' | 'residualSd'>;
  /** Gauge resolution, Pa (optional). */
  gaugeResolution?: number;
  /** Hole diameter, m (optional; default radius 0.108 m). */
  holeDiameter?: number;
  /** Open-hole length, m, used as the crack height when given. */
  openHoleLength?: number;
  /** Assumed crack aperture, m (default 1e-4). */
  aperture?: number;
  /** Assumed crack height, m (overrides the open-hole length). */
  height?: number;
}

function positiveOrThrow(name: string, value: number | undefined, unit: string): void {
  if (value === undefined) return;
  if (!Number.isFinite(value) || value <= 0) {
    throw new EngineError('out-of-range', `${name} ${value} ${unit} is not a positive number`, {}, `a positive ${name} in ${unit}`);
  }
}

function formatNumber(value: number): string {
  if (value >= 100) return value.toFixed(0);
  if (value >= 10) return value.toFixed(1);
  if (value >= 0.1) return value.toFixed(2);
  return value.toPrecision(2);
}

/**
 * How far a fracture must grow before the record can show it, from the record's own
 * loading fit (METHODS.md; common practice reasoning).
 *
 * @param input.loadingFit slope dP/dV in Pa/m3 (> 0) and residual SD in Pa (>= 0).
 * @param input.gaugeResolution Pa, > 0 when given.
 * @param input.holeDiameter m, > 0 when given; default radius 0.108 m (8.5 in hole).
 * @param input.openHoleLength m, used as the crack height when given; default 1 m.
 * @param input.aperture m, default 1e-4 (0.1 mm).
 * @param input.height m, overrides the open-hole length.
 * @returns the Detectability record, or null when the slope is not positive or no pressure
 *   departure can be resolved (residual SD 0 and no gauge resolution).
 * @throws EngineError 'out-of-range' for non-positive geometry or resolution.
 * @example fractureDetectability({loadingFit: {slope: 33e6, residualSd: 20e3}}) // implied length ~18 m, 168 radii
 */
export function fractureDetectability(input: DetectabilityInput): Detectability | null {
  const { slope, residualSd } = input.loadingFit;
  positiveOrThrow('gauge resolution', input.gaugeResolution, 'Pa');
  positiveOrThrow('hole diameter', input.holeDiameter, 'm');
  positiveOrThrow('open-hole length', input.openHoleLength, 'm');
  positiveOrThrow('crack aperture', input.aperture, 'm');
  positiveOrThrow('crack height', input.height, 'm');
  if (!Number.isFinite(slope) || slope <= 0 || !Number.isFinite(residualSd) || residualSd < 0) return null;
  const minPressureDeparture = Math.max(3 * residualSd, input.gaugeResolution ?? 0);
  if (minPressureDeparture <= 0) return null;
  const compliance = 1 / slope;
  const minDetectableVolume = compliance * minPressureDeparture;
  const assumedAperture = input.aperture ?? DEFAULT_CRACK_APERTURE;
  const assumedHeight = input.height ?? input.openHoleLength ?? DEFAULT_CRACK_HEIGHT;
  const wellboreRadius = input.holeDiameter !== undefined ? input.holeDiameter / 2 : DEFAULT_WELLBORE_RADIUS;
  const impliedFractureLength = minDetectableVolume / (assumedAperture * assumedHeight);
  const lengthToRadius = impliedFractureLength / wellboreRadius;
  const kirschApplies = lengthToRadius < KIRSCH_LENGTH_RATIO_LIMIT;
  const litres = minDetectableVolume * 1000;
  const heightSource = input.height !== undefined ? 'assumed' : input.openHoleLength !== undefined ? 'open-hole' : 'assumed';
  const radiusSource = input.holeDiameter !== undefined ? 'hole' : 'assumed 8.5 in hole';
  const head =
    `The record could not see a fracture smaller than ${formatNumber(litres)} L ` +
    `(smallest resolvable departure ${formatNumber(minPressureDeparture / 1e3)} kPa, system compliance ` +
    `${(compliance * 1e9).toPrecision(3)} L/MPa); at ${formatNumber(assumedAperture * 1e3)} mm aperture over ` +
    `${formatNumber(assumedHeight)} m ${heightSource} height that is a crack ${formatNumber(impliedFractureLength)} m long, ` +
    `${formatNumber(lengthToRadius)} times the ${radiusSource} radius of ${formatNumber(wellboreRadius)} m`;
  const tail = kirschApplies
    ? ': a crack that small is still near the wall, so the Kirsch relations can apply.'
    : ': the breakdown or reopening pick reflects a fracture far beyond the wall, where the Kirsch relations no longer hold.';
  return {
    minPressureDeparture,
    compliance,
    minDetectableVolume,
    impliedFractureLength,
    wellboreRadius,
    assumedAperture,
    assumedHeight,
    lengthToRadius,
    kirschApplies,
    message: head + tail,
  };
}
