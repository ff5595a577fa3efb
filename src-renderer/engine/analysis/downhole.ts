/**
 * Gauge pressure to downhole pressure at the tested depth.
 *
 * A surface gauge reads the pressure added on top of the static fluid column, so the
 * pressure at the tested interval is P_dh = P_surface + rho g TVD with g = 9.80665 m/s2
 * (standard gravity, exact; NIST SP 811) and rho the density of the column (hydrostatic
 * law; Bourgoyne et al., Applied Drilling Engineering 1986, ch. 4, from memory).
 * Friction in the string is neglected: the loading rates of these tests are low
 * (common practice). A downhole gauge is used as recorded (assumed at the tested depth).
 *
 * Policy on missing data: every pressure the engine reports is downhole, so a surface
 * gauge without the TVD or the mud density cannot be analysed; that is an
 * EngineError 'bad-metadata' naming what is missing, never a silent gauge-level result.
 */
import { EngineError } from '../errors';
import type { GaugePosition, TestMetadata } from '../record';
import { STANDARD_GRAVITY } from '../units/quantity';

/** Result of {@link downholePressure}. */
export interface DownholePressure {
  /** Pressure at the tested depth, Pa, one per sample. */
  pressure: Float64Array;
  /** Pressure added to each gauge reading, Pa (0 for a downhole gauge). */
  correction: number;
  /** Gauge position used. */
  gaugePosition: GaugePosition;
}

/**
 * Hydrostatic pressure of a static fluid column, rho g h.
 *
 * @param density column density, kg/m3, finite and > 0 (about 800-2500 for drilling fluids).
 * @param tvd vertical height of the column, m, finite and >= 0.
 * @returns pressure, Pa.
 * @throws EngineError 'bad-metadata' for a non-finite or out-of-range value.
 * @example fluidColumnPressure(1000, 1000) // 9806650 Pa (9.80665 MPa)
 */
export function fluidColumnPressure(density: number, tvd: number): number {
  if (!Number.isFinite(density) || density <= 0) {
    throw new EngineError('bad-metadata', `mud density ${density} kg/m3 is not a positive number`, {}, 'a density above 0 kg/m3');
  }
  if (!Number.isFinite(tvd) || tvd < 0) {
    throw new EngineError('bad-metadata', `TVD ${tvd} m is not a depth`, {}, 'a TVD of 0 m or more');
  }
  return density * STANDARD_GRAVITY * tvd;
}

/**
 * Downhole pressure at the tested depth from the gauge readings: a surface gauge gets the
 * static column rho g TVD added; a downhole gauge is returned unchanged (as a copy).
 * The gauge position is `metadata.gaugePosition`, surface when absent.
 *
 * @param gaugePressure gauge readings, Pa.
 * @param metadata needs depthTvd (m) and mudDensity (kg/m3) for a surface gauge.
 * @param fileName for the error's location.
 * @returns the downhole series, the correction added (Pa) and the gauge position used.
 * @throws EngineError 'bad-metadata' when a surface gauge lacks TVD or mud density
 *   (the message names each missing value) or they are out of range.
 * @example downholePressure(p, { gaugePosition: 'surface', depthTvd: 1500, mudDensity: 1200 }).correction // 17651970
 */
export function downholePressure(gaugePressure: Float64Array, metadata: TestMetadata, fileName?: string): DownholePressure {
  const gaugePosition: GaugePosition = metadata.gaugePosition ?? 'surface';
  if (gaugePosition === 'downhole') {
    return { pressure: Float64Array.from(gaugePressure), correction: 0, gaugePosition };
  }
  const missing: string[] = [];
  if (metadata.depthTvd === undefined) missing.push('the TVD of the tested interval');
  if (metadata.mudDensity === undefined) missing.push('the mud density');
  if (missing.length > 0) {
    throw new EngineError(
      'bad-metadata',
      `the pressure was read at surface; reaching the tested depth needs ${missing.join(' and ')}, which the file does not give`,
      fileName ? { file: fileName } : {},
      'TVD and mud density in the file or as options (or a downhole gauge)',
    );
  }
  let correction: number;
  try {
    correction = fluidColumnPressure(metadata.mudDensity as number, metadata.depthTvd as number);
  } catch (e) {
    throw e instanceof EngineError && fileName ? e.withFile(fileName) : e;
  }
  const pressure = new Float64Array(gaugePressure.length);
  for (let i = 0; i < pressure.length; i++) pressure[i] = gaugePressure[i] + correction;
  return { pressure, correction, gaugePosition };
}
