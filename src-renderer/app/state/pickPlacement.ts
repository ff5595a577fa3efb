import type { AnalysisOptions } from '../../engine/analysis-options';
import type { TestDetail } from '../../archive/api';
import type { TestRecord } from '../../engine/record';
import type { CycleAnalysis, Pick, PickKind } from '../../engine/result';

/** Index of the sample whose value is nearest `target` in a non-decreasing series (binary search). */
export function nearestIndex(values: ArrayLike<number>, target: number, start = 0, end = values.length - 1): number {
  if (end < start) return start;
  let lo = start;
  let hi = end;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (values[mid] < target) lo = mid + 1; else hi = mid;
  }
  if (lo > start && Math.abs(values[lo - 1] - target) <= Math.abs(values[lo] - target)) return lo - 1;
  return lo;
}

/** Index in [start, end] whose value is nearest `target`, for series that need not be sorted (linear scan). */
export function nearestIndexUnsorted(values: ArrayLike<number>, target: number, start: number, end: number): number {
  let best = start;
  for (let i = start; i <= end; i++) if (Math.abs(values[i] - target) < Math.abs(values[best] - target)) best = i;
  return best;
}

/** Sample range a pick of this kind belongs to in its cycle: loading picks while pumping, shut-in picks after. */
export function pickRange(c: CycleAnalysis, kind: PickKind): [number, number] {
  const { pumpStart, pumpEnd, shutInEnd } = c.cycle;
  if (kind === 'isip' || kind === 'closure') return [pumpEnd, Math.max(pumpEnd, shutInEnd)];
  return [pumpStart, pumpEnd];
}

/**
 * A hand-set pick at a sample: time from the record, pressure from the downhole curve
 * unless the engineer typed another value.
 */
export function manualPickAt(kind: PickKind, sampleIndex: number, time: Float64Array, downhole: Float64Array, reason: string,
  pressure?: number, rate?: number): Pick {
  const p: Pick = {
    kind, sampleIndex, time: time[sampleIndex], pressure: pressure ?? downhole[sampleIndex],
    method: 'manual', manual: true, reason,
  };
  if (rate !== undefined) p.rate = rate;
  return p;
}

/** The record behind a stored test, for re-running the analysis in the worker. */
export function recordOfDetail(detail: TestDetail): TestRecord {
  return {
    time: detail.samples.time, pressure: detail.samples.pressure, rate: detail.samples.rate, volume: detail.samples.volume,
    metadata: detail.metadata,
    source: { fileName: detail.summary.fileName, format: 'synthetic', layout: '', columns: [], derived: { rate: false, volume: false }, warnings: [] },
  };
}

/**
 * Analysis options that reproduce the stored analysis with one more pick change, for the
 * grade preview while the engineer edits: the manual picks in force, with this one replacing
 * any earlier hand-set pick of the same cycle and kind.
 */
export function previewOptions(detail: TestDetail, limits: Record<string, number>, change: { cycle: number; kind: PickKind; pick: Pick | null; reason: string }): AnalysisOptions {
  const kept = detail.manualPicks.filter((m) => !(m.cycle === change.cycle && m.kind === change.kind));
  return {
    type: detail.analysis.type,
    limits,
    manualPicks: [...kept.map((m) => ({ cycle: m.cycle, kind: m.kind, pick: m.pick, reason: m.reason })), change],
  };
}
