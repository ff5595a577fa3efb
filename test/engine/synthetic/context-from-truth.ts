// Test helper: an AnalysisContext built from a synthetic record and the truth it was made
// with (the cycle boundaries and picks are the set ones, not detected), so that stress
// estimates and quality criteria can be checked against known answers.
import { fitLine } from '../../../src-renderer/engine/analysis/least-squares';
import type { TestRecord, TestType } from '../../../src-renderer/engine/record';
import type { AnalysisContext, ClosureCandidate, CycleAnalysis, Pick, PickKind } from '../../../src-renderer/engine/result';
import type { SyntheticTruth } from '../../../src-renderer/engine/synthetic/spec';

function nearestIndex(time: Float64Array, t: number): number {
  let best = 0;
  for (let i = 0; i < time.length; i++) if (Math.abs(time[i] - t) < Math.abs(time[best] - t)) best = i;
  return best;
}

function firstIndexFrom(time: Float64Array, t: number): number {
  let i = 0;
  while (i < time.length - 1 && time[i] < t - 1e-9) i++;
  return i;
}

function lastIndexUpTo(time: Float64Array, t: number): number {
  let i = time.length - 1;
  while (i > 0 && time[i] > t + 1e-9) i--;
  return i;
}

/** Steps of a step-rate record: runs of nearly constant set rate (jumps over 20 %). */
function rateSteps(record: TestRecord, from: number, to: number): { rate: number; pressure: number; startIndex: number; endIndex: number }[] {
  const steps: { rate: number; pressure: number; startIndex: number; endIndex: number }[] = [];
  let start = from;
  for (let i = from + 1; i <= to + 1; i++) {
    const jump = i > to || Math.abs(record.rate[i] - record.rate[start]) > 0.2 * Math.abs(record.rate[start]);
    if (jump) {
      const end = i - 1;
      if (end - start >= 10) steps.push({ rate: record.rate[end], pressure: record.pressure[end], startIndex: start, endIndex: end });
      start = i;
    }
  }
  return steps;
}

export interface ContextOptions {
  type?: TestType;
  /** Fraction of the rise to the first departure where the loading fit starts (default 0.15). */
  loadingFrom?: number;
  /** Closure candidates per cycle index (pressures in Pa). */
  closureCandidates?: Record<number, number[]>;
}

export function contextFromTruth(record: TestRecord, truth: SyntheticTruth, options: ContextOptions = {}): AnalysisContext {
  const offset = record.metadata.gaugePosition === 'downhole' ? 0 : truth.hydrostatic;
  const downhole = new Float64Array(record.pressure.length);
  for (let i = 0; i < downhole.length; i++) downhole[i] = record.pressure[i] + offset;
  const meta = record.metadata;
  const expectedSlope = meta.systemVolume && meta.compressibility ? 1 / (meta.systemVolume * meta.compressibility) : null;
  const cycles: CycleAnalysis[] = truth.cycles.map((c) => {
    const pumpStart = firstIndexFrom(record.time, c.pumpStartTime);
    const pumpEnd = lastIndexUpTo(record.time, c.pumpEndTime);
    const shutInEnd = lastIndexUpTo(record.time, c.shutInEndTime);
    const picks: Partial<Record<PickKind, Pick>> = {};
    for (const [kind, e] of Object.entries(c.picks) as [PickKind, { pressure: number; time: number; rate?: number }][]) {
      picks[kind] = { kind, pressure: e.pressure, time: e.time, method: 'set-truth', sampleIndex: nearestIndex(record.time, e.time), ...(e.rate !== undefined ? { rate: e.rate } : {}) };
    }
    // Linear loading part: from 15 % to 90 % of the rise to the first departure event.
    const firstEvent = c.picks.leakOff ?? c.picks.reopening ?? c.picks.fitMaximum;
    let loadingFit = null;
    if (firstEvent && truth.type !== 'srt') {
      const p0 = downhole[pumpStart];
      const lo = p0 + (options.loadingFrom ?? 0.15) * (firstEvent.pressure - p0);
      const hi = p0 + 0.9 * (firstEvent.pressure - p0);
      let a = pumpStart;
      while (a < pumpEnd && downhole[a] < lo) a++;
      let b = a;
      while (b < pumpEnd && downhole[b + 1] < hi) b++;
      if (b - a >= 2) {
        const f = fitLine(record.volume, downhole, a, b);
        loadingFit = { slope: f.slope, intercept: f.intercept, r2: f.r2, residualSd: f.residualSd, n: f.n, start: f.start, end: f.end };
      }
    }
    const candidates: ClosureCandidate[] = (options.closureCandidates?.[c.index] ?? []).map((p, k) => ({
      method: `method-${k + 1}`, pressure: p, time: c.picks.closure?.time ?? c.pumpEndTime, sampleIndex: pumpEnd,
    }));
    const spread = candidates.length >= 2 ? Math.max(...candidates.map((x) => x.pressure)) - Math.min(...candidates.map((x) => x.pressure)) : null;
    const stepRate = truth.type === 'srt' ? { steps: rateSteps(record, pumpStart, pumpEnd), matrixLine: null, fractureLine: null, extension: null } : undefined;
    let sum = 0;
    for (let i = pumpStart; i <= pumpEnd; i++) sum += record.rate[i];
    return {
      cycle: {
        index: c.index, pumpStart, pumpEnd, shutInEnd,
        meanRate: sum / (pumpEnd - pumpStart + 1),
        volumePumped: record.volume[pumpEnd] - record.volume[pumpStart],
        flowBack: false,
      },
      loadingFit,
      expectedSlope,
      picks,
      closureCandidates: candidates,
      closureSpread: spread,
      ...(stepRate ? { stepRate } : {}),
    };
  });
  return {
    type: options.type ?? truth.type,
    typeInferred: false,
    time: record.time,
    rate: record.rate,
    volume: record.volume,
    gaugePressure: record.pressure,
    downholePressure: downhole,
    metadata: { ...record.metadata },
    cycles,
  };
}
