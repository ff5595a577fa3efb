/**
 * Pore pressure against depth: a stated gradient from sea level (offshore) or ground
 * (onshore), or per-well measurements joined by straight lines. Depths are TVD in m below
 * the rig floor; pressures Pa; gradients Pa/m.
 */
import { EngineError } from '../errors';

/** Hydrostatic pore-pressure gradient, Pa/m: 10.0 kPa/m (common practice for formation brine; METHODS.md gives 0.465 psi/ft = 10.52 kPa/m for brine and 9.79 kPa/m for fresh water). */
export const DEFAULT_HYDROSTATIC_GRADIENT = 10_000;

/** One pore-pressure measurement (formation tester, DST, or a stated value). */
export interface PorePressureMeasurement {
  /** TVD below rig floor, m. */
  tvd: number;
  /** Pore pressure, Pa. */
  pressure: number;
  /** Where it came from, in plain words (e.g. "formation tester, Harrow Flats 3"). */
  source?: string;
}

/** A pore-pressure profile: nodes joined by straight lines, a gradient below the deepest. */
export interface PorePressureProfile {
  /** Node depths, TVD m below rig floor, increasing; the first is the hydrostatic datum (pressure 0). */
  depth: number[];
  pressure: number[];
  /** Gradient used below the deepest node, Pa/m. */
  gradientBelow: number;
  source: 'gradient' | 'measurements';
  provenance: string[];
}

function checkGradient(gradient: number): void {
  if (!(gradient > 0 && gradient <= 1e5)) {
    throw new EngineError('out-of-range', `pore-pressure gradient ${gradient} Pa/m is outside (0, 100000]`, {}, 'a gradient in Pa/m, e.g. 10000');
  }
}

function checkDatum(datum: number): void {
  if (!(datum >= 0) || !Number.isFinite(datum)) {
    throw new EngineError('bad-argument', `hydrostatic datum ${datum} m is not usable`, {}, 'a depth >= 0 m below rig floor');
  }
}

/**
 * Pore pressure from a stated gradient, Pp = gradient x (TVD - datum), zero above the
 * datum. The datum is sea level offshore (the rig floor elevation, i.e. the air gap, below
 * the rig floor) or the ground level onshore (the rig floor height).
 *
 * @param gradient Pa/m in (0, 1e5]; default {@link DEFAULT_HYDROSTATIC_GRADIENT} (10.0 kPa/m, common practice).
 * @param datum depth of sea level or ground below the rig floor, m (>= 0, default 0).
 * @returns a {@link PorePressureProfile}.
 * @throws EngineError 'out-of-range' for a bad gradient; 'bad-argument' for a bad datum.
 * @example porePressureAt(porePressureFromGradient(10000, 25), 1025) // 1.0e7 Pa
 */
export function porePressureFromGradient(gradient = DEFAULT_HYDROSTATIC_GRADIENT, datum = 0): PorePressureProfile {
  checkGradient(gradient);
  checkDatum(datum);
  return {
    depth: [datum],
    pressure: [0],
    gradientBelow: gradient,
    source: 'gradient',
    provenance: [`Pore pressure from a stated gradient of ${(gradient / 1000).toFixed(3)} kPa/m below ${datum} m TVD (sea level or ground)${gradient === DEFAULT_HYDROSTATIC_GRADIENT ? ', the hydrostatic default (common practice)' : ''}.`],
  };
}

/**
 * Pore pressure from measurements in one well: hydrostatic (zero) at the datum, straight
 * lines between measurements in depth order, and below the deepest measurement the
 * stated gradient (default hydrostatic 10.0 kPa/m) added to it.
 *
 * @param measurements at least one, finite TVD (m, deeper than the datum) and pressure (Pa, >= 0); no two at the same depth.
 * @param options.datum sea level or ground below the rig floor, m (default 0).
 * @param options.gradientBelow Pa/m below the deepest point (default 10000).
 * @param options.well well name for the provenance.
 * @returns a {@link PorePressureProfile}.
 * @throws EngineError 'too-few-points' with no measurement; 'bad-argument' for a bad or
 *   repeated depth or pressure; 'out-of-range' for a bad gradient.
 * @example porePressureFromMeasurements([{ tvd: 2000, pressure: 24e6 }], { datum: 25 })
 */
export function porePressureFromMeasurements(
  measurements: PorePressureMeasurement[],
  options: { datum?: number; gradientBelow?: number; well?: string } = {},
): PorePressureProfile {
  const datum = options.datum ?? 0;
  const gradientBelow = options.gradientBelow ?? DEFAULT_HYDROSTATIC_GRADIENT;
  checkDatum(datum);
  checkGradient(gradientBelow);
  if (measurements.length === 0) throw new EngineError('too-few-points', 'no pore-pressure measurement given', {}, 'one or more measurements');
  const sorted = [...measurements].sort((a, b) => a.tvd - b.tvd);
  const depth = [datum];
  const pressure = [0];
  for (const [i, m] of sorted.entries()) {
    if (!Number.isFinite(m.tvd) || !Number.isFinite(m.pressure) || m.pressure < 0 || m.tvd <= datum) {
      throw new EngineError('bad-argument', `pore-pressure measurement ${i + 1} (${m.tvd} m, ${m.pressure} Pa) is not usable`, {}, `a TVD below ${datum} m and a pressure >= 0`);
    }
    if (m.tvd === depth[depth.length - 1]) {
      throw new EngineError('bad-argument', `two pore-pressure measurements at ${m.tvd} m`, {}, 'one measurement per depth');
    }
    depth.push(m.tvd);
    pressure.push(m.pressure);
  }
  const where = options.well ? ` in ${options.well}` : '';
  return {
    depth,
    pressure,
    gradientBelow,
    source: 'measurements',
    provenance: [
      `Pore pressure from ${sorted.length} measurement${sorted.length > 1 ? 's' : ''}${where} joined by straight lines, zero at ${datum} m TVD (sea level or ground); below ${sorted[sorted.length - 1].tvd} m the deepest value plus ${(gradientBelow / 1000).toFixed(3)} kPa/m.`,
    ],
  };
}

/**
 * Pore pressure at a depth from a profile: 0 above the datum, straight lines between
 * nodes, the profile's gradient below the deepest node.
 *
 * @param profile from {@link porePressureFromGradient} or {@link porePressureFromMeasurements}.
 * @param tvd TVD below rig floor, m, finite.
 * @returns Pp, Pa.
 * @throws EngineError 'bad-argument' for a non-finite depth.
 * @example porePressureAt(porePressureFromGradient(), 1000) // 1e7
 */
export function porePressureAt(profile: PorePressureProfile, tvd: number): number {
  if (!Number.isFinite(tvd)) throw new EngineError('bad-argument', `depth ${tvd} is not a finite number`, {}, 'a depth in m');
  const { depth, pressure } = profile;
  const n = depth.length;
  if (tvd <= depth[0]) return 0;
  if (tvd >= depth[n - 1]) return pressure[n - 1] + profile.gradientBelow * (tvd - depth[n - 1]);
  let i = 1;
  while (depth[i] < tvd) i++;
  const f = (tvd - depth[i - 1]) / (depth[i] - depth[i - 1]);
  return pressure[i - 1] + f * (pressure[i] - pressure[i - 1]);
}
