/**
 * A reduced copy of one cycle for the shut-in methods, so that long shut-ins (hours at
 * high sampling rates, hundreds of thousands of samples) cost little time and memory.
 *
 * Method (the engine's own): the first pumping sample (for the pumping time tp), the last
 * `fullResolution` pumping samples and the first `fullResolution` shut-in samples are
 * kept as recorded (friction drop, ISIP, early decline); later shut-in samples are
 * thinned to every k-th sample so that at most `maxSamples` remain. Thinning, not
 * averaging, keeps each sample's noise as recorded, so noise estimates and derivative
 * errors of the shut-in methods stay consistent; their binning (hundreds of bins)
 * averages many samples per bin either way. Sample indices map back through `indexMap`.
 */
import type { Cycle } from '../result';

/** Defaults of {@link reducedShutIn}. */
export const SHUT_IN_REDUCTION = { maxSamples: 20000, fullResolution: 4000 } as const;

/** A cycle re-indexed onto reduced arrays. */
export interface ReducedShutIn {
  time: Float64Array;
  pressure: Float64Array;
  /** The cycle with pumpStart, pumpEnd and shutInEnd on the reduced arrays. */
  cycle: Cycle;
  /** Reduced index -> record sample index. */
  indexMap: Int32Array;
}

/**
 * The reduced arrays of a cycle whose shut-in is longer than `maxSamples`, or null when
 * the cycle is short enough to use as recorded.
 *
 * @param time s. @param pressure Pa (downhole). @param cycle the cycle (record indices).
 * @param maxSamples most shut-in samples kept, >= 2 x fullResolution (default 20,000).
 * @param fullResolution samples kept as recorded at each side of the shut-in instant (default 4,000).
 * @returns reduced arrays, re-indexed cycle and index map; null when no reduction is needed.
 * @example const r = reducedShutIn(time, p, cycle); const isip = isipPick(r.time, r.pressure, r.cycle);
 */
export function reducedShutIn(
  time: Float64Array,
  pressure: Float64Array,
  cycle: Cycle,
  maxSamples: number = SHUT_IN_REDUCTION.maxSamples,
  fullResolution: number = SHUT_IN_REDUCTION.fullResolution,
): ReducedShutIn | null {
  const shutInSamples = cycle.shutInEnd - cycle.pumpEnd;
  if (shutInSamples <= maxSamples) return null;
  const pumpFrom = Math.max(cycle.pumpStart + 1, cycle.pumpEnd - fullResolution + 1);
  const denseEnd = Math.min(cycle.shutInEnd, cycle.pumpEnd + fullResolution);
  const remaining = cycle.shutInEnd - denseEnd;
  const stride = Math.max(1, Math.ceil(remaining / Math.max(1, maxSamples - fullResolution)));
  const indices: number[] = [cycle.pumpStart];
  for (let i = pumpFrom; i <= denseEnd; i++) indices.push(i);
  for (let i = denseEnd + stride; i <= cycle.shutInEnd; i += stride) indices.push(i);
  if (indices[indices.length - 1] !== cycle.shutInEnd) indices.push(cycle.shutInEnd);
  const indexMap = Int32Array.from(indices);
  const t = new Float64Array(indexMap.length);
  const p = new Float64Array(indexMap.length);
  for (let k = 0; k < indexMap.length; k++) {
    t[k] = time[indexMap[k]];
    p[k] = pressure[indexMap[k]];
  }
  const pumpEnd = 1 + (cycle.pumpEnd - pumpFrom);
  return {
    time: t,
    pressure: p,
    cycle: { ...cycle, pumpStart: 0, pumpEnd: cycle.pumpStart === cycle.pumpEnd ? 0 : pumpEnd, shutInEnd: indexMap.length - 1 },
    indexMap,
  };
}
