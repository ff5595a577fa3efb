/**
 * Chart option builders for the test review screen. Pure functions of the record,
 * the analysis and the display units; they decimate for drawing and never change
 * the data used for computation.
 */
import type { AnalysisResult, CycleAnalysis, LineFit, Pick, PickKind } from '../../engine/result';
import type { UnitSystem } from '../../engine/units/unitSystem';
import { displayScale, unitLabel } from '../format/units';
import { displayIndices, pairsAt } from './decimate';
import type { ChartOption, LineSeriesOption, ScatterSeriesOption } from './echarts';
import { cycleStyle, PICK_ORDER, PICK_STYLE, SERIES_COLOR } from './style';

export const FONT_STACK = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';

/** A pick placed on a chart, with the cycle it belongs to. */
export interface PlacedPick { cycle: number; kind: PickKind; pick: Pick }

/** Key of a pick on every chart: "cycle:kind". */
export function pickKey(cycle: number, kind: PickKind): string { return `${cycle}:${kind}`; }

export function parsePickKey(key: string): { cycle: number; kind: PickKind } | null {
  const m = /^(\d+):([a-zA-Z]+)$/.exec(key);
  return m ? { cycle: Number(m[1]), kind: m[2] as PickKind } : null;
}

/** Every pick of every cycle, in pumping order. */
export function placedPicks(analysis: AnalysisResult): PlacedPick[] {
  const out: PlacedPick[] = [];
  for (const c of analysis.cycles) {
    for (const kind of PICK_ORDER) {
      const pick = c.picks[kind];
      if (pick) out.push({ cycle: c.cycle.index, kind, pick });
    }
  }
  return out;
}

function base(): ChartOption {
  return {
    animation: false,
    textStyle: { fontFamily: FONT_STACK, fontSize: 12, color: '#2a3442' },
    grid: { left: 64, right: 64, top: 36, bottom: 56, containLabel: false },
    tooltip: {
      trigger: 'axis', axisPointer: { type: 'cross', snap: false }, confine: true, textStyle: { fontFamily: FONT_STACK },
      valueFormatter: (v) => (typeof v === 'number' ? tooltipNumber(v) : String(v ?? '')),
    },
    legend: { type: 'scroll', top: 2, left: 'center', itemGap: 12, itemWidth: 18, itemHeight: 10, textStyle: { fontSize: 11.5 } },
  };
}

function axisName(name: string, unit: string): string { return `${name} (${unit})`; }

const AXIS_COMMON = {
  nameLocation: 'middle' as const,
  nameTextStyle: { fontSize: 12, color: '#3b4654' },
  axisLine: { lineStyle: { color: '#8893a2' } },
  splitLine: { lineStyle: { color: '#e4e8ee' } },
  axisLabel: { color: '#3b4654', formatter: tickLabel },
};

/** Rounds up to a readable axis end: a multiple of half the value's power of ten (849 -> 850, 76.1 -> 80). */
export function niceCeil(v: number): number {
  if (!(v > 0)) return v <= 0 ? 0 : 1;
  const step = 10 ** Math.floor(Math.log10(v)) / 2;
  return Math.ceil(v / step - 1e-9) * step;
}

/** Rounds down to a readable axis start (0 stays 0). */
export function niceFloor(v: number): number {
  if (v >= 0) return v === 0 ? 0 : v < 1 ? 0 : Math.floor(v / (10 ** Math.floor(Math.log10(v)) / 2)) * (10 ** Math.floor(Math.log10(v)) / 2);
  return -niceCeil(-v);
}

/** Tooltip numbers: four significant digits, thousands separators. */
export function tooltipNumber(v: number): string {
  if (!Number.isFinite(v)) return '–';
  if (Math.abs(v) >= 1000) return Math.round(v).toLocaleString('en-US');
  return Number(v.toPrecision(4)).toLocaleString('en-US', { maximumSignificantDigits: 4 });
}

/** Axis tick text: at most 4 decimals, no binary noise (an axis end at 76.1166... shows as 76.12). */
export function tickLabel(value: number): string {
  if (!Number.isFinite(value)) return '';
  const a = Math.abs(value);
  const digits = a >= 100 ? 0 : a >= 10 ? 1 : a >= 1 ? 2 : 4;
  return Number(value.toFixed(digits)).toLocaleString('en-US', { maximumFractionDigits: digits });
}

/**
 * Side of its marker each pick's label sits on, so neighbouring picks do not write over each
 * other's markers: the leak-off point (on the rising loading line) to the left, the ISIP (just
 * after the pumping peak, and on the pressure axis of the shut-in charts) to the right, the
 * closure (below the ISIP on the decline) underneath, peaks above.
 */
const PICK_LABEL_SIDE: Record<PickKind, 'top' | 'bottom' | 'left' | 'right'> = {
  leakOff: 'left', breakdown: 'top', propagation: 'top', isip: 'right', closure: 'bottom', reopening: 'left', fitMaximum: 'top', extension: 'top',
};

function pickSeries(picks: { key: string; kind: PickKind; x: number; y: number }[], yAxisIndex = 0): ScatterSeriesOption[] {
  const kinds = [...new Set(picks.map((p) => p.kind))];
  // Labels only when few picks share the chart; otherwise on hover or selection (the legend keys the shapes).
  const labels = picks.length <= 4;
  return kinds.map((kind) => {
    const s = PICK_STYLE[kind];
    return {
      id: `pick-${kind}`,
      name: s.short,
      type: 'scatter',
      yAxisIndex,
      symbol: s.symbol,
      symbolRotate: s.rotate,
      symbolSize: s.size,
      z: 10,
      cursor: 'move',
      itemStyle: { color: s.color, borderColor: '#ffffff', borderWidth: 1.5 },
      label: { show: labels, formatter: s.short, position: PICK_LABEL_SIDE[kind], distance: 6, color: s.color, fontWeight: 'bold', fontSize: 11 },
      // A label that would cover another one is hidden (it shows on hover); see PICK_LABEL_SIDE.
      labelLayout: { hideOverlap: true },
      emphasis: { scale: 1.5, label: { show: true, formatter: (p: { name: string }) => `${s.short} c${p.name.split(':')[0]}` } },
      data: picks.filter((p) => p.kind === kind).map((p) => ({ name: p.key, value: [p.x, p.y] })),
      tooltip: { trigger: 'item' },
    } satisfies ScatterSeriesOption;
  });
}

/** Index range [first, last] of samples whose x lies in [lo, hi] (x non-decreasing), padded by one sample. */
export function indexRange(x: ArrayLike<number>, lo: number, hi: number): [number, number] {
  const n = x.length;
  if (n === 0) return [0, -1];
  let a = 0; let b = n;
  while (a < b) { const m = (a + b) >> 1; if (x[m] < lo) a = m + 1; else b = m; }
  const first = Math.max(0, a - 1);
  a = first; b = n;
  while (a < b) { const m = (a + b) >> 1; if (x[m] <= hi) a = m + 1; else b = m; }
  const last = Math.min(n - 1, a);
  return [first, Math.max(first, last)];
}

function decimatedPairs(x: Float64Array, y: Float64Array, target: number, range: [number, number] | null,
  sx: (v: number) => number, sy: (v: number) => number): [number, number][] {
  if (range) {
    const [i0, i1] = indexRange(x, range[0], range[1]);
    const xs = x.subarray(i0, i1 + 1);
    const ys = y.subarray(i0, i1 + 1);
    return pairsAt(xs, ys, displayIndices(xs, ys, target), sx, sy);
  }
  return pairsAt(x, y, displayIndices(x, y, target), sx, sy);
}

export interface TimeChartInput {
  time: Float64Array;
  gaugePressure: Float64Array;
  downholePressure: Float64Array;
  rate: Float64Array;
  picks: PlacedPick[];
  units: UnitSystem;
  /** Points drawn per series (about twice the plot width). */
  target: number;
  /** Visible time window, s (null: whole record). Data outside is not drawn; the axis keeps the full extent. */
  range: [number, number] | null;
  showGauge: boolean;
}

/**
 * The pick markers of the pressure-time chart alone (scatter series 'pick-<kind>'), as
 * timeChartOption draws them: for adding the picks to a chart built without them, so the
 * decimated record is not thinned again when the analysis arrives.
 */
export function timeChartPickSeries(picks: PlacedPick[], units: UnitSystem): ScatterSeriesOption[] {
  const sx = displayScale(units, 'time');
  const sp = displayScale(units, 'pressure');
  return pickSeries(picks.map((p) => ({ key: pickKey(p.cycle, p.kind), kind: p.kind, x: sx(p.pick.time), y: sp(p.pick.pressure) })));
}

/**
 * True when the lowest of the series is only gauge noise below zero (within 2 % of the
 * highest value): the pressure axis then starts at 0 instead of a "nice" negative tick.
 */
export function onlyNoiseBelowZero(series: Float64Array[]): boolean {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of series) for (let i = 0; i < s.length; i++) { const v = s[i]; if (v < lo) lo = v; if (v > hi) hi = v; }
  return lo < 0 && hi > 0 && -lo <= 0.02 * hi;
}

/** Pressure (left axis) and pump rate (right axis) against time, with every pick. */
export function timeChartOption(input: TimeChartInput): ChartOption {
  const { time, units } = input;
  const sx = displayScale(units, 'time');
  const sp = displayScale(units, 'pressure');
  const sr = displayScale(units, 'rate');
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    {
      id: 'downhole', name: 'Downhole pressure', type: 'line', yAxisIndex: 0, showSymbol: false, sampling: undefined,
      lineStyle: { width: 1.6, color: SERIES_COLOR.downhole }, itemStyle: { color: SERIES_COLOR.downhole },
      data: decimatedPairs(time, input.downholePressure, input.target, input.range, sx, sp),
    },
    {
      id: 'rate', name: 'Pump rate', type: 'line', yAxisIndex: 1, showSymbol: false, step: false,
      lineStyle: { width: 1.2, color: SERIES_COLOR.rate, type: 'dashed' }, itemStyle: { color: SERIES_COLOR.rate },
      data: decimatedPairs(time, input.rate, input.target, input.range, sx, sr),
    },
  ];
  if (input.showGauge) {
    series.splice(1, 0, {
      id: 'gauge', name: 'Gauge pressure', type: 'line', yAxisIndex: 0, showSymbol: false,
      lineStyle: { width: 1, color: SERIES_COLOR.gauge }, itemStyle: { color: SERIES_COLOR.gauge },
      data: decimatedPairs(time, input.gaugePressure, input.target, input.range, sx, sp),
    });
  }
  series.push(...pickSeries(input.picks.map((p) => ({ key: pickKey(p.cycle, p.kind), kind: p.kind, x: sx(p.pick.time), y: sp(p.pick.pressure) }))));
  const n = time.length;
  const common = base();
  return {
    ...common,
    legend: { ...(common.legend as object), type: 'plain' },
    grid: { left: 64, right: 64, top: 56, bottom: 56 },
    xAxis: {
      type: 'value', ...AXIS_COMMON, name: axisName('Time', unitLabel(units, 'time')), nameGap: 28,
      min: n ? niceFloor(sx(time[0])) : 0, max: n ? niceCeil(sx(time[n - 1])) : 1,
    },
    yAxis: [
      { type: 'value', ...AXIS_COMMON, name: axisName('Pressure', unitLabel(units, 'pressure')), nameGap: 48, scale: false,
        ...(onlyNoiseBelowZero(input.showGauge ? [input.downholePressure, input.gaugePressure] : [input.downholePressure]) ? { min: 0 } : {}) },
      { type: 'value', ...AXIS_COMMON, name: axisName('Rate', unitLabel(units, 'rate')), nameGap: 44, splitLine: { show: false } },
    ],
    dataZoom: [
      { type: 'inside', xAxisIndex: 0, filterMode: 'none', moveOnMouseMove: false },
      { type: 'slider', xAxisIndex: 0, filterMode: 'none', height: 18, bottom: 6 },
    ],
    series,
  };
}

export interface VolumeChartInput {
  time: Float64Array;
  volume: Float64Array;
  downholePressure: Float64Array;
  cycles: CycleAnalysis[];
  units: UnitSystem;
  target: number;
}

/** Volume pumped in a cycle at a sample, m3 (cumulative volume minus the cycle's start). */
export function cycleVolumeAt(volume: ArrayLike<number>, cycle: CycleAnalysis, index: number): number {
  return volume[index] - volume[cycle.cycle.pumpStart];
}

/** Points of a fitted line y = a + b x across [x0, x1], in display units. */
export function linePoints(fit: LineFit, x0: number, x1: number, sx: (v: number) => number, sy: (v: number) => number): [number, number][] {
  return [[sx(x0), sy(fit.intercept + fit.slope * x0)], [sx(x1), sy(fit.intercept + fit.slope * x1)]];
}

/** Pressure against the cycle's pumped volume, with the fitted loading line and the loading picks. */
export function volumeChartOption(input: VolumeChartInput): ChartOption {
  const { units, volume, downholePressure } = input;
  const sv = displayScale(units, 'volume');
  const sp = displayScale(units, 'pressure');
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [];
  const picks: { key: string; kind: PickKind; x: number; y: number }[] = [];
  for (const c of input.cycles) {
    const { pumpStart, pumpEnd, index } = c.cycle;
    const st = cycleStyle(index);
    const v0 = volume[pumpStart];
    const xs = new Float64Array(pumpEnd - pumpStart + 1);
    for (let i = pumpStart; i <= pumpEnd; i++) xs[i - pumpStart] = volume[i] - v0;
    const ys = downholePressure.subarray(pumpStart, pumpEnd + 1);
    series.push({
      id: `cycle-${index}`, name: `Cycle ${index}`, type: 'line', showSymbol: false,
      lineStyle: { width: 1.5, color: st.color, type: st.dash }, itemStyle: { color: st.color },
      data: pairsAt(xs, ys, displayIndices(xs, ys, input.target), sv, sp),
    });
    if (c.loadingFit) {
      const f = c.loadingFit;
      const fitEnd = Math.min(pumpEnd, Math.max(f.end, c.picks.leakOff?.sampleIndex ?? f.end));
      series.push({
        id: `fit-${index}`, name: index === 1 ? 'Loading line' : `Loading line ${index}`, type: 'line', showSymbol: false,
        lineStyle: { width: 2, color: SERIES_COLOR.fit, type: [6, 4] }, itemStyle: { color: SERIES_COLOR.fit },
        data: linePoints(f, 0, volume[fitEnd] - v0, sv, sp), tooltip: { show: false },
      });
    }
    for (const kind of ['leakOff', 'breakdown', 'propagation', 'fitMaximum', 'reopening'] as PickKind[]) {
      const p = c.picks[kind];
      if (p && p.sampleIndex >= pumpStart && p.sampleIndex <= pumpEnd) {
        picks.push({ key: pickKey(index, kind), kind, x: sv(volume[p.sampleIndex] - v0), y: sp(p.pressure) });
      }
    }
  }
  series.push(...pickSeries(picks));
  return {
    ...base(),
    tooltip: { trigger: 'item', confine: true },
    xAxis: { type: 'value', ...AXIS_COMMON, name: axisName('Volume pumped in the cycle', unitLabel(units, 'volume')), nameGap: 28 },
    yAxis: { type: 'value', ...AXIS_COMMON, name: axisName('Downhole pressure', unitLabel(units, 'pressure')), nameGap: 48 },
    series,
  };
}

/** Shut-in diagnostic series of one cycle (SI; built by shutInDiagnostics.ts). */
export interface ShutInSeries {
  cycle: number;
  /** Time since shut-in, s. */
  dt: Float64Array;
  pressure: Float64Array;
  g: Float64Array;
  /** G dP/dG, Pa (positive for a falling pressure). */
  gdpdg: Float64Array;
  /** Slope of the straight line through the origin and G dP/dG at the closure pick, Pa per unit G, when there is one. */
  tangentSlope: number | null;
  /** Square root of the time since shut-in, s^0.5. */
  rootDt: Float64Array;
  /** dP/d sqrt(t), Pa/s^0.5 (magnitude). */
  sqrtDerivative: Float64Array;
  /** Log-log (engine logLogDiagnostic): elapsed shut-in time of each bin (s), pressure change (Pa), dt dP/d(dt) (Pa). */
  logElapsed: Float64Array;
  deltaP: Float64Array;
  logDerivative: Float64Array;
  /** Closure candidates, with their time since shut-in (s). */
  candidates: { method: string; dt: number; pressure: number; g: number | null }[];
  /** Pick keys drawn on the diagnostics (closure and ISIP of the cycle), with dt. */
  picks: { key: string; kind: PickKind; dt: number; pressure: number }[];
}

function finitePairs(x: Float64Array, y: Float64Array, target: number, sx: (v: number) => number, sy: (v: number) => number,
  positiveOnly = false): [number, number][] {
  const n = Math.min(x.length, y.length);
  const ok = (i: number) => Number.isFinite(x[i]) && Number.isFinite(y[i]) && (!positiveOnly || (x[i] > 0 && y[i] > 0));
  let bad = 0;
  for (let i = 0; i < n; i++) if (!ok(i)) bad++;
  if (bad === 0) return pairsAt(x, y, displayIndices(x, y, target), sx, sy);
  // Compact the usable samples (plain loops: this runs on long shut-ins).
  const xs = new Float64Array(n - bad);
  const ys = new Float64Array(n - bad);
  for (let i = 0, k = 0; i < n; i++) if (ok(i)) { xs[k] = x[i]; ys[k] = y[i]; k++; }
  return pairsAt(xs, ys, displayIndices(xs, ys, target), sx, sy);
}

function gAt(s: ShutInSeries, dt: number): number {
  const [i] = indexRange(s.dt, dt, dt);
  const k = Math.min(s.g.length - 1, s.dt[i] < dt && i + 1 < s.dt.length ? i + 1 : i);
  return s.g[k];
}

/** G-function plot: pressure and G dP/dG against G, with the tangent line through the origin and the closure picks. */
export function gFunctionChartOption(s: ShutInSeries, units: UnitSystem, target: number): ChartOption {
  const sp = displayScale(units, 'pressure');
  const id = (v: number) => v;
  const gMax = s.g.length ? s.g[s.g.length - 1] : 1;
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    { id: 'p', name: 'Pressure', type: 'line', showSymbol: false, yAxisIndex: 0, lineStyle: { color: SERIES_COLOR.downhole, width: 1.5 },
      itemStyle: { color: SERIES_COLOR.downhole }, data: finitePairs(s.g, s.pressure, target, id, sp) },
    { id: 'gdpdg', name: 'G dP/dG', type: 'line', showSymbol: false, yAxisIndex: 1, lineStyle: { color: SERIES_COLOR.derivative, width: 1.3 },
      itemStyle: { color: SERIES_COLOR.derivative }, data: finitePairs(s.g, s.gdpdg, target, id, sp) },
  ];
  if (s.tangentSlope !== null && Number.isFinite(s.tangentSlope)) {
    series.push({ id: 'tangent', name: 'Line through origin', type: 'line', showSymbol: false, yAxisIndex: 1,
      lineStyle: { color: SERIES_COLOR.tangent, type: 'dashed', width: 1 }, itemStyle: { color: SERIES_COLOR.tangent },
      data: [[0, 0], [gMax, sp(s.tangentSlope * gMax)]], tooltip: { show: false } });
  }
  series.push(...pickSeries(s.picks.map((p) => ({ key: p.key, kind: p.kind, x: gAt(s, p.dt), y: sp(p.pressure) }))));
  if (s.candidates.length) {
    series.push({ id: 'candidates', name: 'Other closure methods', type: 'scatter', symbol: 'emptyCircle', symbolSize: 9, yAxisIndex: 0,
      itemStyle: { color: '#0f7669' }, tooltip: { trigger: 'item', formatter: (p: unknown) => String((p as { data: { name: string } }).data.name) },
      data: s.candidates.map((c) => ({ name: c.method, value: [c.g ?? gAt(s, c.dt), sp(c.pressure)] })) });
  }
  return {
    ...base(),
    grid: { left: 64, right: 64, top: 36, bottom: 40 },
    xAxis: { type: 'value', ...AXIS_COMMON, name: 'G-function', nameGap: 24, min: 0 },
    yAxis: [
      { type: 'value', ...AXIS_COMMON, name: axisName('Pressure', unitLabel(units, 'pressure')), nameGap: 44, scale: true },
      { type: 'value', ...AXIS_COMMON, name: axisName('G dP/dG', unitLabel(units, 'pressure')), nameGap: 44, min: 0, splitLine: { show: false } },
    ],
    series,
  };
}

/** Square-root-of-time plot: pressure and |dP/d sqrt(t)| against sqrt of time since shut-in. */
export function sqrtTimeChartOption(s: ShutInSeries, units: UnitSystem, target: number): ChartOption {
  const sp = displayScale(units, 'pressure');
  const root = s.rootDt;
  const id = (v: number) => v;
  return {
    ...base(),
    grid: { left: 58, right: 58, top: 44, bottom: 40 },
    xAxis: { type: 'value', ...AXIS_COMMON, name: 'Square root of time since shut-in (√s)', nameGap: 24, min: 0 },
    yAxis: [
      { type: 'value', ...AXIS_COMMON, name: axisName('Pressure', unitLabel(units, 'pressure')), nameGap: 44, scale: true },
      { type: 'value', ...AXIS_COMMON, name: axisName('dP/d√t', `${unitLabel(units, 'pressure')}/√s`), nameGap: 44, splitLine: { show: false } },
    ],
    series: [
      { id: 'p', name: 'Pressure', type: 'line', showSymbol: false, yAxisIndex: 0, lineStyle: { color: SERIES_COLOR.downhole, width: 1.5 },
        itemStyle: { color: SERIES_COLOR.downhole }, data: finitePairs(root, s.pressure, target, id, sp) },
      { id: 'dsqrt', name: 'dP/d√t', type: 'line', showSymbol: false, yAxisIndex: 1, lineStyle: { color: SERIES_COLOR.derivative, width: 1.2 },
        itemStyle: { color: SERIES_COLOR.derivative }, data: finitePairs(root, s.sqrtDerivative, target, id, sp) },
      ...pickSeries(s.picks.map((p) => ({ key: p.key, kind: p.kind, x: Math.sqrt(p.dt), y: sp(p.pressure) }))),
    ],
  };
}

/** Log-log diagnostic: pressure change and its derivative dt dP/d(dt) against time since shut-in, both log axes. */
export function logLogChartOption(s: ShutInSeries, units: UnitSystem, target: number): ChartOption {
  const sp = displayScale(units, 'pressure');
  const id = (v: number) => v;
  return {
    ...base(),
    grid: { left: 58, right: 24, top: 44, bottom: 40 },
    tooltip: { trigger: 'item', confine: true },
    xAxis: { type: 'log', ...AXIS_COMMON, name: 'Time since shut-in (s)', nameGap: 24 },
    yAxis: { type: 'log', ...AXIS_COMMON, name: axisName('ΔP and derivative', unitLabel(units, 'pressure')), nameGap: 44 },
    series: [
      { id: 'dp', name: 'ΔP', type: 'line', showSymbol: false, lineStyle: { color: SERIES_COLOR.downhole, width: 1.5 },
        itemStyle: { color: SERIES_COLOR.downhole }, data: finitePairs(s.logElapsed, s.deltaP, target, id, sp, true) },
      { id: 'dlog', name: 'dt·dP/d(dt)', type: 'scatter', symbol: 'circle', symbolSize: 3, itemStyle: { color: SERIES_COLOR.derivative },
        data: finitePairs(s.logElapsed, s.logDerivative, Math.min(target, 600), id, sp, true) },
    ],
  };
}

export interface StepRateInput {
  cycle: CycleAnalysis;
  units: UnitSystem;
}

/** Step-rate plot: stabilised pressure against rate with the matrix and fracture lines and their intersection. */
export function stepRateChartOption({ cycle, units }: StepRateInput): ChartOption | null {
  const sr = cycle.stepRate;
  if (!sr || sr.steps.length === 0) return null;
  const sq = displayScale(units, 'rate');
  const sp = displayScale(units, 'pressure');
  const rates = sr.steps.map((s) => s.rate);
  const qMax = Math.max(...rates, sr.extension?.rate ?? 0) * 1.08;
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    { id: 'steps', name: 'Stabilised steps', type: 'scatter', symbol: 'rect', symbolSize: 10, itemStyle: { color: SERIES_COLOR.downhole },
      data: sr.steps.map((s) => [sq(s.rate), sp(s.pressure)]) },
  ];
  if (sr.matrixLine) {
    series.push({ id: 'matrix', name: 'Matrix line', type: 'line', showSymbol: false, lineStyle: { color: SERIES_COLOR.fit, width: 2 },
      itemStyle: { color: SERIES_COLOR.fit }, data: linePoints(sr.matrixLine, 0, qMax, sq, sp) });
  }
  if (sr.fractureLine) {
    series.push({ id: 'fracture', name: 'Fracture line', type: 'line', showSymbol: false, lineStyle: { color: SERIES_COLOR.derivative, width: 2, type: 'dashed' },
      itemStyle: { color: SERIES_COLOR.derivative }, data: linePoints(sr.fractureLine, 0, qMax, sq, sp) });
  }
  if (sr.extension) {
    series.push(...pickSeries([{ key: pickKey(cycle.cycle.index, 'extension'), kind: 'extension', x: sq(sr.extension.rate), y: sp(sr.extension.pressure) }]));
  }
  return {
    ...base(),
    tooltip: { trigger: 'item', confine: true },
    xAxis: { type: 'value', ...AXIS_COMMON, name: axisName('Pump rate', unitLabel(units, 'rate')), nameGap: 28, min: 0 },
    yAxis: { type: 'value', ...AXIS_COMMON, name: axisName('Stabilised pressure', unitLabel(units, 'pressure')), nameGap: 48, scale: true },
    series,
  };
}

export interface OverlayInput {
  time: Float64Array;
  downholePressure: Float64Array;
  cycles: CycleAnalysis[];
  units: UnitSystem;
  target: number;
}

/** Every cycle overlaid: pressure against time since that cycle's pump start (pumping and shut-in). */
export function cyclesOverlayOption(input: OverlayInput): ChartOption {
  const { time, downholePressure, units } = input;
  const sx = displayScale(units, 'time');
  const sp = displayScale(units, 'pressure');
  const series: LineSeriesOption[] = input.cycles.map((c) => {
    const { pumpStart, shutInEnd, index } = c.cycle;
    const st = cycleStyle(index);
    const t0 = time[pumpStart];
    const xs = Float64Array.from(time.subarray(pumpStart, shutInEnd + 1), (t) => t - t0);
    const ys = downholePressure.subarray(pumpStart, shutInEnd + 1);
    return {
      id: `cycle-${index}`, name: `Cycle ${index}`, type: 'line', showSymbol: false,
      lineStyle: { width: 1.6, color: st.color, type: st.dash }, itemStyle: { color: st.color },
      data: pairsAt(xs, ys, displayIndices(xs, ys, input.target), sx, sp),
    };
  });
  return {
    ...base(),
    xAxis: { type: 'value', ...AXIS_COMMON, name: axisName('Time since the cycle started', unitLabel(units, 'time')), nameGap: 28, min: 0 },
    yAxis: { type: 'value', ...AXIS_COMMON, name: axisName('Downhole pressure', unitLabel(units, 'pressure')), nameGap: 48 },
    series,
  };
}
