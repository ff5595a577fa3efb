/**
 * A depth profile of a pressure or stress built from a density that varies linearly
 * between nodes: P(z) = P(z_i) + g [rho_i (z - z_i) + (rho_{i+1} - rho_i)(z - z_i)^2 / (2 dz_i)].
 * The integral of rho g dz is exact for piecewise-linear density (constant density gives
 * rho g z, a linear density the quadratic). Below the deepest node the deepest density
 * is held constant; above the first node (z < depth[0]) the value is P(depth[0]).
 *
 * Used for the vertical stress (density log plus water column) and for pore pressure
 * given as a gradient. All SI: depths TVD m below the rig floor, density kg/m3, Pa.
 */
import { EngineError } from '../errors';
import { STANDARD_GRAVITY } from '../units/quantity';

/** Nodes of a piecewise-linear density and the integrated pressure at each node. */
export interface DensityProfile {
  /** Node depths, TVD m below rig floor, non-decreasing (a repeated depth is a density step). */
  depth: Float64Array;
  /** Density at each node, kg/m3 (linear between nodes). */
  density: Float64Array;
  /** Integrated pressure at each node, Pa (value at the first node plus the integral). */
  pressure: Float64Array;
  /** Plain-language statements of every choice made building the profile. */
  provenance: string[];
}

/**
 * Integrates a piecewise-linear density from the first node down (trapezoid rule, exact
 * for linear density between nodes), g = 9.80665 m/s2 (standard gravity, NIST SP 811).
 * Two nodes at the same depth make a step in density (sea floor, top of a log).
 *
 * @param depth node depths, m, non-decreasing, finite.
 * @param density node densities, kg/m3, finite and >= 0, same length as depth.
 * @param startPressure value at the first node, Pa (default 0).
 * @param provenance statements to carry with the profile.
 * @returns the profile with its integrated pressures.
 * @throws EngineError 'too-few-points' with no node; 'bad-argument' for unequal lengths,
 *   decreasing depths or negative / non-finite densities.
 * @example integrateDensityProfile([0, 1000], [1000, 1000]).pressure[1] // 9806650
 */
export function integrateDensityProfile(
  depth: ArrayLike<number>,
  density: ArrayLike<number>,
  startPressure = 0,
  provenance: string[] = [],
): DensityProfile {
  if (depth.length !== density.length) {
    throw new EngineError('bad-argument', `${depth.length} depths but ${density.length} densities`, {}, 'equal lengths');
  }
  if (depth.length === 0) throw new EngineError('too-few-points', 'a density profile needs at least one node', {}, 'one or more nodes');
  const z = Float64Array.from(depth);
  const rho = Float64Array.from(density);
  const p = new Float64Array(z.length);
  p[0] = startPressure;
  for (let i = 0; i < z.length; i++) {
    if (!Number.isFinite(z[i]) || !Number.isFinite(rho[i]) || rho[i] < 0) {
      throw new EngineError('bad-argument', `node ${i + 1}: depth ${z[i]} m, density ${rho[i]} kg/m3 is not usable`, {}, 'finite depth and a density >= 0');
    }
    if (i > 0) {
      const dz = z[i] - z[i - 1];
      if (!(dz >= 0)) throw new EngineError('bad-argument', `node depths must not decrease (node ${i + 1} at ${z[i]} m)`, {}, 'non-decreasing depths');
      p[i] = p[i - 1] + STANDARD_GRAVITY * 0.5 * (rho[i - 1] + rho[i]) * dz;
    }
  }
  return { depth: z, density: rho, pressure: p, provenance };
}

/**
 * Pressure of a density profile at a depth: exact integral of the piecewise-linear
 * density; constant deepest density below the last node; the first node's value above it.
 *
 * @param profile from {@link integrateDensityProfile}.
 * @param tvd depth, m below rig floor, finite.
 * @returns pressure, Pa.
 * @throws EngineError 'bad-argument' for a non-finite depth.
 * @example profilePressureAt(profile, 1520) // Pa
 */
export function profilePressureAt(profile: DensityProfile, tvd: number): number {
  if (!Number.isFinite(tvd)) throw new EngineError('bad-argument', `depth ${tvd} is not a finite number`, {}, 'a depth in m');
  const { depth: z, density: rho, pressure: p } = profile;
  const n = z.length;
  if (tvd <= z[0]) return p[0];
  if (tvd >= z[n - 1]) return p[n - 1] + STANDARD_GRAVITY * rho[n - 1] * (tvd - z[n - 1]);
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (z[mid] <= tvd) lo = mid;
    else hi = mid;
  }
  const dz = tvd - z[lo];
  const slope = (rho[hi] - rho[lo]) / (z[hi] - z[lo]);
  return p[lo] + STANDARD_GRAVITY * (rho[lo] * dz + 0.5 * slope * dz * dz);
}
