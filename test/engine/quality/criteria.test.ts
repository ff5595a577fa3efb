import { describe, expect, it } from 'vitest';
import { assessQuality } from '../../../src-renderer/engine/quality/assess';
import { canonicalLimitKey, DEFAULT_LIMITS, limitDefinition, resolveLimits } from '../../../src-renderer/engine/quality/limits';
import type { AnalysisContext, CriterionResult, Pick } from '../../../src-renderer/engine/result';
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
      'loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'second-cycle', 'cycle-repeat', 'sampling', 'gauge-range', 'pick-agreement',
    ]);
    expect(assessQuality(cleanLot).criteria.map((c) => c.id)).not.toContain('second-cycle');
    expect(assessQuality(cleanLot).criteria.map((c) => c.id)).not.toContain('cycle-repeat');
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

/** A copy of the context with one pick of one cycle moved to a new pressure (Pa), or removed (null). */
function withPick(ctx: AnalysisContext, cycle: number, kind: 'isip' | 'closure' | 'breakdown' | 'reopening', pressure: number | null, extra: Partial<Pick> = {}): AnalysisContext {
  return {
    ...ctx,
    cycles: ctx.cycles.map((c) => {
      if (c.cycle.index !== cycle) return c;
      const picks = { ...c.picks };
      if (pressure === null) delete picks[kind];
      else picks[kind] = { ...c.picks[kind]!, pressure, ...extra };
      return { ...c, picks };
    }),
  };
}

describe('second-cycle', () => {
  // Truth set by the generator (synthetic/generate.ts): a clean XLOT reopens at the set
  // reopening pressure, below the first-cycle breakdown; the flaw 'reopening-above-breakdown'
  // reopens 0.5 MPa above it. A reopening at or above breakdown means T0 = Pb - Pr <= 0
  // (Bredehoeft et al. 1976, METHODS.md): the later cycle opened something else.
  const ratioOf = (ctx: AnalysisContext) => ctx.cycles[1].picks.reopening!.pressure / ctx.cycles[0].picks.breakdown!.pressure;

  it('should pass a valid later cycle with the reopening / breakdown ratio as its value', () => {
    const c = criterion(cleanXlot, 'second-cycle')!;
    expect(c).toMatchObject({ pass: true, limit: 1, unit: 'ratio', severity: 'major' });
    expect(c.value!).toBeCloseTo(ratioOf(cleanXlot), 12);
    expect(c.value!).toBeLessThan(1);
    expect(c.message).toContain('below the first-cycle breakdown');
    expect(c.message).toContain('cycle 2 was shut in for 15.0 min');
  });

  it('should fail a reopening above breakdown, its value above the limit of 1', () => {
    const ctx = contextFor({ type: 'xlot', flaws: { badSecondCycle: 'reopening-above-breakdown' } });
    const above = criterion(ctx, 'second-cycle')!;
    expect(above.pass).toBe(false);
    expect(above.message).toContain('not below the first-cycle breakdown');
    // Pr = Pb + 0.5 MPa (generator flaw), so the ratio is (Pb + 0.5 MPa) / Pb.
    const pb = ctx.cycles[0].picks.breakdown!.pressure;
    expect(above.value!).toBeCloseTo((pb + 0.5e6) / pb, 12);
    expect(above.value!).toBeGreaterThan(above.limit!);
  });

  it('should fail a later cycle without a stable shut-in, its value still showing the reopening passed', () => {
    // The flaw shortens the second shut-in to 90 s; the reopening is the clean one, below
    // breakdown, so the value (below 1) and the message name the check that failed.
    const short = criterion(contextFor({ type: 'xlot', flaws: { badSecondCycle: 'no-stable-shut-in' } }), 'second-cycle')!;
    expect(short.pass).toBe(false);
    expect(short.message).toContain('cycle 2 has no stable shut-in: 1.5 min, at least 5 min needed');
    expect(short.message).toContain('below the first-cycle breakdown');
    expect(short.value!).toBeLessThan(1);
  });

  it('should fail an XLOT with one cycle, with no value', () => {
    expect(criterion({ ...cleanXlot, cycles: cleanXlot.cycles.slice(0, 1) }, 'second-cycle')).toMatchObject({ pass: false, value: null, limit: 1 });
  });

  it('should let the shut-ins decide, with no value, when there is no reopening / breakdown pair', () => {
    const bare = { ...cleanXlot, cycles: cleanXlot.cycles.map((c) => ({ ...c, picks: {} })) };
    const c = criterion(bare, 'second-cycle')!;
    expect(c).toMatchObject({ pass: true, value: null, limit: 1 });
    expect(c.message).toContain('no reopening was picked');
    const noBreakdown = criterion(withPick(cleanXlot, 1, 'breakdown', null), 'second-cycle')!;
    expect(noBreakdown).toMatchObject({ pass: true, value: null });
    expect(noBreakdown.message).toContain('no first-cycle breakdown');
    const shortBare = contextFor({ type: 'xlot', flaws: { badSecondCycle: 'no-stable-shut-in' } });
    const c2 = criterion({ ...shortBare, cycles: shortBare.cycles.map((k) => ({ ...k, picks: {} })) }, 'second-cycle')!;
    expect(c2).toMatchObject({ pass: false, value: null });
    expect(c2.message).toContain('no stable shut-in');
  });

  it('should not fail a reopening against a breakdown read at a clipped gauge, a lower bound only', () => {
    const pb = cleanXlot.cycles[0].picks.breakdown!.pressure;
    const clipped = withPick(cleanXlot, 1, 'breakdown', cleanXlot.cycles[1].picks.reopening!.pressure - 0.1e6, { bound: 'lower' });
    const c = criterion(clipped, 'second-cycle')!;
    expect(c).toMatchObject({ pass: true, value: null });
    expect(c.message).toContain('lower bound');
    // A reading below the reopening that is not a bound fails.
    expect(criterion(withPick(cleanXlot, 1, 'breakdown', cleanXlot.cycles[1].picks.reopening!.pressure - 0.1e6), 'second-cycle')?.pass).toBe(false);
    expect(pb).toBeGreaterThan(cleanXlot.cycles[1].picks.reopening!.pressure);
  });

  it('should not judge the ISIP and closure repeat (that is cycle-repeat)', () => {
    const drifted = withPick(cleanXlot, 3, 'isip', 37e6);
    expect(criterion(drifted, 'second-cycle')).toMatchObject({ pass: true, value: criterion(cleanXlot, 'second-cycle')!.value });
  });
});

describe('cycle-repeat', () => {
  // Common practice (METHODS.md good practice): ISIP and closure repeat over the cycles. The
  // clean generator sets the same ISIP and closure in every cycle.
  it('should pass cycles whose ISIP and closure repeat', () => {
    const c = criterion(cleanXlot, 'cycle-repeat')!;
    expect(c).toMatchObject({ pass: true, limit: 0.05, unit: 'fraction', severity: 'minor' });
    expect(c.value!).toBeLessThan(1e-9);
    expect(c.message).toContain('ISIP');
    expect(c.message).toContain('closure');
  });

  it('should fail ISIPs of the last two cycles that differ by more than 5 % of their mean', () => {
    const isip2 = cleanXlot.cycles[1].picks.isip!.pressure;
    const c = criterion(withPick(cleanXlot, 3, 'isip', 37e6), 'cycle-repeat')!;
    expect(c.pass).toBe(false);
    // |37 - P2| / ((37 + P2) / 2): relative difference over the mean.
    expect(c.value!).toBeCloseTo(Math.abs(37e6 - isip2) / ((37e6 + isip2) / 2), 12);
    expect(c.message).toContain('more than 5.0 %');
  });

  it('should fail closures that differ and take the larger difference as its value', () => {
    const closure2 = cleanXlot.cycles[1].picks.closure!.pressure;
    const c = criterion(withPick(withPick(cleanXlot, 3, 'closure', 31e6), 3, 'isip', cleanXlot.cycles[1].picks.isip!.pressure * 1.01), 'cycle-repeat')!;
    expect(c.pass).toBe(false);
    expect(c.value!).toBeCloseTo(Math.abs(31e6 - closure2) / ((31e6 + closure2) / 2), 12);
    expect(c.message).toMatch(/^The cycles do not repeat: closure/);
    expect(c.message).toContain('Other checks: ISIP');
  });

  it('should judge on the ISIP alone when fewer than two cycles have a closure', () => {
    const ctx = withPick(withPick(cleanXlot, 2, 'closure', null), 3, 'closure', null);
    const c = criterion(ctx, 'cycle-repeat')!;
    expect(c.pass).toBe(true);
    expect(c.message).toContain('fewer than two cycles have a closure pick');
  });

  it('should not judge one cycle or cycles without ISIP and closure picks', () => {
    expect(criterion({ ...cleanXlot, cycles: cleanXlot.cycles.slice(0, 1) }, 'cycle-repeat')).toMatchObject({ pass: null, value: null, limit: 0.05 });
    const bare = { ...cleanXlot, cycles: cleanXlot.cycles.map((c) => ({ ...c, picks: {} })) };
    const c = criterion(bare, 'cycle-repeat')!;
    expect(c).toMatchObject({ pass: null, value: null });
    expect(c.message).toContain('cannot be compared');
  });

  it('should take its limit from cycle-repeat.maxRepeatDifference and from the old key second-cycle.maxRepeatDifference', () => {
    // ISIP 34.5 -> 35.5 MPa in cycle 3: 1 / 35 = 2.86 %, inside 5 %, outside 2 %.
    const ctx = withPick(cleanXlot, 3, 'isip', cleanXlot.cycles[1].picks.isip!.pressure + 1e6);
    expect(criterion(ctx, 'cycle-repeat')?.pass).toBe(true);
    expect(criterion(ctx, 'cycle-repeat', { 'cycle-repeat.maxRepeatDifference': 0.02 })).toMatchObject({ pass: false, limit: 0.02 });
    // A project saved before the criterion was split keeps its limit under the old key.
    expect(criterion(ctx, 'cycle-repeat', { 'second-cycle.maxRepeatDifference': 0.02 })).toMatchObject({ pass: false, limit: 0.02 });
    // Given both, the current key wins.
    expect(criterion(ctx, 'cycle-repeat', { 'cycle-repeat.maxRepeatDifference': 0.05, 'second-cycle.maxRepeatDifference': 0.02 })?.pass).toBe(true);
    expect(criterion(ctx, 'cycle-repeat', { 'second-cycle.maxRepeatDifference': 0.05, 'cycle-repeat.maxRepeatDifference': 0.02 })?.pass).toBe(false);
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

  it('should read a renamed limit key as its current key and document it under the current key', () => {
    const values = resolveLimits({ 'second-cycle.maxRepeatDifference': 0.03 });
    expect(values['cycle-repeat.maxRepeatDifference']).toBe(0.03);
    expect('second-cycle.maxRepeatDifference' in values).toBe(false);
    expect(canonicalLimitKey('second-cycle.maxRepeatDifference')).toBe('cycle-repeat.maxRepeatDifference');
    expect(canonicalLimitKey('sampling.maxInterval')).toBe('sampling.maxInterval');
    expect(limitDefinition('second-cycle.maxRepeatDifference')).toMatchObject({ key: 'cycle-repeat.maxRepeatDifference', value: 0.05, display: 'percent' });
    expect(DEFAULT_LIMITS.map((l) => l.key)).not.toContain('second-cycle.maxRepeatDifference');
    expect(() => resolveLimits({ 'second-cycle.maxRepeatDifference': Number.NaN })).toThrow(/not a finite number/);
  });
});
