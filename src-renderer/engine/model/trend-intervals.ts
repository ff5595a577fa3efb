/**
 * Depth intervals for a piecewise Shmin trend, from chosen break depths (TVD, m).
 */
import { EngineError } from '../errors';
import type { DepthInterval } from './shmin-trend';

/**
 * Depth intervals split at the given TVDs: [0, b1), [b1, b2), ... [bn, infinity), named
 * by their limits ("0-1500 m", "1500 m and deeper").
 *
 * @param breaks TVDs of the breaks, m, positive, finite (any order; repeats are dropped).
 * @returns the intervals, shallowest first; one interval from 0 with no breaks.
 * @throws EngineError 'bad-argument' for a non-positive or non-finite break.
 * @example intervalsFromBreaks([1500]) // [{name: '0-1500 m', top: 0, base: 1500}, {name: '1500 m and deeper', top: 1500, base: Infinity}]
 */
export function intervalsFromBreaks(breaks: number[]): DepthInterval[] {
  for (const b of breaks) {
    if (!(b > 0) || !Number.isFinite(b)) throw new EngineError('bad-argument', `trend break at ${b} m is not usable`, {}, 'a TVD > 0 m');
  }
  const sorted = [...new Set(breaks)].sort((a, b) => a - b);
  const edges = [0, ...sorted];
  return edges.map((top, i) => {
    const base = i + 1 < edges.length ? edges[i + 1] : Infinity;
    return { name: base === Infinity ? (top === 0 ? 'all depths' : `${top} m and deeper`) : `${top}-${base} m`, top, base };
  });
}
