import { describe, expect, it } from 'vitest';
import { assessQuality } from '../../../src-renderer/engine/quality/assess';
import type { AnalysisContext, CriterionResult } from '../../../src-renderer/engine/result';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import type { SyntheticSpec } from '../../../src-renderer/engine/synthetic/spec';
import { contextFromTruth, type ContextOptions } from '../synthetic/context-from-truth';

// Records are synthetic with set truth (generator in src-renderer/engine/synthetic); the
// limits are the documented defaults of quality/limits.ts (sources named there).
const BASE: Omit<SyntheticSpec, 'type'> = { depthTvd: 2000, shmin: 34e6, porePressure: 20e6, seed: 11 };
const AGREE: ContextOptions = { closureCandidates: { 1: [34e6, 34.2e6], 2: [34e6, 34.1e6], 3: [34e6, 34.1e6] } };

function contextFor(spec: Partial<SyntheticSpec> & { type: SyntheticSpec['type'] }, options: ContextOptions = AGREE): AnalysisContext {
  const { record, truth } = generateSyntheticTest({ ...BASE, ...spec });
  return contextFromTruth(record, truth, options);
}

function criterion(ctx: AnalysisContext, id: string, limits: Record<string, number> = {}): CriterionResult | undefined {
  return assessQuality(ctx, limits).criteria.find((c) => c.id === id);
}

const cleanXlot = contextFor({ type: 'xlot', cycles: 3 });
const cleanLot = contextFor({ type: 'lot' });

describe('quality criteria presence', () => {
  it('should list exactly the criteria that apply to each test type', () => {
    expect(assessQuality(cleanXlot).criteria.map((c) => c.id)).toEqual([
      'loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'second-cycle', 'sampling', 'gauge-range', 'pick-agreement',
    ]);
    expect(assessQuality(cleanLot).criteria.map((c) => c.id)).not.toContain('second-cycle');
    const srt = assessQuality(contextFor({ type: 'srt', mudDensity: 1000 })).criteria.map((c) => c.id);
    expect(srt).toEqual(['rate-stability', 'shut-in-stability', 'sampling', 'gauge-range']);
  });
});

describe('loading-linearity', () => {
  it('should pass a straight loading line and fail one bent by air in the line', () => {
    expect(criterion(cleanLot, 'loading-linearity')).toMatchObject({ pass: true, limit: 0.995 });
    const air = contextFor({ type: 'lot', flaws: { airInLine: true } }, { loadingFrom: 0 });
    const c = criterion(air, 'loading-linearity')!;
    expect(c.pass).toBe(false);
    expect(c.value!).toBeLessThan(0.995);
  });

  it('should not judge a record without a loading fit', () => {
    const ctx = { ...cleanLot, cycles: cleanLot.cycles.map((c) => ({ ...c, loadingFit: null })) };
    expect(criterion(ctx, 'loading-linearity')).toMatchObject({ pass: null, value: null });
  });
});

describe('loading-stiffness', () => {
  it('should pass a slope near 1/(c V) and fail a slope softened by air', () => {
    // METHODS.md "System stiffness": expected dP/dV = 1/(c V); generator builds it exactly.
    const c = criterion(cleanLot, 'loading-stiffness')!;
    expect(c.pass).toBe(true);
    expect(c.value!).toBeCloseTo(1, 1);
    const air = criterion(contextFor({ type: 'lot', flaws: { airInLine: true } }), 'loading-stiffness')!;
    expect(air.pass).toBe(false);
    expect(air.value!).toBeLessThan(0.5);
  });

  it('should say what is missing when no system volume is given', () => {
    const ctx = contextFor({ type: 'lot', includeSystemMetadata: false });
    const c = criterion(ctx, 'loading-stiffness')!;
    expect(c.pass).toBeNull();
    expect(c.message).toContain('No system volume');
  });
});

describe('rate-stability', () => {
  it('should pass a steady rate and fail a wandering one', () => {
    expect(criterion(cleanLot, 'rate-stability')?.pass).toBe(true);
    const c = criterion(contextFor({ type: 'lot', flaws: { unsteadyRate: true } }), 'rate-stability')!;
    expect(c.pass).toBe(false);
    expect(c.value!).toBeGreaterThan(0.1);
  });

  it('should not judge a record without pumping periods', () => {
    expect(criterion({ ...cleanLot, cycles: [] }, 'rate-stability')?.pass).toBeNull();
  });
});

describe('shut-in-stability', () => {
  it('should pass a settled shut-in and fail a leaking one', () => {
    expect(criterion(cleanLot, 'shut-in-stability')?.pass).toBe(true);
    const leak = criterion(contextFor({ type: 'lot', flaws: { leakingShutIn: true } }), 'shut-in-stability')!;
    expect(leak.pass).toBe(false);
    // The set leak is 40 kPa/min = 666.7 Pa/s on top of a settled decline.
    expect(leak.value!).toBeGreaterThan(600);
  });

  it('should fail a shut-in shorter than 10 minutes', () => {
    const c = criterion(contextFor({ type: 'lot', shutInDuration: 240 }), 'shut-in-stability')!;
    expect(c.pass).toBe(false);
    expect(c.message).toContain('shorter than 10 min');
  });

  it('should not judge a record without a shut-in', () => {
    const ctx = { ...cleanLot, cycles: cleanLot.cycles.map((c) => ({ ...c, cycle: { ...c.cycle, shutInEnd: c.cycle.pumpEnd } })) };
    expect(criterion(ctx, 'shut-in-stability')?.pass).toBeNull();
  });
});

describe('second-cycle', () => {
  it('should pass repeating later cycles', () => {
    expect(criterion(cleanXlot, 'second-cycle')).toMatchObject({ pass: true, limit: 0.05 });
  });

  it('should fail a reopening above breakdown and a second cycle without a stable shut-in', () => {
    const above = criterion(contextFor({ type: 'xlot', flaws: { badSecondCycle: 'reopening-above-breakdown' } }), 'second-cycle')!;
    expect(above.pass).toBe(false);
    expect(above.message).toContain('not below the first-cycle breakdown');
    const short = criterion(contextFor({ type: 'xlot', flaws: { badSecondCycle: 'no-stable-shut-in' } }), 'second-cycle')!;
    expect(short.pass).toBe(false);
    expect(short.message).toContain('no stable shut-in');
  });

  it('should fail an XLOT with one cycle and not judge cycles without comparable picks', () => {
    expect(criterion({ ...cleanXlot, cycles: cleanXlot.cycles.slice(0, 1) }, 'second-cycle')?.pass).toBe(false);
    const bare = { ...cleanXlot, cycles: cleanXlot.cycles.map((c) => ({ ...c, picks: {} })) };
    expect(criterion(bare, 'second-cycle')?.pass).toBeNull();
  });

  it('should fail ISIPs that differ by more than the limit', () => {
    const ctx = { ...cleanXlot, cycles: cleanXlot.cycles.map((c) => (c.cycle.index === 3 ? { ...c, picks: { ...c.picks, isip: { ...c.picks.isip!, pressure: 37e6 } } } : c)) };
    const c = criterion(ctx, 'second-cycle')!;
    expect(c.pass).toBe(false);
    expect(c.value!).toBeGreaterThan(0.05);
  });
});

describe('sampling', () => {
  it('should pass 1 s sampling and fail 10 s sampling', () => {
    expect(criterion(cleanLot, 'sampling')).toMatchObject({ pass: true, value: 1 });
    const sparse = criterion(contextFor({ type: 'lot', sampleInterval: 10 }), 'sampling')!;
    expect(sparse.pass).toBe(false);
    expect(sparse.value).toBeCloseTo(10, 6);
  });
});

describe('sampling with rounded times', () => {
  it('should pass 1 s samples written as elapsed minutes rounded to 4 decimals', () => {
    // 1 s = 0.0167 min when rounded to 4 decimals, i.e. 1.002 s: within the 2 % rounding allowance.
    const time = Float64Array.from(cleanLot.time, (t) => Math.round((t / 60) * 1e4) / 1e4 * 60);
    expect(criterion({ ...cleanLot, time }, 'sampling')?.pass).toBe(true);
  });
});

describe('gauge-range', () => {
  it('should pass a reading well inside the range and fail a clipped gauge', () => {
    expect(criterion(cleanXlot, 'gauge-range')?.pass).toBe(true);
    const clipped = criterion(contextFor({ type: 'xlot', flaws: { clippedGauge: true } }), 'gauge-range')!;
    expect(clipped.pass).toBe(false);
    expect(clipped.message).toContain('clipped');
  });

  it('should not judge the margin when no gauge range is given', () => {
    const ctx = { ...cleanLot, metadata: { ...cleanLot.metadata, gaugeRange: undefined } };
    const c = criterion(ctx, 'gauge-range')!;
    expect(c.pass).toBeNull();
    expect(c.message).toContain('No gauge range');
  });
});

describe('pick-agreement', () => {
  it('should pass agreeing closure methods and fail disagreeing ones', () => {
    expect(criterion(cleanLot, 'pick-agreement')?.pass).toBe(true);
    const apart = contextFor({ type: 'lot' }, { closureCandidates: { 1: [32e6, 34e6, 35.5e6] } });
    const c = criterion(apart, 'pick-agreement')!;
    expect(c.pass).toBe(false);
    // (35.5 - 32) / mean(32, 34, 35.5) = 3.5 / 33.833 = 10.3 %.
    expect(c.value!).toBeCloseTo(3.5 / 33.8333, 4);
  });

  it('should not judge a single closure method', () => {
    expect(criterion(contextFor({ type: 'lot' }, { closureCandidates: { 1: [34e6] } }), 'pick-agreement')?.pass).toBeNull();
  });
});

describe('quality limits', () => {
  it('should apply project overrides and reject unknown keys', () => {
    expect(criterion(cleanLot, 'sampling', { 'sampling.maxInterval': 0.5 })?.pass).toBe(false);
    expect(() => assessQuality(cleanLot, { 'no-such.limit': 1 })).toThrow(/unknown quality limit/);
  });
});
