/**
 * System stiffness: the loading slope a leak-off or formation-integrity test should show
 * if the pressurised fluid were the only compliance, dP/dV = 1 / (c_eff V)
 * (METHODS.md "System stiffness"; Bourgoyne et al., Applied Drilling Engineering, 1986,
 * ch. 3, from memory). Field slopes are softer (air, casing expansion, filtration,
 * temperature; Altun, Langlinais & Bourgoyne 2001, SPE D&C 16(2)), so the expected slope
 * is an upper bound and measured / expected is a quality signal.
 *
 * Results are for review by a qualified engineer; they are not a substitute for the
 * operator's well-control policy and defer to local regulations and licensed practice.
 */
import { EngineError } from '../errors';
import type { TestMetadata } from '../record';

/** Pascals per psi (NIST SP 811 App. B.8: 6.894 757 E+03; exact from lbf and in). */
const PASCAL_PER_PSI = (0.45359237 * 9.80665) / (0.0254 * 0.0254);

/**
 * Compressibilities of mud components, 1/Pa, converted from the per-psi values in
 * METHODS.md: water 3.0e-6/psi, oil 5.0e-6/psi, solids 0.2e-6/psi (Bourgoyne et al. 1986,
 * ch. 3, from memory; not checked against the book).
 */
export const COMPONENT_COMPRESSIBILITY = {
  water: 3.0e-6 / PASCAL_PER_PSI,
  oil: 5.0e-6 / PASCAL_PER_PSI,
  solids: 0.2e-6 / PASCAL_PER_PSI,
} as const;

/** Volume fractions of a mud, each in [0, 1], summing to 1. Missing components are 0. */
export interface MudFractions {
  water?: number;
  oil?: number;
  solids?: number;
}

/**
 * Base fluid named by a mud type as written in a report: 'oil' for oil-based and
 * synthetic-based muds (OBM, SBM, NAF, invert emulsion, diesel, mineral oil), 'water' for
 * water-based muds, brines and sea water, null when the text says neither.
 *
 * @param mudType free text, e.g. "Water-based", "OBM", "KCl brine".
 * @returns 'water' | 'oil' | null. Never throws.
 * @example mudBaseFluid('SBM') // 'oil'
 */
export function mudBaseFluid(mudType: string | undefined): 'water' | 'oil' | null {
  if (!mudType) return null;
  const text = mudType.toLowerCase();
  if (/\b(obm|sbm|naf|non-aqueous|oil|synthetic|invert|diesel|mineral|ester|olefin|paraffin)/.test(text)) return 'oil';
  if (/\b(wbm|water|brine|kcl|nacl|cacl|sea ?water|fresh|polymer|spud|bentonite|glycol)/.test(text)) return 'water';
  return null;
}

/**
 * Effective compressibility of a mud, c_eff = sum of volume fraction x component
 * compressibility (METHODS.md; Bourgoyne et al. 1986 ch. 3, from memory).
 *
 * Without fractions the mud is taken as its base liquid alone (all water for water-based
 * or unrecognised types, all oil for oil-based): an assumption, stated here, that errs
 * towards the softer liquid and ignores the stiffer solids.
 *
 * @param mudType free text naming the mud (optional; water-based by default).
 * @param fractions volume fractions of water, oil and solids, each 0..1, sum 1 (+-0.001).
 * @returns compressibility, 1/Pa (4.35e-10 for water).
 * @throws EngineError 'bad-argument' when a fraction is outside 0..1 or they do not sum to 1.
 * @example mudCompressibility('WBM', { water: 0.9, solids: 0.1 }) // about 3.94e-10
 */
export function mudCompressibility(mudType?: string, fractions?: MudFractions): number {
  if (!fractions) {
    return mudBaseFluid(mudType) === 'oil' ? COMPONENT_COMPRESSIBILITY.oil : COMPONENT_COMPRESSIBILITY.water;
  }
  const water = fractions.water ?? 0;
  const oil = fractions.oil ?? 0;
  const solids = fractions.solids ?? 0;
  for (const [name, f] of [['water', water], ['oil', oil], ['solids', solids]] as const) {
    if (!Number.isFinite(f) || f < 0 || f > 1) {
      throw new EngineError('bad-argument', `${name} fraction ${f} is outside 0..1`, {}, 'a volume fraction from 0 to 1');
    }
  }
  const total = water + oil + solids;
  if (Math.abs(total - 1) > 1e-3) {
    throw new EngineError('bad-argument', `mud fractions sum to ${total}, not 1`, {}, 'water + oil + solids = 1');
  }
  return water * COMPONENT_COMPRESSIBILITY.water + oil * COMPONENT_COMPRESSIBILITY.oil + solids * COMPONENT_COMPRESSIBILITY.solids;
}

function positive(meta: TestMetadata, key: keyof TestMetadata): number | undefined {
  const value = meta[key];
  if (value === undefined || value === null) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new EngineError('bad-metadata', `${String(key)} is ${String(value)}`, {}, `${String(key)} as a finite number >= 0 (SI)`);
  }
  return value;
}

/**
 * Volume of fluid under compression from the well geometry: casing bore
 * (pi/4 ID^2 x shoe MD) + open hole below the shoe (pi/4 d_hole^2 x length) + surface
 * lines when given. The open-hole length is `openHoleLength`, else depthMd - casingShoeMd,
 * else 0 (a test right after drilling out a few metres). Drill-pipe displacement and
 * annulus details are ignored (common practice approximation).
 *
 * @param meta test metadata, SI: casingInnerDiameter m, casingShoeMd m, holeDiameter m,
 *   openHoleLength m, depthMd m, surfaceLineVolume m3.
 * @returns volume, m3, or null when the casing ID or shoe depth is missing, or when there
 *   is open hole of known length but unknown diameter.
 * @throws EngineError 'bad-metadata' for a negative or non-finite dimension.
 * @example systemVolumeFromGeometry({ casingInnerDiameter: 0.2245, casingShoeMd: 2000 }) // 79.2 m3
 */
export function systemVolumeFromGeometry(meta: TestMetadata): number | null {
  const casingId = positive(meta, 'casingInnerDiameter');
  const shoeMd = positive(meta, 'casingShoeMd');
  const holeDiameter = positive(meta, 'holeDiameter');
  const surface = positive(meta, 'surfaceLineVolume') ?? 0;
  const depthMd = positive(meta, 'depthMd');
  if (casingId === undefined || shoeMd === undefined) return null;
  let openHole = positive(meta, 'openHoleLength');
  if (openHole === undefined) openHole = depthMd !== undefined && depthMd > shoeMd ? depthMd - shoeMd : 0;
  if (openHole > 0 && holeDiameter === undefined) return null;
  const casingVolume = (Math.PI / 4) * casingId * casingId * shoeMd;
  const openHoleVolume = openHole > 0 ? (Math.PI / 4) * (holeDiameter as number) ** 2 * openHole : 0;
  return casingVolume + openHoleVolume + surface;
}

/** Expected loading slope and the inputs it came from. */
export interface ExpectedLoadingSlope {
  /** dP/dV = 1/(c V), Pa/m3. */
  slope: number;
  /** Volume under compression, m3. */
  volume: number;
  /** Effective compressibility, 1/Pa. */
  compressibility: number;
  /** Where the volume came from: the metadata's systemVolume, or the well geometry. */
  source: 'given' | 'geometry';
}

/**
 * Expected loading slope dP/dV = 1/(c_eff V) of a pressure test (METHODS.md "System
 * stiffness"). V is `systemVolume` when given, else {@link systemVolumeFromGeometry};
 * c_eff is `compressibility` when given, else {@link mudCompressibility} of `mudType`.
 * Casing and hole expansion are not included, so real slopes are expected to be softer.
 * At a constant rate q the pressure-time slope is q times this value.
 *
 * @param meta test metadata (SI).
 * @returns slope Pa/m3 with its volume, compressibility and volume source, or null when
 *   no volume can be found or the volume is 0.
 * @throws EngineError 'bad-metadata' for a non-positive given compressibility or bad geometry.
 * @example expectedLoadingSlope({ systemVolume: 50 }) // slope about 4.6e7 Pa/m3 for water
 */
export function expectedLoadingSlope(meta: TestMetadata): ExpectedLoadingSlope | null {
  const given = positive(meta, 'systemVolume');
  const volume = given ?? systemVolumeFromGeometry(meta);
  if (volume === null || volume === undefined || !(volume > 0)) return null;
  let compressibility: number;
  if (meta.compressibility !== undefined) {
    if (!(meta.compressibility > 0) || !Number.isFinite(meta.compressibility)) {
      throw new EngineError('bad-metadata', `compressibility is ${meta.compressibility}`, {}, 'a compressibility > 0 in 1/Pa');
    }
    compressibility = meta.compressibility;
  } else {
    compressibility = mudCompressibility(meta.mudType);
  }
  return { slope: 1 / (compressibility * volume), volume, compressibility, source: given !== undefined ? 'given' : 'geometry' };
}
