/**
 * The regional stress model: Sv and Pp profiles, the Shmin trend fitted to accepted tests
 * (weighted by grade, with bands), SHmax frictional bounds and reopening points, and the
 * stress table sampled along TVD for well design. Pure and SI (m, Pa).
 */
import { EngineError } from '../errors';
import type { TestType } from '../record';
import type { Grade, PickKind, ShminKind } from '../result';
import { GRADES } from '../result';
import { DEFAULT_FRICTION_COEFFICIENT, frictionalLimitFactor } from '../stress/frictional';
import { FOOT, PSI } from '../units/unitDefinitions';
import { SAFETY_CAUTION } from '../export/safety';
import { porePressureAt, porePressureFromGradient, type PorePressureProfile } from './pore-pressure';
import { REOPENING_CAUTION, reopeningPoint, shmaxBoundsAtDepth, type ReopeningPoint } from './shmax-bounds';
import { fitShminTrend, shminTrendAt, type ShminTrend, type TrendOptions, type TrendPointResult } from './shmin-trend';
import { verticalStressAt, verticalStressFromGradient, type OverburdenSettings, type VerticalStressProfile } from './vertical-stress';

/** Review states as the archive names them (kept structurally equal to archive/events ReviewState). */
export type ModelReviewState = 'imported' | 'in-review' | 'accepted' | 'rejected';

/** One test as the model sees it. SI. */
export interface ModelTestInput {
  testId: string;
  file: string;
  well: string;
  field: string;
  type?: TestType;
  /** TVD of the tested interval below rig floor, m. */
  tvd: number | null;
  md?: number | null;
  shmin: { value: number; kind: ShminKind; from: PickKind } | null;
  grade: Grade;
  state: ModelReviewState;
  /** Who signed off or rejected. */
  reviewer: string | null;
  /** SHmax from the reopening relation, Pa, with the test's cautions. */
  shmaxReopening?: { value: number; cautions: string[] } | null;
  formation?: string;
}

export interface ModelSettings {
  /** Vertical-stress profile; default 1 psi/ft (22.62 kPa/m, common practice) below the mudline. */
  verticalStress?: VerticalStressProfile;
  /** Pore-pressure profile; default hydrostatic 10.0 kPa/m from sea level or ground. */
  porePressure?: PorePressureProfile;
  /** Rig floor elevation and water depth for the default profiles. */
  overburden?: OverburdenSettings;
  /** Friction coefficient for the polygon, default 0.6. */
  frictionCoefficient?: number;
  /** Worst grade taken (default 'D': every weighted grade; the command line uses 'B'). */
  minGrade?: Grade;
  /** Use accepted tests only (default true; the command line, without an archive, sets false). */
  acceptedOnly?: boolean;
  /** Only these wells (names); default all. */
  wells?: string[];
  /** Only this field (name); default all. */
  field?: string;
  trend?: TrendOptions;
}

/** A test and what the model did with it. */
export interface ModelTestResult extends ModelTestInput {
  /** Fitted in the Shmin trend. */
  used: boolean;
  /** How the trend treated it ('not-selected' when filtered out before fitting). */
  role: TrendPointResult['role'] | 'not-selected';
  reason?: string;
  weight: number;
  residual?: number;
  studentisedResidual?: number | null;
  outlier: boolean;
  boundViolated?: boolean;
  /** Sv and Pp of the model at the test depth, Pa (null without TVD). */
  sv: number | null;
  pp: number | null;
  /** (Shmin - Pp)/(Sv - Pp) at the test depth. */
  effectiveStressRatio: number | null;
}

export interface RegionalModel {
  tests: ModelTestResult[];
  trend: ShminTrend;
  /** Effective stress ratio of each trend line at its weighted mean depth. */
  trendEffectiveStressRatio: { segment: string; tvd: number; ratio: number | null }[];
  reopeningPoints: ReopeningPoint[];
  verticalStress: VerticalStressProfile;
  porePressure: PorePressureProfile;
  frictionCoefficient: number;
  /** q for the friction coefficient. */
  frictionalFactor: number;
  minGrade: Grade;
  acceptedOnly: boolean;
  wells: string[] | null;
  field: string | null;
  provenance: string[];
  cautions: string[];
}

function ratio(shmin: number, sv: number, pp: number): number | null {
  const d = sv - pp;
  return d > 0 ? (shmin - pp) / d : null;
}

function selectionReason(t: ModelTestInput, s: Required<Pick<ModelSettings, 'minGrade' | 'acceptedOnly'>> & ModelSettings): string | null {
  if (s.field !== undefined && t.field !== s.field) return `field ${t.field} not chosen`;
  if (s.wells && !s.wells.includes(t.well)) return `well ${t.well} not chosen`;
  if (s.acceptedOnly && t.state !== 'accepted') return `not accepted (${t.state})`;
  if (GRADES.indexOf(t.grade) > GRADES.indexOf(s.minGrade)) return `grade ${t.grade} is below the minimum ${s.minGrade}`;
  if (t.tvd === null || !(t.tvd > 0)) return 'no TVD';
  if (!t.shmin) return 'no Shmin value';
  return null;
}

/**
 * Builds the regional model: selects tests (accepted only by default, grade at least
 * `minGrade`, chosen field and wells, with a TVD and a Shmin value), fits the Shmin trend
 * (shmin-trend, weighted by grade; FIT lower bounds shown, never fitted), evaluates Sv and
 * Pp at each test, the effective stress ratio (Shmin - Pp)/(Sv - Pp) per test and per trend
 * line, and the reopening SHmax points with their cautions.
 *
 * @param tests every test on offer (SI; unselected ones are returned with the reason).
 * @param settings profiles, friction (default 0.6), grade and state filters, trend shape.
 * @returns the {@link RegionalModel}; sample it with {@link stressTable}.
 * @throws EngineError 'bad-argument' for a bad grade, repeated test ids or bad points;
 *   'out-of-range' for a bad friction coefficient or band level.
 * @example buildRegionalModel(tests, { minGrade: 'B' }).trend.segments[0].gradient // Pa/m
 */
export function buildRegionalModel(tests: ModelTestInput[], settings: ModelSettings = {}): RegionalModel {
  const minGrade = settings.minGrade ?? 'D';
  if (!GRADES.includes(minGrade)) throw new EngineError('bad-argument', `minimum grade "${minGrade}" is not A-E`, {}, 'a grade A-E');
  const acceptedOnly = settings.acceptedOnly ?? true;
  const mu = settings.frictionCoefficient ?? DEFAULT_FRICTION_COEFFICIENT;
  const q = frictionalLimitFactor(mu);
  const ids = new Set<string>();
  for (const t of tests) {
    if (ids.has(t.testId)) throw new EngineError('bad-argument', `test id ${t.testId} appears twice`, { file: t.file }, 'unique test ids');
    ids.add(t.testId);
  }
  const overburden = settings.overburden ?? {};
  const sv = settings.verticalStress ?? verticalStressFromGradient(PSI / FOOT, overburden);
  const pp = settings.porePressure ?? porePressureFromGradient(undefined, overburden.rigFloorElevation ?? 0);
  const s = { ...settings, minGrade, acceptedOnly };
  const reasons = new Map<string, string>();
  const selected = tests.filter((t) => {
    const r = selectionReason(t, s);
    if (r) reasons.set(t.testId, r);
    return r === null;
  });
  const trend = fitShminTrend(
    selected.map((t) => ({ id: t.testId, tvd: t.tvd!, shmin: t.shmin!.value, kind: t.shmin!.kind, grade: t.grade, well: t.well, formation: t.formation })),
    settings.trend,
  );
  const byId = new Map(trend.points.map((p) => [p.id, p]));
  const results: ModelTestResult[] = tests.map((t) => {
    const depthOk = t.tvd !== null && t.tvd > 0;
    const svAt = depthOk ? verticalStressAt(sv, t.tvd!) : null;
    const ppAt = depthOk ? porePressureAt(pp, t.tvd!) : null;
    const k = t.shmin && svAt !== null && ppAt !== null ? ratio(t.shmin.value, svAt, ppAt) : null;
    const p = byId.get(t.testId);
    if (!p) {
      return { ...t, used: false, role: 'not-selected', reason: reasons.get(t.testId), weight: 0, outlier: false, sv: svAt, pp: ppAt, effectiveStressRatio: k };
    }
    return {
      ...t, used: p.role === 'fitted', role: p.role, reason: p.reason, weight: p.weight,
      residual: p.residual, studentisedResidual: p.studentisedResidual, outlier: p.outlier, boundViolated: p.boundViolated,
      sv: svAt, pp: ppAt, effectiveStressRatio: k,
    };
  });
  const trendEffectiveStressRatio = trend.segments.map((seg) => {
    const z = seg.meanDepth;
    return { segment: seg.name, tvd: z, ratio: ratio(seg.intercept + seg.gradient * z, verticalStressAt(sv, z), porePressureAt(pp, z)) };
  });
  const reopeningPoints: ReopeningPoint[] = [];
  for (const t of selected) {
    if (!t.shmaxReopening || t.shmin?.kind !== 'estimate') continue;
    const z = t.tvd!;
    reopeningPoints.push(reopeningPoint(
      { testId: t.testId, well: t.well, tvd: z, shmax: t.shmaxReopening.value, cautions: t.shmaxReopening.cautions },
      t.shmin.value, verticalStressAt(sv, z), porePressureAt(pp, z), mu,
    ));
  }
  const used = results.filter((r) => r.used).length;
  const provenance = [
    `${used} of ${tests.length} tests fitted (${acceptedOnly ? 'accepted tests only' : 'review state not required'}, grade ${minGrade} or better${settings.field ? `, field ${settings.field}` : ''}${settings.wells ? `, wells ${settings.wells.join(', ')}` : ''}).`,
    ...sv.provenance,
    ...(settings.verticalStress ? [] : ['Vertical stress gradient 1 psi/ft (22.62 kPa/m) is the common-practice default, not a measurement.']),
    ...pp.provenance,
    ...trend.provenance,
    `SHmax bounds from the stress polygon with friction coefficient ${mu} (q = ${q.toFixed(3)}; Zoback 2007 ch. 4).`,
  ];
  const cautions = [SAFETY_CAUTION];
  if (reopeningPoints.length) cautions.push(REOPENING_CAUTION);
  if (results.some((r) => r.outlier)) cautions.push('Some tests are flagged as outliers of the trend: check their picks before relying on the trend.');
  if (results.some((r) => r.boundViolated)) cautions.push('The trend contradicts at least one bound (a FIT lower bound above the trend, or an upper bound below it).');
  if (!trend.segments.length) cautions.push('No Shmin trend could be fitted: too few usable tests.');
  return {
    tests: results, trend, trendEffectiveStressRatio, reopeningPoints, verticalStress: sv, porePressure: pp,
    frictionCoefficient: mu, frictionalFactor: q, minGrade, acceptedOnly,
    wells: settings.wells ?? null, field: settings.field ?? null, provenance, cautions,
  };
}

/** One row of the stress table, SI. Values are null where the trend does not reach. */
export interface StressTableRow {
  tvd: number;
  md: number | null;
  pp: number;
  sv: number;
  shmin: number | null;
  /** Prediction band (where a new grade-A test would fall), Pa. */
  shminLow: number | null;
  shminHigh: number | null;
  /** Confidence band of the trend line, Pa. */
  shminConfidenceLow: number | null;
  shminConfidenceHigh: number | null;
  shmaxLow: number | null;
  shmaxHigh: number | null;
  regime: string | null;
  effectiveStressRatio: number | null;
  /** Beyond the depth range of the tests that fitted this trend line. */
  extrapolated: boolean;
  segment: string | null;
}

/** Depth sampling of the table. */
export interface StressTableOptions {
  /** First TVD, m, >= 0. */
  from: number;
  /** Last TVD, m, > from. */
  to: number;
  /** Step, m, > 0; at most 100,000 rows. */
  step: number;
  /** Well whose MD column is wanted (for the caller's records). */
  well?: string;
  /** MD at a TVD for that well (e.g. from its survey); null where it cannot be told. */
  mdAtTvd?: (tvd: number) => number | null;
}

/**
 * The stress table: at TVD = from, from + step, ... to (the last row exactly at `to`), the
 * pore pressure, vertical stress, Shmin trend with its prediction and confidence bands,
 * SHmax frictional bounds (from the Shmin estimate), regime and effective stress ratio.
 *
 * @param model from {@link buildRegionalModel}.
 * @param options from/to/step in m; optional MD for one well.
 * @returns rows, SI.
 * @throws EngineError 'bad-argument' for a bad range or step, 'out-of-range' above 100,000 rows.
 * @example stressTable(model, { from: 500, to: 3000, step: 100 })
 */
export function stressTable(model: RegionalModel, options: StressTableOptions): StressTableRow[] {
  const { from, to, step } = options;
  if (!Number.isFinite(from) || !Number.isFinite(to) || from < 0 || !(to > from)) {
    throw new EngineError('bad-argument', `table range ${from}-${to} m is not usable`, {}, 'from >= 0 m and to deeper than from');
  }
  if (!(step > 0) || !Number.isFinite(step)) throw new EngineError('bad-argument', `table step ${step} m is not positive`, {}, 'a step > 0 m');
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  if (count > 100_000) throw new EngineError('out-of-range', `the table would have ${count} rows`, {}, 'at most 100000 rows');
  const depths = Array.from({ length: count }, (_, i) => from + i * step);
  if (to - depths[depths.length - 1] > 1e-9 * Math.max(1, to)) depths.push(to);
  return depths.map((z) => {
    const sv = verticalStressAt(model.verticalStress, z);
    const pp = porePressureAt(model.porePressure, z);
    const t = shminTrendAt(model.trend, z);
    const md = options.mdAtTvd ? options.mdAtTvd(z) : null;
    if (!t) {
      return {
        tvd: z, md, pp, sv, shmin: null, shminLow: null, shminHigh: null, shminConfidenceLow: null, shminConfidenceHigh: null,
        shmaxLow: null, shmaxHigh: null, regime: null, effectiveStressRatio: null, extrapolated: false, segment: null,
      };
    }
    const b = shmaxBoundsAtDepth(t.estimate, sv, pp, model.frictionCoefficient);
    return {
      tvd: z, md, pp, sv,
      shmin: t.estimate, shminLow: t.predictionLow, shminHigh: t.predictionHigh,
      shminConfidenceLow: t.confidenceLow, shminConfidenceHigh: t.confidenceHigh,
      shmaxLow: b.low, shmaxHigh: b.high, regime: b.regimeText,
      effectiveStressRatio: ratio(t.estimate, sv, pp), extrapolated: t.extrapolated, segment: t.segment,
    };
  });
}
