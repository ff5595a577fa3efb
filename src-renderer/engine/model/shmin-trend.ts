/**
 * The Shmin trend against TVD from tested values: weighted least squares,
 * Shmin(z) = intercept + gradient z, weights by grade, with confidence and prediction
 * bands from Student's t (Draper & Smith, Applied Regression Analysis, 3rd ed. 1998,
 * ch. 9 weighted least squares; ch. 3 intervals). Lower bounds (FIT) and upper bounds
 * are shown and checked against the trend, never fitted. Outliers are flagged by their
 * externally studentised residual, never dropped.
 *
 * SI: depths TVD m below rig floor, Shmin Pa, gradient Pa/m.
 */
import { fitLinearModel } from '../analysis/least-squares';
import { EngineError } from '../errors';
import type { Grade, ShminKind } from '../result';
import { studentTQuantile } from './student-t';

/**
 * Relative weight of a test in the fit by grade: the fit treats the variance of a test's
 * Shmin as proportional to 1 / weight. A project choice (no published standard maps
 * letter grades to weights; Morawietz et al. 2020 rank magnitude data by quality classes
 * in the same spirit): A 1, B 0.75, C 0.5, D 0.25, E 0 (unusable, never fitted).
 */
export const GRADE_WEIGHTS: Readonly<Record<Grade, number>> = { A: 1, B: 0.75, C: 0.5, D: 0.25, E: 0 };
/** Externally studentised residual above which a test is flagged an outlier (common practice: 2.5). */
export const DEFAULT_OUTLIER_LIMIT = 2.5;
/** Two-sided level of the bands (common practice: 95 %). */
export const DEFAULT_CONFIDENCE = 0.95;

/** One tested value for the trend. */
export interface TrendPoint {
  id: string;
  tvd: number;
  /** Shmin value, Pa. */
  shmin: number;
  kind: ShminKind;
  grade: Grade;
  well?: string;
  formation?: string;
}

/** A named depth interval (a formation or a chosen depth range): top inclusive, base exclusive, m. */
export interface DepthInterval { name: string; top: number; base: number }

/** Group name of tests that carry no formation name when the trend is fitted by formation. */
export const UNNAMED_FORMATION = 'unnamed';

/** Straight line over all depths, or one line per interval (assigned by depth, or by the test's formation name). */
export type TrendShape =
  | { kind: 'linear' }
  | { kind: 'intervals'; intervals: DepthInterval[]; assignBy?: 'depth' | 'formation' };

export interface TrendOptions {
  shape?: TrendShape;
  /** Two-sided band level in (0, 1), default 0.95. */
  confidence?: number;
  /** Outlier flag limit on |studentised residual|, default 2.5. */
  outlierLimit?: number;
}

/** One fitted straight line. */
export interface TrendSegment {
  name: string;
  /** Interval limits, m; null for the all-depth line. */
  top: number | null;
  base: number | null;
  /** Shmin at TVD 0, Pa. */
  intercept: number;
  /** dShmin/dTVD, Pa/m. */
  gradient: number;
  interceptStandardError: number;
  gradientStandardError: number;
  /** Weighted R2 = 1 - sum w e^2 / sum w (y - ybar_w)^2. */
  r2: number;
  n: number;
  degreesOfFreedom: number;
  /** Residual standard deviation for unit weight (a grade-A test), Pa. */
  residualSd: number;
  /** t quantile used for the bands. */
  tQuantile: number;
  weightSum: number;
  /** Weighted mean depth, m, and sum w (z - zbar)^2, m2. */
  meanDepth: number;
  depthSpread: number;
  /** Shallowest and deepest fitted depth, m. */
  dataTop: number;
  dataBase: number;
}

/** What happened to each point. */
export interface TrendPointResult {
  id: string;
  role: 'fitted' | 'lower-bound' | 'upper-bound' | 'excluded';
  /** Why excluded, in plain words. */
  reason?: string;
  weight: number;
  segment?: string;
  /** Trend estimate at the point's depth, Pa (null where no segment covers it). */
  trendValue: number | null;
  /** Shmin - trend, Pa (fitted points). */
  residual?: number;
  /** Externally studentised residual (fitted points; null with too few points). */
  studentisedResidual?: number | null;
  outlier: boolean;
  /** A bound the trend contradicts (trend below a lower bound or above an upper bound). */
  boundViolated?: boolean;
}

export interface ShminTrend {
  segments: TrendSegment[];
  points: TrendPointResult[];
  confidence: number;
  outlierLimit: number;
  gradeWeights: Readonly<Record<Grade, number>>;
  provenance: string[];
}

/** Trend value and bands at one depth, Pa. */
export interface TrendValue {
  estimate: number;
  confidenceLow: number;
  confidenceHigh: number;
  predictionLow: number;
  predictionHigh: number;
  segment: string;
  /** Outside the fitted depth range of its segment. */
  extrapolated: boolean;
}

function fitSegment(name: string, top: number | null, base: number | null, pts: TrendPoint[], confidence: number): TrendSegment {
  const w = pts.map((p) => GRADE_WEIGHTS[p.grade]);
  const root = w.map(Math.sqrt);
  const fit = fitLinearModel([root, pts.map((p, i) => root[i] * p.tvd)], pts.map((p, i) => root[i] * p.shmin), { intercept: false });
  const [intercept, gradient] = fit.coefficients;
  const weightSum = w.reduce((s, v) => s + v, 0);
  const meanDepth = pts.reduce((s, p, i) => s + w[i] * p.tvd, 0) / weightSum;
  const meanShmin = pts.reduce((s, p, i) => s + w[i] * p.shmin, 0) / weightSum;
  const depthSpread = pts.reduce((s, p, i) => s + w[i] * (p.tvd - meanDepth) ** 2, 0);
  const tss = pts.reduce((s, p, i) => s + w[i] * (p.shmin - meanShmin) ** 2, 0);
  const dof = pts.length - 2;
  return {
    name, top, base, intercept, gradient,
    interceptStandardError: fit.standardErrors[0],
    gradientStandardError: fit.standardErrors[1],
    r2: tss > 0 ? 1 - fit.rss / tss : 1,
    n: pts.length,
    degreesOfFreedom: dof,
    residualSd: fit.residualSd,
    tQuantile: studentTQuantile(0.5 + confidence / 2, dof),
    weightSum, meanDepth, depthSpread,
    dataTop: Math.min(...pts.map((p) => p.tvd)),
    dataBase: Math.max(...pts.map((p) => p.tvd)),
  };
}

function segmentValue(s: TrendSegment, tvd: number): TrendValue {
  const estimate = s.intercept + s.gradient * tvd;
  const meanVariance = s.residualSd ** 2 * (1 / s.weightSum + (tvd - s.meanDepth) ** 2 / s.depthSpread);
  // A new test of unit weight (grade A): variance s^2 / 1 on top of the mean's.
  const newVariance = s.residualSd ** 2 + meanVariance;
  const c = s.tQuantile * Math.sqrt(meanVariance);
  const p = s.tQuantile * Math.sqrt(newVariance);
  return {
    estimate,
    confidenceLow: estimate - c, confidenceHigh: estimate + c,
    predictionLow: estimate - p, predictionHigh: estimate + p,
    segment: s.name,
    extrapolated: tvd < s.dataTop || tvd > s.dataBase,
  };
}

function segmentFor(trend: { segments: TrendSegment[] }, tvd: number): TrendSegment | null {
  for (const s of trend.segments) {
    if (s.top === null || s.base === null || (tvd >= s.top && tvd < s.base)) return s;
  }
  return null;
}

/**
 * Trend estimate with its confidence band (of the mean line) and prediction band (where a
 * new grade-A test would fall), two-sided at the trend's level:
 * estimate +- t s sqrt(1/W + (z - zbar_w)^2 / Szz_w) and +- t s sqrt(1 + 1/W + ...).
 *
 * @param trend from {@link fitShminTrend}. @param tvd TVD below rig floor, m.
 * @returns the values in Pa, or null where no fitted segment covers the depth.
 * @throws nothing.
 * @example shminTrendAt(trend, 1500)?.estimate
 */
export function shminTrendAt(trend: ShminTrend, tvd: number): TrendValue | null {
  const s = segmentFor(trend, tvd);
  return s ? segmentValue(s, tvd) : null;
}

function assign(p: TrendPoint, shape: TrendShape): DepthInterval | null {
  if (shape.kind === 'linear') return null;
  if (shape.assignBy === 'formation') {
    // A test without a formation name belongs to the interval named UNNAMED_FORMATION, if any.
    const name = (p.formation?.trim() || UNNAMED_FORMATION).toLowerCase();
    return shape.intervals.find((i) => i.name.toLowerCase() === name) ?? null;
  }
  return shape.intervals.find((i) => p.tvd >= i.top && p.tvd < i.base) ?? null;
}

function checkOptions(points: TrendPoint[], shape: TrendShape, confidence: number, outlierLimit: number): void {
  if (!(confidence > 0 && confidence < 1)) throw new EngineError('out-of-range', `band level ${confidence} is not in (0, 1)`, {}, 'e.g. 0.95');
  if (!(outlierLimit > 0)) throw new EngineError('out-of-range', `outlier limit ${outlierLimit} is not positive`, {}, 'e.g. 2.5');
  if (shape.kind === 'intervals') {
    for (const i of shape.intervals) {
      if (!(i.base > i.top)) throw new EngineError('bad-argument', `interval "${i.name}" has base ${i.base} m not below top ${i.top} m`, {}, 'base deeper than top');
    }
  }
  const ids = new Set<string>();
  for (const p of points) {
    if (ids.has(p.id)) throw new EngineError('bad-argument', `test id ${p.id} appears twice`, {}, 'unique test ids');
    ids.add(p.id);
    if (!Number.isFinite(p.tvd) || !Number.isFinite(p.shmin) || p.tvd <= 0 || p.shmin <= 0) {
      throw new EngineError('bad-argument', `test ${p.id}: TVD ${p.tvd} m, Shmin ${p.shmin} Pa are not usable`, {}, 'a positive TVD and Shmin');
    }
    if (!(p.grade in GRADE_WEIGHTS)) throw new EngineError('bad-argument', `test ${p.id}: grade "${p.grade}" is not A-E`, {}, 'a grade A-E');
  }
}

/**
 * Fits the Shmin trend: weighted least squares of Shmin on TVD (weights {@link GRADE_WEIGHTS},
 * solved with the QR least squares of analysis/least-squares), one line for all depths or
 * one per interval; a line needs three or more fitted tests at two or more depths (n - 2 >= 1
 * degrees of freedom for the bands), else that line is absent and the provenance says why.
 * Estimates are fitted; lower bounds (FIT) and upper bounds are kept as bounds and flagged
 * when the trend contradicts them; grade E is excluded. Each fitted test gets its externally
 * studentised residual t_i = r_i sqrt((n-3)/(n-2-r_i^2)), r_i = sqrt(w_i) e_i / (s sqrt(1-h_i)),
 * h_i = w_i (1/W + (z_i - zbar)^2/Szz) (Draper & Smith 1998, ch. 8), flagged above the limit.
 *
 * @param points tested values (positive TVD in m and Shmin in Pa, grades A-E).
 * @param options shape (default linear), band level (0.95), outlier limit (2.5).
 * @returns the {@link ShminTrend}; evaluate it with {@link shminTrendAt}.
 * @throws EngineError 'bad-argument' for unusable points, repeated ids or bad intervals; 'out-of-range' for bad levels.
 * @example fitShminTrend([{ id: 'a', tvd: 1000, shmin: 17e6, kind: 'estimate', grade: 'A' }, ...])
 */
export function fitShminTrend(points: TrendPoint[], options: TrendOptions = {}): ShminTrend {
  const shape = options.shape ?? { kind: 'linear' };
  const confidence = options.confidence ?? DEFAULT_CONFIDENCE;
  const outlierLimit = options.outlierLimit ?? DEFAULT_OUTLIER_LIMIT;
  checkOptions(points, shape, confidence, outlierLimit);
  const provenance: string[] = [
    `Shmin trend by weighted least squares against TVD, weights by grade A ${GRADE_WEIGHTS.A}, B ${GRADE_WEIGHTS.B}, C ${GRADE_WEIGHTS.C}, D ${GRADE_WEIGHTS.D}, E ${GRADE_WEIGHTS.E} (project choice).`,
    `Bands two-sided ${(confidence * 100).toFixed(0)} % from Student's t; the prediction band is for a new grade-A test.`,
    `Tests with |studentised residual| > ${outlierLimit} are flagged as outliers and kept in the fit.`,
    'FIT values (lower bounds) and other bounds are shown and checked, never fitted.',
  ];
  const results = new Map<string, TrendPointResult>();
  const groups = new Map<string, { interval: DepthInterval | null; pts: TrendPoint[] }>();
  if (shape.kind === 'linear') groups.set('all depths', { interval: null, pts: [] });
  else for (const i of shape.intervals) groups.set(i.name, { interval: i, pts: [] });
  for (const p of points) {
    const base: TrendPointResult = { id: p.id, role: 'excluded', weight: 0, trendValue: null, outlier: false };
    if (p.kind !== 'estimate') {
      results.set(p.id, { ...base, role: p.kind });
      continue;
    }
    if (GRADE_WEIGHTS[p.grade] === 0) {
      results.set(p.id, { ...base, reason: `grade ${p.grade} carries no weight` });
      continue;
    }
    const interval = assign(p, shape);
    const key = shape.kind === 'linear' ? 'all depths' : interval?.name;
    if (key === undefined) {
      results.set(p.id, { ...base, reason: shape.kind === 'intervals' && shape.assignBy === 'formation' ? `formation "${p.formation ?? ''}" is not one of the chosen intervals` : 'outside every chosen depth interval' });
      continue;
    }
    groups.get(key)!.pts.push(p);
    results.set(p.id, { ...base, role: 'fitted', weight: GRADE_WEIGHTS[p.grade], segment: key });
  }
  const segments: TrendSegment[] = [];
  for (const [name, g] of groups) {
    const depths = new Set(g.pts.map((p) => p.tvd));
    if (g.pts.length < 3 || depths.size < 2) {
      provenance.push(`No trend for ${name}: ${g.pts.length} fitted test${g.pts.length === 1 ? '' : 's'} at ${depths.size} depth${depths.size === 1 ? '' : 's'} (needs three tests at two or more depths).`);
      for (const p of g.pts) results.set(p.id, { ...results.get(p.id)!, role: 'excluded', weight: 0, segment: undefined, reason: `too few tests to fit ${name}` });
      continue;
    }
    const seg = fitSegment(name, g.interval?.top ?? null, g.interval?.base ?? null, g.pts, confidence);
    segments.push(seg);
    const s = seg.residualSd;
    for (const p of g.pts) {
      const w = GRADE_WEIGHTS[p.grade];
      const fitted = seg.intercept + seg.gradient * p.tvd;
      const e = p.shmin - fitted;
      const h = w * (1 / seg.weightSum + (p.tvd - seg.meanDepth) ** 2 / seg.depthSpread);
      let t: number | null = null;
      if (seg.n >= 4 && s > 0 && 1 - h > 1e-12) {
        const r = (Math.sqrt(w) * e) / (s * Math.sqrt(1 - h));
        const denominator = seg.n - 2 - r * r;
        t = denominator > 1e-12 ? r * Math.sqrt((seg.n - 3) / denominator) : Math.sign(r) * Infinity;
      }
      results.set(p.id, { ...results.get(p.id)!, trendValue: fitted, residual: e, studentisedResidual: t, outlier: t !== null && Math.abs(t) > outlierLimit });
    }
  }
  const trend: ShminTrend = { segments, points: [], confidence, outlierLimit, gradeWeights: GRADE_WEIGHTS, provenance };
  for (const p of points) {
    const r = results.get(p.id)!;
    if (r.role === 'lower-bound' || r.role === 'upper-bound') {
      const v = shminTrendAt(trend, p.tvd);
      r.trendValue = v ? v.estimate : null;
      r.boundViolated = v ? (r.role === 'lower-bound' ? v.estimate < p.shmin : v.estimate > p.shmin) : false;
    }
    trend.points.push(r);
  }
  return trend;
}
