/**
 * The depth plot of the regional stress model as an ECharts option: TVD increasing
 * downward; Sv, Pp, the Shmin trend with its confidence and prediction bands, the SHmax
 * frictional upper bound; each test's Shmin as a point whose shape is its grade and whose
 * colour is its well; FIT lower bounds as right-pointing arrows; reopening SHmax as stars;
 * rejected and unreviewed tests (when asked for) as hollow grey symbols; pore-pressure
 * measurements (when the Pp profile is built from them) as hollow blue circles with the Pp
 * line drawn through each of them. The x axis shows
 * pressure, gradient (P / TVD) or equivalent mud weight in the chosen units.
 *
 * Colours follow a palette chosen to stay apart under common colour-vision deficiencies
 * (Okabe & Ito 2008, "Color Universal Design"); every distinction is also carried by line
 * dash or marker shape.
 */
import type { ChartOption, LineSeriesOption, ScatterSeriesOption } from '../../charts/echarts';
import { breckelsVanEekelen, eatonShmin } from '../../../engine/model/correlations';
import { porePressureAt } from '../../../engine/model/pore-pressure';
import type { RegionalModel, StressTableRow } from '../../../engine/model/regional-model';
import type { Grade } from '../../../engine/result';
import { emwFromPressure } from '../../../engine/units/mudWeight';
import { fromSI } from '../../../engine/units/units';
import type { UnitSystem } from '../../../engine/units/unitSystem';

export type DepthAxisMode = 'pressure' | 'gradient' | 'emw';

/** Line styles of the model curves. */
export const CURVE_STYLE = {
  sv: { color: '#1a1a1a', dash: 'solid' as const, width: 2.5, name: 'Sv (vertical stress)', legend: 'Sv' },
  pp: { color: '#0072B2', dash: 'dashed' as const, width: 2, name: 'Pp (pore pressure)', legend: 'Pp' },
  shmin: { color: '#D55E00', dash: 'solid' as const, width: 2.5, name: 'Shmin trend', legend: 'Shmin trend' },
  confidence: { color: '#D55E00', dash: [6, 4] as number[], width: 1.2, name: 'Shmin trend confidence band', legend: 'Trend confidence' },
  prediction: { color: '#D55E00', dash: 'dotted' as const, width: 1.2, name: 'Shmin prediction band', legend: 'Shmin prediction' },
  shmaxHigh: { color: '#009E73', dash: [10, 4, 2, 4] as number[], width: 2, name: 'SHmax upper bound (frictional limit)', legend: 'SHmax frictional limit' },
  breckels: { color: '#7a7a7a', dash: [2, 3] as number[], width: 1.2, name: 'Breckels & van Eekelen 1982 (reference)', legend: 'Breckels & van Eekelen' },
  eaton: { color: '#7a7a7a', dash: [8, 3] as number[], width: 1.2, name: 'Eaton 1969, ν 0.25 (reference)', legend: 'Eaton (ν 0.25)' },
};

/**
 * Styles of the Shmin trend lines when the trend is fitted per interval (depth breaks or
 * formations), reused cyclically: vermillion first (the one-line colour), then reddish
 * purple, orange and bluish green (Okabe & Ito 2008), each with its own dash.
 */
export const SEGMENT_STYLES: { color: string; dash: 'solid' | number[] }[] = [
  { color: '#D55E00', dash: 'solid' },
  { color: '#CC79A7', dash: [12, 4] },
  { color: '#E69F00', dash: [4, 3] },
  { color: '#009E73', dash: [12, 3, 3, 3] },
];

/** Poisson's ratio of the Eaton reference curve (a common-practice mid value for shales and sands). */
export const EATON_REFERENCE_POISSON = 0.25;

/** Marker shape per grade (shape carries the grade; colour carries the well). */
export const GRADE_SYMBOL: Record<Grade, string> = {
  A: 'circle',
  B: 'rect',
  C: 'triangle',
  D: 'diamond',
  E: 'pin',
};

/** Right-pointing arrow: a FIT lower bound (the true Shmin lies to the right). */
export const LOWER_BOUND_SYMBOL = 'path://M0,3 L6,3 L6,0 L10,5 L6,10 L6,7 L0,7 Z';
/** Left-pointing arrow: an upper bound. */
export const UPPER_BOUND_SYMBOL = 'path://M10,3 L4,3 L4,0 L0,5 L4,10 L4,7 L10,7 Z';
/** Five-point star: SHmax from the reopening relation. */
export const REOPENING_SYMBOL = 'path://M5,0 L6.2,3.6 L10,3.8 L7,6.1 L8.1,10 L5,7.8 L1.9,10 L3,6.1 L0,3.8 L3.8,3.6 Z';

/** Well colours (Okabe-Ito order, black last), reused cyclically. */
export const WELL_COLORS = ['#E69F00', '#56B4E9', '#CC79A7', '#0072B2', '#009E73', '#D55E00', '#F0E442', '#000000'];
/** Hidden-by-default tests (rejected, not yet accepted) when shown. */
export const HIDDEN_TEST_COLOR = '#8a8f98';

export interface DepthPlotView {
  mode: DepthAxisMode;
  units: UnitSystem;
  /** Show rejected and not-yet-accepted tests (hollow, grey). */
  showUnaccepted: boolean;
  /** Draw the published correlations (Breckels & van Eekelen, Eaton) for comparison. */
  showReferences?: boolean;
  /** TVD of the mudline (rig floor elevation plus water depth), m: gradient and EMW curves start below it (P / TVD is meaningless above). */
  mudline?: number;
}

/**
 * The depth range over which the Shmin trend is drawn: solid over the fitted tests' TVDs,
 * extrapolated (dashed) no shallower than one table step above the shallowest test and no
 * deeper than the table. Null when no test was fitted.
 */
export function trendDepthRange(model: RegionalModel, rows: StressTableRow[]): { top: number; bottom: number; from: number; to: number } | null {
  const depths = model.tests.filter((t) => t.used && t.tvd !== null && t.tvd > 0).map((t) => t.tvd!);
  if (!depths.length || !rows.length) return null;
  const top = Math.min(...depths);
  const bottom = Math.max(...depths);
  const step = rows.length > 1 ? rows[1].tvd - rows[0].tvd : rows[0].tvd;
  const from = Math.max(rows[0].tvd, top - step);
  const to = Math.max(bottom, rows[rows.length - 1].tvd);
  return { top, bottom, from: Math.min(from, top), to };
}

/** The rows between two TVDs, with rows interpolated linearly at both ends (the trend is linear in TVD). */
function rowsBetween(rows: StressTableRow[], from: number, to: number): StressTableRow[] {
  const at = (z: number): StressTableRow | null => {
    const i = rows.findIndex((r) => r.tvd >= z);
    if (i < 0) return null;
    if (rows[i].tvd === z || i === 0) return rows[i].tvd === z ? rows[i] : null;
    const a = rows[i - 1];
    const b = rows[i];
    const f = (z - a.tvd) / (b.tvd - a.tvd);
    const mix = (x: number | null, y: number | null) => (x === null || y === null ? null : x + (y - x) * f);
    return {
      ...a, tvd: z, md: mix(a.md, b.md), sv: mix(a.sv, b.sv)!, pp: mix(a.pp, b.pp)!, shmin: mix(a.shmin, b.shmin), shminLow: mix(a.shminLow, b.shminLow), shminHigh: mix(a.shminHigh, b.shminHigh),
      shminConfidenceLow: mix(a.shminConfidenceLow, b.shminConfidenceLow), shminConfidenceHigh: mix(a.shminConfidenceHigh, b.shminConfidenceHigh), shmaxHigh: mix(a.shmaxHigh, b.shmaxHigh),
    } as StressTableRow;
  };
  const inner = rows.filter((r) => r.tvd > from && r.tvd < to);
  const first = at(from);
  const last = at(to);
  return [...(first ? [first] : []), ...inner, ...(last ? [last] : [])];
}

/** Axis units and a converter from (pressure Pa, TVD m) to the x value shown. */
export function axisUnits(view: Pick<DepthPlotView, 'mode' | 'units'>): { x: string; depth: string; convert: (p: number, tvd: number) => number | null } {
  const si = view.units === 'si';
  const depth = si ? 'm' : 'ft';
  if (view.mode === 'pressure') {
    const unit = si ? 'MPa' : 'psi';
    return { x: unit, depth, convert: (p) => fromSI(p, unit, 'pressure') };
  }
  if (view.mode === 'gradient') {
    const unit = si ? 'kPa/m' : 'psi/ft';
    return { x: unit, depth, convert: (p, z) => (z > 0 ? fromSI(p / z, unit, 'gradient') : null) };
  }
  const unit = si ? 'sg' : 'ppg';
  return { x: `${unit} EMW`, depth, convert: (p, z) => (z > 0 ? fromSI(emwFromPressure(p, z), unit, 'density') : null) };
}

/** The wells of a model in a stable order, each with its colour. */
export function wellColors(model: RegionalModel): Map<string, string> {
  const wells = [...new Set(model.tests.map((t) => t.well))].sort();
  return new Map(wells.map((w, i) => [w, WELL_COLORS[i % WELL_COLORS.length]]));
}

function curve(id: string, rows: StressTableRow[], pick: (r: StressTableRow) => number | null, style: { color: string; dash: 'solid' | 'dashed' | 'dotted' | number[]; width: number; name: string; legend?: string }, toX: (p: number, z: number) => number | null, toDepth: (z: number) => number): LineSeriesOption {
  const data: (number | null)[][] = [];
  for (const r of rows) {
    const p = pick(r);
    const x = p === null ? null : toX(p, r.tvd);
    data.push(x === null ? [null, toDepth(r.tvd)] : [x, toDepth(r.tvd)]);
  }
  return {
    id, name: style.legend ?? style.name, type: 'line', data: data as LineSeriesOption['data'], symbol: 'none', showSymbol: false, connectNulls: false,
    lineStyle: { color: style.color, type: style.dash as 'solid', width: style.width }, itemStyle: { color: style.color },
    emphasis: { disabled: true }, z: 2,
  };
}

/** Pp line: the table rows, plus every measurement depth when Pp comes from measurements (so the line runs through the points). */
function porePressureCurve(model: RegionalModel, rows: StressTableRow[], toX: (p: number, z: number) => number | null, toDepth: (z: number) => number): LineSeriesOption {
  const profile = model.porePressure;
  if (profile.source !== 'measurements' || rows.length === 0) return curve('pp', rows, (r) => r.pp, CURVE_STYLE.pp, toX, toDepth);
  const depths = [...new Set([...rows.map((r) => r.tvd), ...profile.depth.filter((z) => z > 0)])].sort((a, b) => a - b);
  const data = depths.map((z) => {
    const x = toX(porePressureAt(profile, z), z);
    return [x, toDepth(z)];
  });
  return { ...curve('pp', [], () => null, CURVE_STYLE.pp, toX, toDepth), data: data as LineSeriesOption['data'] };
}

/** The measured pore pressures as points (the profile's nodes below its datum). */
export function porePressurePointSeries(model: RegionalModel, view: Pick<DepthPlotView, 'mode' | 'units'>): ScatterSeriesOption | null {
  const profile = model.porePressure;
  if (profile.source !== 'measurements') return null;
  const axis = axisUnits(view);
  const data = profile.depth.map((z, i) => ({ z, p: profile.pressure[i] })).slice(1).map(({ z, p }) => {
    const x = axis.convert(p, z);
    const depth = fromSI(z, axis.depth, 'length');
    return { name: `pp-${z}`, value: [x ?? NaN, depth], tip: `Pp measurement ${x === null ? '-' : x.toFixed(3)} ${axis.x} at TVD ${depth.toFixed(1)} ${axis.depth}` };
  });
  return {
    id: 'pp-measurements', name: 'Pp measurements', type: 'scatter', symbol: 'circle', symbolSize: 9,
    itemStyle: { color: 'rgba(255,255,255,0)', borderColor: CURVE_STYLE.pp.color, borderWidth: 2 },
    data: data as ScatterSeriesOption['data'], z: 4,
  };
}

/**
 * The Shmin trend line(s): one series "Shmin trend" for a single all-depth line; for a trend
 * fitted per interval (depth breaks or formations), one series per line, drawn over the table
 * rows that use it and named "Shmin trend: <line name>" in the legend.
 *
 * @param model the model. @param rows the stress table (each row names its line).
 * @param toX pressure and TVD to the x value. @param toDepth TVD m to the shown depth.
 * @returns the series, ids "shmin" or "shmin-line-<i>" in the trend's order.
 */
export function shminTrendCurves(model: RegionalModel, rows: StressTableRow[], toX: (p: number, z: number) => number | null, toDepth: (z: number) => number): LineSeriesOption[] {
  const segments = model.trend.segments;
  if (!segments.some((sg) => sg.top !== null)) return [curve('shmin', rows, (r) => r.shmin, CURVE_STYLE.shmin, toX, toDepth)];
  return segments.map((sg, i) => {
    const style = SEGMENT_STYLES[i % SEGMENT_STYLES.length];
    return curve(`shmin-line-${i}`, rows, (r) => (r.segment === sg.name ? r.shmin : null),
      { ...CURVE_STYLE.shmin, color: style.color, dash: style.dash, name: `${CURVE_STYLE.shmin.name}: ${sg.name}`, legend: `${CURVE_STYLE.shmin.name}: ${sg.name}` }, toX, toDepth);
  });
}

/** The Shmin trend outside the tested depths (thin, dashed, one series for both ends). */
function extrapolatedTrend(model: RegionalModel, rows: StressTableRow[], range: { top: number; bottom: number; from: number; to: number }, toX: (p: number, z: number) => number | null, toDepth: (z: number) => number): LineSeriesOption {
  const above = range.from < range.top ? rowsBetween(rows, range.from, range.top) : [];
  const below = range.to > range.bottom ? rowsBetween(rows, range.bottom, range.to) : [];
  const style = { color: CURVE_STYLE.shmin.color, dash: [3, 4] as number[], width: 1.5, name: 'Shmin trend, extrapolated' };
  const part = (rs: StressTableRow[]) => curve('x', rs, (r) => r.shmin, style, toX, toDepth).data as unknown[];
  const data = [...part(above), ...(above.length && below.length ? [[null, null]] : []), ...part(below)];
  return { ...curve('shmin-extrapolated', [], () => null, style, toX, toDepth), data: data as LineSeriesOption['data'], z: 1 };
}

/**
 * Builds the depth-plot option.
 *
 * @param model the fitted model (its tests carry state, grade, role, outlier).
 * @param rows the stress table sampled for the curves.
 * @param view axis mode, units, whether unaccepted tests are shown.
 * @returns an ECharts option; test points are in series with ids starting "pick-test"
 *   whose datum names are test ids (the screen opens a test on click).
 */
export function depthPlotOption(model: RegionalModel, rows: StressTableRow[], view: DepthPlotView): ChartOption {
  const axis = axisUnits(view);
  const toDepth = (z: number) => fromSI(z, axis.depth, 'length');
  const colors = wellColors(model);
  // Gradient and EMW divide by TVD: draw them only below the mudline (and the first table row).
  const mudline = view.mode === 'pressure' ? -Infinity : view.mudline ?? 0;
  const below = rows.filter((r) => r.tvd > mudline);
  // The trend, its bands and the frictional limit (which uses the trend) over the tested depths, extrapolated dashed outside them.
  const range = trendDepthRange(model, below);
  const tested = range ? rowsBetween(below, range.top, range.bottom) : below;
  const banded = range ? rowsBetween(below, range.from, range.to) : below;
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    curve('sv', below, (r) => r.sv, CURVE_STYLE.sv, axis.convert, toDepth),
    porePressureCurve(model, below, axis.convert, toDepth),
    ...shminTrendCurves(model, tested, axis.convert, toDepth),
    ...(range && (range.from < range.top || range.to > range.bottom) ? [extrapolatedTrend(model, below, range, axis.convert, toDepth)] : []),
    curve('shmin-conf-low', banded, (r) => r.shminConfidenceLow, CURVE_STYLE.confidence, axis.convert, toDepth),
    curve('shmin-conf-high', banded, (r) => r.shminConfidenceHigh, { ...CURVE_STYLE.confidence }, axis.convert, toDepth),
    curve('shmin-pred-low', banded, (r) => r.shminLow, CURVE_STYLE.prediction, axis.convert, toDepth),
    curve('shmin-pred-high', banded, (r) => r.shminHigh, { ...CURVE_STYLE.prediction }, axis.convert, toDepth),
    curve('shmax-high', banded, (r) => r.shmaxHigh, CURVE_STYLE.shmaxHigh, axis.convert, toDepth),
  ];
  if (view.showReferences) {
    // B&vE is defined to 50,000 ft (its own range check); Eaton from the model's Sv and Pp.
    series.push(curve('ref-breckels', below, (r) => (r.tvd > 0 && r.tvd <= 15_240 ? breckelsVanEekelen(r.tvd, r.pp) : null), CURVE_STYLE.breckels, axis.convert, toDepth));
    series.push(curve('ref-eaton', below, (r) => (r.sv > r.pp ? eatonShmin(r.sv, r.pp, EATON_REFERENCE_POISSON) : null), CURVE_STYLE.eaton, axis.convert, toDepth));
  }
  const measured = porePressurePointSeries(model, view);
  if (measured) series.push(measured);
  const groups = new Map<string, { name: string; symbol: string; hollow: boolean; data: { name: string; value: number[]; itemStyle: Record<string, unknown>; tip: string }[] }>();
  for (const t of model.tests) {
    if (!t.shmin || t.tvd === null || !(t.tvd > 0)) continue;
    if ((model.field !== null && t.field !== model.field) || (model.wells && !model.wells.includes(t.well))) continue;
    const accepted = t.state === 'accepted';
    if (!accepted && !view.showUnaccepted) continue;
    const x = axis.convert(t.shmin.value, t.tvd);
    if (x === null) continue;
    const bound = t.shmin.kind !== 'estimate';
    const symbol = t.shmin.kind === 'lower-bound' ? LOWER_BOUND_SYMBOL : t.shmin.kind === 'upper-bound' ? UPPER_BOUND_SYMBOL : GRADE_SYMBOL[t.grade];
    const key = `${accepted ? 'a' : 'u'}-${bound ? t.shmin.kind : t.grade}`;
    const name = accepted
      ? bound ? (t.shmin.kind === 'lower-bound' ? 'FIT lower bound' : 'Upper bound') : `Grade ${t.grade}`
      : 'Not accepted';
    const g = groups.get(key) ?? { name, symbol, hollow: !accepted, data: [] };
    const color = accepted ? colors.get(t.well)! : HIDDEN_TEST_COLOR;
    const tip = `${t.well} · ${t.file}<br/>Shmin ${x.toFixed(view.mode === 'pressure' && view.units === 'oilfield' ? 0 : 3)} ${axis.x} (${t.shmin.kind.replace('-', ' ')}, from ${t.shmin.from})<br/>TVD ${toDepth(t.tvd).toFixed(1)} ${axis.depth} · grade ${t.grade} · ${t.state}${t.reviewer ? ` · signed off by ${t.reviewer}` : ''}${t.outlier ? '<br/><b>Outlier of the trend</b>' : ''}${t.used ? '' : `<br/>Not fitted${t.reason ? `: ${t.reason}` : ''}`}`;
    g.data.push({
      name: t.testId, value: [x, toDepth(t.tvd)], tip,
      itemStyle: accepted
        ? { color, borderColor: t.outlier ? '#1a1a1a' : '#ffffff', borderWidth: t.outlier ? 2.5 : 1 }
        : { color: 'rgba(255,255,255,0)', borderColor: color, borderWidth: 1.5, borderType: 'dashed' },
    });
    groups.set(key, g);
  }
  for (const [key, g] of groups) {
    series.push({
      id: `pick-test-${key}`, name: g.name, type: 'scatter', symbol: g.symbol, symbolSize: 12,
      data: g.data.map((d) => ({ name: d.name, value: d.value, itemStyle: d.itemStyle, tip: d.tip })) as ScatterSeriesOption['data'],
      itemStyle: g.hollow ? { color: 'rgba(255,255,255,0)', borderColor: HIDDEN_TEST_COLOR } : { color: '#555555' },
      z: 5, cursor: 'pointer',
    });
  }
  if (model.reopeningPoints.length) {
    series.push({
      id: 'pick-test-reopening', name: 'SHmax, reopening', type: 'scatter', symbol: REOPENING_SYMBOL, symbolSize: 15,
      data: model.reopeningPoints.map((p) => {
        const x = axis.convert(p.shmax, p.tvd);
        return {
          name: p.testId, value: [x ?? NaN, toDepth(p.tvd)],
          itemStyle: { color: colors.get(p.well) ?? '#009E73', borderColor: '#1a1a1a', borderWidth: 1 },
          tip: `${p.well}: SHmax ${x === null ? '-' : x.toFixed(3)} ${axis.x} (reopening relation)<br/>${p.cautions.map((c) => `• ${c}`).join('<br/>')}`,
        };
      }) as ScatterSeriesOption['data'],
      z: 6, cursor: 'pointer',
    });
  }
  return {
    animation: false,
    grid: { left: 70, right: 24, top: 40, bottom: 96 },
    legend: { bottom: 4, left: 'center', type: 'plain', itemGap: 14, itemWidth: 22, textStyle: { fontSize: 13 } },
    tooltip: {
      trigger: 'item', confine: true,
      formatter: (p: unknown) => {
        const d = (p as { data?: { tip?: string }; seriesName?: string; value?: number[] });
        if (d.data?.tip) return d.data.tip;
        const v = d.value;
        return v ? `${d.seriesName}: ${Number(v[0]).toFixed(3)} ${axis.x} at ${Number(v[1]).toFixed(0)} ${axis.depth}` : String(d.seriesName ?? '');
      },
    },
    xAxis: { type: 'value', name: view.mode === 'pressure' ? `Pressure (${axis.x})` : view.mode === 'gradient' ? `Gradient (${axis.x})` : `Equivalent mud weight (${axis.x})`, nameLocation: 'middle', nameGap: 28, position: 'top', scale: view.mode !== 'pressure',
      ...(view.mode === 'pressure' ? {} : { min: axisMinWithMargin, max: axisMaxWithMargin }) },
    yAxis: { type: 'value', name: `TVD (${axis.depth})`, inverse: true, nameLocation: 'middle', nameGap: 50, min: 0 },
    series,
  } as ChartOption;
}

/** A round axis step for a data range: a tenth of its order of magnitude. */
function axisStep(e: { min: number; max: number }): number {
  const range = Math.max(e.max - e.min, Math.abs(e.max) * 0.01, 1e-9);
  return 10 ** Math.floor(Math.log10(range)) / 10;
}

/** The axis start: a round value at least 4 % of the data range below the smallest value (so no curve sits on the edge). */
function axisMinWithMargin(e: { min: number; max: number }): number {
  const step = axisStep(e);
  return Number((Math.floor((e.min - (e.max - e.min) * 0.04) / step) * step).toPrecision(10));
}

/** The axis end: a round value at least 4 % of the data range above the largest value. */
function axisMaxWithMargin(e: { min: number; max: number }): number {
  const step = axisStep(e);
  return Number((Math.ceil((e.max + (e.max - e.min) * 0.04) / step) * step).toPrecision(10));
}
