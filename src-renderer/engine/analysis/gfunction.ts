/**
 * Nolte's G-function of dimensionless shut-in time, the abscissa of the G-function
 * closure plots (Nolte 1979, SPE 8341; METHODS.md "Closure picks on the shut-in decline").
 *
 *   dtD = (t - t_shutin) / tp,  G(dtD) = (4/pi) (g(dtD) - g0)
 *   alpha = 1:   g = (4/3) [(1 + dtD)^1.5 - dtD^1.5],           g0 = 4/3
 *   alpha = 1/2: g = (1 + dtD) asin((1 + dtD)^-0.5) + dtD^0.5,  g0 = pi/2
 *
 * Evaluated in rearranged forms that avoid cancellation: for alpha = 1,
 * (1+d)^1.5 - 1 = expm1(1.5 log1p(d)) when d <= 1 and d^1.5 expm1(1.5 log1p(1/d)) beyond;
 * for alpha = 1/2, asin((1+d)^-0.5) = atan(1/sqrt d) gives g - g0 = d atan(1/sqrt d) +
 * (sqrt d - atan(sqrt d)), two non-negative terms, the second by its series for small d.
 *
 * Results feed closure picks for review by a qualified engineer; they are not a
 * substitute for the operator's well-control policy and defer to local regulations and
 * licensed practice.
 */
import { EngineError } from '../errors';

/** Fracture-growth exponent of the G-function: 1 low-efficiency (area grows linearly), 1/2 high-efficiency. */
export type GFunctionAlpha = 0.5 | 1;

/** sqrt(s) - atan(sqrt(s)) written as s - atan(s) for s = sqrt(dtD); series below 0.1. */
function differenceFromArctangent(s: number): number {
  if (s >= 0.1) return s - Math.atan(s);
  // s - atan(s) = s^3/3 - s^5/5 + s^7/7 - ...; s < 0.1 so 8 terms reach double precision.
  const s2 = s * s;
  let term = s * s2;
  let sum = 0;
  for (let k = 0; k < 8; k++) {
    sum += (k % 2 === 0 ? 1 : -1) * term / (2 * k + 3);
    term *= s2;
  }
  return sum;
}

/**
 * Nolte's G-function G(dtD) for dimensionless shut-in time dtD = (t - t_shutin)/tp.
 *
 * Method: Nolte (1979), SPE 8341, as written in METHODS.md; check values G(0.1) = 0.2072,
 * G(1) = 1.4064, G(4) = 3.7015 (alpha 1), G(1) = 4/pi, G(9) = 5.9164 (alpha 1/2).
 * Limits: G(0) = 0, G increasing; small dtD: G ~ 8 dtD/pi (alpha 1), 2 dtD (alpha 1/2);
 * large dtD: G ~ (4/pi)(2 sqrt(dtD) - 4/3) (alpha 1), 8 sqrt(dtD)/pi - 2 (alpha 1/2).
 *
 * @param dtD dimensionless shut-in time, >= 0, finite (dimensionless).
 * @param alpha 1 (default, low-efficiency) or 0.5 (high-efficiency).
 * @returns G, dimensionless, >= 0.
 * @throws EngineError 'out-of-range' for negative or non-finite dtD; 'bad-argument' for another alpha.
 * @example gFunction(1) // 1.40643...
 */
export function gFunction(dtD: number, alpha: GFunctionAlpha = 1): number {
  if (!Number.isFinite(dtD) || dtD < 0) {
    throw new EngineError('out-of-range', `dimensionless shut-in time ${dtD} is not a finite number >= 0`, {}, 'dtD >= 0');
  }
  if (alpha === 1) {
    let difference: number; // g - g0 = (4/3) [(1+d)^1.5 - d^1.5 - 1]
    if (dtD <= 1) difference = Math.expm1(1.5 * Math.log1p(dtD)) - dtD * Math.sqrt(dtD);
    else difference = dtD * Math.sqrt(dtD) * Math.expm1(1.5 * Math.log1p(1 / dtD)) - 1;
    return (4 / Math.PI) * (4 / 3) * difference;
  }
  if (alpha === 0.5) {
    const s = Math.sqrt(dtD);
    const difference = (dtD === 0 ? 0 : dtD * Math.atan(1 / s)) + differenceFromArctangent(s);
    return (4 / Math.PI) * difference;
  }
  throw new EngineError('bad-argument', `G-function exponent ${String(alpha)} is not supported`, {}, 'alpha 1 or 0.5');
}

/**
 * G-function values for the samples shutInIndex..endIndex of a record, with
 * dtD = (time[i] - time[shutInIndex]) / pumpingTime (Nolte 1979, SPE 8341).
 *
 * @param time elapsed time, s, strictly increasing.
 * @param shutInIndex index of the shut-in instant (the last pumping sample), G = 0 there.
 * @param endIndex last shut-in sample (inclusive), >= shutInIndex, < time.length.
 * @param pumpingTime pumping duration tp of the cycle, s, > 0.
 * @param alpha 1 (default) or 0.5.
 * @returns Float64Array of length endIndex - shutInIndex + 1 (element 0 is the shut-in).
 * @throws EngineError 'out-of-range' for bad indices, tp <= 0 or time running backwards;
 *   'bad-argument' for another alpha.
 * @example gFunctionSeries(time, cycle.pumpEnd, cycle.shutInEnd, tPump)
 */
export function gFunctionSeries(
  time: ArrayLike<number>,
  shutInIndex: number,
  endIndex: number,
  pumpingTime: number,
  alpha: GFunctionAlpha = 1,
): Float64Array {
  if (!Number.isInteger(shutInIndex) || !Number.isInteger(endIndex) || shutInIndex < 0 || endIndex < shutInIndex || endIndex >= time.length) {
    throw new EngineError('out-of-range', `shut-in range [${shutInIndex}, ${endIndex}] is outside 0..${time.length - 1}`, {}, 'shutInIndex <= endIndex inside the record');
  }
  if (!(pumpingTime > 0) || !Number.isFinite(pumpingTime)) {
    throw new EngineError('out-of-range', `pumping time ${pumpingTime} s is not positive`, {}, 'a pumping time > 0 s');
  }
  const t0 = time[shutInIndex];
  const out = new Float64Array(endIndex - shutInIndex + 1);
  for (let i = shutInIndex; i <= endIndex; i++) {
    const dtD = (time[i] - t0) / pumpingTime;
    if (!(dtD >= 0)) {
      throw new EngineError('time-not-increasing', `time at index ${i} is before the shut-in time`, {}, 'time increasing after the shut-in');
    }
    out[i - shutInIndex] = gFunction(dtD, alpha);
  }
  return out;
}
