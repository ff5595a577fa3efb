/**
 * Student's t distribution: cumulative distribution and its inverse (quantiles), for the
 * confidence and prediction bands of the Shmin trend.
 *
 * Method: the t CDF written through the regularised incomplete beta function,
 * F(t; nu) = 1 - I_x(nu/2, 1/2) / 2 for t >= 0 with x = nu / (nu + t^2) (Abramowitz &
 * Stegun 1964, 26.7.1 and 26.5.27; DLMF 8.17), I_x evaluated by its continued fraction
 * (DLMF 8.17.22) with the modified Lentz algorithm, ln Gamma by the Lanczos
 * approximation (g = 7, nine coefficients). The quantile is found by bracketing and
 * safeguarded Newton steps on the CDF to a relative tolerance of 1e-12.
 */
import { EngineError } from '../errors';

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];

/**
 * Natural logarithm of the gamma function for a positive argument (Lanczos
 * approximation, g = 7; relative accuracy about 1e-15).
 *
 * @param x argument, > 0.
 * @returns ln Gamma(x).
 * @throws EngineError 'out-of-range' when x <= 0 or not finite.
 * @example logGamma(5) // ln 24 = 3.178...
 */
export function logGamma(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) {
    throw new EngineError('out-of-range', `ln Gamma needs a positive argument, got ${x}`, {}, 'x > 0');
  }
  if (x < 0.5) {
    // Reflection: Gamma(x) Gamma(1 - x) = pi / sin(pi x).
    return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  }
  const z = x - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) sum += LANCZOS[i] / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Continued fraction of the incomplete beta function (modified Lentz). */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 10000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-15) return h;
  }
  return h;
}

/**
 * Regularised incomplete beta function I_x(a, b) (DLMF 8.17.2), by its continued
 * fraction, using the symmetry I_x(a, b) = 1 - I_{1-x}(b, a) where that converges faster.
 *
 * @param x in [0, 1]. @param a > 0. @param b > 0.
 * @returns I_x(a, b) in [0, 1].
 * @throws EngineError 'out-of-range' for x outside [0, 1] or non-positive a, b.
 * @example regularisedIncompleteBeta(0.5, 2, 2) // 0.5
 */
export function regularisedIncompleteBeta(x: number, a: number, b: number): number {
  if (!(x >= 0 && x <= 1) || !(a > 0) || !(b > 0)) {
    throw new EngineError('out-of-range', `incomplete beta needs 0 <= x <= 1 and a, b > 0 (got x=${x}, a=${a}, b=${b})`);
  }
  if (x === 0) return 0;
  if (x === 1) return 1;
  const logFront = logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x);
  const front = Math.exp(logFront);
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(a, b, x)) / a;
  return 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

function checkDegrees(degreesOfFreedom: number): void {
  if (!(degreesOfFreedom > 0) || !Number.isFinite(degreesOfFreedom) || degreesOfFreedom > 1e7) {
    throw new EngineError('out-of-range', `degrees of freedom must be in (0, 1e7], got ${degreesOfFreedom}`, {}, 'a positive number of degrees of freedom');
  }
}

/**
 * Cumulative distribution function of Student's t with nu degrees of freedom,
 * P(T <= t) (Abramowitz & Stegun 26.7.1 via 26.5.27).
 *
 * @param t any finite value (+-Infinity give 1 and 0).
 * @param degreesOfFreedom nu in (0, 1e7].
 * @returns probability in [0, 1].
 * @throws EngineError 'out-of-range' for bad degrees of freedom.
 * @example studentTCdf(2.228, 10) // about 0.975
 */
export function studentTCdf(t: number, degreesOfFreedom: number): number {
  checkDegrees(degreesOfFreedom);
  if (Number.isNaN(t)) throw new EngineError('out-of-range', 't is not a number', {}, 'a number');
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const x = degreesOfFreedom / (degreesOfFreedom + t * t);
  const tail = 0.5 * regularisedIncompleteBeta(x, degreesOfFreedom / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** Density of Student's t. */
function studentTDensity(t: number, nu: number): number {
  const logC = logGamma((nu + 1) / 2) - logGamma(nu / 2) - 0.5 * Math.log(nu * Math.PI);
  return Math.exp(logC - ((nu + 1) / 2) * Math.log1p((t * t) / nu));
}

/**
 * Inverse CDF (quantile) of Student's t: the t with P(T <= t) = p. Found by bracketing
 * and safeguarded Newton iteration on {@link studentTCdf}; exact closed forms exist for
 * nu = 1 (tan(pi (p - 1/2))) and nu = 2, which the tests use as checks.
 *
 * @param p probability in (0, 1), e.g. 0.975 for a two-sided 95 % interval.
 * @param degreesOfFreedom nu in (0, 1e7] (n - 2 for a straight-line fit).
 * @returns the quantile t_p(nu).
 * @throws EngineError 'out-of-range' when p is not in (0, 1) or nu is bad.
 * @example studentTQuantile(0.975, 10) // 2.2281 (NIST/SEMATECH e-Handbook table)
 */
export function studentTQuantile(p: number, degreesOfFreedom: number): number {
  checkDegrees(degreesOfFreedom);
  if (!(p > 0 && p < 1)) throw new EngineError('out-of-range', `probability must be in (0, 1), got ${p}`, {}, '0 < p < 1');
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentTQuantile(1 - p, degreesOfFreedom);
  // Bracket [lo, hi] with F(lo) < p <= F(hi).
  let lo = 0;
  let hi = 1;
  while (studentTCdf(hi, degreesOfFreedom) < p) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) return Infinity;
  }
  let t = (lo + hi) / 2;
  for (let i = 0; i < 200; i++) {
    const f = studentTCdf(t, degreesOfFreedom) - p;
    if (f === 0) return t;
    if (f < 0) lo = t;
    else hi = t;
    const density = studentTDensity(t, degreesOfFreedom);
    let next = density > 0 ? t - f / density : NaN;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - t) <= 1e-12 * Math.max(1, Math.abs(t))) return next;
    t = next;
  }
  return t;
}
