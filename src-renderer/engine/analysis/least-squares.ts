/**
 * Least-squares fitting: straight lines (with and without intercept), a general
 * linear model solved by Householder QR, and a running line fit for scanning long
 * records. Numerically careful: centred two-pass sums for lines, QR (never the normal
 * equations) for the general model, verified against the NIST StRD linear regression
 * reference datasets (Norris, Pontius, NoInt1, NoInt2, Longley).
 *
 * Results feed picks that are for review by a qualified engineer; they are not a
 * substitute for the operator's well-control policy and defer to local regulations
 * and licensed practice.
 */
import { EngineError } from '../errors';
import type { LineFit } from '../result';

/** A line fit with the standard errors of its two coefficients (or of the slope alone). */
export interface LineFitWithErrors extends LineFit {
  /** Standard error of the slope, same units as the slope. */
  slopeStandardError: number;
  /** Standard error of the intercept (0 for a fit through the origin). */
  interceptStandardError: number;
}

/** Result of {@link fitLinearModel}. */
export interface LinearModelFit {
  /** Fitted coefficients; with an intercept, coefficients[0] is the intercept, then one per predictor. */
  coefficients: number[];
  /** Standard error of each coefficient, sqrt(diag((X'X)^-1) RSS/(n-p)). */
  standardErrors: number[];
  /** Residual standard deviation sqrt(RSS/(n-p)); 0 when n = p. */
  residualSd: number;
  /** Centred R2 with an intercept, uncentred 1 - RSS/sum(y^2) without. */
  r2: number;
  /** Residual sum of squares. */
  rss: number;
  /** n - p. */
  degreesOfFreedom: number;
}

function checkRange(x: ArrayLike<number>, y: ArrayLike<number>, start: number, end: number, minPoints: number): void {
  if (x.length !== y.length) {
    throw new EngineError('bad-argument', `x has ${x.length} values but y has ${y.length}`, {}, 'x and y of equal length');
  }
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end >= x.length) {
    throw new EngineError('out-of-range', `fit range [${start}, ${end}] is outside 0..${x.length - 1}`, {}, 'integer indices inside the arrays');
  }
  if (end - start + 1 < minPoints) {
    throw new EngineError('too-few-points', `a fit needs at least ${minPoints} points, got ${Math.max(0, end - start + 1)}`, {}, `${minPoints} or more points`);
  }
  for (let i = start; i <= end; i++) {
    if (!Number.isFinite(x[i]) || !Number.isFinite(y[i])) {
      throw new EngineError('bad-argument', `value at index ${i} is not a finite number`, {}, 'finite x and y');
    }
  }
}

/**
 * Ordinary least-squares straight line y = intercept + slope x over samples
 * start..end (inclusive), computed with centred two-pass sums (means first, then
 * centred co-moments, then residuals directly) so that large offsets in x or y (e.g.
 * times of 1e6 s, pressures of 5e7 Pa) lose no precision. Verified on NIST StRD
 * Norris to better than 1e-12 relative.
 *
 * @param x abscissa, any unit, finite values, not all equal in the range.
 * @param y ordinate, any unit, finite values.
 * @param start first index (inclusive), default 0.
 * @param end last index (inclusive), default x.length - 1.
 * @returns slope, intercept, centred R2 (1 when y is constant and fitted exactly),
 *   residualSd = sqrt(RSS/(n-2)) (0 for n = 2, where it is undefined), n, start, end,
 *   plus the standard errors of slope and intercept (0 for n = 2).
 * @throws EngineError 'too-few-points' for fewer than 2 points; 'singular-matrix' when all
 *   x are equal; 'out-of-range' for bad indices; 'bad-argument' for unequal lengths or
 *   non-finite values.
 * @example fitLine([0, 1, 2], [1, 3, 5]) // slope 2, intercept 1, r2 1
 */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>, start = 0, end = x.length - 1): LineFitWithErrors {
  checkRange(x, y, start, end, 2);
  const n = end - start + 1;
  let sumX = 0;
  let sumY = 0;
  for (let i = start; i <= end; i++) {
    sumX += x[i];
    sumY += y[i];
  }
  let meanX = sumX / n;
  let meanY = sumY / n;
  // Correct the means with the mean of the deviations (removes the rounding of the first pass).
  let corrX = 0;
  let corrY = 0;
  for (let i = start; i <= end; i++) {
    corrX += x[i] - meanX;
    corrY += y[i] - meanY;
  }
  meanX += corrX / n;
  meanY += corrY / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = start; i <= end; i++) {
    const dx = x[i] - meanX;
    const dy = y[i] - meanY;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  if (!(sxx > 0)) {
    throw new EngineError('singular-matrix', `all x values in [${start}, ${end}] are equal`, {}, 'at least two distinct x values');
  }
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  let rss = 0;
  for (let i = start; i <= end; i++) {
    const r = y[i] - meanY - slope * (x[i] - meanX);
    rss += r * r;
  }
  const variance = n > 2 ? rss / (n - 2) : 0;
  const residualSd = Math.sqrt(variance);
  const r2 = syy > 0 ? 1 - rss / syy : 1;
  return {
    slope,
    intercept,
    r2,
    residualSd,
    n,
    start,
    end,
    slopeStandardError: Math.sqrt(variance / sxx),
    interceptStandardError: Math.sqrt(variance * (1 / n + (meanX * meanX) / sxx)),
  };
}

/**
 * Least-squares line through the origin y = slope x over samples start..end. R2 is the
 * uncentred 1 - RSS/sum(y^2), the definition NIST StRD certifies for NoInt1 and NoInt2.
 *
 * @param x abscissa, finite, not all zero. @param y ordinate, finite.
 * @param start first index (inclusive). @param end last index (inclusive).
 * @returns intercept 0, residualSd = sqrt(RSS/(n-1)) (one fitted parameter; 0 for n = 1),
 *   slopeStandardError = residualSd / sqrt(sum x^2).
 * @throws EngineError 'too-few-points' for no points; 'singular-matrix' when all x are 0;
 *   'out-of-range', 'bad-argument' as {@link fitLine}.
 * @example fitLineThroughOrigin([1, 2], [2, 4]) // slope 2
 */
export function fitLineThroughOrigin(x: ArrayLike<number>, y: ArrayLike<number>, start = 0, end = x.length - 1): LineFitWithErrors {
  checkRange(x, y, start, end, 1);
  const n = end - start + 1;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = start; i <= end; i++) {
    sxx += x[i] * x[i];
    sxy += x[i] * y[i];
    syy += y[i] * y[i];
  }
  if (!(sxx > 0)) throw new EngineError('singular-matrix', 'all x values are zero', {}, 'at least one non-zero x');
  const slope = sxy / sxx;
  let rss = 0;
  for (let i = start; i <= end; i++) {
    const r = y[i] - slope * x[i];
    rss += r * r;
  }
  const variance = n > 1 ? rss / (n - 1) : 0;
  return {
    slope,
    intercept: 0,
    r2: syy > 0 ? 1 - rss / syy : 1,
    residualSd: Math.sqrt(variance),
    n,
    start,
    end,
    slopeStandardError: Math.sqrt(variance / sxx),
    interceptStandardError: 0,
  };
}

/**
 * Multiple linear regression y = b0 + sum_j b_j x_j (or without b0) by Householder QR
 * of the design matrix, after centring the predictors and y when an intercept is fitted,
 * with one step of iterative refinement. Standard errors come from R^-1 (never from
 * inverting X'X). Reproduces NIST StRD Longley (condition number about 1e9 after centring)
 * and Pontius (quadratic) to better than 1e-10 relative.
 *
 * @param columns predictor columns, each of length n (any units, finite).
 * @param y response, length n, finite.
 * @param options.intercept whether to fit the intercept b0.
 * @returns coefficients (intercept first when fitted), their standard errors, residualSd =
 *   sqrt(RSS/(n-p)) (0 when n = p), R2 (centred with intercept, uncentred without), RSS, n-p.
 * @throws EngineError 'too-few-points' when n < p; 'singular-matrix' when the columns are
 *   linearly dependent (to rounding); 'bad-argument' for ragged or non-finite input.
 * @example fitLinearModel([x, x.map((v) => v * v)], y, { intercept: true }) // quadratic
 */
export function fitLinearModel(columns: number[][], y: number[], options: { intercept: boolean }): LinearModelFit {
  const n = y.length;
  const k = columns.length;
  const p = k + (options.intercept ? 1 : 0);
  for (let j = 0; j < k; j++) {
    if (columns[j].length !== n) {
      throw new EngineError('bad-argument', `predictor ${j + 1} has ${columns[j].length} values but y has ${n}`, {}, 'columns of equal length');
    }
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(y[i]) || columns.some((c) => !Number.isFinite(c[i]))) {
      throw new EngineError('bad-argument', `row ${i + 1} has a value that is not a finite number`, {}, 'finite values');
    }
  }
  if (p === 0) throw new EngineError('bad-argument', 'a model needs at least one parameter', {}, 'a predictor or an intercept');
  if (n < p) throw new EngineError('too-few-points', `${p} parameters need at least ${p} observations, got ${n}`, {}, `${p} or more rows`);

  // Design matrix, column-major; with an intercept the predictors and y are centred and
  // the intercept is recovered afterwards (equivalent to the full model, better conditioned).
  const means = new Array<number>(k).fill(0);
  let meanY = 0;
  if (options.intercept) {
    for (let j = 0; j < k; j++) means[j] = accurateMean(columns[j]);
    meanY = accurateMean(y);
  }
  const a: Float64Array[] = columns.map((c, j) => Float64Array.from(c, (v) => v - means[j]));
  const yc = Float64Array.from(y, (v) => v - meanY);
  const qr = householderQr(a, n);
  let b = qr.solve(yc);
  // One step of iterative refinement on the residual of the centred problem.
  const residual = residualOf(a, yc, b);
  const correction = qr.solve(residual);
  b = b.map((v, j) => v + correction[j]);
  const finalResidual = residualOf(a, yc, b);
  let rss = 0;
  for (let i = 0; i < n; i++) rss += finalResidual[i] * finalResidual[i];
  const dof = n - p;
  const variance = dof > 0 ? rss / dof : 0;
  const rInverse = qr.rInverse();
  // diag((Xc'Xc)^-1) = row sums of squares of R^-1.
  const slopeErrors = rInverse.map((row) => Math.sqrt(variance * row.reduce((s, v) => s + v * v, 0)));
  let tss = 0;
  for (let i = 0; i < n; i++) tss += yc[i] * yc[i];
  const r2 = tss > 0 ? 1 - rss / tss : 1;
  if (!options.intercept) {
    return { coefficients: b, standardErrors: slopeErrors, residualSd: Math.sqrt(variance), r2, rss, degreesOfFreedom: dof };
  }
  const intercept = meanY - b.reduce((s, v, j) => s + v * means[j], 0);
  // Var(b0) = s^2 (1/n + m' (Xc'Xc)^-1 m) with m the predictor means; v = R^-T m.
  let quad = 0;
  for (let i = 0; i < k; i++) {
    let v = 0;
    for (let j = 0; j <= i; j++) v += rInverse[j][i] * means[j];
    quad += v * v;
  }
  const interceptError = Math.sqrt(variance * (1 / n + quad));
  return {
    coefficients: [intercept, ...b],
    standardErrors: [interceptError, ...slopeErrors],
    residualSd: Math.sqrt(variance),
    r2,
    rss,
    degreesOfFreedom: dof,
  };
}

/**
 * Least-squares continuous two-segment line with a fixed knot,
 * y = a + b x + c max(0, x - knot): slope b before the knot, b + c after (a linear spline
 * with one knot; common practice). Solved from the centred 2 x 2 normal equations, which is
 * accurate for the short, well-scaled series it serves (derivative curves of a shut-in);
 * use {@link fitLinearModel} for ill-conditioned data.
 *
 * @param x abscissa, finite. @param y ordinate, finite, same length. @param knot x of the joint.
 * @returns a, b, c and the residual sum of squares, or null when the columns are
 *   (nearly) dependent, e.g. the knot outside the data.
 * @throws never (caller validates); non-finite input gives NaN results.
 * @example fitHingedLine([0, 1, 2, 3], [0, 0, 1, 2], 1) // a 0, b 0, c 1
 */
export function fitHingedLine(x: ArrayLike<number>, y: ArrayLike<number>, knot: number): { a: number; b: number; c: number; rss: number } | null {
  const n = x.length;
  let mx = 0;
  let mh = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    mh += Math.max(0, x[i] - knot);
    my += y[i];
  }
  mx /= n;
  mh /= n;
  my /= n;
  let sxx = 0;
  let sxh = 0;
  let shh = 0;
  let sxy = 0;
  let shy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dh = Math.max(0, x[i] - knot) - mh;
    const dy = y[i] - my;
    sxx += dx * dx;
    sxh += dx * dh;
    shh += dh * dh;
    sxy += dx * dy;
    shy += dh * dy;
  }
  const det = sxx * shh - sxh * sxh;
  if (!(det > 1e-12 * sxx * shh)) return null;
  const b = (sxy * shh - shy * sxh) / det;
  const c = (shy * sxx - sxy * sxh) / det;
  const a = my - b * mx - c * mh;
  let rss = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i] - a - b * x[i] - c * Math.max(0, x[i] - knot);
    rss += r * r;
  }
  return { a, b, c, rss };
}

function accurateMean(v: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i];
  const m = s / v.length;
  let c = 0;
  for (let i = 0; i < v.length; i++) c += v[i] - m;
  return m + c / v.length;
}

function residualOf(a: Float64Array[], y: Float64Array, b: number[]): Float64Array {
  const r = Float64Array.from(y);
  for (let j = 0; j < a.length; j++) for (let i = 0; i < r.length; i++) r[i] -= a[j][i] * b[j];
  return r;
}

/** Householder QR of an n x k column-major matrix (copied). */
function householderQr(columns: Float64Array[], n: number) {
  const k = columns.length;
  const a = columns.map((c) => Float64Array.from(c));
  const vs: Float64Array[] = [];
  const betas: number[] = [];
  const rDiag: number[] = [];
  const originalNorms = a.map((c) => columnNorm(c, 0, n));
  for (let j = 0; j < k; j++) {
    const col = a[j];
    const norm = columnNorm(col, j, n);
    if (!(norm > originalNorms[j] * 1e-13)) {
      throw new EngineError('singular-matrix', `predictor ${j + 1} is a linear combination of the others`, {}, 'linearly independent predictors');
    }
    const alpha = col[j] > 0 ? -norm : norm;
    const v = new Float64Array(n);
    for (let i = j; i < n; i++) v[i] = col[i];
    v[j] -= alpha;
    let vv = 0;
    for (let i = j; i < n; i++) vv += v[i] * v[i];
    const beta = 2 / vv;
    for (let c = j; c < k; c++) applyReflector(v, beta, a[c], j, n);
    vs.push(v);
    betas.push(beta);
    rDiag.push(a[j][j]);
  }
  return {
    /** Least-squares solution of A b = rhs. */
    solve(rhs: Float64Array): number[] {
      const qty = Float64Array.from(rhs);
      for (let j = 0; j < k; j++) applyReflector(vs[j], betas[j], qty, j, n);
      const b = new Array<number>(k).fill(0);
      for (let i = k - 1; i >= 0; i--) {
        let s = qty[i];
        for (let c = i + 1; c < k; c++) s -= a[c][i] * b[c];
        b[i] = s / rDiag[i];
      }
      return b;
    },
    /** Upper-triangular R^-1 as rows. */
    rInverse(): number[][] {
      const inv = Array.from({ length: k }, () => new Array<number>(k).fill(0));
      for (let c = 0; c < k; c++) {
        inv[c][c] = 1 / rDiag[c];
        for (let i = c - 1; i >= 0; i--) {
          let s = 0;
          for (let m = i + 1; m <= c; m++) s += a[m][i] * inv[m][c];
          inv[i][c] = -s / rDiag[i];
        }
      }
      return inv;
    },
  };
}

function columnNorm(c: Float64Array, from: number, n: number): number {
  let scale = 0;
  for (let i = from; i < n; i++) scale = Math.max(scale, Math.abs(c[i]));
  if (scale === 0) return 0;
  let s = 0;
  for (let i = from; i < n; i++) s += (c[i] / scale) ** 2;
  return scale * Math.sqrt(s);
}

function applyReflector(v: Float64Array, beta: number, target: Float64Array, from: number, n: number): void {
  let dot = 0;
  for (let i = from; i < n; i++) dot += v[i] * target[i];
  const f = beta * dot;
  if (f === 0) return;
  for (let i = from; i < n; i++) target[i] -= f * v[i];
}

/**
 * A straight-line fit that can grow and shrink one point at a time in O(1), using
 * Welford-style updates of the means and centred co-moments, weighted form after West
 * (1979), Comm. ACM 22(9) (from memory; the bivariate form is common practice). Used to
 * scan long records (1,000,000 samples) for the linear loading part and its departure,
 * and for sliding-window derivatives.
 *
 * Add points with {@link RunningLineFit.add}, drop one with {@link RunningLineFit.remove}
 * (the caller passes the same x, y and weight it added) for a sliding window. A weight is
 * the number of samples a point stands for (e.g. a bin mean), > 0. Accuracy after very
 * many removals degrades slowly; refit with {@link fitLine} for reported numbers.
 *
 * @example const f = new RunningLineFit(); f.add(0, 1); f.add(1, 3); f.slope // 2
 */
export class RunningLineFit {
  private count = 0;
  private weightSum = 0;
  private meanX = 0;
  private meanY = 0;
  private sxx = 0;
  private sxy = 0;
  private syy = 0;

  /** Number of points in the fit. */
  get n(): number {
    return this.count;
  }

  /** Sum of the weights of the points in the fit. */
  get totalWeight(): number {
    return this.weightSum;
  }

  /** Add a point (finite x and y, weight > 0; not checked, for speed). */
  add(x: number, y: number, weight = 1): void {
    this.count++;
    this.weightSum += weight;
    const dx = x - this.meanX;
    const dy = y - this.meanY;
    const f = weight / this.weightSum;
    this.meanX += dx * f;
    this.meanY += dy * f;
    this.sxx += weight * dx * (x - this.meanX);
    this.sxy += weight * dx * (y - this.meanY);
    this.syy += weight * dy * (y - this.meanY);
  }

  /** Remove a point previously added with the same weight. Throws EngineError 'too-few-points' when empty. */
  remove(x: number, y: number, weight = 1): void {
    if (this.count === 0) throw new EngineError('too-few-points', 'cannot remove a point from an empty fit');
    if (this.count === 1) {
      this.clear();
      return;
    }
    const remaining = this.weightSum - weight;
    const previousX = this.meanX - (weight * (x - this.meanX)) / remaining;
    const previousY = this.meanY - (weight * (y - this.meanY)) / remaining;
    this.sxx -= weight * (x - previousX) * (x - this.meanX);
    this.sxy -= weight * (x - previousX) * (y - this.meanY);
    this.syy -= weight * (y - previousY) * (y - this.meanY);
    this.meanX = previousX;
    this.meanY = previousY;
    this.weightSum = remaining;
    this.count--;
    if (this.sxx < 0) this.sxx = 0;
    if (this.syy < 0) this.syy = 0;
  }

  /** Remove every point. */
  clear(): void {
    this.count = 0;
    this.weightSum = this.meanX = this.meanY = this.sxx = this.sxy = this.syy = 0;
  }

  /** Weighted centred sum of squares of x (0 when all x are equal). */
  get spreadX(): number {
    return this.sxx;
  }

  /** Slope; NaN with fewer than 2 points or all x equal. */
  get slope(): number {
    return this.count >= 2 && this.sxx > 0 ? this.sxy / this.sxx : NaN;
  }

  /** Intercept at x = 0; NaN when the slope is. */
  get intercept(): number {
    return this.meanY - this.slope * this.meanX;
  }

  /** Weighted residual sum of squares (never negative); NaN when the slope is. */
  get rss(): number {
    if (this.count < 2 || !(this.sxx > 0)) return NaN;
    return Math.max(0, this.syy - (this.sxy * this.sxy) / this.sxx);
  }

  /** Centred R2; 1 when y is constant. NaN when the slope is. */
  get r2(): number {
    if (this.count < 2 || !(this.sxx > 0)) return NaN;
    return this.syy > 0 ? 1 - this.rss / this.syy : 1;
  }

  /** sqrt(RSS/(n-2)) with n the number of points; 0 for n = 2; NaN with fewer than 2 points. */
  get residualSd(): number {
    if (this.count < 2) return NaN;
    return this.count > 2 ? Math.sqrt(this.rss / (this.count - 2)) : 0;
  }

  /** Predicted y at x (NaN when the slope is). */
  predict(x: number): number {
    return this.meanY + this.slope * (x - this.meanX);
  }
}
