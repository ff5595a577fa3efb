/**
 * Vertical stress (overburden) Sv = integral of rho g dz from the rig floor down
 * (Zoback, Reservoir Geomechanics 2007, ch. 1; METHODS.md "Stress bounds"), with air
 * over the rig floor elevation (air gap), the sea-water column offshore and the
 * sediment density from a bulk-density log or a stated gradient.
 *
 * Depths are TVD in m below the rig floor; densities kg/m3; Sv in Pa.
 */
import { EngineError } from '../errors';
import type { DepthLog } from '../record';
import { STANDARD_GRAVITY } from '../units/quantity';
import { normaliseUnitName } from '../units/unitNames';
import { unitDimension, unitFactorToSI } from '../units/units';
import { integrateDensityProfile, profilePressureAt, type DensityProfile } from './depth-profile';

/** Sea-water density, kg/m3 (common practice; 1020-1030 kg/m3 is the usual range). */
export const SEAWATER_DENSITY = 1025;
/** Sediment density assumed at the mudline for the linear shallow fill, kg/m3 (common practice, from memory: 1.6-1.8 g/cm3 for shallow marine mud). */
export const DEFAULT_MUDLINE_DENSITY = 1700;
/** Densities outside this range (kg/m3) are treated as unusable log readings (common practice: bad-hole or null readings). */
export const USABLE_DENSITY_RANGE: readonly [number, number] = [1000, 3500];
/** Curve names tried, in order, when no density curve is named (common LAS mnemonics for bulk density). */
export const DENSITY_CURVE_NAMES: readonly string[] = ['RHOB', 'RHOZ', 'ZDEN', 'DEN', 'DENS', 'BDEN', 'RHO'];

/** Where the sea floor or ground is, and how to fill the interval the log does not cover. */
export interface OverburdenSettings {
  /** Rig floor elevation above sea level offshore (air gap) or above ground onshore, m, >= 0. Default 0. */
  rigFloorElevation?: number;
  /** Water depth, m, >= 0; 0 or absent onshore. */
  waterDepth?: number;
  /** Sea-water density, kg/m3; default {@link SEAWATER_DENSITY}. */
  seawaterDensity?: number;
  /**
   * Density between the mudline (or ground) and the first log sample: 'constant' uses the
   * first usable log density; 'linear' runs linearly from `mudlineDensity` (default
   * {@link DEFAULT_MUDLINE_DENSITY}) to the first usable log density. Default 'linear'.
   */
  shallowFill?: { kind: 'constant' } | { kind: 'linear'; mudlineDensity?: number };
  /** Curve to use; default the first of {@link DENSITY_CURVE_NAMES} present. */
  densityCurve?: string;
  /** Converts the log's index depth to TVD below rig floor when the index is MD (e.g. from the well's survey). */
  indexToTvd?: (indexDepth: number) => number;
}

/** A vertical-stress profile: the density nodes, Sv at each node, and the choices made. */
export interface VerticalStressProfile extends DensityProfile {
  source: 'density-log' | 'gradient';
}

function mudlineNodes(settings: OverburdenSettings, provenance: string[]): { depth: number[]; density: number[]; mudline: number; surface: string } {
  const rigFloor = settings.rigFloorElevation ?? 0;
  const water = settings.waterDepth ?? 0;
  const seawater = settings.seawaterDensity ?? SEAWATER_DENSITY;
  if (!(rigFloor >= 0) || !(water >= 0) || !(seawater > 0) || !Number.isFinite(rigFloor + water + seawater)) {
    throw new EngineError('bad-argument', `rig floor elevation ${rigFloor} m, water depth ${water} m, sea-water density ${seawater} kg/m3 are not usable`, {}, 'elevation and water depth >= 0, density > 0');
  }
  const depth = [0, rigFloor];
  const density = [0, 0];
  provenance.push(`Depths are TVD below the rig floor; air (no load) over the rig floor elevation of ${rigFloor} m.`);
  if (water > 0) {
    depth.push(rigFloor, rigFloor + water);
    density.push(seawater, seawater);
    provenance.push(`Sea-water column of ${water} m at ${seawater} kg/m3 (common practice value), mudline at ${rigFloor + water} m TVD.`);
  } else {
    provenance.push(`Onshore: ground level at ${rigFloor} m TVD.`);
  }
  return { depth, density, mudline: rigFloor + water, surface: water > 0 ? 'mudline' : 'ground' };
}

function densityFactor(log: DepthLog, name: string, values: Float64Array): { factor: number; note: string } {
  const written = log.curves[name].unit ?? '';
  if (written.trim() && unitDimension(written) === 'density') {
    return { factor: unitFactorToSI(written, 'density'), note: `density curve ${name} in ${normaliseUnitName(written)}` };
  }
  if (written.trim()) {
    throw new EngineError('unknown-unit', `density curve ${name} has unit "${written}", which is not a density unit`, { file: log.fileName }, 'kg/m3, g/cm3 or another density unit');
  }
  const finite = Array.from(values).filter((v) => Number.isFinite(v) && v !== log.nullValue).sort((a, b) => a - b);
  const median = finite.length ? finite[finite.length >> 1] : NaN;
  if (median >= 1 && median <= 5) return { factor: 1000, note: `density curve ${name} has no unit; read as g/cm3 from its magnitude (median ${median})` };
  if (median >= 1000 && median <= 5000) return { factor: 1, note: `density curve ${name} has no unit; read as kg/m3 from its magnitude (median ${median})` };
  throw new EngineError('unknown-unit', `density curve ${name} has no unit and values (median ${median}) that are neither g/cm3 nor kg/m3`, { file: log.fileName }, 'a stated density unit');
}

/**
 * Vertical stress from a bulk-density log: air over the rig floor elevation, the sea
 * water offshore, the stated shallow fill from the mudline to the first usable sample,
 * then the log. Null values (the log's null value, non-finite, outside
 * {@link USABLE_DENSITY_RANGE}) are skipped and the gaps they leave are bridged by a
 * straight line in density between the usable samples either side (stated in the
 * provenance, with every gap over 5 m listed). Below the last sample the last density
 * is held constant (stated). Samples shallower than the mudline are ignored.
 *
 * @param log a DepthLog with a bulk-density curve in kg/m3 or g/cm3 (or another density
 *   unit); index depth in m, TVD or MD (MD converted with `settings.indexToTvd`, else
 *   read as TVD with the assumption stated).
 * @param settings rig floor elevation, water depth (m), sea-water density, shallow fill, curve name.
 * @returns a {@link VerticalStressProfile}; evaluate it with {@link verticalStressAt}.
 * @throws EngineError 'bad-las' when no density curve is found or the depth index is not
 *   monotonic; 'unknown-unit' for a non-density unit; 'too-few-points' with no usable
 *   sample below the mudline; 'bad-argument' for bad settings.
 * @example verticalStressAt(verticalStressFromDensityLog(log, { waterDepth: 120, rigFloorElevation: 25 }), 2000)
 */
export function verticalStressFromDensityLog(log: DepthLog, settings: OverburdenSettings = {}): VerticalStressProfile {
  const provenance: string[] = [];
  const names = Object.keys(log.curves);
  const wanted = settings.densityCurve ? [settings.densityCurve] : DENSITY_CURVE_NAMES;
  const name = wanted.map((w) => names.find((n) => n.toUpperCase() === w.toUpperCase())).find((n) => n !== undefined);
  if (!name) {
    throw new EngineError('bad-las', `no bulk-density curve (${wanted.join(', ')}) in the log; curves are ${names.join(', ') || 'none'}`, { file: log.fileName }, 'a bulk-density curve');
  }
  const values = log.curves[name].values;
  const { factor, note } = densityFactor(log, name, values);
  provenance.push(`Vertical stress from ${log.fileName}: ${note}.`);
  let toTvd: (d: number) => number = (d) => d;
  if (log.indexKind !== 'tvd') {
    if (settings.indexToTvd) {
      toTvd = settings.indexToTvd;
      provenance.push('Log index depths converted to TVD with the well survey.');
    } else {
      provenance.push(`Log index (${log.indexKind}) read as TVD: the well is taken as vertical over the logged interval.`);
    }
  }
  const base = mudlineNodes(settings, provenance);
  const samples: { z: number; rho: number }[] = [];
  let skipped = 0;
  let shallow = 0;
  for (let i = 0; i < log.depth.length; i++) {
    const raw = values[i];
    const rho = raw * factor;
    if (!Number.isFinite(raw) || raw === log.nullValue || rho < USABLE_DENSITY_RANGE[0] || rho > USABLE_DENSITY_RANGE[1]) {
      skipped++;
      continue;
    }
    const z = toTvd(log.depth[i]);
    if (!Number.isFinite(z)) throw new EngineError('bad-las', `depth of sample ${i + 1} is not a number`, { file: log.fileName }, 'finite depths');
    if (z < base.mudline) {
      shallow++;
      continue;
    }
    samples.push({ z, rho });
  }
  if (samples.length > 1 && samples[0].z > samples[samples.length - 1].z) samples.reverse();
  for (let i = 1; i < samples.length; i++) {
    if (!(samples[i].z > samples[i - 1].z)) {
      throw new EngineError('bad-las', `log depths are not monotonic near ${samples[i].z} m`, { file: log.fileName }, 'steadily increasing or decreasing depths');
    }
  }
  if (samples.length === 0) {
    throw new EngineError('too-few-points', `no usable density sample below the ${base.surface} at ${base.mudline} m`, { file: log.fileName }, `density samples in ${USABLE_DENSITY_RANGE[0]}-${USABLE_DENSITY_RANGE[1]} kg/m3`);
  }
  if (skipped) provenance.push(`${skipped} null or unusable density samples skipped (outside ${USABLE_DENSITY_RANGE[0]}-${USABLE_DENSITY_RANGE[1]} kg/m3 or the null value); gaps bridged by a straight line in density.`);
  if (shallow) provenance.push(`${shallow} samples above the ${base.surface} ignored.`);
  const gaps: string[] = [];
  for (let i = 1; i < samples.length; i++) {
    if (samples[i].z - samples[i - 1].z > 5) gaps.push(`${samples[i - 1].z.toFixed(1)}-${samples[i].z.toFixed(1)} m`);
  }
  if (gaps.length) provenance.push(`Gaps over 5 m bridged linearly: ${gaps.slice(0, 20).join(', ')}${gaps.length > 20 ? ` and ${gaps.length - 20} more` : ''}.`);
  const first = samples[0];
  const fill = settings.shallowFill ?? { kind: 'linear' };
  const depth = [...base.depth];
  const density = [...base.density];
  if (first.z > base.mudline) {
    if (fill.kind === 'constant') {
      depth.push(base.mudline);
      density.push(first.rho);
      provenance.push(`From the ${base.surface} (${base.mudline} m) to the first log sample (${first.z} m) the first log density ${first.rho.toFixed(0)} kg/m3 is held constant.`);
    } else {
      const mudlineDensity = fill.mudlineDensity ?? DEFAULT_MUDLINE_DENSITY;
      if (!(mudlineDensity > 0)) throw new EngineError('bad-argument', `mudline density ${mudlineDensity} kg/m3 is not usable`, {}, 'a density > 0');
      depth.push(base.mudline);
      density.push(mudlineDensity);
      provenance.push(`From the ${base.surface} (${base.mudline} m) to the first log sample (${first.z} m) density runs linearly from ${mudlineDensity} kg/m3 (stated ${base.surface} density) to ${first.rho.toFixed(0)} kg/m3.`);
    }
  }
  for (const s of samples) {
    depth.push(s.z);
    density.push(s.rho);
  }
  provenance.push(`Below the last log sample (${samples[samples.length - 1].z} m) its density ${samples[samples.length - 1].rho.toFixed(0)} kg/m3 is held constant.`);
  return { ...integrateDensityProfile(depth, density, 0, provenance), source: 'density-log' };
}

/**
 * Vertical stress from a stated gradient applied below the mudline (offshore, under the
 * sea-water column) or below ground (onshore); air over the rig floor elevation.
 * Common practice overburden gradient: about 1 psi/ft = 22.6 kPa/m (METHODS.md).
 *
 * @param gradient sediment overburden gradient, Pa/m, in (0, 1e5].
 * @param settings rig floor elevation and water depth (m), sea-water density.
 * @returns a {@link VerticalStressProfile}.
 * @throws EngineError 'out-of-range' for a gradient outside (0, 1e5] Pa/m; 'bad-argument' for bad settings.
 * @example verticalStressAt(verticalStressFromGradient(22620), 1000) // 22.62e6 Pa
 */
export function verticalStressFromGradient(gradient: number, settings: OverburdenSettings = {}): VerticalStressProfile {
  if (!(gradient > 0 && gradient <= 1e5)) {
    throw new EngineError('out-of-range', `overburden gradient ${gradient} Pa/m is outside (0, 100000]`, {}, 'a gradient in Pa/m, e.g. 22620');
  }
  const provenance: string[] = [];
  const base = mudlineNodes(settings, provenance);
  const rho = gradient / STANDARD_GRAVITY;
  provenance.push(`Vertical stress from a stated gradient of ${(gradient / 1000).toFixed(3)} kPa/m below the ${settings.waterDepth ? 'mudline' : 'ground'} (density ${rho.toFixed(1)} kg/m3).`);
  const depth = [...base.depth, base.mudline];
  const density = [...base.density, rho];
  return { ...integrateDensityProfile(depth, density, 0, provenance), source: 'gradient' };
}

/**
 * Vertical stress at a depth from a profile (exact integral of the piecewise-linear density).
 *
 * @param profile from {@link verticalStressFromDensityLog} or {@link verticalStressFromGradient}.
 * @param tvd TVD below rig floor, m.
 * @returns Sv, Pa.
 * @throws EngineError 'bad-argument' for a non-finite depth.
 * @example verticalStressAt(profile, 2033) // 4.6e7
 */
export function verticalStressAt(profile: VerticalStressProfile, tvd: number): number {
  return profilePressureAt(profile, tvd);
}
